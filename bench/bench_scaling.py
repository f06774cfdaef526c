"""Benchmark: how each stage of one well's screening grows with the work.

Generates realistic synthetic wells (a random sand-shale succession in the style of the
invented Harrowmere scenario, see ``example_logs/make_examples.py``: beds of lognormal
thickness, a Gaussian tool response, GR baseline steps at hole sections, caliper, bit
size, neutron and density) at two sizes and times every stage of
:func:`logprep.pipeline.screen_well` on the same inputs the pipeline gives it.  For each
stage it prints the time at both sizes and the exponent
``log(t2 / t1) / log(n2 / n1)``: 1 is linear in samples, 2 quadratic.  The whole
screening is timed too (no sheet, no files).

A second table grows the largest throw (cells = rows x throws) at a fixed well length
and prints each field stage's exponent in the number of throw columns.

Run:  python bench/bench_scaling.py [--sizes 20000,80000] [--throws 100,1000] [--repeat 2]
Timings are the best of ``--repeat`` runs.
"""

from __future__ import annotations

import argparse
import math

import numpy as np
from timing import best_time_s

from logprep.blocking import block_with_boundaries, fill_gaps
from logprep.endpoints import zone_bounds
from logprep.juxtaposition import sand_windows
from logprep.model import WellLog
from logprep.pipeline import (
    ScreenSettings,
    clay_volume,
    screen_well,
    seal_capacity_step,
)
from logprep.qc import gr_flags
from logprep.sgr import sgr_field
from logprep.smear import window_smear, with_smear_fields

STEP_M = 0.1524  # 0.5 ft, the common logging step


