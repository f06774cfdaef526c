"""Gamma-ray quality control: per-sample flags, pure numpy.

Each flag is a boolean array over the samples.  :data:`QC_FLAGS` is the registry: name ->
(bit, what it means, what logprep does with the flagged samples).  Every flagged sample is
left out of the endpoint picks; readings that cannot be right (negative, implausible,
spikes) are also replaced by interpolation of Vsh across them, like missing samples.

The thresholds are settings, not constants; their defaults are common practice, no source.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
import pandas as pd

from logprep.errors import SettingsError

QC_FLAGS: dict[str, tuple[int, str, str]] = {
    "missing": (1, "GR null (short gap)", "Vsh interpolated; not used in picks"),
    "null_gap": (2, "GR null over a long gap", "Vsh interpolated; not used in picks"),
    "clipped": (4, "GR flat at the tool's maximum (clipped)", "kept; not used in picks"),
    "negative": (8, "GR below 0 API", "replaced by interpolation; not used in picks"),
    "implausible": (16, "GR above the plausible maximum", "replaced by interpolation; not used in picks"),
    "spike": (32, "single-sample GR spike", "replaced by interpolation; not used in picks"),
    "washout": (64, "caliper exceeds bit size (washout)", "kept; not used in picks; neutron-density ignored"),
    "gas_crossover": (128, "neutron-density crossover (gas)", "neutron-density Vsh set to 0, not negative"),
    "bad_density": (256, "density correction (DRHO) beyond its limit: poor pad contact",
                    "neutron-density not used (GR Vsh alone); GR picks unaffected"),
    "bad_hole": (512, "hole enlarged beyond the bad-hole limit (caliper over bit size)",
                 "unusable: a layer mostly of these is 'no data', never reservoir"),
    "long_gap": (1024, "clay volume interpolated over a gap longer than the gap limit",
                 "unusable: a layer mostly of these is 'no data', never reservoir"),
    "top_hole": (2048, "top hole without usable density, neutron or sonic logs",
                 "unusable: a layer mostly of these is 'no data', never reservoir"),
    "log_tail": (4096, "gamma ray alone below the last density, neutron or sonic readings",
                 "unusable: a layer mostly of these is 'no data', never reservoir"),
}
"""QC flag name -> (bit in the exported QC curve, meaning, action)."""

REPLACED = ("negative", "implausible", "spike")
"""Flags whose GR readings are replaced (set missing, then interpolated)."""

ND_ONLY = ("gas_crossover", "bad_density")
"""Flags about the neutron and density logs only: they never keep a GR sample out of the
GR picks."""

QC_TABLE_COLUMNS = ["flag", "top_m", "base_m", "thickness_m", "samples", "meaning", "action"]


@dataclass(frozen=True)
class QcSettings:
    """Thresholds of the GR checks (all common practice, no source).

    Attributes
    ----------
    gap_m : float
        A run of missing GR at least this long (m) is a ``null_gap``.
    gr_max_api : float
        Readings above this (API) are ``implausible``.
    spike_api : float
        Least departure (API) from the running median (7 samples) for a ``spike``.
    spike_sigma : float
        Departure also at least this many robust standard deviations of the residual.
    washout_in : float
        Caliper minus bit size (inches) above which a sample is in a ``washout``.
    clip_min_samples : int
        At least this many samples equal to the curve maximum make it ``clipped``.
    """

    gap_m: float = 1.0
    gr_max_api: float = 500.0
    spike_api: float = 25.0
    spike_sigma: float = 8.0
    washout_in: float = 1.5
    clip_min_samples: int = 3


LENGTH_UNITS_IN: dict[str, float] = {"IN": 1.0, "INCH": 1.0, "INCHES": 1.0, '"': 1.0,
                                     "MM": 1 / 25.4, "CM": 1 / 2.54, "M": 1 / 0.0254}
"""Caliper and bit-size units understood, with their factor to inches."""


def inches(values, unit: str):
    """A caliper or bit-size curve in inches (a blank unit is taken as inches)."""
    key = (unit or "").strip().upper()
    if key in ("", "_"):
        key = "IN"
    if key not in LENGTH_UNITS_IN:
        raise SettingsError(f"caliper/bit-size unit {unit!r} is not understood; use in, mm or cm")
    return np.asarray(values, dtype=float) * LENGTH_UNITS_IN[key]


def runs(mask) -> list[tuple[int, int]]:
    """``(start, stop)`` index pairs (stop exclusive) of the True runs of ``mask``."""
    m = np.concatenate([[False], np.asarray(mask, dtype=bool), [False]])
    d = np.diff(m.astype(np.int8))
    return list(zip(np.flatnonzero(d == 1), np.flatnonzero(d == -1)))


def missing_flags(depth_m, gr_api, gap_m: float) -> tuple[np.ndarray, np.ndarray]:
    """``(short, long)``: missing GR in runs shorter / at least ``gap_m`` metres."""
    depth = np.asarray(depth_m, dtype=float)
    miss = ~np.isfinite(np.asarray(gr_api, dtype=float))
    long_ = np.zeros(miss.size, dtype=bool)
    step = float(np.median(np.diff(depth))) if depth.size > 1 else 0.0
    for a, b in runs(miss):
        if depth[b - 1] - depth[a] + step >= gap_m:
            long_[a:b] = True
    return miss & ~long_, long_


def clipped_flags(gr_api, min_samples: int = 3, max_fraction: float = 0.05) -> np.ndarray:
    """Samples equal to the curve maximum when at least ``min_samples`` share it: a
    tool or digitising ceiling, not a formation reading.  A measured log never repeats
    its highest reading exactly; when more than ``max_fraction`` of the valid samples
    sit at the maximum the curve is taken to be blocky (edited or modelled), not
    clipped."""
    gr = np.asarray(gr_api, dtype=float)
    finite = np.isfinite(gr)
    none = np.zeros(gr.size, dtype=bool)
    if not finite.any():
        return none
    at_top = np.isclose(gr, np.nanmax(gr), rtol=0.0, atol=1e-6)
    n = int(at_top.sum())
    return at_top if min_samples <= n <= max_fraction * finite.sum() else none


def running_median(values, n: int, min_periods: int = 1) -> np.ndarray:
    """Centred running median over ``n`` samples, NaN ignored; NaN where fewer than
    ``min_periods`` valid samples are in the window."""
    return pd.Series(np.asarray(values, dtype=float)).rolling(
        int(n), center=True, min_periods=int(min_periods)).median().to_numpy()


def spike_flags(gr_api, min_api: float = 25.0, n_sigma: float = 8.0, max_run: int = 2) -> np.ndarray:
    """Isolated spikes: runs of at most ``max_run`` samples departing from the centred
    7-sample running median by more than ``max(min_api, n_sigma * sigma)``, where sigma
    is the robust (1.4826 MAD) spread of all departures.  A real bed is wider than two
    samples once the tool's vertical response has smoothed it."""
    gr = np.asarray(gr_api, dtype=float)
    med = running_median(gr, 7, min_periods=3)
    resid = gr - med
    finite = np.isfinite(resid)
    if not finite.any():
        return np.zeros(gr.size, dtype=bool)
    sigma = 1.4826 * float(np.median(np.abs(resid[finite])))
    with np.errstate(invalid="ignore"):
        big = np.abs(resid) > max(min_api, n_sigma * sigma)
    out = np.zeros(gr.size, dtype=bool)
    for a, b in runs(big):
        if b - a <= max_run:
            out[a:b] = True
    return out


