"""One well from file to results: the Python API that the CLI and notebooks call.

>>> from logprep.pipeline import ScreenSettings, screen_file          # doctest: +SKIP
>>> result = screen_file("A-1.las", ScreenSettings(sand_cutoff=0.3))  # doctest: +SKIP
>>> result.windows                                                    # doctest: +SKIP
"""

from __future__ import annotations

from dataclasses import asdict, dataclass, field, replace
from pathlib import Path

import numpy as np
import pandas as pd

from logprep.blocking import check_cutoffs, fill_gaps, get_blocking_method
from logprep.errors import SettingsError
from logprep.juxtaposition import juxtaposition_grid, sand_windows, sgr_layered_pct
from logprep.lasread import read_well
from logprep.model import Layers, WellLog
from logprep.tops import TOPS_COLUMNS, read_tops, tops_for_well
from logprep.vshale import get_transform, parse_endpoint, resolve_endpoint, vsh_from_gr


@dataclass(frozen=True)
class ScreenSettings:
    """Every choice of a screening run.  Defaults are starting points, not calibrations.

    Attributes
    ----------
    transform : str
        IGR -> Vsh transform, a key of :data:`logprep.vshale.TRANSFORMS`.
    gr_clean, gr_shale : float or str
        GR endpoints: a value in API, or a percentile ``"pN"`` of the well's readings.
    sand_cutoff, shale_cutoff : float
        Vsh cut-offs (fraction) for sand / heterolith / shale.
    min_bed_m : float
        Minimum layer thickness (m); thinner beds merge into a neighbour.
    throw_max_m : float
        Largest throw screened (m).
    blocking : str
        Blocking method, a key of :data:`logprep.blocking.BLOCKING_METHODS`.
    sgr_threshold_pct : float
        SGR above which a fault is taken to seal in the screening verdict.  About 15-20 %
        in many calibrations (Yielding et al. 1997; Yielding 2002): calibrate locally.
    gr_curve : str or None
        Gamma-ray mnemonic to use instead of the alias search.
    depth_unit : str or None
        Depth unit to assume when a file does not state one.
    tops_file : str or None
        Formation tops (CSV ``well, top_m, name``, a markers file, or a folder of them);
        the picks of each well are matched by well name or file stem.
    """

    transform: str = "linear"
    gr_clean: float | str = "p5"
    gr_shale: float | str = "p95"
    sand_cutoff: float = 0.35
    shale_cutoff: float = 0.65
    min_bed_m: float = 1.0
    throw_max_m: float = 300.0
    blocking: str = "cutoff"
    sgr_threshold_pct: float = 20.0
    gr_curve: str | None = None
    depth_unit: str | None = None
    tops_file: str | None = None

    def __post_init__(self) -> None:
        get_transform(self.transform)
        get_blocking_method(self.blocking)
        object.__setattr__(self, "gr_clean", parse_endpoint(self.gr_clean))
        object.__setattr__(self, "gr_shale", parse_endpoint(self.gr_shale))
        check_cutoffs(self.sand_cutoff, self.shale_cutoff)
        if not self.min_bed_m >= 0:
            raise SettingsError(f"--min-bed must be >= 0 m (got {self.min_bed_m:g})")
        if not self.throw_max_m > 0:
            raise SettingsError(f"--throw-max must be > 0 m (got {self.throw_max_m:g})")
        if not 0 <= self.sgr_threshold_pct <= 100:
            raise SettingsError(f"SGR threshold must be within 0-100 % (got {self.sgr_threshold_pct:g})")

    def to_dict(self) -> dict:
        return asdict(self)

    def updated(self, **changes) -> "ScreenSettings":
        """A copy with some settings changed (validated again)."""
        return replace(self, **changes)


