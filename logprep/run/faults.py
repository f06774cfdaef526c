"""Named faults screened at their throw with uncertainty (``--faults FILE``).

For each fault of a faults file (:mod:`logprep.io.faults`) the footwall and hanging-wall
wells are screened as usual; the deterministic screening at the best throw and the Monte
Carlo realisations of :mod:`logprep.fault.uncertainty` give, per juxtaposed reservoir pair,
the rows of ``faults.csv`` (:data:`FAULT_COLUMNS`).
"""

from __future__ import annotations

from dataclasses import dataclass, replace

import numpy as np
import pandas as pd

from logprep.clay.qc import ND_ONLY, REPLACED, any_flag
from logprep.clay.vshale import gamma_ray_index, get_combination, get_transform
from logprep.errors import LogprepError
from logprep.fault.atthrow import group_min, units_of_layers, window_sgr_min_pct
from logprep.fault.capacity import verdict
from logprep.fault.envelope import co2_density_kgm3, depth_datum, geothermal_temperature_k, hydrostatic_pressure_pa
from logprep.fault.sensitivity import rank_inputs
from logprep.fault.settings import capacity_params
from logprep.fault.uncertainty import (
    FLUIDS, INPUTS, BaseInputs, FaultCase, Spreads, base_draw, draw_inputs, evaluate_at_throw,
    fault_realisations, percentiles,
)
from logprep.io.faults import FaultSpec
from logprep.layers.blocking import block_with_boundaries, fill_gaps
from logprep.model import Layers


class FaultScreenError(LogprepError, ValueError):
    """A fault of the faults file could not be screened."""


def setting(settings, name: str, default=None):
    """A setting by its flat name, or ``default`` where this version has no such setting
    (so that later settings, such as a clay fraction, plug in without changes here)."""
    return getattr(settings, name, default)


@dataclass(frozen=True)
class WellColumnModel:
    """Rebuilds one well's blocked column from its QC'd GR for drawn clay and blocking
    inputs, through the same functions and in the same order as the pipeline, so the
    deterministic inputs give the pipeline's layers exactly.

    GR lines move by a constant per realisation: for a percentile endpoint, the change of
    the well's GR (QC'd samples) between the drawn and the deterministic percentile; for an
    API endpoint, the drawn change in API.
    """

    depth_m: np.ndarray
    gr_api: np.ndarray
    clean_line: np.ndarray
    shale_line: np.ndarray
    gr_for_pct: np.ndarray
    base_clean: object
    base_shale: object
    vsh_nd: np.ndarray
    combine: str
    blocking: str
    forced_m: tuple
    changepoint_penalty: float

    def _shift(self, base, level) -> float:
        if isinstance(base, str):
            lvl = float(level[1:]) if isinstance(level, str) else float(level)
            b = float(base[1:])
            if lvl == b:
                return 0.0
            return float(np.percentile(self.gr_for_pct, lvl) - np.percentile(self.gr_for_pct, b))
        return float(level) - float(base)

    def vsh(self, gr_clean, gr_shale, transform: str) -> np.ndarray:
        clean = self.clean_line + self._shift(self.base_clean, gr_clean)
        shale = self.shale_line + self._shift(self.base_shale, gr_shale)
        shale = np.where(shale > clean, shale, clean + 1.0)
        vsh_gr = get_transform(transform)(gamma_ray_index(self.gr_api, clean, shale))
        return get_combination(self.combine)(vsh_gr, self.vsh_nd)

    def layers(self, gr_clean, gr_shale, transform, sand_cutoff, shale_cutoff, min_bed_m) -> Layers:
        vsh, filled = fill_gaps(self.depth_m, self.vsh(gr_clean, gr_shale, transform))
        return block_with_boundaries(self.blocking, self.depth_m, vsh, self.forced_m, filled=filled,
                                     sand_cutoff=sand_cutoff, shale_cutoff=shale_cutoff,
                                     min_bed_m=min_bed_m, changepoint_penalty=self.changepoint_penalty)


def column_model(scr) -> WellColumnModel:
    """The :class:`WellColumnModel` of a :class:`~logprep.run.pipeline.WellScreening`."""
    s = scr.settings
    flags = scr.qc_flags
    gr = np.where(any_flag(flags, REPLACED), np.nan, scr.gr_api)
    exclude = any_flag(flags, [k for k in flags if k not in ND_ONLY])
    vals = gr[np.isfinite(gr) & ~exclude]
    forced = tuple(scr.tops["top_m"].to_numpy(float)) if s.honour_tops else ()
    nd = scr.vsh_nd if scr.vsh_nd is not None else np.full(scr.depth_m.size, np.nan)
    return WellColumnModel(
        depth_m=scr.depth_m, gr_api=gr, clean_line=scr.gr_clean_line, shale_line=scr.gr_shale_line,
        gr_for_pct=vals if vals.size else gr[np.isfinite(gr)], base_clean=s.gr_clean,
        base_shale=s.gr_shale, vsh_nd=nd, combine=s.vsh_combine, blocking=s.blocking,
        forced_m=forced, changepoint_penalty=s.changepoint_penalty)


