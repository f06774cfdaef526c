"""Rock other than sand and shale, from the density, neutron, photoelectric and sonic logs.

A low gamma ray does not make a sand: limestone, chalk, dolomite, coal, anhydrite and
halite read clean on the GR too.  This module calls those rocks sample by sample from
published matrix responses, so the blocking stage can keep them out of the reservoir
classes.  Pure numpy: arrays in, arrays out.  Inputs: bulk density (g/cm3), neutron
porosity (fraction, **limestone scale**, as most compensated neutron logs are recorded),
photoelectric factor (b/e), compressional slowness (us/ft), and the gamma-ray index.

The classes (:data:`ROCK_CLASSES`) and the rules:

* ``coal``: bulk density at most :data:`COAL_RHOB_MAX` and neutron at least
  :data:`COAL_NPHI_MIN` (coal reads 1.2-1.8 g/cm3 and a very high neutron).
* ``anhydrite``: apparent matrix density nearer anhydrite than dolomite and a neutron
  near zero; ``halite``: bulk density within :data:`HALITE_RHOB_TOL` of halite and a
  neutron near zero.  Both also need the PEF near its mineral value where PEF exists.
* ``limestone`` (chalk included: both are calcite): apparent matrix density below the
  calcite-dolomite midpoint and apparent matrix volumetric cross-section ``Umaa`` above
  the dolomite-calcite midpoint, in rock that is clean on the GR.  Needs the PEF: without
  it calcite and a slightly shaly quartz sand give the same neutron-density answer.  With
  a PEF but no density and neutron, a clean rock whose Pe is above the dolomite-calcite
  midpoint (4.11 b/e) is limestone.
* ``dolomite``: apparent matrix density above the calcite-dolomite midpoint, ``Umaa``
  between the quartz-dolomite and dolomite-calcite midpoints, clean on the GR; needs PEF.
* No carbonate is called from the sonic.  The apparent matrix slowness
  ``dt_maa = (dt - phi dt_f) / (1 - phi)`` (Schlumberger 2009, rho_maa-dt_maa plot) was
  tried where the PEF is missing and measured on the 15 labelled FORCE wells: labelled
  limestone (mostly chalk) reads 52-56 us/ft there (median per well), inside the
  sandstone range 51.0-55.5 (Asquith & Krygowski 2004 [from memory]), because the
  time-average fails in chalk; a rule "dt_maa below 49.3" added 252 labelled Sandstone
  samples to the limestone calls for 166 labelled Limestone.  With density and sonic
  alone (no neutron) the time average puts a quartz sand and a limestone of the same
  bulk density 2-3 us/ft apart (2.36 g/cm3: 79 against 76.5 us/ft), within the scatter
  a little clay makes, so no log rule separates them either.
* ``tuff`` is a class name for described rock only: the North Sea tuffs read like shale
  on these logs (see README, validation), so no log rule calls it.

Every decision point is the midpoint of two published mineral values (a derived choice,
not fitted to wells); the only judgement thresholds are the "near zero" neutron band and
the clean-rock gate, marked as common practice.

References
----------
1. Crain, E.R. Crain's Petrophysical Handbook, "Mineral properties tables for log
   analysis" (density, neutron, sonic, Pe and U of minerals).
2. Schlumberger (2009). Log Interpretation Charts, sections on the photoelectric
   factor, the rho_maa-U_maa lithology identification plot and the electron-density
   relation rho_e = (rho_b + 0.1883) / 1.0704.
3. Asquith, G. and Krygowski, D. (2004). Basic Well Log Analysis, 2nd ed., AAPG Methods
   in Exploration 16, ch. on lithology (matrix densities and transit times).
"""

from __future__ import annotations

import numpy as np

from logprep.model import ROCK_CLASSES

__all__ = ["ROCK_CLASSES", "classify_rock", "apparent_matrix_density", "apparent_matrix_u",
           "missing_curve_notes", "pef_trusted"]

