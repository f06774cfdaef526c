"""Reservoir contacts across a fault at one throw: exact, vectorised over bed pairs.

At a fixed throw ``t`` a footwall bed ``[a, b]`` faces a hanging-wall bed ``[c, e]`` (the
hanging-wall well's depths, tied by ``shift_m`` = hanging-wall depth minus footwall depth
of the same horizon, as in :mod:`logprep.fault.twowell`) over footwall depths
``max(a, c - shift + t) <= z <= min(b, e - shift + t)``.  Along that contact the shale
gouge ratio ``SGR = 100 (C(z) - C(z - t)) / t`` (Yielding, Freeman & Needham 1997) is
piecewise linear in ``z``: its kinks are where an end of the slipped interval crosses a bed
boundary of the column it is taken from.  SGR is evaluated exactly at the contact ends and
at every kink, so its minimum over the contact and the leak-point column (convex per
linear piece, :func:`logprep.fault.envelope.leak_point_column_m`) are exact.  With one well
(``hw is fw``, ``shift_m = 0``) the slipped interval lies in single beds at both ends and
SGR is linear along the whole contact.

:func:`window_sgr_min_pct` is the vectorised form of the exact window extremes of
:func:`logprep.fault.juxtaposition.sand_windows` (the minimum SGR of each sand pair over all
throws up to a cap), used for the uncertainty of ``juxtapositions.csv``.

References
----------
1. Yielding, G., Freeman, B. and Needham, D.T. (1997). Quantitative fault seal prediction.
   AAPG Bulletin 81(6), 897-917.
2. Bretan, P., Yielding, G. and Jones, H. (2003). Using calibrated shale gouge ratio to
   estimate hydrocarbon column heights. AAPG Bulletin 87(3), 397-413.
"""

from __future__ import annotations

import itertools
from dataclasses import dataclass

import numpy as np

from logprep.fault.envelope import leak_point_column_m
from logprep.fault.juxtaposition import cumulative_clay, sgr_from_cumulative_pct
from logprep.model import Layers


@dataclass(frozen=True)
class Contacts:
    """Every touching footwall-bed / hanging-wall-bed pair at one throw.

    ``fw_layer``/``hw_layer`` index the two columns' layers; ``top_m``/``base_m`` are the
    contact's footwall depths; ``z_m`` (pairs x points, sorted, NaN-padded) are the
    contact ends and kinks, ``sgr_pct`` the SGR there (on Vsh: scale by the clay fraction
    of shale for clay).
    """

    fw_layer: np.ndarray
    hw_layer: np.ndarray
    top_m: np.ndarray
    base_m: np.ndarray
    z_m: np.ndarray
    sgr_pct: np.ndarray

    def __len__(self) -> int:
        return len(self.fw_layer)


def _slip_sgr_pct(fw: Layers, hw: Layers, shift_m: float, z, t: float, slip_source: str):
    parts = []
    if slip_source in ("footwall", "average"):
        parts.append(sgr_from_cumulative_pct(*cumulative_clay(fw), z, t))
    if slip_source in ("hangingwall", "average"):
        parts.append(sgr_from_cumulative_pct(*cumulative_clay(hw), z + shift_m, t))
    return parts[0] if len(parts) == 1 else 0.5 * (parts[0] + parts[1])


