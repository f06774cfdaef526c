"""Batch runs: worker processes give the same results as one process; tables-only runs;
the bundled demo run covers tops, the deviated well and the well pair."""

import shutil

import pandas as pd

from logprep.run.batch import screen_paths
from logprep.cli import main
from logprep.run.settings import ScreenSettings


def test_jobs_give_identical_results(tmp_path, example_dir, data_dir):
    src = tmp_path / "in"
    src.mkdir()
    for name in ("HRM-1.las", "HRM-4.las"):
        shutil.copy(example_dir / name, src / name)
    shutil.copy(data_dir / "not_las.las", src / "broken.las")
    errors = []
    one = screen_paths([src], tmp_path / "one", ScreenSettings(), jobs=1, sheets=False)
    two = screen_paths([src], tmp_path / "two", ScreenSettings(), jobs=2, sheets=False,
                       on_error=errors.append)
    assert one.rows == two.rows
    assert [r["status"] for r in two.rows] == ["ok", "ok", "error"]  # sorted input order kept
    assert len(errors) == 1 and "broken.las: not a readable LAS file" in errors[0]
    for well in ("HRM-1", "HRM-4"):
        for name in ("layers.csv", "juxtapositions.csv", "sgr_field.npz"):
            assert (tmp_path / "one" / well / name).read_bytes() == \
                (tmp_path / "two" / well / name).read_bytes()
        assert not (tmp_path / "two" / well / "sheet.pdf").exists()


def test_cli_no_sheet_and_jobs(tmp_path, example_dir):
    out = tmp_path / "out"
    assert main(["screen", str(example_dir / "HRM-2.las"), "--no-sheet", "--jobs", "2",
                 "--out", str(out)]) == 0
    assert (out / "HRM-2" / "juxtapositions.csv").exists()
    assert not list(out.rglob("sheet.*"))
    assert main(["screen", str(example_dir / "HRM-2.las"), "--jobs", "0",
                 "--out", str(out)]) == 2


def test_demo_run_uses_bundled_tops_survey_and_pair(tmp_path, monkeypatch):
    monkeypatch.chdir(tmp_path)
    assert main(["screen", "--no-sheet", "--throw-max", "80", "--realisations", "20"]) == 0
    out = tmp_path / "screening"
    settings = (out / "logprep-settings.toml").read_text()
    assert "tops.csv" in settings and "surveys" in settings
    pairs = pd.read_csv(out / "pairs_summary.csv")
    assert pairs["status"].tolist() == ["ok"]
    assert (out / pairs["folder"].iloc[0] / "juxtapositions.csv").exists()
    assert not list(out.rglob("sheet.*"))  # --no-sheet covers the pair folders too
    faults = pd.read_csv(out / "faults.csv")
    assert set(faults["fault"]) == {"Harrowmere Fault", "Ostrel Fault"}
    assert not (out / "faults").exists()  # and the fault pages


def test_unreadable_auxiliary_unit_leaves_curve_out_not_the_well():
    # CWLS LAS 1.2 wrapped example (via lasio, MIT): GR present, density unit 'K/M' as read.
    from conftest import open_logs_path
    from logprep.run.pipeline import screen_file

    r = screen_file(open_logs_path("las_standard_examples", "1.2", "sample_wrapped.las"))
    assert any(n.startswith("RHOB not used: bulk-density unit 'K/M'") for n in r.notes)
    assert len(r.layers) >= 1


def test_error_line_names_a_relative_path_once(tmp_path, data_dir, monkeypatch, capsys):
    # the file named as the user typed it, once: `in/broken.las: not a readable ...`
    # (the one-line error form `FILE: what; what to do`, common practice, no source)
    (tmp_path / "in").mkdir()
    shutil.copy(data_dir / "not_las.las", tmp_path / "in" / "broken.las")
    monkeypatch.chdir(tmp_path)
    assert main(["screen", "in/broken.las", "--no-sheet", "--out", "o"]) == 1
    err = [ln for ln in capsys.readouterr().err.splitlines() if ln.startswith("error:")]
    assert err == [err[0]] and err[0].startswith("error: in/broken.las: not a readable LAS file")
