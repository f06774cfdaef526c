"""Storage of the SGR field at the precision it carries (``sgr_field.npz``).

SGR is a screening number read to whole percent against thresholds of 15-20 %
(Yielding 2002); storing it in float32 (7 significant figures) only spends disk.
The file holds:

``sgr_pct_x10_diff`` (int16)
    SGR in steps of 0.1 %, stored as the difference from the row above (the first row as
    it is), modulo 2**16: ``sgr_pct_x10 = numpy.cumsum(sgr_pct_x10_diff, axis=0,
    dtype=numpy.int16)`` and ``sgr_pct = sgr_pct_x10 / 10``; :data:`SGR_NULL` (-32768)
    in ``sgr_pct_x10`` where the field is undefined (the slipped interval leaves the
    logged column).  Rounding to the nearest step: the stored value is within 0.05 % of
    the computed one.  SGR changes little from one depth row to the next, so the
    differences are mostly small numbers repeated, which deflate packs tightly.
``juxtaposition`` (int8)
    Class codes, with the code table ``juxtaposition_codes`` (int8) and
    ``juxtaposition_names`` (str).
``depth_m``, ``throw_m`` (float64)
    The axes, exact.
``source`` (str), ``sgr_pct_scale`` (0.1), ``sgr_pct_null`` (-32768), ``sgr_pct_x10_diff_axis`` (0)
    Self-description, so that a reader needs no logprep.
``ssf``, ``csp_m`` (float32, only on request)
    The smear indicators on the same axes; they double the file and are drawn on the
    sheet anyway, so they are written only when asked for (``--field-smear``).

Every array is a deflate member of a zip file (the method every zip reader has; level 6).
Row differences and deflate against the plain grid in bzip2, the coder used before,
measured on the bundled wells and a 20,000-sample well (``bench/bench_field_codec.py``):
within 7 % of the same size, and 2.8 to 6.6 times faster to write (bzip2's block sort slows
down on the long runs of the null value and of repeated rows); the plain grid in deflate
would be 1.5 to 1.8 times the size.  The 2-D grids are stored row by row (C order).
The zip members carry a fixed date, so the same field gives the same bytes.  Files of the
earlier formats (plain ``sgr_pct_x10`` in bzip2; float32 ``sgr_pct``) are still read.
"""

from __future__ import annotations

import io
import zipfile

import numpy as np

SGR_STEP_PCT = 0.1
"""Storage step of the SGR field (%)."""

SGR_NULL = np.iinfo(np.int16).min
"""Stored value where the SGR field is undefined."""

_FIXED_DATE = (1980, 1, 1, 0, 0, 0)  # the earliest a zip member can carry: no run time in the file


def encode_sgr_pct(sgr_pct) -> np.ndarray:
    """SGR (%) as int16 steps of :data:`SGR_STEP_PCT`, NaN -> :data:`SGR_NULL`.

    Parameters
    ----------
    sgr_pct : array_like of float
        SGR in percent, 0-100 (values are clipped to that range first), NaN undefined.

    Returns
    -------
    ndarray of int16, same shape.
    """
    s = np.asarray(sgr_pct, dtype=np.float64)
    out = np.full(s.shape, SGR_NULL, dtype=np.int16)
    ok = np.isfinite(s)
    out[ok] = np.rint(np.clip(s[ok], 0.0, 100.0) / SGR_STEP_PCT).astype(np.int16)
    return out


def decode_sgr_pct(stored, step_pct: float = SGR_STEP_PCT, null: int = SGR_NULL) -> np.ndarray:
    """The inverse of :func:`encode_sgr_pct`: float32 SGR (%), NaN where undefined."""
    q = np.asarray(stored)
    out = q.astype(np.float32) * np.float32(step_pct)
    out[q == null] = np.nan
    return out


