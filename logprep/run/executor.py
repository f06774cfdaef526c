"""Where the tasks of a batch run: in this process, in worker processes, or on Dask.

Every task is a call ``fn(*shared, *task)`` of a top-level function that returns its results
as values (file bytes, table rows) and writes nothing: the process that started the run
writes every output (see :mod:`logprep.run.store`).  ``shared`` (settings, the tops table)
is sent to each worker once, not with every task.  The same function gives the same
results on every backend, so the backend is a question of speed only.

Worker processes that stop (killed, out of memory) break a process pool; the tasks then in
flight are retried one at a time in a new pool, so a second stop names the task that
caused it, which is reported as a :class:`TaskLost` outcome.  The other tasks go on.
"""

from __future__ import annotations

import os
import threading
import time
from collections import deque
from collections.abc import Callable, Iterator, Sequence
from dataclasses import dataclass

from logprep.errors import SettingsError


@dataclass(frozen=True)
class Backend:
    """How to run a batch: ``jobs`` local worker processes (1: in this process), or a Dask
    cluster at ``scheduler`` (an address such as ``tcp://10.0.0.5:8786``), or a local Dask
    cluster of ``dask_local`` worker processes."""

    jobs: int = 1
    scheduler: str | None = None
    dask_local: int | None = None

    def __post_init__(self) -> None:
        if self.jobs < 1:
            raise SettingsError(f"--jobs must be 1 or more (got {self.jobs}); give --jobs 1 for "
                                "one process or the number of free cores")
        if self.dask_local is not None and self.dask_local < 1:
            raise SettingsError(f"--dask-local must be 1 or more (got {self.dask_local}); give "
                                "the number of local Dask workers, such as 2")
        if self.scheduler and self.dask_local:
            raise SettingsError("--scheduler and --dask-local both given; give --scheduler (a "
                                "running cluster) or --dask-local (a new one), not both")

    @property
    def uses_dask(self) -> bool:
        return bool(self.scheduler or self.dask_local)

    def describe(self) -> str:
        if self.scheduler:
            return f"Dask cluster at {self.scheduler}"
        if self.dask_local:
            return f"local Dask cluster of {self.dask_local} workers"
        return "1 process" if self.jobs == 1 else f"{self.jobs} worker processes"


@dataclass(frozen=True)
class TaskLost:
    """Outcome of a task whose worker stopped (killed or out of memory) twice."""

    message: str


_SHARED: tuple = ()


def _init_worker(parent_pid: int, shared: tuple) -> None:
    """Pool initializer: keep the shared arguments, and end this worker when the process
    that started it is gone (killed with -9 it cannot tell its workers)."""
    global _SHARED
    _SHARED = shared

    def watch() -> None:
        while True:
            time.sleep(0.5)
            if os.getppid() != parent_pid:
                os._exit(1)

    threading.Thread(target=watch, name="logprep-parent-watch", daemon=True).start()


def _call(fn: Callable, task: tuple):
    return fn(*_SHARED, *task)


def run_tasks(fn: Callable, tasks: Sequence[tuple], backend: Backend = Backend(),
              shared: tuple = ()) -> Iterator[tuple[int, object]]:
    """Run ``fn(*shared, *tasks[i])`` for every ``i``; yield ``(i, result)`` as each task
    finishes (in any order), with a :class:`TaskLost` result for a task whose worker
    stopped.  An exception raised by ``fn`` propagates."""
    if backend.uses_dask:
        from logprep.run.dask_runner import run_on_dask

        yield from run_on_dask(fn, tasks, shared, scheduler=backend.scheduler,
                               local_workers=backend.dask_local, lost=TaskLost)
    elif backend.jobs == 1 or len(tasks) <= 1:
        for i, task in enumerate(tasks):
            yield i, fn(*shared, *task)
    else:
        yield from _run_processes(fn, tasks, shared, backend.jobs)


def _run_processes(fn, tasks, shared, jobs, max_stops: int = 2):
    from concurrent.futures import FIRST_COMPLETED, ProcessPoolExecutor, wait
    from concurrent.futures.process import BrokenProcessPool

    pending = deque(range(len(tasks)))
    stops: dict[int, int] = {}
    while pending:
        pool = ProcessPoolExecutor(max_workers=min(jobs, len(pending)), initializer=_init_worker,
                                   initargs=(os.getpid(), shared))
        inflight: dict = {}
        lost: list[int] = []
        try:
            while pending or inflight:
                # a task that was in flight when a worker stopped runs alone
                while pending and len(inflight) < jobs and not (
                        inflight and (stops.get(pending[0]) or any(stops.get(j) for j in inflight.values()))):
                    i = pending.popleft()
                    inflight[pool.submit(_call, fn, tasks[i])] = i
                done, _ = wait(inflight, return_when=FIRST_COMPLETED)
                for fut in done:
                    i = inflight.pop(fut)
                    try:
                        result = fut.result()
                    except BrokenProcessPool:
                        lost.append(i)
                        continue
                    yield i, result
                if lost:
                    lost += list(inflight.values())
                    break
        finally:
            # wait for the pool's own threads, so that the next pool is not forked while
            # they hold a lock
            pool.shutdown(wait=True, cancel_futures=True)
        for i in sorted(set(lost), reverse=True):
            stops[i] = stops.get(i, 0) + 1
            if stops[i] >= max_stops:
                yield i, TaskLost("the worker process stopped while running this task, twice "
                                  "(killed, or out of memory); run it alone or give it more memory")
            else:
                pending.appendleft(i)
