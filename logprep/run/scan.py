"""Finding the LAS files of a run, and saying which paths were passed over and why.

A folder is walked without following links to folders; a file counts once however many
names (links) lead to it; the output folder of the run and every LAS file logprep itself
wrote (its ``curves.las`` exports) are never taken as input, so a rerun with ``--out``
inside the input folder screens the same wells as the first run.  Every path passed over
is kept with its reason, for one summary line.
"""

from __future__ import annotations

import os
from collections import Counter
from dataclasses import dataclass, field
from pathlib import Path
from collections.abc import Iterable

from logprep.errors import LogprepError
from logprep.io.safetext import show_path

EXPORT_MARK = b"Curves computed by logprep"
"""Text in the ~Other section of every LAS file logprep writes (see
:mod:`logprep.report.lasexport`): such files are results, not inputs."""


@dataclass
class Scan:
    """LAS files found (sorted, unique) and the paths passed over, ``(path, reason)``."""

    files: list[Path] = field(default_factory=list)
    skipped: list[tuple[str, str]] = field(default_factory=list)

    def summary_line(self) -> str | None:
        """``skipped N path(s) while scanning: 2 duplicate ..., 1 unreadable ...
        (first: PATH)``, or None when nothing was skipped."""
        if not self.skipped:
            return None
        counts = Counter(reason for _, reason in self.skipped)
        parts = ", ".join(f"{n} {reason}" for reason, n in sorted(counts.items()))
        return (f"skipped {len(self.skipped)} path(s) while scanning: {parts} "
                f"(first: {self.skipped[0][0]})")


def is_logprep_output(path: Path) -> bool:
    """True for a LAS file that logprep wrote (its export mark in the first 64 KiB)."""
    try:
        with path.open("rb") as f:
            return EXPORT_MARK in f.read(65536)
    except OSError:
        return False


def _inside(path: Path, folder: Path | None) -> bool:
    if folder is None:
        return False
    try:
        path.resolve().relative_to(folder)
        return True
    except (ValueError, OSError):
        return False


def _walk(top: Path, scan: Scan, out: Path | None) -> list[Path]:
    found = []

    def unreadable(err: OSError) -> None:
        scan.skipped.append((show_path(err.filename or top), "unreadable folder(s)"))

    for folder, dirs, names in os.walk(top, onerror=unreadable, followlinks=False):
        here = Path(folder)
        if _inside(here, out):
            scan.skipped.append((show_path(here), "output folder(s) of this run"))
            dirs[:] = []
            continue
        for d in dirs:
            if (here / d).is_symlink():
                scan.skipped.append((show_path(here / d), "linked folder(s) not followed"))
        dirs.sort()
        for name in sorted(names):
            if name.lower().endswith(".las"):
                found.append(here / name)
    return found


def scan_las_files(paths: Iterable[str | Path], out_dir: str | Path | None = None) -> Scan:
    """LAS files named directly, or found recursively (``.las`` in any case) below
    folders, in sorted order, each file once; ``out_dir`` and logprep's own exports are
    passed over.  A path that does not exist raises :class:`LogprepError`."""
    scan = Scan()
    out = Path(out_dir).resolve() if out_dir is not None and Path(out_dir).exists() else None
    candidates: list[Path] = []
    for p in map(Path, paths):
        if p.is_dir():
            candidates += _walk(p, scan, out)
        elif p.is_file():
            candidates.append(p)
        else:
            raise LogprepError(f"{show_path(p)}: no such file or folder; check the path")
    seen: set = set()
    for f in candidates:
        try:
            st = f.stat()
        except OSError:
            scan.skipped.append((show_path(f), "broken link(s) or unreadable file(s)"))
            continue
        if not os.path.isfile(f):
            scan.skipped.append((show_path(f), "not regular file(s)"))
            continue
        key = (st.st_dev, st.st_ino)
        if key in seen:
            scan.skipped.append((show_path(f), "duplicate(s) of a file already listed"))
            continue
        if is_logprep_output(f):
            scan.skipped.append((show_path(f), "LAS file(s) written by logprep"))
            continue
        seen.add(key)
        scan.files.append(f)
    return scan


def find_las_files(paths: Iterable[str | Path], out_dir: str | Path | None = None) -> list[Path]:
    """The files of :func:`scan_las_files` (without the report)."""
    return scan_las_files(paths, out_dir).files
