"""Where the bundled example logs live (an invented scenario, shipped inside the package)."""

from __future__ import annotations

from importlib import resources
from pathlib import Path


def example_logs_dir() -> Path:
    """Folder of the bundled example LAS files (and their tops table).

    Installed, they are the package data ``logprep.example_logs``; in a source checkout
    imported without installing, the ``example_logs/`` folder beside the package.
    """
    try:
        return Path(str(resources.files("logprep.example_logs")))
    except ModuleNotFoundError:
        return Path(__file__).resolve().parents[1] / "example_logs"
