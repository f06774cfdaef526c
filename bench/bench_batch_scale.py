"""Batch scaling on a generated folder of 60 wells: one process, two worker processes and a
two-worker local Dask cluster, timed in the same run, with their ratios.

The wells (``bench/make_batch_wells.py``): ``--n-big`` of 20,000 samples, the rest 3,000-7,000,
one logged in feet, two that fail (no gamma ray; not LAS).  Prints, per backend, the wall
time (best of ``--repeat``; the Dask time includes starting the cluster) and its ratio to one
process (target >= 1.7 on two free cores); the per-well split into ingest / compute /
drawing / encoding (in the worker) and writing (in the main process); peak memory per worker
process; whether the three runs wrote byte-identical outputs; and the largest folder of a
20,000-sample well against the 4 MiB budget.

Run:  python bench/bench_batch_scale.py [--repeat N] [--n 60] [--n-big 4] [--no-sheet]
"""

from __future__ import annotations

import argparse
import tempfile
import time
from collections import defaultdict
from pathlib import Path

from make_batch_wells import BIG_SAMPLES, make_wells

from logprep.run.batch import screen_paths
from logprep.run.executor import Backend
from logprep.run.settings import ScreenSettings
from logprep.run.welltask import STAGES

FOLDER_BUDGET_BYTES = 4 * 1024 * 1024


def tree(root: Path) -> dict[str, bytes]:
    return {p.relative_to(root).as_posix(): p.read_bytes() for p in sorted(root.rglob("*")) if p.is_file()}


def timed_run(src: Path, out: Path, backend: Backend, sheets: bool, repeat: int):
    best, report = float("inf"), None
    for _ in range(repeat):
        t0 = time.perf_counter()
        report = screen_paths([src], out, ScreenSettings(), backend=backend, sheets=sheets, force=True)
        best = min(best, time.perf_counter() - t0)
    return best, report


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--repeat", type=int, default=1)
    ap.add_argument("--n", type=int, default=60)
    ap.add_argument("--n-big", type=int, default=4)
    ap.add_argument("--no-sheet", action="store_true")
    args = ap.parse_args()
    sheets = not args.no_sheet
    with tempfile.TemporaryDirectory() as tmp:
        tmp = Path(tmp)
        src = tmp / "wells"
        make_wells(src, args.n, args.n_big)
        backends = {"--jobs 1": Backend(jobs=1), "--jobs 2": Backend(jobs=2),
                    "--dask-local 2": Backend(dask_local=2)}
        results = {}
        for name, backend in backends.items():
            out = tmp / name.strip("-").replace(" ", "")
            results[name] = (*timed_run(src, out, backend, sheets, args.repeat), out)
        base = results["--jobs 1"][0]
        report1 = results["--jobs 1"][1]
        ok = len(report1.rows) - len(report1.failures)
        print(f"{args.n} wells ({args.n_big} of {BIG_SAMPLES} samples, one in feet, "
              f"{len(report1.failures)} failing), sheets {'on' if sheets else 'off'}; "
              f"{ok} screened")
        print(f"  {'backend':<16} {'wall s':>8} {'speed-up vs --jobs 1':>22}")
        for name, (t, _, _) in results.items():
            print(f"  {name:<16} {t:8.1f} {base / t:22.2f} x")
        print("  target: >= 1.7 x for two workers on two free cores")

        split = defaultdict(float)
        peaks = defaultdict(float)
        for outcome in report1.outcomes.values():
            for stage in (*STAGES, "writing"):
                split[stage] += outcome.timings_s.get(stage, 0.0)
        for name in results:
            for outcome in results[name][1].outcomes.values():
                peaks[(name, outcome.worker)] = max(peaks[(name, outcome.worker)], outcome.peak_rss_mb)
        total = sum(split.values())
        print(f"  per-well split (--jobs 1, {len(report1.outcomes)} wells, {total / max(ok, 1):.2f} s per well):")
        for stage in (*STAGES, "writing"):
            print(f"    {stage:<9} {split[stage] / max(ok, 1):7.3f} s   {split[stage] / total:6.1%}")
        print("  peak memory per worker process (MB):")
        for (name, worker), mb in sorted(peaks.items()):
            print(f"    {name:<16} {worker:<28} {mb:8.0f}")
        trees = {name: tree(out) for name, (_, _, out) in results.items()}
        same = all(t == trees["--jobs 1"] for t in trees.values())
        print(f"  outputs byte-identical across the three runs: {'yes' if same else 'NO'}")
        out1 = results["--jobs 1"][2]
        big = [r["folder"] for r in report1.rows[: args.n_big] if r["status"] == "ok"]
        if big:
            size = max(sum(p.stat().st_size for p in (out1 / f).iterdir()) for f in big)
            print(f"  largest {BIG_SAMPLES}-sample well folder: {size / 2**20:.2f} MiB = "
                  f"{size / FOLDER_BUDGET_BYTES:.2f} x the 4 MiB budget")


if __name__ == "__main__":
    main()
