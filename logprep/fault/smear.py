"""Shale smear indicators over the triangle diagram and per sand-sand window.

Source beds
    The published definitions count shale (clay) source beds with their thickness: SSF the
    throw over one shale bed's thickness (Lindsay et al. 1993), CSP the sum of the squared
    thicknesses of the clay source beds over their smear distances (Bouvier et al. 1989;
    Fulljames et al. 1997); neither weights a bed by its clay content.  A blocked layer is
    therefore a source bed, with its full thickness, when it is fine-grained (lithology
    ``shale`` or ``heterolith``, not a sand or another rock class) and its **clay fraction**
    (the ``vsh`` of the column given, which the fault stage has passed through the Vsh-to-clay
    step of :mod:`logprep.fault.clayfraction`) is at least ``clay_min``.  Default
    :data:`SMEAR_SOURCE_CLAY_MIN` = 0.40: rocks above about 40 % clay deform into clay
    smears, below it into phyllosilicate-framework fault rocks or cataclasites (Fisher &
    Knipe 1998; from memory, not verified).  The clay fraction is compared after rounding
    to :data:`SOURCE_CLAY_DECIMALS` decimals, so float noise does not decide a bed.  A
    source bed has *passed* a point of the fault at footwall
    depth ``z`` and throw ``t`` when it overlaps the slipped interval ``(z - t, z)`` (for a
    reverse fault, ``(z, z - t)``): its footwall cut-off lies above the point and its
    hanging-wall cut-off below it (normal fault), so smear from either can reach the point.

Shale smear factor (Lindsay, Murphy, Walsh & Watterson 1993)
    ``SSF = throw / source-bed thickness``.  Not additive: with several beds the smallest
    value (the thickest bed that has passed) governs, so
    ``SSF(z, t) = |t| / max thickness of the source beds that have passed``; ``inf``
    where none has.  Smears may be incomplete above about 7.

Clay smear potential (Bouvier et al. 1989; Fulljames, Zijerveld & Franssen 1997)
    ``CSP = sum over source beds of thickness^2 / smear distance``, in **metres** here
    (thickness and distance both in metres).  Each bed contributes from both of its
    cut-offs: from the footwall cut-off at distance ``|z - m|`` and from the hanging-wall
    cut-off at ``|m + t - z|``, where ``m`` is the bed's mid-depth and distances are
    measured vertically along the fault (as throw is).  A distance is never taken below half
    the bed's thickness (the point then faces the bed's own cut-off).  0 where no bed has
    passed.  The screening run then converts to distances along the dipping fault and true
    bed thicknesses with one factor, ``sin(fault dip) cos(bed dip)^2``
    (:func:`logprep.fault.geometry.csp_factor`).

References
----------
1. Lindsay, N.G., Murphy, F.C., Walsh, J.J. and Watterson, J. (1993). Outcrop studies of
   shale smears on fault surfaces. IAS Special Publication 15, 113-123.
2. Bouvier, J.D., Kaars-Sijpesteijn, C.H., Kluesner, D.F., Onyejekwe, C.C. and van der Pal,
   R.C. (1989). Three-dimensional seismic interpretation and fault sealing investigations,
   Nun River Field, Nigeria. AAPG Bulletin 73(11), 1397-1414.
3. Fulljames, J.R., Zijerveld, L.J.J. and Franssen, R.C.M.W. (1997). Fault seal processes:
   systematic analysis of fault seals over geological and production time scales. NPF
   Special Publication 7, 51-59.
4. Fisher, Q.J. and Knipe, R.J. (1998). Fault sealing processes in siliciclastic sediments.
   Geological Society, London, Special Publications 147, 117-134.
"""

from __future__ import annotations

import numpy as np
import pandas as pd

from logprep.errors import SettingsError
from logprep.model import Layers
from logprep.fault.sgr import contact_polygon
from logprep.fault.smeargrid import smear_grid

SSF_INCOMPLETE = 7.0
"""SSF above which smears may be incomplete (Lindsay et al. 1993)."""

SMEAR_COLUMNS = ["ssf_min", "ssf_max", "csp_min_m", "csp_max_m"]
"""Columns added to ``juxtapositions.csv`` (after the existing ones)."""


def shale_smear_factor(throw_m, thickness_m):
    """SSF = |throw| / source-bed thickness (Lindsay et al. 1993); ``inf`` for zero
    thickness.  Inputs broadcast; both in metres."""
    t = np.abs(np.asarray(throw_m, float))
    h = np.asarray(thickness_m, float)
    with np.errstate(divide="ignore", invalid="ignore"):
        return np.where(h > 0, t / np.where(h > 0, h, 1.0), np.inf)


