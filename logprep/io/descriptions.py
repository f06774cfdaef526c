"""Core and cuttings descriptions: depth intervals with a lithology, as a reference.

A description file is a CSV with columns ``top_m, base_m, lithology`` (and optionally
``well``, to hold several wells in one file; ``top_ft, base_ft`` for feet), one row per
described interval, as a geologist would type it from a core or a cuttings log.  The free
text lithology is put into one of the rock groups of
:data:`logprep.layers.rockscore.REFERENCE_GROUPS` by the keyword table :data:`KEYWORDS`
(first match wins; extend it there).  A lithology label curve in a LAS file (for example
the FORCE 2020 lithology codes) is read with :data:`LABEL_CODES`.

>>> group_of("Sst, f-m gr, calc cmt")
'sandstone'
>>> group_of("Claystone, dk gry")
'shale'
"""

from __future__ import annotations

import re
from pathlib import Path

import numpy as np
import pandas as pd

from logprep.io.csvtable import read_csv_table
from logprep.errors import LogprepError
from logprep.io.tops import well_key

KEYWORDS: list[tuple[str, str]] = [
    (r"sand(stone)?\s*/\s*shale|shaly\s+sand|interbed|heterolith|sand\w*\s+and\s+shale", "sandy shale"),
    (r"\bmarl", "marl"),
    (r"chalk", "chalk"),
    (r"dolo", "dolomite"),
    (r"lime|\blst\b|grainstone|packstone|wackestone", "limestone"),
    (r"coal|lignite", "coal"),
    (r"anhydrite|\banhy", "anhydrite"),
    (r"halite|\bsalt\b", "halite"),
    (r"tuff|volcan|\bash\b", "tuff"),
    (r"basement|granite|gneiss", "basement"),
    (r"sand|\bsst\b|\bss\b", "sandstone"),
    (r"shale|clay|\bsh\b|\bclst\b|mudstone", "shale"),
]
"""Regular expression (case ignored) -> rock group, tried in order.  A carbonate mudstone
should be written as limestone; plain "mudstone" is read as shale."""

LABEL_CODES: dict[int, str] = {
    30000: "sandstone", 65030: "sandy shale", 65000: "shale", 80000: "marl",
    74000: "dolomite", 70000: "limestone", 70032: "chalk", 88000: "halite",
    86000: "anhydrite", 99000: "tuff", 90000: "coal", 93000: "basement",
}
"""Lithology codes of the FORCE 2020 label curve ``FORCE_2020_LITHOFACIES_LITHOLOGY``
(Bormann et al. 2020, FORCE Machine Learning Competition, doi:10.5281/zenodo.4351156)."""

DESCRIPTION_COLUMNS = ["well", "top_m", "base_m", "lithology", "group"]


class DescriptionError(LogprepError, ValueError):
    """A description file could not be read."""


def group_of(text) -> str:
    """The rock group of a free-text lithology (``other`` when no keyword matches)."""
    s = str(text).strip().lower()
    for pattern, group in KEYWORDS:
        if re.search(pattern, s):
            return group
    return "other"


def read_descriptions(path: str | Path) -> pd.DataFrame:
    """Read a description CSV into :data:`DESCRIPTION_COLUMNS` (``well`` blank when the
    file has no well column), sorted by well and top."""
    path = Path(path)
    df = read_csv_table(path, DescriptionError, "description CSV", "--rock")
    df.columns = [str(c).strip().lower() for c in df.columns]
    factor = 1.0
    if "top_m" not in df.columns and {"top_ft", "base_ft"} <= set(df.columns):
        df = df.rename(columns={"top_ft": "top_m", "base_ft": "base_m"})
        factor = 0.3048
    missing = [c for c in ("top_m", "base_m", "lithology") if c not in df.columns]
    if missing:
        raise DescriptionError(f"{path}: missing column(s) {', '.join(missing)}; a description "
                               "CSV needs top_m, base_m, lithology (and optionally well)")
    for c in ("top_m", "base_m"):
        df[c] = pd.to_numeric(df[c], errors="coerce") * factor
        if df[c].isna().any():
            line = int(df.index[df[c].isna()][0]) + 2
            raise DescriptionError(f"{path}: line {line}: {c} is not a number; write "
                                   "depths as plain numbers in the depth unit of the file")
    bad = df.index[df["base_m"] <= df["top_m"]]
    if len(bad):
        raise DescriptionError(f"{path}: line {int(bad[0]) + 2}: base_m must be below top_m; "
                               "swap the two depths or fix the row")
    df["well"] = df["well"].astype(str).str.strip() if "well" in df.columns else ""
    df["lithology"] = df["lithology"].astype(str).str.strip()
    df["group"] = df["lithology"].map(group_of)
    return df[DESCRIPTION_COLUMNS].sort_values(["well", "top_m"], kind="stable").reset_index(drop=True)


def descriptions_for_well(desc: pd.DataFrame, *names: str) -> pd.DataFrame:
    """The intervals of one well (matched like tops); every row when the file has no
    well column."""
    if (desc["well"] == "").all():
        return desc
    keys = {well_key(n) for n in names if n}
    return desc[desc["well"].map(well_key).isin(keys)].reset_index(drop=True)


def labels_at(depth_m, desc: pd.DataFrame) -> np.ndarray:
    """The rock group at each depth (``""`` outside every interval; where intervals
    overlap the later row wins)."""
    z = np.asarray(depth_m, dtype=float)
    out = np.full(z.size, "", dtype=object)
    for top, base, group in zip(desc["top_m"], desc["base_m"], desc["group"]):
        out[(z >= top) & (z < base)] = group
    return out


def labels_from_codes(codes) -> np.ndarray:
    """Rock groups from a numeric label curve (:data:`LABEL_CODES`; unknown codes
    ``other``, NaN ``""``)."""
    c = np.asarray(codes, dtype=float)
    out = np.full(c.size, "", dtype=object)
    ok = np.isfinite(c)
    out[ok] = [LABEL_CODES.get(int(v), "other") for v in c[ok]]
    return out
