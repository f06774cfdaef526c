"""Seal capacity: from shale gouge ratio to fault-zone capillary pressure and column height.

Pure functions (arrays in, arrays out) plus :func:`seal_capacity_table`, which adds the
seal-capacity columns to the sand-sand windows of :func:`logprep.juxtaposition.sand_windows`.

Method
------
1. Fault-zone capillary entry pressure from SGR with the burial-depth-dependent envelope of
   Bretan, Yielding & Jones (2003): ``FZP (bar) = 10^(SGR/27 - C)``, SGR in %, ``C = 0.5``
   for maximum burial shallower than 3.0 km, ``0.25`` for 3.0-3.5 km, ``0`` deeper.  The
   class boundaries (the source rounds 9850 ft and 11500 ft) and the constants are
   parameters, so a local calibration can replace them.
2. Column height above the free-water level that a capillary pressure ``P`` holds:
   ``h = P / ((rho_w - rho_hc) g)`` (Skerlec 1999).
3. Leak point over a whole contact: with buoyancy pressure ``(rho_w - rho_hc) g (z_fwl - z)``
   at depth ``z``, the contact leaks first where it exceeds the local FZP, so the deepest
   free-water level the contact can hold is ``min_i (z_i + FZP_i / (drho g))`` and the column
   measured from the top of the contact is that minus ``z_top``.  The weakest point need not
   be the lowest SGR: a low SGR deep on the contact can be less limiting than a slightly
   higher SGR at its top.

References
----------
1. Bretan, P., Yielding, G. and Jones, H. (2003). Using calibrated shale gouge ratio to
   estimate hydrocarbon column heights. AAPG Bulletin 87(3), 397-413.
2. Yielding, G. (2002). Shale gouge ratio - calibration by geohistory. NPF Special
   Publication 11, 1-15.
3. Skerlec, G.M. (1999). Evaluating top and fault seal. In: Beaumont, E.A. and Foster, N.H.
   (eds), Exploring for Oil and Gas Traps, AAPG Treatise of Petroleum Geology, ch. 10.
4. Span, R. and Wagner, W. (1996). A new equation of state for carbon dioxide covering the
   fluid region from the triple-point temperature to 1100 K at pressures up to 800 MPa.
   J. Phys. Chem. Ref. Data 25(6), 1509-1596 (CO2 density, through CoolProp).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np
import pandas as pd

from logprep import faultrock
from logprep.errors import SettingsError
from logprep.juxtaposition import cumulative_clay
from logprep.lasread import DEPTH_UNITS_M
from logprep.model import Layers, WellLog
from logprep.units import G_MPS2, LENGTH_UNITS, PA_PER_BAR

ENVELOPE_SGR_SCALE_PCT = 27.0
"""SGR (%) per decade of fault-zone pressure in the envelope (Bretan et al. 2003)."""
ENVELOPE_CLASS_BOUNDS_M = (3000.0, 3500.0)
"""Maximum-burial class boundaries, metres (Bretan et al. 2003 round 9850 and 11500 ft)."""
ENVELOPE_CLASS_C = (0.5, 0.25, 0.0)
"""Envelope constant ``C`` per burial class, shallow to deep (Bretan et al. 2003)."""

FLUIDS = ("oil", "gas", "co2")
CO2_DENSITY_MODES = ("fixed", "eos")
"""``fixed``: the CO2 density setting; ``eos``: Span & Wagner (1996) through CoolProp at
the hydrostatic pressure and geothermal temperature of each window's contact."""

ELEVATION_KEYS = {"KB": "EKB", "DF": "EDF", "RT": "ERT", "GL": "EGL"}
"""Depth reference (``EREF``/``DREF``/``DMF`` header value) -> its elevation mnemonic."""

VERDICTS = ("leak", "uncertain", "seal")
"""Screening verdict words, from the window's minimum SGR against two thresholds."""