def clay_smear_potential_m(thickness_m, distance_m, axis=-1):
    """CSP = sum of thickness^2 / distance (Bouvier et al. 1989; Fulljames et al. 1997),
    in metres when both inputs are metres.  Summed along ``axis``."""
    h = np.asarray(thickness_m, float)
    d = np.asarray(distance_m, float)
    return np.sum(h * h / d, axis=axis)


SMEAR_SOURCE_CLAY_MIN = 0.40
"""Least clay fraction of a source bed (Fisher & Knipe 1998, from memory; see the notes)."""
SOURCE_LITHOLOGIES = ("shale", "heterolith")
"""Layer lithologies that can be source beds (fine-grained; sands and other rock classes not)."""
SOURCE_CLAY_DECIMALS = 6
"""Decimals of the clay fraction compared with ``clay_min``."""


def check_smear_clay_min(value: float) -> None:
    if not 0 < value <= 1:
        raise SettingsError(f"--smear-clay-min must lie within 0 (exclusive) and 1 (got {value:g}); "
                            "give the least clay fraction of a smearing bed, e.g. 0.4")


def source_beds(layers: Layers, clay_min: float = SMEAR_SOURCE_CLAY_MIN) -> np.ndarray:
    """Indices of the source beds: fine-grained layers (:data:`SOURCE_LITHOLOGIES`) whose
    clay fraction (``layers.vsh``, 0-1) is at least ``clay_min``.

    >>> L = Layers([0, 10, 20, 30], [10, 20, 30, 40], [0.9, 0.5, 0.3, 0.45],
    ...            ["shale", "heterolith", "heterolith", "sand"])
    >>> source_beds(L, 0.4).tolist(), source_beds(L, 0.6).tolist()
    ([0, 1], [0])
    """
    fine = np.isin(np.array(layers.lithology, dtype=object), SOURCE_LITHOLOGIES)
    clay = np.round(np.asarray(layers.vsh, float), SOURCE_CLAY_DECIMALS)
    return np.flatnonzero(fine & (clay >= clay_min))


def _bed_terms(top, base, z, t):
    """Passed mask, SSF-relevant thickness and CSP term of one bed at points (z, t)."""
    thick = base - top
    mid = 0.5 * (top + base)
    lo, hi = np.minimum(z, z - t), np.maximum(z, z - t)
    passed = (top < hi) & (base > lo) & (t != 0)
    half = 0.5 * thick
    d_fw = np.maximum(np.abs(z - mid), half)
    d_hw = np.maximum(np.abs(mid + t - z), half)
    term = thick * thick * (1.0 / d_fw + 1.0 / d_hw)
    return passed, thick, term


def smear_at(layers: Layers, depth_m, throw_m,
             clay_min: float = SMEAR_SOURCE_CLAY_MIN) -> tuple[np.ndarray, np.ndarray]:
    """SSF and CSP (m) at footwall depths and throws (broadcast), one column.

    Returns ``(ssf, csp_m)`` as float64 arrays; see the module notes for the definitions.
    """
    z, t = np.broadcast_arrays(np.asarray(depth_m, float), np.asarray(throw_m, float))
    tmax = np.zeros(z.shape)
    csp = np.zeros(z.shape)
    for i in source_beds(layers, clay_min):
        passed, thick, term = _bed_terms(layers.top_m[i], layers.base_m[i], z, t)
        tmax = np.where(passed, np.maximum(tmax, thick), tmax)
        csp += np.where(passed, term, 0.0)
    return shale_smear_factor(t, tmax), csp


def smear_fields(layers: Layers, depth_m, throw_m, dtype=np.float32,
                 clay_min: float = SMEAR_SOURCE_CLAY_MIN):
    """SSF and CSP (m) on the grid ``depth_m`` (rows) x ``throw_m`` (columns).

    Increasing throws >= 0 on increasing depths cost a constant times the cells (rows x
    throws): while few source beds pass a point (at most :data:`STAIRCASE_MAX_PASSED` on
    average, :func:`mean_beds_passed`) each bed is added over the area where it has passed
    (:func:`_smear_staircase`, bit for bit :func:`smear_at`); with more (large throws),
    :func:`logprep.fault.smeargrid.smear_grid` reads range maxima, per-row cumulative
    sums and moment sums of the far beds per hanging-wall depth, equal to :func:`smear_at`
    within float32 rounding (the same terms added in another order; the far hanging-wall
    terms as a series truncated at a relative 4e-11).  Unsorted or negative throws, or
    depths not increasing, take a plain per-bed pass over all rows and throws (cells x
    source beds).
    """
    z = np.asarray(depth_m, float)
    t = np.asarray(throw_m, float)
    tmax = np.zeros((z.size, t.size))
    csp = np.zeros((z.size, t.size))
    if t.size and (t[0] < 0 or np.any(np.diff(t) <= 0) or np.any(np.diff(z) <= 0)):
        _smear_dense(layers, z, t, tmax, csp, clay_min)
    elif t.size and z.size:
        _smear_sorted(layers, z, t, tmax, csp, clay_min)
    ssf = shale_smear_factor(t[None, :], tmax)
    return ssf.astype(dtype), csp.astype(dtype)


