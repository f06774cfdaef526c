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
"""

from __future__ import annotations

import re
from typing import Callable

import numpy as np

from logprep.errors import SettingsError


def gamma_ray_index(gr_api, gr_clean_api: float, gr_shale_api: float, *, clip: bool = True):
    """Gamma-ray index IGR = (GR - GR_clean) / (GR_shale - GR_clean).

    Parameters
    ----------
    gr_api : array_like
        Gamma-ray readings, API units.  NaN stays NaN.
    gr_clean_api, gr_shale_api : float
        Clean-sand and shale lines, API; ``gr_clean_api < gr_shale_api``.
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
    if not np.isfinite(gr_clean_api) or not np.isfinite(gr_shale_api):
        raise SettingsError("GR clean and shale lines must be finite numbers")
    if gr_clean_api >= gr_shale_api:
        raise SettingsError(
            f"GR clean line ({gr_clean_api:g} API) must be below the shale line "
            f"({gr_shale_api:g} API)"
        )
    igr = (np.asarray(gr_api, dtype=float) - gr_clean_api) / (gr_shale_api - gr_clean_api)
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
            raise SettingsError(f"GR endpoint {text!r}: percentile must be within p0..p100")
        return f"p{m.group(1)}"
    try:
        return float(s)
    except ValueError:
        raise SettingsError(
            f"GR endpoint {text!r}: give a value in API (e.g. 30) or a percentile (e.g. p5)"
        ) from None


def resolve_endpoint(setting: float | str, gr_api) -> float:
    """Turn an endpoint setting into API: fixed values pass through, ``pN`` is the N-th
    percentile of the finite readings (common practice, no source)."""
    if isinstance(setting, str):
        q = float(setting[1:])
        gr = np.asarray(gr_api, dtype=float)
        gr = gr[np.isfinite(gr)]
        if gr.size == 0:
            raise SettingsError("cannot pick a GR percentile: no valid readings")
        return float(np.percentile(gr, q))
    return float(setting)


def vsh_from_gr(gr_api, gr_clean_api: float, gr_shale_api: float, transform: str = "linear"):
    """Clay volume from gamma ray: IGR (clipped to [0, 1]) through a named transform."""
    return get_transform(transform)(gamma_ray_index(gr_api, gr_clean_api, gr_shale_api))