def washout_flags(cali_in, bs_in, washout_in: float = 1.5) -> np.ndarray:
    """Caliper more than ``washout_in`` inches over the bit size."""
    with np.errstate(invalid="ignore"):
        return (np.asarray(cali_in, dtype=float) - np.asarray(bs_in, dtype=float)) > washout_in


def density_correction_flags(drho_g_cm3, limit_g_cm3: float = 0.10) -> np.ndarray:
    """Samples whose density correction ``|DRHO|`` exceeds ``limit_g_cm3``.

    The compensated density tool adds DRHO to make up for mudcake and standoff; a large
    correction means the pad lost contact with the wall (rugose or washed-out hole, thick
    mudcake) and the bulk density, hence the neutron-density Vsh, cannot be trusted.
    A limit of about 0.1 g/cm3 is common practice, no source (value from memory).
    Missing DRHO is not flagged.
    """
    with np.errstate(invalid="ignore"):
        return np.abs(np.asarray(drho_g_cm3, dtype=float)) > limit_g_cm3


def gr_flags(
    depth_m,
    gr_api,
    *,
    cali_in=None,
    bs_in=None,
    settings: QcSettings = QcSettings(),
) -> dict[str, np.ndarray]:
    """Every GR flag of :data:`QC_FLAGS` except ``gas_crossover`` (which needs the
    neutron and density logs), as boolean arrays by name.

    Parameters
    ----------
    depth_m, gr_api : array_like
        Depth (m, increasing) and gamma ray (API), NaN where missing.
    cali_in, bs_in : array_like, optional
        Caliper and bit size in inches; without both no washout is flagged.
    """
    gr = np.asarray(gr_api, dtype=float)
    short, long_ = missing_flags(depth_m, gr, settings.gap_m)
    with np.errstate(invalid="ignore"):
        negative = gr < 0.0
        implausible = gr > settings.gr_max_api
    flags = {
        "missing": short,
        "null_gap": long_,
        "clipped": clipped_flags(gr, settings.clip_min_samples),
        "negative": negative,
        "implausible": implausible,
        "spike": spike_flags(np.where(negative | implausible, np.nan, gr),
                             settings.spike_api, settings.spike_sigma) & ~negative & ~implausible,
        "washout": (washout_flags(cali_in, bs_in, settings.washout_in)
                    if cali_in is not None and bs_in is not None else np.zeros(gr.size, dtype=bool)),
    }
    return flags


