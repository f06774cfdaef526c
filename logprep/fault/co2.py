"""Capillary pressure of the fault rock for CO2-brine, from the hydrocarbon-water calibration.

The pressure envelope of Bretan, Yielding & Jones (2003) is calibrated on hydrocarbon
columns held in situ, so it gives a hydrocarbon-water capillary pressure.  Capillary entry
pressure of a pore throat of radius ``r`` is ``P = 2 gamma cos(theta) / r`` (Young-Laplace
with Washburn's wetting term; Washburn 1921), so the same rock holds CO2 against brine at

``P_co2 = P_cal x (gamma_co2 cos theta_co2) / (gamma_cal cos theta_cal)``

with interfacial tensions ``gamma`` (mN/m) and contact angles ``theta`` (degrees, through
the water) of the calibration system and of CO2-brine.  Defaults (:data:`DEFAULTS`):
calibration 30 mN/m and 0 deg (hydrocarbon-brine on water-wet rock, a common figure for
oil-brine; from memory, no published value found to cite), CO2-brine 26 mN/m and 30 deg
(Chiquet, Broseta & Thibeau 2007 measured about 25-30 mN/m above 10 MPa and angles of
0-40 deg on mica and quartz; from memory, not verified): a factor 0.751.  A published check
on the angle (abstract seen): on smooth quartz the water-CO2 contact angle is 0 deg at
0.1 MPa and rises with pressure and temperature to 35 deg at 296 K and 56 deg at 343 K at
20 MPa ("Influence of temperature and pressure on quartz-water-CO2 contact angle and
CO2-water interfacial tension", J. Colloid Interface Sci. 441, 59-64, 2015), so 30 deg is at
the water-wet end of measured values and warm, deep sites may hold less CO2 than the default
says; brine-CO2 interfacial tensions at storage conditions are tabulated by Chalbaud et al.
(2009), whose values were not seen.  Set all four from local measurements where they exist.

References
----------
1. Washburn, E.W. (1921). The dynamics of capillary flow. Physical Review 17(3), 273-283.
2. Chiquet, P., Broseta, D. and Thibeau, S. (2007). Wettability alteration of caprock
   minerals by carbon dioxide. Geofluids 7, 117-122.
3. Bretan, P., Yielding, G. and Jones, H. (2003). AAPG Bulletin 87(3), 397-413.
4. Influence of temperature and pressure on quartz-water-CO2 contact angle and CO2-water
   interfacial tension (2015). Journal of Colloid and Interface Science 441, 59-64
   (abstract seen; authors not checked).
5. Chalbaud, C., Robin, M., Lombard, J-M., Martin, F., Egermann, P. and Bertin, H. (2009).
   Interfacial tension measurements and wettability evaluation for geological CO2 storage.
   Advances in Water Resources 32, 98-109.
"""

from __future__ import annotations

import math

from logprep.errors import SettingsError

DEFAULTS = {"calibration_ift_mn_m": 30.0, "calibration_contact_deg": 0.0,
            "co2_ift_mn_m": 26.0, "co2_contact_deg": 30.0}


def co2_pressure_factor(calibration_ift_mn_m: float = DEFAULTS["calibration_ift_mn_m"],
                        calibration_contact_deg: float = DEFAULTS["calibration_contact_deg"],
                        co2_ift_mn_m: float = DEFAULTS["co2_ift_mn_m"],
                        co2_contact_deg: float = DEFAULTS["co2_contact_deg"]) -> float:
    """``(gamma_co2 cos theta_co2) / (gamma_cal cos theta_cal)``: CO2-brine capillary
    pressure per unit of calibration-system pressure (see the module notes).

    >>> round(co2_pressure_factor(), 4)
    0.7506
    """
    for name, v in (("--calibration-ift", calibration_ift_mn_m), ("--co2-ift", co2_ift_mn_m)):
        if not v > 0:
            raise SettingsError(f"{name} must be > 0 mN/m (got {v:g}); give an interfacial "
                                "tension above 0 mN/m")
    for name, v in (("--calibration-contact-angle", calibration_contact_deg),
                    ("--co2-contact-angle", co2_contact_deg)):
        if not 0 <= v < 90:
            raise SettingsError(f"{name} must lie within 0 and 90 degrees (got {v:g}); at 90 "
                                "degrees or more the rock is not water-wet and holds no column; give an "
                                "angle below 90 degrees")
    return (co2_ift_mn_m * math.cos(math.radians(co2_contact_deg))) / (
        calibration_ift_mn_m * math.cos(math.radians(calibration_contact_deg)))
