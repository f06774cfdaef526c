"""Putting a well's folder in place so that it is complete or visibly marked, never partial.

A well's files are written into a work folder (``<out>/.logprep-work/``) and the finished
folder is then renamed into place: one rename, so a run killed at any moment leaves either
the earlier folder, no folder, or the new complete one.  A folder whose results no longer
match the run (other settings or input, being redone) carries :data:`MARK_NAME` until it is
replaced.  The work folder and hidden temporary files of a killed run are removed at the
start of the next run (:func:`clean_leftovers`).

The data reach the operating system before each rename, which is all a killed process
needs; they are not forced to the disk (no fsync), so a power cut may still lose the
last wells - the run manifest then sees the difference and redoes them.
"""

from __future__ import annotations

import contextlib
import hashlib
import itertools
import os
import shutil
from pathlib import Path

from logprep.errors import OutputError

WORK_DIR_NAME = ".logprep-work"
"""Hidden folder under ``--out`` where wells are assembled before they are moved in place."""

MARK_NAME = "INCOMPLETE.txt"
"""Marker file of a well folder whose results are not those of the latest settings or input."""

_counter = itertools.count()


def _umask() -> int:
    mask = os.umask(0)
    os.umask(mask)
    return mask


def _cannot(path: Path, exc: OSError) -> OutputError:
    return OutputError(f"{path}: cannot write ({exc.strerror or exc}); check the space and "
                       "permissions of the output folder, or give another --out")


def sha256_bytes(data: bytes) -> str:
    return hashlib.sha256(data).hexdigest()


def write_file_atomic(path: Path, data: bytes) -> None:
    """Write ``data`` to ``path`` through a hidden temporary file in the same folder and one
    rename; the file gets the usual permissions (0666 less the umask)."""
    path = Path(path)
    tmp = path.with_name(f".{path.name}.{os.getpid()}-{next(_counter)}.tmp")
    try:
        path.parent.mkdir(parents=True, exist_ok=True)
        with open(tmp, "wb") as f:
            f.write(data)
        os.chmod(tmp, 0o666 & ~_umask())
        os.replace(tmp, path)
    except OSError as exc:
        with contextlib.suppress(OSError):  # not there, or its folder is not a folder
            tmp.unlink()
        raise _cannot(path, exc) from exc


def commit_folder(out_dir: Path, name: str, files: dict[str, bytes]) -> dict[str, str]:
    """Replace ``out_dir/name`` by a folder holding exactly ``files`` (name -> bytes).

    Returns the sha256 of every file.  The folder is assembled under
    :data:`WORK_DIR_NAME` and renamed into place; an earlier folder of that name is moved
    aside first and removed after.
    """
    out_dir = Path(out_dir)
    work = out_dir / WORK_DIR_NAME
    tag = f"{os.getpid()}-{next(_counter)}"
    new = work / f"{name}.{tag}.new"
    old = work / f"{name}.{tag}.old"
    target = out_dir / name
    try:
        new.mkdir(parents=True)
        mode = 0o666 & ~_umask()
        for fname, data in files.items():
            p = new / fname
            with open(p, "wb") as f:
                f.write(data)
            os.chmod(p, mode)
        os.chmod(new, 0o777 & ~_umask())
        if target.exists():
            os.rename(target, old)
        os.rename(new, target)
    except OSError as exc:
        raise _cannot(target, exc) from exc
    finally:
        shutil.rmtree(new, ignore_errors=True)
        shutil.rmtree(old, ignore_errors=True)
        with contextlib.suppress(OSError):
            work.rmdir()  # gone once empty: no hidden folder left after a run
    return {fname: sha256_bytes(data) for fname, data in files.items()}


def mark_folder(folder: Path, reason: str) -> None:
    """Put :data:`MARK_NAME` with ``reason`` into an existing well folder."""
    if Path(folder).is_dir():
        write_file_atomic(Path(folder) / MARK_NAME,
                          f"These results are incomplete or out of date: {reason}\n"
                          "Do not use them; rerun logprep on the same --out to bring them "
                          "up to date.\n".encode())


def folder_matches(folder: Path, sizes: dict[str, int]) -> bool:
    """True when ``folder`` holds exactly the files of ``sizes`` (name -> bytes), each of
    that size, and no :data:`MARK_NAME`."""
    folder = Path(folder)
    try:
        present = {p.name: p.stat().st_size for p in folder.iterdir() if p.is_file()}
    except OSError:
        return False
    return present == sizes


def clean_leftovers(out_dir: Path) -> int:
    """Remove what a killed run left behind: the work folder and this module's hidden
    temporary files at the top of ``out_dir`` and one level down.  Returns how many
    were removed."""
    out_dir = Path(out_dir)
    n = 0
    work = out_dir / WORK_DIR_NAME
    if work.exists():
        shutil.rmtree(work, ignore_errors=True)
        n += 1
    for pattern in (".*.tmp", "*/.*.tmp"):
        for p in out_dir.glob(pattern):
            if p.is_file():
                p.unlink(missing_ok=True)
                n += 1
    return n
