"""Juxtaposition geometry and SGR against published definitions and hand-worked cases.

Sources: ../shared/METHODS.md sections 2-3.  SGR definition: Yielding, Freeman & Needham
(1997), Quantitative fault seal prediction, AAPG Bulletin 81(6) 897-917.  Juxtaposition
geometry: Allan (1989), AAPG Bulletin 73, 803-811; Knipe (1997), AAPG Bulletin 81(2)
187-195 (triangle diagram).  Values marked [D] in METHODS.md are derived by hand from
those definitions.
"""

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st

from logprep.fault.juxtaposition import (
    WINDOW_COLUMNS, contact_length_m, cumulative_clay, juxtaposition_grid,
    juxtaposition_throw_range, sand_windows, sgr_layered_pct,
)
from logprep.model import Layers


def layers(bounds, vsh, lith=None):
    lith = lith or ["sand" if v <= 0.35 else "shale" if v >= 0.65 else "heterolith" for v in vsh]
    return Layers(bounds[:-1], bounds[1:], vsh, lith)


def test_sgr_two_layer_check():
    # METHODS.md s.2 [D]: 20 m at Vsh 0.8 plus 30 m at 0.1, t = 50 m -> 38.0 %.
    L = layers([0, 20, 50], [0.8, 0.1])
    assert sgr_layered_pct(L, 50.0, 50.0) == pytest.approx(38.0, abs=1e-9)


def test_sgr_four_layer_check():
    # METHODS.md s.2 [D]: layers 0-20 (1.0), 20-50 (0.1), 50-60 (0.9), 60-100 (0.2);
    # z = 55, t = 40 -> window [15, 55] -> 31.25 %.
    L = layers([0, 20, 50, 60, 100], [1.0, 0.1, 0.9, 0.2])
    assert sgr_layered_pct(L, 55.0, 40.0) == pytest.approx(31.25, abs=1e-9)


def test_throw_range_check():
    # METHODS.md s.3 [D]: [100,130] vs [60,80] -> juxtaposed for 20 < t < 70.
    assert tuple(map(float, juxtaposition_throw_range(100, 130, 60, 80))) == (20.0, 70.0)


def test_contact_length_check():
    # METHODS.md s.3 [D]: contact at t = 20..70 -> 0, 10, 20, 20, 20, 10, 0 m.
    t = np.array([20, 30, 40, 45, 50, 60, 70.0])
    np.testing.assert_allclose(contact_length_m(100, 130, 60, 80, t), [0, 10, 20, 20, 20, 10, 0])


def test_max_contact_within_the_screened_throws():
    # METHODS.md s.3 [D]: [100,130] vs [60,80] touch for 20 < t < 70 with contact 0, 10,
    # 20, 20, 20, 10, 0 m at t = 20, 30, 40, 45, 50, 60, 70.  Screened to t <= 30 the
    # largest contact the window reaches is 10 m (at t = 30), to t <= 100 it is 20 m.
    L = layers([60, 80, 100, 130], [0.1, 0.9, 0.1])
    for cap, expect in ((30.0, 10.0), (100.0, 20.0), (65.0, 20.0)):
        w = sand_windows(L, throw_max_m=cap)
        r = w[(w.footwall_layer == 2) & (w.hangingwall_layer == 0)].iloc[0]
        assert r.max_contact_m == pytest.approx(expect, abs=1e-12)
    # a sand against itself: contact T - t, largest at the smallest throw
    w = sand_windows(L, throw_max_m=5.0)
    assert w[w.self_juxtaposed].max_contact_m.tolist() == [20.0, 30.0]


def test_bed_faces_itself_below_its_thickness():
    # METHODS.md s.3: a bed of thickness T faces itself for 0 <= t < T.
    lo, hi = juxtaposition_throw_range(40, 55, 40, 55)
    assert (float(lo), float(hi)) == (0.0, 15.0)


def test_sgr_hand_worked_three_layer_window():
    # Hand-worked: sand 0-10 (0.1), shale 10-14 (0.9), sand 14-30 (0.2).
    # z = 20, t = 15: window [5, 20] = 5 m x 0.1 + 4 m x 0.9 + 6 m x 0.2 = 5.3 m -> 35.33 %.
    L = layers([0, 10, 14, 30], [0.1, 0.9, 0.2])
    assert sgr_layered_pct(L, 20.0, 15.0) == pytest.approx(100 * 5.3 / 15, abs=1e-9)


def test_sgr_nan_outside_column_and_limit_at_zero_throw():
    L = layers([0, 10, 14, 30], [0.1, 0.9, 0.2])
    assert np.isnan(sgr_layered_pct(L, 5.0, 10.0))  # window top above the column
    assert sgr_layered_pct(L, 12.0, 0.0) == pytest.approx(90.0)


def _brute_extremes(L, fi, hi, throw_max, n=400):
    """Dense sampling of SGR over the contact area (independent of the vertex method)."""
    a, b = L.top_m[fi], L.base_m[fi]
    c, e = L.top_m[hi], L.base_m[hi]
    lo, up = juxtaposition_throw_range(a, b, c, e)
    up = min(up, throw_max)
    vals = []
    eps = 1e-7 * (up - lo)
    for t in np.concatenate(([lo + eps, up - eps], np.linspace(lo, up, n)[1:-1])):
        z0, z1 = max(a, c + t), min(b, e + t)
        if z1 > z0:
            z = np.linspace(z0, z1, 60)
            vals.append(sgr_layered_pct(L, z, t))
    v = np.concatenate(vals)
    return v.min(), v.max()


