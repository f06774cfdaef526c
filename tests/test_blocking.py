"""Blocking by cut-offs: classes, minimum bed thickness, and conservation of clay."""

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st

from logprep.layers.blocking import block_cutoff, classify_vsh, fill_gaps, sample_edges_m
from logprep.errors import SettingsError


def test_classify_at_cutoffs():
    code = classify_vsh([0.0, 0.35, 0.36, 0.64, 0.65, 1.0], 0.35, 0.65)
    assert code.tolist() == [0, 0, 1, 1, 2, 2]


def test_sample_edges_cover_interval():
    e = sample_edges_m([100.0, 100.5, 101.0])
    np.testing.assert_allclose(e, [99.75, 100.25, 100.75, 101.25])


def test_blocky_log_recovers_its_beds():
    d = np.arange(100.0, 130.0, 0.5) + 0.25
    v = np.where((d > 110) & (d < 120), 0.9, 0.1)
    L = block_cutoff(d, v, min_bed_m=1.0)
    assert L.lithology == ("sand", "shale", "sand")
    np.testing.assert_allclose(L.top_m, [100, 110, 120])
    np.testing.assert_allclose(L.vsh, [0.1, 0.9, 0.1])


def test_thin_bed_merges_into_closest_neighbour():
    # 0.5 m heterolith (0.5) between a sand (0.3: closer) and a shale (0.9).
    d = np.arange(0.0, 20.0, 0.5) + 0.25
    v = np.where(d < 10, 0.3, 0.9)
    v[(d > 10) & (d < 10.5)] = 0.5  # one sample at 10.25
    v[(d > 9.5) & (d < 10.0)] = 0.5  # and 9.75
    L = block_cutoff(d, v, sand_cutoff=0.35, shale_cutoff=0.65, min_bed_m=2.0)
    assert len(L) == 2
    assert L.lithology == ("sand", "shale")
    assert L.base_m[0] == pytest.approx(10.5)


def test_min_bed_zero_keeps_every_run():
    d = np.arange(0.0, 5.0, 0.5)
    v = np.array([0.1, 0.9] * 5)
    L = block_cutoff(d, v, min_bed_m=0.0)
    assert len(L) == 10


def test_bad_settings():
    with pytest.raises(SettingsError):
        block_cutoff([0, 1], [0.1, 0.2], sand_cutoff=0.7, shale_cutoff=0.6)
    with pytest.raises(SettingsError):
        block_cutoff([0, 1], [0.1, np.nan])


def test_fill_gaps_interpolates_inside_only():
    d = np.arange(6.0)
    v = np.array([np.nan, 0.0, np.nan, np.nan, 0.6, np.nan])
    f, was = fill_gaps(d, v)
    np.testing.assert_allclose(f[1:5], [0.0, 0.2, 0.4, 0.6])
    assert np.isnan(f[0]) and np.isnan(f[5])
    assert was.tolist() == [False, False, True, True, False, False]


@settings(max_examples=80, deadline=None)
@given(
    vsh=st.lists(st.floats(0, 1), min_size=2, max_size=300),
    min_bed=st.floats(0, 5),
    cuts=st.tuples(st.floats(0.05, 0.5), st.floats(0.5, 0.95)).filter(lambda c: c[0] < c[1]),
)
def test_blocking_invariants(vsh, min_bed, cuts):
    d = 1000.0 + 0.1524 * np.arange(len(vsh))
    v = np.array(vsh)
    L = block_cutoff(d, v, sand_cutoff=cuts[0], shale_cutoff=cuts[1], min_bed_m=min_bed)
    edges = sample_edges_m(d)
    # contiguous, covering the logged interval
    assert L.top_m[0] == pytest.approx(edges[0]) and L.base_m[-1] == pytest.approx(edges[-1])
    np.testing.assert_allclose(L.top_m[1:], L.base_m[:-1])
    # clay thickness conserved (relative 1e-9)
    assert np.sum(L.vsh * L.thickness_m) == pytest.approx(np.sum(v * np.diff(edges)), rel=1e-9, abs=1e-12)
    # classes follow the cut-offs, neighbours differ, thin beds only when nothing is left to merge
    codes = classify_vsh(L.vsh, *cuts)
    assert [("sand", "heterolith", "shale")[c] for c in codes] == list(L.lithology)
    assert all(a != b for a, b in zip(L.lithology, L.lithology[1:]))
    if len(L) > 1:
        assert np.all(L.thickness_m >= min_bed - 1e-9)


def test_fill_gaps_extends_the_ends_when_asked():
    # Worked by hand: the end gaps take the nearest measured value and are marked filled.
    d = np.arange(6.0)
    v = np.array([np.nan, 0.0, np.nan, np.nan, 0.6, np.nan])
    f, was = fill_gaps(d, v, extend_ends=True)
    np.testing.assert_allclose(f, [0.0, 0.0, 0.2, 0.4, 0.6, 0.6])
    assert was.tolist() == [True, False, True, True, False, True]


def test_spike_on_the_last_sample_does_not_fail_the_well(tmp_path):
    # A 30 API sand / 120 API shale / 30 API sand log with one 900 API spike on the last
    # sample: QC replaces it, and the well is screened with the last sample's Vsh taken
    # from the sample above (the sand, Vsh 0), marked filled.
    from logprep.run.pipeline import screen_file

    z = np.arange(100.0, 130.01, 0.5)
    gr = np.where((z >= 110) & (z < 120), 120.0, 30.0)
    gr[-1] = 900.0
    rows = "".join(f"{a:.4f} {g:.4f}\n" for a, g in zip(z, gr))
    path = tmp_path / "spike.las"
    path.write_text(
        "~VERSION INFORMATION\n VERS. 2.0 :\n WRAP. NO :\n~WELL INFORMATION\n"
        f" STRT.M {z[0]} :\n STOP.M {z[-1]} :\n STEP.M 0.5 :\n NULL. -999.25 :\n"
        " WELL. SPIKE-1 : WELL\n~CURVE INFORMATION\n DEPT.M : DEPTH\n GR.GAPI : GAMMA RAY\n"
        "~A\n" + rows)
    r = screen_file(path)
    assert r.filled[-1] and r.vsh[-1] == pytest.approx(r.vsh[-2])
    assert r.layers.lithology[-1] == "sand"