def synthetic_well(n: int, seed: int = 11) -> WellLog:
    """A vertical well of ``n`` samples at 0.1524 m from 1000 m: a random succession of
    shale, silt, heterolith and sand beds (lognormal thickness, median 3 m), GR from the
    shale fraction through a 0.6 m Gaussian tool response plus noise, a GR baseline step
    every 900 m, a smaller bit size below 40 % of the interval, neutron and density from
    the same profile."""
    rng = np.random.default_rng(seed)
    depth = 1000.0 + STEP_M * np.arange(n)
    length = n * STEP_M
    beds = []
    total = 0.0
    while total < length + 50:
        h = float(np.clip(rng.lognormal(np.log(3.0), 0.9), 0.3, 60.0))
        beds.append(h)
        total += h
    kinds = rng.choice(4, size=len(beds), p=[0.45, 0.1, 0.15, 0.3])
    v_bed = np.select([kinds == 0, kinds == 1, kinds == 2],
                      [rng.uniform(0.85, 1.0, len(beds)), rng.uniform(0.5, 0.6, len(beds)),
                       rng.uniform(0.35, 0.65, len(beds))], rng.uniform(0.0, 0.2, len(beds)))
    tops = 1000.0 - 25.0 + np.concatenate(([0.0], np.cumsum(beds)[:-1]))
    k = np.searchsorted(tops, depth, side="right") - 1
    vsh = v_bed[k]
    sig = 0.6 / STEP_M
    x = np.arange(-int(4 * sig), int(4 * sig) + 1)
    kern = np.exp(-0.5 * (x / sig) ** 2)
    vsh = np.convolve(np.pad(vsh, x.size // 2, mode="edge"), kern / kern.sum(), mode="valid")
    section = ((depth - depth[0]) // 900.0).astype(int)
    baseline = 12.0 * (section % 3)
    gr = 25.0 + baseline + vsh * 95.0 + rng.normal(0, 3.0, n)
    bs = np.where(depth < depth[0] + 0.4 * length, 12.25, 8.5)  # two hole sections
    cali = bs + np.abs(rng.normal(0, 0.15, n)) + np.where(vsh > 0.9, rng.uniform(0, 2.5, n) * (rng.random(n) < 0.05), 0)
    nphi = 0.08 + 0.27 * vsh + rng.normal(0, 0.01, n)
    rhob = 2.35 + 0.2 * vsh + rng.normal(0, 0.015, n)
    gr[rng.integers(0, n, max(1, n // 5000))] = np.nan  # a few nulls
    return WellLog(
        name=f"SYN-{n}", source=f"SYN-{n}.las", sha256="", depth_m=depth,
        curves={"GR": gr, "CALI": cali, "BS": bs, "NPHI": nphi, "RHOB": rhob},
        units={"GR": "GAPI", "CALI": "IN", "BS": "IN", "NPHI": "V/V", "RHOB": "G/CC"},
        depth_unit="M", gr_mnemonic="GR", header={"EKB": "25.0"}, header_units={"EKB": "M"},
    )


def stage_times(well: WellLog, settings: ScreenSettings, repeat: int) -> dict[str, float]:
    """Best time (s) of each stage, each fed what the pipeline gives it."""
    t: dict[str, float] = {}
    depth, gr = well.depth_m, well.gr_api
    t["QC flags"] = best_time_s(lambda: gr_flags(depth, gr), repeat)
    bs = well.curves["BS"]
    t["GR-baseline zoning"] = best_time_s(lambda: zone_bounds(
        depth, gr, "changepoint", bs_in=bs, min_zone_m=settings.zone_min_m,
        min_step_api=settings.zone_step_api), repeat)
    t["clay volume (all)"] = best_time_s(lambda: clay_volume(well, settings), repeat)
    cv = clay_volume(well, settings)
    vsh, filled = fill_gaps(cv.depth_m, cv.vsh)
    blk = lambda: block_with_boundaries(settings.blocking, cv.depth_m, vsh, (), filled=filled,
                                        **settings.blocking_kwargs())
    t["blocking"] = best_time_s(blk, repeat)
    layers = blk()
    t["sand_windows"] = best_time_s(lambda: sand_windows(layers, settings.throw_max_m), repeat)
    windows = sand_windows(layers, settings.throw_max_m)
    t.update(field_times(layers, cv.depth_m, vsh, settings, repeat))
    t["capacity"] = best_time_s(lambda: seal_capacity_step(well, layers, windows, settings), repeat)
    t["window smear"] = best_time_s(lambda: window_smear(layers, windows, settings.throw_max_m), repeat)
    t["whole screening"] = best_time_s(lambda: screen_well(well, settings), repeat)
    t["_windows"] = len(windows)
    t["_layers"] = len(layers)
    return t


def field_times(layers, depth, vsh, settings, repeat) -> dict[str, float]:
    def field():
        return sgr_field(layers, depth, vsh, throw_max_m=settings.throw_max_m,
                         throw_step_m=settings.field_throw_step_m,
                         depth_step_m=settings.field_depth_step_m, source=settings.sgr_field_source)

    grid = field()
    return {"SGR + juxtaposition field": best_time_s(field, repeat),
            "smear fields": best_time_s(lambda: with_smear_fields(grid, layers), repeat),
            "_cells": grid.sgr_pct.size}


def exponent(t1: float, t2: float, n1: float, n2: float) -> float:
    return math.log(t2 / t1) / math.log(n2 / n1)


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--sizes", default="20000,80000", help="two well sizes in samples")
    ap.add_argument("--throws", default="100,1000", help="two largest throws (m) for the field table")
    ap.add_argument("--throw-samples", type=int, default=20000, help="well size of the field table")
    ap.add_argument("--repeat", type=int, default=2)
    args = ap.parse_args()
    n1, n2 = (int(v) for v in args.sizes.split(","))
    settings = ScreenSettings()
    a = stage_times(synthetic_well(n1), settings, args.repeat)
    b = stage_times(synthetic_well(n2), settings, args.repeat)
    print(f"stages of one well (throw max {settings.throw_max_m:g} m): {n1} samples "
          f"({a['_layers']} layers, {a['_windows']} windows) and {n2} samples "
          f"({b['_layers']} layers, {b['_windows']} windows)")
    print(f"  {'stage':<28}{n1:>10}{n2:>10}   exponent in samples (1 = linear)")
    for name in a:
        if name.startswith("_"):
            continue
        print(f"  {name:<28}{a[name]:9.3f}s{b[name]:9.3f}s   {exponent(a[name], b[name], n1, n2):5.2f}")

    t1, t2 = (float(v) for v in args.throws.split(","))
    well = synthetic_well(args.throw_samples)
    cv = clay_volume(well, settings)
    vsh, filled = fill_gaps(cv.depth_m, cv.vsh)
    layers = block_with_boundaries(settings.blocking, cv.depth_m, vsh, (), filled=filled,
                                   **settings.blocking_kwargs())
    fa = field_times(layers, cv.depth_m, vsh, settings.updated(throw_max_m=t1), args.repeat)
    fb = field_times(layers, cv.depth_m, vsh, settings.updated(throw_max_m=t2), args.repeat)
    print(f"fields of a {args.throw_samples}-sample well: throw max {t1:g} m ({fa['_cells'] / 1e6:.1f} M cells) "
          f"and {t2:g} m ({fb['_cells'] / 1e6:.1f} M cells)")
    for name in fa:
        if name.startswith("_"):
            continue
        print(f"  {name:<28}{fa[name]:9.3f}s{fb[name]:9.3f}s   exponent in cells "
              f"{exponent(fa[name], fb[name], fa['_cells'], fb['_cells']):5.2f}")


if __name__ == "__main__":
    main()
