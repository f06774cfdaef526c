"""Output files follow the user's umask (as ``open(path, "w")`` would), yet are still
written atomically through a temporary file."""

import os
import stat

import pytest

from logprep.report.writers import current_umask, write_bytes_atomic


@pytest.fixture
def umask():
    """Set a umask for one test and restore the previous one after it."""
    old = os.umask(0o022)
    os.umask(old)

    def set_mask(mask: int) -> None:
        os.umask(mask)

    yield set_mask
    os.umask(old)


@pytest.mark.parametrize("mask, mode", [(0o022, 0o644), (0o002, 0o664), (0o077, 0o600)])
def test_written_file_mode_follows_umask(tmp_path, umask, mask, mode):
    umask(mask)
    assert current_umask() == mask
    path = tmp_path / "sub" / "table.csv"
    write_bytes_atomic(path, b"a,b\n1,2\n")
    assert stat.S_IMODE(path.stat().st_mode) == mode
    # a plain open() under the same umask gives the same mode (POSIX: 0666 & ~umask)
    plain = tmp_path / "plain.csv"
    plain.write_bytes(b"x")
    assert stat.S_IMODE(plain.stat().st_mode) == mode


def test_replacing_keeps_folder_clean_and_mode(tmp_path, umask):
    umask(0o022)
    path = tmp_path / "sheet.png"
    write_bytes_atomic(path, b"old")
    write_bytes_atomic(path, b"new")
    assert path.read_bytes() == b"new"
    assert stat.S_IMODE(path.stat().st_mode) == 0o644
    assert [p.name for p in tmp_path.iterdir()] == ["sheet.png"]  # no temporary left behind


def test_batch_outputs_readable_by_group_and_others(tmp_path, umask, example_dir):
    from logprep.run.batch import screen_paths

    umask(0o022)
    screen_paths([example_dir / "HRM-4.las"], tmp_path, sheets=False)
    files = [p for p in tmp_path.rglob("*") if p.is_file()]
    assert files
    for p in files:
        assert stat.S_IMODE(p.stat().st_mode) == 0o644, p
