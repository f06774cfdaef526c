"""Juxtaposition geometry and shale gouge ratio for a normal fault through one column.

Convention (triangle diagram): footwall stratigraphic depth ``z`` (metres, positive down)
on the vertical axis, throw ``t`` (metres) on the horizontal.  For a normal fault the
hanging wall is down-thrown, so the hanging-wall rock facing footwall depth ``z`` comes
from stratigraphic depth ``z - t``, and the slipped interval that fed the gouge at that
point is ``[z - t, z]``.

References
----------
1. Allan, U.S. (1989). Model for hydrocarbon migration and entrapment within faulted
   structures. AAPG Bulletin 73, 803-811.
2. Knipe, R.J. (1997). Juxtaposition and seal diagrams to help analyze fault seals in
   hydrocarbon reservoirs. AAPG Bulletin 81(2), 187-195.
3. Yielding, G., Freeman, B. and Needham, D.T. (1997). Quantitative fault seal prediction.
   AAPG Bulletin 81(6), 897-917.
"""

from __future__ import annotations

import itertools

import numpy as np
import pandas as pd

from logprep.model import Layers

JUXTAPOSITION_CLASSES: dict[int, str] = {
    0: "outside",
    1: "sand/sand",
    2: "sand/heterolith",
    3: "sand/shale",
    4: "heterolith/heterolith",
    5: "heterolith/shale",
    6: "shale/shale",
}
"""Codes of the juxtaposition grid (the order of the two walls does not matter);
0 marks points where the hanging-wall rock lies above the logged column."""

_PAIR_CODE = np.array(
    # footwall code (row) x hanging-wall code (column): sand 0, heterolith 1, shale 2
    [[1, 2, 3],
     [2, 4, 5],
     [3, 5, 6]],
    dtype=np.int8,
)

WINDOW_COLUMNS = [
    "footwall_top_m", "footwall_base_m", "hangingwall_top_m", "hangingwall_base_m",
    "throw_min_m", "throw_max_m", "sgr_min_pct", "sgr_max_pct",
]
"""The contract columns of ``juxtapositions.csv``, in order."""


def juxtaposition_throw_range(f_top_m, f_base_m, h_top_m, h_base_m):
    """Open throw interval over which a footwall bed faces a hanging-wall bed.

    The beds touch for ``f_top - h_base < t < f_base - h_top`` (normal fault, hanging wall
    down); the lower end is raised to 0.  Returns ``(throw_min_m, throw_max_m)``; the beds
    never touch at positive throw where ``throw_min_m >= throw_max_m``.
    """
    lo = np.maximum(np.asarray(f_top_m, float) - np.asarray(h_base_m, float), 0.0)
    hi = np.asarray(f_base_m, float) - np.asarray(h_top_m, float)
    return lo, hi


def contact_length_m(f_top_m, f_base_m, h_top_m, h_base_m, throw_m):
    """Length of fault face (metres, vertical) where the two beds touch at a throw.

    ``L(t) = max(0, min(f_base, h_base + t) - max(f_top, h_top + t))``: a trapezoid in t.
    """
    t = np.asarray(throw_m, float)
    return np.maximum(
        0.0,
        np.minimum(f_base_m, np.asarray(h_base_m, float) + t)
        - np.maximum(f_top_m, np.asarray(h_top_m, float) + t),
    )


def max_contact_m(f_top_m, f_base_m, h_top_m, h_base_m, throw_min_m, throw_max_m) -> float:
    """Largest contact length (m) of two beds over throws in ``[throw_min_m, throw_max_m]``.

    :func:`contact_length_m` is a trapezoid in t with corners at ``f_top - h_top`` and
    ``f_base - h_base``, so its maximum over an interval is at an end or a corner inside.
    """
    lo, hi = float(throw_min_m), float(throw_max_m)
    t = [lo, hi] + [x for x in (f_top_m - h_top_m, f_base_m - h_base_m) if lo < x < hi]
    return float(np.max(contact_length_m(f_top_m, f_base_m, h_top_m, h_base_m, np.array(t))))


def cumulative_clay(layers: Layers) -> tuple[np.ndarray, np.ndarray]:
    """Layer boundaries (metres) and the clay thickness above each, ``C(z)`` in metres.

    ``C`` is piecewise linear in depth with slope Vsh, so the clay thickness of any
    interval is a difference of two interpolations.
    """
    bounds = np.concatenate(([layers.top_m[0]], layers.base_m))
    clay = np.concatenate(([0.0], np.cumsum(layers.vsh * layers.thickness_m)))
    return bounds, clay


