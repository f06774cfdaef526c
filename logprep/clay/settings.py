"""Settings of the clay-volume stage: transform, GR lines, zoning, neutron-density and the
GR quality checks."""

from __future__ import annotations

from dataclasses import dataclass

from logprep.clay.endpoints import ONE_SIDED, ZONINGS
from logprep.clay.vshale import get_combination, get_transform, parse_endpoint
from logprep.errors import SettingsError, require_finite_fields


@dataclass(frozen=True)
class ClaySettings:
    """Every choice of the clay-volume stage.  Defaults are starting points, not calibrations.

    Attributes
    ----------
    transform : str
        IGR -> Vsh transform, a key of :data:`logprep.clay.vshale.TRANSFORMS`.
    gr_clean, gr_shale : float or str
        GR endpoints: a value in API, or a percentile ``"pN"`` of the well's readings.
    zoning : str
        How the well is cut into zones for the GR endpoint picks, one of
        :data:`logprep.clay.endpoints.ZONINGS`: ``auto`` (tops when the well has some, else
        changepoints of the GR baseline), ``tops``, ``changepoint`` or ``none``.
    zone_min_m : float
        Shortest zone (m) the changepoint split makes.
    zone_step_api : float
        Least step (API) of the GR baseline between two changepoint zones.
    min_contrast : float
        A zone whose clean-shale contrast is below this fraction of the well's is treated
        as one-sided (see :func:`logprep.clay.endpoints.pick_endpoints`).
    vsh_combine : str
        How the GR and neutron-density Vsh make the chosen Vsh, a key of
        :data:`logprep.clay.vshale.COMBINATIONS` (``gr`` ignores neutron-density).
    washout_in : float
        Caliper over bit size (inches) above which a sample is a washout.
    drho_max_g_cm3 : float
        Density correction ``|DRHO|`` (g/cm3) above which the density reading is not
        trusted: neutron-density Vsh is not used there (GR alone).
    one_sided : str
        What a one-sided zone's lines are, one of :data:`logprep.clay.endpoints.ONE_SIDED`.
    rock_classes : bool
        Recognise limestone/chalk, dolomite, coal, anhydrite and halite from the density,
        neutron and PEF logs (:mod:`logprep.clay.lithology`).
    bad_hole_in : float
        Caliper over bit size (inches) beyond which the hole is too enlarged to read the
        rock: such samples are unusable (a bit size is inferred when the well has none).
    gap_limit_m : float
        Vsh interpolated over a gap longer than this (m) is unusable.
    top_hole_run_m : float
        The top hole ends where density, neutron or sonic are first measured for this
        many metres (and, at the foot, where they were last measured for that many
        metres); the gamma ray beyond is unusable (wells with a GR only are exempt).
    sonic_density : bool
        Where the neutron-density Vsh is missing (no neutron, or none over an interval),
        use the sonic-density separation as the second clay indicator
        (:mod:`logprep.clay.sonicdensity`).
    pef_shale_check : bool
        Do not use the PEF in a hole section whose shales read a carbonate's Pe (barite in
        the mud or a shifted tool; :func:`logprep.clay.lithology.pef_trusted`).
    """

    transform: str = "linear"
    gr_clean: float | str = "p5"
    gr_shale: float | str = "p95"
    zoning: str = "auto"
    zone_min_m: float = 400.0
    zone_step_api: float = 8.0
    min_contrast: float = 0.7
    vsh_combine: str = "mean"
    washout_in: float = 1.5
    drho_max_g_cm3: float = 0.10
    one_sided: str = "recentre"
    rock_classes: bool = True
    bad_hole_in: float = 3.0
    gap_limit_m: float = 5.0
    top_hole_run_m: float = 30.0
    sonic_density: bool = True
    pef_shale_check: bool = False

    def __post_init__(self) -> None:
        require_finite_fields(self)
        get_transform(self.transform)
        get_combination(self.vsh_combine)
        if self.zoning not in ZONINGS:
            raise SettingsError(f"unknown zoning {self.zoning!r}; choose one of {', '.join(ZONINGS)}")
        if not self.zone_min_m > 0:
            raise SettingsError(f"--zone-min must be > 0 m (got {self.zone_min_m:g}); give a zone "
                                "length above 0 m (zone_min_m in a settings file)")
        if not self.zone_step_api >= 0:
            raise SettingsError(f"--zone-step must be >= 0 API (got {self.zone_step_api:g}); give "
                                "a GR step of 0 API or more (zone_step_api in a settings file)")
        if not 0 <= self.min_contrast <= 1:
            raise SettingsError(f"--min-contrast must be within 0-1 (got {self.min_contrast:g}); "
                                "give a fraction such as 0.2 (min_contrast in a settings file)")
        if not self.washout_in > 0:
            raise SettingsError(f"--washout must be > 0 in (got {self.washout_in:g}); give a "
                                "caliper excess above 0 in (washout_in in a settings file)")
        if not self.drho_max_g_cm3 > 0:
            raise SettingsError(f"--drho-max must be > 0 g/cm3 (got {self.drho_max_g_cm3:g}); "
                                "give a density correction above 0 (drho_max_g_cm3 in a settings file)")
        if self.one_sided not in ONE_SIDED:
            raise SettingsError(f"unknown one-sided rule {self.one_sided!r}; choose one of "
                                f"{', '.join(ONE_SIDED)}")
        if not self.bad_hole_in > 0:
            raise SettingsError(f"--bad-hole must be > 0 in (got {self.bad_hole_in:g}); give a "
                                "caliper excess above 0 in (bad_hole_in in a settings file)")
        if not self.gap_limit_m >= 0:
            raise SettingsError(f"--gap-limit must be >= 0 m (got {self.gap_limit_m:g}); give a "
                                "length of 0 m or more (gap_limit_m in a settings file)")
        if not self.top_hole_run_m > 0:
            raise SettingsError(f"--top-hole-run must be > 0 m (got {self.top_hole_run_m:g}); "
                                "give a length above 0 m (top_hole_run_m in a settings file)")
        object.__setattr__(self, "gr_clean", parse_endpoint(self.gr_clean))
        object.__setattr__(self, "gr_shale", parse_endpoint(self.gr_shale))