ATM_PA = 101325.0
CAPACITY_COLUMNS = [
    "burial_depth_m", "fzp_bar", "column_oil_m", "column_gas_m", "column_co2_m", "verdict",
    "co2_density_kgm3", "fault_rock_throw_m", "fault_rock_thickness_m",
    "fault_rock_perm_md", "fault_rock_perm_sperrevik_md", "trans_multiplier",
    "fault_rock_outside_calibration",
]
"""Columns added to ``juxtapositions.csv`` (after the window columns), in order."""
_TEXT_COLUMNS = ("verdict", "fault_rock_outside_calibration")


# ----------------------------------------------------------------------------- envelope
def envelope_c(burial_depth_m, class_bounds_m=ENVELOPE_CLASS_BOUNDS_M, class_c=ENVELOPE_CLASS_C):
    """Envelope constant ``C`` for a maximum burial depth (metres).

    A depth on a boundary belongs to the deeper class (3000 m -> 0.25, 3500 m -> 0).

    >>> float(envelope_c(2000.0)), float(envelope_c(3200.0)), float(envelope_c(4000.0))
    (0.5, 0.25, 0.0)
    """
    bounds = np.asarray(class_bounds_m, float)
    cs = np.asarray(class_c, float)
    if cs.size != bounds.size + 1:
        raise SettingsError(
            f"envelope: {bounds.size} class boundaries need {bounds.size + 1} constants C (got {cs.size})"
        )
    i = np.searchsorted(bounds, np.asarray(burial_depth_m, float), side="right")
    return cs[i]


def fault_zone_pressure_bar(sgr_pct, burial_depth_m, *, sgr_scale_pct=ENVELOPE_SGR_SCALE_PCT,
                            class_bounds_m=ENVELOPE_CLASS_BOUNDS_M, class_c=ENVELOPE_CLASS_C):
    """Fault-zone capillary entry pressure (bar) from SGR, Bretan, Yielding & Jones (2003).

    Parameters
    ----------
    sgr_pct : array_like
        Shale gouge ratio, percent (0-100).
    burial_depth_m : array_like
        Maximum burial depth, metres (picks the constant ``C``).
    sgr_scale_pct, class_bounds_m, class_c
        Envelope constants; the defaults are the published ones.

    Notes
    -----
    ``FZP = 10^(SGR / sgr_scale_pct - C)``.  The envelope bounds the published calibration
    data (North Sea and similar basins); it is not a local calibration.

    >>> round(float(fault_zone_pressure_bar(40.0, 2000.0)), 5)
    9.58262
    """
    sgr = np.asarray(sgr_pct, float)
    c = envelope_c(burial_depth_m, class_bounds_m, class_c)
    return 10.0 ** (sgr / sgr_scale_pct - c)


def column_height_m(pressure_bar, rho_water_kgm3, rho_fluid_kgm3):
    """Column (m) above the free-water level that a capillary pressure holds:
    ``h = P / ((rho_w - rho_hc) g)`` (Skerlec 1999).  Infinite where the fluid is not
    lighter than the water (no buoyancy)."""
    drho = np.asarray(rho_water_kgm3, float) - np.asarray(rho_fluid_kgm3, float)
    p_pa = np.asarray(pressure_bar, float) * PA_PER_BAR
    with np.errstate(divide="ignore"):
        return np.where(drho > 0, p_pa / (np.where(drho > 0, drho, 1.0) * G_MPS2), np.inf)


def leak_point_column_points_m(depth_m, fzp_bar, drho_kgm3):
    """Column (m) held by a contact sampled at points: ``min_i (z_i + FZP_i / (drho g)) -
    min_i z_i`` (the crest at the top of the contact).  ``depth_m``/``fzp_bar`` are 1-D."""
    z = np.asarray(depth_m, float)
    return float(np.min(z + column_height_m(fzp_bar, drho_kgm3, 0.0)) - np.min(z))


