"""Blocking: turn a Vsh curve into a column of layers.

Each sample stands for the interval between the midpoints to its neighbours (half a step
beyond the first and last samples), so a column covers the logged interval without gaps and
thickness-weighted means conserve the clay thickness of the curve exactly.

Methods live in the registry :data:`BLOCKING_METHODS`; each takes ``(depth_m, vsh, **settings)``
and returns :class:`~logprep.model.Layers`.
"""

from __future__ import annotations

import hashlib
import heapq
from collections.abc import Callable

import numpy as np

from logprep.changepoint import noise_sd, pelt_mean_breaks
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
            f"cut-offs must satisfy 0 <= sand ({sand_cutoff:g}) < shale ({shale_cutoff:g}) <= 1; "
            "set --sand-cutoff below --shale-cutoff, both within 0-1"
        )


def fill_gaps(depth_m, vsh, extend_ends: bool = False) -> tuple[np.ndarray, np.ndarray]:
    """Interpolate missing Vsh linearly in depth between measured samples.

    Returns ``(vsh_filled, was_filled)``.  Leading and trailing gaps are not filled (NaN
    stays; callers trim them) unless ``extend_ends``: then they take the nearest measured
    value, so a spike replaced on the first or last sample of a log does not leave the
    column without a Vsh there (common practice, no source).
    """
    d = np.asarray(depth_m, dtype=float)
    v = np.asarray(vsh, dtype=float)
    ok = np.isfinite(v)
    filled = v.copy()
    if ok.sum() >= 2 or (extend_ends and ok.any()):
        inside = (~ok) & (d > d[ok][0]) & (d < d[ok][-1])
        if extend_ends:
            inside = ~ok
        filled[inside] = np.interp(d[inside], d[ok], v[ok])  # np.interp holds the end values
        return filled, inside
    return filled, np.zeros(v.shape, dtype=bool)


def _runs(code) -> tuple[np.ndarray, np.ndarray]:
    """Start and stop (exclusive) indices of runs of equal values."""
    code = np.asarray(code)
    change = np.flatnonzero(code[1:] != code[:-1]) + 1
    starts = np.concatenate(([0], change))
    stops = np.concatenate((change, [code.size]))
    return starts, stops


def _check_block_input(depth_m, vsh, filled, sand_cutoff, shale_cutoff, min_bed_m, edges_m=None):
    """Validated ``(depth, vsh, filled, sample edges)`` for a blocking method."""
    check_cutoffs(sand_cutoff, shale_cutoff)
    if not min_bed_m >= 0:
        raise SettingsError(f"minimum bed thickness must be >= 0 m (got {min_bed_m:g}); give "
                            "--min-bed 0 m or more")
    d = np.asarray(depth_m, dtype=float)
    v = np.asarray(vsh, dtype=float)
    if d.size == 0 or d.size != v.size:
        raise SettingsError("blocking needs equal, non-empty depth and Vsh arrays; pass one Vsh "
                            "value per depth sample")
    if not np.all(np.isfinite(v)):
        raise SettingsError("blocking needs finite Vsh; fill or trim missing samples first")
    f = np.zeros(d.size, dtype=bool) if filled is None else np.asarray(filled, dtype=bool)
    edges = sample_edges_m(d) if edges_m is None else np.asarray(edges_m, dtype=float)
    if edges.size != d.size + 1:
        raise SettingsError("blocking: edges_m needs one more entry than depth_m; pass the "
                            "sample edges (sample_edges_m) or leave edges_m out")
    return d, v, f, edges


