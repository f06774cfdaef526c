"""Generate the synthetic demonstration LAS files bundled with logprep.

The scenario is invented from scratch: the Harrowmere Field, a faulted
shallow-marine sand-shale succession in the Skellan Basin. All names,
locations, numbers and companies are fictitious. Nothing here is derived
from real well data.

Usage (from the repository root)::

    python example_logs/make_examples.py

The script writes five LAS 2.0 files, ``tops.csv`` and nothing else, next to
itself. It only needs numpy and lasio. A fixed random state makes the output
deterministic: running it twice gives byte-identical files (for a given numpy
and lasio version).

Geological model
----------------
A reference column (well HRM-1) is defined bed by bed. Every other well uses
the same beds, with each named unit 5-25 % thicker or thinner than in HRM-1
(beds thinner than 2 m keep their thickness). The wells are vertical, so
measured depth equals true vertical depth below the kelly bushing.

Fault: HRM-2 (footwall, structural crest) and HRM-3 (hanging wall) sit on
opposite sides of the north-south trending Harrowmere Fault. The apparent
offset of the Kellan Marker between them is about 150 m; the Kellan Marker is
the regional tie between the two fault blocks.

For each bed the script builds a shale-fraction profile (blocky, coarsening
upward with a gradational base, fining upward, heterolithic, silty) on a fine
depth grid, turns it into "true" GR, neutron and density curves, smooths them
with a Gaussian tool response (about 0.6 m for GR), samples them at the
logging step and adds tool noise. Each well then receives its deliberate
quirk (see README.md).
"""

from __future__ import annotations

import csv
from pathlib import Path

import lasio
import numpy as np

RANDOM_STATE = 731_205  # fixed integer -> deterministic output
OUT_DIR = Path(__file__).resolve().parent
NULL = -999.25
FT = 0.3048  # metres per foot
STEP_M = 0.1524  # 0.5 ft
FINE_DZ = 0.02  # fine modelling grid (m)

FIELD = "HARROWMERE"
COMPANY = "Calderine Energy Ltd (fictitious)"
SERVICE = "Tidewell Logging Services (fictitious)"
COUNTRY = "Calvennia (fictitious)"

# ---------------------------------------------------------------------------
# Reference stratigraphy (HRM-1), top to bottom.
# Bed = (kind, thickness_m, label). Kinds:
#   shale   marine mudstone (v = 1)
#   silt    silty mudstone / siltstone (v ~ 0.5-0.6)
#   hot     organic-rich condensed shale, very high GR
#   marker  thin hot shale used as regional marker, high GR
#   hetero  interbedded thin sand and shale laminae (0.1-0.6 m)
#   cu      shoreface / mouth-bar sand, coarsening upward, gradational base
#   fu      distributary-channel sand, sharp base, fining upward
#   block   clean blocky sand (also used for thin sand stringers)
# Units whose name is None are not picked in tops.csv.
# ---------------------------------------------------------------------------
STRATIGRAPHY: list[tuple[str | None, list[tuple[str, float, str]]]] = [
    (None, [  # undifferentiated overburden
        ("shale", 60.0, ""), ("silt", 8.0, ""), ("shale", 70.0, ""),
        ("hetero", 10.0, ""), ("shale", 52.0, ""),
    ]),
    ("Marrowby Clay", [
        ("shale", 38.0, ""), ("silt", 5.0, ""), ("shale", 27.0, ""),
        ("block", 1.6, "Marrowby stringer 1"), ("shale", 30.0, ""),
        ("hetero", 9.0, ""), ("shale", 42.0, ""),
        ("block", 1.2, "Marrowby stringer 2"), ("shale", 25.0, ""),
        ("silt", 8.0, ""), ("shale", 43.2, ""),
    ]),
    ("Greywick Shale", [  # regional top seal, hot condensed base
        ("shale", 33.0, ""), ("shale", 47.0, ""), ("hot", 5.0, ""),
    ]),
    ("Ostrel Sandstone", [
        ("cu", 24.0, "Ostrel A1"), ("shale", 3.0, ""),
        ("cu", 12.0, "Ostrel A2"), ("shale", 1.2, ""),
        ("block", 1.5, "Ostrel thin sand"), ("hetero", 6.3, ""),
    ]),
    ("Fennick Shale", [
        ("shale", 14.0, ""), ("block", 1.2, "Fennick stringer"),
        ("shale", 14.8, ""),
    ]),
    ("Vandry Heteroliths", [
        ("hetero", 12.0, ""), ("cu", 7.0, "Vandry sand"),
        ("hetero", 8.0, ""), ("shale", 3.0, ""),
    ]),
    ("Kellan Marker", [  # thin hot shale on top of the Kellan Shale
        ("marker", 3.0, ""), ("shale", 19.0, ""), ("silt", 4.0, ""),
        ("shale", 14.0, ""),
    ]),
    ("Sorrelby Sandstone", [
        ("cu", 30.0, "Sorrelby S1"), ("shale", 1.6, ""),
        ("fu", 10.0, "Sorrelby S2"), ("hetero", 8.4, ""),
        ("shale", 12.0, ""),
    ]),
    ("Wendlow Shale", [
        ("shale", 20.0, ""), ("silt", 4.0, ""), ("shale", 22.0, ""),
    ]),
    ("Quillet Sandstone", [
        ("cu", 20.0, "Quillet Q1"), ("shale", 4.0, ""),
        ("block", 6.0, "Quillet Q2"), ("hetero", 11.2, ""),
        ("block", 1.8, "Quillet thin sand"), ("shale", 2.0, ""),
    ]),
    ("Tunmere Mudstone", [
        ("shale", 60.0, ""), ("silt", 6.0, ""), ("shale", 45.0, ""),
        ("block", 2.5, "Tunmere stringer 1"), ("shale", 80.0, ""),
        ("hetero", 7.0, ""), ("shale", 120.0, ""), ("silt", 5.0, ""),
        ("shale", 90.0, ""), ("block", 1.5, "Tunmere stringer 2"),
        ("shale", 383.0, ""),
    ]),
]
MARKER_UNIT = "Kellan Marker"