def leak_point_column_m(z_top_m, z_base_m, sgr_top_pct, sgr_base_pct, c, drho_kgm3,
                        sgr_scale_pct=ENVELOPE_SGR_SCALE_PCT):
    """Column (m) held by a contact whose SGR varies linearly from its top to its base.

    Exact minimum of ``f(z) = z + FZP(z) / (drho g)`` over ``[z_top, z_base]`` minus
    ``z_top``, where ``FZP(z) = 10^(SGR(z)/scale - C)``.  ``f`` is convex, so the minimum is
    at an end or where ``f'(z) = 0`` (only when SGR falls with depth).  Inputs broadcast.
    """
    z0, z1, s0, s1, c, drho = np.broadcast_arrays(
        *(np.asarray(v, float) for v in (z_top_m, z_base_m, sgr_top_pct, sgr_base_pct, c, drho_kgm3))
    )
    span = z1 - z0
    with np.errstate(divide="ignore", invalid="ignore"):
        a = np.where(drho > 0, PA_PER_BAR / (np.where(drho > 0, drho, 1.0) * G_MPS2), np.inf)
        k = np.where(span > 0, (s1 - s0) / np.where(span > 0, span, 1.0), 0.0)  # % per metre

        def f(z):
            s = s0 + k * (z - z0)
            return z + a * 10.0 ** (s / sgr_scale_pct - c)

        best = np.minimum(f(z0), f(z1))
        # f'(z) = 1 + a ln10 (k/scale) 10^(s/scale - C) = 0
        arg = -sgr_scale_pct / (a * math.log(10.0) * k)
        s_star = sgr_scale_pct * (c + np.log10(np.where(arg > 0, arg, np.nan)))
        z_star = z0 + (s_star - s0) / k
        inside = (k < 0) & np.isfinite(z_star) & (z_star > z0) & (z_star < z1)
        best = np.where(inside, np.minimum(best, f(np.where(inside, z_star, z0))), best)
    return np.where(np.isfinite(a), best - z0, np.inf)


# ----------------------------------------------------------------------------- depth and fluids
def depth_datum(well: WellLog) -> tuple[float | None, str]:
    """Elevation (m above sea level) of the depth reference, read from the LAS header, and
    a note saying where it came from.  ``(None, note)`` when the header has none.

    The reference is named by ``EREF``, ``DREF`` or ``DMF`` (``KB``, ``DF``, ``RT``, ``GL``)
    and its elevation by ``EKB``, ``EDF``, ``ERT`` or ``EGL``; without a reference item the
    first of ``EKB``, ``EDF``, ``ERT`` found is used.  The unit of the item is honoured
    (metres or feet); an item without a unit is taken in the file's depth unit.
    """
    header = {k.upper(): v for k, v in well.header.items()}
    units = {k.upper(): v for k, v in getattr(well, "header_units", {}).items()}
    ref = next((header[k].strip().upper() for k in ("EREF", "DREF", "DMF") if header.get(k, "").strip()), "")
    keys = [ELEVATION_KEYS[ref]] if ref in ELEVATION_KEYS else ["EKB", "EDF", "ERT"]
    for key in keys:
        text = header.get(key, "").strip()
        try:
            value = float(text)
        except ValueError:
            continue
        if not math.isfinite(value):
            continue
        # an item without a unit is in the file's depth unit
        unit = (units.get(key, "").strip() or str(getattr(well, "depth_unit", "") or "")).strip().upper()
        factor = {"": 1.0, **DEPTH_UNITS_M}.get(unit)
        if factor is None:
            continue
        note = f"{key} {value:g} {'m' if factor == 1.0 else 'ft'}"
        return value * factor, note
    return None, "no elevation in the LAS header"


def hydrostatic_pressure_pa(depth_ss_m, rho_water_kgm3):
    """Pressure (Pa) at a depth below sea level on a hydrostatic gradient from 1 atm."""
    return ATM_PA + np.asarray(rho_water_kgm3, float) * G_MPS2 * np.maximum(np.asarray(depth_ss_m, float), 0.0)


def geothermal_temperature_k(depth_ss_m, surface_temp_c, gradient_c_per_km):
    """Temperature (K) at a depth below sea level on a linear geothermal gradient."""
    z = np.maximum(np.asarray(depth_ss_m, float), 0.0)
    return 273.15 + surface_temp_c + gradient_c_per_km * z / 1000.0


