"""Settings of the input stage: which curve, which depth unit, and the side inputs (tops,
deviation surveys) of a screening run."""

from __future__ import annotations

from dataclasses import dataclass

from logprep.errors import SettingsError, require_finite_fields
from logprep.io.las import DEPTH_UNITS_M


@dataclass(frozen=True)
class InputSettings:
    """How wells and their side inputs are read.

    Attributes
    ----------
    gr_curve : str or None
        Gamma-ray mnemonic to use instead of the alias search.
    depth_unit : str or None
        Depth unit to assume when a file does not state one (``m`` or ``ft``).
    tops_file : str or None
        Formation tops (CSV ``well, top_m, name``, a markers file, or a folder of them);
        the picks of each well are matched by well name or file stem.
    survey_dir : str or None
        Folder of deviation surveys, ``<well name or file stem>.csv`` (MD, inclination,
        azimuth; see :mod:`logprep.io.survey`).  A well with a survey is screened on TVD by
        minimum curvature; a well without one is taken as vertical.
    closures_file : str or None
        Structural closure per well (CSV ``well, closure_m``, see :mod:`logprep.io.closures`):
        a well it lists takes its closure instead of ``closure_m`` (``--closure``).
    bed_dip_deg : float
        Bed dip (degrees) for the true stratigraphic thickness ``tst_m`` in ``layers.csv``.
    bed_dip_azimuth_deg : float
        Direction of that dip (degrees from north).  It matters only for a deviated well:
        drilling down-dip thins the stratigraphic thickness per metre drilled, up-dip
        thickens it (see :func:`logprep.io.survey.straight_hole_tst_m`).
    well_time_limit_s : float
        Seconds one well may take (reading, screening, drawing) before it is stopped and
        becomes an error row; 0 = no limit.  A well pair gets twice this (two wells).  It
        bounds the run, not the results, so it is not part of the settings hash that
        decides which wells a rerun redoes.
    """

    gr_curve: str | None = None
    depth_unit: str | None = None
    tops_file: str | None = None
    survey_dir: str | None = None
    closures_file: str | None = None
    bed_dip_deg: float = 0.0
    bed_dip_azimuth_deg: float = 0.0
    well_time_limit_s: float = 900.0

    def __post_init__(self) -> None:
        require_finite_fields(self)
        if self.depth_unit is not None and self.depth_unit.strip().upper() not in DEPTH_UNITS_M:
            raise SettingsError(f"unknown depth unit {self.depth_unit!r}; use m or ft")
        if not 0 <= self.bed_dip_deg < 90:
            raise SettingsError(f"--bed-dip must lie within 0 and 90 degrees (got {self.bed_dip_deg:g}); "
                                "give the bed dip from horizontal (bed_dip_deg in a settings file)")
        if not 0 <= self.bed_dip_azimuth_deg <= 360:
            raise SettingsError(f"--bed-dip-azimuth must lie within 0 and 360 degrees "
                                f"(got {self.bed_dip_azimuth_deg:g}); give a bearing from north in degrees")
        if not self.well_time_limit_s >= 0:
            raise SettingsError(f"--well-time-limit must be >= 0 s (got {self.well_time_limit_s:g}); give "
                                "the seconds a well may take, or 0 for no limit (well_time_limit_s in "
                                "a settings file)")
