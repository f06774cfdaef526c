"""The fast paths of the per-well stages against plain references.

The changepoint search, the sand-sand windows and the smear fields were rewritten so
that their cost grows with the work (samples x throws) rather than faster.  Each must give
exactly what the plain method gives: the references below are the direct definitions
(one step per end; every pair of sands; every point and bed), compared bit for bit.
"""

from __future__ import annotations

import itertools

import numpy as np
import pandas as pd
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from logprep.changepoint import pelt_mean_breaks
from logprep.fault.juxtaposition import (
    WINDOW_COLUMNS,
    _sgr_extremes,
    cumulative_clay,
    juxtaposition_throw_range,
    max_contact_m,
    sand_windows,
)
from logprep.model import LITHOLOGIES, Layers
from logprep.fault.smear import smear_at, smear_fields


def pelt_one_end_at_a_time(x, penalty, min_size):
    """PELT (Killick et al. 2012) with a minimum segment, one end per step: the reference."""
    x = np.asarray(x, float)
    n = x.size
    if n < 2 * min_size:
        return []
    s1 = np.concatenate(([0.0], np.cumsum(x)))
    s2 = np.concatenate(([0.0], np.cumsum(x * x)))
    best = np.full(n + 1, np.inf)
    best[0] = -penalty
    last = np.zeros(n + 1, dtype=int)
    cand, drop_at = [], []
    for t in range(min_size, n + 1):
        if np.isfinite(best[t - min_size]):
            cand.append(t - min_size)
            drop_at.append(n + 1)
        keep = [k for k in range(len(cand)) if drop_at[k] > t]
        cand, drop_at = [cand[k] for k in keep], [drop_at[k] for k in keep]
        c = np.array(cand)
        m = t - c
        cost = np.maximum((s2[t] - s2[c]) - (s1[t] - s1[c]) ** 2 / m, 0.0)
        total = best[c] + cost
        k = int(np.argmin(total))
        best[t] = total[k] + penalty
        last[t] = c[k]
        for j in range(len(cand)):
            if total[j] > best[t] and drop_at[j] > n:
                drop_at[j] = t + min_size
    out, t = [], n
    while t > 0:
        t = int(last[t])
        if t > 0:
            out.append(t)
    return out[::-1]


def optimal_partition_cost(x, breaks, penalty):
    edges = [0, *breaks, len(x)]
    return sum(float(np.sum((x[a:b] - x[a:b].mean()) ** 2)) for a, b in itertools.pairwise(edges)) \
        + penalty * len(breaks)


@settings(max_examples=60, deadline=None)
@given(random_state=st.integers(0, 10_000), n=st.integers(2, 300), min_size=st.integers(1, 40),
       penalty=st.sampled_from([0.0, 0.3, 2.0, 25.0]), kind=st.sampled_from(["noise", "steps", "ties"]))
