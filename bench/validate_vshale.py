"""Validate logprep's default clay volume against interpreted lithology on open wells.

Reads labelled open wells (never copied into the repository):

* FORCE 2020 Norwegian wells (``force2020_norway/*.las``), curve
  ``FORCE_2020_LITHOFACIES_LITHOLOGY``: sand = 30000 Sandstone, shale = 65000 Shale, every
  other code (Sandstone/Shale, limestone, marl, ...) left out.  Bormann, Aursand, Dilib,
  Dischington & Manral (2020), FORCE Machine Learning Competition, doi:10.5281/zenodo.4351156;
  released as public data, no licence named in the source repository.
* KGS Hugoton/Panoma wells (``labelled/kgs_panoma/panoma_data__data.csv``), core facies:
  sand = facies 1 (non-marine sandstone), shale = facies 4 (marine siltstone and shale).
  Facies 2-3 (siltstones) are neither; facies 5 "mudstone" is a carbonate mudstone in the
  Dunham (1962) sense, not a shale, so it is left out too, as are the carbonates 6-9.
  Only wells with at least 10 samples of each class are scored.  Kansas Geological Survey
  data, KGS licence (see its KGS_LICENSE.md).

Each well is scored by balanced accuracy of the call "Vsh < 0.5 is sand"
(:mod:`logprep.clay.scoring`) for the naive whole-well P5/P95 linear baseline and for
logprep's default settings (``ScreenSettings()``), printed side by side with medians.

    python bench/validate_vshale.py [OPEN_LOGS_DIR]      # default ../shared/data/open_logs
    python bench/validate_vshale.py --variants [OPEN_LOGS_DIR]

``--variants`` also scores each entry of :data:`VARIANTS` (settings changed from the
default) and prints the FORCE and KGS median and worst well for each, so a proposed change
of default can be compared on the same wells.
"""

from __future__ import annotations

import os
import sys
import warnings
from pathlib import Path

import numpy as np
import pandas as pd

from logprep.io.las import read_well
from logprep.model import WellLog
from logprep.clay.stage import clay_volume
from logprep.run.settings import ScreenSettings
from logprep.clay.scoring import balanced_accuracy, baseline_vsh

REPO = Path(__file__).resolve().parents[1]
FORCE_SAND, FORCE_SHALE = 30000, 65000
KGS_SAND, KGS_SHALE = (1,), (4,)
KGS_MIN_SAMPLES = 10


VARIANTS: dict[str, dict] = {
    "default": {},
    "GR alone (zoned)": {"vsh_combine": "gr"},
    "minimum of GR and ND": {"vsh_combine": "min"},
    "whole-well picks, mean": {"zoning": "none"},
    "no DRHO gate": {"drho_max_g_cm3": 1e9},
    "DRHO gate at 0.15 g/cm3": {"drho_max_g_cm3": 0.15},
    "P10/P90 lines": {"gr_clean": "p10", "gr_shale": "p90"},
    "P5/P90 lines": {"gr_clean": "p5", "gr_shale": "p90"},
    "zones >= 200 m": {"zone_min_m": 200.0},
    "min contrast 0.5": {"min_contrast": 0.5},
    "P5/P90 lines, no DRHO gate": {"gr_shale": "p90", "drho_max_g_cm3": 1e9},
    "P5/P90 lines, whole-well picks": {"gr_shale": "p90", "zoning": "none"},
}
"""Settings compared by ``--variants``: name -> changes to ``ScreenSettings()``."""


def open_logs_dir(argv) -> Path:
    if len(argv) > 1:
        return Path(argv[1])
    return Path(os.environ.get("LOGPREP_OPEN_LOGS", REPO.parent / "shared" / "data" / "open_logs"))


def score_well(well: WellLog, label, sand_codes, shale_codes, settings=ScreenSettings()):
    """``(baseline, default)`` balanced accuracy for one well with a label per sample."""
    label = np.asarray(label, dtype=float)
    is_sand, is_shale = np.isin(label, sand_codes), np.isin(label, shale_codes)
    base = balanced_accuracy(baseline_vsh(well.gr_api), is_sand, is_shale)
    cv = clay_volume(well, settings.clay)
    i0 = int(np.searchsorted(well.depth_m, cv.depth_m[0]))
    sl = slice(i0, i0 + cv.depth_m.size)
    default = balanced_accuracy(cv.vsh, is_sand[sl], is_shale[sl])
    return base, default


