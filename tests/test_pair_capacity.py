"""Seal capacity of well-pair windows, checked against the one-well seal-capacity table
(identical columns tied at zero shift must give the same numbers) and against a brute-force
leak point sampled densely along each contact (independent of the cutting at bed edges)."""

import numpy as np
import pytest

from logprep.fault.capacity import CapacityParams, contact_ends, seal_capacity_table, window_throws
from logprep.fault.envelope import envelope_c, fault_zone_pressure_bar
from logprep.fault.juxtaposition import sand_windows
from logprep.fault.pair_capacity import footwall_frame, pair_seal_capacity_table
from logprep.fault.twowell import two_well_sgr_pct, two_well_windows
from logprep.run.pipeline import screen_file
from logprep.run.settings import ScreenSettings


@pytest.fixture(scope="module")
def columns(example_dir):
    s = ScreenSettings()
    return (screen_file(example_dir / "HRM-2.las", s).layers,
            screen_file(example_dir / "HRM-3.las", s).layers)


def test_identical_columns_match_the_one_well_table(columns):
    layers, _ = columns
    p = CapacityParams()
    pair = pair_seal_capacity_table(two_well_windows(layers, layers, 0.0, 300.0), layers, layers, 0.0, p)
    one = seal_capacity_table(sand_windows(layers, 300.0), layers, p)
    one = one[~one["self_juxtaposed"]]  # a sand against itself: verdict "self" for one well only
    m = pair.merge(one, on=["footwall_layer", "hangingwall_layer"], suffixes=("_p", "_s"))
    assert len(m) == len(one)
    for col in ("column_oil_m", "column_gas_m", "column_co2_m"):
        assert np.allclose(m[col + "_p"], m[col + "_s"], rtol=1e-9)
    assert (m["verdict_p"] == m["verdict_s"]).all()
    assert np.allclose(m["fzp_bar_p"], m["fzp_bar_s"], rtol=1e-6)


@pytest.mark.parametrize("slip", ["footwall", "hangingwall", "average"])
def test_columns_match_dense_sampling_along_each_contact(columns, slip):
    fw, hw = columns
    shift = 37.0
    p = CapacityParams()
    w = two_well_windows(fw, hw, shift, 300.0, slip)
    table = pair_seal_capacity_table(w, fw, hw, shift, p, slip_source=slip)
    g = 9.80665  # standard gravity (CGPM 1901)
    for k in range(0, len(w), max(1, len(w) // 6)):
        ww = footwall_frame(w.iloc[k], shift)
        t = window_throws(ww, p.n_throws)
        top, base, _, _ = contact_ends(ww, t)
        c = float(envelope_c(table["burial_depth_m"].iloc[k]))
        best = np.inf
        for ti, z0, z1 in zip(t, top, base):
            z = np.linspace(z0, z1, 3001)
            s = two_well_sgr_pct(fw, hw, shift, z, np.full(z.size, ti), slip)
            fzp = fault_zone_pressure_bar(s, 0.0, class_bounds_m=(0.0,), class_c=(c, c))
            # measured from the crest of the trapping (footwall) sand
            crest = float(ww["footwall_top_m"])
            best = min(best, np.nanmin(z + fzp * 1e5 / ((p.rho_brine_kgm3 - p.rho_oil_kgm3) * g) - crest))
        if table["verdict"].iloc[k] == "leak":  # a leaking fault holds no sealing column
            assert table["column_oil_m"].iloc[k] == 0.0
            continue
        exact = table["column_oil_m"].iloc[k]
        # the exact minimum is never above the sampled one, and close to it
        assert exact <= best + 1e-6
        assert exact == pytest.approx(best, rel=2e-3, abs=0.05)


def test_pair_rows_fill_every_capacity_column_as_one_well_does(columns):
    """The calibration, displacement and leak-point columns of a pair row mean what they mean
    for one well: identical columns tied at zero shift give the one-well values."""
    from logprep.fault.capacity import CAPACITY_COLUMNS

    layers, _ = columns
    p = CapacityParams()
    pair = pair_seal_capacity_table(two_well_windows(layers, layers, 0.0, 300.0), layers, layers, 0.0, p)
    one = seal_capacity_table(sand_windows(layers, 300.0), layers, p)
    one = one[~one["self_juxtaposed"]]
    m = pair.merge(one, on=["footwall_layer", "hangingwall_layer"], suffixes=("_p", "_s"))
    assert len(m) == len(one) > 0
    for col in CAPACITY_COLUMNS:
        a, b = m[col + "_p"], m[col + "_s"]
        if col in ("verdict", "fault_rock_outside_calibration"):
            assert (a.astype(str) == b.astype(str)).all(), col
        else:
            assert np.allclose(a.to_numpy(float), b.to_numpy(float), rtol=1e-6, atol=1e-6), col
    # none left empty
    assert pair[["fault_rock_displacement_m", "crest_depth_m", "leak_depth_m", "leak_sgr_pct",
                 "leak_fzp_bar"]].notna().all().all()


def test_pair_leak_point_reproduces_the_column(columns):
    """``column_oil_m = leak_depth_m + leak_fzp_bar 1e5 / ((rho_w - rho_oil) g) - crest_depth_m``
    where the fault rock limits it (the one-well identity, worked by hand from the
    definitions), and the displacement is throw / sin(60 deg) = throw x 1.1547."""
    fw, hw = columns
    p = CapacityParams()
    shift = 37.0
    t = pair_seal_capacity_table(two_well_windows(fw, hw, shift, 300.0), fw, hw, shift, p)
    rock = t[t["column_oil_limit"] == "fault rock"]
    assert len(rock)
    g = 9.80665  # standard gravity (CGPM 1901)
    h = rock["leak_depth_m"] + rock["leak_fzp_bar"] * 1e5 / ((p.rho_brine_kgm3 - p.rho_oil_kgm3) * g) \
        - rock["crest_depth_m"]
    assert np.allclose(h, rock["column_oil_m"], rtol=1e-9, atol=1e-6)
    assert np.allclose(t["fault_rock_displacement_m"], t["fault_rock_throw_m"] / np.sin(np.radians(60.0)))


def test_pair_sgr_uses_the_clay_fraction(columns):
    """With a pure-shale clay fraction of 0.6 every pair SGR is 0.6 x the Vsh-based one
    (SGR is linear in the clay fraction, Yielding et al. 1997; Vcl = 0.6 Vsh)."""
    from logprep.fault.pair_capacity import pair_clay_layers
    from logprep.fault.settings import FieldSettings

    fw, hw = columns
    base = two_well_windows(fw, hw, 37.0, 300.0)
    fc, hc = pair_clay_layers(fw, hw, FieldSettings(shale_clay_fraction=0.6))
    clay = two_well_windows(fc, hc, 37.0, 300.0)
    assert len(clay) == len(base) > 0
    assert np.allclose(clay["sgr_min_pct"], 0.6 * base["sgr_min_pct"], rtol=1e-9)
