"""Blocking: turn a Vsh curve into a column of layers.

Each sample stands for the interval between the midpoints to its neighbours (half a step
beyond the first and last samples), so a column covers the logged interval without gaps and
thickness-weighted means conserve the clay thickness of the curve exactly.

Methods live in the registry :data:`BLOCKING_METHODS`; each takes ``(depth_m, vsh, **settings)``
and returns :class:`~logprep.model.Layers`.
"""

from __future__ import annotations

import heapq
from typing import Callable

import numpy as np

from logprep.errors import SettingsError
from logprep.model import LITHOLOGIES, Layers


def sample_edges_m(depth_m) -> np.ndarray:
    """Interval edges for samples at ``depth_m`` (increasing): midpoints between samples,
    extended by half a step at both ends.  Length ``n + 1``."""
    d = np.asarray(depth_m, dtype=float)
    if d.size == 1:
        return np.array([d[0], d[0]])
    mid = 0.5 * (d[1:] + d[:-1])
    return np.concatenate(([d[0] - (mid[0] - d[0])], mid, [d[-1] + (d[-1] - mid[-1])]))


def classify_vsh(vsh, sand_cutoff: float, shale_cutoff: float) -> np.ndarray:
    """Lithology code per value: 0 sand (Vsh <= sand_cutoff), 2 shale (Vsh >= shale_cutoff),
    1 heterolith in between.  Codes index :data:`~logprep.model.LITHOLOGIES`."""
    check_cutoffs(sand_cutoff, shale_cutoff)
    v = np.asarray(vsh, dtype=float)
    code = np.ones(v.shape, dtype=np.int8)
    code[v <= sand_cutoff] = 0
    code[v >= shale_cutoff] = 2
    return code


def check_cutoffs(sand_cutoff: float, shale_cutoff: float) -> None:
    if not (0.0 <= sand_cutoff < shale_cutoff <= 1.0):
        raise SettingsError(
            f"cut-offs must satisfy 0 <= sand ({sand_cutoff:g}) < shale ({shale_cutoff:g}) <= 1"
        )


def fill_gaps(depth_m, vsh) -> tuple[np.ndarray, np.ndarray]:
    """Interpolate missing Vsh linearly in depth between measured samples.

    Returns ``(vsh_filled, was_filled)``.  Leading and trailing gaps are not filled (NaN
    stays); callers trim them.
    """
    d = np.asarray(depth_m, dtype=float)
    v = np.asarray(vsh, dtype=float)
    ok = np.isfinite(v)
    filled = v.copy()
    if ok.sum() >= 2:
        inside = (~ok) & (d > d[ok][0]) & (d < d[ok][-1])
        filled[inside] = np.interp(d[inside], d[ok], v[ok])
        return filled, inside
    return filled, np.zeros(v.shape, dtype=bool)


def _runs(code) -> tuple[np.ndarray, np.ndarray]:
    """Start and stop (exclusive) indices of runs of equal values."""
    code = np.asarray(code)
    change = np.flatnonzero(code[1:] != code[:-1]) + 1
    starts = np.concatenate(([0], change))
    stops = np.concatenate((change, [code.size]))
    return starts, stops


def block_cutoff(
    depth_m,
    vsh,
    *,
    sand_cutoff: float = 0.35,
    shale_cutoff: float = 0.65,
    min_bed_m: float = 1.0,
    filled=None,
) -> Layers:
    """Block a Vsh curve by cut-offs, merging beds thinner than ``min_bed_m``.

    Parameters
    ----------
    depth_m : array_like
        Sample depths, metres, strictly increasing.
    vsh : array_like
        Clay volume per sample (fraction); must be finite (fill gaps first).
    sand_cutoff, shale_cutoff : float
        Vsh <= ``sand_cutoff`` is sand, >= ``shale_cutoff`` shale, between is heterolith.
    min_bed_m : float
        Minimum layer thickness, metres (0 keeps every run of samples).
    filled : array_like of bool, optional
        Which samples were interpolated; gives each layer's ``filled_fraction``.

    Notes
    -----
    Merge rule: repeatedly take the thinnest layer below ``min_bed_m`` (the upper one on
    ties) and merge it into the neighbour whose Vsh is closest to its own (the thicker
    neighbour on ties; the only neighbour at the top or base).  The merged layer takes the
    thickness-weighted mean Vsh and is classed again by the cut-offs; neighbours of equal
    class are then joined.  Clay thickness (sum of Vsh x thickness) is conserved exactly.
    """
    check_cutoffs(sand_cutoff, shale_cutoff)
    if min_bed_m < 0:
        raise SettingsError(f"minimum bed thickness must be >= 0 m (got {min_bed_m:g})")
    d = np.asarray(depth_m, dtype=float)
    v = np.asarray(vsh, dtype=float)
    if d.size == 0 or d.size != v.size:
        raise SettingsError("blocking needs equal, non-empty depth and Vsh arrays")
    if not np.all(np.isfinite(v)):
        raise SettingsError("blocking needs finite Vsh; fill or trim missing samples first")
    f = np.zeros(d.size, dtype=bool) if filled is None else np.asarray(filled, dtype=bool)
    edges = sample_edges_m(d)
    dz = np.diff(edges)
    code = classify_vsh(v, sand_cutoff, shale_cutoff)
    starts, stops = _runs(code)
    clay = np.add.reduceat(v * dz, starts)
    fill_len = np.add.reduceat(f * dz, starts)
    top, base = edges[starts], edges[stops]
    top, base, clay, fill_len = _merge_thin(
        top, base, clay, fill_len, sand_cutoff, shale_cutoff, min_bed_m
    )
    thick = base - top
    vsh_layer = clay / thick
    codes = classify_vsh(vsh_layer, sand_cutoff, shale_cutoff)
    return Layers(
        top_m=top,
        base_m=base,
        vsh=vsh_layer,
        lithology=tuple(LITHOLOGIES[c] for c in codes),
        filled_fraction=fill_len / thick,
    )


