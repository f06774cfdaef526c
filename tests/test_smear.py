"""Shale smear factor and clay smear potential: published check values, hand-worked
fields, and window extremes against dense sampling.

Sources: SSF, Lindsay, Murphy, Walsh & Watterson (1993), IAS Spec. Publ. 15, 113-123;
CSP, Bouvier et al. (1989), AAPG Bulletin 73(11), 1397-1414, and Fulljames, Zijerveld &
Franssen (1997), NPF Spec. Publ. 7, 51-59; check values from ../shared/METHODS.md s.2.
"""

import numpy as np
import pytest

from logprep.fault.juxtaposition import sand_windows
from logprep.model import Layers
from logprep.fault.sgr import throw_axis_m
from logprep.fault.smear import (
    SMEAR_COLUMNS, clay_smear_potential_m, shale_smear_factor, smear_at, smear_fields,
    window_smear,
)


def layers(bounds, lith):
    vsh = [{"sand": 0.1, "shale": 0.9, "heterolith": 0.5}[x] for x in lith]
    return Layers(bounds[:-1], bounds[1:], vsh, lith)


def test_ssf_published_check():
    # METHODS.md s.2 (Lindsay et al. 1993): throw 35 m over a 5 m bed -> 7.0.
    assert shale_smear_factor(35.0, 5.0) == pytest.approx(7.0, abs=1e-12)
    assert shale_smear_factor(35.0, 0.0) == np.inf


def test_csp_published_checks():
    # METHODS.md s.2 (Bouvier et al. 1989; Fulljames et al. 1997): a 10 m bed at 50 m ->
    # 2.0 m; plus a 5 m bed at 20 m -> 3.25 m.
    assert clay_smear_potential_m([10.0], [50.0]) == pytest.approx(2.0, abs=1e-12)
    assert clay_smear_potential_m([10.0, 5.0], [50.0, 20.0]) == pytest.approx(3.25, abs=1e-12)


TWO_SHALES = layers([0, 40, 50, 60, 65, 100], ["sand", "shale", "sand", "shale", "sand"])


def test_smear_hand_worked_point():
    # z = 80, t = 50: slipped interval (30, 80) holds shale 40-50 (10 m, mid 45) and shale
    # 60-65 (5 m, mid 62.5).  SSF = 50 / 10 = 5.  CSP from both cut-offs of each bed:
    # 10^2/(80-45) + 10^2/(45+50-80) + 5^2/(80-62.5) + 5^2/(62.5+50-80) m.
    ssf, csp = smear_at(TWO_SHALES, 80.0, 50.0)
    assert ssf == pytest.approx(5.0, abs=1e-12)
    expected = 100 / 35 + 100 / 15 + 25 / 17.5 + 25 / 32.5
    assert csp == pytest.approx(expected, rel=1e-12)
    # only the lower shale has passed at z = 80, t = 25 (interval (55, 80)): SSF 25/5
    assert smear_at(TWO_SHALES, 80.0, 25.0)[0] == pytest.approx(5.0)
    # nothing has passed at z = 90, t = 10 (interval (80, 90) is sand)
    ssf, csp = smear_at(TWO_SHALES, 90.0, 10.0)
    assert ssf == np.inf and csp == 0.0


def test_distance_floor_inside_a_cut_off():
    # z = 45 (inside the 40-50 shale), t = 2: distances to both cut-off centres (0 and 2 m)
    # are floored at half the bed thickness, 5 m: CSP = 2 x 100 / 5 = 40 m.
    L = layers([0, 40, 50, 100], ["sand", "shale", "sand"])
    assert smear_at(L, 45.0, 2.0)[1] == pytest.approx(40.0)


def test_fields_match_point_route():
    throw = throw_axis_m(60, 0.5)
    depth = 0.5 * np.arange(201)
    ssf, csp = smear_fields(TWO_SHALES, depth, throw)
    ssf_ref, csp_ref = smear_at(TWO_SHALES, depth[:, None], throw[None, :])
    np.testing.assert_allclose(ssf, ssf_ref, rtol=1e-6)
    np.testing.assert_allclose(csp, csp_ref, rtol=1e-6)
    assert ssf.dtype == np.float32


