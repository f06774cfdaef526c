"""Checks that the text of a drawn matplotlib Figure is legible: no two text boxes
overlap and every one lies on the page.  Used by the sheet and overview tests."""

from __future__ import annotations

from matplotlib.backends.backend_agg import FigureCanvasAgg
from matplotlib.text import Text


def text_boxes(fig) -> list[tuple[str, object]]:
    """(text, window extent) of every visible, non-empty text of ``fig`` after a draw."""
    canvas = FigureCanvasAgg(fig)
    canvas.draw()
    renderer = canvas.get_renderer()
    # tick labels of ticks outside the view are kept as visible Text objects but not drawn
    drawn, all_ticks = set(), set()
    for ax in fig.axes:
        for axis in (ax.xaxis, ax.yaxis):
            for tick in axis.get_major_ticks() + axis.get_minor_ticks():
                all_ticks.update({id(tick.label1), id(tick.label2)})
            for tick in (axis._update_ticks() if ax.axison and axis.get_visible() else []):
                drawn.update({id(tick.label1), id(tick.label2)})
    out = []
    for t in fig.findobj(Text):
        if id(t) in all_ticks and id(t) not in drawn:
            continue
        if not t.get_visible() or not t.get_text().strip():
            continue
        if t.axes is not None and not t.axes.get_visible():
            continue
        bb = t.get_window_extent(renderer)
        if bb.width > 0 and bb.height > 0:
            out.append((t.get_text(), bb))
    return out


def collisions(boxes, shrink: float = 0.5) -> list[tuple[str, str]]:
    """Pairs of texts whose boxes overlap by more than ``shrink`` pixels each way."""
    hits = []
    for i in range(len(boxes)):
        a_text, a = boxes[i]
        for b_text, b in boxes[i + 1:]:
            if (min(a.x1, b.x1) - max(a.x0, b.x0) > shrink
                    and min(a.y1, b.y1) - max(a.y0, b.y0) > shrink):
                hits.append((a_text, b_text))
    return hits


def off_page(fig, boxes, tol: float = 0.5) -> list[str]:
    """Texts whose box leaves the page."""
    w, h = fig.get_figwidth() * fig.dpi, fig.get_figheight() * fig.dpi
    return [t for t, b in boxes if b.x0 < -tol or b.y0 < -tol or b.x1 > w + tol or b.y1 > h + tol]
