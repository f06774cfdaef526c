"""The fault stage of one well: clay fraction, sand-sand windows, the SGR field with the
smear fields, seal capacity and the smear indicators per window, with one note per
convention used (clay, burial, closure, CO2) for the sheet."""

from __future__ import annotations

from dataclasses import replace

import numpy as np
import pandas as pd

from logprep.fault.capacity import seal_capacity_step
from logprep.fault.clayfraction import clay_curve, clay_layers
from logprep.fault.clayfraction import describe as clay_describe
from logprep.fault.geometry import csp_factor
from logprep.fault.juxtaposition import reservoir_mask, sand_windows
from logprep.fault.settings import CapacitySettings, FaultRockSettings, FieldSettings, capacity_params
from logprep.fault.sgr import SgrField, sgr_field
from logprep.fault.smear import window_smear, with_smear_fields
from logprep.model import Layers, WellLog


def fault_stage(well: WellLog, layers: Layers, depth_m, vsh, field: FieldSettings,
                capacity: CapacitySettings, fault_rock: FaultRockSettings,
                bed_dip_deg: float = 0.0, *,
                closure_source: str = "--closure") -> tuple[pd.DataFrame, SgrField, list[str]]:
    """``(windows, grid, notes)`` for a blocked well.

    ``layers``/``vsh`` carry Vsh; the clay fraction of :mod:`logprep.fault.clayfraction`
    enters SGR, the field, seal capacity and fault rock; the lithology (and so which
    layers are reservoir, :func:`~logprep.fault.juxtaposition.reservoir_mask`) stays on
    Vsh.  CSP is along the fault (:func:`~logprep.fault.geometry.csp_factor`).
    ``closure_source`` says where ``capacity.closure_m`` came from (for the note)."""
    clay = clay_layers(layers, field.clay_conversion, field.shale_clay_fraction)
    vcl = clay_curve(np.asarray(vsh, float), field.clay_conversion, field.shale_clay_fraction)
    reservoir = np.asarray(layers.reservoir, bool) | reservoir_mask(layers, field.heterolith_reservoir_ntg)
    windows = sand_windows(clay, field.throw_max_m, reservoir=reservoir)
    grid = sgr_field(clay, depth_m, vcl, throw_max_m=field.throw_max_m,
                     throw_step_m=field.field_throw_step_m, depth_step_m=field.field_depth_step_m,
                     source=field.sgr_field_source)
    factor = csp_factor(field.fault_dip_deg, bed_dip_deg)
    grid = with_smear_fields(grid, clay, factor, clay_min=field.smear_clay_min)
    params = replace(capacity_params(capacity, fault_rock, field), closure_source=closure_source)
    windows, note = seal_capacity_step(well, clay, windows, params, capacity.length_unit)
    windows = windows.join(window_smear(clay, windows, field.throw_max_m, csp_factor=factor,
                                        clay_min=field.smear_clay_min))
    notes = [clay_describe(field.clay_conversion, field.shale_clay_fraction), note,
             f"fault dip {field.fault_dip_deg:g} deg: fault-rock displacement = throw / sin(dip); "
             f"CSP along the fault (x {factor:.3f})",
             f"smear source beds: shale and heterolith layers with clay fraction >= "
             f"{field.smear_clay_min:g} (--smear-clay-min), full thickness"]
    if field.heterolith_reservoir_ntg is not None:
        notes.append(f"heteroliths with net-to-gross >= {field.heterolith_reservoir_ntg:g} screened as reservoir")
    return windows, grid, notes