def test_window_extremes_against_dense_sampling():
    L = layers([0, 12, 20, 35, 41, 44, 70, 78, 100],
               ["sand", "shale", "sand", "heterolith", "sand", "shale", "sand", "shale"][:8])
    w = sand_windows(L, throw_max_m=60.0)
    sm = window_smear(L, w, 60.0)
    assert list(sm.columns) == SMEAR_COLUMNS
    for r, s in zip(w.itertuples(), sm.itertuples()):
        if r.self_juxtaposed:
            assert s.ssf_min == np.inf and s.csp_max_m == 0
            continue
        # dense sampling of the contact area (independent of the boundary method); it
        # approaches the extremes from inside, so 1 % (400 x 400 points) is allowed
        zz, yy = np.meshgrid(np.linspace(r.footwall_top_m, r.footwall_base_m, 400),
                             np.linspace(r.hangingwall_top_m, r.hangingwall_base_m, 400))
        tt = zz - yy
        keep = (tt > max(r.throw_min_m, 1e-6)) & (tt <= 60.0)
        ssf, csp = smear_at(L, zz[keep], tt[keep])
        assert s.ssf_min <= ssf.min() + 1e-9 and s.ssf_max >= ssf.max() - 1e-9
        assert s.ssf_max == pytest.approx(ssf.max(), rel=0.02)
        assert s.csp_min_m <= csp.min() + 1e-9 and s.csp_max_m >= csp.max() - 1e-9
        assert s.csp_min_m == pytest.approx(csp.min(), rel=0.01)
        assert s.csp_max_m == pytest.approx(csp.max(), rel=0.01)


def test_all_sand_column_has_no_smear():
    L = layers([0, 30, 60], ["sand", "sand"])
    ssf, csp = smear_fields(L, np.arange(0, 61.0), throw_axis_m(30, 1.0))
    assert np.isinf(ssf).all() and (csp == 0).all()


# ----------------------------------------------------------------------------- clay source beds
# Source beds by clay fraction: a shale or heterolith layer whose clay fraction (after the
# Vsh-to-clay step) is at least the cut-off counts with its full thickness (the published SSF
# and CSP take bed thickness, no clay weighting: Lindsay et al. 1993; Bouvier et al. 1989).
# Default cut-off 0.40: clay smears above about 40 % clay (Fisher & Knipe 1998, value from memory).
MIXED = Layers([0, 40, 50, 60, 65], [40, 50, 60, 65, 100], [0.1, 0.5, 0.1, 0.9, 0.1],
               ["sand", "heterolith", "sand", "shale", "sand"])


def test_heterolith_above_the_clay_cut_off_is_a_source_bed():
    # worked by hand: z = 80, t = 50; slipped interval (30, 80) holds the heterolith 40-50
    # (10 m, mid 45, clay 0.5) and the shale 60-65 (5 m, mid 62.5).  Both pass 0.40:
    # SSF = 50 / 10 = 5; CSP = 100/35 + 100/15 + 25/17.5 + 25/32.5 = 11.721612 m.
    ssf, csp = smear_at(MIXED, 80.0, 50.0)
    assert float(ssf) == pytest.approx(5.0)
    assert float(csp) == pytest.approx(100 / 35 + 100 / 15 + 25 / 17.5 + 25 / 32.5, rel=1e-12)
    assert float(csp) == pytest.approx(11.721612, abs=1e-6)


def test_clay_step_decides_which_beds_smear():
    from logprep.fault.clayfraction import clay_layers

    # Vcl = 0.6 Vsh: the heterolith drops to clay 0.30 (< 0.40), the shale keeps 0.54.
    # Worked by hand: only the 5 m shale: SSF = 50 / 5 = 10; CSP = 25/17.5 + 25/32.5 = 2.197802 m.
    clay = clay_layers(MIXED, "shale_fraction", 0.6)
    ssf, csp = smear_at(clay, 80.0, 50.0)
    assert float(ssf) == pytest.approx(10.0)
    assert float(csp) == pytest.approx(25 / 17.5 + 25 / 32.5, rel=1e-12)
    # the same with the cut-off raised to 0.6 on Vcl = Vsh
    ssf6, csp6 = smear_at(MIXED, 80.0, 50.0, clay_min=0.6)
    assert float(ssf6) == pytest.approx(10.0) and float(csp6) == pytest.approx(float(csp), rel=1e-12)
    # fields and windows follow the same rule
    f_ssf, f_csp = smear_fields(clay, np.array([80.0]), np.array([50.0]), dtype=np.float64)
    assert f_ssf[0, 0] == pytest.approx(10.0) and f_csp[0, 0] == pytest.approx(float(csp), rel=1e-12)
    w = sand_windows(clay, 60.0)
    cross = w[(w["footwall_layer"] == 4) & (w["hangingwall_layer"] == 0)]
    sm = window_smear(clay, cross, 60.0)
    # beds between sands 0 and 4 that smear: only the shale (5 m): SSF = throw / 5
    assert sm["ssf_min"].iloc[0] == pytest.approx(cross["throw_min_m"].iloc[0] / 5.0)


def test_clay_cut_off_is_compared_at_a_stated_rounding():
    from logprep.fault.smear import source_beds

    # 0.6 x (2/3) is 0.39999999999999997 in floating point: a bed of exactly 40 % clay counts
    L = Layers([0.0, 10.0], [10.0, 20.0], [0.6 * (2 / 3), 0.1], ["heterolith", "sand"])
    assert L.vsh[0] < 0.4
    assert source_beds(L, 0.4).tolist() == [0]
