"""logprep: fault-seal screening straight from well logs.

The pipeline runs through one subpackage per stage, each importing only the ones below it:
:mod:`logprep.io` (LAS, tops, surveys) -> :mod:`logprep.clay` (QC, endpoint picks, Vshale)
-> :mod:`logprep.layers` (blocking) -> :mod:`logprep.fault` (juxtaposition, SGR, smear,
seal capacity) -> :mod:`logprep.report` (sheets, tables) -> :mod:`logprep.run` (settings,
the one-well pipeline, batches) -> :mod:`logprep.cli`.

The names a notebook needs are here::

    from logprep import ScreenSettings, screen_file
    result = screen_file("A-1.las", ScreenSettings(sand_cutoff=0.3))
    result.windows
"""

__version__ = "0.1.0"

from logprep.errors import LogprepError  # noqa: E402

__all__ = ["__version__", "LogprepError", "ScreenSettings", "WellScreening", "read_well",
           "screen_file", "screen_well"]

_PUBLIC = {
    "ScreenSettings": "logprep.run.settings",
    "WellScreening": "logprep.run.pipeline",
    "screen_file": "logprep.run.pipeline",
    "screen_well": "logprep.run.pipeline",
    "read_well": "logprep.io.las",
}


def __getattr__(name: str):
    # the public names are loaded on first use, so `logprep --version` and the CLI's
    # start do not pay for numpy, pandas and matplotlib
    if name in _PUBLIC:
        import importlib

        value = getattr(importlib.import_module(_PUBLIC[name]), name)
        globals()[name] = value
        return value
    raise AttributeError(f"module 'logprep' has no attribute {name!r}")
