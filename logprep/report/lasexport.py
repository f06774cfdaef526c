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
    """The LAS 2.0 file of one :class:`~logprep.run.pipeline.WellScreening`, as bytes."""
    las = lasio.LASFile()
    las.well["WELL"].value = result.well.name
    las.well["NULL"].value = NULL
    las.other = (f"Curves computed by logprep {__version__} from {result.well.source} "
                 f"(sha256 {result.well.sha256[:16]}). Screening estimates: calibrate locally.")
    las.append_curve("DEPT", result.depth_m, unit="M", descr="Depth as logged, metres")
    for name, (values, unit, descr) in export_curves(result).items():
        las.append_curve(name, np.asarray(values, dtype=float), unit=unit, descr=descr)
    buf = io.StringIO()
    las.write(buf, version=2.0, wrap=False, fmt="%.5f")
    return buf.getvalue().encode("utf-8", errors="backslashreplace")  # undecodable names
