"""The fault stage: juxtaposition windows, the SGR field, smear indicators (SSF, CSP), seal
capacity, fault-rock properties and two-well ties.

May import: :mod:`logprep.layers`, :mod:`logprep.clay`, :mod:`logprep.io` and the root
modules; never report, run or the CLI.
"""
