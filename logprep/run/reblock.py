"""Re-block a screened well at other blocking settings without redoing its clay volume:
what the tuning notebook's sliders call, so a change costs the blocking, windows, field and
seal capacity only."""

from __future__ import annotations

from dataclasses import replace

from logprep.fault.capacity import seal_capacity_step
from logprep.fault.juxtaposition import sand_windows
from logprep.fault.settings import capacity_params
from logprep.fault.sgr import sgr_field
from logprep.fault.smear import window_smear, with_smear_fields
import numpy as np

from logprep.layers.stage import blocked_column
from logprep.run.pipeline import WellScreening, qc_flagged

BLOCKING_FIELDS = ("sand_cutoff", "shale_cutoff", "min_bed_m", "blocking", "changepoint_penalty",
                   "honour_tops")
"""The settings a re-blocking may change (the ``layers`` group); all others stay."""


def reblock(result: WellScreening, **changes) -> WellScreening:
    """``result`` re-blocked with ``changes`` to :data:`BLOCKING_FIELDS` (validated as any
    setting): new layers, windows (numbered anew), SGR field and seal capacity; the clay
    volume, QC and picks are those of ``result``.  Gives the same as screening the well
    again with the changed settings."""
    bad = set(changes) - set(BLOCKING_FIELDS)
    if bad:
        raise ValueError(f"reblock changes only blocking settings, not {sorted(bad)}")
    s = result.settings.updated(**changes)
    lay, fld = s.layers, s.field
    forced = result.tops["top_m"].to_numpy(float) if lay.honour_tops and len(result.tops) else ()
    # the pipeline's own blocked column: rock classes and no-data layers as in layers.csv
    raw = np.where(result.filled, np.nan, result.vsh)
    layers = blocked_column(result.depth_m, raw, lay, forced_m=forced, rock=result.rock,
                            unusable=result.unusable, flagged=qc_flagged(result.qc_flags)).layers
    windows = sand_windows(layers, fld.throw_max_m)
    grid = with_smear_fields(sgr_field(layers, result.depth_m, result.vsh, throw_max_m=fld.throw_max_m,
                                       throw_step_m=fld.field_throw_step_m,
                                       depth_step_m=fld.field_depth_step_m, source=fld.sgr_field_source),
                             layers)
    windows, _ = seal_capacity_step(result.well, layers, windows,
                                    capacity_params(s.capacity, s.fault_rock), s.capacity.length_unit)
    windows = windows.join(window_smear(layers, windows, fld.throw_max_m))
    return replace(result, settings=s, layers=layers, windows=windows, grid=grid)
