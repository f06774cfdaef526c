"""Batch screening over files and folders: one well's failure never stops the others.

A batch can be killed at any moment and run again on the same ``--out``: wells whose input
and settings are unchanged are skipped (see :mod:`logprep.run.manifest`), the others are
redone, and every well folder is either complete or carries ``INCOMPLETE.txt``
(:mod:`logprep.run.store`).  Wells run in this process, in worker processes or on a Dask
cluster (:mod:`logprep.run.executor`); this process writes every file.
"""

from __future__ import annotations

import time
from collections.abc import Callable, Iterable
from dataclasses import dataclass, field
from pathlib import Path

from logprep import __version__
from logprep.errors import LogprepError
from logprep.io.closures import read_closures
from logprep.io.survey import check_survey_dir, unmatched_survey_warnings
from logprep.io.tops import read_tops
from logprep.report.writers import prepare_out_dir, well_folder_name, write_summary
from logprep.run.config import SETTINGS_FILE_NAME, write_settings
from logprep.run.contain import log_internal
from logprep.run.executor import Backend, TaskLost, run_tasks
from logprep.run.manifest import (
    Manifest,
    file_sha256,
    readable_path,
    settings_sha256,
    tree_sha256,
)
from logprep.run.progress import Progress
from logprep.run.scan import find_las_files, scan_las_files  # noqa: F401 - find_las_files is API
from logprep.run.settings import ScreenSettings
from logprep.run.store import clean_leftovers, commit_folder, mark_folder
from logprep.run.welltask import (
    OutputOptions,
    WellOutcome,
    screen_well_task,
    summary_row,
)

SUMMARY_EVERY_S = 2.0
"""``summary.csv`` is rewritten at most this often during a run (and always at its end)."""


@dataclass
class BatchReport:
    """``rows``: the ``summary.csv`` rows in input order; ``skipped``: wells unchanged since
    the last run on this ``--out``; ``outcomes``: folder -> :class:`WellOutcome` (timings,
    peak memory) of the wells screened in this run."""

    summary_path: Path
    rows: list[dict]
    skipped: int = 0
    outcomes: dict[str, WellOutcome] = field(default_factory=dict)
    scan_skipped: list[tuple[str, str]] = field(default_factory=list)
    scan_line: str | None = None
    warnings: list[str] = field(default_factory=list)
    """One-line warnings about shared inputs (a survey that matches no well)."""
    overview: dict[str, Path] = field(default_factory=dict)
    """The field overview written after the wells (``overview.html``, ``overview.pdf`` ->
    path); empty when it was turned off."""

    @property
    def failures(self) -> list[dict]:
        return [r for r in self.rows if r["status"] != "ok"]

    @property
    def internal_errors(self) -> int:
        return sum(bool(r.get("internal")) for r in self.rows)


def screen_one(path: Path, folder: str, out_dir: Path, settings: ScreenSettings, tops=None,
               sheets: bool = True, faults=None, spreads=None,
               time_limit_s: float | None = None) -> dict:
    """Screen one file and put its folder in place; return its ``summary.csv`` row.

    Whatever goes wrong becomes a row with ``status`` ``error`` and a one-line message
    naming the file (see :func:`logprep.run.contain.contained_screen`); nothing is written
    for that file.  ``time_limit_s`` bounds the well's time (None: the setting
    ``well_time_limit_s``).
    """
    limit = settings.input.well_time_limit_s if time_limit_s is None else time_limit_s
    outcome = screen_well_task(settings, tops, OutputOptions(sheets=sheets, time_limit_s=limit),
                               (faults, spreads),
                               str(path), readable_path(path), folder)
    if outcome.files is not None:
        commit_folder(Path(out_dir), folder, outcome.files)
    return outcome.row


RUN_ONLY_FIELDS = ("well_time_limit_s",)
"""Settings that bound a run but never change a well's results (left out of the hash)."""


def run_settings_sha256(settings: ScreenSettings, options: OutputOptions, faults=None,
                        spreads=None) -> str:
    """The hash that decides whether a well's results are still those of this run: the
    settings, the output options, the logprep version and the bytes of the tops and
    survey files (not the settings that bound the run, :data:`RUN_ONLY_FIELDS`)."""
    groups = settings.to_dict()
    groups["input"] = {k: v for k, v in groups["input"].items() if k not in RUN_ONLY_FIELDS}
    return settings_sha256(groups, {
        "logprep": __version__, "outputs": options.to_dict(),
        "tops": tree_sha256(settings.input.tops_file), "surveys": tree_sha256(settings.input.survey_dir),
        **({"closures": tree_sha256(settings.input.closures_file)} if settings.input.closures_file else {}),
        "fault_work": _pickle_sha256((faults, spreads)) if faults or spreads else ""})


