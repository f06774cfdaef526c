"""Batches on a real Dask cluster (workers on the loopback interface): one task per well
and per pair, results byte-identical to one process."""

import shutil

import pytest

from logprep.cli import main

distributed = pytest.importorskip("distributed", reason="the Dask extra is not installed")

ARGS = ["--no-sheet", "--quiet", "--throw-max", "120"]


def tree(root):
    return {p.relative_to(root).as_posix(): p.read_bytes()
            for p in sorted(root.rglob("*")) if p.is_file()}


@pytest.fixture
def inputs(tmp_path, example_dir):
    src = tmp_path / "in"
    src.mkdir()
    for name in ("HRM-2.las", "HRM-3.las"):
        shutil.copy(example_dir / name, src / name)
    (src / "broken.las").write_text("not a log\n")
    return src


def test_cluster_gives_the_results_of_one_process(inputs, tmp_path, example_dir):
    from logprep.run.dask_runner import dask_client

    extra = ["--tops", str(example_dir / "tops.csv"), "--pairs", str(example_dir / "pairs.csv")]
    one = tmp_path / "one"
    assert main(["screen", str(inputs), "--out", str(one), *ARGS, *extra]) == 1
    # the local cluster of --dask-local, reached by its address as a team's cluster would be
    with dask_client(local_workers=2) as client:
        address = client.scheduler.address
        assert address.startswith("tcp://127.0.0.1:")
        dask = tmp_path / "dask"
        assert main(["screen", str(inputs), "--out", str(dask), *ARGS, *extra,
                     "--scheduler", address]) == 1
        # the tasks ran on the cluster's two workers: 3 wells + 1 pair
        done = client.run(lambda dask_worker: dask_worker.state.executed_count)
    assert len(done) == 2 and sum(done.values()) >= 4
    assert tree(dask) == tree(one)
    assert (dask / "pair_HRM-2_HRM-3" / "juxtapositions.csv").exists()


def test_unreachable_scheduler_is_a_one_line_usage_error(inputs, tmp_path, capsys, monkeypatch):
    monkeypatch.setattr("logprep.run.dask_runner.CONNECT_TIMEOUT_S", 1.0)
    code = main(["screen", str(inputs / "HRM-2.las"), "--out", str(tmp_path / "o"), *ARGS,
                 "--scheduler", "tcp://127.0.0.1:9"])
    err = capsys.readouterr().err.strip()
    assert code == 2 and len(err.splitlines()) == 1 and "cannot reach the Dask scheduler" in err
