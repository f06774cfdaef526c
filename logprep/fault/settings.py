"""Settings of the fault stage: the throw-depth field, the verdict thresholds and seal
capacity, and the fault-rock properties.  Defaults are starting points, not calibrations."""

from __future__ import annotations

from dataclasses import dataclass

from logprep.errors import SettingsError, require_finite_fields
from logprep.fault.capacity import CapacityParams
from logprep.fault.clayfraction import (
    CLAY_CONVERSIONS, DEFAULT_SHALE_CLAY_FRACTION, check_shale_clay_fraction,
)
from logprep.fault.closure import UNCONSTRAINED_COLUMN_M, check_closure
from logprep.fault.co2 import DEFAULTS as CO2_CAPILLARY, co2_pressure_factor
from logprep.fault.geometry import DEFAULT_FAULT_DIP_DEG, check_fault_dip
from logprep.fault.envelope import CO2_DENSITY_MODES
from logprep.fault.sgr import SGR_FIELD_SOURCES
from logprep.fault.smear import SMEAR_SOURCE_CLAY_MIN, check_smear_clay_min
from logprep.fault.twowell import SLIP_SOURCES
from logprep.units import LENGTH_UNITS

_CAP = CapacityParams()  # seal-capacity defaults live in one place


def parse_number_list(value, name: str) -> tuple[float, ...]:
    """A tuple of floats from a sequence or a comma-separated string (``"3000,3500"``)."""
    items = value.split(",") if isinstance(value, str) else value
    try:
        return tuple(float(v) for v in items)
    except (TypeError, ValueError):
        raise SettingsError(f"{name}: expected comma-separated numbers (got {value!r}); "
                            "give numbers such as 3000,3500") from None


@dataclass(frozen=True)
class FieldSettings:
    """Throws screened and the SGR field over footwall depth x throw.

    Attributes
    ----------
    throw_max_m : float
        Largest throw screened (m).
    sgr_field_source : str
        Clay source of the SGR field (``sgr_field.npz`` and the triangle diagram), a key of
        :data:`logprep.fault.sgr.SGR_FIELD_SOURCES`: ``layers`` (blocked column) or ``curve``
        (continuous Vsh, partial samples weighted by length).
    field_depth_step_m : float or None
        Row spacing of the field (m), rounded to a whole number of log samples (at least
        one); None takes every sample.
    field_throw_step_m : float
        Column spacing of the field (m).
    pair_slip_source : str
        For well pairs (``--pairs``): the column the slipped interval is taken from, a key
        of :data:`logprep.fault.twowell.SLIP_SOURCES` (``footwall``, ``hangingwall``, ``average``).
    clay_conversion : str
        Vsh -> clay fraction step used by SGR, smear and fault rock, a key of
        :data:`logprep.fault.clayfraction.CLAY_CONVERSIONS`.
    shale_clay_fraction : float
        Clay fraction of pure shale (``Vcl = shale_clay_fraction x Vsh``).  Default 1: Vsh
        is taken as the clay fraction, as the published SGR calibrations did; about 0.6 for
        an average shale (60.9 % clay minerals, Shaw & Weaver 1965).
    heterolith_reservoir_ntg : float or None
        Screen heteroliths whose net-to-gross is at least this as reservoir beside the
        sands (None: sands only).
    fault_dip_deg : float
        Fault dip (degrees): displacement along the fault ``throw / sin(dip)`` for the
        fault rock, and CSP smear distances along the fault.  Default 60, the Andersonian
        dip of normal faults (Anderson 1951).
    smear_clay_min : float
        Least clay fraction (after the Vsh-to-clay step) of a shale or heterolith layer for it
        to count as a smear source bed in SSF and CSP.  Default 0.40: clay smears form from
        rocks above about 40 % clay (Fisher & Knipe 1998, from memory).
    """

    throw_max_m: float = 300.0
    sgr_field_source: str = "layers"
    field_depth_step_m: float | None = 0.5
    field_throw_step_m: float = 1.0
    pair_slip_source: str = "footwall"
    clay_conversion: str = "shale_fraction"
    shale_clay_fraction: float = DEFAULT_SHALE_CLAY_FRACTION
    heterolith_reservoir_ntg: float | None = None
    fault_dip_deg: float = DEFAULT_FAULT_DIP_DEG
    smear_clay_min: float = SMEAR_SOURCE_CLAY_MIN

    def __post_init__(self) -> None:
        require_finite_fields(self)
        check_smear_clay_min(self.smear_clay_min)
        if self.clay_conversion not in CLAY_CONVERSIONS:
            raise SettingsError(f"unknown clay conversion {self.clay_conversion!r}; use one of "
                                f"{', '.join(CLAY_CONVERSIONS)}")
        check_shale_clay_fraction(self.shale_clay_fraction)
        n = self.heterolith_reservoir_ntg
        if n is not None and not 0 < n <= 1:
            raise SettingsError(f"--heterolith-reservoir-ntg must lie within 0 (exclusive) and 1 (got {n:g}); "
                                "give a net-to-gross such as 0.5, or leave it out")
        check_fault_dip(self.fault_dip_deg)
        if not self.throw_max_m > 0:
            raise SettingsError(f"--throw-max must be > 0 m (got {self.throw_max_m:g}); give the "
                                "largest throw above 0 m (throw_max_m in a settings file)")
        if self.pair_slip_source not in SLIP_SOURCES:
            raise SettingsError(f"unknown pair slip source {self.pair_slip_source!r}; use one of "
                                f"{', '.join(SLIP_SOURCES)}")
        if self.sgr_field_source not in SGR_FIELD_SOURCES:
            raise SettingsError(f"unknown SGR field source {self.sgr_field_source!r}; use one of "
                                f"{', '.join(SGR_FIELD_SOURCES)}")
        if self.field_depth_step_m is not None and not self.field_depth_step_m > 0:
            raise SettingsError(f"--field-depth-step must be > 0 m (got {self.field_depth_step_m:g}); "
                                "give a step above 0 m, or leave it out for the log's own step")
        if not self.field_throw_step_m > 0:
            raise SettingsError(f"--field-throw-step must be > 0 m (got {self.field_throw_step_m:g}); "
                                "give a step above 0 m (field_throw_step_m in a settings file)")


