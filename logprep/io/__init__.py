"""Readers: LAS logs, tops, surveys, pairs and faults tables."""
