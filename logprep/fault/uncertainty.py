"""Monte Carlo screening of one fault at its throw: draws, realisations and percentiles.

Every realisation draws each uncertain input once, independently, from a documented
default spread (:class:`Spreads`, overridable in the ``[uncertainty]`` table of the
settings file), rebuilds the blocked columns through the ordinary clay-volume and blocking
stages (a *column model*, see :class:`ColumnModel`), and screens the fault's reservoir
pairs at the drawn throw with :mod:`logprep.fault.atthrow`.  All draws come from one
``numpy.random.Generator`` made from the integer ``random_state``, in a fixed order, so a
run is reproducible bit for bit; a spread of zero gives the deterministic value exactly.

Inputs drawn (``INPUTS``), each ``base + spread * (2u - 1)`` with ``u`` uniform on
(0, 1) unless stated:

* throw: from the faults file (fixed, triangular, uniform or normal, inverse CDF of ``u``);
* GR clean and shale lines: a percentile endpoint ``pN`` moves by ``+-gr_*_spread_pct``
  percentile points (the line shifts by the change of the well's GR at that percentile),
  an API endpoint by ``+-gr_*_spread_api``; drawn per well;
* transform: a weighted discrete choice (``transform_weights``), one per realisation;
* sand and shale cut-offs, minimum bed (a fraction of the base value);
* clay fraction of shale (SGR on clay is this fraction times SGR on Vsh);
* envelope constant ``C`` (additive, log10 bar) and SGR scale of the envelope;
* burial depth (additive, m).

Reservoir units are the sand layers of the deterministic column; a realisation's sand
layer belongs to the unit it overlaps most (:func:`logprep.fault.atthrow.units_of_layers`),
so a pair keeps its name while its edges move.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field, fields, replace
from typing import Protocol
from collections.abc import Callable

import numpy as np
from scipy.special import ndtri

from logprep.fault.capacity import CapacityParams, verdict
from logprep.fault.envelope import envelope_c
from logprep.errors import SettingsError
from logprep.fault.atthrow import (
    contact_free_water_m, contact_sgr_min_pct, contacts_at_throw, group_min, units_of_layers,
)
from logprep.model import Layers

FLUIDS = ("oil", "gas", "co2")
P10_90 = (10.0, 50.0, 90.0)
"""Percentiles reported: P10 is the value 10 % of realisations fall below (P10 <= P90)."""
NORMAL_P90_Z = 1.2815515655446004
"""Standard normal quantile at 0.9: a normal throw has sd = (high - low) / (2 x this)."""

INPUTS = {
    "throw_m": "throw",
    "gr_clean_fw": "GR clean line",
    "gr_shale_fw": "GR shale line",
    "gr_clean_hw": "GR clean line (hanging wall)",
    "gr_shale_hw": "GR shale line (hanging wall)",
    "transform": "Vsh transform",
    "sand_cutoff": "sand cut-off",
    "shale_cutoff": "shale cut-off",
    "min_bed_m": "minimum bed",
    "clay_fraction": "clay fraction",
    "envelope_c": "envelope constant C",
    "envelope_scale_pct": "envelope SGR scale",
    "burial_offset_m": "burial depth",
}
"""Every drawn input (key: plain name for tables and sentences), in drawing order."""


@dataclass(frozen=True)
class Spreads:
    """Spreads of the uncertain inputs (half-widths of uniform ranges unless stated).

    Defaults are judgement, stated so that they can be argued with (common practice, no
    source): an endpoint picker's choice moves by a few percentile points or API; the
    linear index is the upper bound of Vsh and two curvilinear transforms for consolidated
    rocks are equally likely; cut-offs are uncertain by 0.05; the minimum bed by half its
    value; the clay fraction of shale by 0.1; the envelope constant by half the step
    between burial classes (0.125, Bretan et al. 2003 classes step by 0.25); burial by
    150 m.  Replace them with local values.
    """

    realisations: int = 1000
    random_state: int = 1
    gr_clean_spread_pct: float = 3.0
    gr_shale_spread_pct: float = 3.0
    gr_clean_spread_api: float = 5.0
    gr_shale_spread_api: float = 10.0
    transform_weights: tuple = (("linear", 1.0), ("larionov-older", 1.0), ("stieber", 1.0))
    sand_cutoff_spread: float = 0.05
    shale_cutoff_spread: float = 0.05
    min_bed_spread_frac: float = 0.5
    clay_fraction_spread: float = 0.1
    envelope_c_spread: float = 0.125
    envelope_scale_spread_pct: float = 0.0
    burial_spread_m: float = 150.0
    draw_throw: bool = True
    """False keeps every throw at its best estimate (the faults file range is ignored)."""

    def __post_init__(self) -> None:
        w = self.transform_weights
        if isinstance(w, dict):
            w = tuple(w.items())
        object.__setattr__(self, "transform_weights", tuple((str(k), float(v)) for k, v in w))
        if not isinstance(self.realisations, int) or not 1 <= self.realisations <= 1_000_000:
            raise SettingsError(f"uncertainty realisations must be a whole number 1-1000000 (got {self.realisations!r}); "
                                "give --realisations a whole number such as 1000")
        if not isinstance(self.random_state, int) or self.random_state < 0:
            raise SettingsError(f"uncertainty random_state must be a whole number >= 0 (got {self.random_state!r}); "
                                "give --random-state a whole number such as 0")
        for f in fields(self):
            v = getattr(self, f.name)
            if f.name.endswith(("_spread", "_spread_pct", "_spread_api", "_spread_m", "_frac")) \
                    and not (isinstance(v, (int, float)) and math.isfinite(v) and v >= 0):
                raise SettingsError(f"uncertainty {f.name} must be a finite number >= 0 (got {v!r}); "
                                    f"give {f.name} 0 or more in the [uncertainty] table")
        if not self.transform_weights or any(not (math.isfinite(x) and x >= 0) for _, x in self.transform_weights) \
                or sum(x for _, x in self.transform_weights) <= 0:
            raise SettingsError("uncertainty transform_weights: weights must be >= 0 and not all zero; give "
                                "non-negative weights (for example linear = 1, stieber = 1)")
        if self.min_bed_spread_frac > 1:
            raise SettingsError(f"uncertainty min_bed_spread_frac must be within 0-1 (got {self.min_bed_spread_frac:g}); "
                                "give a fraction such as 0.25 in the [uncertainty] table")

    @classmethod
    def zero(cls, transform: str, **kw) -> Spreads:
        """No spread at all: every realisation is the deterministic screening."""
        zeros = {f.name: 0.0 for f in fields(cls) if f.name.endswith(
            ("_spread", "_spread_pct", "_spread_api", "_spread_m", "_frac"))}
        return cls(**(zeros | {"transform_weights": ((transform, 1.0),), "draw_throw": False} | kw))

    def updated(self, **changes) -> Spreads:
        return replace(self, **changes)


def spreads_from_dict(data: dict, source: str = "settings") -> Spreads:
    """:class:`Spreads` from the ``[uncertainty]`` table of a settings file (unknown keys
    and wrong types are errors naming ``source`` and the key)."""
    names = {f.name: f for f in fields(Spreads)}
    kw = {}
    for key, value in data.items():
        if key not in names:
            raise SettingsError(f"{source}: unknown key [uncertainty] {key!r}; valid keys: {', '.join(names)}")
        if key == "transform_weights":
            if not isinstance(value, dict):
                raise SettingsError(f"{source}: [uncertainty] transform_weights must be a table; write it "
                                    "as [uncertainty.transform_weights] with transform = weight lines")
        elif key in ("realisations", "random_state"):
            if not isinstance(value, int) or isinstance(value, bool):
                raise SettingsError(f"{source}: [uncertainty] {key} must be a whole number; write it "
                                    "without a decimal point or quotes (for example 1000)")
        elif key == "draw_throw":
            if not isinstance(value, bool):
                raise SettingsError(f"{source}: [uncertainty] draw_throw must be true or false; write "
                                    "draw_throw = true or draw_throw = false (no quotes)")
        elif not isinstance(value, (int, float)) or isinstance(value, bool):
            raise SettingsError(f"{source}: [uncertainty] {key} must be a number; write a number "
                                f"without quotes (for example {key} = 0.1)")
        kw[key] = value
    try:
        return Spreads(**kw)
    except SettingsError as exc:
        raise SettingsError(f"{source}: {exc}") from None


# ----------------------------------------------------------------------------- draws
def draw_throw_m(u, dist: str, best_m: float, low_m: float | None, high_m: float | None) -> np.ndarray:
    """Throws (m) from uniforms ``u`` by the inverse CDF of the fault's distribution.

    ``triangular``: mode ``best`` on ``[low, high]``; ``uniform``: ``[low, high]``;
    ``normal``: mean ``best``, ``low``/``high`` its P10/P90, truncated at 1 mm;
    ``fixed``: ``best``.
    """
    u = np.asarray(u, float)
    if dist == "fixed" or low_m is None or high_m is None or high_m == low_m:
        return np.full(u.shape, float(best_m))
    lo, hi, mode = float(low_m), float(high_m), float(best_m)
    if dist == "uniform":
        return lo + (hi - lo) * u
    if dist == "normal":
        sd = (hi - lo) / (2.0 * NORMAL_P90_Z)
        return np.maximum(mode + sd * ndtri(u), 1e-3)
    if dist == "triangular":
        fc = (mode - lo) / (hi - lo)
        left = lo + np.sqrt(u * (hi - lo) * (mode - lo))
        right = hi - np.sqrt((1.0 - u) * (hi - lo) * (hi - mode))
        return np.where(u < fc, left, right)
    raise SettingsError(f"unknown throw distribution {dist!r}; use one of fixed, uniform, "
                        "triangular, normal in the throw_dist column")


@dataclass(frozen=True)
class BaseInputs:
    """The deterministic value of every drawn input (see :data:`INPUTS`).

    ``gr_clean``/``gr_shale``: per well (footwall, hanging wall) the endpoint setting, a
    number (API) or ``"pN"``.  ``throw``: ``(dist, best, low, high)`` from the faults file.
    """

    throw: tuple
    gr_clean: tuple
    gr_shale: tuple
    transform: str
    sand_cutoff: float
    shale_cutoff: float
    min_bed_m: float
    clay_fraction: float = 1.0
    envelope_scale_pct: float = 27.0


def _endpoint(setting, u, spread_pct: float, spread_api: float):
    """Drawn endpoint levels: percentile points for ``pN``, API otherwise."""
    if isinstance(setting, str):
        base = float(setting[1:])
        return np.clip(base + spread_pct * (2.0 * u - 1.0), 0.0, 100.0)
    return float(setting) + spread_api * (2.0 * u - 1.0)


def draw_inputs(base: BaseInputs, spreads: Spreads, n: int | None = None) -> dict[str, np.ndarray]:
    """``n`` realisations (default ``spreads.realisations``) of every input of
    :data:`INPUTS`: a dict of arrays of shape ``(n,)`` (``transform`` holds names).

    One uniform per input and realisation is drawn in a fixed order whatever the spreads,
    so changing one spread never changes the draws of another input.
    """
    n = spreads.realisations if n is None else int(n)
    rng = np.random.default_rng(spreads.random_state)
    u = dict(zip(INPUTS, rng.random((len(INPUTS), n))))
    dist, best, low, high = base.throw
    out = {"throw_m": draw_throw_m(u["throw_m"], dist if spreads.draw_throw else "fixed", best, low, high)}
    for k, side in enumerate(("fw", "hw")):
        out[f"gr_clean_{side}"] = _endpoint(base.gr_clean[k], u[f"gr_clean_{side}"],
                                            spreads.gr_clean_spread_pct, spreads.gr_clean_spread_api)
        out[f"gr_shale_{side}"] = _endpoint(base.gr_shale[k], u[f"gr_shale_{side}"],
                                            spreads.gr_shale_spread_pct, spreads.gr_shale_spread_api)
    names = [k for k, _ in spreads.transform_weights]
    w = np.array([x for _, x in spreads.transform_weights], float)
    cum = np.cumsum(w) / w.sum()
    pick = np.minimum(np.searchsorted(cum, u["transform"], side="right"), len(names) - 1)
    out["transform"] = np.array(names, dtype=object)[pick]
    sand = base.sand_cutoff + spreads.sand_cutoff_spread * (2.0 * u["sand_cutoff"] - 1.0)
    shale = base.shale_cutoff + spreads.shale_cutoff_spread * (2.0 * u["shale_cutoff"] - 1.0)
    out["sand_cutoff"] = np.clip(sand, 0.0, 0.99)
    out["shale_cutoff"] = np.clip(np.maximum(shale, out["sand_cutoff"] + 0.01), 0.0, 1.0)
    out["min_bed_m"] = base.min_bed_m * (1.0 + spreads.min_bed_spread_frac * (2.0 * u["min_bed_m"] - 1.0))
    cf = base.clay_fraction + spreads.clay_fraction_spread * (2.0 * u["clay_fraction"] - 1.0)
    out["clay_fraction"] = np.clip(cf, 0.01, 1.0)
    out["envelope_c"] = spreads.envelope_c_spread * (2.0 * u["envelope_c"] - 1.0)
    out["envelope_scale_pct"] = np.maximum(
        base.envelope_scale_pct + spreads.envelope_scale_spread_pct * (2.0 * u["envelope_scale_pct"] - 1.0), 1.0)
    out["burial_offset_m"] = spreads.burial_spread_m * (2.0 * u["burial_offset_m"] - 1.0)
    return out


def base_draw(base: BaseInputs) -> dict[str, np.ndarray]:
    """The deterministic inputs as a one-realisation draw (for :func:`screen_fault_at_throw`)."""
    return draw_inputs(base, Spreads.zero(base.transform), 1)


# ----------------------------------------------------------------------------- one realisation
class ColumnModel(Protocol):
    """Builds a well's blocked column for one realisation's clay and blocking inputs."""

    def layers(self, gr_clean, gr_shale, transform: str, sand_cutoff: float,
               shale_cutoff: float, min_bed_m: float) -> Layers: ...


@dataclass(frozen=True)
class FaultCase:
    """Everything about one fault that is not drawn.

    ``units_*``: reservoir units (top_m, base_m arrays) of each column; ``burial_datum_m``:
    the footwall depth where burial depth is zero (the sea floor or ground on the well's
    depth axis; its elevation datum until the clay/burial conventions add water depth and
    uplift) unless ``capacity.max_burial_m`` is set; ``closure_m`` caps the columns.
    """

    fw_model: ColumnModel
    hw_model: ColumnModel | None
    shift_m: float
    units_fw: tuple
    units_hw: tuple
    capacity: CapacityParams = field(default_factory=CapacityParams)
    burial_datum_m: float = 0.0
    closure_m: float | None = None
    slip_source: str = "footwall"
    verdict_rule: Callable = verdict


def _layers(model: ColumnModel, d: dict, r: int, side: str) -> Layers:
    return model.layers(d[f"gr_clean_{side}"][r], d[f"gr_shale_{side}"][r], str(d["transform"][r]),
                        float(d["sand_cutoff"][r]), float(d["shale_cutoff"][r]), float(d["min_bed_m"][r]))


def evaluate_at_throw(fw: Layers, hw: Layers, case: FaultCase, throw_m: float, *, clay_fraction: float,
                      c_offset: float, scale_pct: float, burial_offset_m: float) -> dict[str, np.ndarray]:
    """The reservoir pairs of one realisation: arrays over ``units_fw x units_hw`` (flat):
    ``juxtaposed``, ``sgr_min_pct``, ``fzp_bar``, ``column_{oil,gas,co2}_m``, ``seal``."""
    p = case.capacity
    nf, nh = len(case.units_fw[0]), len(case.units_hw[0])
    cts = contacts_at_throw(fw, hw, case.shift_m, throw_m, slip_source=case.slip_source)
    uf = units_of_layers(fw, *case.units_fw)[cts.fw_layer]
    uh = units_of_layers(hw, *case.units_hw)[cts.hw_layer]
    key = np.where((uf >= 0) & (uh >= 0), uf * nh + uh, -1)
    n = nf * nh

    def burial(top):
        return (p.max_burial_m if p.max_burial_m is not None else top - case.burial_datum_m) + burial_offset_m

    c = envelope_c(burial(cts.top_m), p.class_bounds_m, p.class_c) + c_offset
    smin = contact_sgr_min_pct(cts, clay_fraction)
    drho = [p.rho_brine_kgm3 - r for r in (p.rho_oil_kgm3, p.rho_gas_kgm3, p.rho_co2_kgm3)]
    fwl = contact_free_water_m(cts, c, drho, clay_fraction=clay_fraction, sgr_scale_pct=scale_pct)
    top = group_min(key, cts.top_m, n)
    sgr = group_min(key, smin, n)
    cols = group_min(key, fwl, n) - top[None, :]
    if case.closure_m is not None:
        cols = np.minimum(cols, case.closure_m)
    juxt = np.isfinite(top)
    c_pair = envelope_c(burial(np.where(juxt, top, 0.0)), p.class_bounds_m, p.class_c) + c_offset
    out = {"juxtaposed": juxt, "sgr_min_pct": sgr,
           "fzp_bar": np.where(juxt, 10.0 ** (sgr / scale_pct - c_pair), np.nan),
           "seal": juxt & (case.verdict_rule(np.where(juxt, sgr, -1.0), p.leak_below_pct, p.seal_from_pct) == "seal"),
           "contact_top_m": top}
    for k, fluid in enumerate(FLUIDS):
        out[f"column_{fluid}_m"] = np.where(juxt, cols[k], np.nan)
    return out


def fault_realisations(case: FaultCase, draws: dict[str, np.ndarray]) -> dict[str, np.ndarray]:
    """Every realisation of :func:`evaluate_at_throw`: arrays of shape ``(n, pairs)``.

    The columns are rebuilt once per realisation and well (blocking is the only step that
    is not an array operation over the realisations); everything after the blocking works
    on arrays of bed pairs.
    """
    n = len(draws["throw_m"])
    rows = []
    for r in range(n):
        fw = _layers(case.fw_model, draws, r, "fw")
        hw = fw if case.hw_model is None else _layers(case.hw_model, draws, r, "hw")
        rows.append(evaluate_at_throw(
            fw, hw, case, float(draws["throw_m"][r]), clay_fraction=float(draws["clay_fraction"][r]),
            c_offset=float(draws["envelope_c"][r]), scale_pct=float(draws["envelope_scale_pct"][r]),
            burial_offset_m=float(draws["burial_offset_m"][r])))
    return {k: np.stack([row[k] for row in rows]) for k in rows[0]}


def percentiles(values, mask) -> np.ndarray:
    """P10, P50, P90 of ``values`` (n, pairs) over the realisations where ``mask``; NaN for
    a pair with none.  Linear interpolation between order statistics (numpy's default)."""
    v = np.where(mask, np.asarray(values, float), np.nan)
    out = np.full((len(P10_90), v.shape[1]), np.nan)
    has = mask.any(axis=0)
    if has.any():
        out[:, has] = np.nanpercentile(v[:, has], P10_90, axis=0)
    return out
