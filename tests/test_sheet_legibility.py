"""Every page of the sheet is legible on the open wells the sheets were found hard to read
on (labels running together, names overprinting, numbers piling up, lines off the edge):
no two text boxes collide and none leaves the page.  Also the formation names are drawn
when tops are given, and the GR scale is robust to spikes."""

from __future__ import annotations

import numpy as np
import pytest

from conftest import open_logs_path
from layout_check import collisions, off_page, pdf_off_page, pdf_text_boxes, text_boxes
from logprep.report.sheet import build_sheet
from logprep.run.pipeline import screen_file
from logprep.run.settings import ScreenSettings

OPEN_WELLS = {
    "31/3-1": ("force2020_norway", "31_3-1.las"),
    "16/2-6": ("force2020_norway", "16_2-6.las"),
    "33/9-1": ("force2020_norway", "33_9-1.las"),
    "25/11-24": ("force2020_norway", "25_11-24.las"),
    "31/2-7": ("force2020_norway", "31_2-7.las"),
    "ALMA 3": ("cnsopb_nova_scotia", "ALMA_3_D399_SON_DEN_NEUT_2393-3388M_LAS.las"),
}


def assert_legible(pages, who):
    for k, page in enumerate(pages, start=1):
        boxes = text_boxes(page)
        assert boxes, f"{who} page {k}: no text"
        hit = collisions(boxes)
        assert not hit, f"{who} page {k}: overlapping text {hit[:5]}"
        out = off_page(page, boxes)
        assert not out, f"{who} page {k}: text off the page {[t[:60] for t in out[:5]]}"


def assert_pdf_legible(pdf: bytes, who):
    """The same checks on the written PDF, with the fonts it was written in (the viewer's
    built-in ones for Latin text), text boxes as PDFium lays them out."""
    for k, (size, boxes) in enumerate(pdf_text_boxes(pdf), start=1):
        assert boxes, f"{who} PDF page {k}: no text"
        hit = collisions(boxes, shrink=0.4)
        assert not hit, f"{who} PDF page {k}: overlapping text {hit[:5]}"
        out = pdf_off_page(size, boxes)
        assert not out, f"{who} PDF page {k}: text off the page {[t[:60] for t in out[:5]]}"


def written_sheet(result) -> bytes:
    from logprep.report.writers import render_well

    return render_well(result, build_sheet, field=False)["sheet.pdf"]


@pytest.mark.parametrize("name", list(OPEN_WELLS))
def test_open_well_sheet_text_never_collides(name):
    path = open_logs_path(*OPEN_WELLS[name])
    result = screen_file(path, ScreenSettings())
    assert_legible(build_sheet(result), name)
    assert_pdf_legible(written_sheet(result), name)


def test_example_with_tops_survey_and_notes(example_dir):
    # HRM-5: deviated (survey note), with tops (formation names), the longest notes
    s = ScreenSettings(tops_file=str(example_dir / "tops.csv"), survey_dir=str(example_dir / "surveys"))
    result = screen_file(example_dir / "HRM-5.las", s)
    pages = build_sheet(result)
    assert_legible(pages, "HRM-5")
    assert_pdf_legible(written_sheet(result), "HRM-5")
    texts = [t for t, _ in text_boxes(pages[0])]
    for name in result.tops["name"]:  # every formation of the well is named on page 1
        assert any(str(name)[:8] in t for t in texts), name


def test_gr_scale_is_robust_to_spikes():
    path = open_logs_path(*OPEN_WELLS["16/2-6"])  # readings to about 750 API
    result = screen_file(path, ScreenSettings())
    page = build_sheet(result)[0]
    ax_gr = page.axes[0]
    lo, hi = ax_gr.get_xlim()
    gr = result.gr_api[np.isfinite(result.gr_api)]
    assert lo == 0 and hi < gr.max() / 2  # the axis does not stretch to the spikes
    assert np.mean(gr <= hi) >= 0.995  # yet holds at least 99.5 % of the readings
    labels = [t.get_label() for t in ax_gr.collections]
    assert any("API, at edge" in lab for lab in labels)  # the clipped ones are marked


