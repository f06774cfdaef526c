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


def best_cpu_s(fn, repeats: int) -> tuple[float, object]:
    """Shortest CPU time (s, ``time.process_time``: this process, all threads) of
    ``repeats`` calls of ``fn``, and what the last call returned."""
    best, out = float("inf"), None
    for _ in range(repeats):
        c0 = time.process_time()
        out = fn()
        best = min(best, time.process_time() - c0)
    return best, out


def best_interleaved_s(fns, repeats: int) -> list[tuple[float, float]]:
    """Best wall time and best CPU time (s) of each of ``fns``, the calls interleaved
    (``a, b, a, b, ...``) so that every function meets the same load on a shared machine.
    CPU time (``time.process_time``, this process, all threads) is what a ratio of
    single-process work is steadiest in when other jobs share the cores."""
    wall = [[] for _ in fns]
    cpu = [[] for _ in fns]
    for _ in range(repeats):
        for k, fn in enumerate(fns):
            t0, c0 = time.perf_counter(), time.process_time()
            fn()
            wall[k].append(time.perf_counter() - t0)
            cpu[k].append(time.process_time() - c0)
    return [(min(w), min(c)) for w, c in zip(wall, cpu)]
