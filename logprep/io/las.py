"""Read LAS files into :class:`~logprep.model.WellLog` (the only module that talks to lasio).

Units are fixed here, once: a depth index in feet becomes metres.  Missing values are the
header ``NULL`` plus the common sentinels in :data:`NULL_SENTINELS`.  The gamma-ray curve is
found by the mnemonic registry :data:`GR_ALIASES` (first match wins), by a name the caller
gives, or, failing both, by a curve whose unit is API.
"""

from __future__ import annotations

import hashlib
import warnings
from pathlib import Path

import logging

import lasio
import numpy as np

from logprep.errors import CurveNotFoundError, LasReadError
from logprep.model import WellLog

FT_TO_M = 0.3048  # exact, by definition of the international foot

GR_ALIASES: list[str] = [
    "GR", "GRC", "GR_EDTC", "ECGR", "SGR", "HSGR", "CGR", "HGR", "GRD", "GRS", "GRN",
    "GAM", "GAMMA", "GR_CAL", "GRCFM", "MGR",
]
"""Gamma-ray mnemonics, in order of preference (total GR before spectral sums, computed
GR last).  Extend with :func:`register_gr_alias`."""

CURVE_ALIASES: dict[str, list[str]] = {
    "gr": GR_ALIASES,
    "nphi": ["NPHI", "TNPH", "NPOR", "NPHI_SS", "CNC", "CNCF", "PHIN", "NEUT", "TNPHI", "NPSS"],
    "rhob": ["RHOB", "RHOZ", "DEN", "ZDEN", "DENS", "RHOB_CORR", "HDEN", "RHO8"],
    "cali": ["CALI", "CAL", "CALX", "CALS", "HCAL", "C1", "CALY", "CALIPER"],
    "bs": ["BS", "BIT", "BITSIZE", "BIT_SIZE"],
    "drho": ["DRHO", "DCOR", "ZCOR", "HDRA", "DRH"],
    "pef": ["PEF", "PEFZ", "PE", "PEF8", "PDPE", "PEFL"],
    "dt": ["DTC", "DT", "DTCO", "AC", "DT4P", "DTP"],
}
"""Mnemonics by curve kind (gamma ray, neutron porosity, bulk density, caliper, bit size,
density correction), in order of preference; first match wins.  Add a kind or a mnemonic
here."""

_KIND_NAMES = {"gr": "gamma-ray", "nphi": "neutron-porosity", "rhob": "bulk-density",
               "cali": "caliper", "bs": "bit-size",
               "drho": "density-correction", "pef": "photoelectric-factor",
               "dt": "compressional-sonic"}

DEPTH_UNITS_M: dict[str, float] = {
    "M": 1.0, "METER": 1.0, "METERS": 1.0, "METRE": 1.0, "METRES": 1.0,
    "FT": FT_TO_M, "F": FT_TO_M, "FEET": FT_TO_M, "FOOT": FT_TO_M,
}
"""Depth-index units understood, with their factor to metres."""

NULL_SENTINELS = (-999.25, -9999.0, -9999.25)
"""Values treated as missing in every curve, besides the header NULL."""

logging.getLogger("lasio").setLevel(logging.ERROR)

_TIME_UNITS = {"S", "MS", "SEC", "MIN", "H", "HR", "US"}
_API_UNITS = {"API", "GAPI", "API-GR", "GAPI_UNITS"}


def register_gr_alias(mnemonic: str, *, first: bool = False) -> None:
    """Add a gamma-ray mnemonic to the search list (at the end, or first)."""
    name = mnemonic.strip().upper()
    if name in GR_ALIASES:
        GR_ALIASES.remove(name)
    GR_ALIASES.insert(0, name) if first else GR_ALIASES.append(name)


def _sha256(path: Path) -> str:
    h = hashlib.sha256()
    with path.open("rb") as f:
        for chunk in iter(lambda: f.read(1 << 20), b""):
            h.update(chunk)
    return h.hexdigest()


def _bom_encoding(path: Path) -> str | None:
    """Encoding named by a byte-order mark, else None (lasio's own default)."""
    with path.open("rb") as f:
        head = f.read(4)
    if head.startswith((b"\xff\xfe", b"\xfe\xff")):
        return "utf-16"
    if head.startswith(b"\xef\xbb\xbf"):
        return "utf-8-sig"
    return None


