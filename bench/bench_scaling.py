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

from logprep.clay.endpoints import zone_bounds
from logprep.clay.qc import gr_flags
from logprep.clay.stage import clay_volume
from logprep.fault.capacity import seal_capacity_step
from logprep.fault.juxtaposition import sand_windows
from logprep.fault.settings import capacity_params
from logprep.fault.sgr import sgr_field
from logprep.fault.smear import window_smear, with_smear_fields
from logprep.layers.blocking import block_with_boundaries, fill_gaps
from logprep.model import WellLog
from logprep.run.pipeline import screen_well
from logprep.run.settings import ScreenSettings

STEP_M = 0.1524  # 0.5 ft, the common logging step


def synthetic_well(n: int, random_state: int = 11) -> WellLog:
    """A vertical well of ``n`` samples at 0.1524 m from 1000 m: a random succession of
    shale, silt, heterolith and sand beds (lognormal thickness, median 3 m), GR from the
    shale fraction through a 0.6 m Gaussian tool response plus noise, a GR baseline step
    every 900 m, a smaller bit size below 40 % of the interval, neutron and density from
    the same profile."""
    rng = np.random.default_rng(random_state)
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


def interleaved_best(fns, repeat: int) -> list[float]:
    """Best time (s) of each function, run in turn ``repeat`` times, so that a burst of
    load on the shared machine hits every size alike."""
    times = [[] for _ in fns]
    for _ in range(repeat):
        for fn, ts in zip(fns, times):
            ts.append(best_time_s(fn, 1))
    return [min(ts) for ts in times]


def prepared(well: WellLog, settings: ScreenSettings) -> dict:
    """The inputs the pipeline gives each stage of ``well``."""
    cv = clay_volume(well, settings.clay)
    vsh, filled = fill_gaps(cv.depth_m, cv.vsh)
    layers = block_with_boundaries(settings.blocking, cv.depth_m, vsh, (), filled=filled,
                                   **settings.layers.blocking_kwargs())
    windows = sand_windows(layers, settings.throw_max_m)
    grid = sgr_field(layers, cv.depth_m, vsh, throw_max_m=settings.throw_max_m,
                     throw_step_m=settings.field_throw_step_m,
                     depth_step_m=settings.field_depth_step_m, source=settings.sgr_field_source)
    return {"well": well, "s": settings, "cv": cv, "vsh": vsh, "filled": filled,
            "layers": layers, "windows": windows, "grid": grid}


def stages(p: dict) -> dict:
    """Each stage of one well as a function of no arguments, fed what the pipeline gives it."""
    well, s, cv, layers = p["well"], p["s"], p["cv"], p["layers"]
    return {
        "QC flags": lambda: gr_flags(well.depth_m, well.gr_api, cali_in=well.curves["CALI"],
                                     bs_in=well.curves["BS"]),
        "GR-baseline zoning": lambda: zone_bounds(
            well.depth_m, well.gr_api, "changepoint", bs_in=well.curves["BS"],
            min_zone_m=s.zone_min_m, min_step_api=s.zone_step_api),
        "clay volume (all)": lambda: clay_volume(well, s.clay),
        "blocking": lambda: block_with_boundaries(s.blocking, cv.depth_m, p["vsh"], (),
                                                  filled=p["filled"], **s.layers.blocking_kwargs()),
        "sand_windows": lambda: sand_windows(layers, s.throw_max_m),
        "SGR + juxtaposition field": lambda: sgr_field(
            layers, cv.depth_m, p["vsh"], throw_max_m=s.throw_max_m,
            throw_step_m=s.field_throw_step_m, depth_step_m=s.field_depth_step_m,
            source=s.sgr_field_source),
        "smear fields": lambda: with_smear_fields(p["grid"], layers),
        "capacity": lambda: seal_capacity_step(
            well, layers, p["windows"], capacity_params(s.capacity, s.fault_rock), s.capacity.length_unit),
        "window smear": lambda: window_smear(layers, p["windows"], s.throw_max_m),
        "whole screening": lambda: screen_well(well, s),
    }


FIELD_STAGES = ("SGR + juxtaposition field", "smear fields")


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
    pa, pb = prepared(synthetic_well(n1), settings), prepared(synthetic_well(n2), settings)
    sa, sb = stages(pa), stages(pb)
    print(f"stages of one well (throw max {settings.throw_max_m:g} m): {n1} samples "
          f"({len(pa['layers'])} layers, {len(pa['windows'])} windows) and {n2} samples "
          f"({len(pb['layers'])} layers, {len(pb['windows'])} windows)")
    print(f"  {'stage':<28}{n1:>10}{n2:>10}   exponent in samples (1 = linear)")
    for name in sa:
        ta, tb = interleaved_best([sa[name], sb[name]], args.repeat)
        print(f"  {name:<28}{ta:9.3f}s{tb:9.3f}s   {exponent(ta, tb, n1, n2):5.2f}")

    t1, t2 = (float(v) for v in args.throws.split(","))
    well = synthetic_well(args.throw_samples)
    fa, fb = prepared(well, settings.updated(throw_max_m=t1)), prepared(well, settings.updated(throw_max_m=t2))
    ca, cb = fa["grid"].sgr_pct.size, fb["grid"].sgr_pct.size
    print(f"fields of a {args.throw_samples}-sample well: throw max {t1:g} m ({ca / 1e6:.1f} M cells) "
          f"and {t2:g} m ({cb / 1e6:.1f} M cells)")
    sa, sb = stages(fa), stages(fb)
    for name in FIELD_STAGES:
        ta, tb = interleaved_best([sa[name], sb[name]], args.repeat)
        print(f"  {name:<28}{ta:9.3f}s{tb:9.3f}s   exponent in cells {exponent(ta, tb, ca, cb):5.2f}")


if __name__ == "__main__":
    main()
