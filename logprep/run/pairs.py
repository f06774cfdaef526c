"""Batch screening of well pairs across a fault (footwall well, hanging-wall well).

A pairs file is a CSV with a header: ``footwall, hangingwall`` (well names or LAS file
stems) and, per row, ``marker`` (a top present in both wells' tops) and/or ``shift_m``
(hanging-wall depth minus footwall depth of the same horizon, metres; used when no marker
is given).  Each pair gets a folder ``pair_<footwall>_<hangingwall>`` under the output
folder with ``juxtapositions.csv``, ``sgr_field.npz``, ``sheet.pdf`` and ``sheet.png``;
``pairs_summary.csv`` lists every pair.  One pair's failure never stops the others.
"""

from __future__ import annotations

import math
from dataclasses import replace
from pathlib import Path
from collections.abc import Callable, Iterable

import numpy as np
import pandas as pd

from logprep.io.csvtable import parse_number, read_csv_table
from logprep.errors import LogprepError
from logprep.fault.capacity import well_reference
from logprep.fault.closure import describe as closure_describe
from logprep.io.closures import parse_closure_m
from logprep.fault.pair_capacity import pair_clay_layers, pair_seal_capacity_table
from logprep.fault.settings import capacity_params
from logprep.report.writers import (
    csv_bytes, folder_name, plain_text, sheet_files, with_window_numbers, write_bytes_atomic,
)
from logprep.io.tops import well_key
from logprep.fault.twowell import (
    PairError, check_hanging_wall_down, marker_shift_m, two_well_field, two_well_windows,
)

PAIRS_SUMMARY_COLUMNS = ["footwall", "hangingwall", "marker", "shift_m", "slip_source", "status",
                         "message", "sand_sand_windows", "min_window_sgr_pct", "folder"]


def read_pairs(path: str | Path) -> pd.DataFrame:
    """The pairs CSV as a frame with columns ``footwall, hangingwall, marker, shift_m,
    closure_m`` (text; ``closure_m`` optional, blank for none)."""
    path = Path(path)
    df = read_csv_table(path, PairError, "pairs CSV", "--pairs", dtype=str, keep_default_na=False)
    df.columns = [str(c).strip().lower() for c in df.columns]
    missing = [c for c in ("footwall", "hangingwall") if c not in df.columns]
    if missing or not ({"marker", "shift_m"} & set(df.columns)):
        raise PairError(f"{path}: needs columns footwall, hangingwall and marker and/or shift_m "
                        f"(found {', '.join(df.columns)}); add them to the header line")
    for c in ("marker", "shift_m", "closure_m"):
        if c not in df.columns:
            df[c] = ""
    df = df[["footwall", "hangingwall", "marker", "shift_m", "closure_m"]].apply(lambda s: s.str.strip())
    for k, row in enumerate(df.itertuples(), start=2):
        if not row.footwall or not row.hangingwall:
            raise PairError(f"{path}: line {k}: footwall and hangingwall must both be named; "
                            "write both well names on the line")
        if not row.marker and not row.shift_m:
            raise PairError(f"{path}: line {k}: neither marker nor shift_m given; give a "
                            "marker (with --tops) or a shift_m")
        parse_closure_m(row.closure_m, f"{path}: line {k}")
        if row.shift_m and not row.marker:
            try:
                if not math.isfinite(parse_number(row.shift_m)):
                    raise ValueError
            except ValueError:
                raise PairError(f"{path}: line {k}: shift_m {row.shift_m!r} is not a "
                                "number; write the shift in metres as a plain number") from None
    return df


def _find(name: str, files: list[Path], names: dict[Path, str]) -> Path:
    key = well_key(name)
    for f in files:
        if well_key(f.stem) == key or well_key(names.get(f, "")) == key:
            return f
    raise PairError(f"well {name!r} not found among the LAS files given; add its "
                    "LAS file to the command line or fix the name in the pairs file")


