"""Settings of the blocking stage: method, cut-offs, minimum bed, tops as boundaries."""

from __future__ import annotations

from dataclasses import dataclass

from logprep.errors import SettingsError, require_finite_fields
from logprep.layers.blocking import check_cutoffs, get_blocking_method


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
    """

    blocking: str = "cutoff"
    sand_cutoff: float = 0.35
    shale_cutoff: float = 0.65
    min_bed_m: float = 1.0
    changepoint_penalty: float = 2.0
    honour_tops: bool = False

    def __post_init__(self) -> None:
        require_finite_fields(self)
        get_blocking_method(self.blocking)
        check_cutoffs(self.sand_cutoff, self.shale_cutoff)
        if not self.min_bed_m >= 0:
            raise SettingsError(f"--min-bed must be >= 0 m (got {self.min_bed_m:g})")
        if not self.changepoint_penalty >= 0:
            raise SettingsError(
                f"--changepoint-penalty must be >= 0 (got {self.changepoint_penalty:g})")

    def blocking_kwargs(self) -> dict:
        """The keyword arguments every blocking method receives."""
        return dict(sand_cutoff=self.sand_cutoff, shale_cutoff=self.shale_cutoff,
                    min_bed_m=self.min_bed_m, changepoint_penalty=self.changepoint_penalty)
