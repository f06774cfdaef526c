"""Input: LAS files (the only module that talks to lasio), formation tops, deviation surveys,
the small CSV inputs, and where the bundled example data are.

May import: the root modules (:mod:`logprep.model`, :mod:`logprep.errors`,
:mod:`logprep.units`) only; never clay, layers, fault, report, run or the CLI.
"""
