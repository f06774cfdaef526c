"""LAS ingest: units, nulls, order, quirks, and reading real open files.

Reference library for the real files: lasio itself (the depth and GR read by logprep must
equal what lasio reads, after the documented unit and null handling).  Open data: see
../shared/data/open_logs/PROVENANCE.md (F3: CC BY-SA, dGB Earth Sciences and TNO; CWLS
examples via lasio, MIT).
"""

import lasio
import numpy as np
import pytest

from conftest import open_logs_path
from logprep.errors import CurveNotFoundError, LasReadError, LogprepError
from logprep.io.las import FT_TO_M, GR_ALIASES, find_gr_curve, read_well


def test_metres_file(data_dir):
    w = read_well(data_dir / "layered_metres.las")
    assert w.name == "FIX-1" and w.gr_mnemonic == "GR" and w.depth_unit == "M"
    assert w.depth_m[0] == 100.0 and w.depth_m[-1] == 130.0
    assert len(w.sha256) == 64
    with pytest.raises(ValueError):
        w.depth_m[0] = 1.0  # frozen arrays


def test_feet_become_metres(data_dir):
    # 1 ft = 0.3048 m exactly (international foot, 1959 agreement).
    w = read_well(data_dir / "depth_in_feet.las")
    assert w.depth_unit == "FT"
    assert w.depth_m[0] == pytest.approx(100 * FT_TO_M) and FT_TO_M == 0.3048


def test_decreasing_depth_reversed(data_dir):
    a = read_well(data_dir / "layered_metres.las")
    b = read_well(data_dir / "decreasing_depth.las")
    np.testing.assert_array_equal(a.depth_m, b.depth_m)
    np.testing.assert_array_equal(a.gr_api, b.gr_api)


def test_null_and_sentinels_missing(data_dir):
    w = read_well(data_dir / "null_sentinels.las")
    d, gr = w.depth_m, w.gr_api
    assert np.all(np.isnan(gr[(d >= 112) & (d <= 113)]))
    assert np.isnan(gr[d == 125.0]).all()
    assert np.isfinite(gr[d == 111.0]).all()


@pytest.mark.parametrize("name,pattern", [
    ("duplicate_depth.las", "duplicate depth 102"),
    ("depth_goes_back.las", "depth goes back at 101.5"),
    ("time_index.las", "is time, not depth"),
    ("empty.las", "file is empty"),
    ("not_las.las", "not a readable LAS file"),
])
def test_bad_files_clear_error(data_dir, name, pattern):
    with pytest.raises(LasReadError, match=pattern) as info:
        read_well(data_dir / name)
    msg = str(info.value)
    assert msg.startswith(str(data_dir / name)) and "\n" not in msg


def test_missing_gr_lists_curves_and_fix(data_dir):
    with pytest.raises(CurveNotFoundError) as info:
        read_well(data_dir / "no_gamma_ray.las")
    assert "no gamma-ray curve (found RHOB)" in str(info.value)
    assert "--gr-curve" in str(info.value)
    assert isinstance(info.value, LogprepError) and isinstance(info.value, KeyError)


def test_all_null_gr(data_dir):
    with pytest.raises(CurveNotFoundError, match="no valid samples"):
        read_well(data_dir / "all_gr_null.las")


def test_alias_and_named_curve(data_dir):
    assert read_well(data_dir / "gr_alias_ecgr.las").gr_mnemonic == "ECGR"
    assert read_well(data_dir / "no_gamma_ray.las", gr_curve="rhob").gr_mnemonic == "RHOB"
    with pytest.raises(CurveNotFoundError, match="no curve named 'XGR'"):
        read_well(data_dir / "layered_metres.las", gr_curve="XGR")


def test_alias_order_and_unit_fallback():
    assert find_gr_curve(["SGR", "GR"], {}) == "GR"  # registry order, not file order
    assert find_gr_curve(["RHOB", "GAMMA_X"], {"GAMMA_X": "gAPI"}) == "GAMMA_X"
    assert find_gr_curve(["GR:1", "GR:2"], {}) == "GR:1"
    assert "GR" in GR_ALIASES and "ECGR" in GR_ALIASES


def test_missing_file(tmp_path):
    with pytest.raises(LasReadError, match="file not found"):
        read_well(tmp_path / "nope.las")


def test_f3_well_matches_lasio():
    # F3 well F03-2 (CC BY-SA, dGB Earth Sciences and TNO): 14,067 samples, 30.0-2139.9 m,
    # GR with 159 negative values (PROVENANCE.md); compared with lasio's own read.
    p = open_logs_path("nlog_f3_netherlands", "F03-2_logs.las")
    w = read_well(p)
    las = lasio.read(str(p))
    assert w.name == "F03-2" and len(w.depth_m) == 14067
    np.testing.assert_allclose(w.depth_m, las.index)
    np.testing.assert_allclose(w.gr_api, las["GR"], equal_nan=True)
    assert int(np.sum(w.gr_api < 0)) == 159


def test_nova_scotia_header_oddities():
    # ALMA 3 (CC BY-SA, CNSOPB): ~Parameter before ~Curve, duplicate EPD; 7,843 samples.
    p = open_logs_path("cnsopb_nova_scotia", "ALMA_3_D399_SON_DEN_NEUT_2393-3388M_LAS.las")
    w = read_well(p)
    assert len(w.depth_m) == 7843 and w.depth_m[0] == pytest.approx(2193.036)
    assert np.nanmax(w.gr_api) == pytest.approx(191.9, abs=0.05)


@pytest.mark.parametrize("rel,ok", [
    (("las_standard_examples", "1.2", "sample_wrapped.las"), True),
    (("las_standard_examples", "lasio_variants", "sample_rev.las"), False),  # no GR
    (("las_standard_examples", "lasio_variants", "encodings_utf16lebom.las"), False),
    (("las_standard_examples", "3.0", "sample_3.0.las"), False),  # header only
    (("las_standard_examples", "2.0", "sample_2.0_based.las"), False),  # time index
])
def test_cwls_examples(rel, ok):
    p = open_logs_path(*rel)
    if ok:
        assert read_well(p).gr_mnemonic == "GR"
    else:
        with pytest.raises(LogprepError) as info:
            read_well(p)
        assert str(p) in str(info.value)


def test_utf16_file_reads_with_named_curve():
    # lasio's UTF-16 LE BOM variant: the BOM is honoured; the file has no GR, so name one.
    p = open_logs_path("las_standard_examples", "lasio_variants", "encodings_utf16lebom.las")
    w = read_well(p, gr_curve="NPHI")
    assert len(w.depth_m) >= 2


def test_read_well_name_header_only(data_dir):
    from logprep.io.las import read_well_name

    assert read_well_name(data_dir / "layered_metres.las") == read_well(data_dir / "layered_metres.las").name
    assert read_well_name(data_dir / "not_las.las") == ""
    assert read_well_name(data_dir / "empty.las") == ""
