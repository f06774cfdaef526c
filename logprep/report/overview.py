"""The field overview written after a batch: ``overview.html`` and ``overview.pdf``.

Everything is read back from the output folder a batch wrote (``summary.csv``,
``pairs_summary.csv``, each folder's ``layers.csv``, ``juxtapositions.csv`` and
``notes.txt``, and ``logprep-settings.toml``), so the overview can be remade at any time
from the folder alone (``logprep overview DIR``) and always shows what is on disk.
Well locations come from a locations file or the LAS headers (see
:mod:`logprep.io.locations`).

:func:`overview_rows` gathers one :class:`OverviewRow` per well and per pair;
:mod:`logprep.report.overview_html` and :mod:`logprep.report.overview_page` draw them and
:func:`logprep.report.overview_files.write_overview` writes both files.
"""

from __future__ import annotations

import math
import tomllib
from dataclasses import dataclass, field
from pathlib import Path

import pandas as pd

from logprep.fault.capacity import VERDICTS
from logprep.io.locations import Location, las_header_location, read_locations
from logprep.io.tops import well_key

WORST_ORDER = ("failed",) + VERDICTS + ("not judged", "no windows")
"""Worst-verdict classes of a row, worst first: a well that failed, then the window verdict
words (``leak``, ``uncertain``, ``seal``; see :data:`logprep.capacity.VERDICTS`), then
windows without verdicts (a folder written before verdicts existed), then a well with no
window between different sands."""

WORST_STYLE = {
    "failed": ("#000000", "x"),
    "leak": ("#D55E00", "^"),
    "uncertain": ("#E69F00", "D"),
    "seal": ("#0072B2", "o"),
    "not judged": ("#FFFFFF", "v"),
    "no windows": ("#999999", "s"),
}
"""Colour (Okabe & Ito 2008) and marker of each worst-verdict class on the map; the
markers differ too, so the map still reads in grey print."""

def pair_colour(worst: str) -> str:
    """Line colour of a pair on the map (a dark grey where the class colour is white)."""
    colour = WORST_STYLE[worst][0]
    return "#555555" if colour == "#FFFFFF" else colour


LINKED_FILES = (("sheet", "sheet.pdf"), ("png", "sheet.png"), ("windows", "juxtapositions.csv"),
                ("layers", "layers.csv"), ("notes", "notes.txt"))
"""Files of a well or pair folder that the overview links to, where they exist."""


@dataclass
class OverviewRow:
    """One well or pair of the overview (numbers are None where not known)."""

    kind: str                      # "well" or "pair"
    name: str
    status: str                    # "ok" or "error"
    message: str = ""
    folder: str = ""
    source: str = ""
    layers: int | None = None
    sands: int | None = None
    verdicts: dict = field(default_factory=dict)   # verdict word -> count of windows
    windows: int | None = None
    min_sgr_pct: float | None = None
    min_oil_column_m: float | None = None
    min_co2_column_m: float | None = None
    notes: list = field(default_factory=list)
    links: list = field(default_factory=list)      # (label, path relative to the out folder)
    location: Location | None = None               # wells only; see pair_ends for pairs
    members: tuple = ()            # for a pair: (footwall, hanging wall) names

    @property
    def worst(self) -> str:
        """The worst-verdict class of :data:`WORST_ORDER`."""
        if self.status != "ok":
            return "failed"
        for v in VERDICTS:
            if self.verdicts.get(v, 0):
                return v
        return "not judged" if self.windows and not self.verdicts else "no windows"


def _read_csv(path: Path) -> pd.DataFrame | None:
    try:
        return pd.read_csv(path, keep_default_na=True)
    except (OSError, ValueError, pd.errors.ParserError):
        return None


def _number(value) -> float | None:
    try:
        v = float(value)
    except (TypeError, ValueError):
        return None
    return v if math.isfinite(v) else None


def _min(frame: pd.DataFrame, column: str) -> float | None:
    if column not in frame or not len(frame):
        return None
    return _number(pd.to_numeric(frame[column], errors="coerce").min())


