"""Two-well juxtaposition and SGR against an analytic thickness-change example, the
single-well limit, and dense sampling; the pairs CLI on the invented Harrowmere pair.

SGR definition: Yielding, Freeman & Needham (1997), AAPG Bulletin 81(6) 897-917; the
slipped-interval choices across two columns (footwall, hanging wall, average) are common
practice, no source.  Expected values below are worked by hand from the definition.
"""

import numpy as np
import pandas as pd
import pytest

from logprep.fault.juxtaposition import sand_windows
from logprep.model import Layers
from logprep.fault.twowell import (
    PairError, marker_shift_m, two_well_juxtaposition, two_well_sgr_pct, two_well_windows,
)

# Footwall well A: sand 0-50, shale 50-60, sand 60-100; tie marker at 50 (top of the shale).
A = Layers([0, 50, 60], [50, 60, 100], [0.0, 1.0, 0.0], ["sand", "shale", "sand"])
# Hanging-wall well B: the shale thickens to 20 m: sand 0-70, shale 70-90, sand 90-130;
# the marker at 70.  Shift = 70 - 50 = 20 m.
B = Layers([0, 70, 90], [70, 90, 130], [0.0, 1.0, 0.0], ["sand", "shale", "sand"])
SHIFT = 20.0


def test_marker_shift():
    tops_a = pd.DataFrame({"well": ["A"], "top_m": [50.0], "name": ["Tie Marker"]})
    tops_b = pd.DataFrame({"well": ["B"], "top_m": [70.0], "name": ["tie marker "]})
    assert marker_shift_m(tops_a, tops_b, "Tie marker") == SHIFT
    with pytest.raises(PairError, match="not found"):
        marker_shift_m(tops_a, tops_b, "Other")


def test_sgr_point_thickness_change():
    # z = 80, t = 35 -> hanging-wall depth y = 80 - 35 + 20 = 65 (B's upper sand).
    # footwall interval A[45, 80]: 10 m shale -> 10/35; hanging-wall interval B[65, 100]:
    # 20 m shale -> 20/35; average 15/35.
    for source, expect in (("footwall", 10 / 35), ("hangingwall", 20 / 35), ("average", 15 / 35)):
        assert two_well_sgr_pct(A, B, SHIFT, 80.0, 35.0, source) == pytest.approx(100 * expect, abs=1e-9)
    assert two_well_juxtaposition(A, B, SHIFT, [80.0], [35.0]).tolist() == [[1]]  # sand/sand
    assert two_well_juxtaposition(A, B, SHIFT, [80.0], [20.0]).tolist() == [[3]]  # y = 80: shale


def test_window_extremes_thickness_change():
    # Footwall sand [60, 100] against hanging-wall sand B[0, 70], throws up to 100 m.
    # Throw range: 60 - (70 - 20) = 10 to 100 (capped).
    # Footwall interval: the whole 10 m shale is inside, SGR = 10/t: 100 % at t = 10 and
    # 10 % at t = 100 (z = 100, y = 20).  Hanging-wall interval: shale overlap
    # min(z - 50, 20) over t = z - y + 20: 100 % at (z, y) = (60, 70); lowest 12.5 % at
    # (60, 0), t = 80.
    expected = {"footwall": (10.0, 100.0), "hangingwall": (12.5, 100.0)}
    for source, (lo, hi) in expected.items():
        w = two_well_windows(A, B, SHIFT, 100.0, source)
        row = w[(w.footwall_layer == 2) & (w.hangingwall_layer == 0)].iloc[0]
        assert (row.throw_min_m, row.throw_max_m) == (10.0, 100.0)
        assert row.sgr_min_pct == pytest.approx(lo, abs=1e-6)
        assert row.sgr_max_pct == pytest.approx(hi, abs=1e-6)


