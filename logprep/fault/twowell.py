"""Two-well juxtaposition: the footwall column from one well, the hanging-wall column from
another, so that thickness changes across the fault are honoured.

Tie
    The two columns are tied by a depth shift ``shift_m`` = (marker depth in the
    hanging-wall well) - (marker depth in the footwall well), from a named top present in
    both wells, or given directly as a datum shift.  At footwall depth ``z`` (the footwall
    well's depth) and throw ``t`` the hanging-wall rock facing the point comes from the
    hanging-wall well's depth ``y = z - t + shift_m``.  Throw is the vertical offset of the
    marker across the fault: at ``t = 0`` the marker faces itself.

Slipped interval (:data:`SLIP_SOURCES`)
    With one column the slipped interval is ``[z - t, z]`` of that column.  With two
    different columns the interval of length ``t`` that has moved past the point can be
    taken from the footwall column (``[z - t, z]``), from the hanging-wall column
    (``[y, y + t]``), or as the average of the two; all three are in use in practice
    (common practice, no source), so the choice is a setting.  Juxtaposition always uses
    the footwall bed at ``z`` and the hanging-wall bed at ``y``.

Window SGR extremes are exact: within a window's contact area SGR is linear-fractional on
each cell cut out by the bed boundaries that the interval's ends cross, so the extremes lie
at the cells' corners, which are enumerated.
"""

from __future__ import annotations

import numpy as np
import pandas as pd

from logprep.errors import LogprepError
from logprep.fault.juxtaposition import (
    _PAIR_CODE, WINDOW_COLUMNS, cumulative_clay, juxtaposition_throw_range, layer_index, max_contact_m,
    reservoir_mask,
    sgr_from_cumulative_pct,
)
from logprep.model import Layers
from logprep.fault.sgr import SgrField, throw_axis_m

SLIP_SOURCES = {
    "footwall": "slipped interval [z - t, z] from the footwall well",
    "hangingwall": "slipped interval [y, y + t] from the hanging-wall well",
    "average": "mean SGR of the footwall and hanging-wall intervals",
}
"""How the slipped interval is taken across two columns (``ScreenSettings.pair_slip_source``)."""

PAIR_WINDOW_COLUMNS = WINDOW_COLUMNS + ["footwall_layer", "hangingwall_layer", "max_contact_m"]


class PairError(LogprepError, ValueError):
    """A well pair could not be tied or screened."""


def marker_shift_m(fw_tops: pd.DataFrame, hw_tops: pd.DataFrame, marker: str,
                   fw_name: str = "footwall", hw_name: str = "hanging wall") -> float:
    """``depth in the hanging-wall well - depth in the footwall well`` of a named top
    (names compared without case or surrounding spaces)."""
    def depth(tops, who):
        hit = tops[tops["name"].astype(str).str.strip().str.lower() == marker.strip().lower()]
        if hit.empty:
            raise PairError(f"top {marker!r} not found for {who}; add it to the tops file or give shift_m")
        return float(hit["top_m"].iloc[0])

    return depth(hw_tops, hw_name) - depth(fw_tops, fw_name)


def check_hanging_wall_down(shift_m: float, fw_name: str = "footwall", hw_name: str = "hanging wall",
                            marker: str | None = None) -> None:
    """:class:`PairError` when the tie puts the hanging wall up (``shift_m < 0``: the tie
    horizon shallower in the hanging-wall well).  Two-well screening takes a normal fault,
    hanging wall down; an up-thrown hanging wall means the wells are the wrong way round
    or the fault is reverse, and its windows and SGR would be meaningless."""
    if shift_m < 0:
        what = f"{marker!r} is {-shift_m:.2f} m shallower" if marker else f"shift_m {shift_m:g} m puts the tie horizon higher"
        raise PairError(f"the hanging wall is up: {what} in {hw_name} than in {fw_name}; two-well "
                        "screening takes a normal fault with the hanging wall down: swap footwall and "
                        "hangingwall if the wells are the wrong way round")


