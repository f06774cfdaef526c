"""Batch screening over files and folders: one well's failure never stops the others."""

from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path
from collections.abc import Callable, Iterable

from logprep.errors import LogprepError
from logprep.io.survey import check_survey_dir, unmatched_survey_warnings
from logprep.io.tops import read_tops
from logprep.report.writers import prepare_out_dir, render_well, well_folder_name, write_summary, write_well
from logprep.run.config import SETTINGS_FILE_NAME, write_settings
from logprep.run.contain import contained_screen, log_internal
from logprep.run.pipeline import screen_file
from logprep.run.scan import find_las_files, scan_las_files  # noqa: F401 - find_las_files is API
from logprep.run.settings import ScreenSettings


@dataclass
class BatchReport:
    summary_path: Path
    rows: list[dict]
    skipped: list[tuple[str, str]] = field(default_factory=list)
    scan_line: str | None = None
    warnings: list[str] = field(default_factory=list)
    """One-line warnings about shared inputs (a survey that matches no well)."""

    @property
    def failures(self) -> list[dict]:
        return [r for r in self.rows if r["status"] != "ok"]

    @property
    def internal_errors(self) -> int:
        return sum(bool(r.get("internal")) for r in self.rows)


def screen_one(path: Path, folder: str, out_dir: Path, settings: ScreenSettings, tops=None,
               sheets: bool = True, faults=None, spreads=None,
               time_limit_s: float | None = None) -> dict:
    """Screen one file and write its folder; return its ``summary.csv`` row.

    Whatever goes wrong becomes a row with ``status`` ``error`` and a one-line message
    naming the file (see :func:`logprep.run.contain.contained_screen`); nothing is written for
    that file.  ``sheets=False`` writes the tables only.  ``faults`` (fault results by
    footwall well, see :func:`logprep.run.faults.with_fault_work`) adds their pages to the
    sheet; ``spreads`` appends the uncertainty columns to ``juxtapositions.csv``;
    ``time_limit_s`` bounds the well's time.  Top-level so that worker processes can run it.
    """
    row = {"well": folder, "source": str(path), "status": "ok", "message": "",
           "layers": "", "sand_sand_windows": "", "min_window_sgr_pct": "", "folder": "",
           "warnings": ""}
    result, failed = contained_screen(
        lambda: _screen_and_write(path, folder, out_dir, settings, tops, sheets, faults, spreads),
        path, time_limit_s)
    if failed is not None:
        row.update(status="error", message=failed.message, internal=failed.internal,
                   traceback=failed.traceback)
        return row
    cross = result.windows[~result.windows["self_juxtaposed"]]
    row.update(
        well=result.well.name, layers=len(result.layers), sand_sand_windows=len(cross),
        min_window_sgr_pct=round(result.min_window_sgr_pct, 3), folder=folder,
        warnings="; ".join(result.warnings),
    )
    return row


def _screen_and_write(path, folder, out_dir, settings, tops, sheets, faults, spreads):
    from logprep.report.sheet import build_sheet  # drawing is imported only when needed
    from logprep.run.faults import with_fault_work

    result = with_fault_work(screen_file(path, settings, tops=tops), faults, spreads)
    files_out = render_well(result, build_sheet if sheets else None)
    write_well(files_out, Path(out_dir) / folder)
    return result


def screen_paths(
    paths: Iterable[str | Path],
    out_dir: str | Path,
    settings: ScreenSettings = ScreenSettings(),
    *,
    on_error: Callable[[str], None] | None = None,
    progress: Callable[[Iterable], Iterable] | None = None,
    jobs: int = 1,
    sheets: bool = True,
    faults=None,
    spreads=None,
    time_limit_s: float | None = None,
) -> BatchReport:
    """Screen every LAS file under ``paths`` and write results below ``out_dir``.

    Each file gets its own folder (see :func:`logprep.report.writers.folder_name`) holding
    ``layers.csv``, ``juxtapositions.csv``, ``sheet.pdf`` and ``sheet.png`` and the other
    per-well files; ``out_dir/summary.csv`` lists every file with ``status`` ``ok`` or
    ``error`` (rewritten whole after each well, in input order), and
    ``out_dir/logprep-settings.toml`` holds the settings used (see :mod:`logprep.run.config`).
    Any failure of one file is recorded (and passed to ``on_error``) and the batch goes
    on; an unexpected exception (a bug) also appends its traceback to
    ``logprep-internal-errors.log`` in ``out_dir`` and counts in
    :attr:`BatchReport.internal_errors`.  ``time_limit_s`` bounds each well's time.
    Paths passed over while scanning (``out_dir`` itself, logprep's own exports,
    duplicates, unreadable folders) are in :attr:`BatchReport.skipped`.  ``jobs`` > 1 screens wells
    in that many worker processes (results are the same as with one); ``sheets=False``
    skips the PDF/PNG sheets (tables and fields only) for fast large batches.  ``faults``
    and ``spreads`` as for :func:`screen_one` (the spreads are also written to the settings
    file's ``[uncertainty]`` table).
    """
    out = Path(out_dir)
    scan = scan_las_files(paths, out)
    files = scan.files
    if not files:
        raise LogprepError(f"no .las files found in {', '.join(map(str, paths))}"
                           + (f" ({scan.summary_line()})" if scan.skipped else "")
                           + "; name LAS files or folders that hold them")
    if jobs < 1:
        raise LogprepError(f"--jobs must be 1 or more (got {jobs})")
    # inputs shared by every well are checked once, before any well is screened
    prepare_out_dir(out)
    tops = read_tops(settings.input.tops_file) if settings.input.tops_file else None
    if settings.input.survey_dir:
        check_survey_dir(settings.input.survey_dir)
    write_settings(out / SETTINGS_FILE_NAME, settings, uncertainty=spreads)
    taken: set[str] = set()
    folders = [well_folder_name(f, taken) for f in files]
    rows: list[dict | None] = [None] * len(files)
    summary = out / "summary.csv"

    def record(i: int, row: dict) -> None:
        nonlocal summary
        if row.get("traceback"):
            log_internal(out, row["source"], row.pop("traceback"))
        rows[i] = row
        if row["status"] != "ok" and on_error:
            on_error(row["message"])
        summary = write_summary([r for r in rows if r is not None], out)

    if jobs == 1 or len(files) == 1:
        iterator = progress(range(len(files))) if progress else range(len(files))
        for i in iterator:
            record(i, screen_one(files[i], folders[i], out, settings, tops, sheets, faults,
                                 spreads, time_limit_s))
    else:
        from concurrent.futures import ProcessPoolExecutor, as_completed

        with ProcessPoolExecutor(max_workers=min(jobs, len(files))) as pool:
            futures = {pool.submit(screen_one, f, name, out, settings, tops, sheets, faults,
                                   spreads, time_limit_s): i
                       for i, (f, name) in enumerate(zip(files, folders))}
            done = as_completed(futures)
            for fut in (progress(done) if progress else done):
                record(futures[fut], fut.result())
    done_rows = [r for r in rows if r is not None]
    notes = []
    if settings.input.survey_dir:
        names = [r["well"] for r in done_rows] + [Path(r["source"]).stem for r in done_rows]
        notes = unmatched_survey_warnings(settings.input.survey_dir, names)
    return BatchReport(summary_path=summary, rows=done_rows, warnings=notes,
                       skipped=scan.skipped, scan_line=scan.summary_line())
