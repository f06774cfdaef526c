"""Seal capacity of the windows of a well pair (footwall well, hanging-wall well): the same
columns as :func:`logprep.fault.capacity.seal_capacity_table` adds to one well's windows,
so a pair's ``juxtapositions.csv`` and sheet carry verdicts and column heights too.

Across two columns the SGR along a contact at a fixed throw is no longer linear (the
slipped interval's far end crosses bed boundaries of the column it is taken from, see
:mod:`logprep.fault.twowell`), so each contact is cut at those crossings into pieces on
which SGR is linear, and the leak-point column is the least over the pieces
(:func:`logprep.fault.envelope.leak_point_column_m` is exact on each).  Verdict words and
thresholds are those of one well (:data:`logprep.fault.capacity.VERDICTS`).
"""

from __future__ import annotations

import numpy as np
import pandas as pd

from logprep.fault.closure import with_closure
from logprep.fault.burial import burial_depth_m
from logprep.fault.clayfraction import clay_layers
from logprep.fault.capacity import (
    _TEXT_COLUMNS, CAPACITY_COLUMNS, CapacityParams, _co2_density, capacity_row, _shallowest_contact_m, contact_ends,
    verdict, window_throws,
)
from logprep.fault.envelope import FLUIDS, envelope_c, leak_point_m
from logprep.fault.twowell import two_well_sgr_pct
from logprep.model import Layers
from logprep.units import LENGTH_UNITS


def pair_clay_layers(fw: Layers, hw: Layers, field) -> tuple[Layers, Layers]:
    """Both wells' blocked columns with ``vsh`` replaced by the clay fraction of
    ``field`` (a :class:`~logprep.fault.settings.FieldSettings`), as one well's fault stage
    does (:mod:`logprep.fault.clayfraction`): what pair SGR, columns and fault rock read."""
    return tuple(clay_layers(x, field.clay_conversion, field.shale_clay_fraction) for x in (fw, hw))


def footwall_frame(w, shift_m: float) -> pd.Series:
    """A pair window with its hanging-wall depths moved into the footwall well's frame
    (``y - shift``), where throw is ``z - y`` as for one well."""
    w = w.copy()
    w["hangingwall_top_m"] = w["hangingwall_top_m"] - shift_m
    w["hangingwall_base_m"] = w["hangingwall_base_m"] - shift_m
    return w


def contact_breaks_m(fw: Layers, hw: Layers, shift_m: float, throw_m: float, slip_source: str):
    """Footwall depths at which SGR along a contact at ``throw_m`` changes slope: where the
    slipped interval's far end meets a bed boundary of the column it is taken from."""
    out = []
    if slip_source in ("footwall", "average"):
        out.append(np.concatenate(([fw.top_m[0]], fw.base_m)) + throw_m)   # z - t on a boundary
    if slip_source in ("hangingwall", "average"):
        out.append(np.concatenate(([hw.top_m[0]], hw.base_m)) - shift_m)   # z + shift on one
    return np.concatenate(out)


def pair_leak_points(fw: Layers, hw: Layers, shift_m: float, w_fw, c: float, drho_kgm3, throw_m,
                     slip_source: str, sgr_scale_pct: float):
    """``(column_m, leak_depth_m, leak_sgr_pct)`` of a pair window at each throw for each
    density contrast, each of shape ``(len(drho), len(throw))``: the leak-point column from
    the contact top, the footwall depth of the leak point and the SGR there (``w_fw`` in the
    footwall frame).  The contact is cut where SGR changes slope, and each piece is solved
    exactly by :func:`logprep.fault.envelope.leak_point_m`."""
    top, base, _, _ = contact_ends(w_fw, throw_m)
    drho = np.atleast_1d(np.asarray(drho_kgm3, float))
    out = np.full((drho.size, len(top)), np.inf)
    z_leak = np.full(out.shape, np.nan)
    s_leak = np.full(out.shape, np.nan)
    for j, (t, z0, z1) in enumerate(zip(np.asarray(throw_m, float), top, base)):
        br = contact_breaks_m(fw, hw, shift_m, t, slip_source)
        zs = np.unique(np.concatenate(([z0, z1], br[(br > z0) & (br < z1)])))
        if zs.size == 1:  # the sands touch at one point at this throw
            zs = np.array([z0, z0])
        s = two_well_sgr_pct(fw, hw, shift_m, zs, np.full(zs.size, t), slip_source)
        if not np.isfinite(s).all():
            continue
        col, where = leak_point_m(zs[:-1, None], zs[1:, None], s[:-1, None], s[1:, None], c,
                                  drho[None, :], sgr_scale_pct)
        from_top = col + (zs[:-1, None] - z0)
        i = np.argmin(from_top, axis=0)  # the piece holding the least column, per fluid
        f = np.arange(drho.size)
        out[:, j] = from_top[i, f]
        z_leak[:, j] = where[i, f]
        span = zs[1:] - zs[:-1]
        k = np.where(span > 0, (s[1:] - s[:-1]) / np.where(span > 0, span, 1.0), 0.0)
        s_leak[:, j] = s[:-1][i] + k[i] * (z_leak[:, j] - zs[:-1][i])
    return out, z_leak, s_leak


