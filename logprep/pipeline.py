"""One well from file to results: the Python API that the CLI and notebooks call.

>>> from logprep.pipeline import ScreenSettings, screen_file          # doctest: +SKIP
>>> result = screen_file("A-1.las", ScreenSettings(sand_cutoff=0.3))  # doctest: +SKIP
>>> result.windows                                                    # doctest: +SKIP
"""

from __future__ import annotations

from dataclasses import asdict, dataclass, field, fields, replace
from pathlib import Path

import numpy as np
import pandas as pd

from logprep.blocking import block_with_boundaries, check_cutoffs, fill_gaps, get_blocking_method
from logprep.capacity import (
    CO2_DENSITY_MODES, CapacityParams, capacity_params, depth_datum, seal_capacity_table,
)
from logprep.errors import SettingsError
from logprep.juxtaposition import sand_windows
from logprep.endpoints import (
    PICK_COLUMNS, ZONINGS, lines_per_sample, nd_shale_separation, pick_endpoints, zone_bounds,
)
from logprep.lasread import DEPTH_UNITS_M, read_well, well_curve
from logprep.model import Layers, WellLog
from logprep.units import LENGTH_UNITS
from logprep.qc import ND_ONLY, REPLACED, QcSettings, any_flag, density_correction_flags, gr_flags, inches
from logprep.sgr import SGR_FIELD_SOURCES, SgrField, sgr_field
from logprep.smear import window_smear, with_smear_fields
from logprep.twowell import SLIP_SOURCES
from logprep.survey import find_survey, read_survey, tvd_at_md, well_to_tvd
from logprep.tops import TOPS_COLUMNS, read_tops, tops_for_well
from logprep.vshale import (
    density_correction_g_cm3, density_g_cm3, density_porosity, gamma_ray_index, gas_crossover, get_combination,
    get_transform, neutron_v_v, parse_endpoint, vsh_neutron_density,
)


def parse_number_list(value, name: str) -> tuple[float, ...]:
    """A tuple of floats from a sequence or a comma-separated string (``"3000,3500"``)."""
    items = value.split(",") if isinstance(value, str) else value
    try:
        return tuple(float(v) for v in items)
    except (TypeError, ValueError):
        raise SettingsError(f"{name}: expected comma-separated numbers (got {value!r})") from None


