"""Benchmark: 1,000 Monte Carlo realisations of one fault against one deterministic
screening, measured in the same run.

Baseline: the deterministic screening of the fault's wells as the pipeline does it
(:func:`logprep.run.pipeline.screen_well` of the footwall and, for a two-well fault, the
hanging-wall well, already read from LAS).  Measured: :func:`logprep.run.faults.screen_fault`
with 1,000 realisations (draws, rebuilt columns, contacts, columns, percentiles and
sensitivity).  Target: ratio <= 20.

Run: ``python bench/bench_fault_uncertainty.py``.  Timings are the best of several repeats.
"""

from __future__ import annotations

from timing import best_time_s

from logprep.fault.uncertainty import Spreads
from logprep.io.examples import example_logs_dir
from logprep.io.faults import FaultSpec
from logprep.io.las import read_well
from logprep.run.pipeline import ScreenSettings, screen_well
from logprep.run.faults import screen_fault

N = 1000


def main() -> None:
    demo = example_logs_dir()
    s = ScreenSettings(tops_file=str(demo / "tops.csv"))
    fw_log, hw_log = read_well(demo / "HRM-2.las"), read_well(demo / "HRM-3.las")
    fw, hw = screen_well(fw_log, s), screen_well(hw_log, s)
    cases = {
        "two wells (HRM-2 / HRM-3, marker tie)": (FaultSpec(
            name="two", footwall="HRM-2", hangingwall="HRM-3", marker="Kellan Marker", throw_m=40.0,
            throw_low_m=30.0, throw_high_m=55.0, throw_dist="triangular"), (fw_log, hw_log), hw),
        "one well (HRM-2 on both sides)": (FaultSpec(
            name="one", footwall="HRM-2", throw_m=25.0, throw_low_m=15.0, throw_high_m=35.0,
            throw_dist="uniform"), (fw_log,), None),
    }
    sp = Spreads(realisations=N)
    print(f"{N} realisations per fault; best of repeats; 2 shared cores")
    for label, (spec, logs, hw_scr) in cases.items():
        base = best_time_s(lambda logs=logs: [screen_well(w, s) for w in logs], 3)
        mc = best_time_s(lambda spec=spec, hw_scr=hw_scr: screen_fault(spec, fw, hw_scr, s, sp), 2)
        print(f"{label}: deterministic screening {base:.3f} s; {N} realisations {mc:.2f} s; "
              f"ratio {mc / base:.1f}x (target <= 20x); {1e3 * mc / N:.2f} ms per realisation")


if __name__ == "__main__":
    main()
