"""The tuning notebook runs headless from top to bottom and writes a settings file that
`logprep screen --config` accepts; it takes the user's own well from LOGPREP_WELL without
code edits, a slider redraws only the blocking panel (not the logs), and sliders fire only
on release (no queue of redraws while dragging)."""

import shutil
from pathlib import Path

import pytest

from logprep.run.config import read_config
from logprep.run.settings import ScreenSettings

NOTEBOOK = Path(__file__).resolve().parents[1] / "notebooks" / "tune_blocking.ipynb"

CHECKS = '''
assert all(not w.continuous_update for w in (sand, shale, bed))
logs_before, blocks_before = draws["logs"], draws["blocks"]
sand.value = 0.30  # what releasing the slider does
assert draws["logs"] == logs_before and draws["blocks"] == blocks_before + 1
assert current.settings.layers.sand_cutoff == 0.30
bed.value = 2.0
assert draws["logs"] == logs_before and draws["blocks"] == blocks_before + 2
print("WELL", result.well.name, "WINDOWS", len(current.windows))
'''


def run_notebook(tmp_path, monkeypatch, well=None, extra_cell=""):
    """Execute the notebook headless (with ``extra_cell`` appended) and return its outputs."""
    nbformat = pytest.importorskip("nbformat")
    nbclient = pytest.importorskip("nbclient")
    pytest.importorskip("ipykernel")
    pytest.importorskip("ipywidgets")
    monkeypatch.setenv("LOGPREP_NOTEBOOK_OUT", str(tmp_path))
    monkeypatch.setenv("MPLBACKEND", "Agg")
    if well is not None:
        monkeypatch.setenv("LOGPREP_WELL", str(well))
    else:
        monkeypatch.delenv("LOGPREP_WELL", raising=False)
    nb = nbformat.read(NOTEBOOK, as_version=4)
    if extra_cell:
        nb.cells.append(nbformat.v4.new_code_cell(extra_cell))
    nbclient.NotebookClient(nb, timeout=300, kernel_name="python3",
                            resources={"metadata": {"path": str(tmp_path)}}).execute()
    outputs = [o for c in nb.cells if c.cell_type == "code" for o in c.get("outputs", [])]
    assert not [o for o in outputs if o.get("output_type") == "error"]
    return outputs


def test_tuning_notebook_runs_and_writes_settings(tmp_path, monkeypatch):
    outputs = run_notebook(tmp_path, monkeypatch)
    got, _ = read_config(tmp_path / "tuned-settings.toml")
    example = ScreenSettings(**got)
    assert example.updated(tops_file=None) == ScreenSettings()  # headless: the slider defaults
    assert any("image/png" in o.get("data", {}) for o in outputs)  # the sheet was drawn


def test_notebook_on_own_well_redraws_only_what_a_slider_changes(tmp_path, monkeypatch, example_dir):
    own = tmp_path / "my data" / "MY-WELL.las"  # a well of the user's, outside the package
    own.parent.mkdir()
    shutil.copy(example_dir / "HRM-4.las", own)
    outputs = run_notebook(tmp_path, monkeypatch, well=own, extra_cell=CHECKS)
    text = "".join(o.get("text", "") for o in outputs if o.get("output_type") == "stream")
    assert "WELL HRM-4" in text


ROCK_CHECKS = '''
from logprep.run.tune import sweep_screening
# described rock = the loaded setting's own layers: a perfect match, nothing flipped
assert rock is not None
assert scores["rock_precision"] == 1.0 and scores["rock_recall"] == 1.0
assert scores["rock_balanced_accuracy"] == 1.0 and scores["verdicts_flipped"] == 0
sand.value = 0.20
sw = sweep_screening(result, sand_cutoffs=[0.20], shale_cutoffs=[settings.shale_cutoff],
                     min_beds_m=[settings.min_bed_m], reference_labels=rock)
row = sw.table.iloc[1]
for k in ("rock_precision", "rock_recall", "rock_balanced_accuracy", "verdicts_flipped",
          "new_leak_windows", "windows_changed"):
    assert scores[k] == row[k], (k, scores[k], row[k])
assert scores["rock_recall"] < 1.0  # a stricter sand cut-off loses described sandstone
print("ROCK", scores["rock_precision"], scores["rock_recall"])
'''


def test_notebook_scores_sliders_against_a_description_file(tmp_path, monkeypatch, example_dir):
    # A core description that is exactly the default layers of HRM-1 (sand layers as
    # sandstone, shale layers as shale, heteroliths as sandstone/shale): at the loaded
    # settings precision, recall and balanced accuracy are 1 by construction, and after a
    # slider move the notebook's line equals the `logprep tune` sweep row (same functions).
    from logprep.io.las import read_well
    from logprep.run.pipeline import screen_well
    r = screen_well(read_well(example_dir / "HRM-1.las"),
                    ScreenSettings(tops_file=str(example_dir / "tops.csv")))
    words = {"sand": "sandstone", "shale": "shale", "heterolith": "sandstone/shale"}
    L = r.layers
    rows = [f"{t},{b},{words[x]}" for t, b, x in zip(L.top_m, L.base_m, L.lithology) if x in words]
    desc = tmp_path / "core.csv"
    desc.write_text("top_m,base_m,lithology\n" + "\n".join(rows) + "\n")
    monkeypatch.setenv("LOGPREP_DESCRIPTIONS", str(desc))
    outputs = run_notebook(tmp_path, monkeypatch, extra_cell=ROCK_CHECKS)
    text = "".join(o.get("text", "") for o in outputs if o.get("output_type") == "stream")
    assert "ROCK" in text   # the checks of the appended cell ran to the end
