"""Fuzz the reader and the screening science with mutated LAS files and report what happened.

Mutations of the good files of the hostile corpus (tests/data/hostile) and the example
wells: bytes flipped, inserted, deleted or truncated; whole lines duplicated or dropped;
numbers replaced by extremes (1e308, -1e308, 1e-300, inf, nan, 1e15, 0).  Each mutant is
read with ``read_well`` and, when that succeeds, screened with ``screen_well`` (no sheet).
Any exception outside logprep's error family is a finding: it is printed with its
traceback and the mutant is saved under --keep.

Run:  python bench/fuzz_reader.py [--cases N] [--random-state S] [--keep DIR] [--no-screen]
"""

from __future__ import annotations

import argparse
import collections
import random
import sys
import tempfile
import time
import traceback
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
EXTREMES = [b"1e308", b"-1e308", b"1e-300", b"inf", b"nan", b"1e15", b"0", b"-0", b"1e+999"]


def sources() -> list[bytes]:
    files = sorted((ROOT / "tests" / "data" / "hostile").glob("good_*.las"))
    files += sorted((ROOT / "example_logs").glob("*.las"))
    return [f.read_bytes() for f in files]


def mutate(data: bytes, rng: random.Random) -> bytes:
    b = bytearray(data)
    kind = rng.randrange(7)
    if kind == 0 and b:  # flip bytes
        for _ in range(rng.randint(1, 8)):
            b[rng.randrange(len(b))] = rng.randrange(256)
    elif kind == 1:  # insert bytes
        k = rng.randrange(len(b) + 1)
        b[k:k] = bytes(rng.randrange(256) for _ in range(rng.randint(1, 16)))
    elif kind == 2 and b:  # delete a span
        k = rng.randrange(len(b))
        del b[k:k + rng.randint(1, 200)]
    elif kind == 3:  # truncate
        b = b[:rng.randrange(len(b) + 1)]
    lines = bytes(b).split(b"\n")
    if kind == 4 and lines:  # duplicate or drop lines
        k = rng.randrange(len(lines))
        lines = lines[:k] + ([lines[k]] * rng.randint(0, 3)) + lines[k + 1:]
    elif kind in (5, 6) and lines:  # extreme numbers in a column or a cell
        k = rng.randrange(len(lines))
        parts = lines[k].split()
        if parts:
            parts[rng.randrange(len(parts))] = rng.choice(EXTREMES)
            lines[k] = b" ".join(parts)
        if kind == 6:  # a whole column
            j = rng.randrange(2)
            value = rng.choice(EXTREMES)
            lines = [b" ".join(value if i == j else p for i, p in enumerate(ln.split()))
                     if ln[:1].isdigit() or ln[:2].strip()[:1].isdigit() else ln for ln in lines]
    return b"\n".join(lines)


def main() -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--cases", type=int, default=2000)
    ap.add_argument("--random-state", type=int, default=1)
    ap.add_argument("--keep", default="fuzz-findings")
    ap.add_argument("--no-screen", action="store_true", help="read only, do not screen")
    args = ap.parse_args()

    from logprep.errors import LogprepError
    from logprep.io.las import read_well
    from logprep.run.pipeline import screen_well

    rng = random.Random(args.random_state)
    base = sources()
    outcomes: collections.Counter = collections.Counter()
    findings = []
    slowest = (0.0, "")
    with tempfile.TemporaryDirectory() as tmp:
        path = Path(tmp) / "mutant.las"
        for case in range(args.cases):
            data = mutate(rng.choice(base), rng)
            path.write_bytes(data)
            t0 = time.perf_counter()
            try:
                well = read_well(path)
                if not args.no_screen:
                    screen_well(well)
                outcomes["ok"] += 1
            except LogprepError as exc:
                outcomes[f"refused: {type(exc).__name__}"] += 1
            except Exception:  # noqa: BLE001 - a finding, reported below
                outcomes["FINDING"] += 1
                keep = Path(args.keep)
                keep.mkdir(exist_ok=True)
                (keep / f"case{case:05d}.las").write_bytes(data)
                findings.append((case, traceback.format_exc()))
            dt = time.perf_counter() - t0
            slowest = max(slowest, (dt, f"case {case}"))
    print(f"{args.cases} mutants (random_state {args.random_state}): " + ", ".join(f"{k} {v}" for k, v in sorted(outcomes.items())))
    print(f"slowest: {slowest[0]:.2f} s ({slowest[1]})")
    for case, tb in findings[:10]:
        print(f"--- finding, case {case} (kept in {args.keep}):\n{tb}")
    return 1 if findings else 0


if __name__ == "__main__":
    sys.exit(main())
