"""Progress of a batch on stderr: a bar on a terminal, one line per finished well otherwise
(a log file, a scheduler's output), nothing with ``--quiet``.  Error lines go through the
same object so that they do not tear the bar."""

from __future__ import annotations

import sys
import time
from typing import TextIO


class Progress:
    """Reports wells as they finish.

    Parameters
    ----------
    mode : str
        ``"auto"`` (a bar when ``stream`` is a terminal and tqdm is installed, else lines),
        ``"bar"``, ``"lines"``, ``"quiet"`` (nothing but error lines) or ``"silent"``
        (nothing at all: the Python API's default, where the report carries the errors).
    stream : file
        Where to write (default: stderr).
    unit : str
        What is counted (``"well"``, ``"pair"``).
    """

    def __init__(self, mode: str = "auto", stream: TextIO | None = None, unit: str = "well"):
        self.stream = stream if stream is not None else sys.stderr
        self.unit = unit
        if mode == "auto":
            mode = "bar" if _isatty(self.stream) else "lines"
        self.mode = mode
        self._bar = None
        self.total = self.done = 0
        self._t0 = time.perf_counter()

    def start(self, total: int, skipped: int = 0) -> None:
        """``total`` tasks in the run, of which ``skipped`` were already done."""
        self.total, self.done = total, skipped
        self._t0 = time.perf_counter()
        if self.mode == "bar":
            try:
                from tqdm import tqdm
            except ImportError:
                self.mode = "lines"
            else:
                self._bar = tqdm(total=total, initial=skipped, unit=self.unit, file=self.stream,
                                 dynamic_ncols=True, leave=True)
        if self.mode == "lines" and skipped:
            self._line(f"{skipped} of {total} {self.unit}(s) unchanged since the last run, skipped")

    def _line(self, text: str) -> None:
        print(text, file=self.stream, flush=True)

    def finished(self, name: str, status: str, detail: str = "", message: str = "") -> None:
        """One task finished: ``status`` ``ok`` or ``error`` (with its one-line ``message``,
        shown in every mode but ``silent``)."""
        self.done += 1
        if self._bar is not None:
            self._bar.set_postfix_str(name, refresh=False)
            self._bar.update(1)
            if status != "ok":
                self.error(message)
        elif self.mode == "lines":
            width = len(str(self.total))
            head = f"[{self.done:>{width}}/{self.total}]"
            if status != "ok":  # the same `error: FILE: ...` line as in every other mode
                self._line(f"error: {message}")
            else:
                tail = f" ({detail})" if detail else ""
                self._line(f"{head} {name}: {status}{tail} {time.perf_counter() - self._t0:.1f} s")
        elif status != "ok":
            self.error(message)

    def error(self, message: str) -> None:
        """An error line (shown in every mode but ``silent``, above the bar)."""
        if self.mode == "silent":
            return
        if self._bar is not None:
            self._bar.write(f"error: {message}", file=self.stream)
        else:
            self._line(f"error: {message}")

    def close(self) -> None:
        if self._bar is not None:
            self._bar.close()
            self._bar = None


def _isatty(stream) -> bool:
    try:
        return bool(stream.isatty())
    except (AttributeError, ValueError):
        return False
