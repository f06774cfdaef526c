"""Re-block a screened well at other blocking settings without redoing its clay volume:
what the tuning notebook's sliders call, so a change costs the blocking, windows, field and
seal capacity only."""

from __future__ import annotations

from dataclasses import replace

import numpy as np

from logprep.fault.stage import fault_stage
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
    # the pipeline's own fault stage: clay step, reservoir layers, field, smear, capacity
    windows, grid, _ = fault_stage(result.well, layers, result.depth_m, result.vsh, fld, s.capacity,
                                   s.fault_rock, s.input.bed_dip_deg,
                                   closure_source=getattr(result, "closure_source", "--closure"))
    return replace(result, settings=s, layers=layers, windows=windows, grid=grid)