def diff_rows(stored) -> np.ndarray:
    """Row differences of an int16 grid, modulo 2**16 (the first row as it is): the
    inverse of ``numpy.cumsum(d, axis=0, dtype=numpy.int16)``."""
    q = np.asarray(stored, dtype=np.int16)
    d = q.copy()
    if q.ndim and q.shape[0] > 1:
        d[1:] = (q[1:].astype(np.int32) - q[:-1]).astype(np.int16)  # wraps modulo 2**16
    return d


def undiff_rows(diff) -> np.ndarray:
    """The int16 grid of :func:`diff_rows` back."""
    return np.cumsum(np.asarray(diff, dtype=np.int16), axis=0, dtype=np.int16)


def npz_bytes(arrays: dict[str, np.ndarray], compresslevel: int = 6,
              compression: int = zipfile.ZIP_DEFLATED) -> bytes:
    """A ``.npz`` archive (deflate members, see the module docstring) of ``arrays`` whose
    bytes depend only on the arrays: members in the given order, each in C order and
    with a fixed date."""
    buf = io.BytesIO()
    with zipfile.ZipFile(buf, "w", compression=compression, compresslevel=compresslevel) as zf:
        for name, value in arrays.items():
            member = io.BytesIO()
            np.lib.format.write_array(member, np.asarray(value, order="C"), allow_pickle=False)
            info = zipfile.ZipInfo(f"{name}.npy", date_time=_FIXED_DATE)
            info.compress_type = compression
            info.external_attr = 0o644 << 16
            zf.writestr(info, member.getvalue(), compresslevel=compresslevel)
    return buf.getvalue()


def field_arrays(depth_m, throw_m, sgr_pct, juxtaposition, codes: dict[int, str], source: str,
                 extra: dict | None = None, smear: bool = False) -> dict[str, np.ndarray]:
    """The arrays of ``sgr_field.npz`` (see the module docstring), in file order.

    ``codes`` maps juxtaposition class code -> name; ``extra`` holds the smear fields,
    written only with ``smear=True``.
    """
    keys = np.array(sorted(codes), dtype=np.int8)
    arrays = {
        "depth_m": np.asarray(depth_m, dtype=np.float64),
        "throw_m": np.asarray(throw_m, dtype=np.float64),
        "sgr_pct_x10_diff": diff_rows(encode_sgr_pct(sgr_pct)),
        "sgr_pct_x10_diff_axis": np.array(0, dtype=np.int8),
        "sgr_pct_scale": np.array(SGR_STEP_PCT),
        "sgr_pct_null": np.array(SGR_NULL, dtype=np.int16),
        "juxtaposition": np.asarray(juxtaposition, dtype=np.int8),
        "juxtaposition_codes": keys,
        "juxtaposition_names": np.array([codes[int(k)] for k in keys]),
        "source": np.array(source),
    }
    if smear:
        for name, value in sorted((extra or {}).items()):
            arrays[name] = np.asarray(value, dtype=np.float32)
    return arrays


def read_field_arrays(path_or_bytes) -> dict[str, np.ndarray]:
    """The arrays of an ``sgr_field.npz`` with ``sgr_pct`` decoded to float32 (%).

    ``path_or_bytes`` is a path or the file's bytes.  Files written before the lean
    format (float32 ``sgr_pct``) are read as they are.
    """
    src = io.BytesIO(path_or_bytes) if isinstance(path_or_bytes, (bytes, bytearray)) else path_or_bytes
    with np.load(src, allow_pickle=False) as z:
        arrays = {k: z[k] for k in z.files}
    if "sgr_pct_x10_diff" in arrays:
        arrays.pop("sgr_pct_x10_diff_axis", None)
        arrays["sgr_pct_x10"] = undiff_rows(arrays.pop("sgr_pct_x10_diff"))
    if "sgr_pct_x10" in arrays:
        arrays["sgr_pct"] = decode_sgr_pct(arrays.pop("sgr_pct_x10"),
                                           float(arrays.pop("sgr_pct_scale", SGR_STEP_PCT)),
                                           int(arrays.pop("sgr_pct_null", SGR_NULL)))
    return arrays