def layer_index(layers: Layers, depth_m) -> np.ndarray:
    """Index of the layer holding each depth (-1 outside the column).  A depth on a
    boundary belongs to the layer below it."""
    z = np.asarray(depth_m, float)
    i = np.searchsorted(layers.base_m, z, side="right")
    inside = (z >= layers.top_m[0]) & (z < layers.base_m[-1])
    inside |= z == layers.base_m[-1]
    i = np.where(z == layers.base_m[-1], len(layers) - 1, i)
    return np.where(inside, i, -1)


def sgr_from_cumulative_pct(bounds_m, clay_m, depth_m, throw_m):
    """Shale gouge ratio (%) from a cumulative clay function, at any points.

    ``C`` is given at ``bounds_m`` (increasing) as ``clay_m`` and is linear in between
    (piecewise-constant Vsh), as from :func:`cumulative_clay` or
    :func:`logprep.fault.sgr.cumulative_clay_curve`.  ``SGR = 100 (C(z) - C(z - t)) / t``
    (Yielding et al. 1997).  Inputs broadcast.  NaN where ``z`` or ``z - t`` leaves
    ``[bounds_m[0], bounds_m[-1]]``; at ``t = 0`` the limit, 100 x Vsh just above ``z``.
    A negative throw (reverse fault) takes the slipped interval ``[z, z - t]`` below ``z``.
    """
    bounds = np.asarray(bounds_m, float)
    clay = np.asarray(clay_m, float)
    z, t = np.broadcast_arrays(np.asarray(depth_m, float), np.asarray(throw_m, float))
    zt = z - t
    with np.errstate(invalid="ignore", divide="ignore"):
        sgr = 100.0 * (np.interp(z, bounds, clay) - np.interp(zt, bounds, clay)) / t
    if np.any(t == 0):
        slope = np.diff(clay) / np.diff(bounds)
        i = np.clip(np.searchsorted(bounds, z, side="left") - 1, 0, len(slope) - 1)
        sgr = np.where(t == 0, 100.0 * slope[i], sgr)
    out = (zt < bounds[0]) | (zt > bounds[-1]) | (z < bounds[0]) | (z > bounds[-1])
    return np.where(out, np.nan, sgr)


def sgr_layered_pct(layers: Layers, depth_m, throw_m):
    """Shale gouge ratio (%) at footwall depth ``z`` and throw ``t`` from blocked layers.

    ``SGR = 100 / t * integral of Vsh over [z - t, z]`` (Yielding et al. 1997), computed
    as ``100 (C(z) - C(z - t)) / t`` from :func:`cumulative_clay`.  Inputs broadcast.
    NaN where the window leaves the column; at ``t = 0`` the limit, 100 x Vsh just above
    ``z``.
    """
    bounds, clay = cumulative_clay(layers)
    return sgr_from_cumulative_pct(bounds, clay, depth_m, throw_m)


def juxtaposition_grid(layers: Layers, depth_m, throw_m) -> np.ndarray:
    """Juxtaposition class codes (:data:`JUXTAPOSITION_CLASSES`) on a depth x throw grid."""
    z = np.asarray(depth_m, float)[:, None]
    t = np.asarray(throw_m, float)[None, :]
    codes = layers.lithology_code
    fw = layer_index(layers, z)
    hw = layer_index(layers, z - t)
    fw, hw = np.broadcast_arrays(fw, hw)
    grid = _PAIR_CODE[codes[np.maximum(fw, 0)], codes[np.maximum(hw, 0)]]
    return np.where((fw < 0) | (hw < 0), 0, grid).astype(np.int8)


def _sgr_extremes(a, b, c, e, v_f, v_h, c_a, c_c, same, throw_cap):
    """Min and max SGR (%) over the contact region of one bed pair, exactly.

    Inside the region ``{a <= z <= b, c <= z - t <= e, 0 < t <= cap}`` both window ends
    stay in single beds, so ``SGR = 100 (C(a) + v_f (z - a) - C(c) - v_h (z - t - c)) / t``
    is linear-fractional and its extremes lie at the polygon's vertices.  Near ``t = 0``
    (only for a bed against itself, or touching beds) the limits 100 v_f and 100 v_h bound
    the values.
    """
    if same:
        return 100.0 * v_f, 100.0 * v_f
    # lines alpha z + beta t = gamma
    lines = [(1, 0, a), (1, 0, b), (1, -1, c), (1, -1, e), (0, 1, 0.0), (0, 1, throw_cap)]
    tol = 1e-9 * max(1.0, abs(b), abs(throw_cap))
    values = []
    for (a1, b1, g1), (a2, b2, g2) in itertools.combinations(lines, 2):
        det = a1 * b2 - a2 * b1
        if det == 0:
            continue
        z = (g1 * b2 - g2 * b1) / det
        t = (a1 * g2 - a2 * g1) / det
        if not (a - tol <= z <= b + tol and c - tol <= z - t <= e + tol and -tol <= t <= throw_cap + tol):
            continue
        if t <= tol:
            values += [100.0 * v_f, 100.0 * v_h]
            continue
        num = c_a + v_f * (z - a) - c_c - v_h * (z - t - c)
        values.append(100.0 * num / t)
    return min(values), max(values)


