"""Fault-rock permeability, thickness and transmissibility multiplier.

**The equations and constants here are from memory, not verified** against the papers
(tagged [M] in ``../shared/METHODS.md``).  Every constant is a named parameter so that a
checked or local value can replace it; treat the results as indicative only.

References
----------
1. Manzocchi, T., Walsh, J.J., Nell, P. and Yielding, G. (1999). Fault transmissibility
   multipliers for flow simulation models. Petroleum Geoscience 5(1), 53-63,
   doi:10.1144/petgeo.5.1.53.
2. Sperrevik, S., Gillespie, P.A., Fisher, Q.J., Halvorsen, T. and Knipe, R.J. (2002).
   Empirical estimation of fault rock properties. NPF Special Publication 11, 109-125.
"""

from __future__ import annotations

import numpy as np

from logprep.errors import SettingsError

MANZOCCHI_SGR_COEF = -4.0
MANZOCCHI_DISPLACEMENT_COEF = -0.25
MANZOCCHI_EXPONENT = 5.0
MANZOCCHI_OFFSET = 0.0
"""Leading constant of log10 k; one recollection of Manzocchi et al. (1999) has +0.4."""
THICKNESS_RATIO = 66.0
"""Displacement / fault-rock thickness, median ratio (Manzocchi et al. 1999, from memory)."""

SPERREVIK_A_MD = 80000.0
SPERREVIK_B = 19.4
SPERREVIK_C_PER_M = 0.00403
SPERREVIK_D_PER_M = 0.0055
SPERREVIK_E = 12.5
SPERREVIK_EXPONENT = 7.0


def manzocchi_permeability_md(sgr_frac, displacement_m, *, sgr_coef=MANZOCCHI_SGR_COEF,
                              displacement_coef=MANZOCCHI_DISPLACEMENT_COEF,
                              exponent=MANZOCCHI_EXPONENT, offset=MANZOCCHI_OFFSET):
    """Fault-rock permeability (mD) from SGR and displacement, after Manzocchi et al. (1999).

    From memory, not verified.

    Parameters
    ----------
    sgr_frac : array_like
        Shale gouge ratio as a **fraction** (0-1).
    displacement_m : array_like
        Fault displacement, metres (> 0).

    Notes
    -----
    ``log10 k = offset + sgr_coef SGR + displacement_coef log10(D) (1 - SGR)^exponent``,
    by default ``-4 SGR - (1/4) log10(D) (1 - SGR)^5``.
    """
    sgr = np.asarray(sgr_frac, float)
    d = np.asarray(displacement_m, float)
    if np.any(d <= 0):
        raise SettingsError("fault-rock permeability: displacement must be > 0 m; give "
                            "throws above 0 m (--throw-max, --field-throw-step)")
    if np.any((sgr < 0) | (sgr > 1)):
        raise SettingsError("fault-rock permeability: SGR must be a fraction within 0-1; "
                            "pass SGR in percent divided by 100")
    return 10.0 ** (offset + sgr_coef * sgr + displacement_coef * np.log10(d) * (1.0 - sgr) ** exponent)


def sperrevik_permeability_md(clay_frac, max_burial_m, faulting_depth_m, *, a_md=SPERREVIK_A_MD,
                              b=SPERREVIK_B, c_per_m=SPERREVIK_C_PER_M, d_per_m=SPERREVIK_D_PER_M,
                              e=SPERREVIK_E, exponent=SPERREVIK_EXPONENT):
    """Fault-rock permeability (mD) after Sperrevik et al. (2002).  From memory, not verified.

    ``k = a exp(-(b Vcl + c z_max + (d z_f - e)(1 - Vcl)^exponent))`` with clay fraction
    ``Vcl`` (here the SGR as a fraction), maximum burial ``z_max`` and depth at faulting
    ``z_f`` in metres.
    """
    v = np.asarray(clay_frac, float)
    zmax = np.asarray(max_burial_m, float)
    zf = np.asarray(faulting_depth_m, float)
    return a_md * np.exp(-(b * v + c_per_m * zmax + (d_per_m * zf - e) * (1.0 - v) ** exponent))


