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


class Box:
    """A rectangle in PDF points (x0, y0 lower left; x1, y1 upper right)."""

    def __init__(self, x0, y0, x1, y1):
        self.x0, self.y0, self.x1, self.y1 = x0, y0, x1, y1


def pdf_text_boxes(pdf: bytes) -> list[tuple[tuple[float, float], list[tuple[str, Box]]]]:
    """For each page of a written PDF: its size (pt) and the (text, box) of every text
    object as PDFium lays it out, that is as a reader sees the page, whatever fonts the
    file uses."""
    import pypdfium2 as pdfium
    import pypdfium2.raw as pdfium_c

    doc = pdfium.PdfDocument(pdf)
    pages = []
    for page in doc:
        textpage = page.get_textpage()
        boxes = []
        for obj in page.get_objects(filter=(pdfium_c.FPDF_PAGEOBJ_TEXT,)):
            x0, y0, x1, y1 = obj.get_bounds()
            text = textpage.get_text_bounded(x0, y0, x1, y1).strip()
            if text and x1 > x0 and y1 > y0:
                boxes.append((text, Box(x0, y0, x1, y1)))
        pages.append((page.get_size(), boxes))
    return pages


def pdf_off_page(size, boxes, tol: float = 0.5) -> list[str]:
    """Texts of a PDF page whose box leaves the page (``size`` in points)."""
    w, h = size
    return [t for t, b in boxes if b.x0 < -tol or b.y0 < -tol or b.x1 > w + tol or b.y1 > h + tol]
