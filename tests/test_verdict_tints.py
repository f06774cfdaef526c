"""The verdict tints of the window tables: every verdict word (``self`` included) has its own
tint, told apart in grey print and dark enough text stays readable on it.

Relative luminance and contrast ratio as defined by W3C WCAG 2.0 (2008), s.1.4.3 and its
definitions (contrast (L1 + 0.05) / (L2 + 0.05); 7:1 is the enhanced level)."""

import numpy as np
from matplotlib.figure import Figure

from logprep.fault.capacity import SELF_VERDICT, VERDICTS
from logprep.report.table import VERDICT_COLOURS, draw_window_table


def luminance(hex_colour: str) -> float:
    c = np.array([int(hex_colour[i:i + 2], 16) / 255 for i in (1, 3, 5)])
    c = np.where(c <= 0.03928, c / 12.92, ((c + 0.055) / 1.055) ** 2.4)
    return float(0.2126 * c[0] + 0.7152 * c[1] + 0.0722 * c[2])


def test_every_verdict_word_has_a_tint_apart_in_grey():
    assert set(VERDICT_COLOURS) == set(VERDICTS) | {SELF_VERDICT}
    lum = {v: luminance(c) for v, c in VERDICT_COLOURS.items()}
    others = [lum[v] for v in VERDICTS]
    # the self tint differs from each other tint by at least 0.1 in luminance (grey print)
    assert min(abs(lum[SELF_VERDICT] - x) for x in others) >= 0.1
    # near-black table text (#000) keeps at least 7:1 on every tint
    assert all((x + 0.05) / 0.05 >= 7.0 for x in lum.values())


def test_a_self_row_is_tinted_in_the_table():
    from matplotlib.collections import PatchCollection

    fig = Figure(figsize=(8, 3))
    ax = fig.add_axes([0, 0, 1, 1])
    rows = [["1", "100-110", "90-95", "0-20", "5.0", "9.0", "0", "self"],
            ["2", "120-130", "80-85", "30-50", "25.0", "30.0", "12", "seal"]]
    draw_window_table(ax, rows, "t")
    faces = [tuple(np.round(fc, 3)) for pc in ax.collections if isinstance(pc, PatchCollection)
             for fc in pc.get_facecolors()]
    from matplotlib.colors import to_rgba

    assert tuple(np.round(to_rgba(VERDICT_COLOURS["self"]), 3)) in faces
    assert tuple(np.round(to_rgba(VERDICT_COLOURS["seal"]), 3)) in faces
