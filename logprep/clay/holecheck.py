"""Samples that cannot tell rock: badly enlarged hole, long filled gaps, top hole, GR-only foot.

A gamma ray read in a 22 in hole full of mud, a clay volume interpolated over 200 m of
missing log, or a surface section logged with nothing but a gamma ray through casing is
not a measurement of the rock.  These functions mark such samples (boolean arrays); the
blocking stage turns a layer that is mostly unusable into ``no data`` (never reservoir).
Pure numpy/pandas.  Thresholds are settings; their defaults are common practice, no
source.
"""

from __future__ import annotations

import numpy as np
import pandas as pd

from logprep.errors import SettingsError

STANDARD_BIT_SIZES_IN = (6.0, 8.5, 12.25, 17.5, 26.0)
"""Common drill-bit sizes (inches) of offshore wells (common practice, no source)."""

UNUSABLE_REASONS = {
    "bad_hole": "hole enlarged beyond the bad-hole limit",
    "long_gap": "clay volume interpolated over a gap longer than the gap limit",
    "qc_failed": "gamma ray missing or rejected by QC",
    "top_hole": "top hole without usable density, neutron or sonic logs",
    "log_tail": "gamma ray alone below the last density, neutron or sonic readings",
}
"""Why a sample is unusable, by name (also the ``no data`` reasons in ``layers.csv``)."""


def _step(depth) -> float:
    d = np.asarray(depth, dtype=float)
    return float(np.median(np.diff(d))) if d.size > 1 else 1.0


