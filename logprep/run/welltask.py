"""One well as a batch task: read, screen, draw and encode, returning every output as bytes.

The task writes nothing, so it runs the same in this process, in a worker process or on a
Dask worker on another machine; the process that started the run puts the files in place
(:mod:`logprep.run.store`).  It reads the input at an absolute path (``readable``) but
names it in every output and message as the user gave it (``given``), so a results folder
does not depend on where it was made.
"""

from __future__ import annotations

import os
import socket
import sys
import time
from dataclasses import dataclass, field, replace
from pathlib import Path

from logprep.io.safetext import show_path



STAGES = ("ingest", "compute", "drawing", "encoding")
"""Timed stages of a well task (seconds each): reading the LAS file; the screening science;
building the sheet pages and rendering them to PDF/PNG; tables, field and LAS export to bytes."""


@dataclass(frozen=True)
class OutputOptions:
    """Which files a well gets: ``sheets`` (sheet.pdf, sheet.png), ``field``
    (sgr_field.npz; ``--no-field`` leaves it out) and ``field_smear`` (the smear fields
    in it too)."""

    sheets: bool = True
    field: bool = True
    field_smear: bool = False
    time_limit_s: float | None = None
    """Seconds one well may take (None or 0: no limit); not an output choice, so it is left
    out of :meth:`to_dict` and of the run's settings hash."""

    def to_dict(self) -> dict:
        return {"sheets": self.sheets, "field": self.field, "field_smear": self.field_smear}


@dataclass
class WellOutcome:
    """What a well task returns: its ``summary.csv`` row, its files (None on error), the
    seconds per stage of :data:`STAGES`, and the peak memory (MB) of the process that ran it."""

    row: dict
    files: dict[str, bytes] | None
    timings_s: dict[str, float] = field(default_factory=dict)
    peak_rss_mb: float = float("nan")
    worker: str = ""


def summary_row(folder: str, given: str) -> dict:
    return {"well": folder, "source": given, "status": "ok", "message": "", "layers": "",
            "sand_sand_windows": "", "min_window_sgr_pct": "", "folder": "", "warnings": ""}


def peak_rss_mb() -> float:
    """Peak resident memory of this process (MB), where the platform reports it."""
    try:
        import resource
    except ImportError:  # Windows
        return float("nan")
    rss = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss
    return rss / (1024 * 1024) if sys.platform == "darwin" else rss / 1024


def screen_well_task(settings, tops, options: OutputOptions, fault_work: tuple, given: str,
                     readable: str, folder: str) -> WellOutcome:
    """Screen the LAS file at ``readable`` (named ``given``) for folder ``folder``.

    ``settings``, ``tops`` (a tops table or None) and ``fault_work`` (``(faults, spreads)``,
    see :func:`logprep.run.faults.with_fault_work`) are shared by the batch.  A
    Whatever goes wrong (see :func:`logprep.run.contain.contained_screen`) becomes a row
    with ``status`` ``error`` and no files; an unexpected exception also carries its
    traceback (``row["traceback"]``, logged by the batch) and ``options.time_limit_s``
    bounds the well's time.
    """
    from logprep.io.las import read_well
    from logprep.report.writers import render_well, sheet_files
    from logprep.run.pipeline import screen_well

    from logprep.report.writers import plain_text
    from logprep.run.contain import contained_screen

    row = summary_row(folder, given)
    t: dict[str, float] = dict.fromkeys(STAGES, 0.0)
    worker = f"{socket.gethostname()}:{os.getpid()}"
    t0 = time.perf_counter()

    def work():
        well = read_well(readable, gr_curve=settings.input.gr_curve, depth_unit=settings.input.depth_unit)
        well = replace(well, source=given)
        t["ingest"] = time.perf_counter() - t0
        t1 = time.perf_counter()
        result = screen_well(well, settings, tops=tops)
        if any(w is not None for w in fault_work):
            from logprep.run.faults import with_fault_work

            result = with_fault_work(result, *fault_work)
        t2 = time.perf_counter()
        t["compute"] = t2 - t1
        files = render_well(result, None, field=options.field, field_smear=options.field_smear)
        t3 = time.perf_counter()
        t["encoding"] = t3 - t2
        if options.sheets:
            from logprep.report.sheet import build_sheet

            with plain_text():  # text from files is never read as math markup
                files.update(sheet_files(build_sheet(result)))
        t["drawing"] = time.perf_counter() - t3
        return result, files

    done, failed = contained_screen(work, Path(given), options.time_limit_s)
    if failed is not None:
        msg = failed.message.replace(readable, given)
        doubled = f"{show_path(given)}: {show_path(given)}: "  # the reader names the file too
        if msg.startswith(doubled):
            msg = msg[len(doubled) // 2:]
        row.update(status="error", message=msg, internal=failed.internal,
                   traceback=failed.traceback)
        if not any(t.values()):
            t["ingest"] = time.perf_counter() - t0
        return WellOutcome(row, None, t, peak_rss_mb(), worker)
    result, files = done
    cross = result.windows[~result.windows["self_juxtaposed"]]
    row.update(well=result.well.name, layers=len(result.layers), sand_sand_windows=len(cross),
               min_window_sgr_pct=round(result.min_window_sgr_pct, 3), folder=folder,
               warnings="; ".join(result.warnings))
    return WellOutcome(row, dict(sorted(files.items())), t, peak_rss_mb(), worker)
