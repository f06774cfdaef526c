"""The package layout holds: stages layered as the import contracts in pyproject.toml say,
no import circles anywhere, small modules, and a lint-clean tree (common practice, no source)."""

from __future__ import annotations

import shutil
import subprocess
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[1]
BIN = Path(sys.executable).parent
MAX_MODULE_LINES = 420  # "about 400 lines": a module beyond this should be split


def _tool(name: str) -> str:
    exe = BIN / name
    if exe.exists():
        return str(exe)
    found = shutil.which(name)
    if found is None:
        pytest.skip(f"{name} is not installed (pip install '.[test]' installs it)")
    return found


def test_layering_contracts_hold():
    """import-linter checks the contracts of pyproject.toml; a wrong import fails with the
    two modules named in its report."""
    run = subprocess.run([_tool("lint-imports"), "--no-cache"], cwd=REPO, capture_output=True, text=True)
    assert run.returncode == 0, run.stdout[-3000:] + run.stderr[-2000:]
    assert "0 broken" in run.stdout


def test_no_import_circles():
    """No module reaches itself through imports (lazy imports inside functions count too)."""
    grimp = pytest.importorskip("grimp")
    graph = grimp.build_graph("logprep")
    circles = []
    for module in sorted(graph.modules):
        for imported in graph.find_modules_directly_imported_by(module):
            if imported.startswith("logprep") and imported != module:
                back = graph.find_shortest_chain(importer=imported, imported=module)
                if back:
                    circles.append(" -> ".join((module,) + tuple(back)))
    assert not circles, "import circles:\n" + "\n".join(circles)


def test_modules_are_small():
    big = {str(p.relative_to(REPO)): n for p in sorted((REPO / "logprep").rglob("*.py"))
           if (n := len(p.read_text(encoding="utf-8").splitlines())) > MAX_MODULE_LINES}
    assert not big, f"modules over {MAX_MODULE_LINES} lines (split them): {big}"


def test_ruff_is_clean():
    run = subprocess.run([_tool("ruff"), "check", "--no-cache", "."], cwd=REPO, capture_output=True, text=True)
    assert run.returncode == 0, run.stdout[-3000:] + run.stderr[-2000:]


def test_public_face_exports_what_a_notebook_needs():
    import logprep

    for name in ("screen_file", "ScreenSettings", "read_well", "WellScreening", "LogprepError"):
        assert name in logprep.__all__ and getattr(logprep, name) is not None