def pair_window_columns_m(fw: Layers, hw: Layers, shift_m: float, w_fw, c: float, drho_kgm3,
                          throw_m, slip_source: str, sgr_scale_pct: float):
    """Leak-point column (m, from the contact top) of a pair window at each throw for each
    density contrast, shape ``(len(drho), len(throw))``; ``w_fw`` in the footwall frame."""
    return pair_leak_points(fw, hw, shift_m, w_fw, c, drho_kgm3, throw_m, slip_source, sgr_scale_pct)[0]


def _pair_window_capacity(fw, hw, shift_m, w, p: CapacityParams, datum_m, surface_m, slip_source):
    """One pair window's :data:`~logprep.fault.capacity.CAPACITY_COLUMNS`, with the meanings
    of :func:`logprep.fault.capacity.seal_capacity_table` (depths in the footwall well)."""
    w_fw = footwall_frame(w, shift_m)
    t = window_throws(w_fw, p.n_throws)
    burial = p.max_burial_m if p.max_burial_m is not None else float(
        burial_depth_m(_shallowest_contact_m(w_fw) - datum_m, surface_m, p.uplift_m))
    c = float(envelope_c(burial, p.class_bounds_m, p.class_c))
    co2_rho = _co2_density(w_fw, p, datum_m, surface_m)
    drho = np.array([p.rho_brine_kgm3 - r for r in (p.rho_oil_kgm3, p.rho_gas_kgm3, co2_rho)])
    drho[2] /= p.co2_pressure_factor  # CO2-brine capillary pressure (logprep.fault.co2)
    top, base, _, _ = contact_ends(w_fw, t)
    col_t, z_leak, s_leak = pair_leak_points(fw, hw, shift_m, w_fw, c, drho, t, slip_source, p.sgr_scale_pct)
    s_ends = two_well_sgr_pct(fw, hw, shift_m, np.concatenate([top, base]), np.concatenate([t, t]),
                              slip_source)
    tt = np.concatenate([t, t])
    d_m = float(np.max(tt[s_ends <= np.nanmin(s_ends) + 1e-9])) if np.isfinite(s_ends).any() \
        else float(t[-1])
    word = str(verdict(w["sgr_min_pct"], p.leak_below_pct, p.seal_from_pct))
    return capacity_row(w_fw, p, burial=burial, c=c, co2_rho=co2_rho, throw_m=t, top_m=top,
                        col_t=col_t, z_leak=z_leak, s_leak_oil=s_leak[0], d_m=d_m, word=word)


def pair_seal_capacity_table(windows: pd.DataFrame, fw: Layers, hw: Layers, shift_m: float,
                             params: CapacityParams = CapacityParams(), *, datum_m: float = 0.0,
                             surface_elevation_m: float = 0.0, slip_source: str = "footwall",
                             length_unit: str = "m") -> pd.DataFrame:
    """The pair ``windows`` (:func:`logprep.fault.twowell.two_well_windows`) with
    :data:`~logprep.fault.capacity.CAPACITY_COLUMNS` and the closure columns added, with
    the meanings of one well's (:func:`logprep.fault.capacity.seal_capacity_table`).

    Depths of the capacity columns (``crest_depth_m``, ``leak_depth_m``) are the footwall
    well's, where the contacts are; ``datum_m`` and ``surface_elevation_m`` are the footwall
    well's elevation of its depth reference and of its sea floor or ground (m above sea
    level): burial, pressure and temperature are taken there.
    """
    out = windows.copy()
    rows = [_pair_window_capacity(fw, hw, shift_m, w, params, datum_m, surface_elevation_m, slip_source)
            for _, w in windows.iterrows()]
    extra = pd.DataFrame(rows, columns=CAPACITY_COLUMNS, index=windows.index)
    for col in CAPACITY_COLUMNS:
        out[col] = extra[col] if len(windows) else pd.Series(dtype=object if col in _TEXT_COLUMNS else float)
    if length_unit == "ft":
        for fluid in FLUIDS:
            out[f"column_{fluid}_ft"] = out[f"column_{fluid}_m"] / LENGTH_UNITS["ft"]
    return with_closure(out, params.closure_m, unconstrained_column_m=params.unconstrained_column_m)
