"""Exact changepoint search for piecewise-constant means: generic numerics shared by the
GR-baseline zoning (:mod:`logprep.clay.endpoints`) and changepoint blocking
(:mod:`logprep.layers.blocking`).  numpy only."""

from __future__ import annotations

import numpy as np

from logprep.errors import SettingsError


_PELT_CELLS = 1 << 20
"""Cells (ends x starts) of one block step of :func:`pelt_mean_breaks` (memory bound)."""


def pelt_mean_breaks(x, penalty: float, min_size: int = 1) -> np.ndarray:
    """Optimal partition of ``x`` into segments of constant mean (least squares), with a
    cost ``penalty`` per change and at least ``min_size`` samples per segment.

    Minimises ``sum over segments of sum (x - segment mean)^2 + penalty x (number of
    changes)`` exactly, by optimal partitioning with the pruning of PELT (Killick,
    Fearnhead & Eckley 2012); segment costs come from cumulative sums in O(1) each.

    Parameters
    ----------
    x : array_like
        Finite values (here Vsh, fraction).
    penalty : float
        Cost of one change, in units of ``x`` squared; >= 0.
    min_size : int
        Fewest samples in a segment, >= 1.

    Returns
    -------
    ndarray of int
        First sample index of every segment after the first (empty: no change).

    Notes
    -----
    With ``F(t)`` the best cost of ``x[:t]``, ``F(t) = min_s F(s) + C(s, t) + penalty``
    over ``s <= t - min_size``.  A start ``s`` with ``F(s) + C(s, t) > F(t)`` can never
    be optimal again for ends ``T >= t + min_size`` (Killick et al. 2012, theorem 3.1, whose
    constant K is 0 for this cost); with a minimum segment length it is dropped only from
    then on, which keeps the search exact.

    References
    ----------
    1. Killick, R., Fearnhead, P. and Eckley, I.A. (2012). Optimal detection of
       changepoints with a linear computational cost. Journal of the American Statistical
       Association 107(500), 1590-1598. doi:10.1080/01621459.2012.737745
    2. Jackson, B. et al. (2005). An algorithm for optimal partitioning of data on an
       interval. IEEE Signal Processing Letters 12(2), 105-108.
    """
    x = np.asarray(x, dtype=float)
    n = x.size
    if penalty < 0 or min_size < 1:
        raise SettingsError(f"changepoint search needs penalty >= 0 and min_size >= 1 "
                            f"(got {penalty:g}, {min_size}); set --changepoint-penalty to 0 or more and "
                            "--min-bed to a positive length")
    if n < 2 * min_size:
        return np.zeros(0, dtype=np.intp)
    s1 = np.concatenate(([0.0], np.cumsum(x)))
    s2 = np.concatenate(([0.0], np.cumsum(x * x)))
    best = np.full(n + 1, np.inf)
    best[0] = -penalty
    last = np.zeros(n + 1, dtype=np.intp)
    cand = np.zeros(0, dtype=np.intp)      # admissible starts, increasing
    drop_at = np.zeros(0, dtype=np.intp)   # when each is dropped (n + 1: not yet)
    # Ends t are taken in blocks of at most min_size: every start a block's ends can use
    # (s <= t - min_size) is then known before the block, and a start pruned inside the
    # block is dropped only from t + min_size on, after the block.  So one 2-D step per
    # block gives the same values, minima and pruning as one step per end.
    t0 = min_size
    while t0 <= n:
        width = max(1, min(min_size, _PELT_CELLS // (cand.size + min_size)))
        t1 = min(t0 + width, n + 1)          # ends t0 .. t1 - 1
        new = np.arange(t0 - min_size, t1 - min_size)
        new = new[np.isfinite(best[new])]
        cand = np.concatenate((cand[drop_at > t0], new))
        drop_at = np.concatenate((drop_at[drop_at > t0], np.full(new.size, n + 1, dtype=np.intp)))
        ts = np.arange(t0, t1)
        mf = ts.astype(float)[:, None] - cand.astype(float)[None, :]  # exact: small ints
        cost = s1[ts][:, None] - s1[cand][None, :]
        np.square(cost, out=cost)
        np.divide(cost, mf, out=cost)
        np.subtract(s2[ts][:, None] - s2[cand][None, :], cost, out=cost)
        np.maximum(cost, 0.0, out=cost)
        total = np.add(best[cand][None, :], cost, out=cost)
        # a start is usable for end t once t >= s + min_size (only the new starts can be
        # too recent) and until it is dropped (only starts dropped before t1 matter)
        fresh = slice(cand.size - new.size, cand.size)
        young = mf[:, fresh] < min_size
        total[:, fresh][young] = np.inf
        gone = np.flatnonzero(drop_at < t1)
        for j in gone.tolist():
            total[ts >= drop_at[j], j] = np.inf
        k = np.argmin(total, axis=1)
        best[ts] = total[np.arange(ts.size), k] + penalty
        last[ts] = cand[k]
        dominated = np.greater(total, best[ts][:, None])
        dominated[:, fresh] &= ~young
        dominated[:, drop_at <= n] = False  # only starts not yet marked for dropping
        hit = np.flatnonzero(dominated.any(axis=0))
        drop_at[hit] = ts[np.argmax(dominated[:, hit], axis=0)] + min_size
        t0 = t1
    breaks = []
    t = n
    while t > 0:
        t = int(last[t])
        if t > 0:
            breaks.append(t)
    return np.array(breaks[::-1], dtype=np.intp)


def noise_sd(x, floor: float = 0.01) -> float:
    """Robust sample-to-sample noise of ``x``: ``1.4826 MAD(diff x) / sqrt 2``, at least
    ``floor`` (a Vsh resolution of 1 %, common practice, no source).

    The median absolute deviation (MAD) of first differences ignores the few large
    jumps at bed boundaries (Hampel 1974 for the 1.4826 consistency factor).
    """
    d = np.diff(np.asarray(x, dtype=float))
    if d.size == 0:
        return floor
    mad = np.median(np.abs(d - np.median(d)))
    return max(1.4826 * mad / np.sqrt(2.0), floor)


def coarse_mean_breaks(x, penalty: float, min_size: int, block: int) -> np.ndarray:
    """:func:`pelt_mean_breaks` for long, smooth ``x`` at a cost linear in its length:
    the exact search on the means of blocks of ``block`` samples, then the changes placed
    together on their best samples within one block of where the block search put them.

    For a segment made of whole blocks, ``sum (x - segment mean)^2`` is the sum of the
    within-block squares (the same for every partition) plus ``block x sum over blocks of
    (block mean - segment mean)^2`` (the within/between split of a sum of squares, common
    statistics, no source).  So the exact search on the block means with cost
    ``penalty / block`` is the exact optimum among changes on block edges.  It is run
    with at least ``floor`` and at least ``ceil`` of ``min_size / block`` blocks per
    segment (the samples after the last whole block join the last block); for each, the
    changes are then moved jointly, each within ``block`` samples, to the least total cost
    with every segment at least ``min_size`` long (a small dynamic programme over the
    allowed positions), and the cheaper of the two results (cost plus ``penalty`` per
    change) is returned.  It can differ from the exact search where two partitions are
    close in cost; ``block <= 1`` is the exact search.  The block search is quadratic at
    worst in ``len(x) / block`` (a few thousand blocks for a 100 km log at 10 m blocks),
    the rest linear.

    Parameters and return value as :func:`pelt_mean_breaks`; ``block`` in samples.
    """
    x = np.asarray(x, dtype=float)
    b = int(block)
    n = x.size
    if b <= 1 or n < 2 * min_size or n // b < 2:
        return pelt_mean_breaks(x, penalty, min_size)
    nb = n // b
    means = x[:nb * b].reshape(nb, b).mean(axis=1)
    s1 = np.concatenate(([0.0], np.cumsum(x)))
    s2 = np.concatenate(([0.0], np.cumsum(x * x)))
    best, best_cost = np.zeros(0, dtype=np.intp), _segment_cost(s1, s2, 0, n)
    for blocks in sorted({max(1, int(min_size) // b), max(1, -(-int(min_size) // b))}):
        coarse = pelt_mean_breaks(means, penalty / b, blocks) * b
        fine, c = _place_changes(s1, s2, coarse, b, int(min_size))
        if c + penalty * fine.size < best_cost + penalty * best.size:
            best, best_cost = fine, c
    return best


def _segment_cost(s1, s2, a, e):
    """Least-squares cost of ``x[a:e]`` from its cumulative sums (broadcast over a, e)."""
    return (s2[e] - s2[a]) - (s1[e] - s1[a]) ** 2 / (e - a)


def _place_changes(s1, s2, approx, window: int, min_size: int) -> tuple[np.ndarray, float]:
    """Changes near ``approx`` (each within ``window`` samples) of least total cost with
    segments at least ``min_size`` long: ``(changes, cost)``; ``inf`` cost when none fit."""
    n = s1.size - 1
    if approx.size == 0:
        return approx, float(_segment_cost(s1, s2, 0, n))
    pos = [np.arange(max(1, a - window), min(n - 1, a + window) + 1) for a in approx.tolist()]
    f = np.where(pos[0] >= min_size, _segment_cost(s1, s2, 0, pos[0]), np.inf)
    back = []
    for prev, cur in zip(pos[:-1], pos[1:]):
        total = f[None, :] + np.where(cur[:, None] - prev[None, :] >= min_size,
                                      _segment_cost(s1, s2, prev[None, :], np.maximum(cur[:, None], prev[None, :] + 1)),
                                      np.inf)
        k = np.argmin(total, axis=1)
        back.append(k)
        f = total[np.arange(cur.size), k]
    last = pos[-1]
    f = f + np.where(n - last >= min_size, _segment_cost(s1, s2, last, n), np.inf)
    j = int(np.argmin(f))
    cost = float(f[j])
    out = [int(last[j])]
    for k, prev in zip(back[::-1], pos[-2::-1]):
        j = int(k[j])
        out.append(int(prev[j]))
    return np.array(out[::-1], dtype=np.intp), cost