def test_average_extremes_against_dense_sampling():
    w = two_well_windows(A, B, SHIFT, 100.0, "average")
    row = w[(w.footwall_layer == 2) & (w.hangingwall_layer == 0)].iloc[0]
    z, y = np.meshgrid(np.linspace(60, 100, 401), np.linspace(0, 70, 701))
    t = z - y + SHIFT
    keep = (t >= 10 - 1e-9) & (t <= 100 + 1e-9)  # closed: the extremes sit on the limits
    s = two_well_sgr_pct(A, B, SHIFT, z[keep], t[keep], "average")
    s = s[np.isfinite(s)]  # the footwall interval must stay within well A (z - t >= 0)
    assert row.sgr_min_pct <= s.min() + 1e-9 and row.sgr_min_pct == pytest.approx(s.min(), abs=0.05)
    assert row.sgr_max_pct >= s.max() - 1e-9 and row.sgr_max_pct == pytest.approx(s.max(), abs=0.05)


def test_same_well_reduces_to_single_column():
    L = Layers([0, 12, 20, 35, 41, 70, 78], [12, 20, 35, 41, 70, 78, 100],
               [0.15, 0.8, 0.1, 0.55, 0.05, 0.95, 0.2],
               ["sand", "shale", "sand", "heterolith", "sand", "shale", "sand"])
    one = sand_windows(L, 60.0)
    for source in ("footwall", "hangingwall", "average"):
        two = two_well_windows(L, L, 0.0, 60.0, source)
        cols = ["throw_min_m", "throw_max_m", "sgr_min_pct", "sgr_max_pct"]
        np.testing.assert_allclose(two[cols].to_numpy(), one[cols].to_numpy(), atol=1e-6)


def test_pairs_cli_on_example(tmp_path, example_dir):
    from logprep.cli import main

    out = tmp_path / "out"
    code = main(["screen", str(example_dir / "HRM-2.las"), str(example_dir / "HRM-3.las"),
                 "--out", str(out), "--tops", str(example_dir / "tops.csv"),
                 "--pairs", str(example_dir / "pairs.csv"), "--pair-slip-from", "average",
                 "--field-depth-step", "2", "--field-throw-step", "5"])
    assert code == 0
    summary = pd.read_csv(out / "pairs_summary.csv")
    row = summary.iloc[0]
    # Kellan Marker: HRM-3 1988.00 m, HRM-2 1838.00 m (example_logs/tops.csv)
    assert row.status == "ok" and row.shift_m == pytest.approx(150.0)
    d = out / row.folder
    jux = pd.read_csv(d / "juxtapositions.csv")
    assert list(jux.columns[:8]) == list(sand_windows.__globals__["WINDOW_COLUMNS"])
    assert jux["sgr_min_pct"].between(0, 100).all() and len(jux) > 0
    z = np.load(d / "sgr_field.npz")
    assert z["sgr_pct_x10_diff"].shape == (z["depth_m"].size, z["throw_m"].size)
    assert (d / "sheet.pdf").read_bytes().startswith(b"%PDF")


def test_pairs_bad_rows_are_reported(tmp_path, example_dir, capsys):
    from logprep.cli import main

    pairs = tmp_path / "pairs.csv"
    pairs.write_text("footwall,hangingwall,marker\nHRM-2,HRM-9,Kellan Marker\nHRM-2,HRM-3,Nope\n")
    out = tmp_path / "out"
    code = main(["screen", str(example_dir / "HRM-2.las"), str(example_dir / "HRM-3.las"),
                 "--out", str(out), "--tops", str(example_dir / "tops.csv"), "--pairs", str(pairs),
                 "--field-depth-step", "4", "--field-throw-step", "10"])
    assert code == 1
    err = capsys.readouterr().err
    assert "HRM-9" in err and "not found" in err and "'Nope'" in err
    assert all(len(line) < 300 for line in err.splitlines())
    summary = pd.read_csv(out / "pairs_summary.csv")
    assert list(summary["status"]) == ["error", "error"]


def test_window_max_contact_within_the_screened_throws():
    # Hand-worked: footwall sand A[60, 100] (40 m) against B[0, 70] (70 m), in the
    # footwall's frame [-20, 50].  Contact L(t) = min(100, 50 + t) - max(60, -20 + t):
    # L(10) = 0, L(30) = 20, L(50) = 40 (= the footwall sand, up to t = 80).
    for cap, expect in ((30.0, 20.0), (100.0, 40.0)):
        w = two_well_windows(A, B, SHIFT, cap, "footwall")
        row = w[(w.footwall_layer == 2) & (w.hangingwall_layer == 0)].iloc[0]
        assert row.max_contact_m == pytest.approx(expect, abs=1e-12)


