"""Pressure and length conversions with the exact constants logprep uses everywhere.

Constants (see ``../shared/METHODS.md``): 1 psi = 6894.757 Pa, 1 ft = 0.3048 m (exact,
international foot), 1 bar = 1e5 Pa and 1 MPa = 1e6 Pa (SI definitions), standard gravity
g = 9.80665 m/s2 (CGPM 1901, exact).

>>> round(pressure(1.0, "bar", "psi"), 4)
14.5038
>>> length(1000.0, "ft", "m")
304.8
"""

from __future__ import annotations

import numpy as np

from logprep.errors import SettingsError

G_MPS2 = 9.80665
"""Standard acceleration of gravity, m/s2 (exact by definition)."""

PA_PER_PSI = 6894.757
PA_PER_BAR = 1.0e5
PA_PER_MPA = 1.0e6
M_PER_FT = 0.3048

PRESSURE_UNITS: dict[str, float] = {"Pa": 1.0, "bar": PA_PER_BAR, "psi": PA_PER_PSI, "MPa": PA_PER_MPA}
"""Pascals per unit, by unit name."""

LENGTH_UNITS: dict[str, float] = {"m": 1.0, "ft": M_PER_FT}
"""Metres per unit, by unit name."""


def _factor(table: dict[str, float], unit: str, kind: str) -> float:
    try:
        return table[unit]
    except KeyError:
        raise SettingsError(f"unknown {kind} unit {unit!r}; use one of {', '.join(table)}") from None


def pressure(value, from_unit: str, to_unit: str):
    """Convert a pressure (scalar or array) between ``Pa``, ``bar``, ``psi`` and ``MPa``."""
    f = _factor(PRESSURE_UNITS, from_unit, "pressure") / _factor(PRESSURE_UNITS, to_unit, "pressure")
    return np.asarray(value, float) * f if np.ndim(value) else float(value) * f


def length(value, from_unit: str, to_unit: str):
    """Convert a length (scalar or array) between ``m`` and ``ft``."""
    f = _factor(LENGTH_UNITS, from_unit, "length") / _factor(LENGTH_UNITS, to_unit, "length")
    return np.asarray(value, float) * f if np.ndim(value) else float(value) * f
