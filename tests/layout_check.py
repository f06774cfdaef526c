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
    out = []
    for t in fig.findobj(Text):
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
