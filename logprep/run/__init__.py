"""Running screenings: settings, one well, batches, pairs, tuning."""
