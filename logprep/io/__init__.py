"""Reading inputs: LAS logs, tops, surveys, CSV tables, well locations."""