def two_well_sgr_pct(fw: Layers, hw: Layers, shift_m: float, depth_m, throw_m,
                     slip_source: str = "footwall"):
    """SGR (%) at footwall depths and throws (broadcast) across two columns.

    NaN where the footwall point or the facing hanging-wall point is off its column, or
    where the slipped interval leaves the column it is taken from.
    """
    if slip_source not in SLIP_SOURCES:
        raise PairError(f"unknown slip source {slip_source!r}; use one of {', '.join(SLIP_SOURCES)}")
    z, t = np.broadcast_arrays(np.asarray(depth_m, float), np.asarray(throw_m, float))
    y = z - t + shift_m
    off = (z < fw.top_m[0]) | (z > fw.base_m[-1]) | (y < hw.top_m[0]) | (y > hw.base_m[-1])
    parts = []
    if slip_source in ("footwall", "average"):
        parts.append(sgr_from_cumulative_pct(*cumulative_clay(fw), z, t))
    if slip_source in ("hangingwall", "average"):
        parts.append(sgr_from_cumulative_pct(*cumulative_clay(hw), z + shift_m, t))
    sgr = parts[0] if len(parts) == 1 else 0.5 * (parts[0] + parts[1])
    return np.where(off, np.nan, sgr)


def two_well_juxtaposition(fw: Layers, hw: Layers, shift_m: float, depth_m, throw_m) -> np.ndarray:
    """Juxtaposition class codes (0 off either column) on a depth x throw grid."""
    z = np.asarray(depth_m, float)[:, None]
    t = np.asarray(throw_m, float)[None, :]
    fi = layer_index(fw, z)
    hi = layer_index(hw, z - t + shift_m)
    fi, hi = np.broadcast_arrays(fi, hi)
    code = _PAIR_CODE[fw.lithology_code[np.maximum(fi, 0)], hw.lithology_code[np.maximum(hi, 0)]]
    return np.where((fi < 0) | (hi < 0), 0, code).astype(np.int8)


def two_well_field(fw: Layers, hw: Layers, shift_m: float, *, throw_max_m: float,
                   throw_step_m: float, depth_step_m: float, slip_source: str) -> SgrField:
    """The SGR and juxtaposition field of a pair on the footwall well's depth axis."""
    depth = fw.top_m[0] + depth_step_m * np.arange(int((fw.base_m[-1] - fw.top_m[0]) / depth_step_m) + 1)
    throw = throw_axis_m(throw_max_m, throw_step_m)
    sgr = two_well_sgr_pct(fw, hw, shift_m, depth[:, None], throw[None, :], slip_source)
    jux = two_well_juxtaposition(fw, hw, shift_m, depth, throw)
    return SgrField(depth_m=depth, throw_m=throw, sgr_pct=sgr.astype(np.float32),
                    juxtaposition=jux, source=f"two wells, slipped interval from {slip_source}")


def _corner_tolerance_m(*depths_m) -> float:
    """Tolerance (m) for a corner to count as on the contact area: 1e-9 of the deepest
    depth (at least 1e-9 m), far below any bed thickness and any throw evaluated."""
    return 1e-9 * max(1.0, *(abs(float(d)) for d in depths_m))


SMALLEST_THROW_FRACTION = 1e-6
"""The smallest throw at which window corners are evaluated, as a fraction of the deepest
depth (2.2 mm at 2200 m): SGR is a limit at zero throw, and this is 1000 times the corner
tolerance of :func:`_corner_tolerance_m`, so a point just outside a sand is never taken
as on its contact."""


