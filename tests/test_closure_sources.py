"""Structural closure per well (closures file), per pair (pairs file) and per fault (faults
file): read, chosen by precedence, and used to cap the columns of the deterministic windows,
the pair windows and the Monte Carlo answers alike.

The cap itself is ``column = min(fault-rock column, closure)`` (a trap holds no more than its
crest-to-spill-point height: common practice, no source); the values below are worked by hand
from that rule."""

from types import SimpleNamespace

import numpy as np
import pytest

from logprep.errors import LogprepError
from logprep.io.closures import closure_for_well, read_closures
from logprep.run.faults import fault_closure_source
from logprep.run.pairs import pair_closure, read_pairs
from logprep.run.pipeline import screen_file
from logprep.run.settings import ScreenSettings


def test_closures_file_is_read_by_well_name(tmp_path):
    f = tmp_path / "closures.csv"
    f.write_text("# trap heights from the depth maps\nwell;closure_m\nHRM 1;120,5\nHRM-2;\n", encoding="utf-8")
    got = read_closures(f)
    # worked by hand: the decimal comma with semicolons is 120.5 m; a blank cell is no closure
    assert closure_for_well(got, "HRM-1") == (120.5, "HRM 1")
    assert closure_for_well(got, "nope", "hrm_2") == (None, "HRM-2")
    assert closure_for_well(got, "HRM-3") is None


@pytest.mark.parametrize("body, says", [
    ("well,closure_m\nHRM-1,-40\n", "line 2: closure_m -40 must be a positive number"),
    ("well,closure_m\nHRM-1,tall\n", "line 2: closure_m 'tall' is not a number"),
    ("well,closure_m\nHRM-1,100\nHRM 1,200\n", "line 3: well 'HRM 1' is listed twice"),
    ("well,height\nHRM-1,100\n", "needs the columns well and closure_m"),
    ("well,closure_m\n,100\n", "line 2: the well is not named"),
])
def test_closures_file_errors_name_file_line_and_fix(tmp_path, body, says):
    f = tmp_path / "closures.csv"
    f.write_text(body, encoding="utf-8")
    with pytest.raises(LogprepError) as e:
        read_closures(f)
    msg = str(e.value)
    assert msg.startswith(str(f)) and says in msg and "\n" not in msg
    assert ";" in msg  # what to do follows


@pytest.fixture(scope="module")
def hrm1_open(example_dir):
    return screen_file(example_dir / "HRM-1.las", ScreenSettings())


def test_well_closure_caps_its_windows_and_the_sheet_says_so(example_dir, tmp_path, hrm1_open):
    f = tmp_path / "closures.csv"
    f.write_text("well,closure_m\nHRM-1,40\nHRM-2,500\n", encoding="utf-8")
    capped = screen_file(example_dir / "HRM-1.las", ScreenSettings(closures_file=str(f), closure_m=900.0))
    w0, w1 = hrm1_open.windows, capped.windows
    assert capped.settings.capacity.closure_m == 40.0  # the file overrides --closure for HRM-1
    assert "columns capped at the structural closure of 40 m (closures.csv, well HRM-1)" in "; ".join(capped.notes)
    sealing = ~w0["verdict"].isin(["leak", "self"])
    assert sealing.any()
    for fluid in ("oil", "gas", "co2"):
        raw = w0[f"column_{fluid}_m"].to_numpy(float)
        got = w1[f"column_{fluid}_m"].to_numpy(float)
        # worked by hand: min(fault-rock column, 40 m) where the fault can seal, 0 m elsewhere
        assert np.allclose(got[sealing], np.minimum(raw[sealing], 40.0))
        assert (got[~sealing] == 0.0).all()
        lim = w1[f"column_{fluid}_limit"].to_numpy(object)
        assert set(lim[sealing & (raw > 40.0)]) <= {"closure"}
        assert set(lim[sealing & (raw <= 40.0)]) <= {"fault rock"}
    assert (w1["closure_m"] == 40.0).all() and w0["closure_m"].isna().all()
    assert not w1["column_unconstrained"].any()


def test_a_well_the_file_does_not_list_keeps_the_run_closure(example_dir, tmp_path, hrm1_open):
    f = tmp_path / "closures.csv"
    f.write_text("well,closure_m\nHRM-2,40\n", encoding="utf-8")
    r = screen_file(example_dir / "HRM-1.las", ScreenSettings(closures_file=str(f), closure_m=75.0))
    assert r.settings.capacity.closure_m == 75.0 and r.closure_source == "--closure"
    assert (r.windows["closure_m"] == 75.0).all()
    assert r.windows["column_oil_m"].max() <= 75.0


def test_pair_closure_precedence(tmp_path):
    """A pair's own closure (pairs file) comes first, then the footwall well's."""
    fw = SimpleNamespace(settings=ScreenSettings(closure_m=300.0), closure_source="closures.csv, well A")
    assert pair_closure("80", fw, "pairs file, A / B") == (80.0, "pairs file, A / B")
    assert pair_closure("", fw) == (300.0, "footwall well, closures.csv, well A")
    bare = SimpleNamespace(settings=ScreenSettings(), closure_source="--closure")
    assert pair_closure(" ", bare) == (None, "--closure")
    f = tmp_path / "pairs.csv"
    f.write_text("footwall,hangingwall,shift_m,closure_m\nA,B,20,\nA,C,25,0\n", encoding="utf-8")
    with pytest.raises(LogprepError, match="line 3: closure_m 0 must be a positive number"):
        read_pairs(f)
    f.write_text("footwall,hangingwall,shift_m,closure_m\nA,B,20,\nA,C,25,60\n", encoding="utf-8")
    assert read_pairs(f)["closure_m"].tolist() == ["", "60"]


def test_fault_closure_precedence():
    fw = SimpleNamespace(closure_source="closures.csv, well A")
    assert fault_closure_source(SimpleNamespace(closure_m=55.0, name="F1"), fw) == "faults file, fault F1"
    assert fault_closure_source(SimpleNamespace(closure_m=None, name="F1"), fw) == \
        "footwall well, closures.csv, well A"


def test_monte_carlo_columns_take_the_footwall_wells_closure(example_dir, tmp_path):
    """A fault without its own closure is capped by its footwall well's closures-file row."""
    from logprep.fault.uncertainty import Spreads
    from logprep.io.faults import FaultSpec
    from logprep.run.faults import screen_fault

    f = tmp_path / "closures.csv"
    f.write_text("well,closure_m\nHRM-1,30\n", encoding="utf-8")
    s = ScreenSettings(closures_file=str(f))
    fw = screen_file(example_dir / "HRM-1.las", s)
    spec = FaultSpec(name="F-test", footwall="HRM-1", throw_m=40.0, throw_low_m=30.0, throw_high_m=50.0,
                     throw_dist="uniform")
    res = screen_fault(spec, fw, None, s, Spreads(realisations=40, random_state=3))
    assert res.closure_m == 30.0 and res.closure_source == "footwall well, closures.csv, well HRM-1"
    assert (res.table["closure_m"] == 30.0).all()
    for fluid in ("oil", "gas", "co2"):
        cols = res.realisations[f"column_{fluid}_m"]
        assert np.nanmax(cols) <= 30.0 + 1e-9
