"""Gamma-ray index and clay (shale) volume by published transforms.

All functions are pure and vectorised: arrays in, arrays out.  Vsh is a fraction (0-1).

References
----------
1. Asquith, G. and Gibson, C. (1982). Basic Well Log Analysis for Geologists. AAPG Methods
   in Exploration 3, ch. V (gamma-ray index; quotes Larionov's curves).
2. Larionov, V.V. (1969). Borehole Radiometry. Nedra, Moscow.
3. Stieber, S.J. (1970). Pulsed neutron capture log evaluation - Louisiana Gulf Coast.
   SPE 2961.
4. Clavier, C., Hoyle, W. and Meunier, D. (1971). Quantitative interpretation of thermal
   neutron decay time logs. J. Pet. Tech. 23(6), 743-755.
5. Crain, E.R. Crain's Petrophysical Handbook, shale volume from the neutron-density
   separation (response equations for a water-filled rock whose matrix reads zero).
"""

from __future__ import annotations

import re
from collections.abc import Callable

import numpy as np

from logprep.errors import SettingsError


def gamma_ray_index(gr_api, gr_clean_api: float, gr_shale_api: float, *, clip: bool = True):
    """Gamma-ray index IGR = (GR - GR_clean) / (GR_shale - GR_clean).

    Parameters
    ----------
    gr_api : array_like
        Gamma-ray readings, API units.  NaN stays NaN.
    gr_clean_api, gr_shale_api : float or array_like
        Clean-sand and shale lines, API (one value, or one per sample for zoned picks);
        ``gr_clean_api < gr_shale_api`` everywhere.
    clip : bool, default True
        Clip IGR to [0, 1].  Readings cleaner than the clean line or hotter than the shale
        line are then treated as clean sand and pure shale; this is an implementation
        choice (the published formula is unbounded) so that every transform stays in its
        valid domain.

    Notes
    -----
    Asquith & Gibson (1982), ch. V.

    Examples
    --------
    >>> round(float(gamma_ray_index(28.0, 15.0, 128.0)), 5)
    0.11504
    """
    clean = np.asarray(gr_clean_api, dtype=float)
    shale = np.asarray(gr_shale_api, dtype=float)
    if not (np.all(np.isfinite(clean)) and np.all(np.isfinite(shale))):
        raise SettingsError("GR clean and shale lines must be finite numbers; set --gr-clean "
                            "and --gr-shale to API values or percentiles such as p5")
    if np.any(clean >= shale):
        k = np.argmax(np.broadcast_to(clean >= shale, np.broadcast(clean, shale).shape))
        c, s = np.broadcast_to(clean, np.broadcast(clean, shale).shape).flat[k], \
            np.broadcast_to(shale, np.broadcast(clean, shale).shape).flat[k]
        raise SettingsError(
            f"GR clean line ({c:g} API) must be below the shale line ({s:g} API); set "
            "--gr-clean below --gr-shale (or check the GR curve: it may be nearly constant)"
        )
    igr = (np.asarray(gr_api, dtype=float) - clean) / (shale - clean)
    return np.clip(igr, 0.0, 1.0) if clip else igr


def vsh_linear(igr):
    """Linear response: Vsh = IGR (Asquith & Gibson 1982)."""
    return np.asarray(igr, dtype=float) * 1.0


def vsh_larionov_tertiary(igr):
    """Larionov (1969), Tertiary (unconsolidated) rocks: Vsh = 0.083 (2^(3.7 IGR) - 1).

    Reaches 0.9957, not 1, at IGR = 1.
    """
    return 0.083 * (np.exp2(3.7 * np.asarray(igr, dtype=float)) - 1.0)


def vsh_larionov_older(igr):
    """Larionov (1969), older (consolidated) rocks: Vsh = 0.33 (2^(2 IGR) - 1).

    Reaches 0.99, not 1, at IGR = 1.
    """
    return 0.33 * (np.exp2(2.0 * np.asarray(igr, dtype=float)) - 1.0)