@pytest.mark.parametrize("top_m", [1000.0, 2000.0, 5000.0])
@pytest.mark.parametrize("source", ["footwall", "hangingwall", "average"])
def test_sand_against_its_counterpart_at_realistic_depth(top_m, source):
    # Worked by hand: shale 100 m (Vsh 0.8), sand 20 m (0.10), shale 30 m (0.9), sand 20 m
    # (0.05), shale 100 m (0.85); the hanging-wall well is the same column 150 m deeper.
    # A sand facing its own counterpart has only its own rock in the slipped interval
    # near zero throw and over its whole contact, so its SGR is its Vsh: 10 % and 5 %,
    # exactly as the single-well windows give for a sand against itself.
    d = top_m + np.array([0.0, 100.0, 120.0, 150.0, 170.0, 270.0])
    fw = Layers(d[:-1], d[1:], [0.8, 0.1, 0.9, 0.05, 0.85], ["shale", "sand", "shale", "sand", "shale"])
    hw = Layers(fw.top_m + 150.0, fw.base_m + 150.0, fw.vsh, fw.lithology)
    for other, shift in ((hw, 150.0), (fw, 0.0)):
        w = two_well_windows(fw, other, shift, 300.0, source)
        own = w[w.footwall_layer == w.hangingwall_layer].set_index("footwall_layer")
        assert own.loc[1, "sgr_min_pct"] == pytest.approx(10.0, abs=1e-9)
        assert own.loc[1, "sgr_max_pct"] == pytest.approx(10.0, abs=1e-9)
        assert own.loc[3, "sgr_min_pct"] == pytest.approx(5.0, abs=1e-9)
        assert own.loc[3, "sgr_max_pct"] == pytest.approx(5.0, abs=1e-9)
    single = sand_windows(fw, 300.0)
    pair = two_well_windows(fw, fw, 0.0, 300.0, source)
    for col in ("throw_min_m", "throw_max_m", "sgr_min_pct", "sgr_max_pct"):
        np.testing.assert_allclose(pair[col], single[col], atol=1e-9)


def test_hanging_wall_up_is_refused():
    from logprep.fault.twowell import check_hanging_wall_down

    check_hanging_wall_down(0.0)  # the same well twice
    check_hanging_wall_down(17.91)
    with pytest.raises(PairError, match=r"hanging wall is up: 'Top Foresets' is 17.91 m shallower in B than in A"):
        check_hanging_wall_down(-17.91, "A", "B", "Top Foresets")


def test_reversed_pair_and_stray_survey_are_reported(tmp_path, example_dir, capsys):
    # Kellan Marker: HRM-3 1988.00 m, HRM-2 1838.00 m (example_logs/tops.csv), so with
    # HRM-3 named as the footwall the hanging wall is 150 m up: the pair fails with a
    # message; a survey named for no well screened is named in a warning.
    from logprep.cli import main

    pairs = tmp_path / "pairs.csv"
    pairs.write_text("footwall,hangingwall,marker\nHRM-3,HRM-2,Kellan Marker\n")
    surveys = tmp_path / "surveys"
    surveys.mkdir()
    (surveys / "HRM-33.csv").write_text("md_m,inc_deg,azi_deg\n0,0,0\n3000,10,45\n")
    out = tmp_path / "out"
    code = main(["screen", str(example_dir / "HRM-2.las"), str(example_dir / "HRM-3.las"),
                 "--out", str(out), "--tops", str(example_dir / "tops.csv"), "--pairs", str(pairs),
                 "--survey-dir", str(surveys), "--no-sheet",
                 "--field-depth-step", "4", "--field-throw-step", "10"])
    assert code == 1
    err = capsys.readouterr().err
    assert "hanging wall is up: 'Kellan Marker' is 150.00 m shallower in HRM-2 than in HRM-3" in err
    assert "HRM-33.csv: survey matches no well" in err
    assert pd.read_csv(out / "pairs_summary.csv")["status"].tolist() == ["error"]
