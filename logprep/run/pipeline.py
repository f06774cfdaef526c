"""One well from file to results, in the order of the stages: the Python API that the CLI,
batches and notebooks call.

read (io) -> tops and TVD (io) -> clay volume (clay) -> gaps filled and blocked (layers)
-> windows, SGR field, smear, seal capacity (fault) -> :class:`WellScreening`.

>>> from logprep import ScreenSettings, screen_file                   # doctest: +SKIP
>>> result = screen_file("A-1.las", ScreenSettings(sand_cutoff=0.3))  # doctest: +SKIP
>>> result.windows                                                    # doctest: +SKIP
"""

from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path

import numpy as np
import pandas as pd

from logprep.clay.endpoints import PICK_COLUMNS
from logprep.clay.qc import ND_ONLY, any_flag
from logprep.clay.stage import clay_volume
from logprep.fault.sgr import SgrField
from logprep.fault.stage import fault_stage
from logprep.io.closures import closure_for_well, read_closures_cached
from logprep.io.las import read_well
from logprep.io.survey import deviated_well
from logprep.io.tops import TOPS_COLUMNS, well_tops
from logprep.layers.footing import window_footing
from logprep.layers.stage import Column, blocked_column
from logprep.model import Layers, WellLog
from logprep.run.settings import ScreenSettings

__all__ = ["ScreenSettings", "WellScreening", "screen_column", "screen_file", "screen_well"]


@dataclass(frozen=True)
class WellScreening:
    """Everything computed for one well.

    ``depth_m``/``gr_api``/``vsh`` cover the screened interval (first to last valid GR);
    ``gr_api`` is the GR as read; ``filled`` marks samples whose Vsh was interpolated (GR
    missing, or replaced after QC).  ``vsh_gr`` and ``vsh_nd`` are the two estimates
    before combination (``vsh_nd`` NaN without neutron and density logs); ``qc_flags``
    holds the boolean flags of :data:`logprep.clay.qc.QC_FLAGS`; ``picks`` the endpoint picks
    per zone (``picks.csv``); ``gr_clean_line``/``gr_shale_line`` the lines per sample.
    ``gr_clean_api``/``gr_shale_api`` are the whole-well lines, for reference.
    ``survey`` is the deviation survey ``(md_m, inc_deg, azi_deg)`` the depths were put on
    TVD with (None for a well taken as vertical).  ``settings.capacity.closure_m`` is the
    closure the well was screened with and ``closure_source`` where it came from (the
    closures file and row, or ``--closure``).
    """

    well: WellLog
    settings: ScreenSettings
    depth_m: np.ndarray
    gr_api: np.ndarray
    vsh: np.ndarray
    filled: np.ndarray
    gr_clean_api: float
    gr_shale_api: float
    layers: Layers
    windows: pd.DataFrame
    tops: pd.DataFrame = field(default_factory=lambda: pd.DataFrame(columns=TOPS_COLUMNS))
    notes: tuple[str, ...] = field(default_factory=tuple)
    vsh_gr: np.ndarray | None = None
    vsh_nd: np.ndarray | None = None
    qc_flags: dict = field(default_factory=dict)
    picks: pd.DataFrame = field(default_factory=lambda: pd.DataFrame(columns=PICK_COLUMNS))
    gr_clean_line: np.ndarray | None = None
    gr_shale_line: np.ndarray | None = None
    grid: SgrField | None = None
    depth_reference: str = "as logged"
    rock: np.ndarray | None = None
    unusable: dict | None = None
    faults: tuple = ()
    survey: tuple | None = None
    closure_source: str = "--closure"

    @property
    def warnings(self) -> tuple[str, ...]:
        """What the reader changed or doubts in this well (see :attr:`WellLog.warnings`),
        shown in ``qc.csv``, on the sheet and in ``summary.csv``."""
        return tuple(self.well.warnings)

    @property
    def min_window_sgr_pct(self) -> float:
        """Lowest SGR over all sand-sand windows that are not a sand against itself
        (NaN when there are none)."""
        w = self.windows[~self.windows["self_juxtaposed"]]
        return float(w["sgr_min_pct"].min()) if len(w) else float("nan")