_CAP = CapacityParams()  # seal-capacity defaults live in one place


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
    brine_density_kgm3, oil_density_kgm3, gas_density_kgm3, co2_density_kgm3 : float
        Fluid densities (kg/m3) for column heights.  Defaults 1050 / 750 / 250 / 700 lie
        within the handbook ranges (AAPG Wiki gradients; IPCC 2005 for CO2): set your own.
    co2_density_mode : str
        ``fixed`` (``co2_density_kgm3``) or ``eos``: Span & Wagner (1996) through CoolProp at
        the hydrostatic pressure and geothermal temperature of each window's contact.
    surface_temp_c, geothermal_gradient_c_per_km : float
        Temperature at sea level (deg C) and geothermal gradient (deg C/km) for ``eos``.
    max_burial_m : float or None
        Maximum burial depth (m) for the pressure envelope; None uses each window's
        shallowest contact depth below sea level (or as logged when the header gives no
        elevation).
    envelope_sgr_scale_pct, envelope_class_bounds_m, envelope_class_c
        Envelope ``FZP (bar) = 10^(SGR/scale - C)`` with ``C`` per burial class (Bretan,
        Yielding & Jones 2003: 27; 3000, 3500 m; 0.5, 0.25, 0).  Replace with a local
        calibration where one exists.
    sgr_leak_pct : float
        Window verdict ``leak`` below this minimum SGR, ``seal`` from ``sgr_threshold_pct``
        up, ``uncertain`` between.
    length_unit : str
        ``m`` or ``ft``: unit of column heights on the sheet (``ft`` also adds
        ``column_*_ft`` columns to the table).
    cell_length_m, matrix_perm_md : float
        Simulation cell length (m) and matrix permeability (mD) for the transmissibility
        multiplier.
    faulting_depth_m : float or None
        Depth at the time of faulting (m) for the Sperrevik et al. (2002) permeability;
        None takes the burial depth.
    zoning : str
        How the well is cut into zones for the GR endpoint picks, one of
        :data:`logprep.endpoints.ZONINGS`: ``auto`` (tops when the well has some, else
        changepoints of the GR baseline), ``tops``, ``changepoint`` or ``none``.
    zone_min_m : float
        Shortest zone (m) the changepoint split makes.
    zone_step_api : float
        Least step (API) of the GR baseline between two changepoint zones.
    min_contrast : float
        A zone whose clean-shale contrast is below this fraction of the well's is treated
        as one-sided (see :func:`logprep.endpoints.pick_endpoints`).
    vsh_combine : str
        How the GR and neutron-density Vsh make the chosen Vsh, a key of
        :data:`logprep.vshale.COMBINATIONS` (``gr`` ignores neutron-density).
    washout_in : float
        Caliper over bit size (inches) above which a sample is a washout.
    drho_max_g_cm3 : float
        Density correction ``|DRHO|`` (g/cm3) above which the density reading is not
        trusted: neutron-density Vsh is not used there (GR alone).
    changepoint_penalty : float
        For ``blocking = "changepoint"``: cost of one change of mean Vsh, as a multiple of
        (noise sd)^2 x ln(samples); 2 matches the Schwarz criterion, larger gives fewer
        layers (see :func:`logprep.blocking.block_changepoint`).
    honour_tops : bool
        Force a layer boundary at every formation top of the well (needs ``tops_file``).
    sgr_field_source : str
        Clay source of the SGR field (``sgr_field.npz`` and the triangle diagram), a key of
        :data:`logprep.sgr.SGR_FIELD_SOURCES`: ``layers`` (blocked column) or ``curve``
        (continuous Vsh, partial samples weighted by length).
    field_depth_step_m : float or None
        Row spacing of the field (m), rounded to a whole number of log samples (at least
        one); None takes every sample.
    field_throw_step_m : float
        Column spacing of the field (m).
    survey_dir : str or None
        Folder of deviation surveys, ``<well name or file stem>.csv`` (MD, inclination,
        azimuth; see :mod:`logprep.survey`).  A well with a survey is screened on TVD by
        minimum curvature; a well without one is taken as vertical.
    bed_dip_deg : float
        Bed dip (degrees) for the true stratigraphic thickness ``tst_m`` in ``layers.csv``.
    pair_slip_source : str
        For well pairs (``--pairs``): the column the slipped interval is taken from, a key
        of :data:`logprep.twowell.SLIP_SOURCES` (``footwall``, ``hangingwall``, ``average``).
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
    brine_density_kgm3: float = _CAP.rho_brine_kgm3
    oil_density_kgm3: float = _CAP.rho_oil_kgm3
    gas_density_kgm3: float = _CAP.rho_gas_kgm3
    co2_density_kgm3: float = _CAP.rho_co2_kgm3
    co2_density_mode: str = _CAP.co2_density_mode
    surface_temp_c: float = _CAP.surface_temp_c
    geothermal_gradient_c_per_km: float = _CAP.geothermal_gradient_c_per_km
    max_burial_m: float | None = None
    envelope_sgr_scale_pct: float = _CAP.sgr_scale_pct
    envelope_class_bounds_m: tuple[float, ...] = _CAP.class_bounds_m
    envelope_class_c: tuple[float, ...] = _CAP.class_c
    sgr_leak_pct: float = _CAP.leak_below_pct
    length_unit: str = "m"
    cell_length_m: float = _CAP.cell_length_m
    matrix_perm_md: float = _CAP.matrix_perm_md
    faulting_depth_m: float | None = None
    zoning: str = "auto"
    zone_min_m: float = 400.0
    zone_step_api: float = 8.0
    min_contrast: float = 0.7
    vsh_combine: str = "mean"
    washout_in: float = 1.5
    drho_max_g_cm3: float = 0.10
    changepoint_penalty: float = 2.0
    honour_tops: bool = False
    sgr_field_source: str = "layers"
    field_depth_step_m: float | None = 0.5
    field_throw_step_m: float = 1.0
    survey_dir: str | None = None
    bed_dip_deg: float = 0.0
    pair_slip_source: str = "footwall"

    def __post_init__(self) -> None:
        for f in fields(self):
            value = getattr(self, f.name)
            if isinstance(value, (int, float)) and not isinstance(value, bool) \
                    and not np.isfinite(value):
                raise SettingsError(f"setting {f.name} must be a finite number (got {value})")
        get_transform(self.transform)
        if self.depth_unit is not None and self.depth_unit.strip().upper() not in DEPTH_UNITS_M:
            raise SettingsError(f"unknown depth unit {self.depth_unit!r}; use m or ft")
        get_combination(self.vsh_combine)
        if self.zoning not in ZONINGS:
            raise SettingsError(f"unknown zoning {self.zoning!r}; choose one of {', '.join(ZONINGS)}")
        if not self.zone_min_m > 0:
            raise SettingsError(f"--zone-min must be > 0 m (got {self.zone_min_m:g})")
        if not self.zone_step_api >= 0:
            raise SettingsError(f"--zone-step must be >= 0 API (got {self.zone_step_api:g})")
        if not 0 <= self.min_contrast <= 1:
            raise SettingsError(f"--min-contrast must be within 0-1 (got {self.min_contrast:g})")
        if not self.washout_in > 0:
            raise SettingsError(f"--washout must be > 0 in (got {self.washout_in:g})")
        if not self.drho_max_g_cm3 > 0:
            raise SettingsError(f"--drho-max must be > 0 g/cm3 (got {self.drho_max_g_cm3:g})")
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
        if self.pair_slip_source not in SLIP_SOURCES:
            raise SettingsError(f"unknown pair slip source {self.pair_slip_source!r}; use one of "
                                f"{', '.join(SLIP_SOURCES)}")
        if not 0 <= self.bed_dip_deg < 90:
            raise SettingsError(f"--bed-dip must lie within 0 and 90 degrees (got {self.bed_dip_deg:g})")
        if not self.changepoint_penalty >= 0:
            raise SettingsError(
                f"--changepoint-penalty must be >= 0 (got {self.changepoint_penalty:g})")
        if self.sgr_field_source not in SGR_FIELD_SOURCES:
            raise SettingsError(f"unknown SGR field source {self.sgr_field_source!r}; use one of "
                                f"{', '.join(SGR_FIELD_SOURCES)}")
        if self.field_depth_step_m is not None and not self.field_depth_step_m > 0:
            raise SettingsError(f"--field-depth-step must be > 0 m (got {self.field_depth_step_m:g})")
        if not self.field_throw_step_m > 0:
            raise SettingsError(f"--field-throw-step must be > 0 m (got {self.field_throw_step_m:g})")
        self._check_capacity()

    def _check_capacity(self) -> None:
        for name in ("envelope_class_bounds_m", "envelope_class_c"):
            object.__setattr__(self, name, parse_number_list(getattr(self, name), name))
        b, c = self.envelope_class_bounds_m, self.envelope_class_c
        if list(b) != sorted(b) or len(c) != len(b) + 1:
            raise SettingsError(
                f"--envelope-bounds must increase and --envelope-c have one more value "
                f"(got bounds {list(b)}, C {list(c)})"
            )
        if not 0 <= self.sgr_leak_pct <= self.sgr_threshold_pct:
            raise SettingsError(
                f"--sgr-leak ({self.sgr_leak_pct:g} %) must be within 0 and the SGR threshold "
                f"({self.sgr_threshold_pct:g} %)"
            )
        if not self.envelope_sgr_scale_pct > 0:
            raise SettingsError(f"--envelope-scale must be > 0 (got {self.envelope_sgr_scale_pct:g})")
        for name in ("oil", "gas", "co2"):
            rho = getattr(self, f"{name}_density_kgm3")
            if not 0 < rho < self.brine_density_kgm3:
                raise SettingsError(
                    f"--{name}-density {rho:g} kg/m3 must be > 0 and below the brine density "
                    f"{self.brine_density_kgm3:g} kg/m3"
                )
        if self.co2_density_mode not in CO2_DENSITY_MODES:
            raise SettingsError(
                f"unknown CO2 density mode {self.co2_density_mode!r}; use one of {', '.join(CO2_DENSITY_MODES)}"
            )
        if self.length_unit not in LENGTH_UNITS:
            raise SettingsError(f"unknown length unit {self.length_unit!r}; use one of {', '.join(LENGTH_UNITS)}")
        for name in ("cell_length_m", "matrix_perm_md"):
            if not getattr(self, name) > 0:
                raise SettingsError(f"{name} must be > 0 (got {getattr(self, name):g})")
        for name in ("max_burial_m", "faulting_depth_m"):
            v = getattr(self, name)
            if v is not None and not v >= 0:
                raise SettingsError(f"{name} must be >= 0 m (got {v:g})")

    def blocking_kwargs(self) -> dict:
        """The keyword arguments every blocking method receives."""
        return dict(sand_cutoff=self.sand_cutoff, shale_cutoff=self.shale_cutoff,
                    min_bed_m=self.min_bed_m, changepoint_penalty=self.changepoint_penalty)

    def to_dict(self) -> dict:
        return asdict(self)

    def updated(self, **changes) -> "ScreenSettings":
        """A copy with some settings changed (validated again)."""
        return replace(self, **changes)


