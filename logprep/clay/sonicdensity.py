"""Clay volume from the sonic and density logs, for wells (or intervals) without a neutron.

In clay-rich rock the compressional slowness reads far more "porosity" than the density
does: the sonic porosity of a shale (time-average, quartz matrix) is well above its
density porosity, while in a consolidated water sand the two agree.  The separation
``PHIS - PHID`` is a shale indicator used like the neutron-density separation: zero in
clean sand, the zone's shale value in shale, linear between (Crain's Petrophysical
Handbook, "shale volume from the sonic-density crossplot"; Asquith & Krygowski 2004,
ch. on shale volume and on the sonic log).  logprep uses it only where the neutron-density
Vsh is missing (``ClaySettings.sonic_density``).

Limits: the time-average sonic porosity over-reads in uncompacted sand (Wyllie, Gregory &
Gardner 1958 need a compaction correction there), so a shallow, loose sand reads shalier
than it is; gas slows the sonic and lowers the density, both raising the separation less
than clay does.  Pure numpy.
"""

from __future__ import annotations

import numpy as np

from logprep.errors import SettingsError

DT_MATRIX_SANDSTONE_US_FT = 55.5
"""Matrix slowness of sandstone, us/ft (Asquith & Krygowski 2004, table of sonic matrix
values: 55.5-51.0 us/ft; Schlumberger 2009 charts, Por-3) [from memory]."""

DT_FLUID_US_FT = 189.0
"""Slowness of fresh mud filtrate, us/ft (Asquith & Krygowski 2004; Schlumberger 2009
charts, Por-3) [from memory]."""

RHO_MATRIX_SANDSTONE_G_CM3 = 2.65
"""Quartz sandstone matrix density, g/cm3 (Asquith & Krygowski 2004; as
:func:`logprep.clay.vshale.density_porosity`)."""

SLOWNESS_UNITS = {"US/FT": 1.0, "USEC/FT": 1.0, "US/F": 1.0, "MS/FT": 1.0,
                  "US/M": 0.3048, "USEC/M": 0.3048, "MS/M": 0.3048}
"""Slowness unit -> factor to us/ft (1 ft = 0.3048 m, exact)."""


def slowness_us_ft(dt, unit: str):
    """Compressional slowness in us/ft.  A blank or unknown unit is judged from the
    values: a median above 250 cannot be us/ft in rock (fluid reads 189-240), so it is
    us/m (common practice, no source).

    Examples
    --------
    >>> round(float(slowness_us_ft([453.0], "us/m")[0]), 2)
    138.07
    """
    v = np.asarray(dt, dtype=float)
    key = (unit or "").strip().upper().replace(" ", "")
    if key in SLOWNESS_UNITS:
        return v * SLOWNESS_UNITS[key]
    finite = v[np.isfinite(v)]
    return v * (0.3048 if finite.size and float(np.median(finite)) > 250.0 else 1.0)


def sonic_porosity(dt_us_ft, dt_matrix_us_ft: float = DT_MATRIX_SANDSTONE_US_FT,
                   dt_fluid_us_ft: float = DT_FLUID_US_FT):
    """Time-average sonic porosity (Wyllie, Gregory & Gardner 1958):
    PHIS = (dt - dt_ma) / (dt_f - dt_ma).

    Examples
    --------
    >>> round(float(sonic_porosity(82.2)), 3)
    0.2
    """
    if not dt_fluid_us_ft > dt_matrix_us_ft:
        raise SettingsError("fluid slowness must exceed matrix slowness; give a matrix slowness "
                            "below the fluid's (for example 55.5 and 189 us/ft)")
    return (np.asarray(dt_us_ft, dtype=float) - dt_matrix_us_ft) / (dt_fluid_us_ft - dt_matrix_us_ft)


def sonic_density_separation(dt_us_ft, rhob_g_cm3):
    """PHIS - PHID on a quartz matrix (fresh fluid): about 0 in clean consolidated sand,
    large and positive in shale."""
    phid = (RHO_MATRIX_SANDSTONE_G_CM3 - np.asarray(rhob_g_cm3, dtype=float)) / (
        RHO_MATRIX_SANDSTONE_G_CM3 - 1.0)
    return sonic_porosity(dt_us_ft) - phid


def vsh_sonic_density(separation, separation_shale: float):
    """Vsh = (PHIS - PHID) / (PHIS_sh - PHID_sh), clipped to [0, 1] (Crain's Handbook,
    sonic-density shale volume).

    Examples
    --------
    A sand of 20 % porosity (dt 82.2 us/ft, rho_b 2.32 g/cm3) reads clean; a shale point
    of 0.30 separation halfway gives 0.5:

    >>> float(vsh_sonic_density(sonic_density_separation(82.2, 2.32), 0.30))
    0.0
    >>> float(vsh_sonic_density(0.15, 0.30))
    0.5
    """
    if not np.isfinite(separation_shale) or separation_shale <= 0:
        raise SettingsError(f"sonic-density shale separation must be > 0 (got {separation_shale:g}); "
                            "pick the shale point where the sonic porosity reads above the density porosity")
    return np.clip(np.asarray(separation, dtype=float) / separation_shale, 0.0, 1.0)