# ---------------------------------------------------------------------------
# Wells. kellan_m: depth of the Kellan Marker (MD = TVD, metres below KB).
# top/base: logged interval in the file's depth unit.
# ---------------------------------------------------------------------------
WELLS = [
    dict(name="HRM-1", file="HRM-1.las", kellan_m=1902.0, unit="M",
         top=1440.0, base=2420.0, ekb=25.0, date="2019-04-23",
         loc="Slot A, licence DL-07, local grid X 431250 Y 226870",
         gr="GR", curves=("NPHI", "RHOB", "CALI", "BS"), rhob_unit="g/cm3",
         note="Reference well on the western flank. Two logging runs: "
              "12.25 in hole above the casing point in the Greywick Shale, "
              "8.5 in hole below."),
    dict(name="HRM-2", file="HRM-2.las", kellan_m=1838.0, unit="M",
         top=1400.0, base=2310.0, ekb=24.5, date="2020-02-11",
         loc="Slot B, licence DL-07, local grid X 433980 Y 228410",
         gr="ECGR", curves=("NPHI", "RHOB", "CALI", "BS"), rhob_unit="g/cm3",
         note="Crestal well in the FOOTWALL of the Harrowmere Fault. "
              "Gas in the upper Ostrel A1 sand."),
    dict(name="HRM-3", file="HRM-3.las", kellan_m=1988.0, unit="FT",
         top=4900.0, base=8860.0, ekb=82.0, date="2020-09-30",
         loc="Slot C, licence DL-07, local grid X 435120 Y 228150",
         gr="GR", curves=("NPHI", "RHOB", "CALI", "BS"), rhob_unit="g/cm3",
         note="HANGING WALL of the Harrowmere Fault, east of HRM-2. "
              "Depths in feet."),
    dict(name="HRM-4", file="HRM-4.las", kellan_m=1961.0, unit="M",
         top=1470.0, base=2560.0, ekb=26.2, date="2021-06-08",
         loc="Slot D, licence DL-07, local grid X 429870 Y 231020",
         gr="GR", curves=("NPHI", "RHOB", "CALI", "BS"), rhob_unit="kg/m3",
         note="Northern flank appraisal well. Density recorded in kg/m3."),
    dict(name="HRM-5", file="HRM-5.las", kellan_m=1925.0, unit="M",
         top=1460.0, base=2450.0, ekb=23.8, date="2016-11-02",
         loc="Slot E, licence DL-07, local grid X 432600 Y 224950",
         gr="GR", curves=("CALI", "BS"), rhob_unit="g/cm3",
         note="Older exploration well, GR and caliper only. "
              "Data recorded bottom-up (decreasing depth)."),
]

