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
    df = read_csv_table(path, SurveyError, "survey CSV", comment="#")
    cols = {str(c).strip().lower(): c for c in df.columns}
    md_col = next((c for c in _MD if c in cols), None)
    inc_col = next((c for c in _INC if c in cols), None)
    azi_col = next((c for c in _AZI if c in cols), None)
    if md_col is None or inc_col is None or azi_col is None:
        raise SurveyError(f"{path}: needs columns md_m (or md_ft), inc_deg and azi_deg; "
                          f"found {', '.join(map(str, df.columns))}")
    try:
        md = df[cols[md_col]].astype(float).to_numpy() * _MD[md_col]
        inc = df[cols[inc_col]].astype(float).to_numpy()
        azi = df[cols[azi_col]].astype(float).to_numpy()
    except ValueError:
        raise SurveyError(f"{path}: a survey value is not a number") from None
    if md.size < 2 or not np.isfinite(np.stack([md, inc, azi])).all():
        raise SurveyError(f"{path}: needs at least two complete stations")
    if np.any(np.diff(md) <= 0):
        raise SurveyError(f"{path}: measured depth must increase from station to station")
    if np.any((inc < 0) | (inc > 180)):
        raise SurveyError(f"{path}: inclination must lie within 0-180 degrees")
    return md, inc, np.mod(azi, 360.0)


def station_tvd_m(md_m, inc_deg, azi_deg) -> np.ndarray:
    """TVD (m) at the survey stations by minimum curvature (wellpathpy), with the hole
    above the first station vertical."""
    from wellpathpy.mincurve import minimum_curvature

    md = np.asarray(md_m, float)
    tvd, _, _, _ = minimum_curvature(md, np.asarray(inc_deg, float), np.asarray(azi_deg, float))
    return md[0] + np.asarray(tvd, float)


def _unit_vectors(inc_deg, azi_deg) -> np.ndarray:
    i, a = np.radians(inc_deg), np.radians(azi_deg)
    return np.stack([np.sin(i) * np.cos(a), np.sin(i) * np.sin(a), np.cos(i)], axis=-1)


def tvd_at_md(md_query_m, md_m, inc_deg, azi_deg) -> np.ndarray:
    """TVD (m) at any measured depths, along the minimum-curvature arcs between stations.

    Above the first station the hole is vertical; below the last it continues straight
    along the last station's direction.
    """
    md = np.asarray(md_m, float)
    q = np.asarray(md_query_m, float)
    station = station_tvd_m(md, inc_deg, azi_deg)
    u = _unit_vectors(np.asarray(inc_deg, float), np.asarray(azi_deg, float))
    k = np.clip(np.searchsorted(md, q, side="right") - 1, 0, md.size - 2)
    L = md[k + 1] - md[k]
    s = (q - md[k]) / L
    c1, c2 = u[k, 2], u[k + 1, 2]
    cosb = np.clip(np.sum(u[k] * u[k + 1], axis=-1), -1.0, 1.0)
    b = np.arccos(cosb)
    small = b < 1e-9
    bb = np.where(small, 1.0, b)
    R = L / bb
    arc = R * (np.sin(s * bb) * c1 + (1 - np.cos(s * bb)) * (c2 - cosb * c1) / np.sin(bb))
    line = s * L * c1
    out = station[k] + np.where(small, line, arc)
    out = np.where(q < md[0], q, out)  # vertical above the first station
    below = q > md[-1]
    return np.where(below, station[-1] + (q - md[-1]) * u[-1, 2], out)


def check_survey_dir(survey_dir: str | Path) -> Path:
    """``survey_dir`` as a Path; :class:`SurveyError` when it is not a folder."""
    folder = Path(survey_dir)
    if not folder.is_dir():
        what = "is a file, not a folder" if folder.exists() else "not found"
        raise SurveyError(f"{folder}: survey folder {what} (--survey-dir names a folder of "
                          "<well>.csv surveys)")
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


def true_stratigraphic_thickness_m(tvt_m, bed_dip_deg: float):
    """True stratigraphic thickness from true vertical thickness for beds dipping at
    ``bed_dip_deg``: ``TST = TVT cos(dip)`` (common practice, no source)."""
    if not 0 <= bed_dip_deg < 90:
        raise SurveyError(f"bed dip must lie within 0 and 90 degrees (got {bed_dip_deg:g})")
    return np.asarray(tvt_m, float) * np.cos(np.radians(bed_dip_deg))


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


def deviated_well(well: WellLog, survey_dir: str | None, picks: pd.DataFrame):
    """The well (and its tops) on TVD when ``survey_dir`` holds a survey for it.

    Returns ``(well, picks, depth_reference, note)``; unchanged with reference
    ``"as logged"`` and no note for a well without a survey (taken as vertical).
    """
    if not survey_dir:
        return well, picks, "as logged", None
    path = find_survey(survey_dir, well.name, Path(well.source).stem)
    if path is None:
        return well, picks, "as logged", None
    md, inc, azi = read_survey(path)
    tvd_well = well_to_tvd(well, md, inc, azi, path)
    if len(picks):
        picks = picks.assign(top_m=tvd_at_md(picks["top_m"].to_numpy(float), md, inc, azi))
    return (tvd_well, picks, "TVD",
            f"depth axis is TVD below the log's depth reference, from survey {path.name} "
            f"(minimum curvature; max inclination {inc.max():.1f} deg); tops converted too")
