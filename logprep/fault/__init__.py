"""Fault stage: juxtaposition, SGR, seal capacity and fault-rock properties."""