def _smear_dense(layers: Layers, z, t, tmax, csp, clay_min: float = SMEAR_SOURCE_CLAY_MIN) -> None:
    """Every source bed over the rows it can reach (``z`` within its top and base plus
    the largest throw) and every throw: the general case of :func:`smear_fields`."""
    reach = float(np.abs(t).max(initial=0.0))
    increasing = bool(np.all(np.diff(z) > 0))
    for i in source_beds(layers, clay_min):
        top, base = layers.top_m[i], layers.base_m[i]
        r0, r1 = np.searchsorted(z, [top - reach, base + reach], side="left") if increasing \
            else (0, z.size)
        rows = slice(r0, r1 + 1)
        passed, thick, term = _bed_terms(top, base, z[rows, None], t[None, :])
        np.maximum(tmax[rows], np.where(passed, thick, 0.0), out=tmax[rows])
        csp[rows] += np.where(passed, term, 0.0)


STAIRCASE_MAX_PASSED = 12.0
"""Mean source beds passed per point up to which :func:`_smear_staircase` (cost: points x
beds passed) is used rather than :func:`logprep.fault.smeargrid.smear_grid` (cost: points
x a constant); the two take about the same time there on a 2-core machine
(``bench/bench_scaling.py``)."""


def mean_beds_passed(top_m, base_m, depth_m, throw_m) -> float:
    """Mean number of source beds passed per point of the grid: a bed of thickness ``h``
    passes the points of a throw column ``t`` over ``h + t`` of depth, so the mean is
    ``sum(h + mean t) / column length`` (edges ignored)."""
    length = float(depth_m[-1] - depth_m[0]) if len(depth_m) > 1 else 0.0
    if length <= 0:
        return 0.0
    h = np.asarray(base_m, float) - np.asarray(top_m, float)
    return float((h.sum() + h.size * np.mean(throw_m)) / length)


def _smear_sorted(layers: Layers, z, t, tmax, csp, clay_min: float = SMEAR_SOURCE_CLAY_MIN) -> None:
    """:func:`_smear_dense` for increasing throws >= 0 and increasing depths, at a cost
    linear in the cells: the staircase while few beds pass a point
    (:data:`STAIRCASE_MAX_PASSED`), else :func:`logprep.fault.smeargrid.smear_grid`;
    ``t = 0`` columns stay empty (nothing has passed)."""
    c0 = int(np.searchsorted(t, 0.0, side="right"))
    if c0 == t.size:
        return
    src = source_beds(layers, clay_min)
    if mean_beds_passed(layers.top_m[src], layers.base_m[src], z, t[c0:]) <= STAIRCASE_MAX_PASSED:
        _smear_staircase(layers, z, t, tmax, csp, clay_min)
        return
    tm, cs = smear_grid(layers.top_m[src], layers.base_m[src], z, t[c0:])
    tmax[:, c0:] = tm
    csp[:, c0:] = cs


_SMEAR_BLOCK_CELLS = 1 << 16
"""Cells of one row block of :func:`_smear_staircase` (fits a core's cache)."""


