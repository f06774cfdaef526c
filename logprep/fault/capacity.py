"""Seal capacity of the sand-sand windows: verdicts, fault-zone pressure and leak-point
column heights over each window's contact, and fault-rock properties.

:func:`seal_capacity_table` adds the seal-capacity columns to the windows of
:func:`logprep.fault.juxtaposition.sand_windows`; the envelope, column and fluid functions
it uses are in :mod:`logprep.fault.envelope` (method and references there).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
import pandas as pd

from logprep.errors import SettingsError
from logprep.fault import faultrock
from logprep.fault.envelope import (
    depth_datum,
    CO2_DENSITY_MODES, ENVELOPE_CLASS_BOUNDS_M, ENVELOPE_CLASS_C, ENVELOPE_SGR_SCALE_PCT, FLUIDS,
    co2_density_kgm3, envelope_c, fault_zone_pressure_bar, geothermal_temperature_k,
    hydrostatic_pressure_pa, leak_point_column_m, leak_point_m,
)
from logprep.fault.burial import burial_depth_m, pressure_depth_m, surface_elevation_m
from logprep.fault.burial import describe as burial_describe
from logprep.fault.closure import UNCONSTRAINED_COLUMN_M, with_closure
from logprep.fault.closure import describe as closure_describe
from logprep.fault.geometry import DEFAULT_FAULT_DIP_DEG, displacement_m
from logprep.fault.juxtaposition import cumulative_clay
from logprep.model import Layers, WellLog
from logprep.units import LENGTH_UNITS

VERDICTS = ("leak", "uncertain", "seal")
"""Screening verdict words, from the window's minimum SGR against two thresholds."""
SELF_VERDICT = "self"
"""Verdict word of a sand against itself: no fault seal is screened there (the sand
communicates with itself across the fault); such rows stay out of the headline counts."""

CAPACITY_COLUMNS = [
    "burial_depth_m", "fzp_bar", "column_oil_m", "column_gas_m", "column_co2_m", "verdict",
    "co2_density_kgm3", "fault_rock_throw_m", "fault_rock_thickness_m",
    "fault_rock_perm_md", "fault_rock_perm_sperrevik_md", "trans_multiplier",
    "fault_rock_outside_calibration", "fault_rock_displacement_m",
    "crest_depth_m", "leak_throw_m", "leak_depth_m", "leak_sgr_pct", "leak_fzp_bar",
]
"""Columns added to ``juxtapositions.csv`` (after the window columns), in order."""
_TEXT_COLUMNS = ("verdict", "fault_rock_outside_calibration")


# ----------------------------------------------------------------------------- windows
@dataclass(frozen=True)
class CapacityParams:
    """Everything the seal-capacity step needs, in SI-ish units (m, kg/m3, %, mD)."""

    rho_brine_kgm3: float = 1050.0
    rho_oil_kgm3: float = 750.0
    rho_gas_kgm3: float = 250.0
    rho_co2_kgm3: float = 700.0
    co2_density_mode: str = "eos"
    surface_temp_c: float = 10.0
    geothermal_gradient_c_per_km: float = 30.0
    max_burial_m: float | None = None
    sgr_scale_pct: float = ENVELOPE_SGR_SCALE_PCT
    class_bounds_m: tuple = ENVELOPE_CLASS_BOUNDS_M
    class_c: tuple = ENVELOPE_CLASS_C
    leak_below_pct: float = 15.0
    seal_from_pct: float = 20.0
    cell_length_m: float = 100.0
    matrix_perm_md: float = 100.0
    faulting_depth_m: float | None = None
    n_throws: int = 61
    water_depth_m: float | None = None
    ground_elevation_m: float | None = None
    uplift_m: float = 0.0
    closure_m: float | None = None
    closure_source: str = "--closure"
    unconstrained_column_m: float = UNCONSTRAINED_COLUMN_M
    co2_pressure_factor: float = 1.0
    fault_dip_deg: float = DEFAULT_FAULT_DIP_DEG