def pair_closure(pair_closure_text: str, fw, where: str = "pairs file") -> tuple[float | None, str]:
    """``(closure_m, source)`` of a pair: its own ``closure_m`` (pairs file) when given, else
    the footwall well's (the well whose sand traps against the fault: its closures-file
    closure or ``--closure``, as it was screened with)."""
    own = parse_closure_m(pair_closure_text, where)
    if own is not None:
        return own, where
    fw_closure = fw.settings.capacity.closure_m
    source = getattr(fw, "closure_source", "--closure")
    return fw_closure, (f"footwall well, {source}" if source != "--closure" else source)


def pair_windows(fw, hw, shift_m: float, settings, closure: tuple[float | None, str] | None = None
                 ) -> pd.DataFrame:
    """The windows of a pair with their seal-capacity columns and verdicts (as one well's),
    burial taken on the footwall well's depths and datum; ``self_juxtaposed`` is False
    throughout (two wells: a sand never faces itself).  ``closure``: ``(closure_m, source)``
    from :func:`pair_closure` (default: the footwall well's)."""
    fw_clay, hw_clay = pair_clay_layers(fw.layers, hw.layers, settings.field)
    windows = two_well_windows(fw_clay, hw_clay, shift_m, settings.field.throw_max_m,
                               settings.field.pair_slip_source)
    closure_m, source = closure if closure is not None else pair_closure("", fw)
    params = replace(capacity_params(settings.capacity, settings.fault_rock, settings.field),
                     closure_m=closure_m, closure_source=source)
    datum, _, surface, _ = well_reference(fw.well, params)
    table = pair_seal_capacity_table(windows, fw_clay, hw_clay, shift_m, params,
                                     datum_m=datum or 0.0, surface_elevation_m=surface,
                                     slip_source=settings.field.pair_slip_source,
                                     length_unit=settings.capacity.length_unit)
    at = table.columns.get_loc("max_contact_m")
    table.insert(at, "self_juxtaposed", False)
    return table


def pair_task(settings, tops, options, pair: dict, fw_file: tuple[str, str],
              hw_file: tuple[str, str]) -> tuple[dict, dict[str, bytes] | None]:
    """One well pair as a batch task (see :mod:`logprep.run.executor`): screen both wells
    (``(given, readable)`` paths), tie them and return the pair's summary fields and its
    files as bytes (None on failure, with ``status`` ``error``).  Whatever goes wrong is
    contained as for a well (:func:`logprep.run.contain.contained_screen`): an unexpected
    exception gives ``internal`` True and its ``traceback`` (logged by the caller), and
    the pair gets twice ``options.time_limit_s`` (two wells)."""
    from logprep.run.contain import contained_screen

    row = {"shift_m": "", "status": "ok", "message": "", "sand_sand_windows": "",
           "min_window_sgr_pct": ""}
    limit = 2 * options.time_limit_s if options.time_limit_s else None
    done, failed = contained_screen(lambda: _screen_pair(settings, tops, options, pair, fw_file, hw_file),
                                    Path(fw_file[0]), limit, prefix=False,
                                    limit="the pair time limit (twice the per-well limit)")
    if failed is not None:
        msg = failed.message
        for given, readable in (fw_file, hw_file):
            msg = msg.replace(readable, given)
        row.update(status="error", message=msg, internal=failed.internal,
                   traceback=failed.traceback)
        return row, None
    shift, windows, files = done
    row.update(shift_m=round(shift, 4), sand_sand_windows=len(windows),
               min_window_sgr_pct=round(float(windows["sgr_min_pct"].min()), 3) if len(windows) else "")
    return row, files