def _corner_points(a, b, c, e, shift, t_lo, t_hi, z_breaks, y_breaks):
    """Corners of the cells of the contact area ``a <= z <= b, c <= y <= e,
    t_lo <= z - y + shift <= t_hi`` cut by lines ``z = z_breaks`` and ``y = y_breaks``.

    ``t_lo`` must exceed the tolerance (:func:`_corner_tolerance_m`) many times over:
    otherwise a corner on ``z = b`` at throw ``t_lo`` lies within tolerance of the sand
    but its slipped interval lies in the bed below."""
    zs = np.unique(np.concatenate(([a, b], [v for v in z_breaks if a < v < b])))
    ys = np.unique(np.concatenate(([c, e], [v for v in y_breaks if c < v < e])))
    pts = [(z, y) for z in zs for y in ys]
    for z in zs:  # ends of each z-line on the throw limits
        pts += [(z, z + shift - t_lo), (z, z + shift - t_hi)]
    for y in ys:
        pts += [(y - shift + t_lo, y), (y - shift + t_hi, y)]
    p = np.array(pts, float)
    tol = _corner_tolerance_m(a, b, c, e)
    t = p[:, 0] - p[:, 1] + shift
    ok = ((p[:, 0] >= a - tol) & (p[:, 0] <= b + tol) & (p[:, 1] >= c - tol) & (p[:, 1] <= e + tol)
          & (t >= t_lo - tol) & (t <= t_hi + tol))
    return p[ok]


def two_well_windows(fw: Layers, hw: Layers, shift_m: float, throw_max_m: float,
                     slip_source: str = "footwall", heterolith_ntg: float | None = None) -> pd.DataFrame:
    """Every footwall-sand / hanging-wall-sand pair that touches for a throw in
    ``(0, throw_max_m]``, with the exact SGR extremes over its contact area.

    Hanging-wall depths are the hanging-wall well's own depths; ``throw_*`` are marker
    offsets.  Columns :data:`PAIR_WINDOW_COLUMNS`.
    """
    # reservoir layers (default: sand), with heteroliths above a net-to-gross when asked
    fsand = [int(i) for i in np.flatnonzero(fw.reservoir | reservoir_mask(fw, heterolith_ntg))]
    hsand = [int(i) for i in np.flatnonzero(hw.reservoir | reservoir_mask(hw, heterolith_ntg))]
    fb = np.concatenate(([fw.top_m[0]], fw.base_m))
    hb = np.concatenate(([hw.top_m[0]], hw.base_m))
    rows = []
    for fi in fsand:
        a, b = fw.top_m[fi], fw.base_m[fi]
        for hi in hsand:
            c, e = hw.top_m[hi], hw.base_m[hi]
            lo, up = juxtaposition_throw_range(a, b, c - shift_m, e - shift_m)
            lo, cap = float(lo), min(float(up), throw_max_m)
            if not lo < cap:
                continue
            # footwall source: the interval's lower end z - t = y - shift crosses footwall
            # boundaries; hanging-wall source: its upper end z + shift crosses hanging-wall ones
            t_small = SMALLEST_THROW_FRACTION * max(1.0, abs(a), abs(b), abs(c), abs(e))
            pts = _corner_points(a, b, c, e, shift_m, max(lo, min(t_small, 0.5 * cap)), cap,
                                 z_breaks=hb - shift_m, y_breaks=fb + shift_m)
            s = two_well_sgr_pct(fw, hw, shift_m, pts[:, 0], pts[:, 0] - pts[:, 1] + shift_m, slip_source)
            # SGR of Vsh in [0, 1] lies in [0, 100]; clip the rounding noise (no "-0.0")
            s = np.clip(s[np.isfinite(s)], 0.0, 100.0)
            rows.append({
                "footwall_top_m": a, "footwall_base_m": b,
                "hangingwall_top_m": c, "hangingwall_base_m": e,
                "throw_min_m": lo, "throw_max_m": cap,
                "sgr_min_pct": float(s.min()) if s.size else np.nan,
                "sgr_max_pct": float(s.max()) if s.size else np.nan,
                "footwall_layer": fi, "hangingwall_layer": hi,
                "max_contact_m": max_contact_m(a, b, c - shift_m, e - shift_m, lo, cap),
            })
    return pd.DataFrame(rows, columns=PAIR_WINDOW_COLUMNS)
