"""Batch screening over files and folders: one well's failure never stops the others."""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path
from typing import Callable, Iterable

from logprep.config import SETTINGS_FILE_NAME, write_settings
from logprep.errors import LogprepError
from logprep.outputs import folder_name, render_well, write_summary, write_well
from logprep.pipeline import ScreenSettings, screen_file
from logprep.tops import read_tops


def find_las_files(paths: Iterable[str | Path]) -> list[Path]:
    """LAS files named directly, or found recursively (``.las`` in any case) below folders,
    in sorted order without repeats.  A path that does not exist raises
    :class:`LogprepError`."""
    found: list[Path] = []
    for p in map(Path, paths):
        if p.is_dir():
            found += sorted(q for q in p.rglob("*") if q.is_file() and q.suffix.lower() == ".las")
        elif p.is_file():
            found.append(p)
        else:
            raise LogprepError(f"{p}: no such file or folder")
    seen, unique = set(), []
    for f in found:
        key = f.resolve()
        if key not in seen:
            seen.add(key)
            unique.append(f)
    return unique


@dataclass
class BatchReport:
    summary_path: Path
    rows: list[dict]

    @property
    def failures(self) -> list[dict]:
        return [r for r in self.rows if r["status"] != "ok"]


def screen_paths(
    paths: Iterable[str | Path],
    out_dir: str | Path,
    settings: ScreenSettings = ScreenSettings(),
    *,
    on_error: Callable[[str], None] | None = None,
    progress: Callable[[Iterable], Iterable] | None = None,
) -> BatchReport:
    """Screen every LAS file under ``paths`` and write results below ``out_dir``.

    Each file gets its own folder (see :func:`logprep.outputs.folder_name`) holding
    ``layers.csv``, ``juxtapositions.csv``, ``sheet.pdf`` and ``sheet.png``;
    ``out_dir/summary.csv`` lists every file with ``status`` ``ok`` or ``error``, and
    ``out_dir/logprep-settings.toml`` holds the settings used (see :mod:`logprep.config`).  A
    :class:`LogprepError` for one file is recorded (and passed to ``on_error``) and the
    batch goes on; any other exception is a bug and propagates.
    """
    from logprep.sheet import build_sheet  # drawing is imported only when needed

    out = Path(out_dir)
    files = find_las_files(paths)
    if not files:
        raise LogprepError(f"no .las files found in {', '.join(map(str, paths))}")
    tops = read_tops(settings.tops_file) if settings.tops_file else None
    write_settings(out / SETTINGS_FILE_NAME, settings)
    taken: set[str] = set()
    rows: list[dict] = []
    iterator = progress(files) if progress else files
    for f in iterator:
        name = folder_name(f, taken)
        row = {"well": name, "source": str(f), "status": "ok", "message": "",
               "layers": "", "sand_sand_windows": "", "min_window_sgr_pct": "", "folder": ""}
        try:
            result = screen_file(f, settings, tops=tops)
            files_out = render_well(result, build_sheet)
            write_well(files_out, out / name)
        except LogprepError as exc:
            msg = str(exc).splitlines()[0] if str(exc) else type(exc).__name__
            if str(f) not in msg:
                msg = f"{f}: {msg}"
            row.update(status="error", message=msg)
            if on_error:
                on_error(msg)
        else:
            cross = result.windows[~result.windows["self_juxtaposed"]]
            row.update(
                well=result.well.name, layers=len(result.layers),
                sand_sand_windows=len(cross),
                min_window_sgr_pct=round(result.min_window_sgr_pct, 3),
            )
            row["folder"] = name
        rows.append(row)
        summary = write_summary(rows, out)
    return BatchReport(summary_path=summary, rows=rows)
