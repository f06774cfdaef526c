"""SSF and CSP over a whole triangle-diagram grid at a cost linear in its cells.

The definitions are those of :mod:`logprep.fault.smear` (SSF: Lindsay, Murphy, Walsh &
Watterson 1993; CSP: Bouvier et al. 1989, Fulljames et al. 1997).  Here only the order of
the arithmetic changes.  With the source beds sorted by depth and never overlapping, the
beds that have passed a point ``(z, t > 0)`` (``top < z`` and ``base > u``, where
``u = z - t`` is the hanging-wall depth) are one run of consecutive source beds,
``j(u) <= i < k(z)``.  So:

* the largest passed thickness (SSF's denominator) is a range maximum, read from a
  sparse table of the thicknesses in O(1) per point (exact);
* the footwall terms ``h^2 / max(|z - m|, h/2)`` depend on the row ``z`` only: one
  cumulative sum over the beds per row, then a difference per point (exact but for the
  order of the float64 additions);
* the hanging-wall terms ``h^2 / max(|m - u|, h/2)`` depend on each point's own ``u``.
  Beds below the one holding ``u`` have ``m - u > h/2``, so their term is ``h^2 / (m - u)``.
  Around grid depths ``u0`` every :data:`HW_GRID_M` metres, with ``u = u0 + d``, a bed
  at least :data:`FAR_M` below ``u0`` gives ``h^2 / (a - d) = sum_p d^p h^2 / a^(p+1)``
  (``a = m - u0``; a geometric series in ``d / a <= 0.05``); those moments are summed per
  ``u0`` over the beds, and the :data:`MOMENTS` terms kept leave a relative error below
  ``0.05^8 / 0.95``, about 4e-11, far below the float32 rounding (6e-8) of the output.
  The beds nearer than :data:`FAR_M` (a few) are summed exactly.

The cost is (rows + hanging-wall grid depths) x (source beds within the largest throw)
for the tables, plus (cells) x (near beds + moments) for the points: linear in rows x
throws at a given bed thickness.  Pure numpy.
"""

from __future__ import annotations

import numpy as np

HW_GRID_M = 1.0
"""Spacing (m) of the hanging-wall depths the far-bed moments are taken at."""
FAR_M = 10.0
"""A bed whose mid-depth lies this far (m) or more below a grid depth is summed by its
moments there (``d / a <= HW_GRID_M / 2 / FAR_M = 0.05``)."""
MOMENTS = 8
"""Terms of the geometric series kept (error factor ``0.05^8 / 0.95``)."""
_CELLS = 1 << 14
"""Points worked on at once."""


def _sparse_max(v: np.ndarray) -> np.ndarray:
    """Table ``T[l, i] = max(v[i : i + 2^l])`` (0 past the end) for range maxima."""
    n = v.size
    levels = max(1, int(n).bit_length())
    table = np.zeros((levels, n))
    table[0] = v
    for lev in range(1, levels):
        w = 1 << (lev - 1)
        table[lev, :n - w] = np.maximum(table[lev - 1, :n - w], table[lev - 1, w:])
    return table