@dataclass(frozen=True)
class WellScreening:
    """Everything computed for one well.

    ``depth_m``/``gr_api``/``vsh`` cover the screened interval (first to last valid GR);
    ``gr_api`` is the GR as read; ``filled`` marks samples whose Vsh was interpolated (GR
    missing, or replaced after QC).  ``vsh_gr`` and ``vsh_nd`` are the two estimates
    before combination (``vsh_nd`` NaN without neutron and density logs); ``qc_flags``
    holds the boolean flags of :data:`logprep.qc.QC_FLAGS`; ``picks`` the endpoint picks
    per zone (``picks.csv``); ``gr_clean_line``/``gr_shale_line`` the lines per sample.
    ``gr_clean_api``/``gr_shale_api`` are the whole-well lines, for reference.
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

    @property
    def min_window_sgr_pct(self) -> float:
        """Lowest SGR over all sand-sand windows that are not a sand against itself
        (NaN when there are none)."""
        w = self.windows[~self.windows["self_juxtaposed"]]
        return float(w["sgr_min_pct"].min()) if len(w) else float("nan")


def well_tops(well: WellLog, settings: ScreenSettings, tops: pd.DataFrame | None = None) -> pd.DataFrame:
    """The tops of ``well`` from ``tops`` (all wells) or from ``settings.tops_file``;
    matched on the WELL name or the file stem.  Empty when there are none."""
    if tops is None:
        if not settings.tops_file:
            return pd.DataFrame(columns=TOPS_COLUMNS)
        tops = read_tops(settings.tops_file)
    return tops_for_well(tops, well.name, Path(well.source).stem)


@dataclass(frozen=True)
class ClayVolume:
    """The clay-volume stage of one well (see :func:`clay_volume`)."""

    depth_m: np.ndarray
    gr_api: np.ndarray
    vsh_gr: np.ndarray
    vsh_nd: np.ndarray
    vsh: np.ndarray
    qc_flags: dict
    picks: pd.DataFrame
    gr_clean_line: np.ndarray
    gr_shale_line: np.ndarray
    gr_clean_api: float
    gr_shale_api: float
    notes: tuple[str, ...]


def _curve_in(well: WellLog, kind: str, sl: slice, convert, notes: list[str]):
    """An auxiliary curve (caliper, bit size, neutron, density...) in logprep's units, or
    None when the well has none.  A unit logprep cannot convert leaves the curve out with a
    note (on the sheet) rather than failing the well: the gamma ray alone still screens it."""
    found = well_curve(well, kind)
    if found is None:
        return None
    values, unit = found
    try:
        return convert(values[sl], unit)
    except SettingsError as exc:
        notes.append(f"{kind.upper()} not used: {exc}")
        return None


def clay_volume(well: WellLog, settings: ScreenSettings = ScreenSettings(),
                tops: pd.DataFrame | None = None) -> ClayVolume:
    """GR QC, zoned endpoint picks, GR and neutron-density Vsh and their combination,
    over the interval from the first to the last valid GR sample.

    ``tops`` are this well's tops (columns ``well, top_m, name``) or None.  ``vsh`` is
    NaN where the GR is missing or was replaced after QC (interpolated later).
    """
    gr_all = well.gr_api
    valid = np.flatnonzero(np.isfinite(gr_all))
    if valid.size < 2:
        raise SettingsError(f"{well.source}: fewer than two valid GR samples")
    sl = slice(valid[0], valid[-1] + 1)
    depth, gr_read = well.depth_m[sl], gr_all[sl]
    notes = []
    cali = _curve_in(well, "cali", sl, inches, notes)
    bs = _curve_in(well, "bs", sl, inches, notes)
    flags = gr_flags(depth, gr_read, cali_in=cali, bs_in=bs,
                     settings=QcSettings(washout_in=settings.washout_in))
    gr = np.where(any_flag(flags, REPLACED), np.nan, gr_read)
    exclude = any_flag(flags, [k for k in flags if k not in ND_ONLY])
    bounds, source, names = zone_bounds(
        depth, np.where(exclude, np.nan, gr), settings.zoning, tops, bs_in=bs,
        min_zone_m=settings.zone_min_m, min_step_api=settings.zone_step_api,
    )
    try:
        picks = pick_endpoints(depth, gr, bounds, clean=settings.gr_clean, shale=settings.gr_shale,
                               exclude=exclude, min_contrast=settings.min_contrast,
                               source=source, names=names)
        whole = pick_endpoints(depth, gr, [], clean=settings.gr_clean, shale=settings.gr_shale,
                               exclude=exclude)
    except SettingsError as exc:
        raise SettingsError(f"{well.source}: {exc}") from None
    clean_line = lines_per_sample(depth, picks, "gr_clean_api")
    shale_line = lines_per_sample(depth, picks, "gr_shale_api")
    vsh_gr = get_transform(settings.transform)(gamma_ray_index(gr, clean_line, shale_line))

    vsh_nd = np.full(depth.size, np.nan)
    nphi = _curve_in(well, "nphi", sl, neutron_v_v, notes)
    rhob = _curve_in(well, "rhob", sl, density_g_cm3, notes)
    flags["gas_crossover"] = np.zeros(depth.size, dtype=bool)
    drho = _curve_in(well, "drho", sl, density_correction_g_cm3, notes)
    flags["bad_density"] = (density_correction_flags(drho, settings.drho_max_g_cm3)
                            if drho is not None else np.zeros(depth.size, dtype=bool))
    if nphi is not None and rhob is not None and settings.vsh_combine != "gr":
        phid = density_porosity(rhob)
        sep = nphi - phid
        nd_bad = flags["washout"] | flags["bad_density"]
        picks["nd_shale_separation"] = nd_shale_separation(depth, gr, sep, picks,
                                                           exclude=exclude | nd_bad)
        sep_line = lines_per_sample(depth, picks, "nd_shale_separation")
        usable = np.isfinite(sep_line) & ~nd_bad
        for value in np.unique(sep_line[usable]):
            m = usable & (sep_line == value)
            vsh_nd[m] = vsh_neutron_density(nphi[m], phid[m], float(value))
        flags["gas_crossover"] = gas_crossover(nphi, phid) & usable & np.isfinite(gr)
        if not usable.any():
            notes.append("neutron-density: no usable shale point; GR Vsh alone")
    vsh = get_combination(settings.vsh_combine)(vsh_gr, vsh_nd)
    return ClayVolume(
        depth_m=depth, gr_api=gr_read, vsh_gr=vsh_gr, vsh_nd=vsh_nd, vsh=vsh, qc_flags=flags,
        picks=picks, gr_clean_line=clean_line, gr_shale_line=shale_line,
        gr_clean_api=float(whole["gr_clean_api"].iloc[0]),
        gr_shale_api=float(whole["gr_shale_api"].iloc[0]), notes=tuple(notes),
    )


def deviated_well(well: WellLog, settings: ScreenSettings, picks: pd.DataFrame):
    """The well (and its tops) on TVD when ``settings.survey_dir`` holds a survey for it.

    Returns ``(well, picks, depth_reference, note)``; unchanged with reference
    ``"as logged"`` and no note for a well without a survey (taken as vertical).
    """
    if not settings.survey_dir:
        return well, picks, "as logged", None
    path = find_survey(settings.survey_dir, well.name, Path(well.source).stem)
    if path is None:
        return well, picks, "as logged", None
    md, inc, azi = read_survey(path)
    tvd_well = well_to_tvd(well, md, inc, azi, path)
    if len(picks):
        picks = picks.assign(top_m=tvd_at_md(picks["top_m"].to_numpy(float), md, inc, azi))
    return (tvd_well, picks, "TVD",
            f"depth axis is TVD below the log's depth reference, from survey {path.name} "
            f"(minimum curvature; max inclination {inc.max():.1f} deg); tops converted too")


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
    well, picks, depth_ref, survey_note = deviated_well(well, settings, picks)
    cv = clay_volume(well, settings, picks)
    depth = cv.depth_m
    notes = list(cv.notes) + ([survey_note] if survey_note else [])
    vsh, filled = fill_gaps(depth, cv.vsh, extend_ends=True)
    if filled.any():
        notes.append(
            f"{int(filled.sum())} GR samples missing or replaced after QC; Vsh interpolated there"
        )
    forced = picks["top_m"].to_numpy(float) if settings.honour_tops else ()
    if settings.honour_tops and len(picks) == 0:
        notes.append("no formation tops for this well; layers not tied to tops")
    layers = block_with_boundaries(
        settings.blocking, depth, vsh, forced, filled=filled, **settings.blocking_kwargs()
    )
    windows = sand_windows(layers, settings.throw_max_m)
    sgr = sgr_field(
        layers, depth, vsh, throw_max_m=settings.throw_max_m,
        throw_step_m=settings.field_throw_step_m, depth_step_m=settings.field_depth_step_m,
        source=settings.sgr_field_source,
    )
    sgr = with_smear_fields(sgr, layers)
    windows, note = seal_capacity_step(well, layers, windows, settings)
    notes.append(note)
    windows = windows.join(window_smear(layers, windows, settings.throw_max_m))
    return WellScreening(
        well=well, settings=settings, depth_m=depth, gr_api=cv.gr_api, vsh=vsh, filled=filled,
        gr_clean_api=cv.gr_clean_api, gr_shale_api=cv.gr_shale_api, layers=layers,
        windows=windows, tops=picks, notes=tuple(notes), vsh_gr=cv.vsh_gr, vsh_nd=cv.vsh_nd,
        qc_flags=cv.qc_flags, picks=cv.picks, gr_clean_line=cv.gr_clean_line,
        gr_shale_line=cv.gr_shale_line, grid=sgr,
        depth_reference=depth_ref,
    )


def seal_capacity_step(well: WellLog, layers: Layers, windows: pd.DataFrame,
                       settings: ScreenSettings) -> tuple[pd.DataFrame, str]:
    """Seal-capacity columns for the windows (see :mod:`logprep.capacity`) and a note on
    the depth datum used for burial, pressure and temperature."""
    datum, source = depth_datum(well)
    if settings.max_burial_m is not None:
        note = f"burial depth set to {settings.max_burial_m:g} m (maximum burial setting)"
    elif datum is None:
        note = "burial depth = depth as logged (no elevation in the LAS header; set --max-burial)"
    else:
        note = f"burial depth = contact depth below sea level (logged depth - {source})"
    table = seal_capacity_table(windows, layers, capacity_params(settings), datum_m=datum or 0.0,
                                length_unit=settings.length_unit)
    return table, note


def screen_file(
    path: str | Path,
    settings: ScreenSettings = ScreenSettings(),
    *,
    tops: pd.DataFrame | None = None,
) -> WellScreening:
    """Read a LAS file and screen it (``tops`` as in :func:`screen_well`)."""
    well = read_well(path, gr_curve=settings.gr_curve, depth_unit=settings.depth_unit)
    return screen_well(well, settings, tops=tops)
