"""Columns a trap can hold: the fault-rock column capped by the structural closure.

A fault seal holds at most the column its capillary pressure supports (the leak-point
column of :mod:`logprep.fault.capacity`), but a trap cannot hold more than its
structural closure, the height from its crest to its spill point (common practice, no
source).  Each fluid column is therefore ``min(fault-rock column, closure)`` and each row
says which limited it (:data:`LIMITS`):

``fault rock``
    the fault rock's capillary pressure (the closure is larger or not given);
``closure``
    the structural closure, the most specific one given: the pair's (``closure_m`` in the
    pairs file) or the named fault's (faults file), else the well's (closures file; for a
    pair or fault the footwall well's, whose sand traps), else the run's (``--closure``);
    ``closure_m`` on each row is the closure used (NaN: none);
``leak``
    the window's minimum SGR is below the leak threshold: the pressure envelope is not
    meant to apply to such a fault (it leaks), so no sealing column is reported (0 m);
``self``
    a sand against itself: no fault seal at all (0 m).

Without a closure, a window whose column exceeds ``unconstrained_column_m`` (default
:data:`UNCONSTRAINED_COLUMN_M`) is flagged ``column_unconstrained``: the number is what the
fault rock could hold, not what the trap holds, and few traps close over more than a few
hundred metres (common practice, no source).
"""

from __future__ import annotations

import numpy as np
import pandas as pd

from logprep.errors import SettingsError

LIMITS = ("fault rock", "closure", "leak", "self")
UNCONSTRAINED_COLUMN_M = 1000.0
"""Column (m) above which a column without a closure is flagged unconstrained."""
FLUIDS = ("oil", "gas", "co2")
CLOSURE_COLUMNS = ["column_oil_limit", "column_gas_limit", "column_co2_limit", "column_unconstrained",
                   "closure_m"]
"""Columns added to ``juxtapositions.csv`` after the capacity columns, in order."""


def check_closure(closure_m: float | None, unconstrained_column_m: float) -> None:
    if closure_m is not None and not closure_m > 0:
        raise SettingsError(f"--closure must be > 0 m (got {closure_m:g}); give the closure "
                            "height above 0 m, or leave --closure out for no cap")
    if not unconstrained_column_m > 0:
        raise SettingsError(f"--unconstrained-column must be > 0 m (got {unconstrained_column_m:g}); "
                            "give a column height above 0 m (unconstrained_column_m in a settings file)")


def capped_column_m(column_m, closure_m: float | None, leaks) -> tuple[np.ndarray, np.ndarray]:
    """``(column, limit)`` per window: ``min(column, closure)`` and the :data:`LIMITS`
    word; 0 m and ``leak`` where ``leaks``.

    >>> c, why = capped_column_m([120.0, 400.0, 50.0], 300.0, [False, False, True])
    >>> c.tolist(), why.tolist()
    ([120.0, 300.0, 0.0], ['fault rock', 'closure', 'leak'])
    """
    col = np.asarray(column_m, float)
    leaks = np.asarray(leaks, bool)
    limit = np.full(col.shape, LIMITS[0], dtype=object)
    if closure_m is not None:
        by_closure = col > closure_m
        col = np.where(by_closure, float(closure_m), col)
        limit[by_closure] = LIMITS[1]
    col = np.where(leaks, 0.0, col)
    limit[leaks] = LIMITS[2]
    return col, limit


def with_closure(table: pd.DataFrame, closure_m: float | None = None, *,
                 unconstrained_column_m: float = UNCONSTRAINED_COLUMN_M,
                 no_seal=("leak", "self")) -> pd.DataFrame:
    """The seal-capacity table with columns capped by the closure, the limit of each fluid
    column and the ``column_unconstrained`` flag (:data:`CLOSURE_COLUMNS`).  Windows whose
    ``verdict`` is one of ``no_seal`` (a leaking fault, a sand against itself) hold no
    sealing column: 0 m, with the verdict word as the limit."""
    check_closure(closure_m, unconstrained_column_m)
    out = table.copy()
    verdicts = out["verdict"].astype(str).to_numpy() if len(out) else np.zeros(0, dtype=object)
    leaks = np.isin(verdicts, list(no_seal))
    longest = np.zeros(len(out))
    for fluid in FLUIDS:
        raw = out[f"column_{fluid}_m"].to_numpy(float)
        longest = np.maximum(longest, np.where(leaks, 0.0, raw))
        col, limit = capped_column_m(raw, closure_m, leaks)
        limit[leaks] = verdicts[leaks]
        out[f"column_{fluid}_m"] = col
        out[f"column_{fluid}_limit"] = pd.Series(list(limit), index=out.index, dtype=object)
        if f"column_{fluid}_ft" in out:
            out[f"column_{fluid}_ft"] = col / 0.3048
    out["column_unconstrained"] = (closure_m is None) & (longest > unconstrained_column_m)
    out["closure_m"] = np.full(len(out), np.nan if closure_m is None else float(closure_m))
    return out


def describe(closure_m: float | None, unconstrained_column_m: float, source: str = "--closure") -> str:
    """One line for the sheet: which closure capped the columns and where it came from
    (``source``: ``--closure``, or the closures, pairs or faults file and its row)."""
    if closure_m is None:
        return (f"no structural closure given ({source}): columns are what the fault rock could "
                f"hold; over {unconstrained_column_m:g} m flagged unconstrained")
    return f"columns capped at the structural closure of {closure_m:g} m ({source})"
