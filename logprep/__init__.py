"""logprep: fault-seal screening straight from well logs.

The science lives in small pure modules (:mod:`logprep.vshale`, :mod:`logprep.blocking`,
:mod:`logprep.juxtaposition`, :mod:`logprep.sgr`); LAS input is in :mod:`logprep.lasread`,
drawing in :mod:`logprep.sheet`, the batch runner in :mod:`logprep.batch` and the command line
in :mod:`logprep.cli`.
"""

__version__ = "0.1.0"

from logprep.errors import LogprepError  # noqa: E402

__all__ = ["__version__", "LogprepError"]