CURVE_INFO = {
    "DEPT": "Measured depth below KB",
    "GR": "Gamma ray",
    "ECGR": "Gamma ray, environmentally corrected",
    "NPHI": "Neutron porosity, sandstone matrix",
    "RHOB": "Bulk density",
    "CALI": "Caliper",
    "BS": "Bit size",
}


# ---------------------------------------------------------------------------
# Helpers
# ---------------------------------------------------------------------------
def gaussian_smooth(x: np.ndarray, sigma_m: float, dz: float) -> np.ndarray:
    """Convolve with a normalised Gaussian (edge-padded)."""
    sigma = sigma_m / dz
    half = int(np.ceil(4.0 * sigma))
    k = np.exp(-0.5 * (np.arange(-half, half + 1) / sigma) ** 2)
    k /= k.sum()
    xp = np.pad(x, half, mode="edge")
    return np.convolve(xp, k, mode="valid")


def correlated_noise(rng, n: int, corr_m: float, dz: float) -> np.ndarray:
    """Zero-mean, unit-std noise with a Gaussian correlation length."""
    z = gaussian_smooth(rng.standard_normal(n), corr_m, dz)
    return (z - z.mean()) / z.std()


def well_beds(well_idx: int, rng) -> list[dict]:
    """Beds for one well with absolute depths (m), scaled per unit."""
    beds = []
    for unit, unit_beds in STRATIGRAPHY:
        h_ref = sum(b[1] for b in unit_beds)
        if well_idx == 0 or unit is None:
            f = 1.0
        else:
            f = 1.0 + rng.choice([-1.0, 1.0]) * rng.uniform(0.05, 0.25)
        thin = sum(b[1] for b in unit_beds if b[1] < 2.0)
        thick = h_ref - thin
        f_thick = (f * h_ref - thin) / thick
        for kind, h, label in unit_beds:
            beds.append(dict(unit=unit, kind=kind, label=label,
                             h=h if h < 2.0 else h * f_thick))
    return beds


def place_beds(beds: list[dict], kellan_m: float) -> None:
    """Assign top/base depths so that the Kellan Marker sits at kellan_m."""
    above = 0.0
    for b in beds:
        if b["unit"] == MARKER_UNIT:
            break
        above += b["h"]
    z = kellan_m - above
    for b in beds:
        b["top"] = z
        z += b["h"]
        b["base"] = z


