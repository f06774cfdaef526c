"""Awkward files and settings as users meet them: each gives a result or one clear line
naming the file, never a traceback; shared inputs are checked before any well runs.

Fixtures are written under ``tmp_path`` by the tests (common practice, no source: these
are behaviour checks, not science checks)."""

import numpy as np
import pandas as pd
import pytest

from logprep.cli import main
from logprep.errors import LogprepError, SettingsError
from logprep.run.pipeline import screen_file
from logprep.run.settings import ScreenSettings
from logprep.io.tops import read_tops


def write_las(path, depth_m, gr_api, well="FIX-1"):
    """A minimal LAS 2.0 file with DEPT (m) and GR (API)."""
    rows = "".join(f"{z:.4f} {g:.4f}\n" for z, g in zip(depth_m, gr_api))
    path.write_text(
        "~VERSION INFORMATION\n VERS. 2.0 :\n WRAP. NO :\n~WELL INFORMATION\n"
        f" STRT.M {depth_m[0]} :\n STOP.M {depth_m[-1]} :\n STEP.M 0 :\n NULL. -999.25 :\n"
        f" WELL. {well} : WELL\n~CURVE INFORMATION\n DEPT.M : DEPTH\n GR.GAPI : GAMMA RAY\n"
        "~A\n" + rows)
    return path


def layered(path, **kw):
    """GR 30 API sand 100-110 m, 120 API shale 110-120 m, 30 API sand 120-130 m."""
    z = np.arange(100.0, 130.01, 0.5)
    return write_las(path, z, np.where((z >= 110) & (z < 120), 120.0, 30.0), **kw)


def one_line_error(capsys):
    err = capsys.readouterr().err
    assert "Traceback" not in err
    lines = [ln for ln in err.splitlines() if ln.strip()]
    assert len(lines) == 1, err
    return lines[0]


def test_no_sand_sand_window_still_gives_a_sheet(tmp_path):
    # all shale with noise: one lithology, so the windows table is empty but typed
    from logprep.report.sheet import build_sheet

    z = np.arange(100.0, 130.01, 0.5)
    r = screen_file(write_las(tmp_path / "shale.las", z, 120 + 5 * np.sin(7 * z)))
    assert len(r.windows) == 0 and r.windows["self_juxtaposed"].dtype == bool
    assert np.isnan(r.min_window_sgr_pct)
    assert len(build_sheet(r)) >= 1


def test_log_shorter_than_one_field_row_still_gives_a_sheet(tmp_path):
    # 10 samples over 9 mm: the SGR field has one row, too few to contour
    from logprep.report.sheet import build_sheet

    z = 100 + 0.001 * np.arange(10)
    r = screen_file(write_las(tmp_path / "short.las", z, np.where(np.arange(10) % 2, 30.0, 120.0)))
    assert r.grid.sgr_pct.shape[0] == 1
    assert len(build_sheet(r)) >= 1


@pytest.mark.parametrize("option", ["--throw-max", "--sand-cutoff", "--min-bed"])
@pytest.mark.parametrize("value", ["inf", "nan"])
def test_non_finite_setting_is_a_usage_error(tmp_path, capsys, option, value):
    las = layered(tmp_path / "w.las")
    assert main(["screen", str(las), "--no-sheet", "--out", str(tmp_path / "o"),
                 option, value]) == 2
    assert "must be a finite number" in one_line_error(capsys)


def test_oversized_sgr_field_fails_the_well_not_the_machine(tmp_path, capsys):
    las = layered(tmp_path / "w.las")
    out = tmp_path / "o"
    assert main(["screen", str(las), "--no-sheet", "--out", str(out),
                 "--field-throw-step", "0.00001"]) == 1
    line = one_line_error(capsys)
    assert str(las) in line and "million cells" in line and "--field-throw-step" in line
    assert pd.read_csv(out / "summary.csv")["status"].tolist() == ["error"]


@pytest.mark.parametrize("raw", [
    b"\xef\xbb\xbfwell,top_m,name\nFIX-1,115,Mid\n",              # UTF-8 with BOM
    b"well;top_m;name\nFIX-1;115,0;Mid\n",                          # semicolons, decimal comma
    b"well\ttop_m\tname\nFIX-1\t115\tMid\n",                        # tabs
    "well,top_m,name\nFIX-1,115,Mid\n".encode("utf-16"),            # UTF-16 with BOM
    b"well, top_m, name\r\nFIX-1, 115, Mid\r\n",                      # CRLF, spaces
])
def test_tops_csv_as_spreadsheets_save_it(tmp_path, raw):
    path = tmp_path / "tops.csv"
    path.write_bytes(raw)
    tops = read_tops(path)
    assert tops[["well", "top_m", "name"]].values.tolist() == [["FIX-1", 115.0, "Mid"]]


