"""Well locations for the field overview map: from LAS header items or a locations file.

LAS headers carry a location in many ways; read here, in this order:

* ``LATI``/``LAT``/``LATITUDE`` with ``LONG``/``LON``/``LONGITUDE``: decimal degrees or
  degrees-minutes-seconds text with a hemisphere letter (``43 35' 47.74" N``);
* ``XCOORD``/``X``/``EASTING`` with ``YCOORD``/``Y``/``NORTHING``: grid coordinates;
* ``LOC``/``LOCATION`` text holding ``X = 606554 Y = 6080126`` or ``X 431250 Y 226870``.

A locations file is a CSV (as spreadsheets save it, see :mod:`logprep.csvtable`) with a
``well`` column and either ``x, y`` (or ``easting, northing``) or ``latitude, longitude``
(or ``lat, lon``); it wins over the headers.  Nothing here is used by the screening
science: a well without a location is screened the same and left off the map.
"""

from __future__ import annotations

import math
import re
from collections.abc import Mapping
from dataclasses import dataclass
from pathlib import Path

from logprep.io.csvtable import parse_number, read_csv_table
from logprep.errors import LogprepError

GEOGRAPHIC, GRID = "degrees", "grid"
LAT_KEYS = ("LATI", "LAT", "LATITUDE")
LON_KEYS = ("LONG", "LON", "LONGITUDE")
X_KEYS = ("XCOORD", "X", "EASTING", "XWELL")
Y_KEYS = ("YCOORD", "Y", "NORTHING", "YWELL")
_NUMBER = r"[-+]?\d+(?:[.,]\d+)?"


class LocationsError(LogprepError, ValueError):
    """A locations file could not be read."""


@dataclass(frozen=True)
class Location:
    """Where a well is: ``x`` easting or longitude, ``y`` northing or latitude.

    ``kind`` is :data:`GEOGRAPHIC` (decimal degrees, east and north positive) or
    :data:`GRID` (grid units as given, usually metres); ``source`` says where it came from.
    """

    x: float
    y: float
    kind: str
    source: str


def parse_angle_deg(text: str) -> float:
    """Decimal degrees from ``"43.5966"``, ``"-60.69"``, ``"43 35' 47.74\\" N"``,
    ``"60°41'22.69\\"W"`` or ``"N 43 35 47.74"`` (S and W negative).

    Raises ValueError when the text holds no angle or minutes/seconds are not below 60.
    """
    s = str(text).strip().upper()
    nums = [float(v.replace(",", ".")) for v in re.findall(r"\d+(?:[.,]\d+)?", s)]
    if not nums or len(nums) > 3:
        raise ValueError(f"not an angle: {text!r}")
    if any(v >= 60 for v in nums[1:]):
        raise ValueError(f"minutes and seconds must be below 60: {text!r}")
    value = sum(v / 60 ** k for k, v in enumerate(nums))
    hemi = re.findall(r"(?<![A-Z])[NSEW](?![A-Z])", s)
    negative = s.lstrip().startswith("-") or (hemi and hemi[-1] in "SW")
    return -value if negative else value


def _item(header: Mapping[str, str], keys) -> str | None:
    upper = {str(k).strip().upper(): v for k, v in header.items()}
    for k in keys:
        v = upper.get(k)
        if v is not None and str(v).strip():
            return str(v).strip()
    return None


def _number(text: str | None) -> float | None:
    if text is None:
        return None
    m = re.fullmatch(rf"\s*({_NUMBER})\s*[A-Za-z]*\s*", text)
    if not m:
        return None
    value = parse_number(m.group(1))
    return value if math.isfinite(value) else None


