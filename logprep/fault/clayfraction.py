"""From shale volume to clay fraction, the quantity the shale gouge ratio is defined on.

SGR is the clay fraction of the rock that has slipped past a point (Yielding, Freeman &
Needham 1997); a gamma-ray log gives a shale volume, and shale is not all clay: average
shales hold about 60 % clay minerals, the rest silt-size quartz, feldspar and carbonate
(Shaw & Weaver 1965, abstract seen: X-ray analyses of about 400 shales average 60.9 % clay
minerals, 30.8 % quartz, 4.5 % feldspar, 3.6 % carbonate; for the 300 best-identified
samples 64.1 +- 9.4 % clay).  The step is a registry of
conversions (:data:`CLAY_CONVERSIONS`), each ``Vcl = f(Vsh, shale_clay_fraction)``:

``shale_fraction``
    ``Vcl = shale_clay_fraction x Vsh``: pure shale has clay fraction
    ``shale_clay_fraction`` and clean sand none, linear between (common practice, no
    source).  With ``shale_clay_fraction = 1`` (the default) Vsh is used as the clay
    fraction, as most SGR calibrations did (Yielding 2002 used Vsh-based SGR from wireline
    logs; from memory) - this is the default so that the calibrated thresholds and envelope
    apply as published, and it is the upper end of the clay content.

Every SGR, the smear indicators' clay and the fault-rock inputs then use ``Vcl``; the
lithology cut-offs (sand / heterolith / shale) stay on Vsh.

References
----------
1. Yielding, G., Freeman, B. and Needham, D.T. (1997). Quantitative fault seal prediction.
   AAPG Bulletin 81(6), 897-917.
2. Shaw, D.B. and Weaver, C.E. (1965). The mineralogical composition of shales. Journal of
   Sedimentary Petrology 35(1), 213-222.
"""

from __future__ import annotations

from dataclasses import replace
from collections.abc import Callable

import numpy as np

from logprep.errors import SettingsError
from logprep.model import Layers


def shale_fraction_clay(vsh, shale_clay_fraction: float = 1.0) -> np.ndarray:
    """Clay fraction ``Vcl = shale_clay_fraction x Vsh`` (both fractions 0-1).

    >>> float(shale_fraction_clay(0.5, 0.6))
    0.3
    """
    check_shale_clay_fraction(shale_clay_fraction)
    return shale_clay_fraction * np.asarray(vsh, float)


CLAY_CONVERSIONS: dict[str, Callable] = {"shale_fraction": shale_fraction_clay}
"""Vsh -> clay fraction conversions (``FaultSettings.clay_conversion``)."""

DEFAULT_SHALE_CLAY_FRACTION = 1.0
"""Clay fraction of pure shale by default: 1, Vsh taken as the clay fraction (see the
module notes; 0.609 for the average shale of Shaw & Weaver 1965)."""


def check_shale_clay_fraction(value: float) -> None:
    if not 0 < value <= 1:
        raise SettingsError(f"--shale-clay-fraction must lie within 0 (exclusive) and 1 (got {value:g}); "
                            "give a fraction such as 0.6 (shale_clay_fraction in a settings file)")


def get_clay_conversion(name: str) -> Callable:
    """The conversion registered as ``name``; :class:`SettingsError` listing the valid ones."""
    try:
        return CLAY_CONVERSIONS[name]
    except KeyError:
        raise SettingsError(f"unknown clay conversion {name!r}; use one of {', '.join(CLAY_CONVERSIONS)}") from None


def clay_layers(layers: Layers, conversion: str = "shale_fraction",
                shale_clay_fraction: float = DEFAULT_SHALE_CLAY_FRACTION) -> Layers:
    """``layers`` with ``vsh`` replaced by the clay fraction (lithology unchanged): the
    column the SGR, smear and fault-rock steps read."""
    vcl = get_clay_conversion(conversion)(layers.vsh, shale_clay_fraction)
    return replace(layers, vsh=vcl)


def clay_curve(vsh, conversion: str = "shale_fraction",
               shale_clay_fraction: float = DEFAULT_SHALE_CLAY_FRACTION) -> np.ndarray:
    """The clay fraction of a Vsh curve (for the ``curve`` SGR field)."""
    return get_clay_conversion(conversion)(vsh, shale_clay_fraction)


def describe(conversion: str, shale_clay_fraction: float) -> str:
    """One line for the sheet and the settings: which clay fraction entered SGR."""
    if conversion == "shale_fraction" and shale_clay_fraction == 1.0:
        return "clay fraction = Vsh (pure shale taken as all clay; --shale-clay-fraction 1)"
    return f"clay fraction = {shale_clay_fraction:g} x Vsh ({conversion})"
