"""Running screenings: settings, the one-well pipeline, batches, pairs and faults."""
