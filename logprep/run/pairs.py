"""Batch screening of well pairs across a fault (footwall well, hanging-wall well).

A pairs file is a CSV with a header: ``footwall, hangingwall`` (well names or LAS file
stems) and, per row, ``marker`` (a top present in both wells' tops) and/or ``shift_m``
(hanging-wall depth minus footwall depth of the same horizon, metres; used when no marker
is given).  Each pair gets a folder ``pair_<footwall>_<hangingwall>`` under the output
folder with ``juxtapositions.csv``, ``sgr_field.npz``, ``sheet.pdf`` and ``sheet.png``;
``pairs_summary.csv`` lists every pair.  One pair's failure never stops the others.
"""

from __future__ import annotations

from pathlib import Path
from collections.abc import Callable, Iterable

import numpy as np
import pandas as pd

from logprep.io.csvtable import parse_number, read_csv_table
from logprep.errors import LogprepError
from logprep.fault.envelope import depth_datum
from logprep.fault.pair_capacity import pair_seal_capacity_table
from logprep.fault.settings import capacity_params
from logprep.report.writers import (
    csv_bytes, folder_name, pdf_bytes, plain_text, png_bytes, with_window_numbers, write_bytes_atomic,
)
from logprep.io.tops import well_key
from logprep.fault.twowell import (
    PairError, check_hanging_wall_down, marker_shift_m, two_well_field, two_well_windows,
)

PAIRS_SUMMARY_COLUMNS = ["footwall", "hangingwall", "marker", "shift_m", "slip_source", "status",
                         "message", "sand_sand_windows", "min_window_sgr_pct", "folder"]


def read_pairs(path: str | Path) -> pd.DataFrame:
    """The pairs CSV as a frame with columns ``footwall, hangingwall, marker, shift_m``."""
    path = Path(path)
    df = read_csv_table(path, PairError, "pairs CSV", dtype=str, keep_default_na=False)
    df.columns = [str(c).strip().lower() for c in df.columns]
    missing = [c for c in ("footwall", "hangingwall") if c not in df.columns]
    if missing or not ({"marker", "shift_m"} & set(df.columns)):
        raise PairError(f"{path}: needs columns footwall, hangingwall and marker and/or shift_m "
                        f"(found {', '.join(df.columns)})")
    for c in ("marker", "shift_m"):
        if c not in df.columns:
            df[c] = ""
    df = df[["footwall", "hangingwall", "marker", "shift_m"]].apply(lambda s: s.str.strip())
    for k, row in enumerate(df.itertuples(), start=2):
        if not row.footwall or not row.hangingwall:
            raise PairError(f"{path}: line {k}: footwall and hangingwall must both be named")
        if not row.marker and not row.shift_m:
            raise PairError(f"{path}: line {k}: give a marker or a shift_m")
        if row.shift_m and not row.marker:
            try:
                parse_number(row.shift_m)
            except ValueError:
                raise PairError(f"{path}: line {k}: shift_m {row.shift_m!r} is not a number") from None
    return df


def _find(name: str, files: list[Path], names: dict[Path, str]) -> Path:
    key = well_key(name)
    for f in files:
        if well_key(f.stem) == key or well_key(names.get(f, "")) == key:
            return f
    raise PairError(f"well {name!r} not found among the LAS files given")


def pair_windows(fw, hw, shift_m: float, settings) -> pd.DataFrame:
    """The windows of a pair with their seal-capacity columns and verdicts (as one well's),
    burial taken on the footwall well's depths and datum; ``self_juxtaposed`` is False
    throughout (two wells: a sand never faces itself)."""
    windows = two_well_windows(fw.layers, hw.layers, shift_m, settings.field.throw_max_m,
                               settings.field.pair_slip_source)
    datum, _ = depth_datum(fw.well)
    table = pair_seal_capacity_table(windows, fw.layers, hw.layers, shift_m,
                                     capacity_params(settings.capacity, settings.fault_rock),
                                     datum_m=datum or 0.0, slip_source=settings.field.pair_slip_source,
                                     length_unit=settings.capacity.length_unit)
    at = table.columns.get_loc("max_contact_m")
    table.insert(at, "self_juxtaposed", False)
    return table