def header_location(header: Mapping[str, str]) -> Location | None:
    """The location in a LAS ``~Well`` header (mnemonic -> value text), or None.

    See the module notes for the items read.  Values out of range (latitude beyond 90,
    longitude beyond 180) or all zero (a common placeholder) are not taken.
    """
    lat, lon = _item(header, LAT_KEYS), _item(header, LON_KEYS)
    if lat and lon:
        try:
            la, lo = parse_angle_deg(lat), parse_angle_deg(lon)
        except ValueError:
            la = lo = None
        if la is not None and abs(la) <= 90 and abs(lo) <= 180 and (la, lo) != (0, 0):
            return Location(lo, la, GEOGRAPHIC, "LAS header latitude/longitude")
    x, y = _number(_item(header, X_KEYS)), _number(_item(header, Y_KEYS))
    if x is not None and y is not None and (x, y) != (0, 0):
        return Location(x, y, GRID, "LAS header X/Y")
    loc = _item(header, ("LOC", "LOCATION"))
    if loc:
        mx = re.search(rf"(?<![A-Za-z])X\s*[=:]?\s*({_NUMBER})", loc, flags=re.IGNORECASE)
        my = re.search(rf"(?<![A-Za-z])Y\s*[=:]?\s*({_NUMBER})", loc, flags=re.IGNORECASE)
        if mx and my:
            x, y = parse_number(mx.group(1)), parse_number(my.group(1))
            if (x, y) != (0, 0):
                return Location(x, y, GRID, "LAS header LOC")
    return None


def las_header_location(path: str | Path) -> Location | None:
    """The location in a LAS file's header (read without its data), or None when the
    file cannot be read or names no location."""
    from logprep.io.las import read_well_header

    return header_location(read_well_header(path))


def read_locations(path: str | Path) -> dict[str, Location]:
    """A locations file as ``{well name: Location}`` (see the module notes)."""
    path = Path(path)
    df = read_csv_table(path, LocationsError, "locations CSV", "--locations", dtype=str, keep_default_na=False)
    cols = {str(c).strip().lower(): c for c in df.columns}
    pairs = [("x", "y", GRID), ("easting", "northing", GRID),
             ("longitude", "latitude", GEOGRAPHIC), ("lon", "lat", GEOGRAPHIC)]
    found = next(((a, b, kind) for a, b, kind in pairs if a in cols and b in cols), None)
    if "well" not in cols or found is None:
        raise LocationsError(f"{path}: needs columns well and x, y (or latitude, longitude); "
                             f"found {', '.join(map(str, df.columns))}; name the columns so in the header line")
    xcol, ycol, kind = found
    out: dict[str, Location] = {}
    for k, row in enumerate(df.itertuples(index=False), start=2):
        rec = dict(zip(df.columns, row))
        name = str(rec[cols["well"]]).strip()
        if not name:
            continue
        try:
            if kind == GEOGRAPHIC:
                x, y = parse_angle_deg(rec[cols[xcol]]), parse_angle_deg(rec[cols[ycol]])
                if not (abs(y) <= 90 and abs(x) <= 180):
                    raise ValueError
            else:
                x, y = parse_number(rec[cols[xcol]]), parse_number(rec[cols[ycol]])
        except ValueError:
            raise LocationsError(f"{path}: line {k}: {xcol}/{ycol} of {name!r} are not "
                                 "coordinates; write numbers (or degrees within +-90/+-180)") from None
        out[name] = Location(x, y, kind, f"locations file {path.name}")
    return out


def map_xy(locations: list[Location]) -> tuple[list[tuple[float, float] | None], str, str]:
    """Plot positions of ``locations`` on one flat map, the kind drawn, and a note.

    The kind most locations share is drawn; the others are left off (None) with a note.
    Degrees are drawn equirectangular about the mean latitude (x = longitude x cos
    latitude), a fair picture over one field.
    """
    kinds = [loc.kind for loc in locations]
    if not kinds:
        return [], "", ""
    kind = max((GRID, GEOGRAPHIC), key=kinds.count)
    left = sum(k != kind for k in kinds)
    note = (f"{left} well(s) located in {GEOGRAPHIC if kind == GRID else 'grid units'} are "
            "not drawn beside the others" if left else "")
    same = [loc for loc in locations if loc.kind == kind]
    scale = math.cos(math.radians(sum(loc.y for loc in same) / len(same))) if kind == GEOGRAPHIC else 1.0
    xy = [(loc.x * scale, loc.y) if loc.kind == kind else None for loc in locations]
    return xy, kind, note
