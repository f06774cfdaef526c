"""logprep: fault-seal screening straight from well logs.

The science lives in small pure modules (:mod:`logprep.clay.vshale`, :mod:`logprep.layers.blocking`,
:mod:`logprep.fault.juxtaposition`, :mod:`logprep.fault.sgr`); LAS input is in :mod:`logprep.io.las`,
drawing in :mod:`logprep.report.sheet`, the batch runner in :mod:`logprep.run.batch` and the command line
in :mod:`logprep.cli`.
"""

__version__ = "0.1.0"

from logprep.errors import LogprepError  # noqa: E402

__all__ = ["__version__", "LogprepError"]
