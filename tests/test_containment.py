"""Containment beyond single wells: well pairs and named faults whose screening hits a bug
become their own error rows (one stderr line, a traceback in the log file, counted as
internal errors) and the run goes on; the per-well time limit is a setting; paths that
cannot be read while scanning are reported in the run's summary line.

The bug is a real one put where plug-ins go: a blocking method in
``logprep.layers.blocking.BLOCKING_METHODS`` that fails on wells below 1010 m (no logprep
function is replaced).  Behaviour checks (common practice, no source).
"""

from __future__ import annotations

import os
import subprocess
import sys
import time
from pathlib import Path

import pandas as pd
import pytest

from logprep.cli import main
from logprep.layers.blocking import BLOCKING_METHODS, block_cutoff
from logprep.run.contain import INTERNAL_LOG_NAME

sys.path.insert(0, str(Path(__file__).parent / "data" / "hostile"))
import make_hostile  # noqa: E402


@pytest.fixture
def plugin():
    """Register a blocking method for the test and remove it after."""
    names = []

    def register(name, fn):
        BLOCKING_METHODS[name] = fn
        names.append(name)
        return name

    yield register
    for n in names:
        BLOCKING_METHODS.pop(n, None)


def _deep_fails(depth_m, vsh, **kw):
    if depth_m[0] > 1010:
        return {}["no such key"]  # the plug-in's bug
    return block_cutoff(depth_m, vsh, **kw)


def _wells(tmp_path: Path) -> list[Path]:
    z, gr = make_hostile.column()
    files = []
    for stem, top, well in (("a_shallow", 0, "A-1"), ("b_deep", 100, "B-1"), ("c_shallow", 0, "C-1")):
        f = tmp_path / f"{stem}.las"
        f.write_text(make_hostile.las2(list(zip(z + top, gr)), well=well))
        files.append(f)
    return files


def test_pair_and_fault_bugs_are_contained_logged_and_counted(tmp_path, capsys, plugin):
    files = _wells(tmp_path)
    pairs = tmp_path / "pairs.csv"
    pairs.write_text("footwall,hangingwall,shift_m\nA-1,C-1,5\nA-1,B-1,100\nC-1,A-1,3\n")
    faults = tmp_path / "faults.csv"
    faults.write_text("name,footwall,throw_m\nF-deep,B-1,20\nF-shallow,A-1,20\n")
    out = tmp_path / "o"
    rc = main(["screen", *map(str, files), "--out", str(out), "--no-sheet",
               "--blocking", plugin("deep-fails-test", _deep_fails),
               "--pairs", str(pairs), "--faults", str(faults), "--realisations", "50",
               "--co2-density-mode", "fixed", "--no-field"])
    assert rc == 1
    cap = capsys.readouterr()
    assert "Traceback" not in cap.err
    rows = pd.read_csv(out / "pairs_summary.csv", keep_default_na=False)
    assert rows["status"].tolist() == ["ok", "error", "ok"]  # the pairs after it went on
    msg = rows["message"][1]
    assert msg.startswith(f"{pairs}: pair A-1 / B-1: internal error (KeyError")
    assert "; " in msg and INTERNAL_LOG_NAME in msg
    assert rows["folder"][1] == "" and (out / rows["folder"][0] / "juxtapositions.csv").exists()
    assert "screened 3 well pair(s): 2 ok, 1 failed (1 internal error(s)" in cap.out
    # the fault on the deep well failed, the other ran and is in faults.csv
    assert "screened 2 fault(s)" in cap.out and "1 ok, 1 failed (1 internal error(s)" in cap.out
    assert pd.read_csv(out / "faults.csv")["fault"].unique().tolist() == ["F-shallow"]
    # one stderr line each: the deep well, its pair, its fault
    err = [ln for ln in cap.err.splitlines() if ln.startswith("error: ")]
    assert len(err) == 3 and all("internal error (KeyError" in ln for ln in err)
    assert any("pair A-1 / B-1" in ln for ln in err) and any("F-deep" in ln for ln in err)
    log = (out / INTERNAL_LOG_NAME).read_text()
    assert log.count("Traceback (most recent call last)") == 3
    assert "pair A-1 / B-1" in log and "fault 'F-deep'" in log and "no such key" in log