def _fill_from_folder(row: OverviewRow, out: Path) -> None:
    """Counts, extremes, notes and links from the files of the row's folder."""
    folder = out / row.folder
    row.links = [(label, f"{row.folder}/{name}") for label, name in LINKED_FILES
                 if (folder / name).is_file()]
    layers = _read_csv(folder / "layers.csv")
    if layers is not None and "lithology" in layers:
        row.layers = len(layers)
        row.sands = (int(layers["reservoir"].astype(str).str.lower().eq("true").sum())
                     if "reservoir" in layers else int((layers["lithology"] == "sand").sum()))
    windows = _read_csv(folder / "juxtapositions.csv")
    if windows is not None:
        if "self_juxtaposed" in windows:
            windows = windows[~windows["self_juxtaposed"].astype(str).str.lower().eq("true")]
        row.windows = len(windows)
        if "verdict" in windows:
            counts = windows["verdict"].astype(str).value_counts()
            row.verdicts = {v: int(counts.get(v, 0)) for v in VERDICTS}
        row.min_sgr_pct = _min(windows, "sgr_min_pct")
        row.min_oil_column_m = _min(windows, "column_oil_m")
        row.min_co2_column_m = _min(windows, "column_co2_m")
    notes = folder / "notes.txt"
    if notes.is_file():
        row.notes = [n for n in notes.read_text(encoding="utf-8", errors="replace").splitlines() if n]


def _text(value) -> str:
    return "" if value is None or (isinstance(value, float) and math.isnan(value)) else str(value)


def overview_rows(out_dir: str | Path, locations_file: str | Path | None = None) -> list[OverviewRow]:
    """One row per well of ``summary.csv`` and per pair of ``pairs_summary.csv`` in
    ``out_dir``, in file order, wells first.  Locations from ``locations_file`` (matched on
    the well name or the LAS file stem) win over those in the LAS headers."""
    out = Path(out_dir)
    given = {well_key(k): v for k, v in (read_locations(locations_file) if locations_file else {}).items()}
    rows: list[OverviewRow] = []
    summary = _read_csv(out / "summary.csv")
    for rec in ([] if summary is None else summary.to_dict("records")):
        source = _text(rec.get("source"))
        row = OverviewRow("well", _text(rec.get("well")) or Path(source).stem,
                          _text(rec.get("status")) or "error", _text(rec.get("message")),
                          _text(rec.get("folder")), source)
        if row.status == "ok" and row.folder:
            _fill_from_folder(row, out)
        stem = Path(source).stem
        row.location = given.get(well_key(row.name)) or given.get(well_key(stem))
        if row.location is None and source:
            row.location = las_header_location(source)
        rows.append(row)
    pairs = _read_csv(out / "pairs_summary.csv")
    for rec in ([] if pairs is None else pairs.to_dict("records")):
        fw, hw = _text(rec.get("footwall")), _text(rec.get("hangingwall"))
        row = OverviewRow("pair", f"{fw} / {hw}", _text(rec.get("status")) or "error",
                          _text(rec.get("message")), _text(rec.get("folder")), members=(fw, hw))
        if row.status == "ok" and row.folder:
            _fill_from_folder(row, out)
        rows.append(row)
    return rows


def pair_ends(rows: list[OverviewRow]) -> dict[str, tuple[Location, Location]]:
    """For each pair row name, the locations of its footwall and hanging-wall wells."""
    located = {}
    for r in rows:
        if r.kind == "well" and r.location is not None:
            located.setdefault(well_key(r.name), r.location)
            located.setdefault(well_key(Path(r.source).stem), r.location)
    ends = {}
    for r in rows:
        if r.kind == "pair":
            a, b = (located.get(well_key(m)) for m in r.members)
            if a is not None and b is not None:
                ends[r.name] = (a, b)
    return ends


def verdict_rule(out_dir: str | Path) -> str:
    """The verdict thresholds of the run, from its ``logprep-settings.toml``."""
    path = Path(out_dir) / "logprep-settings.toml"
    try:
        data = tomllib.loads(path.read_text(encoding="utf-8"))
    except (OSError, ValueError):
        return ""
    flat = {}
    for k, v in data.items():
        flat.update(v if isinstance(v, dict) else {k: v})
    leak, seal = flat.get("sgr_leak_pct"), flat.get("sgr_threshold_pct")
    if leak is None or seal is None:
        return ""
    return (f"window verdict from its lowest SGR: leak below {leak:g} %, uncertain from "
            f"{leak:g} % to below {seal:g} %, seal from {seal:g} %")