def _screen_pair(settings, tops, options, pair, fw_file, hw_file):
    """``(shift_m, windows, files)`` of one pair (see :func:`pair_task`)."""
    from logprep.io.las import read_well
    from logprep.run.pipeline import screen_well

    fw, hw = (screen_well(replace(read_well(readable, gr_curve=settings.input.gr_curve,
                                            depth_unit=settings.input.depth_unit), source=given),
                          settings, tops=tops)
              for given, readable in (fw_file, hw_file))
    if pair["marker"]:
        if tops is None:
            raise PairError(f"marker {pair['marker']!r} needs a tops file; give --tops "
                            "or a shift_m in the pairs file")
        shift = marker_shift_m(fw.tops, hw.tops, pair["marker"], pair["footwall"],
                               pair["hangingwall"])
    else:
        shift = parse_number(pair["shift_m"])
    check_hanging_wall_down(shift, pair["footwall"], pair["hangingwall"], pair["marker"] or None)
    closure = pair_closure(pair.get("closure_m", ""), fw,
                           f"pairs file, {pair['footwall']} / {pair['hangingwall']}")
    windows = pair_windows(fw, hw, shift, settings, closure)
    step = settings.field.field_depth_step_m or float(np.median(np.diff(fw.depth_m)))
    grid = two_well_field(*pair_clay_layers(fw.layers, hw.layers, settings.field), shift,
                          throw_max_m=settings.field.throw_max_m,
                          throw_step_m=settings.field.field_throw_step_m, depth_step_m=step,
                          slip_source=settings.field.pair_slip_source)
    files = {"juxtapositions.csv": csv_bytes(with_window_numbers(windows))}
    if options.field:
        files["sgr_field.npz"] = grid.npz_bytes(smear=options.field_smear)
    if options.sheets:
        from logprep.report.pair_sheet import PairScreening, build_pair_sheet

        with plain_text():
            pages = build_pair_sheet(PairScreening(
                fw, hw, shift, pair["marker"] or "", windows, grid, settings,
                closure_note=closure_describe(closure[0], settings.capacity.unconstrained_column_m,
                                              closure[1])))
            files.update(sheet_files(pages))
    return shift, windows, files


def screen_pairs(
    paths: Iterable[str | Path],
    pairs_file: str | Path,
    out_dir: str | Path,
    settings,
    *,
    on_error: Callable[[str], None] | None = None,
    sheets: bool = True,
    field: bool = True,
    field_smear: bool = False,
    backend=None,
    time_limit_s: float | None = None,
    force: bool = False,
) -> list[dict]:
    """Screen every pair of ``pairs_file`` (wells found among the LAS files under
    ``paths``) and write one folder per pair plus ``pairs_summary.csv`` in ``out_dir``
    (``sheets=False``: no ``sheet.pdf``/``sheet.png``; ``field``/``field_smear`` as for
    wells).  One task per pair on ``backend`` (a :class:`logprep.run.executor.Backend`).
    A pair's failure is its row's message and the others go on; an unexpected exception
    (a bug) also appends its traceback to ``logprep-internal-errors.log`` in ``out_dir`` and
    marks the row ``internal``.  ``time_limit_s`` is the per-well limit (None: the setting
    ``well_time_limit_s``; a pair gets twice it).  Pairs are recorded in the run manifest
    (:mod:`logprep.run.manifest`): a rerun skips a pair whose two input files, pairs-file
    row, settings and tops are unchanged and whose folder is intact (its row then carries
    ``unchanged`` True), unless ``force``.  Returns the summary rows."""
    from logprep.run.contain import log_internal
    from logprep.io.las import read_well_name
    from logprep.io.tops import read_tops
    from logprep.run.batch import find_las_files
    from logprep.run.executor import Backend, TaskLost, run_tasks
    from logprep.run.batch import run_settings_sha256
    from logprep.run.manifest import Manifest, readable_path
    from logprep.run.store import commit_folder
    from logprep.run.welltask import OutputOptions

    out = Path(out_dir)
    pairs = read_pairs(pairs_file)
    files = find_las_files(paths)
    tops = read_tops(settings.input.tops_file) if settings.input.tops_file else None
    names = {f: read_well_name(f) for f in files} if len(pairs) else {}
    taken: set[str] = set()
    rows, tasks, where = [], [], []
    for p in pairs.itertuples():
        row = {"footwall": p.footwall, "hangingwall": p.hangingwall, "marker": p.marker,
               "shift_m": "", "slip_source": settings.field.pair_slip_source, "status": "ok",
               "message": "", "sand_sand_windows": "", "min_window_sgr_pct": "", "folder": ""}
        rows.append(row)
        try:
            fw_f, hw_f = (_find(name, files, names) for name in (p.footwall, p.hangingwall))
        except LogprepError as exc:
            row.update(status="error", message=_pair_message(pairs_file, p, str(exc)))
            continue
        folder = folder_name(f"pair_{p.footwall}_{p.hangingwall}", taken)
        pair = {"footwall": p.footwall, "hangingwall": p.hangingwall, "marker": p.marker,
                "shift_m": p.shift_m}
        tasks.append((pair, (str(fw_f), readable_path(fw_f)), (str(hw_f), readable_path(hw_f))))
        where.append((len(rows) - 1, folder))
    limit = settings.input.well_time_limit_s if time_limit_s is None else time_limit_s
    options = OutputOptions(sheets=sheets, field=field, field_smear=field_smear, time_limit_s=limit)
    worker_settings = settings.updated(survey_dir=readable_path(settings.input.survey_dir)) \
        if settings.input.survey_dir else settings
    manifest = Manifest(out)
    todo, keys = pairs_to_redo(manifest, out, tasks, where, rows, run_settings_sha256(settings, options), force)
    summary = out / "pairs_summary.csv"
    try:
        write_bytes_atomic(summary, csv_bytes(pd.DataFrame(rows, columns=PAIRS_SUMMARY_COLUMNS)))
        for j, outcome in run_tasks(pair_task, [tasks[k] for k in todo], backend or Backend(),
                                    shared=(worker_settings, tops, options)):
            k = todo[j]
            (at, folder), p = where[k], pairs.iloc[where[k][0]]
            row = rows[at]
            if isinstance(outcome, TaskLost):
                outcome = ({"status": "error", "message": outcome.message}, None)
            fields_, files_out = outcome
            row.update(fields_)
            if row.get("traceback"):
                log_internal(out, f"{pairs_file}: pair {p.footwall} / {p.hangingwall}", row.pop("traceback"))
            if files_out is not None:
                sums = commit_folder(out, folder, files_out)
                row["folder"] = folder
                manifest.record(folder, kind="pair", source=f"{tasks[k][1][0]} / {tasks[k][2][0]}",
                                input_sha=keys[k][0], settings_sha=keys[k][1], outputs=sums,
                                sizes={n: len(b) for n, b in files_out.items()},
                                row={c: row[c] for c in PAIRS_SUMMARY_COLUMNS})
            else:
                row["message"] = _pair_message(pairs_file, p, row["message"])
    finally:
        for row in rows:
            if row["status"] != "ok" and on_error:
                on_error(row["message"])
        write_bytes_atomic(summary, csv_bytes(pd.DataFrame(rows, columns=PAIRS_SUMMARY_COLUMNS)))
        manifest.compact()
    return rows