def test_overview_that_cannot_be_written_is_one_error_line_and_the_wells_stand(tmp_path, capsys, monkeypatch):
    # the system refuses the overview (here a font file it cannot read, as seen when the
    # installation is unreadable to the user): one error line, the traceback logged, the
    # wells' results and summary in place, exit status 1 (common practice, no source)
    import logprep.report.overview_files as overview_files

    def refuse(out_dir, locations_file=None):
        raise PermissionError(13, "Permission denied", "/site-packages/fonts/Courier.afm")

    monkeypatch.setattr(overview_files, "write_overview", refuse)
    files = _wells(tmp_path)[:1]
    out = tmp_path / "o"
    rc = main(["screen", *map(str, files), "--out", str(out), "--no-sheet", "--no-field"])
    cap = capsys.readouterr()
    assert rc == 1 and "Traceback" not in cap.err
    err = [ln for ln in cap.err.splitlines() if ln.startswith("error: ")]
    assert len(err) == 1 and "overview.html" in err[0] and "PermissionError" in err[0], cap.err
    assert f"logprep overview {out}" in err[0]  # what to do
    assert "field overview" not in cap.out and "1 ok, 0 failed" in cap.out
    assert (out / "summary.csv").exists() and not (out / "overview.html").exists()
    assert "Courier.afm" in (out / INTERNAL_LOG_NAME).read_text()


def test_well_time_limit_is_a_setting_and_a_stall_becomes_an_error_row(tmp_path, capsys, plugin):
    from logprep.run.batch import run_settings_sha256
    from logprep.run.config import read_config
    from logprep.run.settings import ScreenSettings
    from logprep.run.welltask import OutputOptions

    def stalls(depth_m, vsh, **kw):
        if depth_m[0] > 1010:
            time.sleep(30)
        return block_cutoff(depth_m, vsh, **kw)

    files = _wells(tmp_path)
    config = tmp_path / "s.toml"
    config.write_text(f'[input]\nwell_time_limit_s = 3.5\n[layers]\nblocking = "{plugin("stalls-test", stalls)}"\n'
                      '[capacity]\nco2_density_mode = "fixed"\n')
    out = tmp_path / "o"
    t0 = time.perf_counter()
    assert main(["screen", *map(str, files), "--out", str(out), "--no-sheet", "--config", str(config)]) == 1
    assert time.perf_counter() - t0 < 20
    summary = pd.read_csv(out / "summary.csv")
    assert summary["status"].tolist() == ["ok", "error", "ok"]
    assert "per-well time limit of 3.5 s" in summary["message"][1]
    assert "--well-time-limit" in summary["message"][1] and "well_time_limit_s" in summary["message"][1]
    assert read_config(out / "logprep-settings.toml")[0]["well_time_limit_s"] == 3.5
    # the option maps to the same field and overrides the file
    from logprep.cli import build_parser

    args = build_parser().parse_args(["screen", "--config", str(config), "--well-time-limit", "7"])
    from logprep.cli import _settings_from_args

    assert _settings_from_args(args).input.well_time_limit_s == 7
    # a limit bounds the run, not the results: reruns do not redo wells for it
    o = OutputOptions()
    assert run_settings_sha256(ScreenSettings(well_time_limit_s=5), o) == \
        run_settings_sha256(ScreenSettings(well_time_limit_s=50), o)
    assert run_settings_sha256(ScreenSettings(sand_cutoff=0.3), o) != run_settings_sha256(ScreenSettings(), o)
    capsys.readouterr()
    assert main(["screen", str(files[0]), "--out", str(tmp_path / "o2"), "--well-time-limit", "-1"]) == 2
    err = capsys.readouterr().err
    assert "--well-time-limit must be >= 0 s" in err and "; " in err