VERDICT_SGR_DECIMALS = 6
"""SGR is compared with the verdict thresholds after rounding to this many decimals of a
per cent (1e-6 %, far below any meaningful SGR difference and far above floating-point
noise), so that a bed of Vsh 0.15, whose mean can come out as 14.999999999999996 %, is
``uncertain`` at a 15 % leak threshold, not ``leak`` by rounding noise."""


def verdict(sgr_min_pct, leak_below_pct: float, seal_from_pct: float) -> np.ndarray:
    """``leak`` where SGR < ``leak_below_pct``, ``seal`` where SGR >= ``seal_from_pct``,
    ``uncertain`` between.  About 15-20 % separates leaking from sealing faults in many
    calibrations (Yielding et al. 1997; Yielding 2002); the thresholds are settings.
    SGR is rounded to :data:`VERDICT_SGR_DECIMALS` before the comparison."""
    s = np.round(np.asarray(sgr_min_pct, float), VERDICT_SGR_DECIMALS)
    return np.where(s < leak_below_pct, VERDICTS[0], np.where(s >= seal_from_pct, VERDICTS[2], VERDICTS[1]))


def window_throws(w, n: int = 61) -> np.ndarray:
    """Throws (m) at which a window is evaluated: ``n`` evenly spaced from its minimum to
    its maximum throw plus the throws where an end of the contact changes bed edge (the
    corners of the contact area), so that extremes of SGR are met exactly.  Zero throw
    is replaced by 1 mm (SGR is a limit there)."""
    lo, hi = float(w["throw_min_m"]), float(w["throw_max_m"])
    corners = [w["footwall_top_m"] - w["hangingwall_top_m"], w["footwall_base_m"] - w["hangingwall_base_m"]]
    t = np.concatenate([np.linspace(lo, hi, n), [c for c in corners if lo < c < hi]])
    return np.unique(np.maximum(t, min(1e-3, 0.5 * (hi - lo))))


def contact_ends(w, throw_m):
    """Top and base (m, footwall depth) of a window's contact at each throw, and the
    hanging-wall depths facing them (``top - throw``, ``base - throw``, computed from the
    bed edges so that they never stray outside the beds by rounding)."""
    t = np.asarray(throw_m, float)
    top_h = np.maximum(w["footwall_top_m"] - t, w["hangingwall_top_m"])
    base_h = np.minimum(w["footwall_base_m"] - t, w["hangingwall_base_m"])
    top = np.maximum(w["footwall_top_m"], w["hangingwall_top_m"] + t)
    base = np.minimum(w["footwall_base_m"], w["hangingwall_base_m"] + t)
    base, base_h = np.maximum(base, top), np.maximum(base_h, top_h)
    return top, base, top_h, base_h


_LAST_CLAY: tuple = (None, None)


def _cumulative_clay_of(layers: Layers):
    """:func:`logprep.fault.juxtaposition.cumulative_clay` of ``layers``, remembered for
    the last column (its arrays are read-only): every window of a well asks for it several
    times, and recomputing it per window made the capacity step grow as windows x layers."""
    global _LAST_CLAY
    cached = _LAST_CLAY  # one read: safe if another thread replaces it meanwhile
    if cached[0] is not layers:
        cached = (layers, cumulative_clay(layers))
        _LAST_CLAY = cached
    return cached[1]


def sgr_between_pct(layers: Layers, footwall_depth_m, hangingwall_depth_m):
    """SGR (%) of the slipped interval between a hanging-wall depth and the footwall depth
    facing it: ``100 (C(z) - C(z - t)) / t`` (Yielding et al. 1997), the same value as
    :func:`logprep.fault.juxtaposition.sgr_layered_pct` at throw ``t = z_fw - z_hw`` but with the
    two depths given, so a point on a bed edge stays on it."""
    bounds, clay = _cumulative_clay_of(layers)
    z, zh = np.asarray(footwall_depth_m, float), np.asarray(hangingwall_depth_m, float)
    return 100.0 * (np.interp(z, bounds, clay) - np.interp(zh, bounds, clay)) / (z - zh)