# ---------------------------------------------------------------- published responses
# name: (bulk density g/cm3, neutron limestone-scale v/v, slowness us/ft, Pe b/e, U b/cm3)
MINERALS: dict[str, tuple[float, float, float, float, float]] = {
    # Crain's Handbook mineral table [V: density 2.64, Pe 1.81, U 4.79, dt 56.0];
    # neutron -0.02 (limestone scale) from Crain [from memory]
    "quartz": (2.64, -0.02, 56.0, 1.81, 4.79),
    # Crain's Handbook [V: 2.71, Pe 5.08, U 13.77, dt 49.0]; neutron 0 by definition of
    # the limestone scale
    "calcite": (2.71, 0.00, 49.0, 5.08, 13.77),
    # Crain's Handbook [V: 2.85, Pe 3.14, U 9.00, dt 44.0]; neutron about +0.01 [V]
    "dolomite": (2.85, 0.01, 44.0, 3.14, 9.00),
    # Crain's Handbook / Schlumberger charts [from memory: 2.98, Pe 5.05, U 14.93 V
    # (U also in the mineral table of Schlumberger 2009), dt 50, neutron -0.01]
    "anhydrite": (2.98, -0.01, 50.0, 5.05, 14.93),
    # halite: log density 2.04 (Schlumberger charts, apparent density of NaCl) [from
    # memory], Pe 4.65 [from memory], dt 67 [from memory], neutron -0.02 [from memory]
    "halite": (2.04, -0.02, 67.0, 4.65, 9.45),
}
"""Matrix log responses by mineral (see the comments for source and confidence)."""

COAL_RHOB_MAX = 1.80
"""Upper end of the bulk density of coal, g/cm3 (lignite about 1.2, bituminous 1.2-1.5,
anthracite up to about 1.8): Crain's Handbook, coal log responses [from memory]."""

COAL_NPHI_MIN = 0.38
"""Least neutron porosity of coal (v/v): coal is hydrogen-rich and reads 0.4 or more on
the neutron log (Crain's Handbook [from memory]); 0.38 leaves a small margin."""

RHO_FLUID_G_CM3 = 1.0
"""Pore-fluid density for the apparent matrix values (fresh mud filtrate)."""

U_FLUID_B_CM3 = 0.398
"""Volumetric photoelectric cross-section of fresh water, b/cm3 (Schlumberger 2009
charts; Crain's Handbook) [V]."""

NEAR_ZERO_NPHI = 0.05
"""Neutron (v/v) below which a rock holds almost no hydrogen: evaporites read -0.02 to
0.0; 0.05 allows for tool noise (common practice, no source)."""

HALITE_RHOB_TOL = 0.08
"""Band (g/cm3) around the halite log density 2.04 (about four times the density tool's
repeatability of 0.02 g/cm3; common practice, no source)."""

PEF_TOL = 1.0
"""Band (b/e) around a mineral's Pe for the evaporites (common practice, no source)."""

CLEAN_IGR_MAX = 0.35
"""Carbonates are called only in rock whose gamma-ray index is below this (a clay-rich
rock's apparent matrix values sit between the minerals' and mislead; equals the default
sand cut-off; common practice, no source)."""

RHOMAA_CALCITE_DOLOMITE = 0.5 * (MINERALS["calcite"][0] + MINERALS["dolomite"][0])
RHOMAA_DOLOMITE_ANHYDRITE = 0.5 * (MINERALS["dolomite"][0] + MINERALS["anhydrite"][0])
RHOMAA_QUARTZ_CALCITE = 0.5 * (MINERALS["quartz"][0] + MINERALS["calcite"][0])
UMAA_DOLOMITE_CALCITE = 0.5 * (MINERALS["dolomite"][4] + MINERALS["calcite"][4])
UMAA_QUARTZ_DOLOMITE = 0.5 * (MINERALS["quartz"][4] + MINERALS["dolomite"][4])
PE_DOLOMITE_CALCITE = 0.5 * (MINERALS["dolomite"][3] + MINERALS["calcite"][3])
"""4.11 b/e: above it a clean rock's Pe is nearer calcite than dolomite (or quartz, 1.81)."""


SHALE_IGR_MIN = 1.0 - CLEAN_IGR_MAX
"""Gamma-ray index above which a sample is taken as shale for the PEF check (the mirror
of the clean gate; common practice, no source)."""

SHALE_PE_B_E = 3.42
"""Pe of an average shale, b/e (Schlumberger Log Interpretation Charts, mineral table,
"shale (average)" [from memory]); the clay minerals read 1.8-3.5 (kaolinite 1.83,
smectite 2.04, illite 3.45; Crain's Handbook mineral table), chlorite alone 6.3."""


