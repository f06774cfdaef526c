"""The tuning notebook runs headless from top to bottom and writes a settings file that
`logprep screen --config` accepts."""

from pathlib import Path

import pytest

from logprep.run.config import read_config
from logprep.run.settings import ScreenSettings

NOTEBOOK = Path(__file__).resolve().parents[1] / "notebooks" / "tune_blocking.ipynb"


def test_tuning_notebook_runs_and_writes_settings(tmp_path, monkeypatch):
    nbformat = pytest.importorskip("nbformat")
    nbclient = pytest.importorskip("nbclient")
    pytest.importorskip("ipykernel")
    pytest.importorskip("ipywidgets")
    monkeypatch.setenv("LOGPREP_NOTEBOOK_OUT", str(tmp_path))
    monkeypatch.setenv("MPLBACKEND", "Agg")
    nb = nbformat.read(NOTEBOOK, as_version=4)
    nbclient.NotebookClient(nb, timeout=300, kernel_name="python3",
                            resources={"metadata": {"path": str(tmp_path)}}).execute()
    got, _ = read_config(tmp_path / "tuned-settings.toml")
    assert ScreenSettings(**got) == ScreenSettings()  # run headless: the slider defaults
    outputs = [o for c in nb.cells if c.cell_type == "code" for o in c.get("outputs", [])]
    assert not [o for o in outputs if o.get("output_type") == "error"]
    assert any("image/png" in o.get("data", {}) for o in outputs)  # the sheet was drawn