def window_columns_m(layers: Layers, w, c: float, drho_kgm3, throw_m,
                     sgr_scale_pct: float = ENVELOPE_SGR_SCALE_PCT) -> np.ndarray:
    """Leak-point column (m) of a window at each throw for each density contrast:
    shape ``(len(drho), len(throw))``.  SGR is exact at the contact ends (blocked layers)
    and linear between them at a fixed throw."""
    top, base, top_h, base_h = contact_ends(w, throw_m)
    s_top = sgr_between_pct(layers, top, top_h)
    s_base = sgr_between_pct(layers, base, base_h)
    drho = np.atleast_1d(np.asarray(drho_kgm3, float))[:, None]
    return leak_point_column_m(top, base, s_top, s_base, c, drho, sgr_scale_pct)


def _shallowest_contact_m(w) -> float:
    """Shallowest footwall depth (m, as logged) at which a window's sands touch: the
    contact top at the window's smallest throw."""
    return float(max(w["footwall_top_m"], w["hangingwall_top_m"] + w["throw_min_m"]))


def _window_capacity(layers: Layers, w, p: CapacityParams, datum_m: float, surface_m: float,
                     co2_rho: float) -> dict:
    t = window_throws(w, p.n_throws)
    top, base, top_h, base_h = contact_ends(w, t)
    shallow_ss = _shallowest_contact_m(w) - datum_m
    burial = p.max_burial_m if p.max_burial_m is not None else float(
        burial_depth_m(shallow_ss, surface_m, p.uplift_m))
    c = float(envelope_c(burial, p.class_bounds_m, p.class_c))
    # CO2: the calibration's hydrocarbon-water pressure x the capillary factor, i.e. the
    # density contrast divided by it (h = factor P / (drho g))
    drho = np.array([p.rho_brine_kgm3 - r for r in (p.rho_oil_kgm3, p.rho_gas_kgm3, co2_rho)])
    drho[2] /= p.co2_pressure_factor
    s_top = sgr_between_pct(layers, top, top_h)
    s_base = sgr_between_pct(layers, base, base_h)
    col_t, z_leak = leak_point_m(top, base, s_top, s_base, c, drho[:, None], p.sgr_scale_pct)
    span = base - top
    k = np.where(span > 0, (s_base - s_top) / np.where(span > 0, span, 1.0), 0.0)
    s_leak_oil = s_top + k * (z_leak[0] - top)
    # the fault rock at the window's lowest SGR (met at a contact end of a sampled throw)
    # (ties, as for a sand against itself, go to the largest throw: a real fault's rock)
    tt = np.concatenate([t, t])
    s_ends = np.concatenate([s_top, s_base])
    lowest = s_ends <= np.nanmin(s_ends) + 1e-9
    d_m = float(np.max(tt[lowest]))
    word = SELF_VERDICT if bool(w.get("self_juxtaposed", False)) else str(
        verdict(w["sgr_min_pct"], p.leak_below_pct, p.seal_from_pct))
    return capacity_row(w, p, burial=burial, c=c, co2_rho=co2_rho, throw_m=t, top_m=top,
                        col_t=col_t, z_leak=z_leak, s_leak_oil=s_leak_oil, d_m=d_m, word=word)


