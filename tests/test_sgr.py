"""The SGR field over footwall depth x throw: hand-worked and published checks, properties,
and agreement between independent routes.

Sources: SGR definition, Yielding, Freeman & Needham (1997), Quantitative fault seal
prediction, AAPG Bulletin 81(6) 897-917; check values derived from it in
../shared/METHODS.md section 2 (tag [D]: worked by hand from the definition).
"""

import io

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st

from logprep.fault.fieldcodec import read_field_arrays
from logprep.layers.blocking import block_cutoff
from logprep.fault.juxtaposition import (
    JUXTAPOSITION_CLASSES, cumulative_clay, juxtaposition_grid, sgr_layered_pct,
)
from logprep.model import Layers
from logprep.fault.sgr import (
    SgrField, cumulative_clay_curve, juxtaposition_field, sgr_field, sgr_field_pct, throw_axis_m,
)


def layers(bounds, vsh):
    lith = ["sand" if v <= 0.35 else "shale" if v >= 0.65 else "heterolith" for v in vsh]
    return Layers(bounds[:-1], bounds[1:], vsh, lith)


def field_at(L, z, t, g=0.5):
    """Field value at one (z, t) from the fast grid route (z must be a node)."""
    bounds, clay = cumulative_clay(L)
    depth, sgr = sgr_field_pct(bounds, clay, g, np.array([t]))
    i = int(np.argmin(np.abs(depth - z)))
    assert depth[i] == pytest.approx(z)
    return float(sgr[i, 0])


def test_field_two_layer_check():
    # METHODS.md s.2 [D]: 20 m at Vsh 0.8 plus 30 m at 0.1, t = 50 m -> 38.0 %.
    # float32 storage: 7 significant digits, so 1e-4 % absolute.
    assert field_at(layers([0, 20, 50], [0.8, 0.1]), 50.0, 50.0) == pytest.approx(38.0, abs=1e-4)


def test_field_four_layer_check():
    # METHODS.md s.2 [D]: layers 0-20 (1.0), 20-50 (0.1), 50-60 (0.9), 60-100 (0.2);
    # z = 55, t = 40 -> window [15, 55] -> 31.25 %.
    L = layers([0, 20, 50, 60, 100], [1.0, 0.1, 0.9, 0.2])
    assert field_at(L, 55.0, 40.0) == pytest.approx(31.25, abs=1e-4)


def test_field_throw_between_nodes():
    # Hand-worked: sand 0-10 (0.1), shale 10-14 (0.9), sand 14-30 (0.2); z = 20, t = 15.25:
    # window [4.75, 20] = 5.25 x 0.1 + 4 x 0.9 + 6 x 0.2 = 5.325 m -> 34.918 %.
    # The throw is not a whole number of 0.5 m nodes, so the interpolation path is used.
    L = layers([0, 10, 14, 30], [0.1, 0.9, 0.2])
    assert field_at(L, 20.0, 15.25) == pytest.approx(100 * 5.325 / 15.25, abs=1e-4)


def test_field_reverse_fault_negative_throw():
    # Hand-worked: reverse throw -10 m at z = 20 takes the interval [20, 30] below:
    # sand 14-30 at Vsh 0.2 -> 20 %.
    L = layers([0, 10, 14, 30], [0.1, 0.9, 0.2])
    assert field_at(L, 20.0, -10.0) == pytest.approx(20.0, abs=1e-4)
    assert np.isnan(field_at(L, 25.0, -10.0))  # window [25, 35] leaves the column


def ramp(h=0.1):
    """Vsh rising linearly 0 -> 1 over 0-100 m, sampled at interval centres."""
    depth = h / 2 + h * np.arange(int(round(100 / h)))
    return depth, depth / 100.0


def test_curve_ramp_check():
    # METHODS.md s.2 [D]: Vsh rising linearly 0 -> 1 over 0-100 m, window [20, 60] -> 40.0 %.
    # Interval edges fall on 20 and 60 and the midpoint rule is exact for a linear Vsh.
    depth, vsh = ramp()
    bounds, clay = cumulative_clay_curve(depth, vsh)
    d, sgr = sgr_field_pct(bounds, clay, 0.1, np.array([40.0]))
    i = int(np.argmin(np.abs(d - 60.0)))
    assert sgr[i, 0] == pytest.approx(40.0, abs=1e-4)


