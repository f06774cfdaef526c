"""Settings of the blocking stage: method, cut-offs, minimum bed, tops as boundaries."""

from __future__ import annotations

from dataclasses import dataclass

from logprep.errors import SettingsError, require_finite_fields
from logprep.layers.blocking import check_cutoffs, get_blocking_method
from logprep.model import LAYER_CLASSES, NO_DATA


def parse_classes(value) -> tuple[str, ...]:
    """Layer class names from a sequence or a comma-separated string (``"sand,limestone"``)."""
    items = value.split(",") if isinstance(value, str) else list(value)
    names = tuple(str(v).strip().lower() for v in items if str(v).strip())
    bad = [n for n in names if n not in LAYER_CLASSES or n == NO_DATA]
    if bad or not names:
        usable = ", ".join(c for c in LAYER_CLASSES if c != NO_DATA)
        raise SettingsError(f"--reservoir: unknown class {', '.join(bad) or '(none given)'}; "
                            f"use some of {usable}")
    return names


@dataclass(frozen=True)
class LayerSettings:
    """How the Vsh curve is blocked into layers.

    Attributes
    ----------
    blocking : str
        Blocking method, a key of :data:`logprep.layers.blocking.BLOCKING_METHODS`.
    sand_cutoff, shale_cutoff : float
        Vsh cut-offs (fraction) for sand / heterolith / shale.
    min_bed_m : float
        Minimum layer thickness (m); thinner beds merge into a neighbour.
    changepoint_penalty : float
        For ``blocking = "changepoint"``: cost of one change of mean Vsh, as a multiple of
        (noise sd)^2 x ln(samples); 2 matches the Schwarz criterion, larger gives fewer
        layers (see :func:`logprep.layers.blocking.block_changepoint`).
    honour_tops : bool
        Force a layer boundary at every formation top of the well (needs ``tops_file``).
    reservoir_classes : tuple of str
        Layer classes counted as reservoir (windows, SGR leak paths): ``sand`` by default;
        add ``limestone`` for a fractured carbonate, for example.  ``no data`` never is.
    max_unusable : float
        A layer with more than this share of unusable samples is ``no data``.
    thin_bed_m : float
        A window sand thinner than this (m) is marked ``thin`` in ``juxtapositions.csv``.
    """

    blocking: str = "cutoff"
    sand_cutoff: float = 0.35
    shale_cutoff: float = 0.65
    min_bed_m: float = 1.0
    changepoint_penalty: float = 2.0
    honour_tops: bool = False
    reservoir_classes: tuple[str, ...] | str = ("sand",)
    max_unusable: float = 0.5
    thin_bed_m: float = 3.0

    def __post_init__(self) -> None:
        object.__setattr__(self, "reservoir_classes", parse_classes(self.reservoir_classes))
        require_finite_fields(self)
        if not 0 <= self.max_unusable < 1:
            raise SettingsError(f"--max-unusable must be within 0 and 1 (got {self.max_unusable:g}); "
                                "give a fraction below 1 (max_unusable in a settings file)")
        if not self.thin_bed_m >= 0:
            raise SettingsError(f"--thin-bed must be >= 0 m (got {self.thin_bed_m:g}); give a "
                                "thickness of 0 m or more (thin_bed_m in a settings file)")
        get_blocking_method(self.blocking)
        check_cutoffs(self.sand_cutoff, self.shale_cutoff)
        if not self.min_bed_m >= 0:
            raise SettingsError(f"--min-bed must be >= 0 m (got {self.min_bed_m:g}); give a "
                                "thickness of 0 m or more (min_bed_m in a settings file)")
        if not self.changepoint_penalty >= 0:
            raise SettingsError(
                f"--changepoint-penalty must be >= 0 (got {self.changepoint_penalty:g}); "
                "give 0 or more (changepoint_penalty in a settings file)")

    def blocking_kwargs(self) -> dict:
        """The keyword arguments every blocking method receives."""
        return dict(sand_cutoff=self.sand_cutoff, shale_cutoff=self.shale_cutoff,
                    min_bed_m=self.min_bed_m, changepoint_penalty=self.changepoint_penalty)
