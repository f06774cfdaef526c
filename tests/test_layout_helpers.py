"""Pure legibility helpers of the sheet: robust axis limit, spread labels, wrapping."""

import numpy as np
from hypothesis import given, settings
from hypothesis import strategies as st

from logprep.report.layout import (
    nice_ceiling,
    robust_upper,
    spread_positions,
    wrap_to_width,
)


def test_nice_ceiling():
    assert [nice_ceiling(x) for x in (0.9, 1.0, 1.01, 137, 151, 780)] == [1, 1, 1.2, 150, 200, 800]


def test_robust_upper_ignores_spikes_but_keeps_the_shale_line():
    gr = np.r_[np.linspace(20, 140, 1000), [520.0, 750.0]]  # two spikes, as in 16/2-6
    top = robust_upper(gr)
    assert 140 <= top <= 200
    assert robust_upper(gr, [300.0]) >= 300  # a shale line beyond the readings stays in view


@settings(max_examples=200, deadline=None)
@given(st.lists(st.floats(0, 100), min_size=1, max_size=40), st.floats(0.5, 5))
def test_spread_keeps_order_gap_and_bounds(y, gap):
    lo, hi = 0.0, 100.0
    out = spread_positions(y, gap, lo, hi)
    order = np.argsort(np.asarray(y), kind="stable")
    s = out[order]
    assert np.all(s >= lo - 1e-9) and np.all(s <= hi + 1e-9)
    assert np.all(np.diff(s) >= min(gap, (hi - lo) / max(1, len(y) - 1)) - 1e-9)


def test_spread_moves_nothing_that_does_not_collide():
    y = [10.0, 30.0, 50.0]
    assert np.allclose(spread_positions(y, 5, 0, 100), y)
    # two labels 1 apart with a gap of 5 move symmetrically about their mean
    assert np.allclose(spread_positions([50.0, 51.0], 5, 0, 100), [48.0, 53.0])


def test_wrap_fits_width():
    text = "Notes: " + "; ".join(f"note number {k} about the survey and the datum" for k in range(20))
    out = wrap_to_width(text, 500, 7)
    assert max(len(line) for line in out.splitlines()) * 7 * 1233 / 2048 <= 500
    assert out.replace("\n", " ").split() == text.split()
