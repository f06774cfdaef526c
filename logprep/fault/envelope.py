"""The fault-zone pressure envelope, column heights, the depth datum and fluid properties:
pure functions (arrays in, arrays out) behind the seal-capacity table of
:mod:`logprep.fault.capacity`.

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

import functools
import math

import numpy as np

from logprep.errors import SettingsError
from logprep.io.las import DEPTH_UNITS_M
from logprep.model import WellLog
from logprep.units import G_MPS2, PA_PER_BAR

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

ATM_PA = 101325.0
"""Atmospheric pressure at sea level (Pa)."""


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
            f"envelope: {bounds.size} class boundaries need {bounds.size + 1} constants C (got {cs.size}); "
            "give --envelope-c one value more than --envelope-bounds"
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


def leak_point_m(z_top_m, z_base_m, sgr_top_pct, sgr_base_pct, c, drho_kgm3,
                 sgr_scale_pct=ENVELOPE_SGR_SCALE_PCT):
    """``(column_m, leak_depth_m)`` of a contact whose SGR varies linearly from its top to
    its base: the exact minimum of ``f(z) = z + FZP(z) / (drho g)`` over ``[z_top, z_base]``
    minus ``z_top``, and the depth where it is met (the leak point), with
    ``FZP(z) = 10^(SGR(z)/scale - C)``.  ``f`` is convex, so the minimum is at an end or
    where ``f'(z) = 0`` (only when SGR falls with depth).  Inputs broadcast."""
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

        f0, f1 = f(z0), f(z1)
        best = np.minimum(f0, f1)
        where = np.where(f1 < f0, z1, z0)
        # f'(z) = 1 + a ln10 (k/scale) 10^(s/scale - C) = 0
        arg = -sgr_scale_pct / (a * math.log(10.0) * k)
        s_star = sgr_scale_pct * (c + np.log10(np.where(arg > 0, arg, np.nan)))
        z_star = z0 + (s_star - s0) / k
        inside = (k < 0) & np.isfinite(z_star) & (z_star > z0) & (z_star < z1)
        fs = f(np.where(inside, z_star, z0))
        better = inside & (fs < best)
        best = np.where(better, fs, best)
        where = np.where(better, z_star, where)
    return np.where(np.isfinite(a), best - z0, np.inf), where


def leak_point_column_m(z_top_m, z_base_m, sgr_top_pct, sgr_base_pct, c, drho_kgm3,
                        sgr_scale_pct=ENVELOPE_SGR_SCALE_PCT):
    """Column (m) held by a contact whose SGR varies linearly from its top to its base,
    measured from its top (the first item of :func:`leak_point_m`)."""
    return leak_point_m(z_top_m, z_base_m, sgr_top_pct, sgr_base_pct, c, drho_kgm3, sgr_scale_pct)[0]


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
        import CoolProp.CoolProp  # noqa: F401 - here, so that a missing CoolProp gets the hint below
    except ImportError:
        raise SettingsError(
            "CO2 density by equation of state needs CoolProp, which is not installed; "
            "pip install 'logprep[co2]', or use --co2-density-mode fixed"
        ) from None
    p, t = np.broadcast_arrays(np.asarray(pressure_pa, float), np.asarray(temperature_k, float))
    out = np.array([_co2_density_point(float(pi), float(ti)) for pi, ti in zip(p.ravel(), t.ravel())])
    return out.reshape(p.shape) if p.ndim else float(out[0])


@functools.lru_cache(maxsize=4096)
def _co2_density_point(pressure_pa: float, temperature_k: float) -> float:
    """One CoolProp solve, remembered: the windows of a well or a pair often share the
    depth of their shallowest contact, hence its pressure and temperature (110 depths for
    the 1,241 windows of a 20,000-sample well).  A failed solve raises and is not kept."""
    from CoolProp.CoolProp import PropsSI  # present: co2_density_kgm3 checked

    return PropsSI("D", "P", pressure_pa, "T", temperature_k, "CO2")
