"""Containment of one well's failure: a time limit per well, and unexpected exceptions
turned into an error row plus a full traceback in a log file.

A batch must finish whatever one file does.  :func:`contained` runs one well's work and
returns either its result or an :class:`Outcome` describing the failure: a
:class:`~logprep.errors.LogprepError` (a problem the user can fix) keeps its message;
anything else is a bug in logprep, reported as ``internal error`` with its traceback so
it can be fixed, without stopping the run.  The time limit uses ``SIGALRM`` and so
applies where the well runs in a process's main thread (``--jobs 1`` and worker
processes); elsewhere the well runs without one.
"""

from __future__ import annotations

import signal
import sys
import threading
import time
import traceback
from contextlib import contextmanager
from dataclasses import dataclass
from pathlib import Path

from logprep.errors import LogprepError
from logprep.io.safetext import escape_line, show_path

INTERNAL_LOG_NAME = "logprep-internal-errors.log"
"""File in the output folder that collects the traceback of every internal error."""


class WellTimeLimitError(LogprepError, TimeoutError):
    """One well took longer than the per-well time limit."""


@dataclass
class Outcome:
    """How one well's work failed: ``message`` (one line, ``FILE: what; what to do``),
    ``internal`` True for an unexpected exception, whose ``traceback`` is kept."""

    message: str
    internal: bool = False
    traceback: str = ""


@contextmanager
def time_limit(seconds: float | None, where: str, limit: str = "the per-well time limit"):
    """Raise :class:`WellTimeLimitError` in the block after ``seconds`` (None or 0: no
    limit; also none outside the main thread or where ``SIGALRM`` does not exist);
    ``limit`` names the limit in the message."""
    usable = (seconds and seconds > 0 and hasattr(signal, "SIGALRM")
              and threading.current_thread() is threading.main_thread())
    if not usable:
        yield
        return

    def expire(signum, frame):
        raise WellTimeLimitError(
            f"{where + ': ' if where else ''}still running after {limit} of {seconds:g} s; raise it "
            "with --well-time-limit (well_time_limit_s in a settings file; 0 = none) "
            "or check the file (size, sampling)")

    previous = signal.signal(signal.SIGALRM, expire)
    signal.setitimer(signal.ITIMER_REAL, seconds)
    try:
        yield
    finally:
        signal.setitimer(signal.ITIMER_REAL, 0)
        signal.signal(signal.SIGALRM, previous)


def exception_line(exc: BaseException) -> str:
    """``Type: first line of the message`` (160 characters at most), escaped for one line."""
    detail = escape_line(str(exc).strip().splitlines()[0][:160]) if str(exc).strip() else ""
    return f"{type(exc).__name__}{': ' + detail if detail else ''}"


def failure(exc: BaseException, path: Path, *, prefix: bool = True) -> Outcome:
    """The :class:`Outcome` of an exception raised while screening ``path`` (its message
    starts with the path unless ``prefix`` is False: a caller that names the item itself,
    such as a well pair)."""
    where = show_path(path)
    if isinstance(exc, LogprepError):
        msg = escape_line(str(exc).splitlines()[0] if str(exc).strip() else type(exc).__name__)
        if prefix and not msg.startswith(where):
            msg = f"{where}: {msg}"
        return Outcome(msg)
    return Outcome(
        f"{where + ': ' if prefix else ''}internal error ({exception_line(exc)}); the rest of the batch goes on: "
        f"please report this with {INTERNAL_LOG_NAME} from the output folder",
        internal=True,
        traceback="".join(traceback.format_exception(type(exc), exc, exc.__traceback__)),
    )


def log_internal(out_dir: Path, path: str, trace: str) -> None:
    """Append one internal error's traceback to :data:`INTERNAL_LOG_NAME` in ``out_dir``."""
    stamp = time.strftime("%Y-%m-%dT%H:%M:%SZ", time.gmtime())
    with (Path(out_dir) / INTERNAL_LOG_NAME).open("a", encoding="utf-8", errors="backslashreplace") as f:
        f.write(f"--- {stamp} {escape_line(path)}\n{trace}\n")


