"""Fault geometry: from vertical throw to distances along the fault.

Throw is the vertical offset of a horizon across the fault.  For dip-slip on a fault
dipping ``phi`` the displacement along the fault is ``D = throw / sin(phi)`` (derived from
the right triangle of throw, heave and displacement), and a vertical distance on the fault
surface becomes ``distance / sin(phi)`` along the fault's dip.  Beds dipping ``beta``
(across the fault's strike) are ``cos(beta)`` as thick as their vertical thickness.

Used for the fault-rock thickness and permeability (displacement) and the clay smear
potential, ``CSP = sum thickness^2 / smear distance`` (Bouvier et al. 1989; Fulljames et al.
1997), whose distances are along the fault: with vertical distances and thicknesses
``CSP_true = CSP_vertical x sin(phi) x cos(beta)^2``.  Default fault dip 60 deg, the
Andersonian dip of normal faults (Anderson 1951).

References
----------
1. Anderson, E.M. (1951). The Dynamics of Faulting, 2nd edn. Oliver & Boyd, Edinburgh.
2. Bouvier, J.D. et al. (1989). Three-dimensional seismic interpretation and fault sealing
   investigations, Nun River Field, Nigeria. AAPG Bulletin 73(11), 1397-1414.
"""

from __future__ import annotations

import math

import numpy as np

from logprep.errors import SettingsError

DEFAULT_FAULT_DIP_DEG = 60.0


def check_fault_dip(fault_dip_deg: float) -> None:
    if not 0 < fault_dip_deg <= 90:
        raise SettingsError(f"--fault-dip must lie within 0 (exclusive) and 90 degrees (got {fault_dip_deg:g}); "
                            "give the dip from horizontal, for example 60 (fault_dip_deg in a settings file)")


def displacement_m(throw_m, fault_dip_deg: float = DEFAULT_FAULT_DIP_DEG):
    """Displacement along the fault (m) for a vertical throw: ``throw / sin(dip)``.

    >>> round(float(displacement_m(100.0, 60.0)), 3)
    115.47
    """
    check_fault_dip(fault_dip_deg)
    return np.asarray(throw_m, float) / math.sin(math.radians(fault_dip_deg))


def csp_factor(fault_dip_deg: float = DEFAULT_FAULT_DIP_DEG, bed_dip_deg: float = 0.0) -> float:
    """``sin(fault dip) x cos(bed dip)^2``: CSP along the fault with true bed thicknesses
    per unit of CSP from vertical distances and vertical thicknesses.

    >>> round(csp_factor(60.0), 4)
    0.866
    """
    check_fault_dip(fault_dip_deg)
    if not 0 <= bed_dip_deg < 90:
        raise SettingsError(f"--bed-dip must lie within 0 and 90 degrees (got {bed_dip_deg:g}); "
                            "give the bed dip from horizontal (bed_dip_deg in a settings file)")
    return math.sin(math.radians(fault_dip_deg)) * math.cos(math.radians(bed_dip_deg)) ** 2