def contacts_at_throw(fw: Layers, hw: Layers, shift_m: float, throw_m: float, *,
                      slip_source: str = "footwall", lithology: str = "sand") -> Contacts:
    """The contacts of ``lithology`` beds across the fault at throw ``throw_m`` (m, > 0).

    Parameters
    ----------
    fw, hw : Layers
        Footwall and hanging-wall columns (the same object for a fault in one well).
    shift_m : float
        Hanging-wall depth minus footwall depth of the tie horizon (m; 0 for one well).
    throw_m : float
        Vertical throw of the tie horizon (m).
    slip_source : str
        Column the slipped interval is taken from (:data:`logprep.fault.twowell.SLIP_SOURCES`).
    """
    t = float(throw_m)
    fi = np.array([i for i, x in enumerate(fw.lithology) if x == lithology], dtype=np.intp)
    hi = np.array([i for i, x in enumerate(hw.lithology) if x == lithology], dtype=np.intp)
    F, H = np.meshgrid(fi, hi, indexing="ij")
    F, H = F.ravel(), H.ravel()
    top = np.maximum(fw.top_m[F], hw.top_m[H] - shift_m + t)
    base = np.minimum(fw.base_m[F], hw.base_m[H] - shift_m + t)
    keep = base > top
    F, H, top, base = F[keep], H[keep], top[keep], base[keep]
    kinks = np.concatenate((np.concatenate(([fw.top_m[0]], fw.base_m)) + t,
                            np.concatenate(([hw.top_m[0]], hw.base_m)) - shift_m))
    inside = (kinks[None, :] > top[:, None]) & (kinks[None, :] < base[:, None])
    z = np.concatenate((top[:, None], np.where(inside, kinks[None, :], np.nan), base[:, None]), axis=1)
    z = np.sort(z, axis=1)
    width = max(2, int(np.isfinite(z).sum(axis=1).max(initial=2)))
    z = z[:, :width]
    sgr = _slip_sgr_pct(fw, hw, shift_m, np.where(np.isfinite(z), z, top[:, None]), t, slip_source)
    sgr = np.where(np.isfinite(z), sgr, np.nan)
    return Contacts(fw_layer=F, hw_layer=H, top_m=top, base_m=base, z_m=z, sgr_pct=sgr)


def contact_sgr_min_pct(contacts: Contacts, clay_fraction: float = 1.0) -> np.ndarray:
    """Lowest SGR (%) over each contact, with clay = ``clay_fraction`` x Vsh; NaN where the
    slipped interval leaves the logged column everywhere on the contact."""
    s = contacts.sgr_pct * clay_fraction
    with np.errstate(all="ignore"):
        return np.where(np.isfinite(s).any(axis=1), np.nanmin(np.where(np.isfinite(s), s, np.inf), axis=1), np.nan)


def contact_free_water_m(contacts: Contacts, c, drho_kgm3, *, clay_fraction: float = 1.0,
                         sgr_scale_pct: float = 27.0) -> np.ndarray:
    """Deepest free-water level (m, footwall depth) each contact holds for each density
    contrast: ``min over the contact of z + FZP(z) / (drho g)`` with
    ``FZP = 10^(SGR / scale - C)`` (Bretan et al. 2003), exact per linear piece.

    ``c`` is the envelope constant per contact (or one value); returns shape
    ``(len(drho), len(contacts))``.  The column held is this minus the contact top.
    """
    z = contacts.z_m
    s = contacts.sgr_pct * clay_fraction
    z0, z1, s0, s1 = z[:, :-1], z[:, 1:], s[:, :-1], s[:, 1:]
    ok = np.isfinite(z0) & np.isfinite(z1) & np.isfinite(s0) & np.isfinite(s1)
    c = np.broadcast_to(np.asarray(c, float), (len(contacts),))[:, None]
    out = []
    for drho in np.atleast_1d(np.asarray(drho_kgm3, float)):
        col = leak_point_column_m(np.where(ok, z0, 0.0), np.where(ok, z1, 0.0), np.where(ok, s0, 0.0),
                                  np.where(ok, s1, 0.0), c, drho, sgr_scale_pct)
        fwl = np.where(ok, z0 + col, np.inf).min(axis=1, initial=np.inf)
        out.append(np.where(np.isfinite(fwl) | ~ok.any(axis=1), fwl, np.inf))
    return np.array(out, dtype=float).reshape(len(out), len(contacts))


