"""Robust GR lines per zone: short zones merged, clean lines within the well's floor and
shale line, a note when most zones are one-sided.  Hand-built logs, known answers."""

import numpy as np
import pandas as pd
import pytest

from logprep.clay.endpoints import merge_short_zones, one_sided_note, pick_endpoints
from logprep.errors import SettingsError


def test_short_zone_merged_into_smaller_neighbour():
    ok = np.ones(300, bool)
    # zones of 100, 10 (too short), 190 samples: the 10-sample zone joins the 100 one
    assert merge_short_zones([100, 110], ok, 30) == [110]
    assert merge_short_zones([5], ok, 30) == []           # first zone too short
    assert merge_short_zones([100, 200], ok, 30) == [100, 200]


def test_picks_merge_names_and_rows():
    z = np.arange(0.0, 300.0, 1.0)
    rng = np.random.default_rng(0)
    gr = np.where(np.arange(300) % 20 < 10, 30.0, 110.0) + rng.normal(0, 2, 300)
    picks = pick_endpoints(z, gr, [100, 110], names=["A", "B", "C"])
    assert list(picks["zone"]) == ["A + B", "C"]
    assert "merged" in picks["note"].iloc[0]


def test_recentred_clean_line_held_at_floor():
    # a shaly one-sided zone with readings 95-105 API in a well of 20..110 API:
    # re-centring alone would give a clean line of about 95 - 80 = 15 API, below every
    # reading of the well (floor = P1 of the well, about 20 API)
    z = np.arange(0.0, 400.0, 1.0)
    rng = np.random.default_rng(2)
    gr = np.concatenate([np.where(np.arange(200) % 10 < 5, 20.0, 110.0), rng.uniform(95, 105, 200)])
    picks = pick_endpoints(z, gr, [200])
    floor = np.percentile(gr, 1)
    assert (picks["gr_clean_api"] >= floor - 1e-9).all()
    assert (picks["gr_clean_api"] < picks["gr_shale_api"]).all()


def test_one_sided_well_rule_takes_whole_well_lines():
    z = np.arange(0.0, 400.0, 1.0)
    gr = np.concatenate([np.where(np.arange(200) % 10 < 5, 20.0, 110.0), np.full(200, 60.0)])
    gr = gr + np.random.default_rng(3).normal(0, 1, 400)
    picks = pick_endpoints(z, gr, [200], one_sided="well")
    whole = pick_endpoints(z, gr, [])
    assert picks["gr_clean_api"].iloc[1] == pytest.approx(whole["gr_clean_api"].iloc[0])
    assert "whole-well lines" in picks["note"].iloc[1]
    with pytest.raises(SettingsError):
        pick_endpoints(z, gr, [200], one_sided="sideways")


def test_one_sided_note_only_for_most_zones():
    p = pd.DataFrame({"note": ["one-sided (sandy) zone", "one-sided (shaly) zone", ""]})
    assert "2 of 3" in one_sided_note(p)
    assert one_sided_note(p.iloc[[0, 2, 2]].reset_index(drop=True)) is None