def block_cutoff(
    depth_m,
    vsh,
    *,
    sand_cutoff: float = 0.35,
    shale_cutoff: float = 0.65,
    min_bed_m: float = 1.0,
    filled=None,
    edges_m=None,
    **_ignored,
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
    edges_m : array_like, optional
        Interval edges of the samples (``n + 1``; default :func:`sample_edges_m`).

    Notes
    -----
    Merge rule: repeatedly take the thinnest layer below ``min_bed_m`` (the upper one on
    ties) and merge it into the neighbour whose Vsh is closest to its own (the thicker
    neighbour on ties; the only neighbour at the top or base).  The merged layer takes the
    thickness-weighted mean Vsh and is classed again by the cut-offs; neighbours of equal
    class are then joined.  Clay thickness (sum of Vsh x thickness) is conserved exactly.
    """
    d, v, f, edges = _check_block_input(
        depth_m, vsh, filled, sand_cutoff, shale_cutoff, min_bed_m, edges_m
    )
    code = classify_vsh(v, sand_cutoff, shale_cutoff)
    starts, _ = _runs(code)
    return _layers_from_segments(edges, v, f, starts, sand_cutoff, shale_cutoff, min_bed_m)


def _layers_from_segments(edges, v, filled, starts, sand_cutoff, shale_cutoff, min_bed_m) -> Layers:
    """Layers from segments of samples (``starts``: first sample of each segment): each
    segment gets its thickness-weighted Vsh and class; neighbours of equal class join;
    layers thinner than ``min_bed_m`` merge as in :func:`block_cutoff`.

    Each layer's net-to-gross is the share of its thickness in samples with
    Vsh <= ``sand_cutoff``; like clay and filled thickness it is summed, never averaged,
    so it survives merging exactly.
    """
    dz = np.diff(edges)
    starts = np.asarray(starts, dtype=np.intp)
    clay = np.add.reduceat(v * dz, starts)
    seg_thick = np.add.reduceat(dz, starts)
    # join neighbouring segments of equal class first
    joined, _ = _runs(classify_vsh(clay / seg_thick, sand_cutoff, shale_cutoff))
    starts = starts[joined]
    stops = np.concatenate((starts[1:], [v.size]))
    extras = np.vstack([
        np.add.reduceat(v * dz, starts),
        np.add.reduceat(filled * dz, starts),
        np.add.reduceat((v <= sand_cutoff) * dz, starts),
    ])
    top, base, extras = _merge_thin(
        edges[starts], edges[stops], extras, sand_cutoff, shale_cutoff, min_bed_m
    )
    clay, fill_len, net = extras
    thick = base - top
    vsh_layer = clay / thick
    codes = classify_vsh(vsh_layer, sand_cutoff, shale_cutoff)
    return Layers(
        top_m=top,
        base_m=base,
        vsh=vsh_layer,
        lithology=tuple(LITHOLOGIES[c] for c in codes),
        filled_fraction=fill_len / thick,
        net_to_gross=net / thick,
    )


def _merge_thin(top, base, extras, sand_cutoff, shale_cutoff, min_bed_m):
    """Merge thin layers (rule in :func:`block_cutoff`) with a heap and a linked list:
    O(n log n) in the number of runs.  ``extras`` holds additive per-layer quantities
    (thickness-weighted sums), one row each; row 0 is the clay thickness."""
    n = len(top)
    top, base = list(map(float, top)), list(map(float, base))
    extras = [list(map(float, row)) for row in extras]
    clay = extras[0]
    alive = [True] * n
    prev = list(range(-1, n - 1))
    nxt = list(range(1, n + 1))
    nxt[-1] = -1
    version = [0] * n
    live = [n]

    check_cutoffs(sand_cutoff, shale_cutoff)

    def cls(i):
        # classify_vsh on one value, in plain floats (the same comparisons; called per merge)
        t = base[i] - top[i]
        if not t > 0:
            return int(classify_vsh(clay[i] / t, sand_cutoff, shale_cutoff))
        v = clay[i] / t
        return 0 if v <= sand_cutoff else 2 if v >= shale_cutoff else 1

    heap = [(base[i] - top[i], top[i], i, 0) for i in range(n) if base[i] - top[i] < min_bed_m]
    heapq.heapify(heap)

    def absorb(keep, gone):
        """Join layer ``gone`` into its neighbour ``keep``."""
        top[keep] = min(top[keep], top[gone])
        base[keep] = max(base[keep], base[gone])
        for row in extras:
            row[keep] += row[gone]
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
            np.array([[row[i] for i in idx] for row in extras]))


# ----------------------------------------------------------------------------- changepoints
_SEGMENT_CACHE: dict = {}


def _cached_breaks(v, penalty, min_size):
    """:func:`pelt_mean_breaks` remembered for the last few curves (a sensitivity sweep
    re-blocks the same curve at many cut-offs)."""
    key = (hashlib.blake2b(v.tobytes(), digest_size=16).digest(), v.size, float(penalty), int(min_size))
    if key not in _SEGMENT_CACHE:
        if len(_SEGMENT_CACHE) >= 64:
            _SEGMENT_CACHE.pop(next(iter(_SEGMENT_CACHE)))
        _SEGMENT_CACHE[key] = pelt_mean_breaks(v, penalty, min_size)
    return _SEGMENT_CACHE[key]


def block_changepoint(
    depth_m,
    vsh,
    *,
    sand_cutoff: float = 0.35,
    shale_cutoff: float = 0.65,
    min_bed_m: float = 1.0,
    changepoint_penalty: float = 2.0,
    filled=None,
    edges_m=None,
    **_ignored,
) -> Layers:
    """Block a Vsh curve by an optimal changepoint search, then class the segments.

    The curve is split into segments of constant mean Vsh by :func:`pelt_mean_breaks`
    with a minimum segment of ``min_bed_m`` (in samples, at the median sample step) and a
    cost per change of ``changepoint_penalty x sd^2 x ln n`` (``sd`` from
    :func:`noise_sd`, ``n`` samples).  A multiplier of 2 matches the Schwarz (1978)
    information criterion for a change of mean with known noise; larger values give fewer,
    thicker layers.  Each segment takes its thickness-weighted Vsh and is classed by the
    cut-offs; neighbours of equal class join, and any layer still thinner than
    ``min_bed_m`` (uneven sampling) merges as in :func:`block_cutoff`.

    Unlike :func:`block_cutoff`, where a boundary falls where the curve crosses a
    cut-off, a boundary here falls where the mean changes most, and an interbedded
    stretch whose mean lies between the cut-offs becomes one heterolith layer rather than
    a flicker of thin beds.

    References
    ----------
    1. Killick, R., Fearnhead, P. and Eckley, I.A. (2012). JASA 107(500), 1590-1598.
    2. Schwarz, G. (1978). Estimating the dimension of a model. Annals of Statistics 6(2),
       461-464.
    """
    d, v, f, edges = _check_block_input(
        depth_m, vsh, filled, sand_cutoff, shale_cutoff, min_bed_m, edges_m
    )
    if not changepoint_penalty >= 0:
        raise SettingsError(f"changepoint penalty must be >= 0 (got {changepoint_penalty:g}); "
                            "give --changepoint-penalty 0 or more")
    step = float(np.median(np.diff(d))) if d.size > 1 else 1.0
    min_size = max(1, int(np.ceil(min_bed_m / step - 1e-9)))
    penalty = changepoint_penalty * noise_sd(v) ** 2 * np.log(max(v.size, 2))
    breaks = _cached_breaks(v, penalty, min_size)
    starts = np.concatenate(([0], breaks)).astype(np.intp)
    return _layers_from_segments(edges, v, f, starts, sand_cutoff, shale_cutoff, min_bed_m)


BLOCKING_METHODS: dict[str, Callable[..., Layers]] = {
    "cutoff": block_cutoff,
    "changepoint": block_changepoint,
}
"""Blocking methods by name; each returns :class:`~logprep.model.Layers`."""


def get_blocking_method(name: str) -> Callable[..., Layers]:
    try:
        return BLOCKING_METHODS[name.strip().lower()]
    except KeyError:
        raise SettingsError(
            f"unknown blocking method {name!r}; choose one of {', '.join(BLOCKING_METHODS)}"
        ) from None


def block_with_boundaries(method, depth_m, vsh, boundaries_m=(), *, filled=None, **settings) -> Layers:
    """Block with ``method`` (a name in :data:`BLOCKING_METHODS` or a function) while
    forcing a layer boundary at each depth in ``boundaries_m`` (formation tops).

    Each boundary moves to the nearest sample edge (:func:`sample_edges_m`), so it lies
    within half a sample step of the pick and clay thickness stays exact; the interval
    between two forced boundaries is blocked on its own, so no layer spans one (a layer
    there may be thinner than the minimum bed, and neighbours across a boundary may share
    a class).  Boundaries outside the logged interval or on its ends are ignored.
    """
    fn = get_blocking_method(method) if isinstance(method, str) else method
    d = np.asarray(depth_m, dtype=float)
    v = np.asarray(vsh, dtype=float)
    f = np.zeros(d.size, dtype=bool) if filled is None else np.asarray(filled, dtype=bool)
    edges = sample_edges_m(d)
    b = np.asarray(boundaries_m, dtype=float).ravel()
    b = b[np.isfinite(b) & (b > edges[0]) & (b < edges[-1])]
    cuts = np.unique(np.abs(edges[None, :] - b[:, None]).argmin(axis=1)) if b.size else b
    cuts = cuts[(cuts > 0) & (cuts < d.size)].astype(np.intp)
    if cuts.size == 0:
        return fn(d, v, filled=f, **settings)
    parts = [
        fn(d[lo:hi], v[lo:hi], filled=f[lo:hi], edges_m=edges[lo:hi + 1], **settings)
        for lo, hi in zip(np.concatenate(([0], cuts)), np.concatenate((cuts, [d.size])))
    ]
    return Layers(
        top_m=np.concatenate([p.top_m for p in parts]),
        base_m=np.concatenate([p.base_m for p in parts]),
        vsh=np.concatenate([p.vsh for p in parts]),
        lithology=sum((p.lithology for p in parts), ()),
        filled_fraction=np.concatenate([p.filled_fraction for p in parts]),
        net_to_gross=np.concatenate([p.net_to_gross for p in parts]),
    )


def net_to_gross(layers: Layers) -> float:
    """Net-to-gross of a blocked column: thickness of sand layers over total thickness."""
    t = layers.thickness_m
    sand = np.array([x == "sand" for x in layers.lithology])
    return float(t[sand].sum() / t.sum()) if t.sum() > 0 else float("nan")
