"""How firm the ground under a window is: partly filled, flagged or thin sands.

A window between two sands is only as good as the two layers it rests on.  For each row
of ``juxtapositions.csv`` these columns say whether either sand was partly interpolated,
carries QC-flagged or unusable samples, or is thinner than a stated limit, so a user can
sort out windows that rest on weak ground.  Pure numpy/pandas.
"""

from __future__ import annotations

import numpy as np
import pandas as pd

FOOTING_COLUMNS = ["footwall_filled_fraction", "hangingwall_filled_fraction",
                   "footwall_flagged_fraction", "hangingwall_flagged_fraction",
                   "partly_filled", "flagged", "thin", "footing"]


def window_footing(windows: pd.DataFrame, filled_fraction, flagged_fraction, thickness_m, *,
                   thin_m: float = 3.0, flagged_limit: float = 0.2) -> pd.DataFrame:
    """Footing columns (:data:`FOOTING_COLUMNS`) for ``windows`` (which must carry
    ``footwall_layer`` and ``hangingwall_layer`` indices).

    Parameters
    ----------
    filled_fraction, flagged_fraction, thickness_m : array_like
        Per layer: share of thickness interpolated, share of samples with a QC flag or
        unusable, and thickness (m).
    thin_m : float
        A sand thinner than this (m) is ``thin`` (about the vertical resolution of a GR
        tool and a few samples; common practice, no source).
    flagged_limit : float
        A sand with more than this share of flagged samples is ``flagged``.

    ``footing`` is ``sound`` or the list of weaknesses (``partly filled; thin``).
    """
    fi = windows["footwall_layer"].to_numpy(int)
    hi = windows["hangingwall_layer"].to_numpy(int)
    ff = np.asarray(filled_fraction, dtype=float)
    fl = np.asarray(flagged_fraction, dtype=float)
    th = np.asarray(thickness_m, dtype=float)
    out = pd.DataFrame(index=windows.index)
    out["footwall_filled_fraction"] = ff[fi] if len(fi) else np.array([], float)
    out["hangingwall_filled_fraction"] = ff[hi] if len(hi) else np.array([], float)
    out["footwall_flagged_fraction"] = fl[fi] if len(fi) else np.array([], float)
    out["hangingwall_flagged_fraction"] = fl[hi] if len(hi) else np.array([], float)
    out["partly_filled"] = (out["footwall_filled_fraction"] > 0) | (out["hangingwall_filled_fraction"] > 0)
    out["flagged"] = ((out["footwall_flagged_fraction"] > flagged_limit)
                      | (out["hangingwall_flagged_fraction"] > flagged_limit))
    out["thin"] = (th[fi] < thin_m) | (th[hi] < thin_m) if len(fi) else np.array([], bool)
    words = []
    for pf, fg, tn in zip(out["partly_filled"], out["flagged"], out["thin"]):
        w = [n for n, v in (("partly filled", pf), ("flagged", fg), ("thin", tn)) if v]
        words.append("; ".join(w) if w else "sound")
    out["footing"] = pd.Series(words, index=windows.index, dtype=object)
    return out.astype({"partly_filled": bool, "flagged": bool, "thin": bool})
