"""Settings of the fault stage: the throw-depth field, the verdict thresholds and seal
capacity, and the fault-rock properties.  Defaults are starting points, not calibrations."""

from __future__ import annotations

from dataclasses import dataclass

from logprep.errors import SettingsError, require_finite_fields
from logprep.fault.capacity import CapacityParams
from logprep.fault.envelope import CO2_DENSITY_MODES
from logprep.fault.sgr import SGR_FIELD_SOURCES
from logprep.fault.twowell import SLIP_SOURCES
from logprep.units import LENGTH_UNITS

_CAP = CapacityParams()  # seal-capacity defaults live in one place


def parse_number_list(value, name: str) -> tuple[float, ...]:
    """A tuple of floats from a sequence or a comma-separated string (``"3000,3500"``)."""
    items = value.split(",") if isinstance(value, str) else value
    try:
        return tuple(float(v) for v in items)
    except (TypeError, ValueError):
        raise SettingsError(f"{name}: expected comma-separated numbers (got {value!r})") from None


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
    """

    throw_max_m: float = 300.0
    sgr_field_source: str = "layers"
    field_depth_step_m: float | None = 0.5
    field_throw_step_m: float = 1.0
    pair_slip_source: str = "footwall"

    def __post_init__(self) -> None:
        require_finite_fields(self)
        if not self.throw_max_m > 0:
            raise SettingsError(f"--throw-max must be > 0 m (got {self.throw_max_m:g})")
        if self.pair_slip_source not in SLIP_SOURCES:
            raise SettingsError(f"unknown pair slip source {self.pair_slip_source!r}; use one of "
                                f"{', '.join(SLIP_SOURCES)}")
        if self.sgr_field_source not in SGR_FIELD_SOURCES:
            raise SettingsError(f"unknown SGR field source {self.sgr_field_source!r}; use one of "
                                f"{', '.join(SGR_FIELD_SOURCES)}")
        if self.field_depth_step_m is not None and not self.field_depth_step_m > 0:
            raise SettingsError(f"--field-depth-step must be > 0 m (got {self.field_depth_step_m:g})")
        if not self.field_throw_step_m > 0:
            raise SettingsError(f"--field-throw-step must be > 0 m (got {self.field_throw_step_m:g})")


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

    def __post_init__(self) -> None:
        require_finite_fields(self)
        if not 0 <= self.sgr_threshold_pct <= 100:
            raise SettingsError(f"SGR threshold must be within 0-100 % (got {self.sgr_threshold_pct:g})")
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
        if self.max_burial_m is not None and not self.max_burial_m >= 0:
            raise SettingsError(f"max_burial_m must be >= 0 m (got {self.max_burial_m:g})")


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
                raise SettingsError(f"{name} must be > 0 (got {getattr(self, name):g})")
        if self.faulting_depth_m is not None and not self.faulting_depth_m >= 0:
            raise SettingsError(f"faulting_depth_m must be >= 0 m (got {self.faulting_depth_m:g})")


def capacity_params(capacity: CapacitySettings, fault_rock: FaultRockSettings) -> CapacityParams:
    """The :class:`~logprep.fault.capacity.CapacityParams` of the two settings groups."""
    c, r = capacity, fault_rock
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
    )