def units_of_layers(layers: Layers, unit_top_m, unit_base_m, lithology: str = "sand") -> np.ndarray:
    """Reservoir unit of each layer: the unit interval a ``lithology`` layer overlaps most
    (-1 for other layers and for ones outside every unit)."""
    ut, ub = np.asarray(unit_top_m, float), np.asarray(unit_base_m, float)
    if ut.size == 0:
        return np.full(len(layers), -1, dtype=np.intp)
    ov = np.minimum(layers.base_m[:, None], ub[None, :]) - np.maximum(layers.top_m[:, None], ut[None, :])
    best = ov.argmax(axis=1)
    is_lith = np.array([x == lithology for x in layers.lithology], dtype=bool)
    return np.where(is_lith & (ov.max(axis=1) > 0), best, -1).astype(np.intp)


def group_min(keys, values, n_keys: int, fill=np.nan) -> np.ndarray:
    """Minimum of ``values`` (shape ``(n,)`` or ``(k, n)``) per key in ``[0, n_keys)``
    (keys < 0 left out); ``fill`` where a key has no value."""
    keys = np.asarray(keys, np.intp)
    v = np.atleast_2d(np.asarray(values, float))
    out = np.full((v.shape[0], n_keys), np.inf)
    ok = keys >= 0
    for k in range(v.shape[0]):
        np.minimum.at(out[k], keys[ok], v[k, ok])
    has = np.zeros(n_keys, dtype=bool)
    has[keys[ok]] = True
    out[:, ~has] = fill
    return out if np.ndim(values) > 1 else out[0]


# ----------------------------------------------------------------------------- all throws
_LINES = [(1, 0, "a"), (1, 0, "b"), (1, -1, "c"), (1, -1, "e"), (0, 1, "zero"), (0, 1, "cap")]


def window_sgr_min_pct(layers: Layers, throw_max_m: float, lithology: str = "sand"):
    """Every ``lithology`` pair touching at a throw in ``(0, throw_max_m]`` with its exact
    minimum SGR (%) over the contact area, as :func:`logprep.fault.juxtaposition.sand_windows`
    computes it, vectorised over the pairs.

    Returns ``(footwall_layer, hangingwall_layer, sgr_min_pct)``.  Within a pair's contact
    area SGR is linear-fractional, so its extremes lie at the vertices of the polygon cut
    by the lines ``z = a, b``, ``z - t = c, e``, ``t = 0, cap``; near ``t = 0`` the limits
    100 Vsh of either bed bound it, and a bed against itself has 100 Vsh everywhere.
    """
    idx = np.array([i for i, x in enumerate(layers.lithology) if x == lithology], dtype=np.intp)
    F, H = (m.ravel() for m in np.meshgrid(idx, idx, indexing="ij"))
    _, clay = cumulative_clay(layers)
    a, b, c, e = layers.top_m[F], layers.base_m[F], layers.top_m[H], layers.base_m[H]
    lo = np.maximum(a - e, 0.0)
    cap = np.minimum(b - c, float(throw_max_m))
    keep = lo < cap
    F, H, a, b, c, e, cap = (x[keep] for x in (F, H, a, b, c, e, cap))
    vf, vh, ca, cc = layers.vsh[F], layers.vsh[H], clay[F], clay[H]
    g = {"a": a, "b": b, "c": c, "e": e, "zero": np.zeros_like(a), "cap": cap}
    tol = 1e-9 * np.maximum(np.maximum(1.0, np.abs(b)), np.abs(cap))
    best = np.full(a.shape, np.inf)
    for (a1, b1, k1), (a2, b2, k2) in itertools.combinations(_LINES, 2):
        det = a1 * b2 - a2 * b1
        if det == 0:
            continue
        g1, g2 = g[k1], g[k2]
        z = (g1 * b2 - g2 * b1) / det
        t = (a1 * g2 - a2 * g1) / det
        ok = ((a - tol <= z) & (z <= b + tol) & (c - tol <= z - t) & (z - t <= e + tol)
              & (-tol <= t) & (t <= cap + tol))
        small = t <= tol
        with np.errstate(all="ignore"):
            val = 100.0 * (ca + vf * (z - a) - cc - vh * (z - t - c)) / t
        val = np.where(small, np.minimum(100.0 * vf, 100.0 * vh), val)
        best = np.where(ok, np.minimum(best, val), best)
    best = np.where(F == H, 100.0 * vf, best)
    return F, H, best
