"""The closures file: the structural closure of the trap at each well.

A CSV (read like the other hand-made tables, see :mod:`logprep.io.csvtable`) with a header
and one row per well:

``well``        WELL name or LAS file stem (matched as the tops are, see
                :func:`logprep.io.tops.well_key`)
``closure_m``   structural closure of the trap the well tests (m, crest to spill point, > 0);
                blank: no closure for that well (its columns are what the fault rock holds)

Lines starting with ``#`` are comments.  A closure is a property of a trap, so the natural
places for it are the well that tests the trap (this file), the well pair across the
bounding fault (``closure_m`` in the pairs file) and the named fault (``closure_m`` in the
faults file); which one a table used is said on its sheet.  Every error names the file and
the line and says what to give instead.
"""

from __future__ import annotations

import math
from functools import lru_cache
from pathlib import Path

from logprep.errors import LogprepError
from logprep.io.csvtable import parse_number, read_csv_table
from logprep.io.tops import well_key


class ClosuresError(LogprepError, ValueError):
    """A closures file could not be read or holds a wrong value."""


def parse_closure_m(text, where: str) -> float | None:
    """A closure (m) from a table cell: None when blank, else a number > 0; otherwise a
    :class:`ClosuresError` that starts with ``where`` (file and line)."""
    text = "" if text is None else str(text).strip()
    if not text or text.lower() == "nan":
        return None
    try:
        value = parse_number(text)
    except ValueError:
        raise ClosuresError(f"{where}: closure_m {text!r} is not a number; give metres "
                            "(crest to spill point) or leave it blank") from None
    if not (math.isfinite(value) and value > 0):
        raise ClosuresError(f"{where}: closure_m {text} must be a positive number of metres; "
                            "give the crest-to-spill-point height or leave it blank")
    return value


def read_closures(path: str | Path) -> dict[str, tuple[str, float | None]]:
    """The closures file as ``{well_key: (well name as written, closure_m or None)}``."""
    path = Path(path)
    df = read_csv_table(path, ClosuresError, "closures CSV", "--closures", dtype=str, keep_default_na=False,
                        comment="#")
    df.columns = [str(c).strip().lower() for c in df.columns]
    missing = [c for c in ("well", "closure_m") if c not in df.columns]
    if missing:
        raise ClosuresError(f"{path}: needs the columns well and closure_m (found "
                            f"{', '.join(df.columns) or 'none'}); add a header line 'well,closure_m'")
    out: dict[str, tuple[str, float | None]] = {}
    for k, (name, text) in enumerate(zip(df["well"], df["closure_m"]), start=2):
        name = str(name).strip()
        where = f"{path}: line {k}"
        if not name:
            raise ClosuresError(f"{where}: the well is not named; give its WELL name or LAS file stem")
        key = well_key(name)
        if key in out:
            raise ClosuresError(f"{where}: well {name!r} is listed twice; keep one closure per well")
        out[key] = (name, parse_closure_m(text, where))
    return out


def read_closures_cached(path: str | Path) -> dict[str, tuple[str, float | None]]:
    """:func:`read_closures`, read again only when the file's size or time stamp changes
    (every well of a batch asks for it)."""
    p = Path(path)
    try:
        st = p.stat()
    except OSError:
        return read_closures(p)  # raises the file's one-line error
    return _read_closures_at(str(p), st.st_mtime_ns, st.st_size)


@lru_cache(maxsize=8)
def _read_closures_at(path: str, mtime_ns: int, size: int):
    return read_closures(path)


def closure_for_well(closures: dict, *names: str) -> tuple[float | None, str] | None:
    """``(closure_m, name as written)`` of the first of ``names`` (WELL name, file stem)
    found in ``closures`` (:func:`read_closures`), or None when the file does not list it."""
    for n in names:
        if n and well_key(n) in closures:
            name, value = closures[well_key(n)]
            return value, name
    return None
