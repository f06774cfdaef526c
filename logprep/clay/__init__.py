"""Clay volume: GR quality flags, zoned endpoint picks, Vshale transforms, neutron-density
Vsh, the clay stage of one well and scoring against labelled lithology.

May import: :mod:`logprep.io` and the root modules; never layers, fault, report, run or the CLI.
"""
