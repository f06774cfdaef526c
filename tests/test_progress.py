"""Progress on stderr: a bar on a terminal, one line per well otherwise, errors always."""

import io

from logprep.run.progress import Progress


def run(mode):
    stream = io.StringIO()
    p = Progress(mode, stream)
    p.start(3, skipped=1)
    p.finished("HRM-1", "ok", "5 layers, 2 windows")
    p.finished("bad", "error", message="bad.las: not a readable LAS file")
    p.close()
    return stream.getvalue()


def test_lines_when_not_a_terminal():
    text = run("auto")  # a StringIO is not a terminal
    lines = text.splitlines()
    assert lines[0] == "1 of 3 well(s) unchanged since the last run, skipped"
    assert lines[1].startswith("[2/3] HRM-1: ok (5 layers, 2 windows)")
    assert lines[2] == "error: bad.las: not a readable LAS file"


def test_bar_counts_and_keeps_errors():
    text = run("bar")
    assert "3/3" in text and "well" in text
    assert "error: bad.las: not a readable LAS file" in text


def test_quiet_prints_only_errors_and_silent_nothing():
    assert run("quiet").splitlines() == ["error: bad.las: not a readable LAS file"]
    assert run("silent") == ""