def sand_units(layers: Layers) -> tuple[np.ndarray, np.ndarray]:
    """Reservoir units of a column: its sand layers (top_m, base_m)."""
    k = [i for i, x in enumerate(layers.lithology) if x == "sand"]
    return layers.top_m[k], layers.base_m[k]


def unit_labels(units, tops: pd.DataFrame) -> list[str]:
    """``"<formation> <top>-<base> m"`` per unit (the formation whose top is at or above
    the unit's top), or ``"sand <top>-<base> m"`` without tops."""
    t = tops.sort_values("top_m") if len(tops) else tops
    out = []
    for top, base in zip(*units):
        name = "sand"
        if len(t):
            above = t[t["top_m"] <= top + 1e-6]
            if len(above):
                name = str(above["name"].iloc[-1])
        out.append(f"{name} {top:.1f}-{base:.1f} m")
    return out


FAULT_COLUMNS = (
    ["fault", "footwall_well", "hangingwall_well", "footwall_unit", "hangingwall_unit",
     "self_juxtaposed", "throw_m", "throw_p10_m", "throw_p90_m", "fault_dip_deg", "closure_m",
     "juxtaposed_base", "sgr_min_pct_base", "verdict_base", "p_juxtaposed"]
    + [f"sgr_min_pct_p{p}" for p in (10, 50, 90)] + [f"fzp_bar_p{p}" for p in (10, 50, 90)]
    + [f"column_{f}_m_p{p}" for f in FLUIDS for p in (10, 50, 90)]
    + ["p_seal", "main_driver", "main_driver_share", "column_driver", "verdict_rule",
       "realisations", "random_state"]
)
"""Columns of ``faults.csv``, in order (see the README output contract)."""


def _tie_shift_m(spec: FaultSpec, fw, hw) -> float:
    if not spec.two_wells:
        return 0.0
    if spec.marker:
        from logprep.fault.twowell import marker_shift_m

        return marker_shift_m(fw.tops, hw.tops, spec.marker, spec.footwall, spec.hangingwall)
    return float(spec.shift_m)


def fault_closure_source(spec: FaultSpec, fw) -> str:
    """Where a fault's closure comes from: its own row in the faults file, else the
    footwall well's (its closures-file row or ``--closure``)."""
    if spec.closure_m is not None:
        return f"faults file, fault {spec.name}"
    source = getattr(fw, "closure_source", "--closure")
    return f"footwall well, {source}" if source != "--closure" else source


def fault_case(spec: FaultSpec, fw, hw, settings) -> FaultCase:
    """The :class:`~logprep.fault.uncertainty.FaultCase` of a fault from its screened wells
    (``hw`` None for a fault within one well)."""
    cap = capacity_params(settings.capacity, settings.fault_rock)
    datum, _ = depth_datum(fw.well)
    datum = datum or 0.0
    units_fw = sand_units(fw.layers)
    units_hw = sand_units(hw.layers) if hw is not None else units_fw
    if cap.co2_density_mode == "eos" and len(units_fw[0]):
        z_ss = float(np.min(units_fw[0])) - datum
        rho = co2_density_kgm3(hydrostatic_pressure_pa(z_ss, cap.rho_brine_kgm3),
                               geothermal_temperature_k(z_ss, cap.surface_temp_c, cap.geothermal_gradient_c_per_km))
        cap = replace(cap, rho_co2_kgm3=float(rho))
    # the fault's own closure, else the footwall well's (closures file or --closure)
    closure = spec.closure_m if spec.closure_m is not None else fw.settings.capacity.closure_m
    return FaultCase(
        fw_model=column_model(fw), hw_model=column_model(hw) if hw is not None else None,
        shift_m=_tie_shift_m(spec, fw, hw) if hw is not None else 0.0,
        units_fw=units_fw, units_hw=units_hw, capacity=cap,
        burial_datum_m=datum, closure_m=closure, slip_source=settings.pair_slip_source if hw is not None else "footwall")


def base_inputs(spec: FaultSpec, fw, hw, settings) -> BaseInputs:
    s = settings
    return BaseInputs(
        throw=(spec.throw_dist, spec.throw_m, spec.throw_low_m, spec.throw_high_m),
        gr_clean=(s.gr_clean, (hw or fw).settings.gr_clean), gr_shale=(s.gr_shale, (hw or fw).settings.gr_shale),
        transform=s.transform, sand_cutoff=s.sand_cutoff, shale_cutoff=s.shale_cutoff,
        min_bed_m=s.min_bed_m, clay_fraction=float(s.shale_clay_fraction),
        envelope_scale_pct=s.envelope_sgr_scale_pct)