def test_tops_csv_in_windows_latin1_keeps_the_name(tmp_path):
    path = tmp_path / "tops.csv"
    path.write_bytes("well,top_m,name\nFIX-1,115,Café Sand\n".encode("cp1252"))
    assert read_tops(path)["name"].tolist() == ["Café Sand"]


def test_empty_tops_csv_says_so(tmp_path):
    path = tmp_path / "tops.csv"
    path.write_bytes(b"")
    with pytest.raises(LogprepError, match=r"tops.csv: the tops CSV is empty"):
        read_tops(path)


def test_semicolon_survey_and_pairs(tmp_path):
    from logprep.run.pairs import read_pairs
    from logprep.io.survey import read_survey

    s = tmp_path / "W.csv"
    s.write_text("md_m;inc_deg;azi_deg\n0;0;0\n100;2,5;90\n")
    md, inc, _ = read_survey(s)
    assert md.tolist() == [0.0, 100.0] and inc.tolist() == [0.0, 2.5]
    p = tmp_path / "pairs.csv"
    p.write_text("footwall;hangingwall;shift_m\nA-1;A-2;12,5\n")
    assert read_pairs(p)["shift_m"].tolist() == ["12,5"]


def test_shared_inputs_fail_before_any_well(tmp_path, capsys):
    las = layered(tmp_path / "w.las")
    out = tmp_path / "o"
    assert main(["screen", str(las), "--no-sheet", "--out", str(out),
                 "--survey-dir", str(tmp_path / "nowhere")]) == 2
    assert "survey folder not found" in one_line_error(capsys)
    assert main(["screen", str(las), "--no-sheet", "--out", str(out),
                 "--pairs", str(tmp_path / "none.csv")]) == 2
    assert "none.csv: pairs CSV not found" in one_line_error(capsys)
    assert not (out / "summary.csv").exists()  # no well was screened


def test_out_that_is_a_file(tmp_path, capsys):
    las = layered(tmp_path / "w.las")
    taken = tmp_path / "taken"
    taken.write_text("keep me")
    assert main(["screen", str(las), "--no-sheet", "--out", str(taken)]) == 2
    assert "--out must name a folder" in one_line_error(capsys)
    assert main(["tune", str(las), "--out", str(taken)]) == 2
    assert "--out must name a folder" in one_line_error(capsys)
    assert taken.read_text() == "keep me"


def test_well_folder_never_takes_a_run_file_name(tmp_path):
    from logprep.report.writers import folder_name

    taken: set[str] = set()
    names = [folder_name(p, taken) for p in ("a/logprep-settings.toml.las",
                                             "b/pairs_summary.csv.las", "c/W.las", "d/W.las")]
    assert names == ["logprep-settings.toml-2", "pairs_summary.csv-2", "W", "W-2"]


@pytest.mark.parametrize("sweep, message", [
    (["--sand-sweep", "0:inf:1"], "is not 'a,b,c' or 'start:stop:step'"),
    (["--sand-sweep", "nan,0.3"], "not a finite number"),
    (["--sand-sweep", "0:1:0.000001"], "gives 1000001 values; use at most 200"),
    (["--sand-sweep", "0.7,0.8", "--shale-sweep", "0.5,0.6"], "nothing to sweep"),
])
def test_tune_bad_ranges_are_usage_errors(tmp_path, capsys, sweep, message):
    las = layered(tmp_path / "w.las")
    assert main(["tune", str(las), "--out", str(tmp_path / "t"), *sweep]) == 2
    assert message in one_line_error(capsys)
    assert not (tmp_path / "t" / "tune.csv").exists()


def test_settings_reject_non_finite_from_python():
    with pytest.raises(SettingsError, match="throw_max_m must be a finite number"):
        ScreenSettings(throw_max_m=float("inf"))


def test_config_unknown_key_suggests_the_near_one(tmp_path, capsys):
    cfg = tmp_path / "s.toml"
    cfg.write_text("sand_cut = 0.3\n")
    las = layered(tmp_path / "w.las")
    assert main(["screen", str(las), "--no-sheet", "--out", str(tmp_path / "o"),
                 "--config", str(cfg)]) == 2
    line = one_line_error(capsys)
    assert "unknown key 'sand_cut'; valid keys:" in line
    assert line.endswith("did you mean 'sand_cutoff'?")


def test_config_depth_unit_checked_before_any_well(tmp_path, capsys):
    cfg = tmp_path / "s.toml"
    cfg.write_text('depth_unit = "furlong"\n')
    las = layered(tmp_path / "w.las")
    assert main(["screen", str(las), "--no-sheet", "--out", str(tmp_path / "o"),
                 "--config", str(cfg)]) == 2
    assert "unknown depth unit 'furlong'; use m or ft" in one_line_error(capsys)
