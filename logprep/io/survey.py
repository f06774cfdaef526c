"""Deviation surveys: measured depth to true vertical depth by the minimum curvature method.

A survey file is a CSV with a header and one row per station: measured depth, inclination
(degrees from vertical) and azimuth (degrees from north).  Column names are matched
without case: ``md_m``/``md`` (metres) or ``md_ft`` (feet), ``inc_deg``/``inc``/
``inclination``/``devi``, ``azi_deg``/``azi``/``azimuth``/``azim``.  Stations must have
strictly increasing MD.  The hole above the first station is taken as vertical (TVD = MD
there), so a survey should start at or above the top of the log.

Station positions come from ``wellpathpy`` (minimum curvature).  Between stations the
path is the circular arc that the method assumes, so TVD at any MD is interpolated
*along that arc* (exact for the method, not a straight line between stations):

``dTVD(s) = R [sin(s b) cos i1 + (1 - cos(s b)) (cos i2 - cos b cos i1) / sin b]``

for the fraction ``s`` of a course of length ``L`` with dogleg ``b`` and ``R = L / b``; at
``s = 1`` this is the usual ``L / 2 (cos i1 + cos i2) RF`` with ``RF = 2 / b tan(b / 2)``.

References
----------
1. Sawaryn, S.J. and Thorogood, J.L. (2005). A compendium of directional calculations
   based on the minimum curvature method. SPE Drilling & Completion 20(1), 24-36.
"""

from __future__ import annotations

from pathlib import Path

import numpy as np
import pandas as pd

from logprep.io.csvtable import read_csv_table
from logprep.errors import LogprepError
from logprep.io.tops import well_key
from logprep.model import WellLog

FT = 0.3048

_MD = {"md_m": 1.0, "md": 1.0, "dept": 1.0, "md_ft": FT}
_INC = ("inc_deg", "inc", "inclination", "devi", "incl")
_AZI = ("azi_deg", "azi", "azimuth", "azim")


class SurveyError(LogprepError, ValueError):
    """A deviation survey could not be read or used."""


def read_survey(path: str | Path) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """``(md_m, inc_deg, azi_deg)`` from a survey CSV (see the module notes)."""
    path = Path(path)
    df = read_csv_table(path, SurveyError, "survey CSV", "--survey-dir", comment="#")
    cols = {str(c).strip().lower(): c for c in df.columns}
    md_col = next((c for c in _MD if c in cols), None)
    inc_col = next((c for c in _INC if c in cols), None)
    azi_col = next((c for c in _AZI if c in cols), None)
    if md_col is None or inc_col is None or azi_col is None:
        raise SurveyError(f"{path}: needs columns md_m (or md_ft), inc_deg and azi_deg; "
                          f"found {', '.join(map(str, df.columns))}; name the columns so in the header line")
    try:
        md = df[cols[md_col]].astype(float).to_numpy() * _MD[md_col]
        inc = df[cols[inc_col]].astype(float).to_numpy()
        azi = df[cols[azi_col]].astype(float).to_numpy()
    except ValueError:
        raise SurveyError(f"{path}: a survey value is not a number; write md, inc and "
                          "azi as plain numbers in every row") from None
    if md.size < 2 or not np.isfinite(np.stack([md, inc, azi])).all():
        raise SurveyError(f"{path}: needs at least two complete stations; give two or "
                          "more rows with md, inc and azi all filled in")
    if np.any(np.diff(md) <= 0):
        raise SurveyError(f"{path}: measured depth must increase from station to station; "
                          "sort the rows by depth and remove repeated stations")
    if np.any((inc < 0) | (inc > 180)):
        raise SurveyError(f"{path}: inclination must lie within 0-180 degrees; give "
                          "inc_deg in degrees from vertical")
    return md, inc, np.mod(azi, 360.0)