@dataclass(frozen=True)
class CapacitySettings:
    """Verdict thresholds, the fault-zone pressure envelope and column heights.

    Attributes
    ----------
    sgr_threshold_pct : float
        SGR from which a window's verdict is ``seal``.  About 15-20 % in many calibrations
        (Yielding et al. 1997; Yielding 2002): calibrate locally.
    sgr_leak_pct : float
        Window verdict ``leak`` below this minimum SGR, ``uncertain`` between it and
        ``sgr_threshold_pct``.
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
    length_unit : str
        ``m`` or ``ft``: unit of column heights on the sheet (``ft`` also adds
        ``column_*_ft`` columns to the table).
    water_depth_m, ground_elevation_m : float or None
        Water depth (offshore) or ground elevation above sea level (onshore), m: burial is
        measured below the sea floor or ground.  None reads the LAS header (water depth
        items, ``EGL``) or, without them, takes the surface at sea level (said on the sheet).
    uplift_m : float
        Section removed since maximum burial (m), added to the present burial depth.
    closure_m : float or None
        Structural closure (m, crest to spill point) that caps every column; None: no cap,
        columns above ``unconstrained_column_m`` are flagged unconstrained.
    unconstrained_column_m : float
        Column (m) above which a column without a closure is flagged.
    calibration_ift_mn_m, calibration_contact_deg, co2_ift_mn_m, co2_contact_deg : float
        Interfacial tension (mN/m) and contact angle (degrees) of the hydrocarbon-water
        system of the envelope's calibration and of CO2-brine: the CO2 capillary pressure
        is the envelope's times ``(g_co2 cos t_co2)/(g_cal cos t_cal)`` (defaults 30, 0,
        26, 30: a factor 0.751; see :mod:`logprep.fault.co2`).
    """

    sgr_threshold_pct: float = 20.0
    sgr_leak_pct: float = _CAP.leak_below_pct
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
    length_unit: str = "m"
    water_depth_m: float | None = None
    ground_elevation_m: float | None = None
    uplift_m: float = 0.0
    closure_m: float | None = None
    unconstrained_column_m: float = UNCONSTRAINED_COLUMN_M
    calibration_ift_mn_m: float = CO2_CAPILLARY["calibration_ift_mn_m"]
    calibration_contact_deg: float = CO2_CAPILLARY["calibration_contact_deg"]
    co2_ift_mn_m: float = CO2_CAPILLARY["co2_ift_mn_m"]
    co2_contact_deg: float = CO2_CAPILLARY["co2_contact_deg"]

    def __post_init__(self) -> None:
        require_finite_fields(self)
        _check_capacity_conventions(self)
        if not 0 <= self.sgr_threshold_pct <= 100:
            raise SettingsError(f"--sgr-threshold must be within 0-100 % (got {self.sgr_threshold_pct:g}); "
                                "give a percentage such as 20 (sgr_threshold_pct in a settings file)")
        for name in ("envelope_class_bounds_m", "envelope_class_c"):
            object.__setattr__(self, name, parse_number_list(getattr(self, name), name))
        b, c = self.envelope_class_bounds_m, self.envelope_class_c
        if list(b) != sorted(b) or len(c) != len(b) + 1:
            raise SettingsError(
                f"--envelope-bounds must increase and --envelope-c have one more value "
                f"(got bounds {list(b)}, C {list(c)}); list the bounds in increasing order "
                "and one C per class"
            )
        if not 0 <= self.sgr_leak_pct <= self.sgr_threshold_pct:
            raise SettingsError(
                f"--sgr-leak ({self.sgr_leak_pct:g} %) must be within 0 and the SGR threshold "
                f"({self.sgr_threshold_pct:g} %); lower --sgr-leak or raise --sgr-threshold"
            )
        if not self.envelope_sgr_scale_pct > 0:
            raise SettingsError(f"--envelope-scale must be > 0 (got {self.envelope_sgr_scale_pct:g}); "
                                "give a scale above 0 % SGR")
        for name in ("oil", "gas", "co2"):
            rho = getattr(self, f"{name}_density_kgm3")
            if not 0 < rho < self.brine_density_kgm3:
                raise SettingsError(
                    f"--{name}-density {rho:g} kg/m3 must be > 0 and below the brine density "
                    f"{self.brine_density_kgm3:g} kg/m3; give a density between 0 and the brine's"
                )
        if self.co2_density_mode not in CO2_DENSITY_MODES:
            raise SettingsError(
                f"unknown CO2 density mode {self.co2_density_mode!r}; use one of {', '.join(CO2_DENSITY_MODES)}"
            )
        if self.length_unit not in LENGTH_UNITS:
            raise SettingsError(f"unknown length unit {self.length_unit!r}; use one of {', '.join(LENGTH_UNITS)}")
        if self.max_burial_m is not None and not self.max_burial_m >= 0:
            raise SettingsError(f"--max-burial must be >= 0 m (got {self.max_burial_m:g}); give "
                                "the deepest burial as 0 m or more (max_burial_m in a settings file)")