def vsh_stieber(igr, a: float = 3.0):
    """Stieber (1970): Vsh = IGR / (A - (A - 1) IGR), with the usual A = 3."""
    igr = np.asarray(igr, dtype=float)
    return igr / (a - (a - 1.0) * igr)


def vsh_clavier(igr):
    """Clavier, Hoyle & Meunier (1971): Vsh = 1.7 - sqrt(3.38 - (IGR + 0.7)^2)."""
    igr = np.asarray(igr, dtype=float)
    return 1.7 - np.sqrt(3.38 - (igr + 0.7) ** 2)


TRANSFORMS: dict[str, Callable] = {
    "linear": vsh_linear,
    "larionov-tertiary": vsh_larionov_tertiary,
    "larionov-older": vsh_larionov_older,
    "stieber": vsh_stieber,
    "clavier": vsh_clavier,
}
"""IGR -> Vsh transforms by name.  The CLI choices and the tests read this registry."""


def get_transform(name: str) -> Callable:
    """Look up a transform by name (``-``/``_`` and case ignored)."""
    key = name.strip().lower().replace("_", "-")
    try:
        return TRANSFORMS[key]
    except KeyError:
        raise SettingsError(
            f"unknown Vsh transform {name!r}; choose one of {', '.join(TRANSFORMS)}"
        ) from None


_PERCENTILE = re.compile(r"^[pP](\d+(?:\.\d+)?)$")


def parse_endpoint(text: str | float) -> float | str:
    """Parse a GR endpoint setting: a number (API) or a percentile ``pN`` (0 <= N <= 100).

    Returns a float for a fixed value, or the normalised string ``pN`` for a percentile.
    """
    if isinstance(text, (int, float)) and not isinstance(text, bool):
        return float(text)
    s = str(text).strip()
    m = _PERCENTILE.match(s)
    if m:
        q = float(m.group(1))
        if not 0.0 <= q <= 100.0:
            raise SettingsError(f"GR endpoint {text!r}: percentile must be within p0..p100; give "
                                  "--gr-clean/--gr-shale as p0 to p100 (for example p5)")
        return f"p{m.group(1)}"
    try:
        return float(s)
    except ValueError:
        raise SettingsError(
            f"GR endpoint {text!r} is neither a number nor a percentile; give "
            "--gr-clean/--gr-shale a value in API (e.g. 30) or a percentile (e.g. p5)"
        ) from None


def resolve_endpoint(setting: float | str, gr_api) -> float:
    """Turn an endpoint setting into API: fixed values pass through, ``pN`` is the N-th
    percentile of the finite readings (common practice, no source)."""
    if isinstance(setting, str):
        q = float(setting[1:])
        gr = np.asarray(gr_api, dtype=float)
        gr = gr[np.isfinite(gr)]
        if gr.size == 0:
            raise SettingsError("cannot pick a GR percentile: no valid readings; check the GR "
                                "curve or give --gr-clean/--gr-shale in API")
        return float(np.percentile(gr, q))
    return float(setting)


def vsh_from_gr(gr_api, gr_clean_api: float, gr_shale_api: float, transform: str = "linear"):
    """Clay volume from gamma ray: IGR (clipped to [0, 1]) through a named transform."""
    return get_transform(transform)(gamma_ray_index(gr_api, gr_clean_api, gr_shale_api))


# ------------------------------------------------------------------ neutron-density
DENSITY_UNITS: dict[str, float] = {
    "G/CM3": 1.0, "G/CC": 1.0, "GM/CC": 1.0, "GR/CC": 1.0, "G/C3": 1.0, "GCC": 1.0,
    "G/CM^3": 1.0, "KG/M3": 1e-3, "K/M3": 1e-3, "KG/M^3": 1e-3, "KGM3": 1e-3,
}
"""Bulk-density units understood, with their factor to g/cm3."""