def pairs_to_redo(manifest, out: Path, tasks: list[tuple], where: list[tuple[int, str]],
                  rows: list[dict], run_sha: str, force: bool) -> tuple[list[int], list[tuple[str, str]]]:
    """Which pair tasks to run: the others are unchanged since the last run on ``out``
    (their rows are filled from the manifest and marked ``unchanged``).  A pair folder to be
    redone, or no longer in the pairs file, is marked incomplete and forgotten first.
    Returns the task numbers to run and each task's (input hash, settings hash)."""
    from logprep.run.batch import _input_sha256
    from logprep.run.manifest import pair_input_sha256
    from logprep.run.store import mark_folder

    keys, todo = [], []
    for k, (pair, fw_file, hw_file) in enumerate(tasks):
        at, folder = where[k]
        keys.append((pair_input_sha256(pair, _input_sha256(Path(fw_file[1])),
                                       _input_sha256(Path(hw_file[1]))), run_sha))
        if not force and manifest.is_current(folder, *keys[k]):
            rows[at].update(manifest.entries[folder]["row"], unchanged=True)
            continue
        rows[at].update(status="pending", message="not screened yet (the run was stopped before this pair)")
        todo.append(k)
        if (out / folder).exists():
            mark_folder(out / folder, "being redone for other settings or input")
            manifest.drop(folder)
    for folder in sorted(manifest.folders("pair") - {f for _, f in where}):
        mark_folder(out / folder, "not in the latest pairs file run on this folder (see pairs_summary.csv)")
        manifest.drop(folder)
    return todo, keys


def _pair_message(pairs_file, p, msg: str) -> str:
    return f"{pairs_file}: pair {p.footwall} / {p.hangingwall}: {msg.splitlines()[0] if msg else ''}"