def test_curve_partial_samples_weighted_by_length():
    # Window [20.03, 60.03] cuts samples at both ends; the exact integral of the ramp is
    # (60.03^2 - 20.03^2) / 200 = 16.012 m of clay -> 40.03 %.  With constant Vsh per
    # 0.1 m sample the error of a partial sample is at most slope x h^2 / 8 = 1.25e-5 m
    # (two ends: 2.5e-5 m -> 6e-5 %).  Weighting whole samples instead would be off by
    # ~0.03 x 0.2 / 40 -> 0.015 %, far outside the tolerance.
    depth, vsh = ramp()
    bounds, clay = cumulative_clay_curve(depth, vsh)
    from logprep.fault.juxtaposition import sgr_from_cumulative_pct
    got = sgr_from_cumulative_pct(bounds, clay, 60.03, 40.0)
    assert got == pytest.approx(100 * (60.03**2 - 20.03**2) / 200 / 40, abs=1e-4)


def direct_sum_pct(edges, vsh, z, t):
    """Independent route: each sample's Vsh times its length inside [z - t, z]."""
    inside = np.clip(np.minimum(edges[1:], z) - np.maximum(edges[:-1], z - t), 0, None)
    return 100 * float(np.sum(vsh * inside)) / t


def test_field_matches_direct_summation_on_a_log():
    rng = np.random.default_rng(3)
    depth = 1500 + 0.1524 * np.arange(3000)
    vsh = np.clip(np.repeat(rng.uniform(0, 1, 60), 50) + rng.normal(0, 0.05, 3000), 0, 1)
    bounds, clay = cumulative_clay_curve(depth, vsh)
    throw = throw_axis_m(120.0, 0.5)
    d, sgr = sgr_field_pct(bounds, clay, 0.1524, throw, rows_every=3)
    for i, j in zip(rng.integers(0, d.size, 200), rng.integers(1, throw.size, 200)):
        if d[i] - throw[j] < bounds[0]:
            assert np.isnan(sgr[i, j])
        else:
            # float32 storage -> 1e-4 % absolute
            assert sgr[i, j] == pytest.approx(direct_sum_pct(bounds, vsh, d[i], throw[j]), abs=1e-4)


bed_lists = st.lists(st.tuples(st.integers(1, 40), st.floats(0.0, 1.0)), min_size=1, max_size=10)


@settings(max_examples=40, deadline=None)
@given(beds=bed_lists, step=st.sampled_from([0.5, 0.7, 1.3, 2.0]))
def test_field_properties(beds, step):
    # Bed thicknesses in whole 0.5 m nodes, so the field is exact (module notes).
    thick = 0.5 * np.array([b[0] for b in beds], float)
    vsh = np.array([b[1] for b in beds])
    bounds = np.concatenate(([0.0], np.cumsum(thick)))
    L = layers(bounds, vsh)
    throw = throw_axis_m(bounds[-1], step)
    depth, sgr = sgr_field_pct(*cumulative_clay(L), 0.5, throw)
    finite = np.isfinite(sgr)
    assert ((sgr[finite] >= -1e-4) & (sgr[finite] <= 100 + 1e-4)).all()
    ref = sgr_layered_pct(L, depth[:, None], throw[None, :])
    assert np.array_equal(finite, np.isfinite(ref))
    np.testing.assert_allclose(sgr[finite], ref[finite], atol=2e-4)
    for v, expect in ((1.0, 100.0), (0.0, 0.0)):  # all shale 100, all sand 0
        _, s = sgr_field_pct(*cumulative_clay(layers(bounds, np.full_like(vsh, v))), 0.5, throw)
        np.testing.assert_allclose(s[np.isfinite(s)], expect, atol=1e-4)