NEUTRON_UNITS: dict[str, float] = {
    "V/V": 1.0, "M3/M3": 1.0, "DEC": 1.0, "FRAC": 1.0, "FRACTION": 1.0, "CFCF": 1.0,
    "PU": 0.01, "%": 0.01, "P.U.": 0.01, "PERCENT": 0.01,
}
"""Neutron-porosity units understood, with their factor to a fraction (v/v)."""


def _unit_factor(values, unit: str, table: dict[str, float], big: float, big_factor: float,
                 what: str) -> float:
    key = (unit or "").strip().upper().replace(" ", "")
    if key in table:
        return table[key]
    v = np.asarray(values, dtype=float)
    v = v[np.isfinite(v)]
    if key not in ("", "_", "UNITLESS", "NONE") :
        raise SettingsError(
            f"{what} unit {unit!r} is not understood; use one of {', '.join(sorted(table))}"
        )
    # No unit stated: judge from the magnitude (common practice, no source).
    return big_factor if v.size and float(np.median(v)) > big else 1.0


def density_g_cm3(rhob, unit: str):
    """Bulk density in g/cm3 from a curve in any unit of :data:`DENSITY_UNITS`.

    A blank unit is judged from the values: a median above 100 means kg/m3.

    Examples
    --------
    >>> float(density_g_cm3([2450.0], "kg/m3")[0])
    2.45
    """
    f = _unit_factor(rhob, unit, DENSITY_UNITS, 100.0, 1e-3, "bulk-density")
    return np.asarray(rhob, dtype=float) * f


def density_correction_g_cm3(drho, unit: str):
    """Density correction (DRHO) in g/cm3 from a curve in any unit of
    :data:`DENSITY_UNITS`.  A blank unit is judged from the values: a median magnitude
    above 1 means kg/m3 (a correction of 1 g/cm3 is impossible)."""
    key = (unit or "").strip().upper().replace(" ", "")
    v = np.asarray(drho, dtype=float)
    if key in ("", "_", "UNITLESS", "NONE"):
        a = np.abs(v[np.isfinite(v)])
        return v * (1e-3 if a.size and float(np.median(a)) > 1.0 else 1.0)
    return v * _unit_factor(v, unit, DENSITY_UNITS, 100.0, 1e-3, "density-correction")


def neutron_v_v(nphi, unit: str):
    """Neutron porosity as a fraction from a curve in any unit of :data:`NEUTRON_UNITS`.

    A blank unit is judged from the values: a median above 1.5 means porosity units (%).
    """
    f = _unit_factor(nphi, unit, NEUTRON_UNITS, 1.5, 0.01, "neutron-porosity")
    return np.asarray(nphi, dtype=float) * f


def density_porosity(rhob_g_cm3, rho_matrix_g_cm3: float = 2.65, rho_fluid_g_cm3: float = 1.0):
    """Density porosity PHID = (rho_ma - rho_b) / (rho_ma - rho_f).

    Parameters
    ----------
    rhob_g_cm3 : array_like
        Bulk density, g/cm3.
    rho_matrix_g_cm3 : float, default 2.65
        Matrix density (quartz sandstone).  It should match the matrix the neutron curve
        is scaled to; many neutron logs are recorded on a limestone scale (2.71), and a
        sandstone-scaled density porosity against them reads a few porosity units above
        the neutron in clean water sands (common practice, no source).
    rho_fluid_g_cm3 : float, default 1.0
        Pore-fluid density (fresh water; mud filtrate near 1.0-1.1).

    Notes
    -----
    Asquith & Gibson (1982), ch. IV (density log).

    Examples
    --------
    >>> round(float(density_porosity(2.32)), 6)
    0.2
    """
    if not rho_matrix_g_cm3 > rho_fluid_g_cm3:
        raise SettingsError("matrix density must exceed fluid density; give a matrix density "
                            "above the fluid density (for example 2.65 and 1.0 g/cm3)")
    rhob = np.asarray(rhob_g_cm3, dtype=float)
    return (rho_matrix_g_cm3 - rhob) / (rho_matrix_g_cm3 - rho_fluid_g_cm3)


