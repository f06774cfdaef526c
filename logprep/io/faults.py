"""The faults file: one named fault per row, screened at its own throw.

CSV (read like the other hand-made tables, see :mod:`logprep.io.csvtable`: any common
encoding, comma, semicolon or tab, decimal comma with semicolons) or TOML with one
``[[fault]]`` table per fault.  Keys (CSV column names):

``name``          fault name (required, unique)
``footwall``      footwall well: WELL name or LAS file stem (required)
``hangingwall``   hanging-wall well; blank: the footwall well's column on both sides
``marker``        for two wells: a top in both wells' tops that ties them
``shift_m``       for two wells without a marker: hanging-wall depth minus footwall depth
                  of the same horizon (m)
``throw_m``       best estimate of the throw (m, vertical, > 0; required)
``throw_low_m``, ``throw_high_m``
                  range of the throw (m); both or neither
``throw_dist``    ``triangular`` (low, best, high; the default with a range), ``uniform``
                  (low to high), ``normal`` (mean best, low and high the P10 and P90),
                  ``fixed`` (the default without a range)
``fault_dip_deg`` fault dip (degrees from horizontal, 0-90; default 60)
``closure_m``     structural closure (m): caps the column heights; blank for none

Lines starting with ``#`` are comments.  Every error names the file, the row and the
column, and says what to give instead.
"""

from __future__ import annotations

import math
import tomllib
from dataclasses import dataclass
from pathlib import Path

from logprep.errors import LogprepError
from logprep.io.csvtable import read_csv_table

THROW_DISTRIBUTIONS = ("fixed", "triangular", "uniform", "normal")
"""How the throw of a fault is drawn (see :func:`logprep.fault.uncertainty.draw_throw_m`)."""

DEFAULT_FAULT_DIP_DEG = 60.0
"""Dip of a normal fault when none is given (Andersonian normal fault, common practice,
no source)."""

FAULT_KEYS = ("name", "footwall", "hangingwall", "marker", "shift_m", "throw_m", "throw_low_m",
              "throw_high_m", "throw_dist", "fault_dip_deg", "closure_m")
"""Every key a fault may have; ``name``, ``footwall`` and ``throw_m`` are required."""

REQUIRED_KEYS = ("name", "footwall", "throw_m")


class FaultsError(LogprepError, ValueError):
    """A faults file could not be read or holds a wrong value."""


@dataclass(frozen=True)
class FaultSpec:
    """One fault of a faults file (see the module notes for the meaning of each field).

    ``hangingwall`` is None for a fault inside one well's column; ``where`` names the row
    in messages (``"faults.csv: row 2"``).
    """

    name: str
    footwall: str
    throw_m: float
    hangingwall: str | None = None
    marker: str | None = None
    shift_m: float | None = None
    throw_low_m: float | None = None
    throw_high_m: float | None = None
    throw_dist: str = "fixed"
    fault_dip_deg: float = DEFAULT_FAULT_DIP_DEG
    closure_m: float | None = None
    where: str = ""

    @property
    def two_wells(self) -> bool:
        return self.hangingwall is not None

    @property
    def throw_range_m(self) -> tuple[float, float]:
        """Smallest and largest throw the distribution can give (the P10/P90 for ``normal``:
        its tails reach beyond them)."""
        if self.throw_low_m is None:
            return self.throw_m, self.throw_m
        return self.throw_low_m, self.throw_high_m


def _text(value) -> str:
    if value is None:
        return ""
    if isinstance(value, float) and math.isnan(value):
        return ""
    return str(value).strip()


def _number(value, where: str, key: str, what: str):
    """A finite float from a cell (blank: None); error naming the row and column."""
    if isinstance(value, bool):
        raise FaultsError(f"{where}, column {key}: {value!r} is not a number; give {what}")
    if isinstance(value, (int, float)):
        x = float(value)
    else:
        text = _text(value)
        if not text:
            return None
        try:
            x = float(text.replace(",", "."))
        except ValueError:
            raise FaultsError(f"{where}, column {key}: {text!r} is not a number; give {what}") from None
    if not math.isfinite(x):
        raise FaultsError(f"{where}, column {key}: {x} is not a finite number; give {what}")
    return x