def _numeric(values) -> np.ndarray:
    """A curve as floats; text that is not a number becomes NaN."""
    arr = np.asarray(values)
    if arr.dtype.kind in "fiu":
        return arr.astype(float)
    out = np.full(arr.shape, np.nan)
    for i, v in enumerate(arr):
        try:
            out[i] = float(str(v).replace(",", "."))
        except ValueError:
            pass
    return out


def _base_mnemonic(mnemonic: str) -> str:
    """``GR:1`` (lasio's name for a repeated mnemonic) -> ``GR``."""
    return mnemonic.split(":")[0].strip().upper()


def find_curve(
    mnemonics: list[str],
    units: dict[str, str],
    kind: str = "gr",
    wanted: str | None = None,
    *,
    required: bool = True,
) -> str | None:
    """Choose the curve of ``kind`` (a key of :data:`CURVE_ALIASES`) from ``mnemonics``.

    ``wanted`` (case-insensitive) must exist when given.  Otherwise the first alias of the
    kind present wins; for gamma ray, failing that, the first curve with an API unit.
    Raises :class:`CurveNotFoundError` naming the curves found, or returns None when
    ``required`` is False.
    """
    by_upper = {}
    for m in mnemonics:
        by_upper.setdefault(m.upper(), m)
        by_upper.setdefault(_base_mnemonic(m), m)
    if wanted:
        key = wanted.strip().upper()
        if key in by_upper:
            return by_upper[key]
        raise CurveNotFoundError(
            f"no curve named {wanted!r} (found {', '.join(mnemonics) or 'none'})"
        )
    for alias in CURVE_ALIASES[kind]:
        if alias in by_upper:
            return by_upper[alias]
    if kind == "gr":
        for m in mnemonics:
            if units.get(m, "").strip().upper() in _API_UNITS:
                return m
    if not required:
        return None
    hint = "; name one with --gr-curve" if kind == "gr" else ""
    raise CurveNotFoundError(
        f"no {_KIND_NAMES.get(kind, kind)} curve (found {', '.join(mnemonics) or 'no curves'}){hint}"
    )


def find_gr_curve(mnemonics: list[str], units: dict[str, str], wanted: str | None = None) -> str:
    """Choose the gamma-ray mnemonic (see :func:`find_curve`)."""
    return find_curve(mnemonics, units, "gr", wanted)


def well_curve(well: WellLog, kind: str) -> tuple[np.ndarray, str] | None:
    """``(values, unit as read)`` of the well's curve of ``kind``, or None when absent or
    without a single valid sample."""
    name = find_curve(list(well.curves), dict(well.units), kind, required=False)
    if name is None or not np.any(np.isfinite(well.curves[name])):
        return None
    return well.curves[name], well.units.get(name, "")


def read_well_name(path: str | Path) -> str:
    """The ``WELL`` header item of a LAS file, reading the header only (several times
    quicker than :func:`read_well` on a large file); ``""`` when the file cannot be read
    as LAS or has no WELL item."""
    path = Path(path)
    try:
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            las = lasio.read(str(path), ignore_data=True, encoding=_bom_encoding(path))
    except Exception:  # lasio raises many types for unreadable input; the caller only matches names
        return ""
    return str(las.well["WELL"].value).strip() if "WELL" in las.well else ""


def read_well_header(path: str | Path) -> dict[str, str]:
    """The ``~Well`` items of a LAS file (mnemonic -> value as text), reading the header
    only; empty when the file cannot be read as LAS."""
    path = Path(path)
    try:
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            las = lasio.read(str(path), ignore_data=True, encoding=_bom_encoding(path))
    except Exception:  # noqa: BLE001 - lasio raises many types for unreadable input
        return {}
    return {item.mnemonic: str(item.value) for item in las.well}


def read_well(
    path: str | Path,
    *,
    gr_curve: str | None = None,
    depth_unit: str | None = None,
) -> WellLog:
    """Read one LAS file.

    Parameters
    ----------
    path : str or Path
        The LAS file (versions 1.2 and 2.0; 3.0 where lasio reads it).
    gr_curve : str, optional
        Gamma-ray mnemonic to use instead of the alias search.
    depth_unit : str, optional
        Unit of the depth index (``m`` or ``ft``) when the file does not state one, or to
        override a wrong one.

    Returns
    -------
    WellLog
        Depth in metres, increasing; all curves with missing values as NaN.

    Raises
    ------
    LasReadError
        The file is missing, empty, not LAS, has no data, no depth index, a time index,
        or a depth that repeats or goes back and forth.
    CurveNotFoundError
        No gamma-ray curve could be found (or ``gr_curve`` is absent).
    """
    path = Path(path)
    if not path.is_file():
        raise LasReadError(f"{path}: file not found")
    if path.stat().st_size == 0:
        raise LasReadError(f"{path}: file is empty")
    try:
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            las = lasio.read(str(path), encoding=_bom_encoding(path))
    except Exception as exc:  # lasio raises many types for unreadable input
        reason = str(exc).strip().splitlines()[0] if str(exc).strip() else type(exc).__name__
        raise LasReadError(f"{path}: not a readable LAS file ({reason})") from exc
    try:
        return _to_well_log(path, las, gr_curve=gr_curve, depth_unit=depth_unit)
    except CurveNotFoundError as exc:
        raise CurveNotFoundError(f"{path}: {exc}") from None
    except LasReadError as exc:
        raise LasReadError(f"{path}: {exc}") from None