def contained_screen(work, path: Path, time_limit_s: float | None, *, prefix: bool = True,
                     limit: str = "the per-well time limit"):
    """``(work(), None)``, or ``(None, Outcome)`` when it raised anything (a
    :class:`KeyboardInterrupt` still stops the run) or ran over ``time_limit_s``
    (``prefix`` as for :func:`failure`, ``limit`` as for :func:`time_limit`)."""
    try:
        with time_limit(time_limit_s, show_path(path) if prefix else "", limit):
            return work(), None
    except Exception as exc:  # noqa: BLE001 - containment is the point: one well never stops a batch
        return None, failure(exc, path, prefix=prefix)


def print_error(msg: str) -> None:
    """Print one failure as one escaped ``error:`` line on stderr."""
    print(f"error: {escape_line(msg)}", file=sys.stderr)


def final_line(report, out) -> str:
    """The run's last line: counts, internal errors and paths skipped while scanning."""
    ok = len(report.rows) - len(report.failures)
    bugs = internal_clause(report.internal_errors, out)
    skipped = f"; {report.scan_line}" if report.scan_line else ""
    unchanged = (f" ({report.skipped} unchanged since the last run, skipped; --force redoes them)"
                 if report.skipped else "")
    return (f"screened {len(report.rows)} file(s): {ok} ok, {len(report.failures)} failed{bugs}{unchanged}; "
            f"results in {show_path(out)}, summary {show_path(report.summary_path)}{skipped}")


def internal_clause(count: int, out) -> str:
    """`` (N internal error(s): tracebacks in OUT/logprep-internal-errors.log, please
    report)``, or nothing for none."""
    return (f" ({count} internal error(s): tracebacks in {show_path(out)}/{INTERNAL_LOG_NAME}, "
            "please report)") if count else ""


def pairs_line(rows: list[dict], out) -> str:
    """The line after the well pairs: counts, internal errors, the summary file."""
    bad = sum(r["status"] != "ok" for r in rows)
    bugs = internal_clause(sum(bool(r.get("internal")) for r in rows), out)
    same = sum(bool(r.get("unchanged")) for r in rows)  # skipped: see run.pairs.pairs_to_redo
    skipped = f" ({same} unchanged since the last run, skipped)" if same else ""
    return (f"screened {len(rows)} well pair(s): {len(rows) - bad} ok, {bad} failed{bugs}{skipped}; "
            f"summary {show_path(out)}/pairs_summary.csv")


def overview_after_batch(out_dir, locations_file=None) -> bool:
    """Write ``overview.html`` and ``overview.pdf`` after a batch and print their line.  A
    failure, the system's or logprep's, is one ``error:`` line that says how to remake the
    overview (an unexpected one's traceback goes to :data:`INTERNAL_LOG_NAME`), and the
    wells' results stand.  True when it failed."""
    from logprep.report.overview_files import write_overview

    target = Path(out_dir) / "overview.html"
    try:
        written = write_overview(out_dir, locations_file)
    except Exception as exc:  # noqa: BLE001 - the wells' results stand whatever fails here
        problem = failure(exc, target)
        remake = f"remake it with 'logprep overview {show_path(out_dir)}'"
        if not problem.internal:
            print_error(f"{problem.message}; {remake}")
            return True
        log_internal(Path(out_dir), show_path(target), problem.traceback)
        print_error(f"{show_path(target)}: field overview not written ({exception_line(exc)}); the "
                    f"wells' results are complete; {remake} once that is fixed (traceback in "
                    f"{INTERNAL_LOG_NAME})")
        return True
    print(f"field overview {written['overview.html']} (open in a browser) and {written['overview.pdf']}")
    return False