def build_true_curves(beds, zf, rng, gas_label=None):
    """True (unsmoothed) GR, NPHI, RHOB on the fine grid."""
    n = zf.size
    v = np.ones(n)  # shale fraction
    gr_sand = np.full(n, 35.0)
    gr_shale = np.full(n, 112.0)
    hot = np.zeros(n)
    gas = np.zeros(n, dtype=bool)
    phi_off = np.zeros(n)

    fluct = correlated_noise(rng, n, 0.8, FINE_DZ)  # small-scale texture
    drift = correlated_noise(rng, n, 4.0, FINE_DZ)  # shale GR drift

    for b in beds:
        m = (zf >= b["top"]) & (zf < b["base"])
        if not m.any():
            continue
        h = b["h"]
        x = (zf[m] - b["top"]) / h  # 0 at top, 1 at base
        gr_sand[m] = rng.uniform(27.0, 40.0)
        gr_shale[m] = rng.uniform(102.0, 124.0)
        phi_off[m] = rng.uniform(-0.015, 0.015)
        kind = b["kind"]
        if kind == "shale":
            v[m] = 1.0
        elif kind == "silt":
            v[m] = np.clip(0.55 + 0.08 * fluct[m], 0.35, 0.75)
        elif kind in ("hot", "marker"):
            v[m] = 1.0
            gr_shale[m] = rng.uniform(164.0, 172.0) if kind == "hot" \
                else rng.uniform(136.0, 141.0)
            hot[m] = 1.0
        elif kind == "hetero":
            vv = np.empty(m.sum())
            zz = zf[m] - b["top"]
            pos, sandy = 0.0, bool(rng.integers(2))
            while pos < h:
                t = rng.lognormal(np.log(0.25 if sandy else 0.3), 0.45)
                sel = (zz >= pos) & (zz < pos + t)
                vv[sel] = rng.uniform(0.05, 0.2) if sandy \
                    else rng.uniform(0.85, 1.0)
                pos += t
                sandy = not sandy
            v[m] = vv
        elif kind in ("cu", "fu", "block"):
            base_v = np.clip(0.06 + 0.04 * fluct[m], 0.0, 0.2)
            if kind == "block":
                v[m] = base_v
            else:
                g = min(0.4, 10.0 / h) if h > 4 else 0.4
                s = x if kind == "cu" else 1.0 - x  # gradational end = 1
                ramp = np.clip((s - (1.0 - g)) / g, 0.0, 1.0) ** 1.4
                v[m] = base_v + (0.92 - base_v) * ramp
            if gas_label and b["label"] == gas_label:
                gas[m] = x < 0.55  # gas-water contact at 55 % of the bed
        else:  # pragma: no cover
            raise ValueError(kind)

    gr_shale = gr_shale + 5.0 * drift * (1.0 - 0.6 * hot)
    gr_sand = gr_sand + 2.5 * fluct
    gr = gr_sand + v * (gr_shale - gr_sand)

    depth_frac = (zf - 1400.0) / 1300.0  # simple compaction trends
    phi = 0.27 - 0.07 * depth_frac + phi_off
    nphi_sand = np.where(gas, 0.55 * phi, phi + 0.01)
    rho_fluid = np.where(gas, 0.45, 1.0)
    rhob_sand = 2.65 - (2.65 - rho_fluid) * phi
    nphi_sh = 0.44 - 0.06 * depth_frac + 0.02 * hot + 0.01 * drift
    rhob_sh = 2.46 + 0.12 * depth_frac - 0.10 * hot + 0.01 * drift
    nphi = (1.0 - v) * nphi_sand + v * nphi_sh
    rhob = (1.0 - v) * rhob_sand + v * rhob_sh
    return gr, nphi, rhob, v


def tool_noise(rng, n, sigma):
    """White noise lightly smoothed by a 3-point filter, std ~ sigma."""
    e = rng.standard_normal(n + 2)
    e = 0.25 * e[:-2] + 0.5 * e[1:-1] + 0.25 * e[2:]
    return e / np.sqrt(0.375) * sigma


def taper(zm, top, base, ramp=1.5):
    """0..1 window with cosine ramps, used for the washout."""
    w = np.clip(np.minimum(zm - top, base - zm) / ramp, 0.0, 1.0)
    return 0.5 - 0.5 * np.cos(np.pi * w)


def unit_top(beds, unit):
    return next(b["top"] for b in beds if b["unit"] == unit)


def bed(beds, label):
    return next(b for b in beds if b["label"] == label)