def inferred_bit_size_in(depth_m, cali_in, window_m: float = 50.0,
                         under_gauge_in: float = 1.5) -> np.ndarray:
    """A bit size for wells that record none.

    The running 10th percentile of the caliper over ``window_m`` is the in-gauge hole;
    the bit is the largest standard size (:data:`STANDARD_BIT_SIZES_IN`) not above it
    plus ``under_gauge_in`` (a caliper in gauge hole may read a little under the bit:
    arm calibration, mudcake).  A bit never grows with depth, so each depth takes the
    largest size found at or below it.  NaN where there is no caliper.

    Examples
    --------
    >>> import numpy as np
    >>> z = np.arange(0.0, 300.0, 0.5)
    >>> cali = np.where(z < 150, 16.8, 12.4)      # 17.5 in over 12.25 in hole
    >>> bs = inferred_bit_size_in(z, cali)
    >>> float(bs[0]), float(bs[-1])
    (17.5, 12.25)
    """
    cali = np.asarray(cali_in, dtype=float)
    n = max(3, round(window_m / _step(depth_m)))
    low = pd.Series(cali).rolling(n, center=True, min_periods=max(1, n // 5)).quantile(0.10).to_numpy()
    sizes = np.asarray(STANDARD_BIT_SIZES_IN)
    k = np.searchsorted(sizes, low + under_gauge_in, side="right") - 1
    bs = np.where(np.isfinite(low), sizes[np.clip(k, 0, None)], 0.0)
    bs = np.maximum.accumulate(bs[::-1])[::-1]
    return np.where(np.isfinite(cali) & (bs > 0), bs, np.nan)


def bad_hole_flags(cali_in, bs_in, limit_in: float = 3.0) -> np.ndarray:
    """Caliper more than ``limit_in`` inches over the bit size: the hole is so enlarged
    that the gamma ray (mud between tool and wall) and the pad tools do not read the
    rock.  (The ordinary ``washout`` QC flag, 1.5 in by default, only keeps samples out of
    the picks; this one takes them out of the rock.)"""
    if not limit_in > 0:
        raise SettingsError(f"--bad-hole must be > 0 in (got {limit_in:g}); give a caliper "
                            "excess above 0 in (bad_hole_in in a settings file)")
    with np.errstate(invalid="ignore"):
        return (np.asarray(cali_in, dtype=float) - np.asarray(bs_in, dtype=float)) > limit_in


def long_gap_flags(depth_m, filled, limit_m: float = 5.0) -> np.ndarray:
    """Interpolated samples in runs longer than ``limit_m`` metres."""
    if not limit_m >= 0:
        raise SettingsError(f"--gap-limit must be >= 0 m (got {limit_m:g}); give a length of "
                            "0 m or more (gap_limit_m in a settings file)")
    f = np.asarray(filled, dtype=bool)
    depth = np.asarray(depth_m, dtype=float)
    out = np.zeros(f.size, dtype=bool)
    m = np.concatenate([[False], f, [False]])
    d = np.diff(m.astype(np.int8))
    step = _step(depth)
    for a, b in zip(np.flatnonzero(d == 1), np.flatnonzero(d == -1)):
        if depth[b - 1] - depth[a] + step > limit_m:
            out[a:b] = True
    return out


def measured(values, depth_m, window_m: float = 5.0, min_roughness: float = 1e-4) -> np.ndarray:
    """True where a curve is present and carries measurement noise: a density or sonic
    that is a smooth straight trend (a modelled or edited curve, as in some released
    datasets' top holes) has a running median second difference of about zero.  The
    roughness is relative to the curve's median magnitude: a logging tool's sample-to-
    sample noise is some tenths of a percent of its reading, a modelled trend's (F03-4,
    41-526 m) about 1e-5; the limit 1e-4 lies between (common practice, no source)."""
    v = np.asarray(values, dtype=float)
    n = max(3, round(window_m / _step(depth_m)))
    d2 = np.abs(np.diff(v, 2, prepend=np.nan, append=np.nan))
    scale = np.nanmedian(np.abs(v)) if np.any(np.isfinite(v)) else 1.0
    rough = pd.Series(d2).rolling(n, center=True, min_periods=1).median().to_numpy()
    with np.errstate(invalid="ignore"):
        return np.isfinite(v) & (rough > min_roughness * max(scale, 1e-12))


def top_hole_flags(depth_m, aux_curves, min_run_m: float = 30.0) -> np.ndarray:
    """Samples above the first ``min_run_m`` metres in which some auxiliary log (density,
    neutron, sonic) is measured (:func:`measured`), when the well has one somewhere
    deeper.  A well logged with a gamma ray only is left alone (no flag): it has no
    better log to compare with."""
    depth = np.asarray(depth_m, dtype=float)
    out = np.zeros(depth.size, dtype=bool)
    curves = [c for c in aux_curves if c is not None]
    if not curves or depth.size == 0:
        return out
    meas = np.zeros(depth.size, dtype=bool)
    for c in curves:
        meas |= measured(c, depth)
    if not meas.any():
        return out
    n = max(1, round(min_run_m / _step(depth)))
    run = pd.Series(meas.astype(float)).rolling(n, min_periods=n).sum().to_numpy()
    full = np.flatnonzero(run >= n)
    start = int(full[0]) - n + 1 if full.size else int(np.flatnonzero(meas)[0])
    out[:max(start, 0)] = True
    return out


def log_tail_flags(depth_m, aux_curves, min_run_m: float = 30.0) -> np.ndarray:
    """Samples below the last ``min_run_m`` metres in which some auxiliary log (density,
    neutron, sonic) is measured, when the well has one: the foot of the well logged with
    a gamma ray alone (F03-4: 1858-1900 m, GR of 10-14 API in the chalk below the last
    density and sonic).  A clean gamma ray there could be sand, chalk or anhydrite, and
    the well's own lithology logs, which would tell, stop above it.  The mirror of
    :func:`top_hole_flags` (its run taken from the foot up)."""
    depth = np.asarray(depth_m, dtype=float)
    up = top_hole_flags(-depth[::-1], [None if c is None else np.asarray(c, dtype=float)[::-1]
                                       for c in aux_curves], min_run_m)
    return up[::-1]


def unusable_flags(depth_m, *, filled, qc_failed, cali_in=None, bs_in=None, aux_curves=(),
                   bad_hole_in: float = 3.0, gap_limit_m: float = 5.0,
                   top_hole_run_m: float = 30.0) -> dict[str, np.ndarray]:
    """Every reason of :data:`UNUSABLE_REASONS` as a boolean array.  ``bs_in`` None with a
    caliper takes :func:`inferred_bit_size_in`."""
    depth = np.asarray(depth_m, dtype=float)
    none = np.zeros(depth.size, dtype=bool)
    if cali_in is not None:
        bs = inferred_bit_size_in(depth, cali_in) if bs_in is None else bs_in
        bad = bad_hole_flags(cali_in, bs, bad_hole_in)
    else:
        bad = none
    return {
        "bad_hole": bad,
        "long_gap": long_gap_flags(depth, filled, gap_limit_m),
        "qc_failed": np.asarray(qc_failed, dtype=bool),
        "top_hole": top_hole_flags(depth, aux_curves, top_hole_run_m),
        "log_tail": log_tail_flags(depth, aux_curves, top_hole_run_m),
    }