def gas_crossover(nphi_v_v, phid):
    """True where the neutron reads below the density porosity (PHIN < PHID): the
    crossover of light hydrocarbon (gas) or of very clean, low-hydrogen rock."""
    with np.errstate(invalid="ignore"):
        return np.asarray(nphi_v_v, dtype=float) < np.asarray(phid, dtype=float)


def vsh_neutron_density(nphi_v_v, phid, separation_shale: float):
    """Clay volume from the neutron-density separation.

    Vsh = (PHIN - PHID) / (PHIN_sh - PHID_sh), clipped to [0, 1].

    Parameters
    ----------
    nphi_v_v : array_like
        Neutron porosity, fraction, in the units of the matrix used for ``phid``.
    phid : array_like
        Density porosity, fraction (see :func:`density_porosity`).
    separation_shale : float
        PHIN_sh - PHID_sh read in a shale (fraction, > 0).

    Notes
    -----
    Valid for water-filled rock.  In a gas crossover (PHIN < PHID) the separation is
    negative; it is returned as 0 (clean), never as negative shale, and
    :func:`gas_crossover` marks those samples.  Crain's Petrophysical Handbook response
    equations; ../shared/METHODS.md section 1.

    Examples
    --------
    >>> round(float(vsh_neutron_density(0.30, 0.20, 0.45 - 0.10)), 6)
    0.285714
    """
    if not np.isfinite(separation_shale) or separation_shale <= 0:
        raise SettingsError(
            f"neutron-density shale separation must be > 0 (got {separation_shale:g}); "
            "pick the neutron-density shale point where the neutron reads above the density porosity"
        )
    sep = np.asarray(nphi_v_v, dtype=float) - np.asarray(phid, dtype=float)
    return np.clip(sep / separation_shale, 0.0, 1.0)


def combine_mean(vsh_gr, vsh_nd):
    """Mean of the GR and neutron-density estimates; GR alone where ND is missing."""
    g, n = np.asarray(vsh_gr, dtype=float), np.asarray(vsh_nd, dtype=float)
    return np.where(np.isfinite(n), 0.5 * (g + n), g)


def combine_min(vsh_gr, vsh_nd):
    """Lower of the GR and neutron-density estimates (each over-reads clay in its own
    way: hot sands for GR, shaly-looking tight rock for ND); GR alone where ND is
    missing.  Taking the minimum is common practice, no source."""
    g, n = np.asarray(vsh_gr, dtype=float), np.asarray(vsh_nd, dtype=float)
    return np.where(np.isfinite(n), np.fmin(g, n), g)


def combine_gr_only(vsh_gr, vsh_nd):
    """The GR estimate alone."""
    return np.asarray(vsh_gr, dtype=float) * 1.0


def combine_nd_first(vsh_gr, vsh_nd):
    """The neutron-density estimate where it exists, else GR."""
    g, n = np.asarray(vsh_gr, dtype=float), np.asarray(vsh_nd, dtype=float)
    return np.where(np.isfinite(n), n, g)


COMBINATIONS: dict[str, Callable] = {
    "mean": combine_mean,
    "min": combine_min,
    "gr": combine_gr_only,
    "nd": combine_nd_first,
}
"""Ways to join the GR and neutron-density Vsh into the chosen Vsh, by name."""


def get_combination(name: str) -> Callable:
    key = str(name).strip().lower()
    try:
        return COMBINATIONS[key]
    except KeyError:
        raise SettingsError(
            f"unknown Vsh combination {name!r}; choose one of {', '.join(COMBINATIONS)}"
        ) from None
