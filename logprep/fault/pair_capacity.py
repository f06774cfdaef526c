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

from logprep.fault import faultrock
from logprep.fault.closure import with_closure
from logprep.fault.capacity import (
    CAPACITY_COLUMNS, CapacityParams, _shallowest_contact_m, contact_ends, verdict, window_throws,
)
from logprep.fault.envelope import (
    FLUIDS, co2_density_kgm3, envelope_c, fault_zone_pressure_bar, geothermal_temperature_k,
    hydrostatic_pressure_pa, leak_point_column_m,
)
from logprep.fault.twowell import two_well_sgr_pct
from logprep.model import Layers
from logprep.units import LENGTH_UNITS


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


def pair_window_columns_m(fw: Layers, hw: Layers, shift_m: float, w_fw, c: float, drho_kgm3,
                          throw_m, slip_source: str, sgr_scale_pct: float):
    """Leak-point column (m, from the contact top) of a pair window at each throw for each
    density contrast, shape ``(len(drho), len(throw))``; ``w_fw`` in the footwall frame."""
    top, base, _, _ = contact_ends(w_fw, throw_m)
    drho = np.atleast_1d(np.asarray(drho_kgm3, float))
    out = np.full((drho.size, len(top)), np.inf)
    for j, (t, z0, z1) in enumerate(zip(np.asarray(throw_m, float), top, base)):
        br = contact_breaks_m(fw, hw, shift_m, t, slip_source)
        zs = np.unique(np.concatenate(([z0, z1], br[(br > z0) & (br < z1)])))
        if zs.size == 1:  # the sands touch at one point at this throw
            zs = np.array([z0, z0])
        s = two_well_sgr_pct(fw, hw, shift_m, zs, np.full(zs.size, t), slip_source)
        if not np.isfinite(s).all():
            continue
        col = leak_point_column_m(zs[:-1, None], zs[1:, None], s[:-1, None], s[1:, None], c,
                                  drho[None, :], sgr_scale_pct)
        out[:, j] = (col + (zs[:-1, None] - z0)).min(axis=0)
    return out


def _pair_window_capacity(fw, hw, shift_m, w, p: CapacityParams, datum_m, co2_rho, slip_source):
    w_fw = footwall_frame(w, shift_m)
    t = window_throws(w_fw, p.n_throws)
    burial = p.max_burial_m if p.max_burial_m is not None else max(
        _shallowest_contact_m(w_fw) - datum_m + p.uplift_m, 0.0)
    c = float(envelope_c(burial, p.class_bounds_m, p.class_c))
    drho = [p.rho_brine_kgm3 - r for r in (p.rho_oil_kgm3, p.rho_gas_kgm3, co2_rho)]
    drho[2] /= p.co2_pressure_factor  # CO2-brine capillary pressure (logprep.fault.co2)
    top, base, _, _ = contact_ends(w_fw, t)
    # columns from the crest of the trapping (footwall) sand, as for one well
    cols = (pair_window_columns_m(fw, hw, shift_m, w_fw, c, drho, t, slip_source, p.sgr_scale_pct)
            + (top - float(w_fw["footwall_top_m"]))[None, :]).min(axis=1)
    s_ends = two_well_sgr_pct(fw, hw, shift_m, np.concatenate([top, base]), np.concatenate([t, t]),
                              slip_source)
    tt = np.concatenate([t, t])
    d_m = float(np.max(tt[s_ends <= np.nanmin(s_ends) + 1e-9])) if np.isfinite(s_ends).any() \
        else float(t[-1])
    sgr_frac = float(w["sgr_min_pct"]) / 100.0
    tf = float(faultrock.fault_rock_thickness_m(d_m))
    k_m = float(faultrock.manzocchi_permeability_md(sgr_frac, d_m))
    z_f = p.faulting_depth_m if p.faulting_depth_m is not None else burial
    return {
        "burial_depth_m": burial,
        "fzp_bar": float(fault_zone_pressure_bar(w["sgr_min_pct"], burial, sgr_scale_pct=p.sgr_scale_pct,
                                                 class_bounds_m=p.class_bounds_m, class_c=p.class_c)),
        "column_oil_m": cols[0], "column_gas_m": cols[1], "column_co2_m": cols[2],
        "verdict": str(verdict(w["sgr_min_pct"], p.leak_below_pct, p.seal_from_pct)),
        "co2_density_kgm3": co2_rho,
        "fault_rock_throw_m": d_m, "fault_rock_thickness_m": tf,
        "fault_rock_perm_md": k_m,
        "fault_rock_perm_sperrevik_md": float(faultrock.sperrevik_permeability_md(sgr_frac, burial, z_f)),
        "trans_multiplier": float(faultrock.transmissibility_multiplier(tf, k_m, p.matrix_perm_md,
                                                                        p.cell_length_m)),
    }


def pair_seal_capacity_table(windows: pd.DataFrame, fw: Layers, hw: Layers, shift_m: float,
                             params: CapacityParams = CapacityParams(), *, datum_m: float = 0.0,
                             slip_source: str = "footwall", length_unit: str = "m") -> pd.DataFrame:
    """The pair ``windows`` (:func:`logprep.fault.twowell.two_well_windows`) with
    :data:`~logprep.fault.capacity.CAPACITY_COLUMNS` added, as one well's are.

    ``datum_m`` is the footwall well's elevation of its depth reference above sea level
    (burial, pressure and temperature are taken on the footwall well's depths, where the
    contacts are).
    """
    out = windows.copy()
    rows = []
    for _, w in windows.iterrows():
        rho = params.rho_co2_kgm3
        if params.co2_density_mode == "eos":
            z_ss = _shallowest_contact_m(footwall_frame(w, shift_m)) - datum_m
            rho = float(co2_density_kgm3(
                hydrostatic_pressure_pa(z_ss, params.rho_brine_kgm3),
                geothermal_temperature_k(z_ss, params.surface_temp_c, params.geothermal_gradient_c_per_km)))
        rows.append(_pair_window_capacity(fw, hw, shift_m, w, params, datum_m, rho, slip_source))
    extra = pd.DataFrame(rows, columns=CAPACITY_COLUMNS, index=windows.index)
    for col in CAPACITY_COLUMNS:
        out[col] = extra[col] if len(windows) else pd.Series(dtype=object if col == "verdict" else float)
    if length_unit == "ft":
        for fluid in FLUIDS:
            out[f"column_{fluid}_ft"] = out[f"column_{fluid}_m"] / LENGTH_UNITS["ft"]
    return with_closure(out, params.closure_m, unconstrained_column_m=params.unconstrained_column_m)