def force_rows(root: Path, settings=ScreenSettings()):
    for f in sorted((root / "force2020_norway").glob("*.las")):
        well = read_well(f)
        label = well.curves["FORCE_2020_LITHOFACIES_LITHOLOGY"]
        yield ("FORCE 2020", f.stem, *score_well(well, label, [FORCE_SAND], [FORCE_SHALE], settings))


def kgs_wells(root: Path):
    """The KGS wells as :class:`WellLog` (GR only) with their facies, duplicate depths
    dropped (first kept)."""
    path = root / "labelled" / "kgs_panoma" / "panoma_data__data.csv"
    df = pd.read_csv(path)
    for name, g in df.groupby("Well Name", sort=False):
        g = g.drop_duplicates("Depth").sort_values("Depth")
        well = WellLog(name=name, source=f"{path}#{name}", sha256="", depth_m=g["Depth"].to_numpy(),
                       curves={"GR": g["GR"].to_numpy()}, units={"GR": "API"}, depth_unit="M",
                       gr_mnemonic="GR")
        yield well, g["Facies"].to_numpy()


def kgs_rows(root: Path, settings=ScreenSettings()):
    for well, facies in kgs_wells(root):
        if np.isin(facies, KGS_SAND).sum() < KGS_MIN_SAMPLES or \
                np.isin(facies, KGS_SHALE).sum() < KGS_MIN_SAMPLES:
            continue
        yield ("KGS Panoma", well.name, *score_well(well, facies, KGS_SAND, KGS_SHALE, settings))


def variant_table(root: Path) -> pd.DataFrame:
    """Median and worst balanced accuracy per set for each of :data:`VARIANTS`."""
    rows = []
    for name, changes in VARIANTS.items():
        settings = ScreenSettings().updated(**changes)
        got = pd.DataFrame(list(force_rows(root, settings)) + list(kgs_rows(root, settings)),
                           columns=["set", "well", "baseline", "variant"])
        row = {"variant": name}
        for set_name, g in got.groupby("set", sort=False):
            row[f"{set_name} median"] = g["variant"].median()
            row[f"{set_name} worst"] = g["variant"].min()
            row[f"{set_name} below baseline"] = int((g["variant"] < g["baseline"] - 0.005).sum())
        rows.append(row)
    return pd.DataFrame(rows)


def main(argv=sys.argv) -> int:
    variants = "--variants" in argv
    argv = [a for a in argv if a != "--variants"]
    root = open_logs_dir(argv)
    if not (root / "force2020_norway").is_dir():
        print(f"open data not found at {root}; pass the open_logs folder", file=sys.stderr)
        return 2
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", RuntimeWarning)
        rows = list(force_rows(root)) + list(kgs_rows(root))
    table = pd.DataFrame(rows, columns=["set", "well", "baseline_p5_p95", "logprep_default"])
    table["gain"] = table["logprep_default"] - table["baseline_p5_p95"]
    pd.set_option("display.width", 120)
    print("Sand-versus-shale balanced accuracy (call: Vsh < 0.5 is sand)")
    print(table.to_string(index=False, float_format=lambda x: f"{x:.3f}"))
    for name, g in table.groupby("set", sort=False):
        print(f"{name}: median baseline {g['baseline_p5_p95'].median():.3f}, "
              f"median default {g['logprep_default'].median():.3f}; worst baseline "
              f"{g['baseline_p5_p95'].min():.3f}, worst default {g['logprep_default'].min():.3f} "
              f"({len(g)} wells)")
    print(f"all: median baseline {table['baseline_p5_p95'].median():.3f}, "
          f"median default {table['logprep_default'].median():.3f} ({len(table)} wells)")
    if variants:
        with warnings.catch_warnings():
            warnings.simplefilter("ignore", RuntimeWarning)
            vt = variant_table(root)
        print("\nVariants (balanced accuracy; 'below baseline' counts wells more than 0.005 under the P5/P95 baseline)")
        print(vt.to_string(index=False, float_format=lambda x: f"{x:.3f}"))
    return 0


if __name__ == "__main__":
    sys.exit(main())
