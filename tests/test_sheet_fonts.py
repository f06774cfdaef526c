"""Fonts of the written sheet: Latin text is set in the PDF viewer's built-in Helvetica and
Courier (no font embedded, the fast path of ``logprep.report.writers.pdf_bytes``); a well
named in another script keeps the embedded DejaVu fonts, which have its letters.  PDF
facts (the standard 14 fonts every conforming reader supplies; WinAnsi encoding): ISO
32000-1:2008, sections 9.6.2.2 and D.1."""

from __future__ import annotations

from dataclasses import replace

import pypdfium2 as pdfium

from logprep.io.las import read_well
from logprep.report.sheet import build_sheet
from logprep.report.writers import CORE_FONT_TEXT, core_fonts_suffice, render_well
from logprep.run.pipeline import screen_well
from logprep.run.settings import ScreenSettings


def _sheet(example_dir, name=None):
    well = read_well(example_dir / "HRM-1.las")
    if name:
        well = replace(well, name=name)
    return render_well(screen_well(well, ScreenSettings()), build_sheet, field=False)


def _page_text(pdf: bytes, k: int = 0) -> str:
    return pdfium.PdfDocument(pdf)[k].get_textpage().get_text_range()


def test_latin_sheet_uses_the_built_in_fonts(example_dir):
    files = _sheet(example_dir, "Ærøskøbing Sør-1")  # Latin-1 letters are covered
    pdf = files["sheet.pdf"]
    assert b"/BaseFont /Helvetica" in pdf and b"/BaseFont /Courier" in pdf
    assert b"/FontFile" not in pdf and b"/CharProcs" not in pdf  # nothing embedded
    assert "Ærøskøbing Sør-1" in _page_text(pdf)
    assert "−" not in _page_text(pdf, 1)  # an ASCII minus, which the built-in fonts have


def test_other_scripts_keep_embedded_fonts(example_dir):
    name = "Берёза-1"
    assert not set(name) <= CORE_FONT_TEXT
    pdf = _sheet(example_dir, name)["sheet.pdf"]
    assert b"/BaseFont /Helvetica" not in pdf
    assert b"DejaVuSans" in pdf  # the embedded font that has Cyrillic letters
    assert b"/CharProcs" in pdf


def test_core_font_check_reads_every_text():
    from matplotlib.figure import Figure

    fig = Figure()
    ax = fig.add_subplot()
    ax.set_xlabel("throw (m)")
    assert core_fonts_suffice([fig])
    ax.set_yticks([0, 1], ["dip", "throw"])
    assert core_fonts_suffice([fig])
    ax.set_yticks([0, 1], ["dip", "Δ throw"])  # tick labels given as text are read too
    assert not core_fonts_suffice([fig])
    ax.set_yticks([0, 1], ["dip", "throw"])
    ax.legend(handles=ax.plot([0, 1], label="SGR ≥ 20 %"))  # '≥' is not in WinAnsi
    assert not core_fonts_suffice([fig])
