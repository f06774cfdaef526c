"""Generate a folder of synthetic LAS wells for the batch benchmark (invented Harrowmere
bench wells HRM-B01...; nothing here comes from real data).

Each well is a random sand-shale succession (beds 0.5-25 m thick, Vsh per bed from a
beta distribution) turned into GR = 25 + 95 Vsh API, smoothed over about 0.6 m (tool
response) and given 3 API of noise, sampled every 0.1524 m, with a density curve.  A fixed
random_state makes the folder the same on every run.  Of the ``n`` wells, ``n_big`` have 20,000
samples, one is logged in feet and two have problems a batch must report and go past: one
has no gamma-ray curve, one is not a LAS file at all.

Usage: python bench/make_batch_wells.py OUT_DIR [--n 60] [--n-big 10]
"""

from __future__ import annotations

import argparse
from pathlib import Path

import numpy as np

STEP_M = 0.1524
FT = 0.3048
BIG_SAMPLES = 20_000


def succession_vsh(n_samples: int, rng: np.random.Generator) -> np.ndarray:
    """Vsh per sample of a random bed succession (fraction)."""
    total = n_samples * STEP_M
    tops, vsh, z = [], [], 0.0
    while z < total:
        tops.append(z)
        vsh.append(rng.beta(0.6, 0.6))
        z += rng.uniform(0.5, 25.0)
    depth = STEP_M * np.arange(n_samples)
    v = np.asarray(vsh)[np.searchsorted(tops, depth, side="right") - 1]
    kernel = np.exp(-0.5 * (np.arange(-6, 7) * STEP_M / 0.3) ** 2)
    return np.convolve(np.pad(v, 6, mode="edge"), kernel / kernel.sum(), mode="valid")


def las_text(name: str, depth, curves: dict[str, tuple[str, np.ndarray]], unit: str = "M") -> str:
    head = (f"~VERSION INFORMATION\n VERS.  2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0\n"
            f" WRAP.  NO  : ONE LINE PER DEPTH STEP\n~WELL INFORMATION\n"
            f" STRT.{unit} {depth[0]:.4f} :\n STOP.{unit} {depth[-1]:.4f} :\n"
            f" STEP.{unit} {depth[1] - depth[0]:.4f} :\n NULL.  -999.25 :\n WELL.  {name} : WELL\n"
            f" FLD .  HARROWMERE : FIELD (fictitious)\n~CURVE INFORMATION\n DEPT.{unit} : DEPTH\n")
    head += "".join(f" {m}.{u} : {m}\n" for m, (u, _) in curves.items())
    cols = np.column_stack([depth] + [v for _, v in curves.values()])
    body = "\n".join(" ".join(f"{x:.4f}" for x in row) for row in cols)
    return head + "~A\n" + body + "\n"


def make_wells(out_dir: str | Path, n: int = 60, n_big: int = 10, random_state: int = 20_261_202) -> list[Path]:
    """Write the bench wells into ``out_dir``; returns their paths."""
    out = Path(out_dir)
    out.mkdir(parents=True, exist_ok=True)
    rng = np.random.default_rng(random_state)
    paths = []
    for k in range(n):
        name = f"HRM-B{k + 1:02d}"
        path = out / f"{name}.las"
        paths.append(path)
        if k == n - 1:  # a problem: not a LAS file
            path.write_text("this file was saved from a spreadsheet by mistake\n1,2,3\n")
            continue
        samples = BIG_SAMPLES if k < n_big else int(rng.integers(3_000, 7_000))
        vsh = succession_vsh(samples, rng)
        gr = 25 + 95 * vsh + rng.normal(0, 3, samples)
        rhob = 2.65 - 0.25 * (1 - vsh) + rng.normal(0, 0.01, samples)
        depth = 1200.0 + STEP_M * np.arange(samples)
        curves = {"GR": ("GAPI", gr), "RHOB": ("G/C3", rhob)}
        unit = "M"
        if k == n - 2:  # a problem: no gamma-ray curve
            curves = {"RHOB": ("G/C3", rhob)}
        if k == n_big:  # one well logged in feet
            depth, unit = depth / FT, "FT"
        path.write_text(las_text(name, depth, curves, unit))
    return paths


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("out_dir")
    ap.add_argument("--n", type=int, default=60)
    ap.add_argument("--n-big", type=int, default=10)
    args = ap.parse_args()
    paths = make_wells(args.out_dir, args.n, args.n_big)
    print(f"{len(paths)} wells in {args.out_dir}")


if __name__ == "__main__":
    main()