SCAN_AS_NOBODY = r"""
import contextlib, io, os, sys
uid, gid, folder, out, warm = int(sys.argv[1]), int(sys.argv[2]), sys.argv[3], sys.argv[4], sys.argv[5]
from logprep.cli import main
# a first run as root loads every module the run needs (the interpreter's own library may
# lie where the unprivileged user cannot read it), then the privileges go
with contextlib.redirect_stdout(io.StringIO()), contextlib.redirect_stderr(io.StringIO()):
    main(["screen", warm, "--out", warm + "-out", "--no-sheet"])
os.setgroups([]); os.setgid(gid); os.setuid(uid)
sys.exit(main(["screen", folder, "--out", out, "--no-sheet"]))
"""


def _unprivileged_ids() -> tuple[int, int] | None:
    import pwd

    try:
        pw = pwd.getpwnam("nobody")
    except KeyError:
        return None
    return pw.pw_uid, pw.pw_gid


@pytest.mark.skipif(not hasattr(os, "geteuid"), reason="POSIX permissions only")
def test_unreadable_folder_and_file_are_reported_while_scanning(tmp_path):
    # as root nothing is unreadable, so the run goes in a child process that drops to the
    # unprivileged user 'nobody' first
    if os.geteuid() == 0:
        ids = _unprivileged_ids()
        if ids is None:
            pytest.skip("running as root and there is no 'nobody' user to drop to")
    else:
        ids = None
    import shutil
    import tempfile

    base = Path(tempfile.mkdtemp(prefix="logprep-perm-"))  # outside root's private tmp
    try:
        os.chmod(base, 0o777)
        folder = base / "in"
        (folder / "locked").mkdir(parents=True)
        z, gr = make_hostile.column()
        for f in (folder / "good.las", folder / "locked" / "hidden.las", folder / "unreadable.las"):
            f.write_text(make_hostile.las2(list(zip(z, gr)), well=f.stem))
        os.chmod(folder / "locked", 0o000)
        os.chmod(folder / "unreadable.las", 0o000)
        os.chmod(folder, 0o755)
        out = base / "out"
        env = {**os.environ, "PYTHONPATH": os.pathsep.join(sys.path)}
        if ids is not None:
            out.mkdir()
            os.chown(out, *ids)
            warm = base / "warm"
            warm.mkdir()
            shutil.copy(folder / "good.las", warm / "good.las")
            (warm / "bad.las").write_text("~A\n1 2\n")
            cmd = [sys.executable, "-c", SCAN_AS_NOBODY, str(ids[0]), str(ids[1]), str(folder), str(out),
                   str(warm)]
        else:
            cmd = [sys.executable, "-c", "import sys; from logprep.cli import main; sys.exit(main(sys.argv[1:]))",
                   "screen", str(folder), "--out", str(out), "--no-sheet"]
        run = subprocess.run(cmd, capture_output=True, text=True, env=env, timeout=300, cwd=base)
        assert run.returncode == 1, run.stderr
        assert "Traceback" not in run.stderr
        # the folder it could not open is named in the one summary line
        line = run.stdout.strip().splitlines()[-2 if "field overview" in run.stdout else -1]
        scan_lines = [ln for ln in run.stdout.splitlines() if "while scanning" in ln]
        assert len(scan_lines) == 1, run.stdout
        assert "1 unreadable folder(s)" in scan_lines[0] and "locked" in scan_lines[0], line
        # the file it found but may not read is its own error row, saying what to do
        summary = pd.read_csv(out / "summary.csv", keep_default_na=False)
        by = {Path(s).name: r for s, r in zip(summary["source"], summary.to_dict("records"))}
        assert set(by) == {"good.las", "unreadable.las"} and by["good.las"]["status"] == "ok"
        msg = by["unreadable.las"]["message"]
        assert by["unreadable.las"]["status"] == "error" and "Permission denied" in msg and "; " in msg
    finally:
        for p in (base / "in" / "locked", base / "in" / "unreadable.las"):
            if p.exists():
                os.chmod(p, 0o755)
        shutil.rmtree(base, ignore_errors=True)