def screen_pairs(
    paths: Iterable[str | Path],
    pairs_file: str | Path,
    out_dir: str | Path,
    settings,
    *,
    on_error: Callable[[str], None] | None = None,
    sheets: bool = True,
) -> list[dict]:
    """Screen every pair of ``pairs_file`` (wells found among the LAS files under
    ``paths``) and write one folder per pair plus ``pairs_summary.csv`` in ``out_dir``
    (``sheets=False``: no ``sheet.pdf``/``sheet.png``).  Returns the summary rows."""
    from logprep.run.batch import find_las_files
    from logprep.io.las import read_well_name
    from logprep.run.pipeline import screen_file
    from logprep.io.tops import read_tops

    out = Path(out_dir)
    pairs = read_pairs(pairs_file)
    files = find_las_files(paths)
    tops = read_tops(settings.input.tops_file) if settings.input.tops_file else None
    names: dict[Path, str] = {}
    cache: dict[Path, object] = {}
    taken: set[str] = set()
    rows = []
    for p in pairs.itertuples():
        row = {"footwall": p.footwall, "hangingwall": p.hangingwall, "marker": p.marker,
               "shift_m": "", "slip_source": settings.field.pair_slip_source, "status": "ok",
               "message": "", "sand_sand_windows": "", "min_window_sgr_pct": "", "folder": ""}
        try:
            if not names:
                names = {f: read_well_name(f) for f in files}
            results = []
            for name in (p.footwall, p.hangingwall):
                f = _find(name, files, names)
                if f not in cache:
                    cache[f] = screen_file(f, settings, tops=tops)
                results.append(cache[f])
            fw, hw = results
            if p.marker:
                if tops is None:
                    raise PairError(f"marker {p.marker!r} needs a tops file (--tops)")
                shift = marker_shift_m(fw.tops, hw.tops, p.marker, p.footwall, p.hangingwall)
            else:
                shift = parse_number(p.shift_m)
            check_hanging_wall_down(shift, p.footwall, p.hangingwall, p.marker or None)
            windows = pair_windows(fw, hw, shift, settings)
            step = settings.field.field_depth_step_m or float(np.median(np.diff(fw.depth_m)))
            grid = two_well_field(fw.layers, hw.layers, shift, throw_max_m=settings.field.throw_max_m,
                                  throw_step_m=settings.field.field_throw_step_m, depth_step_m=step,
                                  slip_source=settings.field.pair_slip_source)
            files_out = {"juxtapositions.csv": csv_bytes(with_window_numbers(windows)),
                         "sgr_field.npz": grid.npz_bytes()}
            if sheets:
                with plain_text():
                    from logprep.report.pair_sheet import PairScreening, build_pair_sheet

                    pages = build_pair_sheet(PairScreening(fw, hw, shift, p.marker or "", windows, grid,
                                                           settings))
                    files_out.update({"sheet.pdf": pdf_bytes(pages), "sheet.png": png_bytes(pages[0])})
            folder = folder_name(f"pair_{p.footwall}_{p.hangingwall}", taken)
            for fname, data in files_out.items():
                write_bytes_atomic(out / folder / fname, data)
        except LogprepError as exc:
            msg = f"{pairs_file}: pair {p.footwall} / {p.hangingwall}: {str(exc).splitlines()[0]}"
            row.update(status="error", message=msg)
            if on_error:
                on_error(msg)
        else:
            row.update(shift_m=round(shift, 4), sand_sand_windows=len(windows), folder=folder,
                       min_window_sgr_pct=round(float(windows["sgr_min_pct"].min()), 3)
                       if len(windows) else "")
        rows.append(row)
        write_bytes_atomic(out / "pairs_summary.csv",
                           csv_bytes(pd.DataFrame(rows, columns=PAIRS_SUMMARY_COLUMNS)))
    return rows
