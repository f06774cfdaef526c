"""The command line end to end on the bundled example logs and on bad input.

These run the real CLI (in-process through ``logprep.cli.main`` and once as a subprocess),
real LAS files through lasio, and check the written PDF/PNG/CSV files.
"""

import shutil
import subprocess
import sys
from pathlib import Path

import numpy as np
import pandas as pd
import pytest

from logprep.cli import main
from logprep.fault.juxtaposition import WINDOW_COLUMNS
from logprep.report.writers import SUMMARY_COLUMNS


@pytest.fixture(scope="module")
def example_run(tmp_path_factory, example_dir):
    out = tmp_path_factory.mktemp("screen") / "out"
    code = main(["screen", str(example_dir), "--out", str(out)])
    return code, out


def test_example_run_writes_contract(example_run, example_dir):
    code, out = example_run
    assert code == 0
    summary = pd.read_csv(out / "summary.csv")
    assert list(summary.columns[:7]) == SUMMARY_COLUMNS[:7]
    las = sorted(p.stem for p in example_dir.glob("*.las"))
    assert sorted(summary["folder"]) == las and (summary["status"] == "ok").all()
    for stem in las:
        d = out / stem
        assert (d / "sheet.pdf").read_bytes().startswith(b"%PDF")
        assert (d / "sheet.png").read_bytes().startswith(b"\x89PNG")
        layers = pd.read_csv(d / "layers.csv")
        assert list(layers.columns[:5]) == ["top_m", "base_m", "thickness_m", "vsh", "lithology"]
        from logprep.model import LAYER_CLASSES
        assert set(layers["lithology"]) <= set(LAYER_CLASSES)
        # a reservoir layer is a sand by default; no data never is
        assert set(layers.loc[layers["reservoir"], "lithology"]) <= {"sand"}
        assert layers["vsh"].between(0, 1).all()
        np.testing.assert_allclose(layers["top_m"].iloc[1:], layers["base_m"].iloc[:-1], atol=1e-3)
        np.testing.assert_allclose(layers["thickness_m"], layers["base_m"] - layers["top_m"], atol=1e-3)
        # the example wells are 900-1200 m of section in metres (one well logged in feet)
        assert 800 < layers["base_m"].iloc[-1] - layers["top_m"].iloc[0] < 1300
        jux = pd.read_csv(d / "juxtapositions.csv")
        assert list(jux.columns[:8]) == WINDOW_COLUMNS
        from logprep.layers.footing import FOOTING_COLUMNS
        assert list(jux.columns[-8:]) == FOOTING_COLUMNS
        assert list(jux.columns[-12:-8]) == ["ssf_min", "ssf_max", "csp_min_m", "csp_max_m"]
        assert set(jux["footing"]) <= {"sound", "partly filled", "flagged", "thin",
                                       "partly filled; flagged", "partly filled; thin",
                                       "flagged; thin", "partly filled; flagged; thin"}
        assert (jux["ssf_min"] <= jux["ssf_max"]).all() and (jux["csp_min_m"] >= 0).all()
        assert len(jux) > 0
        assert jux["sgr_min_pct"].between(0, 100).all() and jux["sgr_max_pct"].between(0, 100).all()
        assert (jux["sgr_min_pct"] <= jux["sgr_max_pct"] + 1e-9).all()
        assert (jux["throw_min_m"] < jux["throw_max_m"]).all() and (jux["throw_max_m"] <= 300).all()


def test_feet_well_in_metres(example_run):
    # HRM-3 is logged in feet from 4900 ft: 4900 x 0.3048 = 1493.52 m.
    _, out = example_run
    layers = pd.read_csv(out / "HRM-3" / "layers.csv")
    assert layers["top_m"].iloc[0] == pytest.approx(4900 * 0.3048, abs=0.1)


def test_bad_inputs_one_line_errors_and_exit_1(tmp_path, data_dir, example_dir, capsys):
    src = tmp_path / "in"
    src.mkdir()
    for name in ("no_gamma_ray.las", "empty.las", "not_las.las"):
        shutil.copy(data_dir / name, src / name)
    shutil.copy(example_dir / "HRM-1.las", src / "HRM-1.las")
    out = tmp_path / "out"
    code = main(["screen", str(src), "--out", str(out)])
    err = capsys.readouterr().err
    assert code == 1
    lines = [ln for ln in err.splitlines() if ln.strip()]
    assert len(lines) == 3 and "Traceback" not in err
    assert any("no_gamma_ray.las: no gamma-ray curve" in ln for ln in lines)
    assert any("empty.las: file is empty" in ln for ln in lines)
    assert any("not_las.las: not a readable LAS file" in ln for ln in lines)
    summary = pd.read_csv(out / "summary.csv")
    assert sorted(summary["status"]) == ["error", "error", "error", "ok"]
    assert (out / "HRM-1" / "sheet.pdf").exists()
    assert not (out / "empty").exists()