def _check_capacity_conventions(self) -> None:
    if self.water_depth_m is not None and self.ground_elevation_m is not None:
        raise SettingsError("--water-depth and --ground-elevation both given; give --water-depth "
                            "(offshore) or --ground-elevation (onshore), not both")
    if self.water_depth_m is not None and not self.water_depth_m >= 0:
        raise SettingsError(f"--water-depth must be >= 0 m (got {self.water_depth_m:g}); give "
                            "the water depth as 0 m or more, or --ground-elevation onshore")
    if not self.uplift_m >= 0:
        raise SettingsError(f"--uplift must be >= 0 m (got {self.uplift_m:g}); give the uplift "
                            "as 0 m or more (uplift_m in a settings file)")
    check_closure(self.closure_m, self.unconstrained_column_m)
    co2_pressure_factor(self.calibration_ift_mn_m, self.calibration_contact_deg,
                        self.co2_ift_mn_m, self.co2_contact_deg)



@dataclass(frozen=True)
class FaultRockSettings:
    """Fault-rock permeability, thickness and the transmissibility multiplier.

    Attributes
    ----------
    cell_length_m, matrix_perm_md : float
        Simulation cell length (m) and matrix permeability (mD) for the transmissibility
        multiplier.
    faulting_depth_m : float or None
        Depth at the time of faulting (m) for the Sperrevik et al. (2002) permeability;
        None takes the burial depth.
    """

    cell_length_m: float = _CAP.cell_length_m
    matrix_perm_md: float = _CAP.matrix_perm_md
    faulting_depth_m: float | None = None

    def __post_init__(self) -> None:
        require_finite_fields(self)
        for name in ("cell_length_m", "matrix_perm_md"):
            if not getattr(self, name) > 0:
                raise SettingsError(f"{name} must be > 0 (got {getattr(self, name):g}); set "
                                    "--cell-length and --matrix-perm above 0")
        if self.faulting_depth_m is not None and not self.faulting_depth_m >= 0:
            raise SettingsError(f"--faulting-depth must be >= 0 m (got {self.faulting_depth_m:g}); "
                                "give 0 m or more, or leave it out to use the burial depth")


def capacity_params(capacity: CapacitySettings, fault_rock: FaultRockSettings,
                    field: FieldSettings | None = None) -> CapacityParams:
    """The :class:`~logprep.fault.capacity.CapacityParams` of the settings groups (the
    field group gives the fault dip; without it the default dip)."""
    c, r = capacity, fault_rock
    f = field if field is not None else FieldSettings()
    return CapacityParams(
        rho_brine_kgm3=c.brine_density_kgm3, rho_oil_kgm3=c.oil_density_kgm3,
        rho_gas_kgm3=c.gas_density_kgm3, rho_co2_kgm3=c.co2_density_kgm3,
        co2_density_mode=c.co2_density_mode, surface_temp_c=c.surface_temp_c,
        geothermal_gradient_c_per_km=c.geothermal_gradient_c_per_km,
        max_burial_m=c.max_burial_m, sgr_scale_pct=c.envelope_sgr_scale_pct,
        class_bounds_m=tuple(c.envelope_class_bounds_m), class_c=tuple(c.envelope_class_c),
        leak_below_pct=c.sgr_leak_pct, seal_from_pct=c.sgr_threshold_pct,
        cell_length_m=r.cell_length_m, matrix_perm_md=r.matrix_perm_md,
        faulting_depth_m=r.faulting_depth_m,
        water_depth_m=c.water_depth_m, ground_elevation_m=c.ground_elevation_m, uplift_m=c.uplift_m,
        closure_m=c.closure_m, unconstrained_column_m=c.unconstrained_column_m,
        co2_pressure_factor=co2_pressure_factor(c.calibration_ift_mn_m, c.calibration_contact_deg,
                                                c.co2_ift_mn_m, c.co2_contact_deg),
        fault_dip_deg=f.fault_dip_deg,
    )