def co2_density_kgm3(pressure_pa, temperature_k):
    """CO2 density (kg/m3) from the Span & Wagner (1996) equation of state in CoolProp.

    CoolProp is an optional dependency (``pip install 'logprep[co2]'``); without it a
    :class:`~logprep.errors.SettingsError` says how to install it or to use a fixed density.
    """
    try:
        from CoolProp.CoolProp import PropsSI
    except ImportError:
        raise SettingsError(
            "CO2 density by equation of state needs CoolProp: pip install 'logprep[co2]', "
            "or use --co2-density-mode fixed"
        ) from None
    p, t = np.broadcast_arrays(np.asarray(pressure_pa, float), np.asarray(temperature_k, float))
    out = np.array([PropsSI("D", "P", float(pi), "T", float(ti), "CO2") for pi, ti in zip(p.ravel(), t.ravel())])
    return out.reshape(p.shape) if p.ndim else float(out[0])


# ----------------------------------------------------------------------------- windows
@dataclass(frozen=True)
class CapacityParams:
    """Everything the seal-capacity step needs, in SI-ish units (m, kg/m3, %, mD)."""

    rho_brine_kgm3: float = 1050.0
    rho_oil_kgm3: float = 750.0
    rho_gas_kgm3: float = 250.0
    rho_co2_kgm3: float = 700.0
    co2_density_mode: str = "fixed"
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


def capacity_params(settings) -> CapacityParams:
    """The :class:`CapacityParams` of a :class:`~logprep.pipeline.ScreenSettings`."""
    s = settings
    return CapacityParams(
        rho_brine_kgm3=s.brine_density_kgm3, rho_oil_kgm3=s.oil_density_kgm3,
        rho_gas_kgm3=s.gas_density_kgm3, rho_co2_kgm3=s.co2_density_kgm3,
        co2_density_mode=s.co2_density_mode, surface_temp_c=s.surface_temp_c,
        geothermal_gradient_c_per_km=s.geothermal_gradient_c_per_km,
        max_burial_m=s.max_burial_m, sgr_scale_pct=s.envelope_sgr_scale_pct,
        class_bounds_m=tuple(s.envelope_class_bounds_m), class_c=tuple(s.envelope_class_c),
        leak_below_pct=s.sgr_leak_pct, seal_from_pct=s.sgr_threshold_pct,
        cell_length_m=s.cell_length_m, matrix_perm_md=s.matrix_perm_md,
        faulting_depth_m=s.faulting_depth_m,
    )


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


def sgr_between_pct(layers: Layers, footwall_depth_m, hangingwall_depth_m):
    """SGR (%) of the slipped interval between a hanging-wall depth and the footwall depth
    facing it: ``100 (C(z) - C(z - t)) / t`` (Yielding et al. 1997), the same value as
    :func:`logprep.juxtaposition.sgr_layered_pct` at throw ``t = z_fw - z_hw`` but with the
    two depths given, so a point on a bed edge stays on it."""
    bounds, clay = cumulative_clay(layers)
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


def _window_capacity(layers: Layers, w, p: CapacityParams, datum_m: float, co2_rho: float) -> dict:
    t = window_throws(w, p.n_throws)
    top, base, top_h, base_h = contact_ends(w, t)
    shallow_m = _shallowest_contact_m(w) - datum_m
    burial = p.max_burial_m if p.max_burial_m is not None else shallow_m
    c = float(envelope_c(burial, p.class_bounds_m, p.class_c))
    drho = [p.rho_brine_kgm3 - r for r in (p.rho_oil_kgm3, p.rho_gas_kgm3, co2_rho)]
    cols = window_columns_m(layers, w, c, drho, t, p.sgr_scale_pct).min(axis=1)
    # the fault rock at the window's lowest SGR (met at a contact end of a sampled throw)
    # (ties, as for a sand against itself, go to the largest throw: a real fault's rock)
    tt = np.concatenate([t, t])
    s_ends = sgr_between_pct(layers, np.concatenate([top, base]), np.concatenate([top_h, base_h]))
    lowest = s_ends <= np.nanmin(s_ends) + 1e-9
    d_m = float(np.max(tt[lowest]))
    sgr_frac = float(w["sgr_min_pct"]) / 100.0
    tf = float(faultrock.fault_rock_thickness_m(d_m))
    k_m = float(faultrock.manzocchi_permeability_md(sgr_frac, d_m))
    z_f = p.faulting_depth_m if p.faulting_depth_m is not None else burial
    k_s = float(faultrock.sperrevik_permeability_md(sgr_frac, burial, z_f))
    tm = float(faultrock.transmissibility_multiplier(tf, k_m, p.matrix_perm_md, p.cell_length_m))
    return {
        "burial_depth_m": burial,
        "fzp_bar": float(fault_zone_pressure_bar(w["sgr_min_pct"], burial, sgr_scale_pct=p.sgr_scale_pct,
                                                 class_bounds_m=p.class_bounds_m, class_c=p.class_c)),
        "column_oil_m": cols[0], "column_gas_m": cols[1], "column_co2_m": cols[2],
        "verdict": str(verdict(w["sgr_min_pct"], p.leak_below_pct, p.seal_from_pct)),
        "co2_density_kgm3": co2_rho,
        "fault_rock_throw_m": d_m, "fault_rock_thickness_m": tf,
        "fault_rock_perm_md": k_m, "fault_rock_perm_sperrevik_md": k_s,
        "trans_multiplier": tm,
        "fault_rock_outside_calibration": faultrock.calibration_note(
            sgr_frac, d_m, burial, k_s, k_m, p.matrix_perm_md),
    }