def _drawn_inputs(draws: dict, two_wells: bool) -> dict[str, np.ndarray]:
    """The inputs that vary, as numbers (the transform as its index of first use)."""
    out = {}
    for key in INPUTS:
        if key.endswith("_hw") and not two_wells:
            continue
        v = draws[key]
        if key == "transform":
            _, v = np.unique(v.astype(str), return_inverse=True)
        v = np.asarray(v, float)
        if np.ptp(v) > 0:
            out[key] = v
    return out


@dataclass(frozen=True)
class FaultResult:
    """One fault screened: ``table`` (rows of ``faults.csv``), the realisations and draws,
    the sensitivity per pair (``sensitivity``: pair index -> list of (input, share)), the
    deterministic evaluation ``base``, the fault, its tie shift and the columns."""

    spec: FaultSpec
    table: pd.DataFrame
    realisations: dict
    draws: dict
    base: dict
    sensitivity: dict
    shift_m: float
    fw_layers: Layers
    hw_layers: Layers
    pair_index: tuple
    fw_units: tuple = ((), ())
    hw_units: tuple = ((), ())
    grid: object = None
    footwall_keys: tuple = ()
    closure_m: float | None = None
    closure_source: str = "--closure"


def screen_fault(spec: FaultSpec, fw, hw, settings, spreads: Spreads | None = None) -> FaultResult:
    """Screen one fault: deterministic at the best throw and ``spreads.realisations``
    realisations; ``fw``/``hw`` are the screened wells (``hw`` None within one well)."""
    spreads = spreads or Spreads()
    case = fault_case(spec, fw, hw, settings)
    base = base_inputs(spec, fw, hw, settings)
    b = base_draw(base)
    hw_layers = hw.layers if hw is not None else fw.layers
    det = evaluate_at_throw(fw.layers, hw_layers, case, spec.throw_m, clay_fraction=float(b["clay_fraction"][0]),
                            c_offset=0.0, scale_pct=base.envelope_scale_pct, burial_offset_m=0.0)
    draws = draw_inputs(base, spreads)
    real = fault_realisations(case, draws)
    nh = len(case.units_hw[0])
    lab_f = unit_labels(case.units_fw, fw.tops)
    lab_h = unit_labels(case.units_hw, (hw or fw).tops)
    x = _drawn_inputs(draws, hw is not None)
    juxt = real["juxtaposed"]
    show = np.flatnonzero(juxt.any(axis=0) | det["juxtaposed"])
    pct = {k: percentiles(real[k], juxt) for k in ["sgr_min_pct", "fzp_bar"] + [f"column_{f}_m" for f in FLUIDS]}
    t10, t90 = np.percentile(draws["throw_m"], [10.0, 90.0])
    rows, sens = [], {}
    rule = f"seal where min SGR >= {case.capacity.seal_from_pct:g} % (leak below {case.capacity.leak_below_pct:g} %)"
    for k in show:
        m = juxt[:, k]
        seal = real["seal"][:, k].astype(float)
        xs = {n: v[m] for n, v in x.items()}
        by_seal = rank_inputs(xs, seal[m]) if m.sum() > 2 else []
        if not by_seal or not np.isfinite(by_seal[0][1]):
            by_seal = rank_inputs(xs, real["sgr_min_pct"][m, k]) if m.sum() > 2 else []
        by_col = rank_inputs(xs, real["column_oil_m"][m, k]) if m.sum() > 2 else []
        sens[int(k)] = by_seal
        i, j = divmod(int(k), nh)
        row = {
            "fault": spec.name, "footwall_well": fw.well.name,
            "hangingwall_well": (hw or fw).well.name, "footwall_unit": lab_f[i], "hangingwall_unit": lab_h[j],
            "self_juxtaposed": hw is None and i == j, "throw_m": spec.throw_m,
            "throw_p10_m": t10, "throw_p90_m": t90, "fault_dip_deg": spec.fault_dip_deg,
            "closure_m": case.closure_m if case.closure_m is not None else np.nan,
            "juxtaposed_base": bool(det["juxtaposed"][k]), "sgr_min_pct_base": det["sgr_min_pct"][k],
            "verdict_base": str(case.verdict_rule(det["sgr_min_pct"][k], case.capacity.leak_below_pct,
                                                  case.capacity.seal_from_pct)) if det["juxtaposed"][k] else "",
            "p_juxtaposed": m.mean(),
            "p_seal": seal[m].mean() if m.any() else np.nan,
            "main_driver": INPUTS[by_seal[0][0]] if by_seal and np.isfinite(by_seal[0][1]) else "",
            "main_driver_share": by_seal[0][1] if by_seal else np.nan,
            "column_driver": INPUTS[by_col[0][0]] if by_col and np.isfinite(by_col[0][1]) else "",
            "verdict_rule": rule, "realisations": len(m), "random_state": spreads.random_state,
        }
        for name, arr in pct.items():
            for q, p in zip((10, 50, 90), arr[:, k]):
                row[f"{name}_p{q}"] = p
        rows.append(row)
    table = pd.DataFrame(rows, columns=FAULT_COLUMNS)
    return FaultResult(spec=spec, table=table, realisations=real, draws=draws, base=det, sensitivity=sens,
                       shift_m=case.shift_m, fw_layers=fw.layers, hw_layers=hw_layers,
                       pair_index=tuple(int(k) for k in show), fw_units=case.units_fw,
                       hw_units=case.units_hw, closure_m=case.closure_m,
                       closure_source=fault_closure_source(spec, fw))