def test_changepoint_blocks_match_one_end_at_a_time(random_state, n, min_size, penalty, kind):
    rng = np.random.default_rng(random_state)
    if kind == "noise":
        x = rng.normal(0, 1, n)
    elif kind == "steps":
        x = np.repeat(rng.normal(0, 3, n // 7 + 1), 7)[:n] + rng.normal(0, 0.4, n)
    else:
        x = np.round(rng.normal(0, 1, n), 0)  # many equal costs: the tie rule must agree
    assert pelt_mean_breaks(x, penalty, min_size).tolist() == pelt_one_end_at_a_time(x, penalty, min_size)


def test_changepoint_search_is_optimal_on_small_series():
    """Against exhaustive optimal partitioning (Jackson et al. 2005) without pruning."""
    rng = np.random.default_rng(3)
    for _ in range(20):
        n, min_size, penalty = 40, 3, 1.5
        x = np.repeat(rng.normal(0, 2, 8), 5) + rng.normal(0, 0.5, n)
        best = np.full(n + 1, np.inf)
        best[0] = -penalty
        for t in range(min_size, n + 1):
            for s in range(t - min_size + 1):
                if np.isfinite(best[s]):
                    seg = x[s:t]
                    best[t] = min(best[t], best[s] + float(np.sum((seg - seg.mean()) ** 2)) + penalty)
        got = optimal_partition_cost(x, pelt_mean_breaks(x, penalty, min_size).tolist(), penalty)
        assert got == pytest.approx(best[n], rel=1e-9, abs=1e-9)


def random_layers(rng, n_layers=60, thin=0.2, thick=12.0) -> Layers:
    h = rng.uniform(thin, thick, n_layers)
    top = 1000.0 + np.concatenate(([0.0], np.cumsum(h)[:-1]))
    code = rng.integers(0, 3, n_layers)
    code[1:][code[1:] == code[:-1]] = (code[:-1][code[1:] == code[:-1]] + 1) % 3
    vsh = np.choose(code, [rng.uniform(0, 0.3, n_layers), rng.uniform(0.4, 0.6, n_layers),
                           rng.uniform(0.7, 1, n_layers)])
    return Layers(top, top + h, vsh, [LITHOLOGIES[c] for c in code])


def every_pair_windows(layers: Layers, throw_max_m: float) -> pd.DataFrame:
    """Every sand against every sand, kept where they touch: the plain definition."""
    idx = [i for i, lith in enumerate(layers.lithology) if lith == "sand"]
    _, clay = cumulative_clay(layers)
    rows = []
    for fi in idx:
        a, b = layers.top_m[fi], layers.base_m[fi]
        for hi in idx:
            c, e = layers.top_m[hi], layers.base_m[hi]
            lo, hi_t = juxtaposition_throw_range(a, b, c, e)
            hi_cap = min(float(hi_t), throw_max_m)
            if not lo < hi_cap:
                continue
            smin, smax = _sgr_extremes(a, b, c, e, layers.vsh[fi], layers.vsh[hi], clay[fi],
                                       clay[hi], fi == hi, hi_cap)
            rows.append({"footwall_top_m": a, "footwall_base_m": b, "hangingwall_top_m": c,
                         "hangingwall_base_m": e, "throw_min_m": float(lo), "throw_max_m": hi_cap,
                         "sgr_min_pct": smin, "sgr_max_pct": smax, "footwall_layer": fi,
                         "hangingwall_layer": hi, "self_juxtaposed": fi == hi,
                         "max_contact_m": max_contact_m(a, b, c, e, lo, hi_cap)})
    cols = WINDOW_COLUMNS + ["footwall_layer", "hangingwall_layer", "self_juxtaposed", "max_contact_m"]
    dtypes = {c: float for c in cols} | {"footwall_layer": int, "hangingwall_layer": int,
                                         "self_juxtaposed": bool}
    return pd.DataFrame(rows, columns=cols).astype(dtypes)


@pytest.mark.parametrize("random_state,throw_max_m", [(1, 30.0), (2, 100.0), (3, 5.0), (4, 1e4)])
def test_sand_windows_match_every_pair(random_state, throw_max_m):
    layers = random_layers(np.random.default_rng(random_state))
    got = sand_windows(layers, throw_max_m)
    ref = every_pair_windows(layers, throw_max_m)
    assert len(got) > 0
    pd.testing.assert_frame_equal(got, ref, check_exact=True)


@pytest.mark.parametrize("throws", [
    np.arange(0.0, 80.5, 1.0),                      # the field's axis: 0 and up, increasing
    np.array([0.5, 3.0, 7.25, 40.0, 41.0]),          # uneven steps, no zero
    np.array([-20.0, -3.0, 0.0, 2.0, 15.0]),        # reverse faults too
    np.array([30.0, 5.0, 12.0]),                    # any order
])
def test_smear_fields_match_smear_at_point_by_point(throws):
    rng = np.random.default_rng(8)
    layers = random_layers(rng, n_layers=80, thin=0.1, thick=6.0)
    z = np.arange(layers.top_m[0] - 5.0, layers.base_m[-1] + 5.0, 0.4572)
    if throws.size == 3:
        z = np.random.default_rng(2).permutation(z)  # rows in any order too
    ssf, csp = smear_fields(layers, z, throws)
    ref_ssf, ref_csp = smear_at(layers, z[:, None], throws[None, :])
    assert ssf.dtype == csp.dtype == np.float32
    np.testing.assert_array_equal(ssf, ref_ssf.astype(np.float32))
    np.testing.assert_array_equal(csp, ref_csp.astype(np.float32))
    # the float64 sums themselves are the same to the last bit, not only after rounding
    _, csp64 = smear_fields(layers, z, throws, dtype=np.float64)
    np.testing.assert_array_equal(csp64, ref_csp)


def test_well_log_shares_only_arrays_nothing_else_can_change():
    """A reader's own read-only column is taken as is (no second copy of the log in
    memory); a writable array, or a read-only view of one, is copied."""
    from logprep.model import WellLog

    owned = 1000.0 + np.arange(11.0)  # owns its memory
    owned.setflags(write=False)
    writable = np.arange(11.0)
    block = np.arange(22.0).reshape(11, 2)
    view = block[:, 1]
    view.setflags(write=False)
    w = WellLog("W", "w.las", "", owned, {"GR": writable, "RHOB": view}, {}, "M", "GR")
    assert w.depth_m is owned
    assert w.curves["GR"] is not writable and w.curves["RHOB"] is not view
    writable[0] = -1.0
    block[0, 1] = -1.0
    assert w.curves["GR"][0] == 0.0 and w.curves["RHOB"][0] == 1.0
    assert not any(a.flags.writeable for a in (w.depth_m, *w.curves.values()))


def test_cli_loads_no_science_to_print_its_version(capsys):
    """``logprep --version`` must not pay for numpy, pandas or matplotlib (half a second
    of imports): the CLI module imports them only when a command needs them."""
    import subprocess
    import sys

    from logprep import __version__
    from logprep.cli import main

    probe = ("import sys, logprep.cli; print(sorted(m for m in "
             "('numpy', 'pandas', 'scipy', 'matplotlib', 'lasio') if m in sys.modules))")
    out = subprocess.run([sys.executable, "-c", probe], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "[]"
    assert main(["--version"]) == 0
    assert capsys.readouterr().out == f"logprep {__version__}\n"