def station_positions_m(md_m, inc_deg, azi_deg) -> np.ndarray:
    """Positions ``(north, east, tvd)`` (m) of the survey stations by minimum curvature
    (wellpathpy), relative to the first station's horizontal position, with the hole
    above the first station vertical (TVD = MD there).  Shape ``(n, 3)``."""
    from wellpathpy.mincurve import minimum_curvature

    md = np.asarray(md_m, float)
    tvd, north, east, _ = minimum_curvature(md, np.asarray(inc_deg, float), np.asarray(azi_deg, float))
    return np.stack([np.asarray(north, float), np.asarray(east, float), md[0] + np.asarray(tvd, float)], axis=-1)


def station_tvd_m(md_m, inc_deg, azi_deg) -> np.ndarray:
    """TVD (m) at the survey stations by minimum curvature (wellpathpy), with the hole
    above the first station vertical."""
    return station_positions_m(md_m, inc_deg, azi_deg)[:, 2]


def _unit_vectors(inc_deg, azi_deg) -> np.ndarray:
    i, a = np.radians(inc_deg), np.radians(azi_deg)
    return np.stack([np.sin(i) * np.cos(a), np.sin(i) * np.sin(a), np.cos(i)], axis=-1)


def position_at_md(md_query_m, md_m, inc_deg, azi_deg) -> np.ndarray:
    """Positions ``(north, east, tvd)`` (m) at any measured depths, along the
    minimum-curvature arcs between stations: ``r(s) = r1 + R [sin(s b) u1 + (1 - cos(s b))
    (u2 - cos b u1) / sin b]`` (Sawaryn & Thorogood 2005).  Above the first station the
    hole is vertical; below the last it continues straight along the last direction.
    Shape ``md_query_m.shape + (3,)``."""
    md = np.asarray(md_m, float)
    q = np.asarray(md_query_m, float)
    station = station_positions_m(md, inc_deg, azi_deg)
    u = _unit_vectors(np.asarray(inc_deg, float), np.asarray(azi_deg, float))
    k = np.clip(np.searchsorted(md, q, side="right") - 1, 0, md.size - 2)
    L = (md[k + 1] - md[k])[..., None]
    s = (q - md[k])[..., None]
    s = s / L
    u1, u2 = u[k], u[k + 1]
    cosb = np.clip(np.sum(u1 * u2, axis=-1), -1.0, 1.0)[..., None]
    b = np.arccos(cosb)
    small = b < 1e-9
    bb = np.where(small, 1.0, b)
    arc = (L / bb) * (np.sin(s * bb) * u1 + (1 - np.cos(s * bb)) * (u2 - cosb * u1) / np.sin(bb))
    out = station[k] + np.where(small, s * L * u1, arc)
    above = (q < md[0])[..., None]
    out = np.where(above, station[0] + (q - md[0])[..., None] * np.array([0.0, 0.0, 1.0]), out)
    below = (q > md[-1])[..., None]
    return np.where(below, station[-1] + (q - md[-1])[..., None] * u[-1], out)


def tvd_at_md(md_query_m, md_m, inc_deg, azi_deg) -> np.ndarray:
    """TVD (m) at any measured depths, along the minimum-curvature arcs between stations
    (the vertical component of :func:`position_at_md`).

    Above the first station the hole is vertical; below the last it continues straight
    along the last station's direction.
    """
    return position_at_md(md_query_m, md_m, inc_deg, azi_deg)[..., 2]


def check_survey_dir(survey_dir: str | Path) -> Path:
    """``survey_dir`` as a Path; :class:`SurveyError` when it is not a folder."""
    folder = Path(survey_dir)
    if not folder.is_dir():
        what = "is a file, not a folder" if folder.exists() else "not found"
        raise SurveyError(f"{folder}: survey folder {what}; give --survey-dir a folder of "
                          "<well>.csv surveys")
    return folder


def find_survey(survey_dir: str | Path, *names: str) -> Path | None:
    """The survey CSV in ``survey_dir`` named after any of ``names`` (well name or file
    stem, matched like tops: case, spaces, ``-``, ``_`` ignored); None when there is none."""
    folder = check_survey_dir(survey_dir)
    keys = {well_key(n) for n in names if n}
    for p in sorted(folder.iterdir()):
        if p.suffix.lower() == ".csv" and well_key(p.stem) in keys:
            return p
    return None


