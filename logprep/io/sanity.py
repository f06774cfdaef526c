"""Physical bounds on a log, checked as it is read and before any array is sized from it.

Later stages size grids from the depth range and the sample step (the SGR field, the
thin-bed merge, the running medians), so a depth index of 1e15 m or a step of 1e-7 m
must stop at the reader with one clear line, not as a 40 GiB allocation or a division
by zero.  Values no instrument reads (1e308, infinities) are set missing with a
warning; quirks that still give a result (very few samples, a GR clipped at the tool's
ceiling) give a warning the user sees in ``qc.csv``, on the sheet and in
``summary.csv``.  The bounds are common practice, no source, unless stated.
"""

from __future__ import annotations

import numpy as np

from logprep.errors import LasReadError

MAX_ABS_DEPTH_M = 15_000.0
"""Largest depth magnitude accepted.  The deepest boreholes reach about 12.3 km (Kola
SG-3, 12,262 m; from memory)."""

MIN_STEP_M = 1.0e-5
"""Smallest depth step accepted between two samples (0.01 mm; the finest borehole
imagers sample at about 2.5 mm)."""

MAX_SAMPLES = 5_000_000
"""Most depth samples in one well (a 15 km log sampled every 3 mm)."""

GR_LIMITS_API = (-100.0, 5000.0)
"""Gamma-ray readings outside this range are not measurements (shales read roughly
60-250 API, hot shales up to about 1000 API; common practice, no source)."""

MAX_ABS_VALUE = 1.0e30
"""Readings of other curves beyond this magnitude are not measurements (elastic moduli in
Pa reach about 1e12; 1e30 keeps every physical reading and stops overflows)."""

FEW_SAMPLES = 50
"""Fewer depth samples than this: too few for a meaningful screen (warning)."""

CLIP_SHARE = 0.02
CLIP_RUN = 5
"""GR flat at its own maximum (or minimum) on at least :data:`CLIP_SHARE` of the samples,
in runs of :data:`CLIP_RUN` or more, reads as a clipped (saturated) tool (warning)."""


def check_depth_range(depth_m: np.ndarray) -> None:
    """Refuse a depth index (metres, finite values, any order) that no borehole has:
    beyond :data:`MAX_ABS_DEPTH_M`, or more than :data:`MAX_SAMPLES` samples."""
    if depth_m.size > MAX_SAMPLES:
        raise LasReadError(
            f"{depth_m.size:,} depth samples, over logprep's limit of {MAX_SAMPLES:,}; "
            "split the log into depth intervals or resample it coarser")
    if depth_m.size == 0:
        return
    lo, hi = float(np.min(depth_m)), float(np.max(depth_m))
    if max(abs(lo), abs(hi)) > MAX_ABS_DEPTH_M:
        raise LasReadError(
            f"depth runs {lo:.6g} to {hi:.6g} m, beyond any borehole "
            f"(|depth| <= {MAX_ABS_DEPTH_M:,.0f} m); check the depth column and its unit in "
            "~Curve (or pass --depth-unit)")


def check_depth_index(depth_m: np.ndarray) -> None:
    """:func:`check_depth_range`, and for a sorted increasing index no step below
    :data:`MIN_STEP_M`."""
    check_depth_range(depth_m)
    if depth_m.size > 1:
        step = np.diff(depth_m)
        k = int(np.argmin(step))
        if step[k] < MIN_STEP_M:
            raise LasReadError(
                f"depth step of {step[k]:.3g} m at {depth_m[k]:.6g} m, finer than any "
                f"logging tool (>= {MIN_STEP_M:g} m); check the depth column (its unit, "
                "rounding, or repeated rows) and correct or remove those rows")


def bound_values(curves: dict[str, np.ndarray], gr: str) -> list[str]:
    """Set readings no instrument makes to NaN, in place; returns a warning per curve
    changed.  GR outside :data:`GR_LIMITS_API`; other curves beyond
    :data:`MAX_ABS_VALUE` or infinite."""
    notes = []
    for name, values in curves.items():
        finite = np.isfinite(values)
        if name == gr:
            lo, hi = GR_LIMITS_API
            bad = ~np.isnan(values) & ~((values >= lo) & (values <= hi))
            limit = f"{lo:g}..{hi:g} API"
        else:
            bad = ~np.isnan(values) & ~(finite & (np.abs(values) <= MAX_ABS_VALUE))
            limit = f"+-{MAX_ABS_VALUE:g}"
        n = int(bad.sum())
        if n:
            worst = values[bad][np.argmax(np.abs(values[bad]))]
            values[bad] = np.nan
            notes.append(f"{n} {name} reading(s) outside {limit} (up to {worst:.3g}) set missing; "
                         "check the curve's unit or set them to the NULL value")
    return notes


def quirk_warnings(depth_m: np.ndarray, gr_api: np.ndarray, gr: str) -> list[str]:
    """Warnings for a log that reads but screens poorly: few samples, clipped GR."""
    notes = []
    n = depth_m.size
    if n < FEW_SAMPLES:
        span = float(depth_m[-1] - depth_m[0]) if n > 1 else 0.0
        notes.append(f"only {n} depth samples over {span:.3g} m: too few for a meaningful "
                     "screen (layers and SGR rest on a handful of readings)")
    valid = gr_api[np.isfinite(gr_api)]
    if valid.size >= 20 and np.unique(valid).size >= 20:  # a measured log, not a step model
        for label, value in (("maximum", valid.max()), ("minimum", valid.min())):
            at = gr_api == value
            if at.sum() < CLIP_SHARE * valid.size:
                continue
            runs = np.diff(np.flatnonzero(np.diff(np.r_[0, at.astype(np.int8), 0])))[::2]
            if runs.size and runs.max() >= CLIP_RUN:
                notes.append(
                    f"{gr} flat at its {label} {value:g} on {int(at.sum())} samples "
                    f"({at.sum() / valid.size:.0%}): the tool may have been clipped; check "
                    "the GR there before trusting the shale line")
    return notes


def wrap_warning(wrap: bool, data: bytes, n_curves: int, comma: bool = False) -> str | None:
    """A warning when the ``WRAP`` flag or the ~Curve section does not match the rows of
    the data section (judged from its first non-blank, non-comment lines)."""
    lines = [ln for ln in data[:65536].splitlines()[:60]
             if ln.strip() and not ln.lstrip().startswith(b"#")][:20]
    if not lines or n_curves < 2:
        return None
    counts = [len((ln.replace(b",", b" ") if comma else ln).split()) for ln in lines]
    full = sum(c == n_curves for c in counts)
    if not wrap and full < len(counts) // 2:
        common = max(set(counts), key=counts.count)
        return (f"WRAP. NO, but data lines hold {common} values, not the {n_curves} columns "
                "~Curve lists; check ~Curve names every column once (or set WRAP. YES if "
                "rows wrap)")
    if wrap and full == len(counts) and n_curves > 1:
        return "WRAP. YES, but every data line holds a whole row; set WRAP. NO"
    return None
