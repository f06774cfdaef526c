"""Rock classes from published log responses, unusable samples, and the rock scores.

Check values: Crain's Petrophysical Handbook, "Mineral properties tables for log
analysis" (quartz 2.64 g/cm3, Pe 1.81, U 4.79 b/cm3; calcite 2.71, 5.08, 13.77; dolomite
2.85, 3.14, 9.00); Schlumberger (2009) Log Interpretation Charts (rho_e = (rho_b +
0.1883) / 1.0704; U of fresh water 0.398 b/cm3).  Anhydrite (2.98, Pe 5.05), halite (log
density 2.04, Pe 4.65) and coal (1.2-1.8 g/cm3, neutron >= 0.4) are from memory.
"""

import numpy as np
import pytest

from logprep.clay.holecheck import (
    bad_hole_flags,
    inferred_bit_size_in,
    long_gap_flags,
    top_hole_flags,
    unusable_flags,
)
from logprep.clay.lithology import (
    MINERALS,
    U_FLUID_B_CM3,
    apparent_matrix_density,
    apparent_matrix_u,
    classify_rock,
    electron_density,
)
from logprep.layers.rockclass import NO_DATA, assign_rock, class_boundaries_m
from logprep.layers.rockscore import called_reservoir, pooled_scores, rock_scores


@pytest.mark.parametrize("mineral,u_table", [("quartz", 4.79), ("calcite", 13.77), ("dolomite", 9.00)])
def test_u_of_zero_porosity_mineral_matches_handbook(mineral, u_table):
    # Crain's table lists U = Pe x rho_e; recomputing it from the tabled density and Pe
    # must agree within the table's rounding of the density (0.1 b/cm3).
    rho, _n, _dt, pe, u = MINERALS[mineral]
    assert u == u_table
    assert apparent_matrix_u(pe, rho, 0.0) == pytest.approx(u_table, abs=0.1)


def test_electron_density_of_water_filled_limestone():
    # Schlumberger charts: rho_e = (rho_b + 0.1883) / 1.0704; calcite 2.71 -> 2.7077
    assert float(electron_density(2.71)) == pytest.approx(2.7077, abs=1e-4)


@pytest.mark.parametrize("mineral", ["quartz", "calcite", "dolomite", "anhydrite"])
@pytest.mark.parametrize("phi", [0.0, 0.1, 0.3])
def test_apparent_matrix_density_returns_grain_density(mineral, phi):
    rho_ma = MINERALS[mineral][0]
    rhob = rho_ma * (1 - phi) + phi * 1.0  # water-filled, volumetric mixing [D]
    assert float(apparent_matrix_density(rhob, phi)) == pytest.approx(rho_ma, abs=1e-9)


def _rock(mineral, phi, pe=None, igr=0.1):
    """Logs of a clean water-filled rock of one mineral: density and U mix by volume;
    the limestone-scale neutron is the porosity plus the mineral's zero-porosity reading."""
    rho, nphi0, _dt, _pe, u = MINERALS[mineral]
    rhob = rho * (1 - phi) + phi
    nphi = phi + (1 - phi) * nphi0
    u_b = (1 - phi) * u + phi * U_FLUID_B_CM3
    pef = u_b / electron_density(rhob) if pe is None else pe
    return {"rhob_g_cm3": np.array([rhob]), "nphi_v_v": np.array([nphi]), "pef_b_e": np.array([pef]),
                "igr": np.array([igr])}


@pytest.mark.parametrize("mineral,phi,expected", [
    ("calcite", 0.0, "limestone"), ("calcite", 0.2, "limestone"), ("calcite", 0.35, "limestone"),
    ("dolomite", 0.0, "dolomite"), ("dolomite", 0.05, "dolomite"),
    ("anhydrite", 0.0, "anhydrite"), ("halite", 0.0, "halite"),
    ("quartz", 0.0, ""), ("quartz", 0.25, ""),
])
def test_synthetic_rock_of_each_class(mineral, phi, expected):
    assert classify_rock(**_rock(mineral, phi))[0] == expected


def test_coal_and_its_washout_lookalike():
    logs = {"rhob_g_cm3": np.array([1.45, 1.45, 2.35]), "nphi_v_v": np.array([0.55, 0.55, 0.35]),
                "igr": np.array([0.5, 0.5, 0.9])}
    assert list(classify_rock(**logs)) == ["coal", "coal", ""]
    # the same readings in enlarged hole are mud, not coal
    washed = classify_rock(**logs, washout=np.array([False, True, False]))
    assert list(washed) == ["coal", "", ""]


def test_no_pef_no_carbonate_call():
    logs = _rock("calcite", 0.2)
    logs["pef_b_e"] = None
    assert classify_rock(**logs)[0] == ""