SPERREVIK_FITTED_CLAY = (0.0, 0.6)
"""Clay fractions of the fault rocks the Sperrevik et al. (2002) relation was fitted on
(from memory, not verified)."""
SPERREVIK_FITTED_BURIAL_M = (1500.0, 5000.0)
"""Maximum burial depths (m) of those samples (North Sea and mid-Norway cores; from memory,
not verified).  At 353 m the relation gives millions of mD: an extrapolation."""
MANZOCCHI_FITTED_SGR = (0.0, 0.6)
"""SGR fractions of the fault-rock data behind the Manzocchi et al. (1999) relation (from
memory, not verified)."""
MANZOCCHI_FITTED_DISPLACEMENT_M = (0.001, 1000.0)
"""Displacements (m) of the thickness-displacement data (from memory, not verified)."""


def _outside(name: str, value: float, bounds, unit: str, fmt: str = "g") -> str | None:
    lo, hi = bounds
    if lo <= value <= hi:
        return None
    return f"{name} {value:{fmt}}{unit} outside the fitted {lo:g}-{hi:g}{unit}"


def calibration_note(sgr_frac: float, displacement_m: float, max_burial_m: float,
                     sperrevik_md: float, manzocchi_md: float, matrix_perm_md: float) -> str:
    """Why a window's fault-rock permeabilities are extrapolations ('' when they are not):
    inputs outside the ranges the relations were fitted on (:data:`SPERREVIK_FITTED_CLAY`,
    :data:`SPERREVIK_FITTED_BURIAL_M`, :data:`MANZOCCHI_FITTED_SGR`,
    :data:`MANZOCCHI_FITTED_DISPLACEMENT_M`), or a fault rock more permeable than the
    matrix it was made from (physically implausible for a deformation product; common
    practice, no source).  Parts are joined by ``"; "``."""
    parts = [
        _outside("Sperrevik: clay", sgr_frac, SPERREVIK_FITTED_CLAY, "", ".2f"),
        _outside("Sperrevik: burial", max_burial_m, SPERREVIK_FITTED_BURIAL_M, " m", ".0f"),
        _outside("Manzocchi: SGR", sgr_frac, MANZOCCHI_FITTED_SGR, "", ".2f"),
        _outside("Manzocchi: displacement", displacement_m, MANZOCCHI_FITTED_DISPLACEMENT_M, " m", ".3g"),
    ]
    for name, k in (("Sperrevik", sperrevik_md), ("Manzocchi", manzocchi_md)):
        if k > matrix_perm_md:
            parts.append(f"{name}: {k:.3g} mD above the matrix {matrix_perm_md:g} mD")
    return "; ".join(p for p in parts if p)


def fault_rock_thickness_m(displacement_m, ratio=THICKNESS_RATIO):
    """Fault-rock thickness (m) = displacement / ``ratio`` (median 66, Manzocchi et al.
    1999, from memory)."""
    return np.asarray(displacement_m, float) / ratio


def transmissibility_multiplier(thickness_m, fault_perm_md, matrix_perm_md, cell_length_m):
    """Transmissibility multiplier between two equal cells either side of the fault.

    ``T = [1 + (t_f / L)(k_m - k_f) / k_f]^-1`` (Manzocchi et al. 1999), ``L`` the cell
    length (centre to centre across the fault) in metres, permeabilities in mD.
    """
    tf = np.asarray(thickness_m, float)
    kf = np.asarray(fault_perm_md, float)
    km = np.asarray(matrix_perm_md, float)
    L = np.asarray(cell_length_m, float)
    if np.any(L <= 0) or np.any(kf <= 0) or np.any(km <= 0):
        raise SettingsError("transmissibility: cell length and permeabilities must be > 0; "
                            "set --cell-length and --matrix-perm above 0")
    return 1.0 / (1.0 + (tf / L) * (km - kf) / kf)


def transmissibility_multiplier_cells(thickness_m, fault_perm_md, perm_i_md, perm_j_md,
                                      length_i_m, length_j_m):
    """General form for unequal cells i, j:
    ``T = [1 + t_f (2/k_f - 1/k_i - 1/k_j) / (L_i/k_i + L_j/k_j)]^-1`` (derived)."""
    tf, kf, ki, kj, li, lj = (np.asarray(v, float) for v in
                              (thickness_m, fault_perm_md, perm_i_md, perm_j_md, length_i_m, length_j_m))
    return 1.0 / (1.0 + tf * (2.0 / kf - 1.0 / ki - 1.0 / kj) / (li / ki + lj / kj))