def smear_grid(top_m, base_m, depth_m, throw_m) -> tuple[np.ndarray, np.ndarray]:
    """Largest passed source-bed thickness (m, 0 where none) and CSP (m) on the grid
    ``depth_m`` (rows, increasing) x ``throw_m`` (columns, increasing, > 0).

    ``top_m``, ``base_m``: the source beds, sorted by depth, not overlapping (m).
    """
    top = np.asarray(top_m, float)
    base = np.asarray(base_m, float)
    z = np.asarray(depth_m, float)
    t = np.asarray(throw_m, float)
    nz, nt = z.size, t.size
    tmax = np.zeros((nz, nt))
    csp = np.zeros((nz, nt))
    if top.size == 0 or nz == 0 or nt == 0:
        return tmax, csp
    thick = base - top
    mid = 0.5 * (top + base)
    half = 0.5 * thick
    sq = thick * thick
    table = _sparse_max(thick)
    flat_table = table.ravel()
    k_row = np.searchsorted(top, z, side="left")  # beds 0 .. k-1 have top < z
    # hanging-wall grid depths u0 = u_first + m D, covering every u = z - t
    u_first = z[0] - t[-1] - HW_GRID_M
    n_grid = int(np.ceil((z[-1] - u_first) / HW_GRID_M)) + 2
    u0 = u_first + HW_GRID_M * np.arange(n_grid)
    far0 = np.searchsorted(mid, u0 + FAR_M, side="left")  # first far bed per u0
    k_end = np.searchsorted(top, u0 + HW_GRID_M + t[-1], side="left")
    width = int(max(1, (k_end - far0).max(initial=0)))
    # moments[m, w, p]: sum over beds far0[m] .. far0[m] + w - 1 of h^2 / a^(p+1)
    moments = np.zeros((n_grid, width + 1, MOMENTS))
    idx = far0[:, None] + np.arange(width)[None, :]
    ok = idx < np.minimum(k_end, top.size)[:, None]
    idx = np.minimum(idx, top.size - 1)
    inv_a = np.where(ok, 1.0 / np.where(ok, mid[idx] - u0[:, None], 1.0), 0.0)
    term = sq[idx] * inv_a * ok
    for p in range(MOMENTS):
        moments[:, 1:, p] = np.cumsum(term, axis=1)
        term *= inv_a
    flat_mom = moments.reshape(-1, MOMENTS)
    rows_per = max(1, _CELLS // nt)
    for r0 in range(0, nz, rows_per):
        r1 = min(nz, r0 + rows_per)
        zc = z[r0:r1, None]
        u = zc - t[None, :]
        k = np.broadcast_to(k_row[r0:r1, None], u.shape)
        j = np.searchsorted(base, u, side="right")  # beds j.. have base > u
        n = k - j
        live = n > 0
        if not live.any():
            continue
        # SSF: range maximum of the thicknesses over j .. k-1
        lev = np.frexp(np.maximum(n, 1))[1] - 1
        jj = np.minimum(j, top.size - 1)
        kk = np.maximum(k - (1 << lev), 0)
        row_off = lev * top.size
        tmax[r0:r1] = np.where(live, np.maximum(flat_table[row_off + jj], flat_table[row_off + kk]), 0.0)
        # footwall terms: cumulative sum over the beds the block can reach, per row
        lo, hi = int(j.min()), int(k.max())
        f = sq[None, lo:hi] / np.maximum(np.abs(zc - mid[None, lo:hi]), half[None, lo:hi])
        cum = np.zeros((r1 - r0, hi - lo + 1))
        np.cumsum(f, axis=1, out=cum[:, 1:])
        jc = np.minimum(j, k) - lo
        fw = np.take_along_axis(cum, k - lo, axis=1) - np.take_along_axis(cum, jc, axis=1)
        # hanging-wall terms: exact for beds j .. near_end-1, moments for near_end .. k-1
        m = np.clip(np.rint((u - u_first) / HW_GRID_M).astype(np.intp), 0, n_grid - 1)
        d = u - u0[m]
        fm = far0[m]
        # bed j needs its exact term only when u lies inside it (else m - u > h/2)
        inside = top[np.minimum(j, top.size - 1)] <= u
        near_end = np.minimum(k, np.maximum(fm, j + inside))
        hw = np.zeros(u.shape)
        for step in range(int((near_end - j).max(initial=0))):
            i = j + step
            use = i < near_end
            ic = np.minimum(i, top.size - 1)
            g = sq[ic] / np.maximum(np.abs(mid[ic] - u), half[ic])
            hw += np.where(use, g, 0.0)
        a_idx = np.clip(near_end - fm, 0, width)
        b_idx = np.clip(k - fm, 0, width)
        far = live & (b_idx > a_idx)
        if far.any():
            cells = np.flatnonzero(far)
            at = m.ravel()[cells] * (width + 1)
            diff = flat_mom[at + b_idx.ravel()[cells]]
            sub = np.flatnonzero(a_idx.ravel()[cells] > 0)  # a = 0: nothing to take off
            diff[sub] -= flat_mom[at[sub] + a_idx.ravel()[cells[sub]]]
            dc = d.ravel()[cells]
            acc = diff[:, MOMENTS - 1].copy()
            for p in range(MOMENTS - 2, -1, -1):  # Horner in d
                acc *= dc
                acc += diff[:, p]
            hw.ravel()[cells] += acc
        csp[r0:r1] = np.where(live, fw + hw, 0.0)
    return tmax, csp