def fault_from_row(row: dict, where: str) -> FaultSpec:
    """A :class:`FaultSpec` from one row (keys as in :data:`FAULT_KEYS`, values as text or
    numbers), every value checked; ``where`` prefixes messages (file and row)."""
    unknown = [k for k in row if k not in FAULT_KEYS]
    if unknown:
        raise FaultsError(f"{where}: unknown column {unknown[0]!r}; valid columns: {', '.join(FAULT_KEYS)}")
    for key in REQUIRED_KEYS:
        if not _text(row.get(key)):
            raise FaultsError(f"{where}, column {key}: missing; every fault needs {', '.join(REQUIRED_KEYS)}")
    name, footwall = _text(row["name"]), _text(row["footwall"])
    hangingwall = _text(row.get("hangingwall")) or None
    marker = _text(row.get("marker")) or None
    shift = _number(row.get("shift_m"), where, "shift_m", "metres (hanging-wall minus footwall depth)")
    throw = _number(row["throw_m"], where, "throw_m", "the best throw estimate in metres")
    low = _number(row.get("throw_low_m"), where, "throw_low_m", "metres")
    high = _number(row.get("throw_high_m"), where, "throw_high_m", "metres")
    dip = _number(row.get("fault_dip_deg"), where, "fault_dip_deg", "degrees from horizontal")
    closure = _number(row.get("closure_m"), where, "closure_m", "metres, or leave it blank")
    dist = _text(row.get("throw_dist")).lower() or ("fixed" if low is None and high is None else "triangular")
    if throw <= 0:
        raise FaultsError(f"{where}, column throw_m: {throw:g} m; give a positive throw (normal fault)")
    if (low is None) != (high is None):
        missing = "throw_high_m" if high is None else "throw_low_m"
        raise FaultsError(f"{where}, column {missing}: missing; give both throw_low_m and throw_high_m or neither")
    if low is not None and not 0 <= low <= throw <= high:
        raise FaultsError(f"{where}, columns throw_low_m/throw_high_m: need 0 <= low <= throw_m <= high "
                          f"(got {low:g}, {throw:g}, {high:g} m); put throw_m between the two")
    if dist not in THROW_DISTRIBUTIONS:
        raise FaultsError(f"{where}, column throw_dist: unknown {dist!r}; use one of {', '.join(THROW_DISTRIBUTIONS)}")
    if dist != "fixed" and low is None:
        raise FaultsError(f"{where}, column throw_dist: {dist} needs throw_low_m and "
                          "throw_high_m; give both, or write fixed")
    if dist == "normal" and not low < high:
        raise FaultsError(f"{where}, columns throw_low_m/throw_high_m: a normal throw needs "
                          "low < high; widen the range or write throw_dist fixed")
    if dip is None:
        dip = DEFAULT_FAULT_DIP_DEG
    if not 0 < dip <= 90:
        raise FaultsError(f"{where}, column fault_dip_deg: {dip:g}; give a dip above 0 and up to 90 degrees")
    if closure is not None and closure <= 0:
        raise FaultsError(f"{where}, column closure_m: {closure:g}; give a positive closure or leave it blank")
    if hangingwall is not None and hangingwall.lower() == footwall.lower():
        hangingwall = None
    if hangingwall is None and (marker or shift is not None):
        key = "marker" if marker else "shift_m"
        raise FaultsError(f"{where}, column {key}: a tie is only for two wells; name a hangingwall or leave {key} blank")
    if hangingwall is not None and not marker and shift is None:
        raise FaultsError(f"{where}, column marker: two wells need a tie; give a marker or a shift_m")
    return FaultSpec(name=name, footwall=footwall, hangingwall=hangingwall, marker=marker,
                     shift_m=None if marker else shift, throw_m=throw, throw_low_m=low,
                     throw_high_m=high, throw_dist=dist, fault_dip_deg=dip, closure_m=closure,
                     where=where)


def _rows_csv(path: Path) -> list[tuple[dict, str]]:
    df = read_csv_table(path, FaultsError, "faults file", "--faults", dtype=str, keep_default_na=False,
                        comment="#")
    df.columns = [str(c).strip().lower() for c in df.columns]
    df = df.loc[:, [c for c in df.columns if c and not c.startswith("unnamed:")]]
    return [(dict(zip(df.columns, values)), f"{path}: row {k}")
            for k, values in enumerate(df.itertuples(index=False, name=None), start=1)]


def _rows_toml(path: Path) -> list[tuple[dict, str]]:
    try:
        data = tomllib.loads(path.read_text(encoding="utf-8-sig"))
    except (OSError, UnicodeDecodeError) as exc:
        raise FaultsError(f"{path}: cannot read the faults file ({exc}); save it as UTF-8 "
                          "text and check the path given to --faults") from None
    except tomllib.TOMLDecodeError as exc:
        raise FaultsError(f"{path}: not valid TOML ({exc}); write one [[fault]] table per fault") from None
    extra = [k for k in data if k != "fault"]
    faults = data.get("fault")
    if extra or not isinstance(faults, list) or not all(isinstance(f, dict) for f in faults):
        raise FaultsError(f"{path}: expected only [[fault]] tables (found {', '.join(data) or 'nothing'}); "
                          "write one [[fault]] table per fault and nothing else")
    return [(f, f"{path}: [[fault]] {k}") for k, f in enumerate(faults, start=1)]


def read_faults(path: str | Path) -> list[FaultSpec]:
    """Read a faults file (``.toml``: ``[[fault]]`` tables; anything else: CSV)."""
    path = Path(path)
    if not path.is_file():
        raise FaultsError(f"{path}: faults file not found; give a CSV or TOML file with one fault per row")
    rows = _rows_toml(path) if path.suffix.lower() == ".toml" else _rows_csv(path)
    if not rows:
        raise FaultsError(f"{path}: no faults; add one row per fault with name, footwall, throw_m")
    faults, seen = [], {}
    for row, where in rows:
        spec = fault_from_row(row, where)
        key = spec.name.lower()
        if key in seen:
            raise FaultsError(f"{where}, column name: {spec.name!r} repeats {seen[key]}; give each fault its own name")
        seen[key] = where.rsplit(": ", 1)[-1]
        faults.append(spec)
    return faults