@dataclass(frozen=True)
class WellScreening:
    """Everything computed for one well.

    ``depth_m``/``gr_api``/``vsh`` cover the screened interval (first to last valid GR);
    ``filled`` marks samples whose GR was missing and whose Vsh was interpolated.
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

    @property
    def min_window_sgr_pct(self) -> float:
        """Lowest SGR over all sand-sand windows that are not a sand against itself
        (NaN when there are none)."""
        w = self.windows[~self.windows["self_juxtaposed"]]
        return float(w["sgr_min_pct"].min()) if len(w) else float("nan")

    def grids(self, n_depth: int = 500, n_throw: int = 300):
        """Depth and throw axes with the SGR (%) and juxtaposition-class grids for the
        triangle diagram: ``(depth_m, throw_m, sgr_pct, juxtaposition)``."""
        top, base = self.layers.top_m[0], self.layers.base_m[-1]
        depth = np.linspace(top, base, n_depth)
        throw = np.linspace(0.0, self.settings.throw_max_m, n_throw)
        sgr = sgr_layered_pct(self.layers, depth[:, None], throw[None, :])
        jux = juxtaposition_grid(self.layers, depth, throw)
        return depth, throw, sgr, jux


def well_tops(well: WellLog, settings: ScreenSettings, tops: pd.DataFrame | None = None) -> pd.DataFrame:
    """The tops of ``well`` from ``tops`` (all wells) or from ``settings.tops_file``;
    matched on the WELL name or the file stem.  Empty when there are none."""
    if tops is None:
        if not settings.tops_file:
            return pd.DataFrame(columns=TOPS_COLUMNS)
        tops = read_tops(settings.tops_file)
    return tops_for_well(tops, well.name, Path(well.source).stem)


def screen_well(
    well: WellLog,
    settings: ScreenSettings = ScreenSettings(),
    *,
    tops: pd.DataFrame | None = None,
) -> WellScreening:
    """Run the screening science on a well already read.

    ``tops`` is a tops table for any number of wells (see :mod:`logprep.tops`); when it is
    None and ``settings.tops_file`` is set, that file is read.
    """
    picks = well_tops(well, settings, tops)
    gr_all = well.gr_api
    valid = np.flatnonzero(np.isfinite(gr_all))
    if valid.size < 2:
        raise SettingsError(f"{well.source}: fewer than two valid GR samples")
    sl = slice(valid[0], valid[-1] + 1)
    depth, gr = well.depth_m[sl], gr_all[sl]
    notes = []
    clean = resolve_endpoint(settings.gr_clean, gr)
    shale = resolve_endpoint(settings.gr_shale, gr)
    if clean >= shale:
        raise SettingsError(
            f"{well.source}: GR clean line {clean:.1f} API is not below the shale line "
            f"{shale:.1f} API; set --gr-clean/--gr-shale"
        )
    vsh_raw = vsh_from_gr(gr, clean, shale, settings.transform)
    vsh, filled = fill_gaps(depth, vsh_raw)
    if filled.any():
        notes.append(
            f"{int(filled.sum())} missing GR samples inside the interval; Vsh interpolated there"
        )
    method = get_blocking_method(settings.blocking)
    layers = method(
        depth, vsh,
        sand_cutoff=settings.sand_cutoff, shale_cutoff=settings.shale_cutoff,
        min_bed_m=settings.min_bed_m, filled=filled,
    )
    windows = sand_windows(layers, settings.throw_max_m)
    return WellScreening(
        well=well, settings=settings, depth_m=depth, gr_api=gr, vsh=vsh, filled=filled,
        gr_clean_api=clean, gr_shale_api=shale, layers=layers, windows=windows,
        tops=picks, notes=tuple(notes),
    )


def screen_file(
    path: str | Path,
    settings: ScreenSettings = ScreenSettings(),
    *,
    tops: pd.DataFrame | None = None,
) -> WellScreening:
    """Read a LAS file and screen it (``tops`` as in :func:`screen_well`)."""
    well = read_well(path, gr_curve=settings.gr_curve, depth_unit=settings.depth_unit)
    return screen_well(well, settings, tops=tops)
