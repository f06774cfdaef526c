"""Export the computed curves of a screened well as a LAS 2.0 file (through lasio).

Curves: DEPT (m), GR as read, the clean and shale lines, Vsh from GR, from
neutron-density and the chosen Vsh, the lithology code of the blocked layer at each sample
(0 sand, 1 heterolith, 2 shale; see :data:`logprep.model.LITHOLOGIES`) and the QC flags
packed as bits (:data:`logprep.clay.qc.QC_FLAGS`).  Missing values are -999.25.
"""

from __future__ import annotations

import io

import lasio
import numpy as np

from logprep import __version__
from logprep.model import LITHOLOGIES
from logprep.clay.qc import QC_FLAGS, flag_code

NULL = -999.25

CURVE_FORMATS = {"DEPT": "%.4f", "GR": "%.3f", "GR_CLEAN": "%.2f", "GR_SHALE": "%.2f",
                 "VSH_GR": "%.3f", "VSH_ND": "%.3f", "VSH": "%.3f", "LITH": "%.0f", "QC": "%.0f"}
"""Decimals written per curve: depth to 0.1 mm, GR to 0.001 API (as LAS files usually carry
it), the lines to 0.01 API, Vsh to 0.001 v/v and codes as integers.  Vsh carries no more:
gamma-ray counting noise of a few API over a 70-100 API clean-to-shale range is already
0.02-0.05 v/v (common practice, no source), so a fourth decimal only spends about 60 kB
per 20,000 samples.  Missing values are written as the bare null ``-999.25`` whatever
the column's decimals.  Columns are separated by one space without padding (LAS 2.0 only
asks for delimited values), which keeps a 20,000-sample export near 1 MB."""


def sample_lithology_code(depth_m, layers) -> np.ndarray:
    """Lithology code of the layer holding each sample."""
    k = np.searchsorted(layers.top_m, np.asarray(depth_m, dtype=float), side="right") - 1
    return layers.lithology_code[np.clip(k, 0, len(layers) - 1)].astype(float)


def export_curves(result) -> dict[str, tuple[np.ndarray, str, str]]:
    """Mnemonic -> (values, unit, description) of the exported curves."""
    n = result.depth_m.size
    nan = np.full(n, np.nan)
    bits = ", ".join(f"{v[0]} {k}" for k, v in QC_FLAGS.items())
    return {
        "GR": (result.gr_api, "gAPI", f"Gamma ray as read ({result.well.gr_mnemonic})"),
        "GR_CLEAN": (result.gr_clean_line if result.gr_clean_line is not None else nan, "gAPI",
                     "Clean-sand GR line of the zone"),
        "GR_SHALE": (result.gr_shale_line if result.gr_shale_line is not None else nan, "gAPI",
                     "Shale GR line of the zone"),
        "VSH_GR": (result.vsh_gr if result.vsh_gr is not None else nan, "v/v",
                   f"Clay volume from GR ({result.settings.clay.transform})"),
        "VSH_ND": (result.vsh_nd if result.vsh_nd is not None else nan, "v/v",
                   "Clay volume from neutron-density separation"),
        "VSH": (result.vsh, "v/v", f"Chosen clay volume ({result.settings.clay.vsh_combine})"),
        "LITH": (sample_lithology_code(result.depth_m, result.layers), "",
                 "Blocked lithology: " + ", ".join(f"{i} {x}" for i, x in enumerate(LITHOLOGIES))),
        "QC": (flag_code(result.qc_flags).astype(float) if result.qc_flags else np.zeros(n), "",
               "QC flag bits: " + bits),
    }


def las_bytes(result) -> bytes:
    """The LAS 2.0 file of one :class:`~logprep.run.pipeline.WellScreening`, as bytes.

    lasio writes the header sections (from the first sample, with STRT, STOP and STEP of the
    whole log); the data section is formatted here, one ``%`` format per row, about 30x
    quicker than lasio's per-value writer on a 20,000-sample log.
    """
    depth = np.asarray(result.depth_m, dtype=float)
    columns = {"DEPT": (depth, "M", "Depth as logged, metres")}
    for name, (values, unit, descr) in export_curves(result).items():
        columns[name] = (np.asarray(values, dtype=float), unit, descr)
    las = lasio.LASFile()
    las.well["WELL"].value = result.well.name
    las.well["NULL"].value = NULL
    las.other = (f"Curves computed by logprep {__version__} from {result.well.source} "
                 f"(sha256 {result.well.sha256[:16]}). Screening estimates: calibrate locally.")
    for name, (values, unit, descr) in columns.items():
        las.append_curve(name, values[:1], unit=unit, descr=descr)
    step = depth[1] - depth[0] if depth.size > 1 else 0.0
    buf = io.StringIO()
    las.write(buf, version=2.0, wrap=False, fmt="%.5f", len_numeric_field=-1,
              STRT=f"{depth[0]:.5f}", STOP=f"{depth[-1]:.5f}", STEP=f"{step:.5f}")
    head = buf.getvalue()
    head = head[: head.index("\n", head.index("~A")) + 1]
    return (head + data_section(columns)).encode("utf-8", errors="backslashreplace")  # undecodable names


def data_section(columns: dict[str, tuple]) -> str:
    """The ``~A`` rows: values in :data:`CURVE_FORMATS` (``%.5f`` otherwise), one space
    before and between them; NaN written as the null value ``-999.25`` (readers take it as
    missing by value)."""
    names = list(columns)
    fmt = " " + " ".join(CURVE_FORMATS.get(n, "%.5f") for n in names) + "\n"
    data = np.column_stack([columns[n][0] for n in names])
    data = np.where(np.isfinite(data), data, np.nan)  # +-inf is missing too
    text = "".join(fmt % tuple(row) for row in data.tolist())
    return text.replace(" nan", f" {NULL:g}")  # the one token '%f' gives NaN