def screen_well(
    well: WellLog,
    settings: ScreenSettings = ScreenSettings(),
    *,
    tops: pd.DataFrame | None = None,
) -> WellScreening:
    """Run the screening science on a well already read.

    ``tops`` is a tops table for any number of wells (see :mod:`logprep.io.tops`); when it
    is None and ``settings.input.tops_file`` is set, that file is read.
    """
    settings, closure_source = well_closure(well, settings)
    fld, inp = settings.field, settings.input
    well, picks, depth_ref, cv, col, notes, survey = _column_stages(well, settings, tops)
    depth, vsh, filled, layers = cv.depth_m, col.vsh, col.filled, col.layers
    windows, sgr, fault_notes = fault_stage(well, layers, depth, vsh, fld, settings.capacity,
                                            settings.fault_rock, inp.bed_dip_deg,
                                            closure_source=closure_source)
    notes.extend(fault_notes)
    windows = windows.join(window_footing(windows, layers.filled_fraction, layers.flagged_fraction,
                                          layers.thickness_m, thin_m=settings.layers.thin_bed_m))
    return WellScreening(
        well=well, settings=settings, depth_m=depth, gr_api=cv.gr_api, vsh=vsh, filled=filled,
        gr_clean_api=cv.gr_clean_api, gr_shale_api=cv.gr_shale_api, layers=layers,
        windows=windows, tops=picks, notes=tuple(notes), vsh_gr=cv.vsh_gr, vsh_nd=cv.vsh_nd,
        qc_flags=cv.qc_flags, picks=cv.picks, gr_clean_line=cv.gr_clean_line,
        gr_shale_line=cv.gr_shale_line, grid=sgr,
        depth_reference=depth_ref, rock=cv.rock, unusable=cv.unusable, survey=survey,
        closure_source=closure_source,
    )


def well_closure(well: WellLog, settings: ScreenSettings) -> tuple[ScreenSettings, str]:
    """The settings with the well's own closure (``settings.input.closures_file``, matched
    by WELL name or file stem) in place of ``closure_m``, and where the closure came from
    (for the sheet).  A well the file does not list keeps ``--closure``."""
    path = settings.input.closures_file
    if path:
        hit = closure_for_well(read_closures_cached(path), well.name, Path(well.source or "").stem)
        if hit is not None:
            value, name = hit
            return settings.updated(closure_m=value), f"{Path(path).name}, well {name}"
    return settings, "--closure"


def _column_stages(well: WellLog, settings: ScreenSettings, tops):
    """Tops and TVD, clay volume and the blocked column: every stage up to ``layers.csv``."""
    inp, lay = settings.input, settings.layers
    picks = well_tops(well, inp.tops_file, tops)
    well, picks, depth_ref, survey_note, survey = deviated_well(well, inp.survey_dir, picks, with_survey=True)
    cv = clay_volume(well, settings.clay, picks)
    notes = [f"warning: {w}" for w in well.warnings] + list(cv.notes) \
        + ([survey_note] if survey_note else [])
    if (~np.isfinite(cv.vsh)).any():
        notes.append(f"{int((~np.isfinite(cv.vsh)).sum())} GR samples missing or replaced after "
                     "QC; Vsh interpolated there")
    forced = picks["top_m"].to_numpy(float) if lay.honour_tops else ()
    if lay.honour_tops and len(picks) == 0:
        notes.append("no formation tops for this well; layers not tied to tops")
    col = blocked_column(cv.depth_m, cv.vsh, lay, forced_m=forced, rock=cv.rock,
                         unusable=cv.unusable, flagged=qc_flagged(cv.qc_flags))
    return well, picks, depth_ref, cv, col, notes + list(col.notes), survey


def qc_flagged(flags: dict) -> np.ndarray | None:
    """Samples with any GR-side QC flag (the neutron-density-only flags aside)."""
    if not flags:
        return None
    return any_flag(flags, [k for k in flags if k not in ND_ONLY])


def screen_column(well: WellLog, settings: ScreenSettings = ScreenSettings(), *,
                  tops: pd.DataFrame | None = None) -> Column:
    """The blocked column of a well exactly as :func:`screen_well` writes it to
    ``layers.csv``, without the fault stages (for validation and tuning)."""
    return _column_stages(well, settings, tops)[4]


def screen_file(
    path: str | Path,
    settings: ScreenSettings = ScreenSettings(),
    *,
    tops: pd.DataFrame | None = None,
) -> WellScreening:
    """Read a LAS file and screen it (``tops`` as in :func:`screen_well`)."""
    well = read_well(path, gr_curve=settings.input.gr_curve, depth_unit=settings.input.depth_unit)
    return screen_well(well, settings, tops=tops)