def _smear_staircase(layers: Layers, z, t, tmax, csp, clay_min: float = SMEAR_SOURCE_CLAY_MIN) -> None:
    """:func:`_smear_dense` for increasing throws >= 0, restricted to where a bed can
    have passed: rows ``top < z < base + t_max``, throws ``t > z - base``.  The tests of
    :func:`_bed_terms` still decide every point (the ranges are only made no narrower)."""
    c0 = int(np.searchsorted(t, 0.0, side="right"))  # t = 0: nothing has passed
    if c0 == t.size:
        return
    t_last = float(t[-1])
    block = max(8, _SMEAR_BLOCK_CELLS // t.size)
    for i in source_beds(layers, clay_min):
        top, base = layers.top_m[i], layers.base_m[i]
        thick = base - top
        mid = 0.5 * (top + base)
        half = 0.5 * thick
        sq = thick * thick
        slack = 1e-9 * (1.0 + abs(base) + t_last)
        ra = int(np.searchsorted(z, top, side="right"))  # first row with top < z
        rb = int(np.searchsorted(z, base + t_last + slack, side="right"))
        mid_t = mid + t
        for r0 in range(ra, rb, block):
            r1 = min(r0 + block, rb)
            zc = z[r0:r1, None]
            cs = max(c0, int(np.searchsorted(t, z[r0] - base - slack, side="left")))
            # passed: top < z (every row here), base > z - t, t != 0 (every column here)
            passed = base > zc - t[None, cs:]
            inv_fw = 1.0 / np.maximum(np.abs(zc - mid), half)
            buf = mid_t[None, cs:] - zc
            np.abs(buf, out=buf)
            np.maximum(buf, half, out=buf)
            np.divide(1.0, buf, out=buf)
            np.add(inv_fw, buf, out=buf)
            np.multiply(sq, buf, out=buf)
            np.add(csp[r0:r1, cs:], buf, out=csp[r0:r1, cs:], where=passed)
            np.maximum(tmax[r0:r1, cs:], thick, out=tmax[r0:r1, cs:], where=passed)


def _window_extremes(layers: Layers, w, throw_max_m: float, n_edge: int,
                     shale: np.ndarray | None = None) -> tuple[float, ...]:
    """SSF and CSP extremes over one window's contact area.

    Inside a sand-sand contact area the beds that have passed are fixed (every layer
    strictly between the two sands), so SSF = t / T_max is extreme at the window's throw
    limits, and CSP = f(z) + g(z - t) with f decreasing and g increasing in their
    arguments has no interior extremum: it is evaluated along the boundary of the area
    (``n_edge`` points per edge, vertices included; the maximum is at a vertex, exact).
    """
    fi, hi = int(w.footwall_layer), int(w.hangingwall_layer)
    lo_i, hi_i = min(fi, hi), max(fi, hi)
    shale = source_beds(layers) if shale is None else shale  # sorted layer indices
    between = shale[np.searchsorted(shale, lo_i, side="right"):np.searchsorted(shale, hi_i, side="left")]
    if not between.size:
        return np.inf, np.inf, 0.0, 0.0
    tmax = float(np.max(layers.base_m[between] - layers.top_m[between]))
    ssf_min = float(w.throw_min_m) / tmax
    ssf_max = float(w.throw_max_m) / tmax
    poly = contact_polygon(w.footwall_top_m, w.footwall_base_m, w.hangingwall_top_m,
                           w.hangingwall_base_m, max(0.0, float(w.throw_min_m)), throw_max_m)
    if len(poly) == 0:
        return ssf_min, ssf_max, np.nan, np.nan
    s = np.linspace(0.0, 1.0, n_edge)[:, None]
    edges = [poly[k - 1] + s * (poly[k] - poly[k - 1]) for k in range(len(poly))]
    pts = np.concatenate(edges)
    pts = pts[pts[:, 0] > 0]  # t -> 0 has no smear distance along the fault
    if len(pts) == 0:
        return ssf_min, ssf_max, np.nan, np.nan
    # CSP of smear_at, all the beds at once (one row each), summed in bed order
    passed, _, term = _bed_terms(layers.top_m[between][:, None], layers.base_m[between][:, None],
                                 pts[None, :, 1], pts[None, :, 0])
    csp = np.zeros(len(pts))
    for row in np.where(passed, term, 0.0):
        csp += row
    return ssf_min, ssf_max, float(csp.min()), float(csp.max())


def window_smear(layers: Layers, windows: pd.DataFrame, throw_max_m: float,
                 n_edge: int = 201, csp_factor: float = 1.0,
                 clay_min: float = SMEAR_SOURCE_CLAY_MIN) -> pd.DataFrame:
    """Columns :data:`SMEAR_COLUMNS` for each row of ``windows`` (same index):
    ``ssf_min``/``ssf_max`` (inf where no source bed lies between the two sands, e.g. a
    sand against itself) and ``csp_min_m``/``csp_max_m`` (metres; 0 there).  CSP is
    multiplied by ``csp_factor`` (:func:`logprep.fault.geometry.csp_factor`: distances along
    a dipping fault and true bed thicknesses instead of vertical ones)."""
    shale = source_beds(layers, clay_min)  # once per well: the windows only look up their range
    rows = [_window_extremes(layers, w, throw_max_m, n_edge, shale) for w in windows.itertuples()]
    out = pd.DataFrame(rows, columns=SMEAR_COLUMNS, index=windows.index, dtype=float)
    out[["csp_min_m", "csp_max_m"]] *= csp_factor
    return out


def with_smear_fields(grid, layers: Layers, csp_factor: float = 1.0,
                      clay_min: float = SMEAR_SOURCE_CLAY_MIN):
    """A copy of an :class:`~logprep.fault.sgr.SgrField` carrying ``ssf`` and ``csp_m`` on its
    axes (float32; NaN where the SGR is NaN, i.e. the slipped interval leaves the log);
    CSP times ``csp_factor`` as in :func:`window_smear`."""
    from dataclasses import replace

    ssf, csp = smear_fields(layers, grid.depth_m, grid.throw_m, clay_min=clay_min)
    if csp_factor != 1.0:
        csp *= np.float32(csp_factor)
    off = np.isnan(grid.sgr_pct)
    ssf[off] = np.nan
    csp[off] = np.nan
    return replace(grid, extra={**grid.extra, "ssf": ssf, "csp_m": csp})
