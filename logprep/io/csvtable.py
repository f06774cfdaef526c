"""Small hand-made CSV tables (tops, surveys, well pairs) as spreadsheets save them.

Accepted without asking: UTF-8 with or without a byte-order mark, UTF-16 with one, and
Windows-1252 (Latin-1) text; a comma, semicolon or tab between fields, found from the
header line; with semicolons, a decimal comma in numbers (``1712,5``), as continental
European spreadsheets write them.
"""

from __future__ import annotations

import codecs
import io
from pathlib import Path

import pandas as pd

from logprep.errors import LogprepError

SEPARATORS = (",", ";", "\t")
"""Field separators tried, in order of preference when the header has several."""


def decode_text(raw: bytes) -> str:
    """Text of a file from its bytes: BOM-named encoding, else UTF-8, else Windows-1252
    (which maps every byte, so this never fails)."""
    if raw.startswith((codecs.BOM_UTF16_LE, codecs.BOM_UTF16_BE)):
        return raw.decode("utf-16")
    try:
        return raw.decode("utf-8-sig")
    except UnicodeDecodeError:
        return raw.decode("cp1252", errors="replace")


def header_separator(text: str, comment: str | None = None) -> str:
    """The separator used in the first line that is neither blank nor a comment: the
    one of :data:`SEPARATORS` it holds most of (comma when none)."""
    for line in text.splitlines():
        if line.strip() and not (comment and line.lstrip().startswith(comment)):
            counts = [line.count(s) for s in SEPARATORS]
            return SEPARATORS[counts.index(max(counts))] if max(counts) else ","
    return ","


def parse_number(text: str) -> float:
    """A number read as text, with a decimal point or a decimal comma; ValueError if none."""
    return float(str(text).strip().replace(",", "."))


def read_csv_table(path: str | Path, error: type[LogprepError], what: str, option: str = "",
                   **kwargs) -> pd.DataFrame:
    """Read a small CSV table (see the module notes) with :func:`pandas.read_csv`.

    ``what`` names the table in messages (``"tops CSV"``); any problem raises ``error``
    naming the file and, in its fix, ``option`` (the option that names the file).
    ``kwargs`` go to :func:`pandas.read_csv`.
    """
    path = Path(path)
    given = f" given to {option}" if option else ""
    try:
        raw = path.read_bytes()
    except FileNotFoundError:
        raise error(f"{path}: {what} not found; check the path{given}") from None
    except OSError as exc:
        raise error(f"{path}: cannot read the {what} ({exc.strerror or exc}); make it "
                    f"readable or copy it elsewhere and give that path{given}") from None
    text = decode_text(raw)
    if not text.strip():
        raise error(f"{path}: the {what} is empty; write a header line and one "
                    f"row per entry, or leave out{given or ' the file'}")
    sep = header_separator(text, kwargs.get("comment"))
    if sep == ";":
        kwargs.setdefault("decimal", ",")
    try:
        return pd.read_csv(io.StringIO(text), sep=sep, skipinitialspace=True, **kwargs)
    except (ValueError, pd.errors.ParserError) as exc:
        reason = str(exc).strip().splitlines()[0] if str(exc).strip() else type(exc).__name__
        raise error(f"{path}: not a readable {what} ({reason}); save it as a plain "
                    "text table with one header line and the same number of cells per row") from None
