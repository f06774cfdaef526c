"""The run manifest ``logprep-manifest.jsonl``: which wells in ``--out`` are done, from what.

One JSON object per line.  A line is appended (and flushed) as each well's folder is put in
place, so the cost per well stays constant however large the batch, and a run killed in
the middle of a line loses only that line (an unreadable last line is ignored).  Later lines
override earlier ones for the same folder.  At the end of a run the file is rewritten with
one line per folder, sorted, through a temporary file and a rename.

A well line holds::

    {"folder": "HRM-1", "source": "logs/HRM-1.las", "input_sha256": "...",
     "settings_sha256": "...", "outputs": {"layers.csv": ["<sha256>", <bytes>], ...},
     "row": {<the well's summary.csv row>}}

and ``{"folder": ..., "drop": true}`` forgets a folder.  A rerun skips a well whose input
hash and settings hash are unchanged and whose folder still holds exactly the recorded
files at the recorded sizes (see :func:`logprep.run.store.folder_matches`).
"""

from __future__ import annotations

import hashlib
import json
import os
from pathlib import Path
from typing import Self

from logprep.errors import OutputError
from logprep.run.store import folder_matches, write_file_atomic

MANIFEST_NAME = "logprep-manifest.jsonl"


def file_sha256(path: str | Path, chunk: int = 1 << 20) -> str:
    """sha256 (hex) of a file's bytes, read in chunks."""
    h = hashlib.sha256()
    with open(path, "rb") as f:
        while block := f.read(chunk):
            h.update(block)
    return h.hexdigest()


def tree_sha256(path: str | Path | None) -> str:
    """sha256 over a file, or over every file below a folder (relative names and bytes,
    in sorted order); ``""`` for None.  Used for the inputs shared by all wells (tops,
    surveys), which belong to the settings hash."""
    if not path:
        return ""
    p = Path(path)
    if p.is_file():
        return file_sha256(p)
    h = hashlib.sha256()
    for f in sorted(q for q in p.rglob("*") if q.is_file()):
        h.update(f.relative_to(p).as_posix().encode() + b"\0" + file_sha256(f).encode())
    return h.hexdigest()


def settings_sha256(settings: dict, extra: dict) -> str:
    """sha256 of the settings (a flat dict) and ``extra`` (output options, logprep version,
    hashes of shared inputs), as canonical JSON."""
    blob = json.dumps({"settings": settings, "extra": extra}, sort_keys=True, default=str)
    return hashlib.sha256(blob.encode()).hexdigest()


class Manifest:
    """The manifest of one output folder (see the module docstring)."""

    def __init__(self, out_dir: str | Path):
        self.out_dir = Path(out_dir)
        self.path = self.out_dir / MANIFEST_NAME
        self.entries: dict[str, dict] = {}
        self._fh = None
        if self.path.exists():
            self._load()

    def _load(self) -> None:
        try:
            lines = self.path.read_text(encoding="utf-8").splitlines()
        except (OSError, UnicodeDecodeError):
            return  # unreadable: start afresh, every well is redone
        for line in lines:
            try:
                rec = json.loads(line)
            except json.JSONDecodeError:
                continue  # a line cut short by a kill
            if not isinstance(rec, dict) or "folder" not in rec:
                continue
            if rec.get("drop"):
                self.entries.pop(rec["folder"], None)
            elif "input_sha256" in rec:
                self.entries[rec["folder"]] = rec

    def is_current(self, folder: str, input_sha: str, settings_sha: str) -> bool:
        """True when ``folder`` was written from this input and these settings and still
        holds exactly its recorded files."""
        e = self.entries.get(folder)
        if not e or e.get("input_sha256") != input_sha or e.get("settings_sha256") != settings_sha:
            return False
        sizes = {name: int(v[1]) for name, v in e.get("outputs", {}).items()}
        return folder_matches(self.out_dir / folder, sizes)

    def _append(self, rec: dict) -> None:
        try:
            if self._fh is None:
                self._fh = open(self.path, "a", encoding="utf-8")  # noqa: SIM115 (kept open for the run)
            self._fh.write(json.dumps(rec, sort_keys=True) + "\n")
            self._fh.flush()
        except OSError as exc:
            raise OutputError(f"{self.path}: cannot write ({exc.strerror or exc}); check the "
                              "space and permissions of the output folder, or give another --out") from exc

    def record(self, folder: str, *, source: str, input_sha: str, settings_sha: str,
               outputs: dict[str, str], sizes: dict[str, int], row: dict) -> None:
        """Note a well folder put in place (``outputs``: file -> sha256, ``sizes``: file -> bytes)."""
        rec = {"folder": folder, "source": source, "input_sha256": input_sha,
               "settings_sha256": settings_sha,
               "outputs": {k: [outputs[k], int(sizes[k])] for k in sorted(outputs)}, "row": row}
        self.entries[folder] = rec
        self._append(rec)

    def drop(self, folder: str) -> None:
        """Forget ``folder`` (its results are being redone or are no longer valid)."""
        if folder in self.entries:
            del self.entries[folder]
            self._append({"folder": folder, "drop": True})

    def close(self) -> None:
        if self._fh is not None:
            self._fh.close()
            self._fh = None

    def compact(self) -> None:
        """Rewrite the file with one line per folder, sorted (the end of a run)."""
        self.close()
        text = "".join(json.dumps(self.entries[k], sort_keys=True) + "\n" for k in sorted(self.entries))
        write_file_atomic(self.path, text.encode("utf-8"))

    def __enter__(self) -> Self:
        return self

    def __exit__(self, *exc) -> None:
        self.close()


def readable_path(path: str | Path) -> str:
    """An absolute form of ``path`` for worker processes or machines whose working folder
    differs (the path as given is kept for the outputs)."""
    return os.path.abspath(os.fspath(path))
