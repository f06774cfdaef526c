"""Read LAS files into :class:`~logprep.model.WellLog` (the only module that talks to lasio).

Units are fixed here, once: a depth index in feet becomes metres.  Missing values are the
header ``NULL`` plus the common sentinels in :data:`NULL_SENTINELS`.  The gamma-ray curve is
found by the mnemonic registry :data:`GR_ALIASES` (first match wins), by a name the caller
gives, or, failing both, by a curve whose unit is API.
"""

from __future__ import annotations

import logging
import warnings
from pathlib import Path

import lasio
import numpy as np

from logprep.errors import CurveNotFoundError, LasReadError
from logprep.io.fastascii import header_items, read_las_data
from logprep.io.lastext import load_las_source
from logprep.model import WellLog
from logprep.io.safetext import show_path
from logprep.io.sanity import (
    bound_values, check_depth_index, check_depth_range, quirk_warnings, wrap_warning,
)

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
            f"no curve named {wanted!r} (found {', '.join(mnemonics) or 'none'}); "
            "check the name given with --gr-curve against the ~Curve section"
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
    fix = "name one with --gr-curve" if kind == "gr" else "add the curve to the file"
    raise CurveNotFoundError(
        f"no {_KIND_NAMES.get(kind, kind)} curve (found {', '.join(mnemonics) or 'no curves'}); {fix}"
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
    try:
        source = load_las_source(path)
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            las = lasio.read(source.header + "~A\n")
    except Exception:  # noqa: BLE001 - lasio raises many types; the caller only matches names
        return ""
    return str(las.well["WELL"].value).strip() if "WELL" in las.well else ""


def read_well_header(path: str | Path) -> dict[str, str]:
    """The ``~Well`` items of a LAS file (mnemonic -> value as text), reading the header
    only; empty when the file cannot be read as LAS."""
    try:
        source = load_las_source(path)  # checked, decoded and made safe like read_well
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            las = lasio.read(source.header + "~A\n")
    except Exception:  # noqa: BLE001 - lasio raises many types for unreadable input
        return {}
    return {item.mnemonic: str(item.value) for item in las.well}


def read_well(
    path: str | Path,
    *,
    gr_curve: str | None = None,
    depth_unit: str | None = None,
    fast: bool = True,
) -> WellLog:
    """Read one LAS file.

    Parameters
    ----------
    path : str or Path
        The LAS file (versions 1.2, 2.0 and 3.0; LAS 3.0 data sets other than the log
        are not read).
    gr_curve : str, optional
        Gamma-ray mnemonic to use instead of the alias search.
    depth_unit : str, optional
        Unit of the depth index (``m`` or ``ft``) when the file does not state one, or to
        override a wrong one.
    fast : bool
        Parse plain data sections with the C parser (:mod:`logprep.io.fastascii`); False
        reads every file with lasio alone (same values, slower).

    Returns
    -------
    WellLog
        Depth in metres, increasing; all curves with missing values as NaN; ``warnings``
        naming what the reader changed or doubts.

    Raises
    ------
    LasReadError
        The file is missing, empty, binary, too large, not LAS, has no data, no depth
        index, a time index, a depth beyond physical bounds, or a depth that repeats or
        goes back and forth.
    CurveNotFoundError
        No gamma-ray curve could be found (or ``gr_curve`` is absent).
    """
    path = Path(path)
    where = show_path(path)
    source = load_las_source(path)
    sample, has_rows = bytes(source.data[:65536]), source.has_rows()
    data = read_las_data(source, fast=fast)
    source.drop_data()  # the file's bytes are not needed any more
    notes = list(source.warnings)
    wrap_note = wrap_warning(source.wrap, sample, len(data.columns), source.delimiter == "COMMA")
    notes += [wrap_note] if wrap_note else []
    try:
        return _to_well_log(path, source, data, notes, has_rows=has_rows,
                            gr_curve=gr_curve, depth_unit=depth_unit)
    except CurveNotFoundError as exc:
        raise CurveNotFoundError(f"{where}: {exc}") from None
    except LasReadError as exc:
        raise LasReadError(f"{where}: {exc}") from None


def _text_gr_check(parsed, numeric: list[int], gr_curve: str | None) -> None:
    """A gamma-ray curve that holds only text gets its own message, not 'no curve'."""
    dropped = [j for j in range(1, len(parsed.columns)) if j not in numeric]
    for j in dropped:
        name = parsed.mnemonics[j]
        wanted = (gr_curve or "").strip().upper()
        if _base_mnemonic(name) in (GR_ALIASES if not wanted else [wanted]):
            first = str(np.asarray(parsed.columns[j])[0])[:40]
            raise CurveNotFoundError(
                f"gamma-ray curve {name} holds text, not numbers (first value {first!r}); "
                "correct the ~A values (numbers separated by blanks) or name another "
                "curve with --gr-curve")


def _to_well_log(path: Path, source, parsed, notes: list[str], *, has_rows: bool,
                 gr_curve, depth_unit) -> WellLog:
    las = parsed.las
    if not parsed.columns or not np.size(parsed.columns[0]):
        what = "no data rows under ~A" if has_rows \
            else "no log data section (~A, or ~Log_Data in LAS 3.0)"
        raise LasReadError(f"{what}; a LAS file for screening needs depth-indexed log data: "
                           "export the log again with its data")
    if parsed.engine == "fast":  # every column is a number already (and ours to change)
        numeric, cols = list(range(len(parsed.columns))), list(parsed.columns)
    else:
        floats = [_numeric(c) for c in parsed.columns]
        numeric = [0] + [
            j for j in range(1, len(floats))
            if np.asarray(parsed.columns[j]).dtype.kind in "fiu" or np.any(np.isfinite(floats[j]))
        ]
        cols = [floats[j] for j in numeric]
    index_mnemonic, index_unit = parsed.mnemonics[0], parsed.units[0]
    if index_mnemonic.upper().startswith("UNKNOWN"):
        raise LasReadError("no ~Curve section naming the data columns; add one (one line "
                           "per column, the depth first, e.g. 'DEPT.M : DEPTH')")
    _text_gr_check(parsed, numeric, gr_curve)
    mnemonics = [parsed.mnemonics[j] for j in numeric]
    units = dict(zip(parsed.mnemonics, parsed.units))

    unit_read = (depth_unit or index_unit or "").strip()
    unit_key = unit_read.upper()
    if unit_key in _TIME_UNITS or index_mnemonic.upper() in {"TIME", "ETIM"}:
        raise LasReadError(
            f"index {index_mnemonic} [{index_unit}] is time, not depth; logprep needs a "
            "depth-indexed log: export the log against depth"
        )
    if unit_key not in DEPTH_UNITS_M:
        hint = "pass --depth-unit m or ft" if not unit_key else "pass --depth-unit m or ft to override"
        raise LasReadError(
            f"depth index {index_mnemonic} has unit {unit_read!r}, not metres or feet; {hint}"
        )

    null = las.well["NULL"].value if "NULL" in las.well else None
    sentinels = list(NULL_SENTINELS)
    try:
        if null is not None and str(null).strip() != "":
            sentinels.append(float(null))
    except (TypeError, ValueError):
        pass
    with np.errstate(invalid="ignore"):
        for col in cols:  # column by column: no temporary the size of the whole log
            for s in sentinels:
                col[np.abs(col - s) <= 1e-6] = np.nan

    raw_depth = cols[0]
    with np.errstate(over="ignore", invalid="ignore"):
        depth = raw_depth * DEPTH_UNITS_M[unit_key]
    keep = np.isfinite(depth)
    if not keep.all():
        cols, depth = [c[keep] for c in cols], depth[keep]
    if depth.size < 2:
        raise LasReadError(f"fewer than two depth samples ({depth.size} with a valid depth); "
                           "a screen needs a log over a depth interval: check the depth column")
    check_depth_range(depth)
    step = np.diff(depth)
    if np.all(step < 0):
        cols, depth = [c[::-1] for c in cols], depth[::-1]
        step = np.diff(depth)
    raw_depth = cols[0]
    if np.any(step == 0):
        i = int(np.flatnonzero(step == 0)[0])
        raise LasReadError(
            f"duplicate depth {raw_depth[i]:g} {unit_read} in {index_mnemonic}; "
            "remove the repeated rows"
        )
    if np.any(step < 0):
        i = int(np.flatnonzero(step < 0)[0])
        raise LasReadError(
            f"depth goes back at {raw_depth[i + 1]:g} {unit_read} (after {raw_depth[i]:g}); "
            "the depth index must increase or decrease throughout: sort the rows or split "
            "the file at the repeat"
        )
    check_depth_index(depth)

    curve_names = mnemonics[1:]
    gr = find_gr_curve(curve_names, units, gr_curve)
    curves = {m: cols[j + 1] for j, m in enumerate(curve_names)}  # WellLog copies them
    notes += bound_values(curves, gr)
    if not np.any(np.isfinite(curves[gr])):
        raise CurveNotFoundError(
            f"gamma-ray curve {gr} has no valid samples (all NULL); name another with --gr-curve")
    notes += quirk_warnings(depth, curves[gr], gr)

    header, header_units = header_items(las, source.renamed)
    name = header.get("WELL", "").strip() or path.stem
    return WellLog(
        name=name,
        source=str(path),
        sha256=source.sha256,
        depth_m=depth,
        curves=curves,
        units=units,
        depth_unit=unit_read,
        gr_mnemonic=gr,
        header=header,
        header_units=header_units,
        warnings=tuple(notes),
    )