def _pickle_sha256(obj) -> str:
    import hashlib
    import pickle

    return hashlib.sha256(pickle.dumps(obj, protocol=4)).hexdigest()


def pending_row(folder: str, given: str) -> dict:
    row = summary_row(folder, given)
    row.update(status="pending", message="not screened yet (the run was stopped before this well); "
               "run the same command again to screen it (finished wells are kept)")
    return row


def screen_paths(
    paths: Iterable[str | Path],
    out_dir: str | Path,
    settings: ScreenSettings | None = None,
    *,
    on_error: Callable[[str], None] | None = None,
    progress: Progress | None = None,
    jobs: int = 1,
    sheets: bool = True,
    field: bool = True,
    field_smear: bool = False,
    force: bool = False,
    backend: Backend | None = None,
    faults=None,
    spreads=None,
    time_limit_s: float | None = None,
    overview: bool = True,
    locations: str | Path | None = None,
) -> BatchReport:
    """Screen every LAS file under ``paths`` and write results below ``out_dir``.

    Each file gets its own folder (see :func:`logprep.report.writers.folder_name`) holding
    ``layers.csv``, ``juxtapositions.csv``, ``sgr_field.npz``, ``sheet.pdf``, ``sheet.png``
    and the other per-well files; ``out_dir/summary.csv`` lists every file in input order
    with ``status`` ``ok``, ``error`` or (while the run goes on, or after it was killed)
    ``pending``; ``out_dir/logprep-settings.toml`` holds the settings used (see
    :mod:`logprep.run.config`) and ``out_dir/logprep-manifest.jsonl`` what each folder was made
    from.  Wells unchanged since the last run on ``out_dir`` are skipped unless ``force``.

    Any failure of one file is recorded (and passed to ``on_error``) and the batch goes on;
    an unexpected exception (a bug) also appends its traceback to
    ``logprep-internal-errors.log`` in ``out_dir`` and counts in
    :attr:`BatchReport.internal_errors`; ``time_limit_s`` bounds each well's time (None:
    the setting ``well_time_limit_s``).  Paths
    passed over while scanning are in :attr:`BatchReport.scan_skipped`.  ``jobs`` > 1 screens wells
    in that many worker processes, ``backend`` on a Dask cluster (results are the same);
    ``sheets=False`` skips the PDF/PNG sheets, ``field=False`` the SGR field file and
    ``field_smear`` adds the smear fields to it.

    After the wells, the field overview (``overview.html`` to open in a browser and the
    one-page ``overview.pdf``, see :mod:`logprep.report.overview`) is written in
    ``out_dir`` from what the folder holds, well locations from the LAS headers or the
    ``locations`` file; ``overview=False`` leaves it out (remake it at any time with
    :func:`logprep.report.overview_files.write_overview` or ``logprep overview DIR``).
    """
    settings = settings if settings is not None else ScreenSettings()
    backend = backend if backend is not None else Backend(jobs=jobs)
    out = Path(out_dir)
    scan = scan_las_files(paths, out)
    files = scan.files
    if not files:
        raise LogprepError(f"no .las files found in {', '.join(map(str, paths))}"
                           + (f" ({scan.summary_line()})" if scan.skipped else "")
                           + "; name LAS files or folders that hold them")
    if overview and locations is not None:
        from logprep.io.locations import read_locations

        read_locations(locations)  # a bad locations file is found before any well runs
    # inputs shared by every well are checked once, before any well is screened
    prepare_out_dir(out)
    clean_leftovers(out)
    tops = read_tops(settings.input.tops_file) if settings.input.tops_file else None
    if settings.input.survey_dir:
        check_survey_dir(settings.input.survey_dir)
    if settings.input.closures_file:
        read_closures(settings.input.closures_file)
    limit = settings.input.well_time_limit_s if time_limit_s is None else time_limit_s
    options = OutputOptions(sheets=sheets, field=field, field_smear=field_smear, time_limit_s=limit)
    run_sha = run_settings_sha256(settings, options, faults, spreads)
    taken: set[str] = set()
    folders = [well_folder_name(f, taken) for f in files]
    given = [str(f) for f in files]
    inputs = [_input_sha256(f) for f in files]
    progress = progress if progress is not None else Progress("silent")

    with Manifest(out) as manifest:
        rows: list[dict] = []
        todo: list[int] = []
        for i, folder in enumerate(folders):
            if not force and manifest.is_current(folder, inputs[i], run_sha):
                rows.append({**manifest.entries[folder]["row"], "source": given[i]})
                continue
            rows.append(pending_row(folder, given[i]))
            todo.append(i)
            if (out / folder).exists():
                mark_folder(out / folder, "being redone for other settings or input "
                            "(logprep-settings.toml describes the latest run)")
                manifest.drop(folder)
        for folder in sorted(manifest.folders("well") - set(folders)):  # pairs: run.pairs
            mark_folder(out / folder, "not part of the latest run on this folder (see "
                        "summary.csv and logprep-settings.toml)")
            manifest.drop(folder)
        write_settings(out / SETTINGS_FILE_NAME, settings, uncertainty=spreads)
        summary = write_summary(rows, out)
        report = BatchReport(summary, rows, skipped=len(files) - len(todo),
                             scan_skipped=scan.skipped, scan_line=scan.summary_line())
        progress.start(len(files), report.skipped)
        # workers read by absolute path (their working folder may differ) but name the
        # file as given; the survey folder likewise
        worker_settings = settings.updated(**{k: readable_path(getattr(settings.input, k))
                                              for k in ("survey_dir", "closures_file")
                                              if getattr(settings.input, k)})
        if backend.uses_dask or backend.jobs > 1:
            todo = biggest_first(todo, files)
        tasks = [(given[i], readable_path(files[i]), folders[i]) for i in todo]
        last = time.monotonic()
        try:
            for k, outcome in run_tasks(screen_well_task, tasks, backend,
                                        shared=(worker_settings, tops, options, (faults, spreads))):
                i = todo[k]
                if isinstance(outcome, TaskLost):
                    row = {**pending_row(folders[i], given[i]), "status": "error",
                           "message": f"{given[i]}: {outcome.message}"}
                else:
                    row = outcome.row
                    if row.get("traceback"):
                        log_internal(out, row["source"], row.pop("traceback"))
                    report.outcomes[folders[i]] = outcome
                    if outcome.files is not None:
                        t0 = time.perf_counter()
                        sums = commit_folder(out, folders[i], outcome.files)
                        outcome.timings_s["writing"] = time.perf_counter() - t0
                        manifest.record(folders[i], source=given[i], input_sha=inputs[i],
                                        settings_sha=run_sha, outputs=sums, row=row,
                                        sizes={n: len(b) for n, b in outcome.files.items()})
                rows[i] = row
                if row["status"] != "ok" and on_error:
                    on_error(row["message"])
                progress.finished(folders[i], row["status"], _detail(row), row["message"])
                if time.monotonic() - last >= SUMMARY_EVERY_S:
                    write_summary(rows, out)
                    last = time.monotonic()
        finally:
            progress.close()
            write_summary(rows, out)
            manifest.compact()
    if settings.input.survey_dir:
        names = [r["well"] for r in rows] + [Path(r["source"]).stem for r in rows]
        report.warnings = unmatched_survey_warnings(settings.input.survey_dir, names)
    if overview:
        from logprep.report.overview_files import write_overview

        report.overview = write_overview(out, locations)
    return report


def biggest_first(todo: list[int], files: list[Path]) -> list[int]:
    """``todo`` with the largest input files first (ties in input order): with several
    workers the long wells then start early instead of leaving one worker busy at the end
    (longest-first scheduling, common practice, no source)."""
    def size(i: int) -> int:
        try:
            return files[i].stat().st_size
        except OSError:
            return 0
    return sorted(todo, key=lambda i: (-size(i), i))


def _input_sha256(path: Path) -> str:
    try:
        return file_sha256(path)
    except OSError:
        return ""  # unreadable: the well task reports it


def _detail(row: dict) -> str:
    if row["status"] != "ok":
        return ""
    return f"{row['layers']} layers, {row['sand_sand_windows']} windows"