def test_shaly_rock_not_called_carbonate():
    assert classify_rock(**_rock("calcite", 0.2, igr=0.8))[0] == ""


def test_bad_hole_and_inferred_bit_size():
    assert list(bad_hole_flags([12.0, 17.0, np.nan], [12.25, 12.25, 12.25], 4.0)) == [False, True, False]
    z = np.arange(0.0, 600.0, 0.5)
    cali = np.where(z < 300, 17.0, 12.5)
    cali[100:140] = 23.0  # a 20 m washout in the 17.5 in hole
    bs = inferred_bit_size_in(z, cali)
    assert bs[0] == 17.5 and bs[-1] == 12.25 and bs[120] == 17.5


def test_long_gap_only_beyond_limit():
    z = np.arange(0.0, 100.0, 1.0)
    filled = np.zeros(z.size, bool)
    filled[10:13] = True   # 3 m
    filled[50:70] = True   # 20 m
    out = long_gap_flags(z, filled, 5.0)
    assert not out[10:13].any() and out[50:70].all() and out.sum() == 20


def test_top_hole_modelled_trend_and_gr_only_well():
    z = np.arange(0.0, 1000.0, 0.5)
    rng = np.random.default_rng(1)
    rhob = 1.9 + 0.0004 * z                      # a smooth trend: not a measurement
    rhob[z >= 400] += rng.normal(0, 0.02, (z >= 400).sum())
    flags = top_hole_flags(z, [rhob])
    assert flags[z < 395].all() and not flags[z >= 401].any()
    assert not top_hole_flags(z, [None]).any()   # GR-only well: nothing to compare with


def test_unusable_flags_keys():
    z = np.arange(0.0, 50.0, 0.5)
    u = unusable_flags(z, filled=np.zeros(z.size, bool), qc_failed=np.zeros(z.size, bool))
    assert set(u) == {"bad_hole", "long_gap", "qc_failed", "top_hole", "log_tail"}


def test_boundaries_and_majority_assignment():
    z = np.arange(0.25, 30.0, 0.5)               # 60 samples, edges 0..30 m
    rock = np.full(z.size, "", dtype=object)
    rock[20:32] = "limestone"                    # 10-16 m
    unusable = np.zeros(z.size, bool)
    unusable[44:60] = True                       # 22-30 m
    cls = np.where(unusable, NO_DATA, rock)
    b = class_boundaries_m(z, cls, 2.0)
    assert list(b) == [10.0, 16.0, 22.0, 30.0]
    top, base = np.array([0.0, 10.0, 16.0, 22.0]), np.array([10.0, 16.0, 22.0, 30.0])
    lith, bad = assign_rock(["sand"] * 4, z, rock, unusable, top, base, ["limestone"])
    assert lith == ("sand", "limestone", "sand", NO_DATA)
    assert list(bad) == [0.0, 0.0, 0.0, 1.0]


def test_rock_scores_hand_worked():
    # 10 samples: layers 0-5 m sand, 5-10 m shale.  Labels: in the sand layer 3 sandstone,
    # 1 sandy shale, 1 shale; in the shale layer 1 sandstone, 3 shale, 1 unlabelled.
    z = np.arange(0.5, 10.0, 1.0)
    called = called_reservoir(z, [0.0, 5.0], [5.0, 10.0], [True, False])
    labels = ["sandstone"] * 3 + ["sandy shale", "shale", "sandstone"] + ["shale"] * 3 + [""]
    s = rock_scores(called, labels)
    assert s["precision"] == pytest.approx(4 / 5)         # 4 of 5 called are sand-bearing
    assert s["recall"] == pytest.approx(3 / 4)            # 3 of 4 sandstone called
    assert s["shale_kept_out"] == pytest.approx(3 / 4)
    assert s["balanced_accuracy"] == pytest.approx(0.75)
    assert s["in_sand_shale"] == pytest.approx(1 / 4)
    import pandas as pd
    pooled = pooled_scores(pd.DataFrame([s, s]))
    assert pooled["precision"] == pytest.approx(0.8) and pooled["recall"] == pytest.approx(0.75)


def test_window_footing():
    import pandas as pd

    from logprep.layers.footing import window_footing
    windows = pd.DataFrame({"footwall_layer": [0, 0, 2], "hangingwall_layer": [0, 2, 2]})
    out = window_footing(windows, filled_fraction=[0.0, 0.0, 0.4], flagged_fraction=[0.5, 0, 0],
                         thickness_m=[10.0, 5.0, 2.0], thin_m=3.0)
    assert list(out["footing"]) == ["flagged", "partly filled; flagged; thin", "partly filled; thin"]
    empty = window_footing(windows.iloc[:0], [0.0], [0.0], [1.0])
    assert len(empty) == 0 and empty["thin"].dtype == bool