def unmatched_surveys(survey_dir: str | Path, names) -> list[Path]:
    """Survey CSVs in ``survey_dir`` that match none of ``names`` (well names and file
    stems, compared as :func:`find_survey` does): a survey named for a well that is not
    there, or misspelt, would otherwise be ignored without a word."""
    folder = check_survey_dir(survey_dir)
    keys = {well_key(n) for n in names if n}
    return [p for p in sorted(folder.iterdir()) if p.suffix.lower() == ".csv" and well_key(p.stem) not in keys]


def unmatched_survey_warnings(survey_dir: str | Path, names) -> list[str]:
    """One line per survey of :func:`unmatched_surveys`, naming the file and the fix."""
    return [f"{p}: survey matches no well screened (names and file stems are matched without "
            f"case, spaces, '-' or '_'); rename it after its well, or that well is taken as vertical"
            for p in unmatched_surveys(survey_dir, names)]


def _check_dip(bed_dip_deg: float) -> None:
    if not 0 <= bed_dip_deg < 90:
        raise SurveyError(f"bed dip must lie within 0 and 90 degrees (got {bed_dip_deg:g}); "
                          "give --bed-dip from horizontal")


def true_stratigraphic_thickness_m(tvt_m, bed_dip_deg: float):
    """True stratigraphic thickness from true vertical thickness for beds dipping at
    ``bed_dip_deg``: ``TST = TVT cos(dip)`` (common practice, no source).  Exact for a
    vertical well at any dip azimuth; a deviated well needs
    :func:`stratigraphic_thickness_along_path_m`."""
    _check_dip(bed_dip_deg)
    return np.asarray(tvt_m, float) * np.cos(np.radians(bed_dip_deg))


def bed_normal(bed_dip_deg: float, dip_azimuth_deg: float) -> np.ndarray:
    """Unit normal ``(north, east, down)`` of beds dipping ``bed_dip_deg`` towards
    ``dip_azimuth_deg`` (degrees from north), pointing down-section (derived: the plane
    holds the dip direction ``(cos d cos a, cos d sin a, sin d)`` and the strike)."""
    _check_dip(bed_dip_deg)
    d, a = np.radians(bed_dip_deg), np.radians(dip_azimuth_deg)
    return np.array([-np.sin(d) * np.cos(a), -np.sin(d) * np.sin(a), np.cos(d)])


def straight_hole_tst_m(md_length_m, inc_deg, azi_deg, bed_dip_deg: float, dip_azimuth_deg: float):
    """True stratigraphic thickness (m) of a straight hole section of measured length
    ``md_length_m`` at inclination ``inc_deg`` and azimuth ``azi_deg`` through beds of
    dip ``bed_dip_deg`` towards ``dip_azimuth_deg``:
    ``TST = L |cos i cos d - sin i sin d cos(azi - dip_azi)|`` (derived: the hole's
    direction projected on the bed normal).  Drilling down-dip thins, up-dip thickens."""
    u = _unit_vectors(np.asarray(inc_deg, float), np.asarray(azi_deg, float))
    return np.asarray(md_length_m, float) * np.abs(u @ bed_normal(bed_dip_deg, dip_azimuth_deg))


def stratigraphic_thickness_along_path_m(md_top_m, md_base_m, md_m, inc_deg, azi_deg,
                                         bed_dip_deg: float, dip_azimuth_deg: float):
    """True stratigraphic thickness (m) of layers cut by a surveyed well between measured
    depths ``md_top_m`` and ``md_base_m``: the distance between the parallel bed planes
    through the two points, ``|(r(base) - r(top)) . n|`` with positions ``r`` along the
    minimum-curvature path (:func:`position_at_md`) and the bed normal ``n``
    (:func:`bed_normal`).  Exact for planar parallel beds of one dip."""
    n = bed_normal(bed_dip_deg, dip_azimuth_deg)
    top = position_at_md(md_top_m, md_m, inc_deg, azi_deg)
    base = position_at_md(md_base_m, md_m, inc_deg, azi_deg)
    return np.abs((base - top) @ n)


