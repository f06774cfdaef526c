"""Bundled example logs of an invented scenario (see README.md in this folder)."""