def _merge_thin(top, base, clay, fill_len, sand_cutoff, shale_cutoff, min_bed_m):
    """Merge thin layers (rule in :func:`block_cutoff`) with a heap and a linked list:
    O(n log n) in the number of runs."""
    n = len(top)
    top, base, clay, fill_len = (list(map(float, a)) for a in (top, base, clay, fill_len))
    alive = [True] * n
    prev = list(range(-1, n - 1))
    nxt = list(range(1, n + 1))
    nxt[-1] = -1
    version = [0] * n
    live = [n]

    def cls(i):
        return int(classify_vsh(clay[i] / (base[i] - top[i]), sand_cutoff, shale_cutoff))

    heap = [(base[i] - top[i], top[i], i, 0) for i in range(n) if base[i] - top[i] < min_bed_m]
    heapq.heapify(heap)

    def absorb(keep, gone):
        """Join layer ``gone`` into its neighbour ``keep``."""
        top[keep] = min(top[keep], top[gone])
        base[keep] = max(base[keep], base[gone])
        clay[keep] += clay[gone]
        fill_len[keep] += fill_len[gone]
        alive[gone] = False
        live[0] -= 1
        p, q = prev[gone], nxt[gone]
        if p != -1:
            nxt[p] = q
        if q != -1:
            prev[q] = p
        version[keep] += 1

    def settle(i):
        """Join equal-class neighbours into ``i``; requeue if still thin."""
        for side in (prev, nxt):
            j = side[i]
            while j != -1 and cls(j) == cls(i):
                absorb(i, j)
                j = side[i]
        if base[i] - top[i] < min_bed_m:
            heapq.heappush(heap, (base[i] - top[i], top[i], i, version[i]))

    while heap and live[0] > 1:
        thick, _, i, ver = heapq.heappop(heap)
        if not alive[i] or ver != version[i] or base[i] - top[i] >= min_bed_m:
            continue
        p, q = prev[i], nxt[i]
        if p == -1 and q == -1:
            break
        vi = clay[i] / (base[i] - top[i])
        if p == -1:
            target = q
        elif q == -1:
            target = p
        else:
            dp = abs(clay[p] / (base[p] - top[p]) - vi)
            dq = abs(clay[q] / (base[q] - top[q]) - vi)
            if dp != dq:
                target = p if dp < dq else q
            else:
                target = p if (base[p] - top[p]) >= (base[q] - top[q]) else q
        absorb(target, i)
        settle(target)
    idx = [i for i in range(n) if alive[i]]
    order = np.argsort([top[i] for i in idx])
    idx = [idx[k] for k in order]
    return (np.array([top[i] for i in idx]), np.array([base[i] for i in idx]),
            np.array([clay[i] for i in idx]), np.array([fill_len[i] for i in idx]))


BLOCKING_METHODS: dict[str, Callable[..., Layers]] = {
    "cutoff": block_cutoff,
}
"""Blocking methods by name; each returns :class:`~logprep.model.Layers`."""


def get_blocking_method(name: str) -> Callable[..., Layers]:
    try:
        return BLOCKING_METHODS[name.strip().lower()]
    except KeyError:
        raise SettingsError(
            f"unknown blocking method {name!r}; choose one of {', '.join(BLOCKING_METHODS)}"
        ) from None
