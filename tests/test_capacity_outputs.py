"""Seal capacity end to end: table columns, sheet page, CLI options and errors, on one of
the invented Harrowmere example wells."""

import re
import shutil

import pandas as pd
import pytest

from logprep.fault.capacity import CAPACITY_COLUMNS
from logprep.cli import main
from logprep.fault.juxtaposition import WINDOW_COLUMNS
from logprep.run.pipeline import screen_file
from logprep.run.settings import ScreenSettings
from logprep.report.draw import TABLE_HEAD, window_rows
from logprep.report.sheet import build_sheet


@pytest.fixture(scope="module")
def hrm1(example_dir):
    return screen_file(example_dir / "HRM-1.las")


def test_table_has_capacity_columns_after_the_contract(hrm1):
    cols = list(hrm1.windows.columns)
    assert cols[:8] == WINDOW_COLUMNS
    # the capacity block follows the contract and the other window columns, in order
    # (later stages, e.g. the smear indicators, may append after it)
    k = cols.index(CAPACITY_COLUMNS[0])
    assert cols[k:k + len(CAPACITY_COLUMNS)] == CAPACITY_COLUMNS
    w = hrm1.windows
    assert set(w["verdict"]) <= {"leak", "uncertain", "seal", "self"}
    assert (w.loc[w["self_juxtaposed"], "verdict"] == "self").all()
    sealing = ~w["verdict"].isin(["leak", "self"])
    assert (w.loc[sealing, "column_gas_m"] > 0).all() and (w.loc[~sealing, "column_gas_m"] == 0).all()
    assert (w["fzp_bar"] > 0).all()
    # HRM-1 (invented) has EKB 25 m: burial depth below sea level = logged depth - 25 m
    top = pd.concat([w["footwall_top_m"], w["hangingwall_top_m"] + w["throw_min_m"]], axis=1).max(axis=1)
    assert (w["burial_depth_m"] - (top - 25.0)).abs().max() < 1e-9
    assert any("EKB 25 m" in n for n in hrm1.notes)


def test_sheet_shows_verdicts_and_capacity_page(hrm1):
    pages = build_sheet(hrm1)
    assert pages[1].texts[0].get_text().endswith("seal capacity of the sand-sand windows")
    page2 = " ".join(t.get_text() for t in pages[1].texts)
    for phrase in ("Screening estimate only", "Calibrate to local pressure data",
                   "licensed professional judgement", "CO2 storage containment", "Bretan, Yielding & Jones (2003)",
                   "not verified"):
        assert phrase in page2.replace("\n", " ")
    assert len(pages[1].axes) == 3
    rows = window_rows(hrm1.windows, [1, 2], 20.0)
    assert rows[0][TABLE_HEAD.index("verdict")] == hrm1.windows.iloc[0]["verdict"]
    assert rows[0][TABLE_HEAD.index("oil\ncolumn")].endswith(" m")


def test_cli_feet_and_co2_eos(tmp_path, example_dir):
    pytest.importorskip("CoolProp")
    src = tmp_path / "in"
    src.mkdir()
    shutil.copy(example_dir / "HRM-2.las", src)
    out = tmp_path / "out"
    code = main(["screen", str(src), "--out", str(out), "--length-unit", "ft",
                 "--co2-density-mode", "eos", "--max-burial", "3200", "--oil-density", "800"])
    assert code == 0
    jux = pd.read_csv(out / "HRM-2" / "juxtapositions.csv")
    assert list(jux.columns[:8]) == WINDOW_COLUMNS
    assert (jux["burial_depth_m"] == 3200).all()
    # the CSV keeps 10 significant figures
    assert ((jux["column_oil_ft"] * 0.3048 / jux["column_oil_m"]) - 1).abs().max() < 1e-9
    # HRM-2 contacts lie 1.7-2.3 km below sea level: CO2 on 10 C + 30 C/km, hydrostatic
    assert jux["co2_density_kgm3"].between(550, 800).all()
    pdf = (out / "HRM-2" / "sheet.pdf").read_bytes()
    assert len(re.findall(rb"/Type\s*/Page\b", pdf)) >= 2


@pytest.mark.parametrize("args,message", [
    (["--oil-density", "1100"], "--oil-density 1100 kg/m3 must be > 0 and below the brine density 1050 kg/m3"),
    (["--envelope-bounds", "3500,3000"], "--envelope-bounds must increase"),
    (["--envelope-c", "0.5,x"], "envelope_class_c: expected comma-separated numbers"),
    (["--sgr-leak", "25"], "--sgr-leak (25 %) must be within 0 and the SGR threshold (20 %)"),
])
def test_cli_bad_capacity_settings_are_one_line(tmp_path, capsys, args, message):
    code = main(["screen", "--out", str(tmp_path / "o"), *args])
    err = capsys.readouterr().err
    assert code == 2
    assert err.count("\n") == 1 and message in err


def test_settings_accept_envelope_lists():
    s = ScreenSettings(envelope_class_bounds_m="2500", envelope_class_c="0.6,0.1")
    assert s.envelope_class_bounds_m == (2500.0,) and s.envelope_class_c == (0.6, 0.1)
