"""Running batch tasks on a Dask distributed cluster (the optional ``logprep[dask]`` extra).

One task per well (per pair, per fault); tasks share nothing but the settings and the tops
table, sent to every worker once (:meth:`distributed.Client.scatter`).  Workers read the
input files at their absolute paths (so a cluster needs the inputs on a path every worker
sees) and return the outputs as bytes; the client writes them (see
:mod:`logprep.run.executor`).
"""

from __future__ import annotations

import logging
import multiprocessing
from collections.abc import Callable, Iterator, Sequence
from contextlib import contextmanager

from logprep.errors import LogprepError, SettingsError

INSTALL_HINT = "install the Dask extra: pip install 'logprep[dask]'"

CONNECT_TIMEOUT_S = 15.0
"""How long to try to reach a ``--scheduler`` before giving up."""


WORKER_PRELOAD = ("distributed", "numpy", "pandas", "scipy", "matplotlib", "lasio",
                  "logprep.run.welltask", "logprep.run.pipeline", "logprep.io.las",
                  "logprep.report.writers", "logprep.report.sheet", "logprep.run.contain",
                  "logprep.run.pairs", "logprep.run.fault_batch")
"""Modules the local cluster's fork server imports once, so that its workers start with them
(instead of every worker importing them again, by spawn, before its first task)."""

LOCAL_WORKER_CONFIG = {
    # workers forked from one server that has imported the modules above: a start-up of
    # about 1 s instead of several
    "distributed.worker.multiprocessing-method": "forkserver",
    # the nanny's default MALLOC_TRIM_THRESHOLD_ fixes the allocator's thresholds, so every
    # large numpy temporary is mapped and unmapped again: 20x the page faults and about
    # 20 % more CPU per well (bench/bench_batch_scale.py); the allocator's own adaptive
    # thresholds are kept instead
    "distributed.nanny.pre-spawn-environ.MALLOC_TRIM_THRESHOLD_": None,
    # calmer house-keeping: every well is a task of a second or more, so the event loops'
    # 20 ms tick, the 100 ms memory poll and the 500 ms system monitor only spend the CPU
    # the wells need (the main process, home of the scheduler and the nannies, used about
    # half the CPU with these on 16 bench wells; bench/bench_batch_scale.py)
    "distributed.admin.tick.interval": "500ms",
    "distributed.worker.memory.monitor-interval": "1s",
    "distributed.admin.system-monitor.interval": "2s",
    "distributed.scheduler.work-stealing-interval": "1s",
}
"""Dask settings of the ``--dask-local`` cluster (a ``--scheduler`` cluster keeps its own;
README says how a team sets the same)."""


def _distributed():
    try:
        import distributed
    except ImportError:
        raise SettingsError(f"Dask is not installed; {INSTALL_HINT}") from None
    return distributed


@contextmanager
def dask_client(scheduler: str | None = None, local_workers: int | None = None):
    """A :class:`distributed.Client` connected to ``scheduler``, or to a local cluster of
    ``local_workers`` single-threaded worker processes on the loopback interface (closed
    again on exit; see :data:`LOCAL_WORKER_CONFIG`)."""
    distributed = _distributed()
    if scheduler:
        try:
            client = distributed.Client(scheduler, timeout=f"{CONNECT_TIMEOUT_S}s")
        except (OSError, TimeoutError, ValueError) as exc:
            raise SettingsError(f"--scheduler {scheduler}: cannot reach the Dask scheduler "
                                f"({exc}); start it with 'dask scheduler' and check the address") from None
        try:
            yield client
        finally:
            client.close()
        return
    import dask
    from distributed.utils import get_mp_context

    with dask.config.set(LOCAL_WORKER_CONFIG):
        get_mp_context()  # distributed's own fork-server preload first, then ours
        multiprocessing.get_context("forkserver").set_forkserver_preload(list(WORKER_PRELOAD))
        cluster = distributed.LocalCluster(
            n_workers=local_workers, threads_per_worker=1, processes=True, host="127.0.0.1",
            dashboard_address=None, silence_logs=logging.ERROR,
        )
    client = distributed.Client(cluster)
    try:
        yield client
    finally:
        client.close()
        cluster.close()


def run_on_dask(fn: Callable, tasks: Sequence[tuple], shared: tuple = (), *,
                scheduler: str | None = None, local_workers: int | None = None,
                client=None, lost: Callable[[str], object] = str) -> Iterator[tuple[int, object]]:
    """As :func:`logprep.run.executor.run_tasks` on a Dask cluster: yields ``(i, result)``
    as tasks finish; a task whose workers died (``KilledWorker``) yields ``lost(message)``
    (the executor passes its :class:`~logprep.run.executor.TaskLost`)."""
    distributed = _distributed()
    if client is None:
        with dask_client(scheduler, local_workers) as c:
            yield from run_on_dask(fn, tasks, shared, client=c, lost=lost)
        return
    if not tasks:
        return
    shared_futs = client.scatter(list(shared), broadcast=True) if shared else []
    futures = [client.submit(fn, *shared_futs, *task, pure=False) for task in tasks]
    index = {f.key: i for i, f in enumerate(futures)}
    for fut in distributed.as_completed(futures):
        i = index[fut.key]
        try:
            result = fut.result()
        except distributed.KilledWorker:
            result = lost("the Dask workers running this task stopped (killed, or out of "
                              "memory); run it alone or give the workers more memory")
        except (OSError, TimeoutError) as exc:
            raise LogprepError(f"lost the connection to the Dask cluster ({exc}); check that the "
                               "--scheduler address runs, then run again (finished wells are kept)") from None
        fut.release()
        yield i, result
