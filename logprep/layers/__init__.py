"""Layers: blocking a Vsh curve into sand / heterolith / shale beds, the blocking-method
registry, and its settings.

May import: :mod:`logprep.io` and the root modules; never clay, fault, report, run or the CLI.
"""