def any_flag(flags: dict[str, np.ndarray], names=None) -> np.ndarray:
    """True where any of ``names`` (default: all) is set."""
    names = list(flags) if names is None else [n for n in names if n in flags]
    n = len(next(iter(flags.values()))) if flags else 0
    out = np.zeros(n, dtype=bool)
    for k in names:
        out |= flags[k]
    return out


def flag_code(flags: dict[str, np.ndarray]) -> np.ndarray:
    """The flags packed into one integer per sample (bits of :data:`QC_FLAGS`)."""
    n = len(next(iter(flags.values()))) if flags else 0
    code = np.zeros(n, dtype=np.int64)
    for k, m in flags.items():
        code |= np.where(m, QC_FLAGS[k][0], 0)
    return code


def qc_table(depth_m, flags: dict[str, np.ndarray]) -> pd.DataFrame:
    """The ``qc.csv`` table: one row per flagged run, by flag then depth.  ``base_m`` is
    the depth of the run's last sample plus one sampling step."""
    depth = np.asarray(depth_m, dtype=float)
    step = float(np.median(np.diff(depth))) if depth.size > 1 else 0.0
    rows = []
    for name in QC_FLAGS:
        if name not in flags:
            continue
        _bit, meaning, action = QC_FLAGS[name]
        for a, b in runs(flags[name]):
            top, base = depth[a], depth[b - 1] + step
            rows.append((name, top, base, base - top, b - a, meaning, action))
    return pd.DataFrame(rows, columns=QC_TABLE_COLUMNS)


def layer_fraction(depth_m, mask, top_m, base_m) -> np.ndarray:
    """Share of each layer's samples (depth in [top, base)) where ``mask`` is True."""
    depth = np.asarray(depth_m, dtype=float)
    mask = np.asarray(mask, dtype=bool)
    k = np.searchsorted(np.asarray(top_m, dtype=float), depth, side="right") - 1
    inside = (k >= 0) & (depth < np.asarray(base_m, dtype=float)[np.clip(k, 0, None)])
    n = np.bincount(k[inside], minlength=len(top_m)).astype(float)
    hit = np.bincount(k[inside & mask], minlength=len(top_m)).astype(float)
    return np.divide(hit, n, out=np.zeros(len(top_m)), where=n > 0)
