"""Small pure helpers that keep sheet pages legible: robust axis limits, labels spread so
they never overlap, and text wrapped to the page.  Arrays and numbers in, numbers out;
nothing here draws."""

from __future__ import annotations

import math
import textwrap

import numpy as np

MONO_ADVANCE_EM = 1233 / 2048
"""Advance width of every glyph of DejaVu Sans Mono (matplotlib's bundled monospace font),
in ems: fixed-width text can be measured exactly without drawing it."""

SANS_ADVANCE_EM = 0.62
"""A safe upper estimate of the mean advance width of DejaVu Sans text, in ems (mixed
case, digits and punctuation average about 0.55)."""


def nice_ceiling(x: float) -> float:
    """The smallest of 1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8 x 10^k at or above ``x`` (> 0)."""
    if not x > 0 or not math.isfinite(x):
        return 1.0
    k = math.floor(math.log10(x))
    for m in (1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10):
        if m * 10 ** k >= x * (1 - 1e-12):
            return m * 10 ** k
    return 10.0 ** (k + 1)


def robust_upper(values, *lines, percentile: float = 99.5, margin: float = 1.1) -> float:
    """Upper axis limit for a log curve: a nice number above the ``percentile`` of the
    finite readings and above every value of ``lines`` (the shale line, say), so a few
    spikes do not squeeze the curve into one side of its track.  Readings above the
    limit are to be marked as clipped by the caller."""
    v = np.asarray(values, float)
    v = v[np.isfinite(v)]
    top = float(np.percentile(v, percentile)) if v.size else 1.0
    for line in lines:
        arr = np.asarray(line, float)
        if arr.size and np.isfinite(arr).any():
            top = max(top, float(np.nanmax(arr)))
    return nice_ceiling(top * margin)


def spread_positions(y, min_gap: float, lo: float, hi: float) -> np.ndarray:
    """Positions as near ``y`` as possible, in the same order, at least ``min_gap`` apart
    and within ``[lo, hi]`` (for labels along a depth axis).

    When the labels cannot all fit (``(n - 1) * min_gap > hi - lo``) they are spaced
    evenly over the whole range, still in order.  Pool-adjacent-violators: each run of
    labels pushed together sits centred on the mean of its wishes.
    """
    y = np.asarray(y, float)
    n = y.size
    if n == 0:
        return y.copy()
    order = np.argsort(y, kind="stable")
    want = np.clip(y[order], lo, hi)
    if (n - 1) * min_gap >= hi - lo:
        out = np.linspace(lo, hi, n) if n > 1 else np.array([(lo + hi) / 2])
    else:
        # shift out the gaps, solve an isotonic fit, shift back
        z = want - min_gap * np.arange(n)
        blocks: list[list[float]] = []  # [mean, count]
        for v in z:
            blocks.append([v, 1])
            while len(blocks) > 1 and blocks[-2][0] > blocks[-1][0]:
                m2, c2 = blocks.pop()
                m1, c1 = blocks.pop()
                blocks.append([(m1 * c1 + m2 * c2) / (c1 + c2), c1 + c2])
        fit = np.concatenate([[m] * c for m, c in blocks])
        fit = np.clip(fit, lo, hi - min_gap * (n - 1))
        out = fit + min_gap * np.arange(n)
    result = np.empty(n)
    result[order] = out
    return result


def wrap_to_width(text: str, width_pt: float, fontsize_pt: float, mono: bool = True) -> str:
    """``text`` with its lines wrapped so that each fits ``width_pt`` points at
    ``fontsize_pt`` (exact for the monospace font, a safe estimate for sans)."""
    advance = MONO_ADVANCE_EM if mono else SANS_ADVANCE_EM
    chars = max(20, int(width_pt / (fontsize_pt * advance)))
    out = []
    for line in text.splitlines() or [""]:
        indent = len(line) - len(line.lstrip(" "))
        out += textwrap.wrap(line, chars, subsequent_indent=" " * (indent + 2),
                             break_long_words=True, break_on_hyphens=False) or [""]
    return "\n".join(out)


def fits_chars(width_pt: float, fontsize_pt: float, mono: bool = True) -> int:
    """How many characters fit ``width_pt`` at ``fontsize_pt``."""
    advance = MONO_ADVANCE_EM if mono else SANS_ADVANCE_EM
    return max(1, int(width_pt / (fontsize_pt * advance)))