def pef_trusted(pef_b_e, igr, section, *, min_samples: int = 30):
    """Where the PEF can be used for the carbonate calls: ``(mask, notes)``.

    In each hole section (equal values of ``section``, e.g. the bit size) the median Pe of
    the shale samples (gamma-ray index at least :data:`SHALE_IGR_MIN`) is compared with
    the dolomite-calcite midpoint :data:`PE_DOLOMITE_CALCITE` (4.11 b/e).  A shale
    reading nearer calcite than dolomite is not a shale's response (average shale
    :data:`SHALE_PE_B_E`): barite in the mud or mudcake (Pe of barite 267 b/e,
    Schlumberger 2009 charts) or a shifted tool lifts every reading of the section, and a
    quartz sand there would read as calcite.  The PEF of such a section is not used.
    A section with fewer than ``min_samples`` shale samples keeps its PEF.

    Examples
    --------
    >>> import numpy as np
    >>> pe = np.r_[np.full(50, 3.3), np.full(50, 4.9)]      # shales: 3.3, then 4.9 b/e
    >>> ok, notes = pef_trusted(pe, np.full(100, 0.9), np.r_[np.zeros(50), np.ones(50)])
    >>> int(ok[:50].sum()), int(ok[50:].sum())
    (50, 0)
    """
    pef = np.asarray(pef_b_e, dtype=float)
    ig = np.asarray(igr, dtype=float)
    sec = np.asarray(section)
    ok = np.ones(pef.size, dtype=bool)
    notes = []
    with np.errstate(invalid="ignore"):
        shale = np.isfinite(pef) & (ig >= SHALE_IGR_MIN)
    for value in np.unique(sec[np.isfinite(pef)]):
        inside = sec == value
        m = shale & inside
        if m.sum() < min_samples:
            continue
        pe_sh = float(np.median(pef[m]))
        if pe_sh > PE_DOLOMITE_CALCITE:
            ok &= ~inside
            notes.append(f"{pe_sh:.2f} b/e")
    return ok, notes


def density_porosity_limestone(rhob_g_cm3, rho_fluid_g_cm3: float = RHO_FLUID_G_CM3):
    """Density porosity on the limestone scale, (2.71 - rho_b) / (2.71 - rho_f).

    Examples
    --------
    >>> round(float(density_porosity_limestone(2.368)), 3)
    0.2
    """
    rho_ma = MINERALS["calcite"][0]
    return (rho_ma - np.asarray(rhob_g_cm3, dtype=float)) / (rho_ma - rho_fluid_g_cm3)


def neutron_density_porosity(nphi_v_v, rhob_g_cm3):
    """Crossplot porosity, the mean of the limestone-scale neutron and density porosities
    (the usual quick-look approximation of the neutron-density chart; Asquith & Krygowski
    2004)."""
    return 0.5 * (np.asarray(nphi_v_v, dtype=float) + density_porosity_limestone(rhob_g_cm3))


def apparent_matrix_density(rhob_g_cm3, phi, rho_fluid_g_cm3: float = RHO_FLUID_G_CM3):
    """Apparent matrix (grain) density rho_maa = (rho_b - phi rho_f) / (1 - phi), g/cm3.

    Schlumberger (2009) charts, rho_maa-U_maa plot.  NaN where phi >= 1.

    Examples
    --------
    A limestone of 20 % porosity (rho_b = 2.71 x 0.8 + 0.2 = 2.368) gives back 2.71:

    >>> round(float(apparent_matrix_density(2.368, 0.2)), 3)
    2.71
    """
    phi = np.asarray(phi, dtype=float)
    with np.errstate(invalid="ignore", divide="ignore"):
        out = (np.asarray(rhob_g_cm3, dtype=float) - phi * rho_fluid_g_cm3) / (1.0 - phi)
    return np.where(phi < 1.0, out, np.nan)


def electron_density(rhob_g_cm3):
    """Electron density index rho_e = (rho_b + 0.1883) / 1.0704 (Schlumberger 2009)."""
    return (np.asarray(rhob_g_cm3, dtype=float) + 0.1883) / 1.0704


def apparent_matrix_u(pef_b_e, rhob_g_cm3, phi, u_fluid_b_cm3: float = U_FLUID_B_CM3):
    """Apparent matrix volumetric photoelectric cross-section, b/cm3:
    U_maa = (Pe rho_e - phi U_f) / (1 - phi) (Schlumberger 2009 charts).

    Examples
    --------
    Zero-porosity calcite: Pe 5.08 at rho_b 2.71 gives U close to the tabled 13.77:

    >>> round(float(apparent_matrix_u(5.08, 2.71, 0.0)), 1)
    13.8
    """
    phi = np.asarray(phi, dtype=float)
    u = np.asarray(pef_b_e, dtype=float) * electron_density(rhob_g_cm3)
    with np.errstate(invalid="ignore", divide="ignore"):
        out = (u - phi * u_fluid_b_cm3) / (1.0 - phi)
    return np.where(phi < 1.0, out, np.nan)


