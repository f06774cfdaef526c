"""Gamma-ray endpoint picking per zone, and the neutron-density shale point per zone.

A single clean/shale pick for a whole well is wrong wherever the GR baseline moves (hole
size, mud, tool, formation).  Here the well is cut into zones, from formation tops or,
without tops, where the GR baseline steps (a changepoint split), and each zone gets its
own clean and shale lines from the samples that passed QC.  Picking the lines per zone
when the baseline shifts is common practice, no source; the changepoint split is the
exact least-squares changepoint search of :mod:`logprep.layers.blocking` (PELT, Killick,
Fearnhead & Eckley 2012, JASA 107(500), 1590-1598) on 10 m block means of the running
median of the GR, each change then placed on its best sample (linear in the log length).

Zoning modes are registered in :data:`ZONINGS`.  Pure numpy/pandas: arrays in, tables out.
"""

from __future__ import annotations

import numpy as np
import pandas as pd

from logprep.changepoint import coarse_mean_breaks
from logprep.errors import SettingsError
from logprep.clay.qc import running_median
from logprep.clay.vshale import resolve_endpoint

PICK_COLUMNS = ["zone", "top_m", "base_m", "source", "gr_clean_api", "gr_shale_api",
                "samples_used", "samples_excluded", "nd_shale_separation", "note"]

ZONINGS = ("auto", "tops", "changepoint", "none")
"""``auto``: tops when the well has any inside the logged interval, else changepoints;
``tops``: tops only (whole well when none); ``changepoint``: baseline steps only;
``none``: one zone for the whole well (the plain single pick)."""


def changepoint_bounds(
    depth_m,
    gr_api,
    *,
    min_zone_m: float = 400.0,
    min_step_api: float = 8.0,
    smooth_m: float = 15.0,
    block_m: float = 10.0,
) -> list[int]:
    """Sample indices where the GR baseline steps.

    The GR is smoothed by a running median over ``smooth_m`` metres (so beds do not count
    as steps; :func:`logprep.clay.qc.running_median`) and split into segments of constant mean
    by the exact changepoint search of the blocking stage
    (:func:`logprep.changepoint.pelt_mean_breaks`, Killick et al. 2012) with segments at
    least ``min_zone_m`` long and a cost per change of ``min_step_api^2 x n_min / 2``: the
    least-squares gain of a step of ``min_step_api`` between two segments of ``n_min``
    samples.  The search runs on the means of ``block_m``-metre blocks of the smoothed GR
    and then places each change on its best sample within a block
    (:func:`logprep.changepoint.coarse_mean_breaks`), so its cost grows linearly with
    the log; a zone is hundreds of metres, so a 10 m block (less than the 15 m running
    median) loses nothing a zone boundary needs (common practice, no source).
    Neighbouring segments whose medians differ by less than ``min_step_api``
    are then joined (smallest difference first).  Returns the sorted indices of the first
    sample of every zone after the first.
    """
    depth = np.asarray(depth_m, dtype=float)
    gr = np.asarray(gr_api, dtype=float)
    if depth.size < 4 or not np.any(np.isfinite(gr)):
        return []
    step = float(np.median(np.diff(depth)))
    n = max(3, int(round(smooth_m / step)))
    base = running_median(gr, n, min_periods=1)
    base = np.where(np.isfinite(base), base, np.nanmedian(base) if np.any(np.isfinite(base)) else 0.0)
    nmin = max(2, int(round(min_zone_m / step)))
    block = max(1, int(round(block_m / step)))
    bounds = list(coarse_mean_breaks(base, min_step_api**2 * nmin / 2.0, nmin, block))
    while bounds:
        edges = [0] + bounds + [depth.size]
        med = [np.median(base[a:b]) for a, b in zip(edges[:-1], edges[1:])]
        diffs = np.abs(np.diff(med))
        k = int(np.argmin(diffs))
        if diffs[k] >= min_step_api:
            break
        del bounds[k]
    return [int(b) for b in bounds]


def tops_bounds(depth_m, tops_m) -> list[int]:
    """Sample indices of the tops that fall strictly inside the logged interval."""
    depth = np.asarray(depth_m, dtype=float)
    idx = np.searchsorted(depth, np.sort(np.asarray(tops_m, dtype=float)))
    return sorted({int(i) for i in idx if 0 < i < depth.size})


def bitsize_bounds(bs_in, *, min_change_in: float = 0.1) -> list[int]:
    """Sample indices where the bit size changes (a new hole section: the GR baseline of
    a new hole size, mud and often tool string).  Missing bit-size samples take the last
    size before them."""
    bs = pd.Series(np.asarray(bs_in, dtype=float)).ffill().bfill().to_numpy()
    if not np.any(np.isfinite(bs)):
        return []
    return [int(i) + 1 for i in np.flatnonzero(np.abs(np.diff(bs)) > min_change_in)]


