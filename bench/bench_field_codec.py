"""What storing the SGR field costs: ``sgr_field.npz`` as written (0.1 % steps in int16 as
row differences, deflate members) against the plain grid in bzip2 (the format before) and
the plain grid in deflate, on the bundled wells and a generated 20,000-sample well, in the
same run: bytes and CPU time to write (best of ``--repeat``), as ratios, and a check that
every format reads back to the same field.

Run:  python bench/bench_field_codec.py [--repeat N]
"""

from __future__ import annotations

import argparse
import tempfile
import zipfile
from pathlib import Path

import numpy as np
from bench_sheet import big_well
from timing import best_cpu_s

from logprep.fault import fieldcodec as fc
from logprep.fault.juxtaposition import JUXTAPOSITION_CLASSES
from logprep.io.examples import example_logs_dir
from logprep.io.las import read_well
from logprep.run.pipeline import ScreenSettings, screen_well


def plain_arrays(grid) -> dict:
    """The field's arrays with the plain int16 grid in place of its row differences, as
    before."""
    arrays = fc.field_arrays(grid.depth_m, grid.throw_m, grid.sgr_pct, grid.juxtaposition,
                             JUXTAPOSITION_CLASSES, grid.source)
    del arrays["sgr_pct_x10_diff_axis"]
    plain = fc.encode_sgr_pct(grid.sgr_pct)
    return {("sgr_pct_x10" if k == "sgr_pct_x10_diff" else k): (plain if k == "sgr_pct_x10_diff" else v)
            for k, v in arrays.items()}


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--repeat", type=int, default=3)
    args = ap.parse_args()
    with tempfile.TemporaryDirectory() as tmp:
        wells = sorted(example_logs_dir().glob("*.las")) + [big_well(Path(tmp) / "BENCH-BIG.las")]
        print("per well: bytes and CPU ms to write sgr_field.npz; ratios are the format before "
              "(plain grid, bzip2) over the one written")
        print(f"  {'well':<10} {'grid':>11} {'written':>16} {'bzip2 (before)':>22} {'plain deflate':>16}")
        tot = np.zeros(6)
        for path in wells:
            grid = screen_well(read_well(path), ScreenSettings()).grid
            t_new, new = best_cpu_s(grid.npz_bytes, args.repeat)
            plain = plain_arrays(grid)
            t_bz, bz = best_cpu_s(lambda: fc.npz_bytes(plain, 9, zipfile.ZIP_BZIP2), args.repeat)
            t_df, df = best_cpu_s(lambda: fc.npz_bytes(plain, 6, zipfile.ZIP_DEFLATED), args.repeat)
            ref = fc.read_field_arrays(bz)["sgr_pct"]
            for data in (new, df):
                assert np.array_equal(fc.read_field_arrays(data)["sgr_pct"], ref, equal_nan=True)
            tot += (len(new), t_new, len(bz), t_bz, len(df), t_df)
            print(f"  {path.stem:<10} {grid.sgr_pct.shape[0]:>5} x {grid.sgr_pct.shape[1]:<3} "
                  f"{len(new) / 1e3:7.0f} kB {t_new * 1e3:5.0f} ms "
                  f"{len(bz) / 1e3:6.0f} kB {t_bz * 1e3:5.0f} ms "
                  f"({len(bz) / len(new):4.2f}x size, {t_bz / t_new:4.1f}x time) "
                  f"{len(df) / len(new):4.2f}x size, {t_df / t_new:4.2f}x time")
        n, tn, b, tb, d, td = tot
        print(f"  all wells: before/written {b / n:.2f}x the bytes and {tb / tn:.1f}x the time; "
              f"plain deflate {d / n:.2f}x the bytes, {td / tn:.2f}x the time; "
              "all three read back to the same field")


if __name__ == "__main__":
    main()