def capacity_row(w, p: CapacityParams, *, burial: float, c: float, co2_rho: float, throw_m, top_m,
                 col_t, z_leak, s_leak_oil, d_m: float, word: str) -> dict:
    """One window's :data:`CAPACITY_COLUMNS` from its leak points, shared by one well's
    windows and a pair's (:mod:`logprep.fault.pair_capacity`).

    ``col_t`` and ``z_leak`` (shape ``(3, len(throw_m))``, oil, gas, CO2) are the leak-point
    columns from the contact top ``top_m`` (m) and the leak depths; ``s_leak_oil`` the SGR
    (%) at the oil leak point of each throw; ``d_m`` the throw (m) of the fault rock at the
    window's lowest SGR; ``burial`` (m) and ``c`` the envelope's burial and constant.
    Columns are measured from the crest of the trapping (footwall) sand."""
    crest = float(w["footwall_top_m"])
    from_crest = col_t + (top_m - crest)[None, :]
    j = np.argmin(from_crest, axis=1)
    cols = from_crest[np.arange(3), j]
    jo = int(j[0])
    leak_sgr = float(s_leak_oil[jo])
    disp = float(displacement_m(d_m, p.fault_dip_deg))
    sgr_frac = float(np.clip(w["sgr_min_pct"] / 100.0, 0.0, 1.0))
    tf = float(faultrock.fault_rock_thickness_m(disp))
    k_m = float(faultrock.manzocchi_permeability_md(sgr_frac, disp))
    z_f = p.faulting_depth_m if p.faulting_depth_m is not None else burial
    k_s = float(faultrock.sperrevik_permeability_md(sgr_frac, burial, z_f))
    tm = float(faultrock.transmissibility_multiplier(tf, k_m, p.matrix_perm_md, p.cell_length_m))
    return {
        "burial_depth_m": burial,
        "fzp_bar": float(fault_zone_pressure_bar(w["sgr_min_pct"], burial, sgr_scale_pct=p.sgr_scale_pct,
                                                 class_bounds_m=p.class_bounds_m, class_c=p.class_c)),
        "column_oil_m": cols[0], "column_gas_m": cols[1], "column_co2_m": cols[2],
        "verdict": word,
        "co2_density_kgm3": co2_rho,
        "fault_rock_throw_m": d_m, "fault_rock_thickness_m": tf,
        "fault_rock_perm_md": k_m, "fault_rock_perm_sperrevik_md": k_s,
        "trans_multiplier": tm,
        "fault_rock_outside_calibration": faultrock.calibration_note(
            sgr_frac, disp, burial, k_s, k_m, p.matrix_perm_md),
        "fault_rock_displacement_m": disp,
        "crest_depth_m": crest, "leak_throw_m": float(throw_m[jo]), "leak_depth_m": float(z_leak[0, jo]),
        "leak_sgr_pct": leak_sgr,
        "leak_fzp_bar": float(10.0 ** (leak_sgr / p.sgr_scale_pct - c)),
    }


def _co2_density(w, params: CapacityParams, datum_m: float, surface_m: float) -> float:
    """CO2 density (kg/m3) at a window's shallowest contact: fixed, or by the equation of
    state at the hydrostatic pressure (water column from sea level offshore, from the
    ground onshore) and the temperature below the sea floor or ground."""
    if params.co2_density_mode == "fixed":
        return params.rho_co2_kgm3
    if params.co2_density_mode != "eos":
        raise SettingsError(f"unknown CO2 density mode {params.co2_density_mode!r}; use one of {', '.join(CO2_DENSITY_MODES)}")
    z_ss = _shallowest_contact_m(w) - datum_m
    p_pa = hydrostatic_pressure_pa(pressure_depth_m(z_ss, surface_m), params.rho_brine_kgm3)
    below = float(burial_depth_m(z_ss, surface_m))
    t_k = geothermal_temperature_k(below, params.surface_temp_c, params.geothermal_gradient_c_per_km)
    return float(co2_density_kgm3(p_pa, t_k))