def test_pair_sheet_is_complete_and_legible(example_dir):
    # the bundled HRM-2 / HRM-3 pair tied on the Kellan Marker (example_logs/pairs.csv)
    from logprep.fault.twowell import marker_shift_m, two_well_field
    from logprep.report.pair_sheet import PairScreening, build_pair_sheet, tie_depth
    from logprep.run.pairs import pair_windows

    s = ScreenSettings(tops_file=str(example_dir / "tops.csv"))
    fw = screen_file(example_dir / "HRM-2.las", s)
    hw = screen_file(example_dir / "HRM-3.las", s)
    shift = marker_shift_m(fw.tops, hw.tops, "Kellan Marker")
    windows = pair_windows(fw, hw, shift, s)
    assert set(windows["verdict"]) <= {"leak", "uncertain", "seal"} and windows["column_oil_m"].notna().all()
    grid = two_well_field(fw.layers, hw.layers, shift, throw_max_m=300, throw_step_m=1, depth_step_m=0.5,
                          slip_source="footwall")
    pages = build_pair_sheet(PairScreening(fw, hw, shift, "Kellan Marker", windows, grid, s))
    assert len(pages) == 3  # columns and triangle, window table with verdicts, seal capacity
    assert_legible(pages, "HRM-2/HRM-3")
    from logprep.report.writers import pdf_bytes, plain_text

    with plain_text():
        assert_pdf_legible(pdf_bytes(build_pair_sheet(PairScreening(fw, hw, shift, "Kellan Marker",
                                                                    windows, grid, s))), "HRM-2/HRM-3")
    table_text = " ".join(t for t, _ in text_boxes(pages[1]))
    for word in set(windows["verdict"]):
        assert f" {word} " in table_text
    assert "seal capacity" in " ".join(t for t, _ in text_boxes(pages[2]))
    # the tie is drawn on both columns at the marker's footwall depth
    tie = tie_depth(fw.tops, "Kellan Marker")
    for ax in pages[0].axes[:2]:
        ys = [ln.get_ydata()[0] for ln in ax.get_lines()]
        assert any(abs(y - tie) < 1e-9 for y in ys)


def test_written_sheet_prints_no_math_markup(example_dir):
    """The sheet draws every text as plain text (file names are never math); tick labels of
    the logarithmic axes (column heights, CSP colour bar) must then be plain numbers, not
    markup such as ``$\\mathdefault{10^{3}}$``.  Read from the written PDF with PDFium.
    (Plain tick labels of a log axis: common practice, no source.)"""
    import pypdfium2 as pdfium

    from logprep.report.writers import render_well

    result = screen_file(example_dir / "HRM-1.las", ScreenSettings())
    files = render_well(result, build_sheet)
    doc = pdfium.PdfDocument(files["sheet.pdf"])
    texts = [doc[i].get_textpage().get_text_range() for i in range(len(doc))]
    for k, text in enumerate(texts, start=1):
        assert "mathdefault" not in text and "$" not in text, f"page {k} prints math markup"
    capacity = next(t for t in texts if "seal capacity" in t)
    assert "1000" in capacity.split() or "100" in capacity.split(), "log axis labels missing"
    smear = next(t for t in texts if "smear indicators" in t)
    assert {"0.1", "1", "10", "100", "1000"} <= set(smear.split()), "CSP colour bar labels missing"
    png = files["sheet.png"]
    assert png.startswith(b"\x89PNG")


def test_pdf_check_finds_overlap_and_text_off_the_page():
    """The PDF checks above can fail: two texts drawn over each other and one past the
    right edge are found in the written file."""
    from matplotlib.figure import Figure

    from logprep.report.writers import pdf_bytes

    fig = Figure(figsize=(4, 3))
    fig.text(0.1, 0.5, "first line of text", fontsize=10)
    fig.text(0.15, 0.51, "second over it", fontsize=10)
    fig.text(0.9, 0.2, "runs off the right edge", fontsize=10)
    ((size, boxes),) = pdf_text_boxes(pdf_bytes([fig]))
    assert collisions(boxes, shrink=0.4)
    assert pdf_off_page(size, boxes) == ["runs off the right edge"]