def reservoir_mask(layers: Layers, heterolith_ntg: float | None = None) -> np.ndarray:
    """Which layers are screened as reservoir: every sand, and a heterolith whose
    net-to-gross (share of its thickness in sand samples) is at least ``heterolith_ntg``
    (None: sands only).  Interbedded sand-shale stacks too thin for the minimum bed
    thickness block as heteroliths yet can hold and pass fluid (common practice, no
    source); a heterolith without a recorded net-to-gross is not taken."""
    sand = np.array([x == "sand" for x in layers.lithology], dtype=bool)
    if heterolith_ntg is None:
        return sand
    if not 0 < heterolith_ntg <= 1:
        raise ValueError(f"heterolith net-to-gross must lie within 0 (exclusive) and 1 (got {heterolith_ntg:g})")
    het = np.array([x == "heterolith" for x in layers.lithology], dtype=bool)
    with np.errstate(invalid="ignore"):
        return sand | (het & (np.asarray(layers.net_to_gross, float) >= heterolith_ntg))


def sand_windows(layers: Layers, throw_max_m: float, lithology: str = "sand",
                 reservoir=None) -> pd.DataFrame:
    """Every footwall-sand / hanging-wall-sand pair that touches for some throw in
    ``(0, throw_max_m]``, including a sand against itself.

    Returns a frame with :data:`WINDOW_COLUMNS` plus ``footwall_layer``,
    ``hangingwall_layer`` (indices into ``layers``), ``self_juxtaposed`` and
    ``max_contact_m`` (the largest contact over the window's throws).  ``reservoir``, a
    boolean per layer (:func:`reservoir_mask`), replaces ``lithology`` as the choice of
    the layers screened as reservoir.  ``throw_max_m`` of
    a window is capped at the screened maximum throw; ``sgr_min_pct`` / ``sgr_max_pct`` are the exact extremes of SGR over the pair's
    contact area within that throw range.
    """
    if throw_max_m <= 0:
        raise ValueError("throw_max_m must be positive")
    # reservoir layers (default: the sand layers); another name asks for that class alone
    if reservoir is not None:
        idx = np.flatnonzero(np.asarray(reservoir, bool)).astype(int)
    else:
        idx = (np.flatnonzero(layers.reservoir).astype(int) if lithology == "sand"
               else np.array([i for i, lith in enumerate(layers.lithology) if lith == lithology], dtype=int))
    bounds, clay = cumulative_clay(layers)
    # only hanging-wall beds that can touch within the throw cap: top below the footwall
    # bed's base, base within ``throw_max_m`` above its top (the layers are in depth
    # order), so the work grows with the windows, not with the square of the sands
    tops_h, bases_h = layers.top_m[idx], layers.base_m[idx]
    rows = []
    for fi in idx.tolist():
        a, b = layers.top_m[fi], layers.base_m[fi]
        slack = 1e-6 * (1.0 + abs(a) + throw_max_m)  # the exact test below decides
        first = int(np.searchsorted(bases_h, a - throw_max_m - slack, side="left"))
        last = int(np.searchsorted(tops_h, b + slack, side="right"))
        for hi in idx[first:last].tolist():
            c, e = layers.top_m[hi], layers.base_m[hi]
            lo, hi_t = juxtaposition_throw_range(a, b, c, e)
            hi_cap = min(float(hi_t), throw_max_m)
            if not lo < hi_cap:
                continue
            smin, smax = _sgr_extremes(
                a, b, c, e, layers.vsh[fi], layers.vsh[hi], clay[fi], clay[hi], fi == hi, hi_cap
            )
            rows.append(
                {
                    "footwall_top_m": a, "footwall_base_m": b,
                    "hangingwall_top_m": c, "hangingwall_base_m": e,
                    "throw_min_m": float(lo), "throw_max_m": hi_cap,
                    "sgr_min_pct": smin, "sgr_max_pct": smax,
                    "footwall_layer": fi, "hangingwall_layer": hi,
                    "self_juxtaposed": fi == hi,
                    "max_contact_m": max_contact_m(a, b, c, e, lo, hi_cap),
                }
            )
    cols = WINDOW_COLUMNS + ["footwall_layer", "hangingwall_layer", "self_juxtaposed", "max_contact_m"]
    # typed even when empty: a well with no sand-sand window (all shale, one sand bed)
    # must still give a boolean ``self_juxtaposed`` that can mask the frame
    dtypes = {c: float for c in cols} | {"footwall_layer": int, "hangingwall_layer": int,
                                         "self_juxtaposed": bool}
    return pd.DataFrame(rows, columns=cols).astype(dtypes)