def seal_capacity_table(windows: pd.DataFrame, layers: Layers, params: CapacityParams = CapacityParams(),
                        *, datum_m: float = 0.0, surface_elevation_m: float = 0.0,
                        length_unit: str = "m") -> pd.DataFrame:
    """``windows`` with :data:`CAPACITY_COLUMNS` and the closure columns of
    :data:`logprep.fault.closure.CLOSURE_COLUMNS` added (and ``column_*_ft`` when
    ``length_unit`` is ``ft``).

    Parameters
    ----------
    windows : DataFrame
        From :func:`logprep.fault.juxtaposition.sand_windows`.
    layers : Layers
        The blocked column the windows come from (depths as logged, m; ``vsh`` the clay
        fraction that enters SGR).
    params : CapacityParams
        Densities, envelope, burial, thresholds, closure and fault-rock inputs.
    datum_m : float
        Elevation of the depth reference above sea level (m); logged depth minus it is the
        depth below sea level.  0 uses the depth as logged.
    surface_elevation_m : float
        Elevation of the sea floor (minus the water depth) or ground (m above sea level);
        burial is measured below it (:mod:`logprep.fault.burial`).

    Notes
    -----
    Per window: ``burial_depth_m`` is ``params.max_burial_m`` when given, otherwise the
    depth below the sea floor or ground of the shallowest contact point over the window
    plus the uplift (the shallower class is the weaker envelope, so this errs on the side
    of leaking); ``fzp_bar`` is the envelope at the window's minimum SGR; ``column_*_m``
    are the smallest leak-point columns over the window's throws, measured from the crest
    of the trapping sand, the top of the footwall sand (``crest_depth_m``), then capped by
    the closure (:mod:`logprep.fault.closure`).  The oil leak point is ``leak_depth_m`` at
    throw ``leak_throw_m`` with SGR ``leak_sgr_pct`` and pressure ``leak_fzp_bar``, so that
    ``column_oil_m = leak_depth_m + leak_fzp_bar 1e5 / ((rho_w - rho_oil) g) -
    crest_depth_m`` where the fault rock limits it.  The fault rock is at the point of
    minimum SGR with the displacement along the fault (throw / sin(fault dip)).
    """
    if length_unit not in LENGTH_UNITS:
        raise SettingsError(f"unknown length unit {length_unit!r}; use one of {', '.join(LENGTH_UNITS)}")
    out = windows.copy()
    # plain dicts per row: a pandas row lookup costs more than the science of a window
    rows = [_window_capacity(layers, w, params, datum_m, surface_elevation_m,
                             _co2_density(w, params, datum_m, surface_elevation_m))
            for w in windows.to_dict("records")]
    extra = pd.DataFrame(rows, columns=CAPACITY_COLUMNS, index=windows.index)
    for col in CAPACITY_COLUMNS:
        out[col] = extra[col] if len(windows) else pd.Series(dtype=object if col in _TEXT_COLUMNS else float)
    if length_unit == "ft":
        for fluid in FLUIDS:
            out[f"column_{fluid}_ft"] = out[f"column_{fluid}_m"] / LENGTH_UNITS["ft"]
    return with_closure(out, params.closure_m, unconstrained_column_m=params.unconstrained_column_m,
                        no_seal=(VERDICTS[0], SELF_VERDICT))


def well_reference(well: WellLog, params: CapacityParams) -> tuple[float | None, str, float, str]:
    """``(datum_m, datum_note, surface_m, surface_note)`` of a well: the elevation of its depth
    reference (None without one) and of its sea floor or ground (m above sea level), each
    with where it came from (:func:`~logprep.fault.envelope.depth_datum`,
    :func:`~logprep.fault.burial.surface_elevation_m`)."""
    datum, source = depth_datum(well)
    surface, surface_note = surface_elevation_m(
        well.header, getattr(well, "header_units", {}), getattr(well, "depth_unit", "M"),
        water_depth_m=params.water_depth_m, ground_elevation_m=params.ground_elevation_m)
    return datum, source, surface, surface_note


def seal_capacity_step(well: WellLog, layers: Layers, windows: pd.DataFrame, params: CapacityParams,
                       length_unit: str = "m") -> tuple[pd.DataFrame, str]:
    """Seal-capacity columns for the windows (see the functions above) and a note on the
    depths used for burial, pressure and temperature, the closure and the CO2 density."""
    datum, source, surface, surface_note = well_reference(well, params)
    ref = ("depth as logged taken below sea level (no elevation in the LAS header)" if datum is None
           else f"depth below sea level = logged depth - {source}")
    parts = [burial_describe(surface_note, params.uplift_m, params.max_burial_m)
             + ("" if params.max_burial_m is not None else f"; {ref}"),
             closure_describe(params.closure_m, params.unconstrained_column_m, params.closure_source),
             co2_describe(params)]
    table = seal_capacity_table(windows, layers, params, datum_m=datum or 0.0,
                                surface_elevation_m=surface, length_unit=length_unit)
    return table, "; ".join(parts)


def co2_describe(p: CapacityParams) -> str:
    """One line for the sheet: which CO2 density and capillary conversion were used."""
    rho = ("CO2 density from the Span & Wagner (1996) equation of state at each contact"
           if p.co2_density_mode == "eos" else f"CO2 density fixed at {p.rho_co2_kgm3:g} kg/m3")
    return f"{rho}; CO2-brine capillary pressure = {p.co2_pressure_factor:.3f} x the envelope's"
