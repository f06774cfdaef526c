"""The log data of a LAS file: lasio for the header, a C-speed parser for plain data.

lasio keeps the header semantics (sections, items, the standard's rules).  Its data
reader is written in Python and is the slow part of reading a large log, so the ``~A``
section of a plain file (LAS 1.2 or 2.0, ``WRAP. NO``, space or tab separated, numbers
only) is parsed by pandas' C engine instead.  Anything else goes to lasio's own reader:
wrapped files, LAS 3.0, other delimiters, comma decimal marks, text columns, comments,
``NaN`` words, run-together numbers (``12.5-999.25``, which the C parser refuses),
ragged rows.  The values are the
same as lasio's (the test suite checks this on every LAS file it has), with the header
NULL as NaN in every curve but the index, as lasio does.
"""

from __future__ import annotations

import io
import logging
import warnings
from dataclasses import dataclass

import lasio
import numpy as np

from logprep.errors import LasReadError
from logprep.io.lastext import LasSource
from logprep.io.safetext import show_path

logging.getLogger("lasio").setLevel(logging.ERROR)


@dataclass
class LasData:
    """A LAS file as parsed: ``las`` the lasio object (header sections; its curves carry
    no data on the fast path), ``columns`` every column in ~Curve order (floats, or
    lasio's arrays of text), ``mnemonics`` and ``units`` in the same order, ``engine``
    ``"fast"`` or ``"lasio"``."""

    las: lasio.LASFile
    columns: list[np.ndarray]
    mnemonics: list[str]
    units: list[str]
    engine: str


def plain_data_reason(source: LasSource) -> str | None:
    """Why the data section of ``source`` needs lasio's reader, or None when the fast
    parser may read it."""
    if not source.version.startswith(("1", "2")):
        return f"LAS version {source.version or 'not stated'}"
    if source.wrap:
        return "wrapped rows"
    if source.delimiter not in ("SPACE", "TAB", ""):
        return f"delimiter {source.delimiter}"
    if not source.has_rows():
        return "no data rows"
    # text, comments, comma decimals, run-together numbers (12.5-999.25) and double points
    # all fail the strict float parse below, which then hands the file to lasio
    return None


def parse_plain_ascii(data, n_columns: int) -> list[np.ndarray] | None:
    """``n_columns`` columns of floats from a plain data section (bytes, or a binary file
    positioned at its start), or None when a row has another number of values or a value
    is not a number (the caller then uses lasio)."""
    import pandas as pd  # pandas is imported when a file is read, not with the CLI

    if isinstance(data, (bytes, memoryview)):
        data = io.BytesIO(data)
    try:
        frame = pd.read_csv(data, sep=r"\s+", header=None, names=range(n_columns),
                            dtype=np.float64, engine="c", na_filter=False)
    except (ValueError, pd.errors.ParserError):
        return None
    columns = [np.array(frame[j].to_numpy(dtype=np.float64), copy=None) for j in range(n_columns)]
    del frame
    columns = [c if c.flags.writeable else c.copy() for c in columns]
    if any(np.isnan(c).any() for c in columns):
        return None  # a short row is padded with NaN; a plain section has no NaN words
    return columns


def _null_value(las) -> float | None:
    if "NULL" not in las.well:
        return None
    try:
        return float(las.well["NULL"].value)
    except (TypeError, ValueError):
        return None


def _read_lasio(text: str, where: str) -> lasio.LASFile:
    try:
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            return lasio.read(text)
    except Exception as exc:  # lasio raises many types for unreadable input
        raise LasReadError(f"{where}: {lasio_problem(exc)}") from exc


def lasio_problem(exc: Exception) -> str:
    """lasio's complaint as ``what is wrong; what to do``."""
    first = str(exc).strip().splitlines()
    reason = (first[-1] if first else type(exc).__name__)[:200]
    if "reshape" in reason:
        return (f"the ~A values do not fill whole rows of the curves in ~Curve ({reason}); "
                "make ~Curve list one line per data column, or set WRAP. YES if rows wrap")
    if "Line" in reason or "section" in reason.lower():
        return (f"a header line does not follow the LAS layout MNEM.UNIT VALUE : DESCRIPTION "
                f"({reason}); correct or delete that line")
    return f"not readable as LAS ({reason}); check the file is a LAS 1.2, 2.0 or 3.0 log export"


def read_las_data(source: LasSource, *, fast: bool = True) -> LasData:
    """Parse ``source`` (see the module docstring); ``fast=False`` always uses lasio."""
    where = show_path(source.path)
    reason = plain_data_reason(source) if fast else "fast parser off"
    if reason is None:
        if source.file_offset is not None:
            source.drop_data()  # parsed from the file in chunks; read again only for lasio
        las = _read_lasio(source.header + "~A\n", where)
        n = len(las.curves)
        values = _parse_source(source, n) if n else None
        if values is not None:
            null = _null_value(las)
            if null is not None:  # as lasio: the header NULL is NaN in every curve but the index
                for col in values[1:]:
                    col[col == null] = np.nan
            return _las_data(las, values, source, "fast")
    if source.file_offset is not None and not len(source.data):
        with open(source.path, "rb") as f:
            f.seek(source.file_offset)
            source.data = memoryview(f.read())
    text = source.header + (source.data_title or "~A") + "\n" + str(
        source.data, source.encoding, "replace")
    las = _read_lasio(text, where)
    columns = [np.asarray(c.data) for c in las.curves]
    return _las_data(las, columns, source, "lasio")


def _parse_source(source: LasSource, n: int) -> list[np.ndarray] | None:
    if source.file_offset is None:
        return parse_plain_ascii(source.data, n)
    with open(source.path, "rb") as f:  # pandas reads the file in chunks: no second copy
        f.seek(source.file_offset)
        return parse_plain_ascii(f, n)


def _las_data(las, columns, source: LasSource, engine: str) -> LasData:
    mnemonics = [source.renamed.get(c.mnemonic, c.mnemonic) for c in las.curves]
    units = [(c.unit or "").strip() for c in las.curves]
    return LasData(las=las, columns=columns, mnemonics=mnemonics, units=units, engine=engine)


def header_items(las, renamed: dict[str, str]) -> tuple[dict[str, str], dict[str, str]]:
    """``(values, units)`` of the ~Well and ~Parameter items by mnemonic (first wins)."""
    values: dict[str, str] = {}
    units: dict[str, str] = {}
    for section in ("Well", "Parameter"):
        for item in las.sections.get(section, []):
            name = renamed.get(item.mnemonic, item.mnemonic)
            values.setdefault(name, str(item.value).strip())
            units.setdefault(name, (item.unit or "").strip())
    return values, units