def test_window_extremes_match_dense_sampling():
    L = layers([0, 12, 20, 35, 41, 70, 78, 100], [0.15, 0.8, 0.1, 0.55, 0.05, 0.95, 0.2])
    w = sand_windows(L, throw_max_m=60.0)
    assert list(w.columns[:8]) == WINDOW_COLUMNS
    cross = w[~w.self_juxtaposed]
    assert len(cross) > 3
    for r in cross.itertuples():
        lo, hi = _brute_extremes(L, r.footwall_layer, r.hangingwall_layer, 60.0)
        # the vertex method is exact; dense sampling approaches it from inside
        assert r.sgr_min_pct <= lo + 1e-9 and r.sgr_min_pct == pytest.approx(lo, abs=0.01)
        assert r.sgr_max_pct >= hi - 1e-9 and r.sgr_max_pct == pytest.approx(hi, abs=0.01)


def test_windows_list_every_touching_sand_pair():
    # Expected pairs enumerated independently by the analytic rule of METHODS.md s.3.
    L = layers([0, 12, 20, 35, 41, 70, 78, 100], [0.15, 0.8, 0.1, 0.55, 0.05, 0.95, 0.2])
    sands = [i for i, x in enumerate(L.lithology) if x == "sand"]
    expected = set()
    for f in sands:
        for h in sands:
            lo, hi = juxtaposition_throw_range(L.top_m[f], L.base_m[f], L.top_m[h], L.base_m[h])
            if lo < min(hi, 40.0):
                expected.add((f, h))
    w = sand_windows(L, throw_max_m=40.0)
    assert set(zip(w.footwall_layer, w.hangingwall_layer)) == expected
    assert (w.throw_max_m <= 40.0).all()
    # a hanging-wall sand below the footwall sand never faces it under normal throw
    assert (w.hangingwall_top_m < w.footwall_base_m).all()


def test_juxtaposition_grid_classes():
    L = layers([0, 10, 20, 30], [0.1, 0.9, 0.1])
    g = juxtaposition_grid(L, np.array([5.0, 25.0]), np.array([0.0, 20.0]))
    # z=5,t=0 sand/sand; z=5,t=20 above column -> 0; z=25,t=0 sand/sand; z=25,t=20 -> sand@5
    assert g.tolist() == [[1, 0], [1, 1]]
    g2 = juxtaposition_grid(L, np.array([25.0]), np.array([10.0]))
    assert g2.tolist() == [[3]]  # sand (footwall) against shale from 15 m


bed_lists = st.lists(
    st.tuples(st.floats(0.5, 30.0), st.floats(0.0, 1.0)), min_size=1, max_size=12)


@settings(max_examples=60, deadline=None)
@given(beds=bed_lists, zf=st.floats(0, 1), tf=st.floats(0.001, 1))
def test_sgr_properties(beds, zf, tf):
    thick = np.array([b[0] for b in beds])
    vsh = np.array([b[1] for b in beds])
    bounds = np.concatenate(([0.0], np.cumsum(thick)))
    L = layers(bounds, vsh)
    z = bounds[-1] * zf
    t = max(z * tf, 1e-3)
    s = sgr_layered_pct(L, z, t)
    if z - t < 0:
        assert np.isnan(s)
    else:
        assert -1e-9 <= s <= 100 + 1e-9
        # uniform columns: all-shale gives 100, all-sand 0
        assert sgr_layered_pct(layers(bounds, np.ones_like(vsh)), z, t) == pytest.approx(100)
        assert sgr_layered_pct(layers(bounds, np.zeros_like(vsh)), z, t) == pytest.approx(0, abs=1e-9)


def test_cumulative_clay_total():
    L = layers([0, 20, 50], [0.8, 0.1])
    bounds, clay = cumulative_clay(L)
    assert clay[-1] == pytest.approx(19.0)
    assert bounds.tolist() == [0, 20, 50]


def test_heterolith_reservoir_above_a_net_to_gross():
    # Worked by hand: shale 1000-1010 (Vsh 0.9), an interbedded stack 1010-1020 blocked as
    # heterolith (Vsh 0.4, net-to-gross 0.6), shale 1020-1030 (0.9), sand 1030-1050 (0.06).
    # The footwall sand faces the stack for throws 10-40 m; lowest SGR at z = 1050 m,
    # t = 30 m: slipped interval [1020, 1050] = (10 x 0.9 + 20 x 0.06) / 30 = 34.0 %.
    from logprep.fault.juxtaposition import reservoir_mask

    L = Layers([1000.0, 1010.0, 1020.0, 1030.0], [1010.0, 1020.0, 1030.0, 1050.0],
               [0.9, 0.4, 0.9, 0.06], ["shale", "heterolith", "shale", "sand"],
               net_to_gross=[0.0, 0.6, 0.0, 1.0])
    assert reservoir_mask(L).tolist() == [False, False, False, True]
    assert reservoir_mask(L, 0.5).tolist() == [False, True, False, True]
    assert reservoir_mask(L, 0.7).tolist() == [False, False, False, True]
    plain = sand_windows(L, 100.0)
    assert len(plain) == 1 and plain["self_juxtaposed"].all()
    w = sand_windows(L, 100.0, reservoir=reservoir_mask(L, 0.5))
    row = w[(w.footwall_layer == 3) & (w.hangingwall_layer == 1)].iloc[0]
    assert (row.throw_min_m, row.throw_max_m) == (10.0, 40.0)
    assert row.sgr_min_pct == pytest.approx(34.0, abs=1e-9)
