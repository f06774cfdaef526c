"""Shared timing helper for the bench scripts (run them as ``python bench/NAME.py``)."""

from __future__ import annotations

import time


def best_time_s(fn, repeats: int) -> float:
    """Shortest wall time (s) of ``repeats`` calls of ``fn``: the least disturbed run."""
    times = []
    for _ in range(repeats):
        t0 = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t0)
    return min(times)