def zone_bounds(depth_m, gr_api, zoning: str, tops: pd.DataFrame | None = None, *,
                bs_in=None, **kw):
    """``(bounds, source, names)``: first-sample indices of zones 2.., how they were
    found and a name for each zone.

    Every mode but ``none`` also cuts where the bit size changes (``bs_in``, inches, when
    given).  ``auto`` uses the tops when the well has some inside the interval, else the
    changepoints of the GR baseline found within each hole section (keywords of
    :func:`changepoint_bounds`).
    """
    if zoning not in ZONINGS:
        raise SettingsError(f"unknown zoning {zoning!r}; choose one of {', '.join(ZONINGS)}")
    depth = np.asarray(depth_m, dtype=float)
    gr = np.asarray(gr_api, dtype=float)
    if zoning == "none":
        return [], "whole well", ["whole well"]
    hole = bitsize_bounds(bs_in) if bs_in is not None else []
    hole_tag = "bit size + " if hole else ""
    have_tops = tops is not None and len(tops) > 0
    t = tops.sort_values("top_m") if have_tops else None
    top_idx = tops_bounds(depth, t["top_m"]) if have_tops else []
    if zoning == "tops" or (zoning == "auto" and top_idx):
        bounds, source = sorted(set(hole) | set(top_idx)), hole_tag + "tops"
    elif zoning == "tops":
        bounds, source = hole, hole_tag.rstrip(" +") or "whole well"
    else:
        bounds = set(hole)
        edges = [0] + hole + [depth.size]
        for a, b in zip(edges[:-1], edges[1:]):
            bounds |= {a + i for i in changepoint_bounds(depth[a:b], gr[a:b], **kw)}
        bounds, source = sorted(bounds), hole_tag + "changepoint"
    names = []
    for start in [0] + bounds:
        if t is not None and len(top_idx):
            above = t[t["top_m"] <= depth[start] + 1e-9]
            names.append(str(above["name"].iloc[-1]) if len(above) else "above first top")
        else:
            names.append(f"zone {len(names) + 1}")
    return bounds, source, names


ONE_SIDED = ("recentre", "well")
"""What a one-sided zone (too little clean-shale contrast) gets: ``recentre`` keeps the
line on its own side and sets the other at the well's contrast from it; ``well`` takes the
whole well's lines (a low-contrast zone is then read against the well, not re-centred on
itself)."""


def merge_short_zones(bounds, ok, min_samples: int) -> list[int]:
    """Drop zone boundaries until every zone holds at least ``min_samples`` usable
    samples (``ok``): the zone with the fewest is joined to its smaller neighbour, one at
    a time.  A zone too short for a meaningful percentile pick is merged, not given
    invented lines."""
    ok = np.asarray(ok, dtype=bool)
    b = sorted(int(x) for x in bounds)
    while b:
        edges = [0] + b + [ok.size]
        counts = [int(ok[a:c].sum()) for a, c in zip(edges[:-1], edges[1:])]
        k = int(np.argmin(counts))
        if counts[k] >= min_samples:
            break
        if k == 0:
            del b[0]
        elif k == len(counts) - 1:
            del b[-1]
        else:  # join to the neighbour with fewer usable samples
            del b[k - 1 if counts[k - 1] <= counts[k + 1] else k]
    return b