# ----------------------------------------------------------------------------- one well, all throws
UNCERTAINTY_COLUMNS = ["sgr_min_pct_p10", "sgr_min_pct_p50", "sgr_min_pct_p90", "p_juxtaposed", "p_seal"]
"""Columns appended to ``juxtapositions.csv`` with ``--uncertainty``."""


def window_uncertainty(scr, spreads: Spreads | None = None) -> pd.DataFrame:
    """:data:`UNCERTAINTY_COLUMNS` for each sand-sand window of a screened well, over
    ``spreads.realisations`` realisations of the clay, blocking, clay-fraction inputs (the
    window spans every throw, so the throw is not drawn): the exact minimum SGR of the
    window's pair of reservoir units over all throws up to the screened maximum."""
    spreads = spreads or Spreads()
    s = scr.settings
    model = column_model(scr)
    spec_throw = ("fixed", s.throw_max_m, None, None)
    base = BaseInputs(throw=spec_throw, gr_clean=(s.gr_clean, s.gr_clean), gr_shale=(s.gr_shale, s.gr_shale),
                      transform=s.transform, sand_cutoff=s.sand_cutoff, shale_cutoff=s.shale_cutoff,
                      min_bed_m=s.min_bed_m, clay_fraction=float(s.shale_clay_fraction))
    d = draw_inputs(base, spreads)
    units = sand_units(scr.layers)
    nu = len(units[0])
    cap = capacity_params(s.capacity, s.fault_rock)
    n = len(d["throw_m"])
    sgr = np.full((n, nu * nu), np.nan)
    for r in range(n):
        L = model.layers(d["gr_clean_fw"][r], d["gr_shale_fw"][r], str(d["transform"][r]),
                         float(d["sand_cutoff"][r]), float(d["shale_cutoff"][r]), float(d["min_bed_m"][r]))
        F, H, smin = window_sgr_min_pct(L, s.throw_max_m)
        u = units_of_layers(L, *units)
        key = np.where((u[F] >= 0) & (u[H] >= 0), u[F] * nu + u[H], -1)
        sgr[r] = group_min(key, smin * float(d["clay_fraction"][r]), nu * nu)
    juxt = np.isfinite(sgr)
    seal = juxt & (verdict(np.where(juxt, sgr, -1.0), cap.leak_below_pct, cap.seal_from_pct) == "seal")
    p = percentiles(sgr, juxt)
    uidx = units_of_layers(scr.layers, *units)
    w = scr.windows
    k = uidx[w["footwall_layer"].to_numpy(int)] * nu + uidx[w["hangingwall_layer"].to_numpy(int)]
    with np.errstate(invalid="ignore"):
        p_seal = seal.sum(axis=0) / juxt.sum(axis=0)
    return pd.DataFrame({
        "sgr_min_pct_p10": p[0, k], "sgr_min_pct_p50": p[1, k], "sgr_min_pct_p90": p[2, k],
        "p_juxtaposed": juxt.mean(axis=0)[k], "p_seal": p_seal[k]}, index=w.index)


def with_fault_work(result, faults: dict | None = None, spreads: Spreads | None = None):
    """``result`` with the fault results whose footwall is this well on ``result.faults``
    (``faults``: footwall key -> results, see
    :func:`logprep.run.fault_batch.faults_by_footwall`) and, with ``spreads``, the
    :data:`UNCERTAINTY_COLUMNS` appended to its windows."""
    from pathlib import Path

    from logprep.io.tops import well_key

    changes = {}
    if faults:
        keys = (well_key(result.well.name), well_key(Path(result.well.source).stem))
        mine = next((faults[k] for k in keys if k in faults), ())
        if mine:
            changes["faults"] = tuple(mine)
    if spreads is not None:
        changes["windows"] = result.windows.join(window_uncertainty(result, spreads))
    return replace(result, **changes) if changes else result