def test_failed_rerun_keeps_earlier_results(tmp_path, data_dir):
    src = tmp_path / "w.las"
    shutil.copy(data_dir / "layered_metres.las", src)
    out = tmp_path / "out"
    assert main(["screen", str(src), "--out", str(out), "--min-bed", "0.5"]) == 0
    before = (out / "w" / "layers.csv").read_bytes()
    shutil.copy(data_dir / "not_las.las", src)
    assert main(["screen", str(src), "--out", str(out)]) == 1
    assert (out / "w" / "layers.csv").read_bytes() == before
    assert not list(out.rglob("*.tmp"))


def test_settings_reach_the_science(tmp_path, data_dir):
    out = tmp_path / "out"
    args = ["screen", str(data_dir / "layered_metres.las"), "--out", str(out),
            "--gr-clean", "30", "--gr-shale", "120", "--min-bed", "0.5", "--throw-max", "25"]
    assert main(args) == 0
    layers = pd.read_csv(out / "layered_metres" / "layers.csv")
    assert layers["lithology"].tolist() == ["sand", "shale", "sand"]
    np.testing.assert_allclose(layers["vsh"], [0, 1, 0], atol=1e-12)
    jux = pd.read_csv(out / "layered_metres" / "juxtapositions.csv")
    # upper sand 99.75-110, lower sand 120-130.25: faces the upper from t = 10 to 30.5, capped at 25;
    # hand-worked min SGR: at t = 25, z = 130.25 the window [105.25, 130.25] holds 10 m of shale -> 40 %.
    cross = jux[~jux["self_juxtaposed"]]
    assert len(cross) == 1
    row = cross.iloc[0]
    assert row["throw_min_m"] == pytest.approx(10.0) and row["throw_max_m"] == pytest.approx(25.0)
    assert row["sgr_min_pct"] == pytest.approx(40.0) and row["sgr_max_pct"] == pytest.approx(100.0)


@pytest.mark.parametrize("args", [
    ["screen", "--transform", "steiber"],
    ["screen", "--sand-cutoff", "0.8", "--shale-cutoff", "0.6"],
    ["screen", "--gr-clean", "cleanest"],
    ["screen", "/no/such/folder"],
    [],
])
def test_usage_errors_exit_2(args, capsys, tmp_path):
    with pytest.raises(SystemExit) as info:
        code = main(args + ["--out", str(tmp_path)] if args else args)
        raise SystemExit(code)
    assert info.value.code == 2
    err = capsys.readouterr().err
    assert err.strip() and "Traceback" not in err


def test_console_script_version_and_default_run(tmp_path):
    # the console script installed beside this interpreter (not another one on PATH)
    exe = Path(sys.executable).with_name("logprep")
    cmd = [str(exe)] if exe.exists() else [sys.executable, "-m", "logprep.cli"]
    v = subprocess.run(cmd + ["--version"], capture_output=True, text=True)
    assert v.returncode == 0 and v.stdout.startswith("logprep ")
    r = subprocess.run(cmd + ["screen", "--throw-max", "60", "--realisations", "30"], cwd=tmp_path,
                       capture_output=True, text=True, timeout=600)
    assert r.returncode == 0, r.stderr
    assert (tmp_path / "screening" / "summary.csv").exists()
    assert len(list((tmp_path / "screening").glob("*/sheet.pdf"))) >= 4
    # the bundled faults file: a fault page per fault, and faults.csv
    assert "screened 2 fault(s) in 30 realisations each: 2 ok" in r.stdout
    pages = sorted(p.name for p in (tmp_path / "screening" / "faults").iterdir())
    assert pages == ["Harrowmere_Fault.pdf", "Harrowmere_Fault.png", "Ostrel_Fault.pdf", "Ostrel_Fault.png"]


def test_readme_test_command_is_what_ci_runs():
    from conftest import REPO

    readme = (REPO / "README.md").read_text()
    ci = (REPO / ".ci" / "run").read_text()
    cmd = "python3 -m venv .venv && . .venv/bin/activate && pip install '.[test]' && pytest"
    assert cmd in readme and cmd in ci
    assert "&& logprep screen" in readme


def test_tops_file_matched_to_wells(tmp_path, example_dir):
    from logprep.run.pipeline import screen_file
    from logprep.run.settings import ScreenSettings

    s = ScreenSettings(tops_file=str(example_dir / "tops.csv"))
    r = screen_file(example_dir / "HRM-3.las", s)
    assert list(r.tops.columns) == ["well", "top_m", "name"]
    assert len(r.tops) >= 6 and set(r.tops["well"]) == {"HRM-3"}
    assert main(["screen", str(example_dir / "HRM-1.las"), "--tops", str(tmp_path / "none.csv"),
                 "--out", str(tmp_path / "o")]) == 2
