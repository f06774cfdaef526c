"""Writing results: every file is written to a temporary name and moved into place, so an
interrupted run never leaves a half-written file and earlier results stay until replaced."""

from __future__ import annotations

import io
import logging
from contextlib import contextmanager
import os
import re
import tempfile
import threading
import warnings
from pathlib import Path

import matplotlib
import pandas as pd
from matplotlib.backends.backend_agg import FigureCanvasAgg
from matplotlib.backends.backend_pdf import PdfPages

from logprep.errors import OutputError
from logprep.fault.juxtaposition import WINDOW_COLUMNS
from logprep.io.survey import layer_tst_m
from logprep.report.lasexport import las_bytes
from logprep.clay.qc import any_flag, layer_fraction, qc_table
from logprep.io.safetext import safe_cell

SUMMARY_COLUMNS = ["well", "source", "status", "message", "layers", "sand_sand_windows",
                   "min_window_sgr_pct", "folder", "warnings"]


def current_umask() -> int:
    """The process's file-mode creation mask, read without changing it where the system
    says it (Linux ``/proc/self/status``); elsewhere set and restored at once."""
    try:
        with open("/proc/self/status", encoding="ascii") as f:
            for line in f:
                if line.startswith("Umask:"):
                    return int(line.split()[1], 8)
    except (OSError, ValueError, IndexError):
        pass
    mask = os.umask(0o022)
    os.umask(mask)
    return mask


def write_bytes_atomic(path: Path, data: bytes) -> None:
    """Write ``data`` to ``path`` through a temporary file in the same folder.

    The file gets the mode a plain ``open(path, "w")`` would give (``0o666`` less the
    umask: 0644 under the usual 022), not the owner-only mode of a temporary file, so
    colleagues can read results on a shared drive."""
    path = Path(path)
    try:
        path.parent.mkdir(parents=True, exist_ok=True)
        fd, tmp = tempfile.mkstemp(prefix=f".{path.name}.", suffix=".tmp", dir=path.parent)
        try:
            os.fchmod(fd, 0o666 & ~current_umask())
            with os.fdopen(fd, "wb") as f:
                f.write(data)
            os.replace(tmp, path)
        except BaseException:
            Path(tmp).unlink(missing_ok=True)
            raise
    except OSError as exc:
        raise OutputError(f"{path}: cannot write ({exc.strerror or exc}); check the space "
                          "and permissions of the output folder, or give another --out") from exc


def prepare_out_dir(out_dir: str | Path) -> Path:
    """Make the output folder (and its parents) before any work, so that an ``--out`` that
    names a file or a folder that cannot be made fails at once with one message."""
    out = Path(out_dir)
    if out.exists() and not out.is_dir():
        raise OutputError(f"{out}: a file of that name exists; --out must name a folder")
    try:
        out.mkdir(parents=True, exist_ok=True)
    except OSError as exc:
        raise OutputError(f"{out}: cannot make the output folder ({exc.strerror or exc}); "
                          "choose another --out") from exc
    return out


def csv_bytes(frame: pd.DataFrame) -> bytes:
    """A table as CSV; text cells made safe (control characters escaped, formula-like
    text neutralised: see :func:`logprep.io.safetext.safe_cell`)."""
    text_cols = [c for c in frame.columns if frame[c].dtype == object or pd.api.types.is_string_dtype(frame[c])]
    if text_cols:
        frame = frame.copy()
        for c in text_cols:
            frame[c] = frame[c].map(safe_cell).astype(object)
    return frame.to_csv(index=False, float_format="%.10g", lineterminator="\n").encode(
        "utf-8", errors="backslashreplace")


class _NoWeightNotice(logging.Filter):
    """Drops matplotlib's notice that the built-in fonts' "Medium" weight stands in for
    "normal" (they have no other; the text is drawn as intended)."""

    def filter(self, record: logging.LogRecord) -> bool:
        return "Failed to find font weight" not in record.getMessage()


