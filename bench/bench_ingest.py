"""Reading one large LAS file: logprep's reader against lasio and the bare pandas parse,
measured in the same run (best of N), with peak memory as a multiple of the file size.

Generates an 18 MB LAS 2.0 file (200,000 rows of depth and 8 curves, 0.05 m steps, some NULLs) in a
temporary folder, then times

* ``lasio.read`` (the baseline: logprep's reader before the fast data path),
* ``logprep.io.las.read_well`` (header through lasio, ``~A`` through pandas' C parser,
  then the unit, NULL, depth and sanity checks),
* the bare ``pandas.read_csv`` of the ``~A`` section (the floor: no header, no checks).

Targets: read_well >= 5x faster than lasio, within 2x of the pandas floor, peak memory
(in a fresh process, above its memory after imports) at most 4x the file size.

Run:  python bench/bench_ingest.py [--repeat N] [--rows N]
"""

from __future__ import annotations

import argparse
import subprocess
import sys
import tempfile
from pathlib import Path

import numpy as np
from timing import best_time_s

CURVES = ["GR", "RHOB", "NPHI", "DT", "CALI", "BS", "RDEP", "PEF"]

_PEAK = """
import sys
sys.path.insert(0, {bench!r})
def status_kb(key):
    with open('/proc/self/status') as f:
        return next(int(ln.split()[1]) for ln in f if ln.startswith(key))
import lasio, numpy, pandas
from logprep.io.las import read_well
with open('/proc/self/clear_refs', 'w') as f:
    f.write('5')  # reset the peak (the parent's peak survives exec on Linux)
before = status_kb('VmRSS:')
{call}
print(max(status_kb('VmHWM:') - before, 0) * 1024)
"""


def write_big_las(path: Path, rows: int) -> int:
    rng = np.random.default_rng(7)
    depth = 1000.0 + 0.05 * np.arange(rows)
    data = np.column_stack([depth] + [rng.normal(50 + 10 * k, 5 + k, rows) for k in range(len(CURVES))])
    data[rng.random(data.shape) < 0.01] = -999.25
    data[:, 0] = depth
    head = ("~VERSION INFORMATION\n VERS.   2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0\n"
            " WRAP.   NO : ONE LINE PER DEPTH STEP\n~WELL INFORMATION\n"
            f" STRT.M  {depth[0]:.4f} :\n STOP.M  {depth[-1]:.4f} :\n STEP.M  0.05 :\n"
            " NULL.   -999.25 :\n WELL.   BENCH-1 : WELL\n~CURVE INFORMATION\n DEPT.M : DEPTH\n"
            + "".join(f" {c}.API : {c}\n" for c in CURVES) + "~A\n")
    with path.open("w") as f:
        f.write(head)
        np.savetxt(f, data, fmt="%9.4f", delimiter=" ")
    return path.stat().st_size


def pandas_floor(path: Path):
    import pandas as pd

    with path.open("rb") as f:
        skip = 0
        for line in f:
            skip += 1
            if line.lstrip().upper().startswith(b"~A"):
                break
    return pd.read_csv(path, sep=r"\s+", header=None, skiprows=skip, engine="c").to_numpy()


def peak_bytes(call: str) -> int:
    code = _PEAK.format(bench=str(Path(__file__).parent), call=call)
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    return int(out.stdout.strip().splitlines()[-1])


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--repeat", type=int, default=3)
    ap.add_argument("--rows", type=int, default=200_000)
    args = ap.parse_args()

    import lasio

    from logprep.io.las import read_well

    with tempfile.TemporaryDirectory() as tmp:
        path = Path(tmp) / "big.las"
        size = write_big_las(path, args.rows)
        ours = read_well(path)
        ref = lasio.read(str(path))
        same = all(np.array_equal(ref.curves[j + 1].data, ours.curves[c], equal_nan=True)
                   for j, c in enumerate(CURVES))
        t_lasio = best_time_s(lambda: lasio.read(str(path)), args.repeat)
        t_ours = best_time_s(lambda: read_well(path), args.repeat)
        t_floor = best_time_s(lambda: pandas_floor(path), args.repeat)
        peak_ours = peak_bytes(f"read_well({str(path)!r})")
        peak_lasio = peak_bytes(f"lasio.read({str(path)!r})")
    print(f"file: {size / 1e6:.1f} MB, {args.rows:,} rows x {len(CURVES) + 1} columns; "
          f"values identical to lasio (NULLs as NaN): {same}")
    print(f"lasio.read           {t_lasio:7.3f} s   (baseline)")
    print(f"logprep read_well    {t_ours:7.3f} s   {t_lasio / t_ours:5.1f}x faster than lasio   "
          "(target >= 5x)")
    print(f"pandas read_csv ~A   {t_floor:7.3f} s   read_well / floor = {t_ours / t_floor:4.2f}   "
          "(target <= 2)")
    print(f"peak memory: read_well {peak_ours / size:4.1f}x the file size (target <= 4x); "
          f"lasio.read {peak_lasio / size:4.1f}x")


if __name__ == "__main__":
    main()