def test_layers_and_curve_routes_agree_on_a_blocky_log():
    # A blocky log (constant Vsh per bed, beds >= min bed) blocks into exactly its beds,
    # so the layered and the continuous-curve routes must give the same field.
    rng = np.random.default_rng(11)
    n_beds = 40
    lengths = rng.integers(10, 80, n_beds)
    values = rng.choice([0.1, 0.5, 0.9], n_beds)
    values[1::2] = np.where(values[1::2] == values[:-1:2], 0.5 if values[0] != 0.5 else 0.1,
                            values[1::2])
    vsh = np.repeat(values, lengths)
    depth = 1800 + 0.1524 * np.arange(vsh.size)
    L = block_cutoff(depth, vsh, sand_cutoff=0.35, shale_cutoff=0.65, min_bed_m=0.0)
    a = sgr_field(L, depth, vsh, throw_max_m=150, throw_step_m=0.5, depth_step_m=0.5, source="layers")
    b = sgr_field(L, depth, vsh, throw_max_m=150, throw_step_m=0.5, depth_step_m=0.5, source="curve")
    assert np.array_equal(np.isfinite(a.sgr_pct), np.isfinite(b.sgr_pct))
    np.testing.assert_allclose(a.sgr_pct, b.sgr_pct, atol=2e-4, equal_nan=True)


def test_juxtaposition_field_matches_point_classes():
    L = layers([0, 10, 14, 30, 42.5, 50], [0.1, 0.9, 0.2, 0.5, 0.95])
    throw = throw_axis_m(40, 0.75)
    jf = juxtaposition_field(L, 0.5, throw)
    depth = 0.5 * np.arange(jf.shape[0])
    # point route, nudged off the boundaries (a boundary belongs to the layer below)
    ref = juxtaposition_grid(L, depth + 1e-9, throw)
    ref[-1] = juxtaposition_grid(L, depth[-1:], throw)[0]  # the base belongs to the last layer
    assert np.array_equal(jf, ref)
    assert set(np.unique(jf)) <= set(JUXTAPOSITION_CLASSES)


def test_npz_contents():
    L = layers([0, 10, 14, 30], [0.1, 0.9, 0.2])
    depth = 0.25 + 0.5 * np.arange(60)
    vsh = np.interp(depth, [0, 10, 10, 14, 14, 30], [0.1, 0.1, 0.9, 0.9, 0.2, 0.2])
    f = sgr_field(L, depth, vsh, throw_max_m=20, throw_step_m=1.0, depth_step_m=1.0)
    z = np.load(io.BytesIO(f.npz_bytes()))
    assert z["sgr_pct_x10_diff"].shape == (z["depth_m"].size, z["throw_m"].size) == z["juxtaposition"].shape
    assert z["sgr_pct_x10_diff"].dtype == np.int16 and z["juxtaposition"].dtype == np.int8
    back = SgrField.from_npz(f.npz_bytes())
    np.testing.assert_allclose(back.sgr_pct, f.sgr_pct, atol=0.05 + 1e-6)  # 0.1 % steps, rounded
    assert np.array_equal(np.isnan(back.sgr_pct), np.isnan(f.sgr_pct))
    table = dict(zip(z["juxtaposition_codes"].tolist(), z["juxtaposition_names"].tolist()))
    assert table == JUXTAPOSITION_CLASSES
    assert z["depth_m"][0] == 0.0 and np.allclose(np.diff(z["depth_m"]), 1.0)


def test_cli_writes_sgr_field(tmp_path, example_dir):
    from logprep.cli import main

    out = tmp_path / "out"
    code = main(["screen", str(example_dir / "HRM-1.las"), "--out", str(out),
                 "--sgr-field-from", "curve", "--field-throw-step", "2", "--field-depth-step", "1"])
    assert code == 0
    z = read_field_arrays(out / "HRM-1" / "sgr_field.npz")
    assert str(z["source"]) == "curve"
    assert np.allclose(np.diff(z["throw_m"]), 2.0) and z["throw_m"][-1] == 300.0
    # rows every round(1 / 0.1524) = 7 samples
    assert np.allclose(np.diff(z["depth_m"]), 7 * 0.1524, atol=1e-6)
    s = z["sgr_pct"]
    assert np.nanmin(s) >= 0 and np.nanmax(s) <= 100 + 1e-4
    # NaN exactly where the slipped interval starts above the top of the log
    top = z["depth_m"][0]
    above = (z["depth_m"][:, None] - z["throw_m"][None, :]) < top - 1e-6
    assert np.array_equal(np.isnan(s), above)


