"""In-sample upper bounds for the sand calls of ``validate_sands.py`` (``--bounds``).

Two numbers per labelled well, both allowed to look at the labels (so neither is a score
of logprep, only a ceiling for any rule of its kind on these logs):

* **oracle cut-off**: the best single Vsh cut-off for this well, applied to the per-sample
  Vsh that logprep computes (no blocking; samples of a rock class or unusable are never
  sand, as in the layers), chosen for the highest precision among the cut-offs that keep
  recall >= 0.75 (the recall target).  Pooled over the wells this is what a per-well
  perfectly tuned cut-off would reach.
* **indistinguishable sandstone**: the well's samples are put in cells of its own logs
  (GR index in tenths of its P5-P95 range, bulk density in 0.05 g/cm3, neutron in
  0.03 v/v, compressional slowness in 5 us/ft; each only where the well has the curve),
  and a labelled Sandstone sample counts as indistinguishable when its cell holds at least
  as many labelled Shale samples.  Any rule working on these logs at this resolution
  calls such a sample and its shale neighbours alike.  Bin widths are about the tools'
  repeatability times a few (common practice, no source).
"""

from __future__ import annotations

import numpy as np
import pandas as pd

from logprep.io.las import well_curve
from logprep.layers.rockscore import TRUE_SAND
from logprep.run.pipeline import _column_stages

CUTS = np.round(np.arange(0.05, 0.951, 0.025), 3)
BINS = {"rhob": 0.05, "nphi": 0.03, "dt": 5.0}


def oracle_cutoff(well, labels, settings) -> dict:
    """Best per-well cut-off on the sample Vsh by balanced accuracy (see the module notes)."""
    _, _, _, cv, col, _, _ = _column_stages(well, settings, None)
    k0 = int(np.searchsorted(well.depth_m, cv.depth_m[0]))
    lab = np.asarray(labels, dtype=object)[k0:k0 + cv.depth_m.size]
    lab = np.array(["" if x is None else str(x) for x in lab], dtype=object)
    blocked = np.zeros(lab.size, dtype=bool)
    if cv.rock is not None and cv.rock.size:
        blocked |= cv.rock != ""
    for m in (cv.unusable or {}).values():
        blocked |= m
    has = lab != ""
    sand = lab == "sandstone"
    good = np.isin(lab, TRUE_SAND)
    all_lab = np.asarray(labels, dtype=object)
    n_sand_all = int((all_lab == "sandstone").sum())
    n_shale_all = int((all_lab == "shale").sum())
    best = None
    for c in CUTS:
        called = (col.vsh < c) & ~blocked & has
        if not called.any():
            continue
        rec = (called & sand).sum() / max(n_sand_all, 1)
        kept_out = 1.0 - (called & (lab == "shale")).sum() / max(n_shale_all, 1)
        ba = 0.5 * (rec + kept_out)
        if best is None or ba > best["ba"]:
            best = {"cut": float(c), "ba": float(ba), "precision": float((called & good).sum() / called.sum()),
                    "recall": float(rec), "called": int(called.sum()), "true": int((called & good).sum())}
    return best or {"cut": np.nan, "ba": np.nan, "precision": np.nan, "recall": np.nan,
                    "called": 0, "true": 0}


def indistinguishable(well, labels) -> dict:
    """Share of labelled Sandstone in cells where labelled Shale is at least as common."""
    lab = np.array(["" if x is None else str(x) for x in labels], dtype=object)
    gr = well.gr_api
    ok = np.isfinite(gr)
    p5, p95 = np.nanpercentile(gr[ok], [5, 95])
    cells = {"gr": np.floor(10 * (gr - p5) / max(p95 - p5, 1e-9))}
    for kind, width in BINS.items():
        found = well_curve(well, kind)
        if found is not None and np.isfinite(found[0]).mean() > 0.5:
            cells[kind] = np.floor(np.asarray(found[0], dtype=float) / width)
    df = pd.DataFrame(cells)
    df["lab"] = lab
    df = df[np.isin(lab, ["sandstone", "shale"])].dropna()
    if df.empty:
        return {"logs": "+".join(cells), "sandstone": 0, "indistinguishable": np.nan}
    keys = [k for k in cells]
    counts = df.groupby(keys)["lab"].value_counts().unstack(fill_value=0)
    for c in ("sandstone", "shale"):
        if c not in counts:
            counts[c] = 0
    lost = counts.loc[counts["shale"] >= counts["sandstone"], "sandstone"].sum()
    return {"logs": "+".join(cells), "sandstone": int(counts["sandstone"].sum()),
            "indistinguishable": float(lost / max(counts["sandstone"].sum(), 1))}


def print_bounds(wells, settings) -> None:
    """Print both bounds per well and pooled."""
    rows = []
    for well, labels in wells:
        o = oracle_cutoff(well, labels, settings)
        d = indistinguishable(well, labels)
        rows.append({"well": well.name, **{f"oracle_{k}": v for k, v in o.items()}, **d})
    df = pd.DataFrame(rows)
    print("\nUpper bounds (in sample, looking at the labels; not scores of logprep)")
    print(df.to_string(index=False, float_format=lambda x: f"{x:.2f}"))
    pooled = df["oracle_true"].sum() / max(df["oracle_called"].sum(), 1)
    lost = (df["indistinguishable"] * df["sandstone"]).sum() / max(df["sandstone"].sum(), 1)
    print(f"  oracle per-well cut-off (best balanced accuracy): median BA "
          f"{df['oracle_ba'].median():.3f}, worst {df['oracle_ba'].min():.3f}, pooled precision "
          f"{pooled:.3f}, median recall {df['oracle_recall'].median():.3f} (cut-offs "
          f"{df['oracle_cut'].min():.2f}-{df['oracle_cut'].max():.2f})")
    print(f"  labelled Sandstone indistinguishable from labelled Shale on the well's logs: "
          f"{lost:.1%} pooled, median well {df['indistinguishable'].median():.1%}")
