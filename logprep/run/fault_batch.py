"""Every fault of a faults file screened over a set of LAS files: ``faults.csv`` and one
page per fault (``faults/<name>.pdf`` and ``.png``) in the output folder.

Wells are found among the LAS files by WELL name or file stem, as for well pairs; each well
is screened once however many faults use it.  One fault's failure never stops the others:
it is reported through ``on_error`` with the faults file, the row and the reason, and
``faults.csv`` lists the faults that ran.
"""

from __future__ import annotations

from dataclasses import replace
from pathlib import Path
from collections.abc import Callable, Iterable

import pandas as pd

from logprep.fault.uncertainty import Spreads
from logprep.io.faults import FaultSpec, read_faults
from logprep.run.faults import FAULT_COLUMNS, FaultResult, FaultScreenError, screen_fault

FAULTS_FILE_NAME = "faults.csv"
FAULT_PAGES_FOLDER = "faults"


def fault_grid(res: FaultResult, fw, settings):
    """The SGR field the fault page draws: the footwall well's own field for a fault in one
    well, the two-well field of the pair otherwise."""
    if not res.spec.two_wells:
        return fw.grid
    from logprep.fault.twowell import two_well_field

    import numpy as np

    step = settings.field_depth_step_m or float(np.median(np.diff(fw.depth_m)))
    return two_well_field(res.fw_layers, res.hw_layers, res.shift_m, throw_max_m=settings.throw_max_m,
                          throw_step_m=settings.field_throw_step_m, depth_step_m=step,
                          slip_source=settings.pair_slip_source)


def _find(name: str, files: list[Path], names: dict[Path, str], spec: FaultSpec) -> Path:
    from logprep.io.tops import well_key

    key = well_key(name)
    for f in files:
        if well_key(f.stem) == key or well_key(names.get(f, "")) == key:
            return f
    raise FaultScreenError(f"{spec.where}: well {name!r} not found among the LAS files given; "
                           "name it by its WELL header or file stem")


def screen_faults(
    paths: Iterable[str | Path],
    faults_file: str | Path,
    settings,
    spreads: Spreads | None = None,
    *,
    on_error: Callable[[str], None] | None = None,
    on_internal: Callable[[str, str], None] | None = None,
) -> list[FaultResult]:
    """Screen every fault of ``faults_file`` with wells from the LAS files under ``paths``.

    Returns the results of the faults that ran (each with its ``grid`` for the page); a
    failing fault is reported through ``on_error`` and left out.  Each fault is contained
    as a well is (:func:`logprep.run.contain.contained_screen`, twice the per-well time
    limit): an unexpected exception (a bug) is also passed to ``on_internal`` as
    ``(where, traceback)``.
    """
    from logprep.run.contain import contained_screen

    from logprep.io.las import read_well_name
    from logprep.io.tops import read_tops
    from logprep.run.batch import find_las_files
    from logprep.run.pipeline import screen_file

    spreads = spreads or Spreads()
    faults = read_faults(faults_file)
    files = find_las_files(paths)
    tops = read_tops(settings.tops_file) if settings.tops_file else None
    names = {f: read_well_name(f) for f in files}
    cache: dict[Path, object] = {}
    out = []
    limit = 2 * settings.well_time_limit_s or None

    def one(spec):
        wells = []
        for name in (spec.footwall, spec.hangingwall):
            if name is None:
                wells.append(None)
                continue
            f = _find(name, files, names, spec)
            if f not in cache:
                cache[f] = screen_file(f, settings, tops=tops)
            wells.append(cache[f])
        fw, hw = wells
        if spec.marker and tops is None:
            raise FaultScreenError(f"{spec.where}: marker {spec.marker!r} needs a tops file; give "
                                   "--tops, or a throw without a marker")
        res = screen_fault(spec, fw, hw, settings, spreads)
        from logprep.io.tops import well_key

        return replace(res, grid=fault_grid(res, fw, settings),
                       footwall_keys=(well_key(fw.well.name), well_key(Path(fw.well.source).stem)))

    for spec in faults:
        res, failed = contained_screen(lambda: one(spec), Path(faults_file), limit, prefix=False,
                                       limit="the fault time limit (twice the per-well limit)")
        if failed is not None:
            msg = failed.message
            if not msg.startswith(str(faults_file)):
                msg = f"{spec.where}: fault {spec.name!r}: {msg}"
            if failed.internal and on_internal:
                on_internal(f"{spec.where}: fault {spec.name!r}", failed.traceback)
            if on_error:
                on_error(msg)
            continue
        out.append(res)
    return out


def faults_table(results: list[FaultResult]) -> pd.DataFrame:
    """The ``faults.csv`` table: every pair of every fault, in faults-file order."""
    frames = [r.table for r in results if len(r.table)]
    if not frames:
        return pd.DataFrame(columns=FAULT_COLUMNS)
    return pd.concat(frames, ignore_index=True)[FAULT_COLUMNS]


def write_faults(results: list[FaultResult], out_dir: str | Path, settings, *, sheets: bool = True) -> list[Path]:
    """Write ``faults.csv`` and, with ``sheets``, ``faults/<name>.pdf``/``.png`` (one page
    per fault); each file atomically.  Returns the paths written."""
    from logprep.report.page_fault import fault_page
    from logprep.report.writers import csv_bytes, folder_name, sheet_files, write_bytes_atomic

    out = Path(out_dir)
    written = [out / FAULTS_FILE_NAME]
    write_bytes_atomic(written[0], csv_bytes(faults_table(results)))
    if sheets:
        taken: set[str] = set()
        for res in results:
            page = fault_page(res, res.grid, settings)
            stem = folder_name(res.spec.name, taken)
            for name, data in sheet_files([page], stem).items():
                path = out / FAULT_PAGES_FOLDER / name
                write_bytes_atomic(path, data)
                written.append(path)
    return written


def faults_by_footwall(results: list[FaultResult]) -> dict[str, tuple[FaultResult, ...]]:
    """Fault results by the footwall well's name key (for the fault page of a well's sheet)."""
    by: dict[str, list] = {}
    for r in results:
        for key in dict.fromkeys(r.footwall_keys):
            by.setdefault(key, []).append(r)
    return {k: tuple(v) for k, v in by.items()}