def well_to_tvd(well, md_m, inc_deg, azi_deg, survey_path: str | Path):
    """A copy of a :class:`~logprep.model.WellLog` whose depth axis is TVD from a survey
    already read (:func:`read_survey`); ``survey_path`` names it in messages.

    Raises :class:`SurveyError` when TVD does not increase along the logged interval
    (a hole at or beyond horizontal)."""
    from dataclasses import replace

    tvd = tvd_at_md(well.depth_m, md_m, inc_deg, azi_deg)
    if np.any(np.diff(tvd) <= 0):
        bad = well.depth_m[1:][np.diff(tvd) <= 0][0]
        raise SurveyError(f"{survey_path}: TVD does not increase at MD {bad:.1f} m (horizontal or "
                          f"upward hole); screening needs a depth that increases down the log")
    return replace(well, depth_m=tvd)


def deviated_well(well: WellLog, survey_dir: str | None, picks: pd.DataFrame, *,
                  with_survey: bool = False):
    """The well (and its tops) on TVD when ``survey_dir`` holds a survey for it.

    Returns ``(well, picks, depth_reference, note)``; unchanged with reference
    ``"as logged"`` and no note for a well without a survey (taken as vertical).
    ``with_survey`` adds a fifth item, the survey ``(md_m, inc_deg, azi_deg)`` or None.
    """
    def out(*items, survey=None):
        return (*items, survey) if with_survey else items

    if not survey_dir:
        return out(well, picks, "as logged", None)
    path = find_survey(survey_dir, well.name, Path(well.source).stem)
    if path is None:
        return out(well, picks, "as logged", None)
    md, inc, azi = read_survey(path)
    tvd_well = well_to_tvd(well, md, inc, azi, path)
    if len(picks):
        picks = picks.assign(top_m=tvd_at_md(picks["top_m"].to_numpy(float), md, inc, azi))
    return out(tvd_well, picks, "TVD",
               f"depth axis is TVD below the log's depth reference, from survey {path.name} "
               f"(minimum curvature; max inclination {inc.max():.1f} deg); tops converted too",
               survey=(md, inc, azi))


def md_at_tvd(tvd_query_m, md_m, inc_deg, azi_deg, step_m: float = 0.05) -> np.ndarray:
    """Measured depth (m) at true vertical depths, by inverting :func:`tvd_at_md` on a
    grid of ``step_m`` along the hole (TVD must increase along it, as screening requires;
    the error is second order in the step, far below a millimetre)."""
    q = np.asarray(tvd_query_m, float)
    lo = float(min(np.min(q), md_m[0]))  # MD >= TVD, so the grid starts high enough
    hi = float(max(np.max(q), md_m[-1]))
    while float(tvd_at_md(hi, md_m, inc_deg, azi_deg)) < float(np.max(q)):
        hi = 2.0 * hi - lo + 1.0
    grid = np.linspace(lo, hi, int(np.ceil((hi - lo) / step_m)) + 2)
    tvd = tvd_at_md(grid, md_m, inc_deg, azi_deg)
    return np.interp(q, tvd, grid)


def layer_tst_m(top_m, base_m, bed_dip_deg: float, dip_azimuth_deg: float = 0.0, survey=None):
    """True stratigraphic thickness (m) of layers ``[top_m, base_m]`` (TVD with a survey,
    else depth as logged, taken as vertical): ``TVT cos(dip)`` for a vertical well; along
    the surveyed path (:func:`stratigraphic_thickness_along_path_m`) when ``survey`` is
    ``(md_m, inc_deg, azi_deg)``, which honours the well's direction against the dip."""
    top, base = np.asarray(top_m, float), np.asarray(base_m, float)
    if survey is None:
        return true_stratigraphic_thickness_m(base - top, bed_dip_deg)
    md, inc, azi = survey
    md_top, md_base = md_at_tvd(top, md, inc, azi), md_at_tvd(base, md, inc, azi)
    return stratigraphic_thickness_along_path_m(md_top, md_base, md, inc, azi, bed_dip_deg, dip_azimuth_deg)
