"""Benchmark: start-up of the command line, as ratios to baselines measured in the same run.

Times, each in a fresh process (best of ``--repeat``):

* the bare interpreter (``python -c pass``): the floor any Python command pays;
* ``logprep --version``: should cost about the floor (no numpy, pandas or matplotlib
  imported to print a version);
* ``python -c "import pandas"``: what every command paid when the CLI imported the
  science at load time;
* ``logprep screen --help``: the options need the registries, so this one imports the
  science (shown for comparison).

It also lists the heavy modules that ``import logprep.cli`` loads (target: none).

Run:  python bench/bench_cli_startup.py [--repeat 7]
"""

from __future__ import annotations

import argparse
import shutil
import subprocess
import sys
from pathlib import Path

from timing import best_time_s

HEAVY = ("numpy", "pandas", "scipy", "matplotlib", "lasio")


def logprep_command() -> list[str]:
    script = Path(sys.executable).with_name("logprep")
    if script.exists():
        return [str(script)]
    found = shutil.which("logprep")
    return [found] if found else [sys.executable, "-m", "logprep.cli"]


def run(cmd: list[str]) -> None:
    subprocess.run(cmd, check=True, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--repeat", type=int, default=7)
    args = ap.parse_args()
    cli = logprep_command()
    cases = [
        ("python -c pass (floor)", [sys.executable, "-c", "pass"]),
        ("logprep --version", cli + ["--version"]),
        ('python -c "import pandas"', [sys.executable, "-c", "import pandas"]),
        ("logprep screen --help", cli + ["screen", "--help"]),
    ]
    times = {name: best_time_s(lambda c=cmd: run(c), args.repeat) for name, cmd in cases}
    floor = times[cases[0][0]]
    for name, t in times.items():
        print(f"  {name:<28} {t * 1e3:7.0f} ms   {t / floor:5.2f} x the floor")
    print(f"  --version against importing pandas: {times['logprep --version'] / times[cases[2][0]]:.2f} x")
    probe = ("import sys, logprep.cli; "
             f"print(','.join(m for m in {HEAVY!r} if m in sys.modules) or 'none')")
    loaded = subprocess.run([sys.executable, "-c", probe], check=True, capture_output=True,
                            text=True).stdout.strip()
    print(f"  heavy modules loaded by 'import logprep.cli': {loaded} (target: none)")


if __name__ == "__main__":
    main()
