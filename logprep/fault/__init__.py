"""Fault stage: juxtaposition, SGR field, smear indicators, seal capacity, fault rock."""
