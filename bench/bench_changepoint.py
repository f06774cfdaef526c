"""Changepoint search speed: logprep's exact PELT on cumulative sums against ruptures' Pelt
(same cost, penalty and minimum segment) on a synthetic Vsh curve, timed in the same run.

    python bench/bench_changepoint.py [n_samples]

Prints seconds and the ratio ruptures / logprep (> 1: logprep faster).
"""

import sys
import time

import numpy as np

from logprep.changepoint import noise_sd, pelt_mean_breaks


def synthetic_vsh(n, random_state=0):
    rng = np.random.default_rng(random_state)
    beds = rng.integers(5, 60, size=n // 5)
    levels = rng.choice([0.1, 0.5, 0.9], size=beds.size)
    v = np.repeat(levels, beds)[:n]
    return np.clip(v + rng.normal(0, 0.05, v.size), 0, 1)


def main():
    n = int(sys.argv[1]) if len(sys.argv) > 1 else 3000
    v = synthetic_vsh(n)
    pen = 2 * noise_sd(v) ** 2 * np.log(v.size)
    t0 = time.perf_counter()
    ours = pelt_mean_breaks(v, pen, 7)
    t_ours = time.perf_counter() - t0
    print(f"logprep pelt_mean_breaks: n={v.size} {t_ours:.3f} s, {len(ours)} changes")
    try:
        import ruptures as rpt
    except ImportError:
        print("ruptures not installed: no baseline")
        return
    t0 = time.perf_counter()
    theirs = rpt.Pelt(model="l2", min_size=7, jump=1).fit(v).predict(pen=pen)[:-1]
    t_theirs = time.perf_counter() - t0
    print(f"ruptures Pelt:            n={v.size} {t_theirs:.3f} s, {len(theirs)} changes")
    print(f"ratio ruptures/logprep: {t_theirs / t_ours:.1f}x; same changes: {list(ours) == list(theirs)}")


if __name__ == "__main__":
    main()
