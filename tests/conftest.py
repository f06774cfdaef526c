"""Shared test fixtures.

Real open well logs are read from outside the project: ``$LOGPREP_OPEN_LOGS`` or, by
default, ``../shared/data/open_logs`` beside the checkout (see its PROVENANCE.md).  Tests
that need them skip with a reason where they are absent, as in a user's clone.
"""

import os
from pathlib import Path

import pytest

import matplotlib

matplotlib.use("Agg")

REPO = Path(__file__).resolve().parents[1]
DATA = Path(__file__).resolve().parent / "data"
OPEN_LOGS = Path(os.environ.get("LOGPREP_OPEN_LOGS", REPO.parent / "shared" / "data" / "open_logs"))


def open_logs_path(*parts) -> Path:
    """Path inside the open-data folder, or skip the test with the reason."""
    p = OPEN_LOGS.joinpath(*parts)
    if not p.exists():
        pytest.skip(f"open data not found at {p} (set LOGPREP_OPEN_LOGS to the open_logs folder)")
    return p


@pytest.fixture
def data_dir() -> Path:
    return DATA


@pytest.fixture(scope="session")
def example_dir() -> Path:
    from logprep.io.examples import example_logs_dir

    return example_logs_dir()
