"""Burial depth for the fault-zone pressure envelope: below the sea floor or the ground.

The envelope of Bretan, Yielding & Jones (2003) picks its constant by the **maximum burial
depth** of the fault rock, measured below the sea floor (offshore) or the ground
(onshore), not the present depth below sea level.  logprep takes

``burial = depth below sea level + surface elevation + uplift``

where the surface elevation is that of the ground (positive, onshore) or of the sea floor
(minus the water depth, offshore), and ``uplift`` the section removed since maximum burial
(exhumation).  Onshore, a log measured from the kelly bushing gives depth below sea level
as ``MD - EKB``; adding the ground elevation ``EGL`` back gives ``MD - (EKB - EGL)``, the
depth below the ground, so the ground elevation is not lost with the kelly bushing.

The surface elevation comes, in order, from a ``--water-depth`` or ``--ground-elevation``
setting, a water-depth item of the LAS header (:data:`WATER_DEPTH_KEYS`), or the ground
elevation item ``EGL`` (negative offshore: the sea floor); otherwise the surface is taken
at sea level and the note says so.  One envelope class step is a factor 10^0.25 = 1.78
(or 10^0.5 = 3.16) in pressure, so the depth used is stated on every sheet.

References
----------
1. Bretan, P., Yielding, G. and Jones, H. (2003). Using calibrated shale gouge ratio to
   estimate hydrocarbon column heights. AAPG Bulletin 87(3), 397-413.
"""

from __future__ import annotations

import math
from collections.abc import Mapping

import numpy as np

from logprep.errors import SettingsError
from logprep.units import M_PER_FT

WATER_DEPTH_KEYS = ("WDEP", "WD", "WATD", "WDPT", "WDPTH", "WATER_DEPTH")
"""LAS header mnemonics read as the water depth (m or ft as the item's unit says)."""
GROUND_ELEVATION_KEY = "EGL"

_UNIT_M = {"": None, "M": 1.0, "METER": 1.0, "METERS": 1.0, "METRE": 1.0, "METRES": 1.0,
           "FT": M_PER_FT, "F": M_PER_FT, "FEET": M_PER_FT, "FOOT": M_PER_FT}


def _header_length_m(header: Mapping[str, str], units: Mapping[str, str], key: str,
                     depth_unit: str) -> tuple[float | None, str]:
    """A length item of the header in metres (an item without a unit is in the file's
    depth unit), and its text for notes."""
    text = str(header.get(key, "")).strip()
    try:
        value = float(text)
    except ValueError:
        return None, ""
    if not math.isfinite(value):
        return None, ""
    unit = str(units.get(key, "") or "").strip().upper() or str(depth_unit or "M").strip().upper()
    factor = _UNIT_M.get(unit)
    if factor is None:
        return None, ""
    return value * factor, f"{key} {value:g} {'m' if factor == 1.0 else 'ft'}"


def surface_elevation_m(header: Mapping[str, str] | None = None, header_units: Mapping[str, str] | None = None,
                        depth_unit: str = "M", *, water_depth_m: float | None = None,
                        ground_elevation_m: float | None = None) -> tuple[float, str]:
    """Elevation (m above sea level) of the sea floor or the ground, and a note naming
    its source (see the module notes for the order).  Offshore it is minus the water depth."""
    if water_depth_m is not None and ground_elevation_m is not None:
        raise SettingsError("--water-depth and --ground-elevation both given; give --water-depth "
                            "(offshore) or --ground-elevation (onshore), not both")
    if water_depth_m is not None:
        if not water_depth_m >= 0:
            raise SettingsError(f"--water-depth must be >= 0 m (got {water_depth_m:g}); give "
                                "the water depth as 0 m or more, or --ground-elevation onshore")
        return -float(water_depth_m), f"sea floor at {water_depth_m:g} m water depth (--water-depth)"
    if ground_elevation_m is not None:
        return float(ground_elevation_m), f"ground at {ground_elevation_m:g} m above sea level (--ground-elevation)"
    h = {str(k).upper(): v for k, v in (header or {}).items()}
    u = {str(k).upper(): v for k, v in (header_units or {}).items()}
    for key in WATER_DEPTH_KEYS:
        wd, text = _header_length_m(h, u, key, depth_unit)
        if wd is not None and wd >= 0:
            return -wd, f"sea floor at {wd:g} m water depth (header {text})"
    egl, text = _header_length_m(h, u, GROUND_ELEVATION_KEY, depth_unit)
    if egl is not None:
        where = "ground" if egl >= 0 else "sea floor"
        return egl, f"{where} at {egl:g} m above sea level (header {text})"
    return 0.0, ("surface taken at sea level (no water depth or ground elevation in the header; "
                 "set --water-depth or --ground-elevation)")


def burial_depth_m(depth_ss_m, surface_elevation_m: float = 0.0, uplift_m: float = 0.0):
    """Maximum burial depth (m) below the sea floor or ground: ``depth below sea level +
    surface elevation + uplift`` (see the module notes), at least 0.

    >>> float(burial_depth_m(2000.0, -100.0))   # 100 m of water
    1900.0
    >>> float(burial_depth_m(1895.0, 100.0))    # MD 2000 m from a KB 105 m, ground 100 m
    1995.0
    """
    if not uplift_m >= 0:
        raise SettingsError(f"--uplift must be >= 0 m (got {uplift_m:g}); give the uplift as 0 "
                            "m or more (uplift_m in a settings file)")
    return np.maximum(np.asarray(depth_ss_m, float) + surface_elevation_m + uplift_m, 0.0)


def pressure_depth_m(depth_ss_m, surface_elevation_m: float = 0.0):
    """Depth (m) of the hydrostatic water column above a point: from sea level offshore
    (the sea is part of the column), from the ground onshore (water table at the
    surface, common practice, no source)."""
    return np.maximum(np.asarray(depth_ss_m, float) + max(surface_elevation_m, 0.0), 0.0)


def describe(surface_note: str, uplift_m: float, max_burial_m: float | None) -> str:
    """One line for the sheet: which burial depth entered the envelope."""
    if max_burial_m is not None:
        return f"burial depth set to {max_burial_m:g} m for every window (--max-burial)"
    up = f" + {uplift_m:g} m uplift (--uplift)" if uplift_m else " (no uplift)"
    return f"burial depth = contact depth below the sea floor or ground{up}; {surface_note}"