# ---------------------------------------------------------------------------
# Main generation
# ---------------------------------------------------------------------------
def make_well(idx: int, spec: dict):
    rng = np.random.default_rng([RANDOM_STATE, idx])
    beds = well_beds(idx, rng)
    place_beds(beds, spec["kellan_m"])

    # Depth index in the file's unit, and the same depths in metres.
    if spec["unit"] == "FT":
        step = 0.5
        n = int(round((spec["base"] - spec["top"]) / step)) + 1
        depth = np.round(spec["top"] + step * np.arange(n), 4)
        zm = depth * FT
    else:
        step = STEP_M
        n = int(np.floor((spec["base"] - spec["top"]) / step + 1e-6)) + 1
        depth = np.round(spec["top"] + step * np.arange(n), 4)
        zm = depth

    if beds[0]["top"] > zm[0] - 5.0:
        raise RuntimeError(f"{spec['name']}: overburden too thin")
    if beds[-1]["base"] < zm[-1] + 5.0:
        raise RuntimeError(f"{spec['name']}: model ends above TD")

    zf = np.arange(zm[0] - 5.0, zm[-1] + 5.0, FINE_DZ)
    gas_label = "Ostrel A1" if spec["name"] == "HRM-2" else None
    gr_t, nphi_t, rhob_t, v_t = build_true_curves(beds, zf, rng, gas_label)

    # Tool vertical response, then sample at the logging step.
    gr = np.interp(zm, zf, gaussian_smooth(gr_t, 0.255, FINE_DZ))
    nphi = np.interp(zm, zf, gaussian_smooth(nphi_t, 0.25, FINE_DZ))
    rhob = np.interp(zm, zf, gaussian_smooth(rhob_t, 0.20, FINE_DZ))
    v = np.interp(zm, zf, gaussian_smooth(v_t, 0.25, FINE_DZ))

    gr = gr + tool_noise(rng, n, 1.5 + 0.015 * np.abs(gr))
    nphi = nphi + tool_noise(rng, n, 0.007)
    rhob = rhob + tool_noise(rng, n, 0.010)

    bs = np.full(n, 8.5)
    cali = (bs + 0.12 + 0.35 * v - 0.08 * (1.0 - v)
            + 0.10 * correlated_noise(rng, n, 1.0, STEP_M)
            + tool_noise(rng, n, 0.02))

    quirks = []
    name = spec["name"]
    if name == "HRM-1":
        # Bit-size change inside the Greywick Shale: 12.25 in above, 8.5 in
        # below. GR reads ~20 API higher in the smaller hole below.
        csg = round(unit_top(beds, "Greywick Shale") + 35.0, 1)
        big = zm < csg
        bs[big] = 12.25
        cali[big] += 12.25 - 8.5 + 0.1
        gr[~big] += 20.0
        quirks.append(f"GR baseline shift +20 API below {csg:.1f} m "
                      f"(bit size 12.25 in -> 8.5 in)")
        # Washout in the Fennick Shale (above its sand stringer).
        f_top = unit_top(beds, "Fennick Shale")
        w = taper(zm, f_top + 2.0, f_top + 12.0)
        cali += w * (3.6 + 0.4 * correlated_noise(rng, n, 0.5, STEP_M))
        gr -= 15.0 * w
        rhob -= 0.22 * w
        nphi += 0.07 * w
        quirks.append(f"washout {f_top + 2.0:.1f}-{f_top + 12.0:.1f} m in "
                      f"Fennick Shale: CALI up to ~13 in over BS 8.5 in, GR -15 API")
    elif name == "HRM-2":
        clip = gr >= 150.0
        gr[clip] = 150.0
        zc = zm[clip]
        quirks.append(f"ECGR clipped flat at 150 API, {zc.min():.1f}-"
                      f"{zc.max():.1f} m ({clip.sum()} samples), hot base "
                      f"of Greywick Shale")
        quirks.append("GR mnemonic is ECGR")
        a1 = bed(beds, "Ostrel A1")
        quirks.append(f"gas in Ostrel A1 {a1['top']:.1f}-"
                      f"{a1['top'] + 0.55 * a1['h']:.1f} m (N-D crossover)")
    elif name == "HRM-3":
        quirks.append("depth index in feet (STRT/STOP/STEP in FT, EKB in ft)")
    elif name == "HRM-4":
        v_top = unit_top(beds, "Vandry Heteroliths")
        gap = (zm >= v_top + 2.0) & (zm < v_top + 10.2)
        gr[gap] = np.nan
        cand = np.flatnonzero(~gap & (zm > zm[0] + 50) & (zm < zm[-1] - 50))
        singles = np.sort(rng.choice(cand, size=4, replace=False))
        gr[singles] = np.nan
        rhob *= 1000.0
        quirks.append(f"GR null gap {zm[gap].min():.1f}-{zm[gap].max():.1f} m"
                      f" ({gap.sum()} samples) in Vandry Heteroliths")
        quirks.append("isolated GR nulls at " + ", ".join(
            f"{zm[i]:.2f}" for i in singles) + " m")
        quirks.append("RHOB in kg/m3")
    elif name == "HRM-5":
        sands = np.flatnonzero(v < 0.15)
        shales = np.flatnonzero(v > 0.95)
        neg = [sands[len(sands) // 3], shales[len(shales) // 2]]
        pos = [shales[len(shales) // 5], sands[(4 * len(sands)) // 5]]
        gr[neg[0]] = -27.4
        gr[neg[1]] = -6.8
        gr[pos[0]] = 318.6
        gr[pos[1]] = 241.3
        quirks.append("negative GR spikes at " + ", ".join(
            f"{zm[i]:.2f}" for i in neg) + " m; single-sample high spikes "
            "at " + ", ".join(f"{zm[i]:.2f}" for i in pos) + " m")
        quirks.append("written bottom-up (decreasing depth, negative STEP)")

    curves = {spec["gr"]: gr, "NPHI": nphi, "RHOB": rhob,
              "CALI": cali, "BS": bs}
    order = [spec["gr"]] + list(spec["curves"])

    if name == "HRM-5":  # bottom-up
        depth = depth[::-1]
        curves = {k: c[::-1] for k, c in curves.items()}
        step = -step

    write_las(spec, depth, step, {k: curves[k] for k in order})

    tops = []
    for unit, _ in STRATIGRAPHY:
        if unit is None:
            continue
        t = unit_top(beds, unit)
        if zm.min() <= t <= zm.max():
            tops.append((name, round(t, 2), unit))
    return tops, quirks, beds


def write_las(spec, depth, step, curves):
    u = spec["unit"]
    las = lasio.LASFile()
    del las.version["DLM"]  # not part of LAS 2.0
    las.well["NULL"].value = NULL
    for mnem in ("PROV", "CNTY", "STAT", "API"):
        del las.well[mnem]
    las.well["COMP"].value = COMPANY
    las.well["COMP"].descr = "Company"
    las.well["WELL"].value = spec["name"]
    las.well["WELL"].descr = "Well"
    las.well["FLD"].value = FIELD
    las.well["FLD"].descr = "Field"
    las.well["LOC"].value = spec["loc"]
    las.well["LOC"].descr = "Location"
    las.well["CTRY"].value = COUNTRY
    las.well["CTRY"].descr = "Country"
    las.well["SRVC"].value = SERVICE
    las.well["SRVC"].descr = "Service company"
    las.well["DATE"].value = spec["date"]
    las.well["DATE"].descr = "Log date"
    las.well["UWI"].value = "CV-DL07-" + spec["name"].split("-")[1].zfill(4)
    las.well["UWI"].descr = "Unique well id"
    for key, d in (("STRT", "First index value"), ("STOP", "Last index value"),
                   ("STEP", "Index step"), ("NULL", "Null value")):
        las.well[key].descr = d
        if key != "NULL":
            las.well[key].unit = u

    las.params.append(lasio.HeaderItem(
        "EKB", unit=u, value=spec["ekb"],
        descr="Elevation of kelly bushing above mean sea level"))
    las.params.append(lasio.HeaderItem(
        "EREF", value="KB", descr="Depth reference"))

    las.other = ("Synthetic, fictitious demonstration data generated by "
                 "example_logs/make_examples.py. Not real well data. "
                 + spec["note"])

    las.append_curve("DEPT", depth, unit=u, descr=CURVE_INFO["DEPT"])
    units = {"NPHI": "v/v", "RHOB": spec["rhob_unit"], "CALI": "in",
             "BS": "in"}
    for mnem, data in curves.items():
        las.append_curve(mnem, data, unit=units.get(mnem, "gAPI"),
                         descr=CURVE_INFO.get(mnem, CURVE_INFO["GR"]))

    fmt_idx = "%.1f" if u == "FT" else "%.4f"
    column_fmt = {0: fmt_idx}
    for i, mnem in enumerate(curves, start=1):
        column_fmt[i] = {"NPHI": "%.4f", "RHOB": "%.4f"}.get(mnem, "%.3f")
        if mnem == "RHOB" and spec["rhob_unit"] == "kg/m3":
            column_fmt[i] = "%.1f"
    path = OUT_DIR / spec["file"]
    with open(path, "w", newline="\n") as fh:
        las.write(fh, version=2.0, wrap=False,
                  STRT=fmt_idx % depth[0], STOP=fmt_idx % depth[-1],
                  STEP=("%.1f" if u == "FT" else "%.4f") % step,
                  column_fmt=column_fmt)


def main():
    all_tops, report = [], []
    for idx, spec in enumerate(WELLS):
        tops, quirks, _ = make_well(idx, spec)
        all_tops.extend(tops)
        report.append((spec["file"], quirks))
    with open(OUT_DIR / "tops.csv", "w", newline="") as fh:
        w = csv.writer(fh, lineterminator="\n")
        w.writerow(["well", "top_m", "name"])
        for well, top, name in all_tops:
            w.writerow([well, f"{top:.2f}", name])
    for fname, quirks in report:
        print(fname)
        for q in quirks:
            print("   -", q)


if __name__ == "__main__":
    main()
