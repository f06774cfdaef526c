"""Batch throughput on the bundled example wells, as ratios against a baseline measured in
the same run: reading the LAS files with lasio alone (the floor any LAS tool pays).

Prints, per well: lasio read (baseline), the screening science (read + Vsh + blocking +
windows + SGR field + capacity), a tables-only batch (``--no-sheet``), a full batch with
sheets, and the full batch on two worker processes.

Run:  python bench/bench_batch.py [--repeat N]
"""

from __future__ import annotations

import argparse
import tempfile
from pathlib import Path

import lasio
from timing import best_time_s

from logprep.run.batch import find_las_files, screen_paths
from logprep.io.examples import example_logs_dir
from logprep.run.pipeline import screen_file
from logprep.run.settings import ScreenSettings


def best_of(repeat, fn):
    return best_time_s(fn, repeat)


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--repeat", type=int, default=2)
    args = ap.parse_args()
    demo = example_logs_dir()
    files = find_las_files([demo])
    settings = ScreenSettings()
    n = len(files)

    read = best_of(args.repeat, lambda: [lasio.read(str(f)) for f in files]) / n
    science = best_of(args.repeat, lambda: [screen_file(f, settings) for f in files]) / n
    with tempfile.TemporaryDirectory() as tmp:
        tables = best_of(args.repeat, lambda: screen_paths(
            [demo], Path(tmp) / "t", settings, sheets=False)) / n
        full = best_of(1, lambda: screen_paths([demo], Path(tmp) / "f", settings)) / n
        full2 = best_of(1, lambda: screen_paths([demo], Path(tmp) / "j", settings, jobs=2)) / n

    print(f"{n} example wells; seconds per well and ratio to the lasio read baseline")
    rows = [
        ("lasio read only (baseline)", read),
        ("screening science (no files written)", science),
        ("batch, tables only (--no-sheet)", tables),
        ("batch with sheets", full),
        ("batch with sheets, --jobs 2", full2),
    ]
    for name, t in rows:
        print(f"  {name:<40} {t:7.3f} s   {t / read:6.1f} x")
    print(f"  speed-up of --jobs 2 over one process: {full / full2:.2f} x "
          "(at most the number of free cores)")
    print(f"  sheets cost {full / tables:.1f} x a tables-only run")


if __name__ == "__main__":
    main()