def test_field_exact_when_boundaries_are_off_the_nodes():
    # A deviated well screened on TVD has an uneven depth axis (the TVD step shrinks as
    # the hole builds angle), so its layer boundaries and sample edges do not fall on the
    # field's uniform nodes.  The field must still be the SGR of the definition
    # (Yielding, Freeman & Needham 1997: 100/t x clay in [z - t, z]) at every grid point,
    # including the t -> 0 column (100 x Vsh just above z), and the juxtaposition codes
    # must be those of the point route.  Hand-worked stand-in for such a log: MD samples
    # every 0.1524 m mapped through TVD = MD cos(inc) with inc rising 0 -> 40 degrees.
    rng = np.random.default_rng(5)
    md = 2000 + 0.1524 * np.arange(2400)
    tvd = 2000 + np.cumsum(np.concatenate(([0.0], np.diff(md) * np.cos(np.radians(np.linspace(0, 40, md.size - 1))))))
    vsh = np.clip(np.repeat(rng.uniform(0, 1, 48), 50) + rng.normal(0, 0.03, md.size), 0, 1)
    L = block_cutoff(tvd, vsh, sand_cutoff=0.35, shale_cutoff=0.65, min_bed_m=1.0)
    for source in ("layers", "curve"):
        f = sgr_field(L, tvd, vsh, throw_max_m=60, throw_step_m=1.0, depth_step_m=0.5, source=source)
        bounds, clay = (cumulative_clay(L) if source == "layers"
                        else cumulative_clay_curve(tvd, vsh))
        from logprep.fault.juxtaposition import sgr_from_cumulative_pct
        ref = sgr_from_cumulative_pct(bounds, clay, f.depth_m[:, None], f.throw_m[None, :])
        assert np.array_equal(np.isfinite(f.sgr_pct), np.isfinite(ref))
        # float32 storage of a percentage: 1e-3 % absolute
        np.testing.assert_allclose(f.sgr_pct, ref, atol=1e-3, equal_nan=True)
        assert np.array_equal(f.juxtaposition, juxtaposition_grid(L, f.depth_m, f.throw_m))


def test_field_snaps_large_throws_on_a_fine_log():
    # 0.1 m sampling from 2000 m: the median step is 0.09999999999990905 m, so a throw of
    # 110 m is 1100.000000001 steps.  Worked by hand: alternating 20 m beds, Vsh 0.1
    # (sand) and 0.8 (shale) from 2000 m; at z = 2110 m and t = 110 m the slipped
    # interval [2000, 2110] holds 3 x 20 m at 0.1, 2 x 20 m at 0.8 and 10 m at 0.8:
    # 46 m of clay, SGR = 100 x 46 / 110 = 41.818 %.  The juxtaposition, counted in whole
    # nodes (node k faces node k - 10 t; a node on a boundary belongs to the bed below),
    # must match cell for cell, including the cells reaching the log top.
    from logprep.fault.juxtaposition import _PAIR_CODE
    depth = np.arange(2000.0, 2400.0, 0.1)
    tops = np.arange(2000.0, 2400.0, 20.0)
    n = tops.size
    lay = Layers(tops, tops + 20.0, np.where(np.arange(n) % 2 == 0, 0.1, 0.8),
                 ["sand" if i % 2 == 0 else "shale" for i in range(n)])
    vsh = np.where(((depth - 2000.0 + 1e-6) // 20.0) % 2 == 0, 0.1, 0.8)
    f = sgr_field(lay, depth, vsh, throw_max_m=200.0, throw_step_m=1.0, depth_step_m=None)
    i, j = int(np.argmin(np.abs(f.depth_m - 2110.0))), int(np.searchsorted(f.throw_m, 110.0))
    assert f.sgr_pct[i, j] == pytest.approx(100 * 46 / 110, abs=1e-4)
    k = np.arange(f.depth_m.size)[:, None]
    m = k - 10 * np.round(f.throw_m).astype(int)[None, :]
    fw, hw = np.minimum(k // 200, n - 1), np.where(m >= 0, np.minimum(m // 200, n - 1), -1)
    codes = lay.lithology_code
    exact = np.where(hw < 0, 0, _PAIR_CODE[codes[fw], codes[np.maximum(hw, 0)]])
    assert int((exact != f.juxtaposition).sum()) == 0
    assert not np.isnan(f.sgr_pct[m >= 0]).any()