def _to_well_log(path: Path, las, *, gr_curve, depth_unit) -> WellLog:
    if not las.curves or las.data is None or np.size(las.data) == 0:
        raise LasReadError("no ~A data section (or no curves)")
    columns = [_numeric(c.data) for c in las.curves]
    numeric = [0] + [
        j for j in range(1, len(columns))
        if np.asarray(las.curves[j].data).dtype.kind in "fiu" or np.any(np.isfinite(columns[j]))
    ]
    data = np.column_stack([columns[j] for j in numeric])
    if data.shape[0] == 0:
        raise LasReadError("no data rows")
    index_item = las.curves[0]
    mnemonics = [las.curves[j].mnemonic for j in numeric]
    units = {c.mnemonic: (c.unit or "").strip() for c in las.curves}

    unit_read = (depth_unit or index_item.unit or "").strip()
    unit_key = unit_read.upper()
    if unit_key in _TIME_UNITS or index_item.mnemonic.upper() in {"TIME", "ETIM"}:
        raise LasReadError(
            f"index {index_item.mnemonic} [{index_item.unit}] is time, not depth; "
            "logprep needs a depth-indexed log"
        )
    if unit_key not in DEPTH_UNITS_M:
        hint = "pass --depth-unit m or ft" if not unit_key else "pass --depth-unit m or ft to override"
        raise LasReadError(
            f"depth index {index_item.mnemonic} has unit {unit_read!r}, not metres or feet; {hint}"
        )

    null = las.well["NULL"].value if "NULL" in las.well else None
    sentinels = list(NULL_SENTINELS)
    try:
        if null is not None and str(null).strip() != "":
            sentinels.append(float(null))
    except (TypeError, ValueError):
        pass
    for s in sentinels:
        data[np.isclose(data, s, rtol=0, atol=1e-6)] = np.nan

    depth = data[:, 0] * DEPTH_UNITS_M[unit_key]
    keep = np.isfinite(depth)
    data, depth = data[keep], depth[keep]
    if depth.size < 2:
        raise LasReadError("fewer than two depth samples")
    step = np.diff(depth)
    if np.all(step < 0):
        data, depth = data[::-1], depth[::-1]
        step = np.diff(depth)
    if np.any(step == 0):
        i = int(np.flatnonzero(step == 0)[0])
        raise LasReadError(
            f"duplicate depth {data[i, 0]:g} {unit_read} in {index_item.mnemonic}; "
            "remove the repeated rows"
        )
    if np.any(step < 0):
        i = int(np.flatnonzero(step < 0)[0])
        raise LasReadError(
            f"depth goes back at {data[i + 1, 0]:g} {unit_read} (after {data[i, 0]:g}); "
            "the depth index must increase or decrease throughout"
        )

    curve_names = mnemonics[1:]
    gr = find_gr_curve(curve_names, units, gr_curve)
    curves = {m: data[:, j + 1] for j, m in enumerate(curve_names)}
    if not np.any(np.isfinite(curves[gr])):
        raise CurveNotFoundError(f"gamma-ray curve {gr} has no valid samples")

    header: dict[str, str] = {}
    header_units: dict[str, str] = {}
    for section in ("well", "params"):
        for item in las.sections.get("Well" if section == "well" else "Parameter", []):
            header.setdefault(item.mnemonic, str(item.value).strip())
            header_units.setdefault(item.mnemonic, (item.unit or "").strip())
    name = header.get("WELL", "").strip() or path.stem
    return WellLog(
        name=name,
        source=str(path),
        sha256=_sha256(path),
        depth_m=depth,
        curves=curves,
        units=units,
        depth_unit=unit_read,
        gr_mnemonic=gr,
        header=header,
        header_units=header_units,
    )
