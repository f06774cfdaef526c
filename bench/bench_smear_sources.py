"""Benchmark: what counting smear source beds by clay fraction costs.

For each bundled example well, the SSF and CSP fields (``with_smear_fields``) with the
default source-bed cut-off (clay fraction >= 0.40, shale and heterolith layers) against the
same fields with a cut-off of 0.65 (about the shale layers alone, the earlier rule), and the
whole screening of the well (``screen_well``) at the two cut-offs, in the same run, best of
``--repeat``.  The smear fields cost cells x (source beds a throw spans), so more source beds
cost more; the whole-well ratio shows how much of that a run sees.

Run: ``python bench/bench_smear_sources.py [--repeat 3]``.
"""

from __future__ import annotations

import argparse

from timing import best_time_s

from logprep.fault.clayfraction import clay_layers
from logprep.fault.smear import source_beds, with_smear_fields
from logprep.io.examples import example_logs_dir
from logprep.io.las import read_well
from logprep.run.pipeline import screen_well
from logprep.run.settings import ScreenSettings


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--repeat", type=int, default=3)
    args = ap.parse_args()
    print("well    beds@0.65 beds@0.40  smear fields 0.40/0.65  whole well 0.40/0.65")
    for path in sorted(example_logs_dir().glob("*.las")):
        well = read_well(path)
        base = screen_well(well, ScreenSettings())
        clay = clay_layers(base.layers)
        t_field = {c: best_time_s(lambda c=c: with_smear_fields(base.grid, clay, clay_min=c), args.repeat)
                   for c in (0.65, 0.40)}
        t_well = {c: best_time_s(lambda c=c: screen_well(well, ScreenSettings(smear_clay_min=c)), args.repeat)
                  for c in (0.65, 0.40)}
        print(f"{path.stem:7s} {len(source_beds(clay, 0.65)):9d} {len(source_beds(clay, 0.40)):9d}"
              f"  {t_field[0.40] / t_field[0.65]:22.2f}  {t_well[0.40] / t_well[0.65]:20.2f}")


if __name__ == "__main__":
    main()