@contextmanager
def _missing_glyphs_quiet():
    """A context in which matplotlib's one-warning-per-character about letters missing from
    the font (a well or file named in a script the font lacks) is not printed: those
    letters are drawn as boxes, and the tables keep the names intact.  The notice of
    :class:`_NoWeightNotice` is dropped too."""
    quiet = _NoWeightNotice()
    log = logging.getLogger("matplotlib.font_manager")
    log.addFilter(quiet)
    try:
        with warnings.catch_warnings():
            warnings.filterwarnings("ignore", message=r"Glyph \d+ .*missing from font",
                                    category=UserWarning)
            yield
    finally:
        log.removeFilter(quiet)


def pdf_metadata() -> dict:
    """PDF document information without the time of the run, so that the same inputs give
    the same bytes; with ``SOURCE_DATE_EPOCH`` set (reproducible builds) matplotlib dates
    the file from it."""
    meta = {"Creator": "logprep", "Title": "fault-seal screening sheet"}
    if not os.environ.get("SOURCE_DATE_EPOCH"):
        meta["CreationDate"] = None
    return meta


def plain_text():
    """A context in which figures made draw all text as plain text: well names, mnemonics
    and paths from files (``A$\\foo$``) are never read as math markup.  Make every figure
    inside it (the setting is read when a text is created)."""
    return matplotlib.rc_context({"text.parse_math": False})


CORE_FONT_TEXT = frozenset(
    "".join(map(chr, range(32, 127))) + "\n\t"
    + "".join(chr(c) for c in range(0xA0, 0x100) if chr(c) not in "¤²³¹¼¾")
    + "–—‘’“”•…‰†‡‹›™ŠšŒœŽžŸ")
"""Characters every PDF viewer draws with its built-in Helvetica and Courier (the standard
14 fonts, WinAnsi encoding) and whose widths matplotlib knows from its bundled metrics."""

CORE_FONTS = {"pdf.use14corefonts": True, "font.sans-serif": ["Helvetica"],
              "font.monospace": ["Courier"], "font.serif": ["Times"], "axes.unicode_minus": False}
"""Settings under which a PDF is written with the viewer's built-in fonts (see
:func:`pdf_bytes`).  Courier's advance (0.600 em) is that of DejaVu Sans Mono (0.602 em)
to 0.3 %, so the fixed-width tables keep their columns; Helvetica is narrower than
DejaVu Sans, so text laid out for DejaVu never grows into its neighbour."""

EMBEDDED_FONTS = {"font.sans-serif": ["DejaVu Sans"], "font.monospace": ["DejaVu Sans Mono"]}
"""Settings for a PDF whose text needs more than :data:`CORE_FONT_TEXT`: matplotlib's
bundled DejaVu fonts, embedded."""


def core_fonts_suffice(figures) -> bool:
    """True when every text of ``figures``, tick labels included, is made of
    :data:`CORE_FONT_TEXT` with the settings of :data:`CORE_FONTS` (an ASCII minus)."""
    with matplotlib.rc_context(CORE_FONTS):
        return all(set(text) <= CORE_FONT_TEXT for fig in figures for text in _texts(fig))


def _texts(artist):
    """Every text string under ``artist``.  An axis gives its label and offset text only:
    asking it for its children would make its ticks, the costliest part of a draw, twice."""
    from matplotlib.axis import Axis
    from matplotlib.text import Text

    for child in artist.get_children():
        if isinstance(child, Axis):
            yield child.label.get_text()
            yield child.get_offset_text().get_text()
            for ticker in (child.major, child.minor):  # the labels, without making ticks
                yield from ticker.formatter.format_ticks(ticker.locator())
            continue
        if isinstance(child, Text):
            yield child.get_text()
        yield from _texts(child)


