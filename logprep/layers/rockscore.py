"""Scoring a blocked column against described rock: does what logprep calls sand hold sand?

The reference is a lithology name per sample: from a label curve in the LAS file, or from
a core or cuttings description (depth intervals, see :mod:`logprep.io.descriptions`)
turned into one label per sample.  Labels are logprep's rock groups of
:data:`REFERENCE_GROUPS` (``sandstone``, ``sandy shale``, ``shale``, ``marl``, ...);
samples without a label are left out.

A sample is **called reservoir** when it lies in a layer counted as reservoir (by default
the ``sand`` layers of ``layers.csv``).  The scores (all shares of labelled samples):

* ``precision``: of the samples called reservoir, the share labelled ``sandstone`` or
  ``sandy shale`` (interbedded sandstone and shale);
* ``recall``: of the samples labelled ``sandstone``, the share called reservoir;
* ``balanced_accuracy``: mean of the recall and of the share of ``shale`` samples *not*
  called reservoir (Brodersen, Ong, Stephan & Buhmann 2010, The balanced accuracy and its
  posterior distribution, ICPR 2010, 3121-3124): it weighs sand and shale equally
  whatever their shares in the well;
* ``in_sand_<group>``: the share of each group's samples called reservoir.

Labelled samples outside the screened interval count as not called reservoir (a sand the
screening never saw is a sand it missed).  Pure numpy/pandas.
"""

from __future__ import annotations

import numpy as np
import pandas as pd

REFERENCE_GROUPS = ("sandstone", "sandy shale", "shale", "marl", "limestone", "chalk",
                    "dolomite", "coal", "anhydrite", "halite", "tuff", "basement", "other")
"""Rock groups a reference label is put in."""

TRUE_SAND = ("sandstone", "sandy shale")
"""Groups that count as a correct reservoir call (sandstone, or interbedded sand/shale)."""

SCORE_COLUMNS = ["labelled", "called_sand", "precision", "recall", "shale_kept_out",
                 "balanced_accuracy"]


def layer_at(depth_m, top_m, base_m) -> np.ndarray:
    """Index of the layer each depth falls in (``top <= z < base``), -1 outside."""
    z = np.asarray(depth_m, dtype=float)
    top = np.asarray(top_m, dtype=float)
    base = np.asarray(base_m, dtype=float)
    if top.size == 0:
        return np.full(z.shape, -1, dtype=np.intp)
    k = np.searchsorted(top, z, side="right") - 1
    inside = (k >= 0) & (z < base[np.clip(k, 0, None)])
    return np.where(inside, k, -1)


def called_reservoir(depth_m, top_m, base_m, reservoir) -> np.ndarray:
    """True for each depth that lies in a layer flagged in ``reservoir`` (bool per layer)."""
    k = layer_at(depth_m, top_m, base_m)
    res = np.asarray(reservoir, dtype=bool)
    return (k >= 0) & res[np.clip(k, 0, max(res.size - 1, 0))] if res.size else np.zeros(k.shape, bool)


def rock_scores(called, labels) -> dict:
    """The scores of one well (see the module notes).

    Parameters
    ----------
    called : array_like of bool
        Per sample: called reservoir.
    labels : array_like of str
        Per sample: a group of :data:`REFERENCE_GROUPS`, or ``""`` / None where there is no
        label.

    Returns
    -------
    dict with :data:`SCORE_COLUMNS` (NaN where a share has no sample) and
    ``in_sand_<group>`` for every group, plus the raw counts ``n_<group>``.
    """
    called = np.asarray(called, dtype=bool)
    lab = np.array(["" if x is None else str(x) for x in labels], dtype=object)
    has = lab != ""

    def share(num, den):
        return float(num) / float(den) if den else float("nan")

    sand_lab = np.isin(lab, ["sandstone"])
    shale_lab = lab == "shale"
    true_sand = np.isin(lab, TRUE_SAND)
    out = {
        "labelled": int(has.sum()),
        "called_sand": int((called & has).sum()),
        "precision": share((called & true_sand).sum(), (called & has).sum()),
        "recall": share((called & sand_lab).sum(), sand_lab.sum()),
        "shale_kept_out": share((~called & shale_lab).sum(), shale_lab.sum()),
    }
    out["balanced_accuracy"] = 0.5 * (out["recall"] + out["shale_kept_out"])
    for g in REFERENCE_GROUPS:
        m = lab == g
        out[f"n_{g}"] = int(m.sum())
        out[f"in_sand_{g}"] = share((called & m).sum(), m.sum())
    return out


def pooled_scores(per_well: pd.DataFrame) -> dict:
    """Scores over all wells' samples together, from the counts of :func:`rock_scores` rows
    (columns ``called_sand``, ``n_<group>``, ``in_sand_<group>``)."""
    n = {g: per_well[f"n_{g}"].sum() for g in REFERENCE_GROUPS}
    hit = {g: (per_well[f"n_{g}"] * per_well[f"in_sand_{g}"].fillna(0.0)).sum()
           for g in REFERENCE_GROUPS}
    called = sum(hit.values())

    def share(a, b):
        return float(a) / float(b) if b else float("nan")

    out = {
        "labelled": int(sum(n.values())),
        "called_sand": round(called),
        "precision": share(sum(hit[g] for g in TRUE_SAND), called),
        "recall": share(hit["sandstone"], n["sandstone"]),
        "shale_kept_out": share(n["shale"] - hit["shale"], n["shale"]),
    }
    out["balanced_accuracy"] = 0.5 * (out["recall"] + out["shale_kept_out"])
    for g in REFERENCE_GROUPS:
        out[f"n_{g}"] = int(n[g])
        out[f"in_sand_{g}"] = share(hit[g], n[g])
    return out


def sand_composition(per_well: pd.DataFrame) -> dict:
    """Pooled share of each group among the labelled samples called reservoir."""
    hit = {g: (per_well[f"n_{g}"] * per_well[f"in_sand_{g}"].fillna(0.0)).sum()
           for g in REFERENCE_GROUPS}
    total = sum(hit.values())
    return {g: (hit[g] / total if total else float("nan")) for g in REFERENCE_GROUPS}
