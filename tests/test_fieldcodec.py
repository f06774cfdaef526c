"""Lean storage of the SGR field: 0.1 % steps in int16 stored as row differences, deflate
members, bytes that depend only on the field."""

import io

import numpy as np
import pytest

from logprep.fault.fieldcodec import (
    SGR_NULL,
    decode_sgr_pct,
    encode_sgr_pct,
    field_arrays,
    diff_rows,
    npz_bytes,
    read_field_arrays,
    undiff_rows,
)


def test_round_trip_within_half_a_step():
    rng = np.random.default_rng(1)
    s = rng.uniform(0, 100, (200, 50)).astype(np.float32)
    s[rng.random(s.shape) < 0.1] = np.nan
    q = encode_sgr_pct(s)
    assert q.dtype == np.int16
    back = decode_sgr_pct(q)
    ok = np.isfinite(s)
    assert np.array_equal(np.isnan(back), ~ok)
    # rounding to the nearest 0.1 % step: at most half a step off (float32 slack)
    assert np.max(np.abs(back[ok] - s[ok])) <= 0.05 + 1e-4


def test_edges_and_null():
    q = encode_sgr_pct([0.0, 100.0, 0.04, 0.05000001, 99.96, np.nan, -1e-9, 100.0000001])
    assert q.tolist() == [0, 1000, 0, 1, 1000, SGR_NULL, 0, 1000]


def test_same_field_same_bytes_and_plain_numpy_reads_it():
    arrays = field_arrays(np.arange(3.0), np.arange(2.0), np.full((3, 2), 12.34),
                          np.zeros((3, 2), np.int8), {0: "outside", 1: "sand-sand"}, "layers")
    a, b = npz_bytes(arrays), npz_bytes(arrays)
    assert a == b
    z = np.load(io.BytesIO(a))
    # the documented recipe, plain numpy: cumulative sum of the row differences down axis 0
    assert int(z["sgr_pct_x10_diff_axis"]) == 0
    assert np.cumsum(z["sgr_pct_x10_diff"], axis=0, dtype=np.int16).tolist() == [[123, 123]] * 3
    assert z["sgr_pct_x10_diff"].tolist() == [[123, 123], [0, 0], [0, 0]]
    assert float(z["sgr_pct_scale"]) == pytest.approx(0.1)
    assert read_field_arrays(a)["sgr_pct"][0, 0] == pytest.approx(12.3)


def test_smear_fields_only_on_request():
    extra = {"ssf": np.ones((3, 2)), "csp_m": np.ones((3, 2))}
    args = (np.arange(3.0), np.arange(2.0), np.zeros((3, 2)), np.zeros((3, 2), np.int8),
            {0: "outside"}, "layers", extra)
    assert "ssf" not in field_arrays(*args)
    with_smear = field_arrays(*args, smear=True)
    assert with_smear["ssf"].dtype == np.float32 and "csp_m" in with_smear


def test_row_differences_wrap_and_come_back_exactly():
    # the jump from the null value (-32768) to 100 % (1000) and back overflows int16: the
    # differences wrap modulo 2**16 and the cumulative sum in int16 wraps them back
    rng = np.random.default_rng(5)
    q = rng.integers(0, 1001, (50, 7)).astype(np.int16)
    q[rng.random(q.shape) < 0.3] = SGR_NULL
    q[0, 0], q[1, 0], q[2, 0] = SGR_NULL, 1000, SGR_NULL
    d = diff_rows(q)
    assert d.dtype == np.int16
    assert np.array_equal(undiff_rows(d), q)
    assert np.array_equal(undiff_rows(diff_rows(q[:1])), q[:1])  # one row: stored as it is


def test_earlier_bzip2_files_are_still_read():
    import zipfile

    sgr = np.array([[12.34, np.nan], [50.0, 99.9]])
    old = npz_bytes({"depth_m": np.arange(2.0), "throw_m": np.arange(2.0),
                     "sgr_pct_x10": encode_sgr_pct(sgr), "sgr_pct_scale": np.array(0.1),
                     "sgr_pct_null": np.array(SGR_NULL, dtype=np.int16)},
                    compression=zipfile.ZIP_BZIP2, compresslevel=9)
    back = read_field_arrays(old)["sgr_pct"]
    assert np.isnan(back[0, 1]) and back[1, 1] == pytest.approx(99.9)


def test_members_are_deflate_in_c_order_and_scalars_stay_scalars():
    import zipfile

    jux = np.asfortranarray(np.arange(12, dtype=np.int8).reshape(3, 4) % 7)
    arrays = field_arrays(np.arange(3.0), np.arange(4.0), np.full((3, 4), 12.34), jux,
                          {k: f"c{k}" for k in range(7)}, "layers")
    data = npz_bytes(arrays)
    with zipfile.ZipFile(io.BytesIO(data)) as zf:
        assert {i.compress_type for i in zf.infolist()} == {zipfile.ZIP_DEFLATED}
    z = np.load(io.BytesIO(data))
    assert z["juxtaposition"].flags["C_CONTIGUOUS"] and np.array_equal(z["juxtaposition"], jux)
    assert z["sgr_pct_scale"].shape == () and z["source"].shape == ()


def test_row_differences_pack_a_smooth_field_tighter():
    # a smooth 0.1 %-step grid (SGR varies slowly with depth and throw) with a null wedge:
    # its row differences are small numbers, which deflate should pack clearly tighter than
    # the plain grid, else the extra step is not worth a reader's cumulative sum
    import zipfile

    d, t = np.meshgrid(np.linspace(0, 30, 2000), np.linspace(0, 6, 300), indexing="ij")
    sgr = 40 + 20 * np.sin(d) * np.cos(t) + np.random.default_rng(3).normal(0, 0.3, d.shape)
    sgr[d < t] = np.nan
    q = encode_sgr_pct(sgr)
    plain = len(npz_bytes({"g": q}, compression=zipfile.ZIP_DEFLATED, compresslevel=6))
    assert len(npz_bytes({"g": diff_rows(q)})) < 0.8 * plain