def _or_nan(x, n):
    return np.full(n, np.nan) if x is None else np.asarray(x, dtype=float)


def classify_rock(*, rhob_g_cm3=None, nphi_v_v=None, pef_b_e=None, igr=None,
                  washout=None) -> np.ndarray:
    """Rock class per sample: a name of :data:`ROCK_CLASSES` or ``""`` (sand/shale
    family, left to the clay volume).

    Parameters
    ----------
    rhob_g_cm3, nphi_v_v, pef_b_e : array_like or None
        Bulk density, limestone-scale neutron porosity and photoelectric factor; None
        when the well lacks the curve (every rule needing it then stays silent).
    igr : array_like or None
        Gamma-ray index (0-1); carbonates are called only below :data:`CLEAN_IGR_MAX`.
    washout : array_like of bool or None
        Samples in enlarged hole: no coal is called there (the density reads mud, low,
        and the neutron high, just like coal).

    Returns
    -------
    ndarray of str (object), one per sample.
    """
    arrays = [a for a in (rhob_g_cm3, nphi_v_v, pef_b_e, igr) if a is not None]
    if not arrays:
        return np.array([], dtype=object)
    n = np.asarray(arrays[0]).size
    rhob, nphi = _or_nan(rhob_g_cm3, n), _or_nan(nphi_v_v, n)
    pef, ig = _or_nan(pef_b_e, n), _or_nan(igr, n)
    out = np.full(n, "", dtype=object)
    phi = neutron_density_porosity(nphi, rhob)
    rhomaa = apparent_matrix_density(rhob, np.clip(phi, 0.0, 0.95))
    umaa = apparent_matrix_u(pef, rhob, np.clip(phi, 0.0, 0.95))
    has_pef = np.isfinite(pef)
    with np.errstate(invalid="ignore"):
        low_h = nphi < NEAR_ZERO_NPHI
        clean = ig < CLEAN_IGR_MAX

        def pe_near(mineral):
            return ~has_pef | (np.abs(pef - MINERALS[mineral][3]) <= PEF_TOL)

        coal = (rhob <= COAL_RHOB_MAX) & (nphi >= COAL_NPHI_MIN)
        if washout is not None:
            coal &= ~np.asarray(washout, dtype=bool)
        anhydrite = low_h & (rhomaa >= RHOMAA_DOLOMITE_ANHYDRITE) & pe_near("anhydrite")
        halite = low_h & (np.abs(rhob - MINERALS["halite"][0]) <= HALITE_RHOB_TOL) & pe_near("halite")
        limestone = (has_pef & clean & (umaa >= UMAA_DOLOMITE_CALCITE)
                     & (rhomaa < RHOMAA_CALCITE_DOLOMITE) & (rhomaa >= RHOMAA_QUARTZ_CALCITE - 0.1))
        # PEF without density and neutron: a clean rock reading nearer calcite's Pe
        pe_only = has_pef & ~(np.isfinite(rhob) & np.isfinite(nphi))
        limestone |= pe_only & clean & (pef >= PE_DOLOMITE_CALCITE)
        dolomite = (has_pef & clean & (rhomaa >= RHOMAA_CALCITE_DOLOMITE)
                    & (rhomaa < RHOMAA_DOLOMITE_ANHYDRITE)
                    & (umaa >= UMAA_QUARTZ_DOLOMITE) & (umaa < UMAA_DOLOMITE_CALCITE))
    # later assignments win: the evaporites and coal are the most specific responses
    for name, mask in (("dolomite", dolomite), ("limestone", limestone), ("halite", halite),
                       ("anhydrite", anhydrite), ("coal", coal)):
        out[mask] = name
    return out


def missing_curve_notes(*, rhob=False, nphi=False, pef=False, cali=False,
                        bs=False) -> list[str]:
    """What the rock classes could not use, one line each, for ``qc.csv`` and the sheet."""
    notes = []
    if not (rhob and nphi):
        notes.append("lithology: no bulk density and neutron pair; carbonate, coal and "
                     "evaporite not recognised (GR-only sand calls may include them)")
    elif not pef:
        notes.append("lithology: no photoelectric factor (PEF); limestone, chalk and "
                     "dolomite not recognised (only coal, anhydrite and halite)")
    if not cali:
        notes.append("hole condition: no caliper; badly enlarged hole not detected")
    elif not bs:
        notes.append("hole condition: no bit size; taken as the largest standard bit "
                     "size not above the caliper's running low")
    return notes
