"""Scoring a clay-volume curve against interpreted lithology (sand versus shale).

Used by ``bench/validate_vshale.py`` and the regression floor in the tests.  A Vsh curve
becomes a call per sample: **sand where Vsh < 0.5, shale where Vsh >= 0.5** (0.5 is the
midpoint of the default sand and shale cut-offs, 0.35 and 0.65).  Samples labelled
anything but sand or shale, and samples without a Vsh, are left out.
"""

from __future__ import annotations

import numpy as np

from logprep.clay.vshale import gamma_ray_index

SAND_CALL_BELOW = 0.5


def balanced_accuracy(vsh, is_sand, is_shale, *, cut: float = SAND_CALL_BELOW) -> float:
    """Mean of the sand recall and the shale recall of the call ``Vsh < cut`` = sand.

    Balanced accuracy (Brodersen et al. 2010, The balanced accuracy and its posterior
    distribution, ICPR 2010, 3121-3124) weighs both classes equally whatever their
    shares.  NaN when either class has no scored sample.
    """
    v = np.asarray(vsh, dtype=float)
    sand = np.asarray(is_sand, dtype=bool) & np.isfinite(v)
    shale = np.asarray(is_shale, dtype=bool) & np.isfinite(v)
    if not sand.any() or not shale.any():
        return float("nan")
    return 0.5 * (float(np.mean(v[sand] < cut)) + float(np.mean(v[shale] >= cut)))


def baseline_vsh(gr_api) -> np.ndarray:
    """The naive reference: linear Vsh with the clean and shale lines at the P5 and P95
    of all the well's valid GR readings, no QC, no zones."""
    gr = np.asarray(gr_api, dtype=float)
    clean, shale = np.nanpercentile(gr, [5, 95])
    return gamma_ray_index(gr, clean, shale)
