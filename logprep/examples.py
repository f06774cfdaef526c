"""Where the bundled example logs live (an invented scenario, shipped inside the package)."""

from __future__ import annotations

from importlib import resources
from pathlib import Path


def example_logs_dir() -> Path:
    """Folder of the bundled example LAS files (and their tops table)."""
    return Path(str(resources.files("logprep.example_logs")))
