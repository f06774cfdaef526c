"""Labels that never overlap: window numbers on the triangle diagram and formation names
on the layer column.  Placement is computed in points from the axes' size and limits, so
nothing needs a draw first."""

from __future__ import annotations

import numpy as np

from logprep.report.layout import SANS_ADVANCE_EM, spread_positions


def axes_scale_pt(ax) -> tuple[float, float]:
    """Points per data unit along x and y of ``ax`` (its position on the figure and its
    current limits; y positive upwards on the page)."""
    fig = ax.get_figure()
    pos = ax.get_position()
    x0, x1 = ax.get_xlim()
    y0, y1 = ax.get_ylim()
    return (pos.width * fig.get_figwidth() * 72.0 / (x1 - x0),
            pos.height * fig.get_figheight() * 72.0 / (y1 - y0))


def _overlaps(box, boxes) -> bool:
    x0, y0, x1, y1 = box
    return any(not (x1 <= b[0] or b[2] <= x0 or y1 <= b[1] or b[3] <= y0) for b in boxes)


def place_number_labels(ax, anchors: dict, fontsize: float = 6.5, max_offset_pt: float = 60.0):
    """Positions for numbered labels near their anchor points (data coordinates), none
    overlapping another or leaving the axes.

    ``anchors`` maps a label text to a list of candidate points inside its shape (the
    first is preferred).  Returns ``{text: (x, y, moved)}``: ``moved`` is True when the label
    sits away from every candidate and needs a leader line to the first one.  A label that
    finds no free place within ``max_offset_pt`` is left out.
    """
    sx, sy = axes_scale_pt(ax)  # negative along an inverted axis: points still count up
    (xa, xb), (ya, yb) = ax.get_xlim(), ax.get_ylim()

    def to_pt(x, y):
        return (x - xa) * sx, (y - ya) * sy

    def to_data(px, py):
        return xa + px / sx, ya + py / sy

    w_ax, h_ax = abs((xb - xa) * sx), abs((yb - ya) * sy)
    h = fontsize * 1.45
    placed, out = [], {}
    offsets = [(r * np.cos(a), r * np.sin(a)) for r in np.arange(h, max_offset_pt, h * 0.8)
               for a in np.linspace(0, 2 * np.pi, 12, endpoint=False)]
    for text, points in anchors.items():
        w = len(text) * fontsize * 0.62 + 4
        tries = [(to_pt(*p), False) for p in points]
        first = tries[0][0]
        tries += [((first[0] + dx, first[1] + dy), True) for dx, dy in offsets]
        for (px, py), moved in tries:
            box = (px - w / 2, py - h / 2, px + w / 2, py + h / 2)
            if box[0] < 1 or box[1] < 1 or box[2] > w_ax - 1 or box[3] > h_ax - 1:
                continue
            if not _overlaps(box, placed):
                placed.append(box)
                out[text] = (*to_data(px, py), moved)
                break
    return out


def formation_labels(ax, tops_m, names, fontsize: float = 6.0):
    """Formation names along a depth track: each near its top, spread so that none
    overlaps the next, within the track.  Draws the names (left-aligned, with a leader
    tick to the top where a name had to move) and returns their depths."""
    tops_m = np.asarray(tops_m, float)
    if tops_m.size == 0:
        return np.array([])
    lo, hi = sorted(ax.get_ylim())
    _, sy = axes_scale_pt(ax)
    gap = fontsize * 1.35 / abs(sy)  # one line of text, in metres
    inside = (tops_m >= lo) & (tops_m <= hi)
    tops_m, names = tops_m[inside], [n for n, k in zip(names, inside) if k]
    y = spread_positions(tops_m + gap * 0.55, gap, lo + gap * 0.5, hi - gap * 0.5)
    width_pt = ax.get_position().width * ax.get_figure().get_figwidth() * 72.0
    max_chars = max(3, int((width_pt - 6) / (fontsize * SANS_ADVANCE_EM)))
    for top, yy, name in zip(tops_m, y, names):
        ax.axhline(top, color="#222222", lw=0.7)
        label = name if len(name) <= max_chars else name[: max_chars - 1] + "."
        ax.text(0.04, yy, label, transform=ax.get_yaxis_transform(), fontsize=fontsize,
                va="center", ha="left", parse_math=False,
                bbox={"boxstyle": "square,pad=0.1", "fc": "white", "ec": "none", "alpha": 0.85})
    return y
