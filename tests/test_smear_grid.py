"""The large-throw route of the smear fields (logprep.fault.smeargrid) against a direct
evaluation of the published definitions, point by point, on a hand-made layer stack.

Definitions (written out again here, independently of the code):
- SSF = throw / thickness of the thickest source bed that has passed the point
  (Lindsay, Murphy, Walsh & Watterson 1993, IAS Spec. Publ. 15, 113-123); inf where none.
- CSP = sum over passed source beds of thickness^2 / distance, from the footwall cut-off
  (distance |z - mid|) and from the hanging-wall cut-off (|mid + t - z|) (Bouvier et al.
  1989, AAPG Bulletin 73(11), 1397-1414; Fulljames, Zijerveld & Franssen 1997, NPF Spec.
  Publ. 7, 51-59), each distance at least half the bed (the convention of
  logprep.fault.smear, common practice, no source).
- A bed has passed point (z, t > 0) when it overlaps the slipped interval (z - t, z).
"""

import numpy as np
import pytest

from logprep.fault.smear import STAIRCASE_MAX_PASSED, mean_beds_passed, source_beds, smear_fields
from logprep.fault.smeargrid import smear_grid
from logprep.model import Layers

# A hand-made stack (m): thin and thick shales, a 30 m shale (points inside it face
# beds far below), heteroliths above and below the clay cut-off, sands between.
THICK = [4.0, 0.6, 2.0, 1.2, 30.0, 3.0, 0.4, 8.0, 12.0, 0.9, 5.0, 2.5, 18.0, 1.5, 6.0,
         0.7, 3.3, 11.0, 2.2, 4.4, 0.5, 7.5, 1.1, 9.0, 2.8, 3.6, 14.0, 0.8, 5.5, 2.0]
LITH = ["sand", "shale", "sand", "heterolith", "shale", "sand", "shale", "heterolith",
        "sand", "shale", "sand", "shale", "sand", "shale", "sand", "heterolith", "shale",
        "sand", "shale", "sand", "shale", "sand", "shale", "shale", "sand", "shale", "sand",
        "shale", "sand", "shale"]
VSH = [0.1, 0.9, 0.15, 0.55, 0.95, 0.1, 0.8, 0.3, 0.05, 0.85, 0.2, 0.7, 0.1, 0.9, 0.1,
       0.45, 0.75, 0.1, 0.9, 0.2, 0.6, 0.1, 0.95, 0.8, 0.1, 0.65, 0.1, 0.9, 0.1, 0.7]
BOUNDS = 1500.0 + np.concatenate(([0.0], np.cumsum(THICK)))
STACK = Layers(BOUNDS[:-1], BOUNDS[1:], VSH, LITH)


def direct(layers, z, t):
    """SSF and CSP by the definitions above, one point at a time (pure Python)."""
    src = [(layers.top_m[i], layers.base_m[i]) for i in source_beds(layers)]
    ssf = np.full((z.size, t.size), np.inf)
    csp = np.zeros((z.size, t.size))
    for r, zz in enumerate(z):
        for c, tt in enumerate(t):
            if tt <= 0:
                continue
            thickest, total = 0.0, 0.0
            for top, base in src:
                if top < zz and base > zz - tt:  # overlaps (z - t, z)
                    h, mid = base - top, 0.5 * (top + base)
                    thickest = max(thickest, h)
                    total += h * h / max(abs(zz - mid), h / 2) + h * h / max(abs(mid + tt - zz), h / 2)
            if thickest > 0:
                ssf[r, c] = tt / thickest
            csp[r, c] = total
    return ssf, csp


Z = 1500.0 + np.arange(0.0, 175.0, 0.37)   # footwall rows beyond the stack's base too
T = np.arange(0.0, 121.0, 1.3)              # t = 0 first: nothing passed there


def test_grid_route_equals_the_definitions():
    # the throws reach well past the near band (FAR_M), so the far-bed moments are used
    ref_ssf, ref_csp = direct(STACK, Z, T)
    src = source_beds(STACK)
    thick, csp = smear_grid(STACK.top_m[src], STACK.base_m[src], Z, T[1:])
    with np.errstate(divide="ignore"):
        ssf = np.where(thick > 0, T[None, 1:] / np.where(thick > 0, thick, 1.0), np.inf)
    np.testing.assert_array_equal(ssf, ref_ssf[:, 1:])        # a maximum: exact
    # float64 sums in another order plus the truncated series: far below float32 rounding
    np.testing.assert_allclose(csp, ref_csp[:, 1:], rtol=1e-9, atol=0)


@pytest.mark.parametrize("route_above", [0.0, np.inf])  # grid route; staircase route
def test_fields_within_float32_rounding_of_the_definitions(route_above, monkeypatch):
    import logprep.fault.smear as smear

    monkeypatch.setattr(smear, "STAIRCASE_MAX_PASSED", route_above)
    ref_ssf, ref_csp = direct(STACK, Z, T)
    ssf, csp = smear_fields(STACK, Z, T)
    assert ssf.dtype == np.float32 and csp.dtype == np.float32
    np.testing.assert_array_equal(ssf, ref_ssf.astype(np.float32))
    ulps = np.abs(csp.view(np.int32).astype(np.int64) - ref_csp.astype(np.float32).view(np.int32))
    assert ulps.max() <= 1  # one unit in the last place of float32 at most


@pytest.mark.parametrize("t_max", [3.0, 15.0])
def test_small_throws_take_the_staircase_exactly(t_max):
    """Few beds pass a point: the staircase (bit for bit the per-point sum of smear_at)."""
    t = np.arange(0.0, t_max, 0.5)
    src = source_beds(STACK)
    assert mean_beds_passed(STACK.top_m[src], STACK.base_m[src], Z, t[1:]) <= STAIRCASE_MAX_PASSED
    ref_ssf, ref_csp = direct(STACK, Z, t)
    ssf, csp = smear_fields(STACK, Z, t)
    np.testing.assert_array_equal(ssf, ref_ssf.astype(np.float32))
    np.testing.assert_allclose(csp, ref_csp.astype(np.float32), rtol=2.0**-23, atol=0)
