"""Regression cases on open wells (the cases of the sand-trust issue): top holes, bad hole
and long gaps never become reservoir; chalk is not sand; clean lines stay physical.
Skipped with a reason where the open data are absent.  Labels: FORCE 2020 lithology curve
(Bormann et al. 2020, doi:10.5281/zenodo.4351156)."""

import warnings

import numpy as np
import pytest
from conftest import open_logs_path

from logprep.io.descriptions import labels_from_codes
from logprep.io.las import read_well
from logprep.io.tops import read_tops
from logprep.layers.rockscore import called_reservoir, rock_scores
from logprep.run.pipeline import screen_column, screen_well
from logprep.run.settings import ScreenSettings


def _column(*parts, **kw):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", RuntimeWarning)
        well = read_well(open_logs_path(*parts))
        return well, screen_column(well, ScreenSettings(), **kw)


def _reservoir_between(layers, top_m, base_m):
    m = (layers.base_m > top_m) & (layers.top_m < base_m)
    return layers.reservoir[m]


def test_31_2_7_top_hole_in_22_inch_hole_is_no_data():
    # 353-443 m: GR about 15 API in 21.8 in hole, no label; it used to be an 89.5 m sand
    _, col = _column("force2020_norway", "31_2-7.las")
    L = col.layers
    assert L.lithology[0] == "no data" and L.base_m[0] >= 440
    assert not _reservoir_between(L, 353, 443).any()


def test_34_10_19_top_hole_not_reservoir():
    _, col = _column("force2020_norway", "34_10-19.las")
    assert not _reservoir_between(col.layers, 211, 291).any()


def test_25_11_24_long_gap_not_reservoir():
    # GR missing over 877-1101 m: no interpolated reservoir layer there
    _, col = _column("force2020_norway", "25_11-24.las")
    L = col.layers
    inside = (L.top_m >= 880) & (L.base_m <= 1098)
    assert inside.any() and not L.reservoir[inside].any()
    assert set(np.array(L.lithology)[inside]) == {"no data"}


def test_f03_4_modelled_top_hole_and_physical_clean_lines():
    well, col = _column("nlog_f3_netherlands", "F03-4_logs.las")
    assert not _reservoir_between(col.layers, 41, 400).any()
    tops = read_tops(open_logs_path("nlog_f3_netherlands", "tops"))
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", RuntimeWarning)
        r = screen_well(well, ScreenSettings(), tops=tops)
    assert (r.picks["gr_clean_api"] > 0).all()
    assert (r.picks["gr_clean_api"] < r.picks["gr_shale_api"]).all()


def test_johan_sverdrup_chalk_not_called_sand():
    # limestone (chalk, PEF about 6 b/e) in sand layers: 87 % before the rock classes
    well, col = _column("force2020_norway", "16_2-6.las")
    L = col.layers
    called = called_reservoir(well.depth_m, L.top_m, L.base_m, L.reservoir)
    s = rock_scores(called, labels_from_codes(well.curves["FORCE_2020_LITHOFACIES_LITHOLOGY"]))
    assert s["in_sand_limestone"] < 0.25
    assert s["precision"] > 0.55


@pytest.mark.parametrize("stem", ["31_2-7", "34_10-19", "25_11-24"])
def test_no_data_never_reservoir_nor_window(stem):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", RuntimeWarning)
        r = screen_well(read_well(open_logs_path("force2020_norway", f"{stem}.las")))
    nd = np.flatnonzero(np.array(r.layers.lithology) == "no data")
    assert nd.size and not r.layers.reservoir[nd].any()
    assert not np.isin(r.windows["footwall_layer"], nd).any()
    assert not np.isin(r.windows["hangingwall_layer"], nd).any()