def seal_capacity_table(windows: pd.DataFrame, layers: Layers, params: CapacityParams = CapacityParams(),
                        *, datum_m: float = 0.0, length_unit: str = "m") -> pd.DataFrame:
    """``windows`` with :data:`CAPACITY_COLUMNS` added (and ``column_*_ft`` when
    ``length_unit`` is ``ft``).

    Parameters
    ----------
    windows : DataFrame
        From :func:`logprep.juxtaposition.sand_windows`.
    layers : Layers
        The blocked column the windows come from (depths as logged, m).
    params : CapacityParams
        Densities, envelope, burial, thresholds and fault-rock inputs.
    datum_m : float
        Elevation of the depth reference above sea level (m); logged depth minus it is the
        depth below sea level used for burial, pressure and temperature.  0 uses the depth
        as logged.

    Notes
    -----
    Per window: ``burial_depth_m`` is ``params.max_burial_m`` when given, otherwise the
    depth below sea level of the shallowest contact point over the window (the
    shallower class is the weaker envelope, so this errs on the side of leaking);
    ``fzp_bar`` is the envelope at the window's minimum SGR; ``column_*_m`` are the
    smallest leak-point columns over the window's throws (see :func:`window_columns_m`),
    measured from the top of the contact; ``verdict`` compares the minimum SGR with the
    thresholds.  The fault-rock columns are at the point of minimum SGR, with the throw
    there as displacement (see :mod:`logprep.faultrock`).
    """
    if length_unit not in LENGTH_UNITS:
        raise SettingsError(f"unknown length unit {length_unit!r}; use one of {', '.join(LENGTH_UNITS)}")
    out = windows.copy()
    rows = []
    for _, w in windows.iterrows():
        rho = params.rho_co2_kgm3
        if params.co2_density_mode == "eos":
            z_ss = _shallowest_contact_m(w) - datum_m
            p_pa = hydrostatic_pressure_pa(z_ss, params.rho_brine_kgm3)
            t_k = geothermal_temperature_k(z_ss, params.surface_temp_c, params.geothermal_gradient_c_per_km)
            rho = float(co2_density_kgm3(p_pa, t_k))
        elif params.co2_density_mode != "fixed":
            raise SettingsError(f"unknown CO2 density mode {params.co2_density_mode!r}; use one of {', '.join(CO2_DENSITY_MODES)}")
        rows.append(_window_capacity(layers, w, params, datum_m, rho))
    extra = pd.DataFrame(rows, columns=CAPACITY_COLUMNS, index=windows.index)
    for col in CAPACITY_COLUMNS:
        out[col] = extra[col] if len(windows) else pd.Series(dtype=object if col in _TEXT_COLUMNS else float)
    if length_unit == "ft":
        for fluid in FLUIDS:
            out[f"column_{fluid}_ft"] = out[f"column_{fluid}_m"] / LENGTH_UNITS["ft"]
    return out