def pick_endpoints(
    depth_m,
    gr_api,
    bounds: list[int],
    *,
    clean: float | str = "p5",
    shale: float | str = "p95",
    exclude=None,
    min_contrast: float = 0.7,
    min_samples: int = 30,
    source: str = "whole well",
    names=None,
    one_sided: str = "recentre",
    floor_percentile: float = 1.0,
) -> pd.DataFrame:
    """Clean and shale GR lines for each zone.

    Parameters
    ----------
    depth_m, gr_api : array_like
        Depth (m, increasing) and GR (API).
    bounds : list of int
        First-sample indices of zones 2.. (see :func:`zone_bounds`).
    clean, shale : float or str
        Endpoint settings: a value in API or a percentile ``"pN"`` of the zone's readings.
    exclude : array_like of bool, optional
        Samples not to use in the picks (QC flags).
    min_contrast : float, default 0.7
        A zone whose shale-minus-clean contrast is below this fraction of the whole
        well's is one-sided (nearly all shale or all sand); see ``one_sided``.
    min_samples : int
        Zones with fewer usable samples are merged with a neighbour
        (:func:`merge_short_zones`) before picking.
    one_sided : str
        One of :data:`ONE_SIDED`.
    floor_percentile : float
        The well's physical floor is this percentile of all its usable readings: no
        zone's clean line goes below it, and none reaches the well's shale line (a
        re-centred clean line of -5 API is no rock's reading).

    Returns
    -------
    DataFrame with columns :data:`PICK_COLUMNS` (``nd_shale_separation`` left NaN).
    """
    if one_sided not in ONE_SIDED:
        raise SettingsError(f"unknown one-sided rule {one_sided!r}; use one of {', '.join(ONE_SIDED)}")
    depth = np.asarray(depth_m, dtype=float)
    gr = np.asarray(gr_api, dtype=float)
    ok = np.isfinite(gr) if exclude is None else np.isfinite(gr) & ~np.asarray(exclude, bool)
    if not ok.any():
        raise SettingsError("no GR sample passed QC (all missing or flagged), so no clean "
                            "and shale lines can be picked; check the GR curve (--gr-curve names another) "
                            "or relax --washout and --bad-hole")
    c_all = resolve_endpoint(clean, gr[ok])
    s_all = resolve_endpoint(shale, gr[ok])
    if c_all >= s_all:
        raise SettingsError(
            f"GR clean line {c_all:.1f} API is not below the shale line {s_all:.1f} API; "
            "set --gr-clean/--gr-shale"
        )
    span = s_all - c_all
    mid = 0.5 * (c_all + s_all)
    floor = min(float(np.percentile(gr[ok], floor_percentile)), c_all)
    starts_all = [0] + list(bounds)
    names_all = names or [f"zone {k + 1}" for k in range(len(starts_all))]
    kept = merge_short_zones(bounds, ok, min_samples)
    starts = [0] + kept
    stops = kept + [depth.size]
    step = float(np.median(np.diff(depth))) if depth.size > 1 else 0.0
    rows = []
    for a, b in zip(starts, stops):
        joined = [names_all[i] for i, st in enumerate(starts_all) if a <= st < b]
        name = " + ".join(joined) if joined else names_all[0]
        use = ok[a:b]
        g = gr[a:b][use]
        note = "merged short zones" if len(joined) > 1 else ""
        if g.size < min_samples:
            c, s, note = c_all, s_all, "too few usable samples: whole-well lines"
        else:
            c, s = resolve_endpoint(clean, g), resolve_endpoint(shale, g)
            if s - c < min_contrast * span:
                shaly = np.median(g) >= mid
                if one_sided == "well":
                    c, s = c_all, s_all
                    note = f"one-sided ({'shaly' if shaly else 'sandy'}) zone: whole-well lines"
                elif shaly:
                    c, note = s - span, "one-sided (shaly) zone: clean line set from the well's contrast"
                else:
                    s, note = c + span, "one-sided (sandy) zone: shale line set from the well's contrast"
            if c < floor or c >= s_all:
                c = min(max(c, floor), s_all - min_contrast * span)
                s = max(s, c + min_contrast * span)
                note = (note + "; " if note else "") + "clean line held within the well's floor and shale line"
        rows.append((name, depth[a], depth[b - 1] + step, source, c, s, int(use.sum()),
                     int((~use & np.isfinite(gr[a:b])).sum() + (~np.isfinite(gr[a:b])).sum()),
                     np.nan, note))
    return pd.DataFrame(rows, columns=PICK_COLUMNS)


def one_sided_note(picks: pd.DataFrame) -> str | None:
    """A warning when most zones are one-sided (their lines are not their own picks)."""
    n = len(picks)
    k = int(picks["note"].str.contains("one-sided").sum())
    if n > 1 and k > n / 2:
        return (f"{k} of {n} GR zones are one-sided (too little clean-shale contrast for "
                "their own lines); check the zoning or the tops")
    return None


def lines_per_sample(depth_m, picks: pd.DataFrame, column: str) -> np.ndarray:
    """The value of ``column`` of the zone each sample falls in."""
    depth = np.asarray(depth_m, dtype=float)
    k = np.searchsorted(picks["top_m"].to_numpy(), depth, side="right") - 1
    return picks[column].to_numpy(dtype=float)[np.clip(k, 0, len(picks) - 1)]


def nd_shale_separation(depth_m, gr_api, separation, picks: pd.DataFrame, *, exclude=None,
                        shale_quantile: float = 70.0, min_samples: int = 30) -> np.ndarray:
    """Neutron-density separation (PHIN - PHID) of shale in each zone of ``picks``: the
    median separation over the zone's usable samples whose GR is at or above the zone's
    ``shale_quantile`` percentile (the shaliest by GR).  NaN where a zone has too few
    such samples or the separation is not positive (no usable shale point)."""
    depth = np.asarray(depth_m, dtype=float)
    gr = np.asarray(gr_api, dtype=float)
    sep = np.asarray(separation, dtype=float)
    ok = np.isfinite(gr) & np.isfinite(sep)
    if exclude is not None:
        ok &= ~np.asarray(exclude, dtype=bool)
    zone = np.searchsorted(picks["top_m"].to_numpy(), depth, side="right") - 1
    out = np.full(len(picks), np.nan)
    for k in range(len(picks)):
        m = ok & (zone == k)
        if m.sum() < min_samples:
            continue
        hot = m & (gr >= np.percentile(gr[m], shale_quantile))
        if hot.sum() >= min_samples // 3:
            v = float(np.median(sep[hot]))
            out[k] = v if v > 0.02 else np.nan
    return out