def pdf_bytes(figures) -> bytes:
    """``figures`` as the pages of one PDF.

    When all its text is Latin (:func:`core_fonts_suffice`), the text is set in the PDF
    viewer's built-in Helvetica and Courier and no font is embedded: about 2.3 times
    faster to write than embedded fonts, since matplotlib then emits each string whole
    instead of laying it out glyph by glyph.  Text in other scripts (a well named in
    Cyrillic, say) keeps the embedded DejaVu fonts, which cover it."""
    figures = list(figures)
    fonts = CORE_FONTS if core_fonts_suffice(figures) else EMBEDDED_FONTS
    buf = io.BytesIO()
    with _missing_glyphs_quiet(), matplotlib.rc_context(fonts), \
            PdfPages(buf, metadata=pdf_metadata()) as pdf:
        for fig in figures:
            FigureCanvasAgg(fig)
            pdf.savefig(fig)
    return buf.getvalue()


PNG_DPI = 110
"""Resolution of the PNG previews (dots per inch)."""

_PDFIUM = threading.Lock()  # PDFium is not thread-safe: one render at a time per process


def png_from_pdf(pdf: bytes, page_index: int = 0, dpi: int = PNG_DPI) -> bytes:
    """One page of a PDF (from :func:`pdf_bytes`) as a PNG preview in 256 colours (a palette
    image, about a third of the true-colour size; the PDF is the full-quality sheet).

    The page is rasterised by PDFium (pypdfium2) from the PDF itself, so the preview is the
    PDF page exactly and the figure is drawn once, not again by a second renderer: about a
    tenth of the time of drawing the page anew with Agg.  Quantised by fast octree (the
    sheet's colours are few and flat).  Deterministic: the same PDF gives the same bytes."""
    import pypdfium2 as pdfium
    from PIL import Image

    with _PDFIUM:
        doc = pdfium.PdfDocument(pdf)
        try:
            page = doc[page_index]
            bitmap = page.render(scale=dpi / 72.0)
            rgb = bitmap.to_pil().convert("RGB")
            bitmap.close()
            page.close()
        finally:
            doc.close()
    with rgb:
        small = rgb.quantize(256, method=Image.Quantize.FASTOCTREE)
    out = io.BytesIO()
    small.save(out, format="png", compress_level=6)
    return out.getvalue()


def png_bytes(figure, dpi: int = PNG_DPI) -> bytes:
    """One figure as a PNG preview (see :func:`png_from_pdf`)."""
    return png_from_pdf(pdf_bytes([figure]), 0, dpi)


def sheet_files(pages, stem: str = "sheet") -> dict[str, bytes]:
    """``{stem}.pdf`` (every page) and ``{stem}.png`` (the first page, rasterised from that
    PDF) as bytes."""
    pdf = pdf_bytes(pages)
    return {f"{stem}.pdf": pdf, f"{stem}.png": png_from_pdf(pdf, 0)}


_UNSAFE = re.compile(r"[^A-Za-z0-9._-]+")

RESERVED_NAMES = ("summary.csv", "pairs_summary.csv", "logprep-settings.toml", "overview.html",
                  "overview.pdf", "logprep-manifest.jsonl", "faults.csv", "faults")
"""Files a run writes at the top of its output folder: no well folder may take their name."""


def folder_name(source: str | Path, taken: set[str]) -> str:
    """A safe, unique folder name from a file stem: unsafe characters become ``_``,
    leading dots are dropped, and ``-2``, ``-3``... make it unique among ``taken``
    (compared case-insensitively).  The name is added to ``taken``."""
    base = _UNSAFE.sub("_", Path(source).stem).lstrip(".") or "well"
    name, k = base, 2
    while name.lower() in taken or name.lower() in RESERVED_NAMES:
        name, k = f"{base}-{k}", k + 1
    taken.add(name.lower())
    return name


