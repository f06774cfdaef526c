"""Formation tops: read tables of named depths and match them to wells.

Two layouts are read:

* a CSV with columns ``well, top_m, name`` (any order, header required; extra columns
  kept), one row per pick;
* a per-well markers file, ``<well>_markers.txt`` or any ``.txt``: ``depth<TAB>name`` lines
  with no header (the well name is the file stem before ``_markers``).

Tops are returned as a :class:`pandas.DataFrame` with columns ``well, top_m, name``,
sorted by well and depth (input order is not trusted).  Depths are metres as in the logs.
"""

from __future__ import annotations

import re
from pathlib import Path

import pandas as pd

from logprep.io.csvtable import decode_text, read_csv_table
from logprep.errors import LogprepError
from logprep.model import WellLog

TOPS_COLUMNS = ["well", "top_m", "name"]


class TopsError(LogprepError, ValueError):
    """A tops file could not be read."""


def _markers_file(path: Path) -> pd.DataFrame:
    rows = []
    well = re.sub(r"_markers$", "", path.stem, flags=re.IGNORECASE)
    for k, line in enumerate(decode_text(path.read_bytes()).splitlines(), start=1):
        line = line.strip()
        if not line or line.startswith("#"):
            continue
        parts = re.split(r"\t+|\s{2,}", line, maxsplit=1)
        if len(parts) != 2:
            parts = line.split(None, 1)
        try:
            depth = float(parts[0])
        except (ValueError, IndexError):
            raise TopsError(f"{path}: line {k}: expected 'depth<TAB>name', got {line!r}; "
                            "write one depth and one name per line") from None
        rows.append((well, depth, parts[1].strip() if len(parts) > 1 else ""))
    return pd.DataFrame(rows, columns=TOPS_COLUMNS)


def read_tops(path: str | Path) -> pd.DataFrame:
    """Read a tops CSV, a markers file, or a folder of markers files."""
    path = Path(path)
    if path.is_dir():
        files = sorted(p for p in path.iterdir() if p.suffix.lower() in {".txt", ".csv"})
        if not files:
            raise TopsError(f"{path}: no tops files (.csv or .txt) in the folder; put the "
                            "tops files there or give --tops one file")
        frames = [read_tops(p) for p in files]
        return _tidy(pd.concat(frames, ignore_index=True))
    if not path.is_file():
        raise TopsError(f"{path}: tops file not found; check the path given to --tops")
    if path.suffix.lower() == ".csv":
        df = read_csv_table(path, TopsError, "tops CSV", "--tops")
        df.columns = [str(c).strip().lower() for c in df.columns]
        missing = [c for c in TOPS_COLUMNS if c not in df.columns]
        if missing:
            raise TopsError(
                f"{path}: missing column(s) {', '.join(missing)}; a tops CSV needs "
                f"{', '.join(TOPS_COLUMNS)}"
            )
        df["top_m"] = pd.to_numeric(df["top_m"], errors="coerce")
        if df["top_m"].isna().any():
            bad = int(df.index[df["top_m"].isna()][0]) + 2
            raise TopsError(f"{path}: line {bad}: top_m is not a number; write the top "
                            "depth in metres as a plain number")
        df["well"] = df["well"].astype(str).str.strip()
        df["name"] = df["name"].astype(str).str.strip()
        return _tidy(df)
    return _tidy(_markers_file(path))


def _tidy(df: pd.DataFrame) -> pd.DataFrame:
    return df.sort_values(["well", "top_m"], kind="stable").reset_index(drop=True)


def well_key(name: str) -> str:
    """Normalised well name for matching: case, spaces, ``-``, ``_``, ``/`` ignored."""
    return re.sub(r"[\s_\-/]+", "", str(name)).upper()


def tops_for_well(tops: pd.DataFrame, *names: str) -> pd.DataFrame:
    """The tops of one well, matched on any of ``names`` (e.g. the LAS WELL item and the
    file stem) by :func:`well_key`.  Empty when none match."""
    keys = {well_key(n) for n in names if n}
    mask = tops["well"].map(well_key).isin(keys)
    return tops[mask].reset_index(drop=True)


def well_tops(well: WellLog, tops_file: str | None, tops: pd.DataFrame | None = None) -> pd.DataFrame:
    """The tops of ``well`` from ``tops`` (all wells) or from ``tops_file``;
    matched on the WELL name or the file stem.  Empty when there are none."""
    if tops is None:
        if not tops_file:
            return pd.DataFrame(columns=TOPS_COLUMNS)
        tops = read_tops(tops_file)
    return tops_for_well(tops, well.name, Path(well.source).stem)