def well_folder_name(source: str | Path, taken: set[str]) -> str:
    """:func:`folder_name` for a well: never ``pair_...``, the prefix of well-pair folders,
    so a file named like a pair cannot share a folder with one."""
    stem = Path(source).stem
    if _UNSAFE.sub("_", stem).lstrip(".").lower().startswith("pair_"):
        source = f"well_{stem}.las"
    return folder_name(source, taken)


def qc_with_warnings(result) -> pd.DataFrame:
    """``qc.csv``: the flagged runs, then one ``warning`` row per reader warning."""
    table = qc_table(result.depth_m, result.qc_flags)
    notes = getattr(result, "warnings", ())
    if not notes:
        return table
    extra = pd.DataFrame([{"flag": "warning", "meaning": w, "action": "see the meaning"}
                          for w in notes], columns=table.columns)
    return pd.concat([table.astype(object), extra.astype(object)], ignore_index=True)


def with_window_numbers(windows: pd.DataFrame) -> pd.DataFrame:
    """The windows with a ``window`` column (1, 2, ... in row order) right after the
    contract columns: the number each window carries on the sheet, in ``logprep tune``
    (``w<k>``) and in the notebook."""
    out = windows.reset_index(drop=True)
    out = out.drop(columns=["window"], errors="ignore")
    at = min(len(WINDOW_COLUMNS), len(out.columns))
    out.insert(at, "window", range(1, len(out) + 1))
    return out


def well_tables(result) -> dict[str, pd.DataFrame]:
    """The machine-readable tables of one well, by file name."""
    windows = with_window_numbers(result.windows)
    extra = [c for c in windows.columns if c not in WINDOW_COLUMNS]
    layers = result.layers.to_frame()
    inp = result.settings.input
    layers["tst_m"] = layer_tst_m(layers["top_m"], layers["base_m"], inp.bed_dip_deg,
                                  inp.bed_dip_azimuth_deg, getattr(result, "survey", None))
    if result.qc_flags:
        layers["qc_flagged_fraction"] = layer_fraction(
            result.depth_m, any_flag(result.qc_flags), result.layers.top_m, result.layers.base_m)
    return {
        "layers.csv": layers,
        "juxtapositions.csv": windows[WINDOW_COLUMNS + extra],
        "qc.csv": qc_with_warnings(result),
        "picks.csv": result.picks,
    }


def render_well(result, sheet_builder=None, *, field: bool = True,
                field_smear: bool = False) -> dict[str, bytes]:
    """Every output file of one well as bytes, rendered in memory first so that a failure
    while drawing leaves nothing half-written.  With no ``sheet_builder`` the sheet
    (``sheet.pdf``, ``sheet.png``) is left out: tables only, much faster.  ``field=False``
    leaves out ``sgr_field.npz``; ``field_smear`` adds the smear fields to it."""
    files = {name: csv_bytes(frame) for name, frame in well_tables(result).items()}
    if field and getattr(result, "grid", None) is not None:
        files["sgr_field.npz"] = result.grid.npz_bytes(smear=field_smear)
    if sheet_builder is not None:
        with plain_text():
            files.update(sheet_files(sheet_builder(result)))
    files["curves.las"] = las_bytes(result)
    files["notes.txt"] = notes_bytes(result.notes)
    return files


def notes_bytes(notes) -> bytes:
    """The notes of a well (the sheet's ``Notes:`` line), one a line, as ``notes.txt``:
    what was assumed, left out or converted.  The field overview lists them per well."""
    return "".join(f"{n}\n" for n in notes if n).encode("utf-8")


def write_well(files: dict[str, bytes], well_dir: Path) -> None:
    for name, data in files.items():
        write_bytes_atomic(Path(well_dir) / name, data)


def write_summary(rows: list[dict], out_dir: Path) -> Path:
    path = Path(out_dir) / "summary.csv"
    write_bytes_atomic(path, csv_bytes(pd.DataFrame(rows, columns=SUMMARY_COLUMNS)))
    return path
