"""Drawing helpers shared by every page of the sheet: colours, page size, the SGR field
panel, the window table and the page footer.  Imports no page module.

Colours come from the colour-blind-safe palette of Okabe & Ito (2008, "Color Universal
Design"), with neutral greys for shale.  The layout is logprep's own.
"""

from __future__ import annotations

import matplotlib
import numpy as np
from matplotlib.collections import PolyCollection

from logprep import __version__
from logprep.fault.sgr import contact_polygon
from logprep.report.caution import CAUTION

LITHOLOGY_COLOURS = {"sand": "#F0E442", "heterolith": "#E69F00", "shale": "#8C8C8C"}
SGR_CONTOURS_PCT = (10, 20, 30, 40, 60)
PAGE_SIZE_IN = (16.5, 11.7)  # A3 landscape
ROWS_PAGE1 = 22
ROWS_PER_PAGE = 45
INK = "#222222"


QC_COLOURS = {
    "missing": "#999999", "null_gap": "#555555", "clipped": "#D55E00", "negative": "#CC79A7",
    "implausible": "#CC79A7", "spike": "#CC79A7", "washout": "#0072B2", "gas_crossover": "#009E73",
    "bad_density": "#56B4E9",
}
"""Marker colour of each QC flag on the sheet (Okabe & Ito 2008 palette and greys)."""


SGR_CMAP = "cividis"  # perceptually uniform and colour-blind safe
NO_DATA = "#F2F2F2"
WINDOW_INK = "#D55E00"  # Okabe & Ito vermillion: sand-sand window outlines
MAX_DRAWN_ROWS = 700
CLASS_HATCHES = {1: "////", 2: "...."}
"""Juxtaposition classes hatched on the triangle diagram (codes of
:data:`logprep.fault.juxtaposition.JUXTAPOSITION_CLASSES`): sand/sand and sand/heterolith."""


def sgr_levels(threshold_pct: float) -> list[float]:
    """SGR contour levels: the screening threshold and the fixed levels."""
    return sorted({float(threshold_pct), *map(float, SGR_CONTOURS_PCT)})


def contourable(z) -> bool:
    """Whether a field can be contoured: matplotlib needs at least 2 x 2 values (a very short
    log or a single throw column gives fewer; the field is then drawn as colour only)."""
    return np.ndim(z) == 2 and min(np.shape(z)) >= 2


def draw_contours(ax, x, y, z, levels, fmt: str, **kwargs):
    """Labelled contours of ``z`` at ``levels``, or nothing when ``z`` is too small."""
    if not contourable(z):
        return None
    cs = ax.contour(x, y, z, levels=levels, **kwargs)
    ax.clabel(cs, fmt=fmt, fontsize=6)
    return cs


def field_ylim(depth, dz: float) -> tuple[float, float]:
    """Depth-axis limits (deepest first) of a field drawn row by row; a single row keeps
    its own thickness ``dz`` so that the axis is never singular."""
    return (depth[-1], depth[0]) if depth.size > 1 else (depth[0] + dz / 2, depth[0] - dz / 2)


def draw_field(ax, grid, *, threshold_pct: float, throw_max_m: float, windows=None,
               labelled=(), hw_shift_m: float = 0.0):
    """Triangle diagram from an :class:`~logprep.fault.sgr.SgrField`: SGR as colour, contours at
    the screening threshold (bold) and fixed levels, the juxtaposition classes of
    :data:`CLASS_HATCHES` hatched, and the sand-sand windows of ``windows``
    outlined (the rows in ``labelled``, numbered from 1, thicker and numbered).
    ``hw_shift_m`` converts a window's hanging-wall depths into the footwall frame.
    Returns the SGR image (for a colour bar)."""

    step = max(1, int(np.ceil(grid.depth_m.size / MAX_DRAWN_ROWS)))
    depth, throw = grid.depth_m[::step], grid.throw_m
    sgr = np.asarray(grid.sgr_pct[::step], float)
    jux = grid.juxtaposition[::step]
    dt = throw[1] - throw[0] if throw.size > 1 else 1.0
    dz = depth[1] - depth[0] if depth.size > 1 else 1.0
    cmap = matplotlib.colormaps[SGR_CMAP].with_extremes(bad=NO_DATA)
    im = ax.imshow(np.ma.masked_invalid(sgr), cmap=cmap, vmin=0, vmax=100, aspect="auto",
                   interpolation="nearest", origin="upper", rasterized=True,
                   extent=(throw[0] - dt / 2, throw[-1] + dt / 2, depth[-1] + dz / 2, depth[0] - dz / 2))
    for code, hatch in CLASS_HATCHES.items() if contourable(jux) else ():
        cf = ax.contourf(throw, depth, (jux == code).astype(np.float32), levels=[0.5, 1.5],
                         colors="none", hatches=[hatch])
        cf.set_edgecolor("#FFFFFF")
        cf.set_linewidth(0)
        cf.set_rasterized(True)  # hatching as vector paths is slow to write and to view
    levels = sgr_levels(threshold_pct)
    widths = [1.6 if lv == threshold_pct else 0.6 for lv in levels]
    draw_contours(ax, throw, depth, sgr, levels, "%g%%", colors=INK, linewidths=widths)
    if windows is not None and len(windows):
        polys = {}  # row number (from 1) -> outline, for windows between different sands
        for k, w in enumerate(windows.itertuples(), start=1):
            if w.self_juxtaposed:
                continue
            poly = contact_polygon(w.footwall_top_m, w.footwall_base_m,
                                   w.hangingwall_top_m - hw_shift_m,
                                   w.hangingwall_base_m - hw_shift_m, 0.0, throw_max_m)
            if len(poly) >= 3:
                polys[k] = poly
        for strong in (False, True):
            group = [p for k, p in polys.items() if (k in labelled) == strong]
            if group:
                ax.add_collection(PolyCollection(group, facecolors="none", edgecolors=WINDOW_INK,
                                                 linewidths=1.1 if strong else 0.5,
                                                 linestyles="-" if strong else ":"))
        for k in labelled:
            if k in polys:
                tmid, zmid = polys[k].mean(axis=0)
                ax.text(tmid, zmid, str(k), fontsize=6.5, ha="center", va="center",
                        bbox=dict(boxstyle="round,pad=0.15", fc="white", ec=WINDOW_INK, lw=0.6))
    ax.set_xlim(min(0.0, throw[0]), throw_max_m)
    ax.set_ylim(*field_ylim(depth, dz))
    return im


def draw_sgr_colourbar(ax, im, label="SGR (%)"):
    cax = ax.inset_axes([0.62, 1.015, 0.38, 0.018])
    cb = ax.figure.colorbar(im, cax=cax, orientation="horizontal")
    cb.ax.tick_params(labelsize=6, length=2, pad=1)
    cb.ax.xaxis.set_ticks_position("top")
    cb.set_label(label, fontsize=6.5, labelpad=1)
    cb.ax.xaxis.set_label_position("top")


TABLE_HEAD = ["#", "footwall\nsand (m)", "hanging-wall\nsand (m)",
              "throw\nrange (m)", "SGR\nmin %", "SGR\nmax %", "oil\ncolumn", "verdict", "note"]
VERDICT_COLOURS = {"leak": "#F6C9A8", "uncertain": "#FBE8A6", "seal": "#CFE8F7"}
"""Cell shades of the verdict column (light tints of Okabe & Ito vermilion, yellow, sky blue)."""


def window_rows(windows, numbers, threshold_pct, length_unit: str = "m") -> list[list[str]]:
    """Table rows for the windows with the given row numbers (from 1).  The oil column
    height is shown in ``length_unit`` (``m`` or ``ft``)."""
    per_m = 1.0 if length_unit == "m" else 1.0 / 0.3048
    rows = []
    for k in numbers:
        w = windows.iloc[k - 1]
        note = "sand against itself" if w.self_juxtaposed else (
            f"SGR < {threshold_pct:g} %" if w.sgr_min_pct < threshold_pct else "")
        col = w.get("column_oil_m", np.nan) * per_m
        rows.append([str(k), f"{w.footwall_top_m:.1f}-{w.footwall_base_m:.1f}",
                     f"{w.hangingwall_top_m:.1f}-{w.hangingwall_base_m:.1f}",
                     f"{w.throw_min_m:.1f}-{w.throw_max_m:.1f}", f"{w.sgr_min_pct:.1f}",
                     f"{w.sgr_max_pct:.1f}", f"{col:.0f} {length_unit}" if np.isfinite(col) else "",
                     str(w.get("verdict", "")), note])
    return rows


MONO_ADVANCE_EM = 1233 / 2048
"""Advance width of every glyph of DejaVu Sans Mono (matplotlib's bundled monospace font),
in ems: fixed-width columns can then be placed exactly."""


def draw_window_table(ax, rows, title, *, fontsize: float = 7.5) -> None:
    """A table of ``rows`` under :data:`TABLE_HEAD`, top-left in ``ax``.

    Each row is one line of fixed-width text (centred fields), so a long table costs one
    text per row instead of a text and a box per cell: several times quicker to write as
    PDF.  Rows are zebra-shaded and the verdict field tinted by :data:`VERDICT_COLOURS`.
    The font shrinks (to 5.5 pt at least) to fit the width; rows that do not fit are cut.
    """
    from matplotlib.collections import LineCollection, PatchCollection
    from matplotlib.patches import Rectangle

    ax.set_axis_off()
    ax.set_xlim(0, 1)
    ax.set_ylim(0, 1)
    ax.set_title(title, loc="left", fontsize=9, fontweight="bold")
    if not rows:
        ax.text(0, 0.95, "No sand-sand windows between different sands.", va="top", fontsize=9)
        return
    heads = [h.split("\n") for h in TABLE_HEAD]
    n_head = max(len(h) for h in heads)
    heads = [[""] * (n_head - len(h)) + h for h in heads]
    widths = [2 + max([len(x) for x in heads[c]] + [len(r[c]) for r in rows])
              for c in range(len(TABLE_HEAD))]
    fig = ax.get_figure()
    pos = ax.get_position()
    width_pt = pos.width * fig.get_figwidth() * 72.0
    height_pt = pos.height * fig.get_figheight() * 72.0
    fontsize = max(5.5, min(fontsize, width_pt / (sum(widths) * MONO_ADVANCE_EM)))
    char_w = fontsize * MONO_ADVANCE_EM / width_pt  # axes fraction per character
    row_h = 1.65 * fontsize / height_pt
    head_h = (n_head + 0.4) * row_h
    rows = rows[: max(0, int((1.0 - head_h) / row_h))]
    starts = np.concatenate(([0], np.cumsum(widths)))
    table_w = starts[-1] * char_w
    top = 1.0 - head_h

    def line(fields) -> str:
        return "".join(f.center(w) for f, w in zip(fields, widths))

    shades = [Rectangle((0, top), table_w, head_h, facecolor="#EEEEEE")]
    vcol = TABLE_HEAD.index("verdict") if "verdict" in TABLE_HEAD else None
    for r, row in enumerate(rows):
        y0 = top - (r + 1) * row_h
        if r % 2:
            shades.append(Rectangle((0, y0), table_w, row_h, facecolor="#F4F4F4"))
        if vcol is not None and row[vcol] in VERDICT_COLOURS:
            shades.append(Rectangle((starts[vcol] * char_w, y0), widths[vcol] * char_w, row_h,
                                    facecolor=VERDICT_COLOURS[row[vcol]]))
    ax.add_collection(PatchCollection(shades, match_original=True, linewidths=0))
    text = dict(family="DejaVu Sans Mono", fontsize=fontsize, va="center", ha="left")
    for k in range(n_head):
        ax.text(0, 1.0 - (0.2 + k + 0.5) * row_h, line([h[k] for h in heads]), **text)
    for r, row in enumerate(rows):
        ax.text(0, top - (r + 0.5) * row_h, line(row), **text)
    bottom = top - len(rows) * row_h
    rules = [[(0, y), (table_w, y)] for y in (1.0, top, bottom)]
    rules += [[(x * char_w, bottom), (x * char_w, 1.0)] for x in starts]
    ax.add_collection(LineCollection(rules, colors="#BBBBBB", linewidths=0.5))


def draw_footer(fig, result) -> None:
    """Provenance, settings, notes and the caution, along the foot of a page."""
    s, w = result.settings, result.well
    prov = (
        f"Source: {w.source}   sha256 {w.sha256[:16]}...   WELL '{w.name}'   depth unit as read: "
        f"{w.depth_unit}   GR curve: {w.gr_mnemonic}   logprep {__version__}\n"
        f"Settings: transform {s.clay.transform}; GR clean {s.clay.gr_clean}, shale {s.clay.gr_shale} per zone "
        f"({len(result.picks)} zone(s), {s.clay.zoning}; whole well {result.gr_clean_api:.1f}-"
        f"{result.gr_shale_api:.1f} API; picks.csv); Vsh {s.clay.vsh_combine} of GR and neutron-density; "
        f"QC flags in qc.csv;\n          cut-offs sand <= {s.layers.sand_cutoff:g}, "
        f"shale >= {s.layers.shale_cutoff:g}; min bed {s.layers.min_bed_m:g} m; blocking {s.layers.blocking}"
        f"{f' (penalty {s.layers.changepoint_penalty:g})' if s.layers.blocking == 'changepoint' else ''}"
        f"{', tied to tops' if s.layers.honour_tops else ''}; "
        f"throws 0-{s.field.throw_max_m:g} m; SGR threshold {s.capacity.sgr_threshold_pct:g} %."
    )
    if result.notes:
        prov += "\nNotes: " + "; ".join(result.notes)
    fig.text(0.015, 0.058, prov, fontsize=7, va="bottom", family="monospace")
    fig.text(0.015, 0.012, "CAUTION: " + CAUTION, fontsize=8, va="bottom", wrap=True,
             color="#7A1F00", bbox=dict(facecolor="#FFF4E5", edgecolor="#D55E00", pad=4))



# ----------------------------------------------------------------------------- window choice
def riskiest_windows(result, n: int) -> list[int]:
    """Row numbers (from 1) of up to ``n`` windows between different sands, lowest
    minimum SGR first."""
    w = result.windows
    cross = w[~w["self_juxtaposed"]].sort_values("sgr_min_pct", kind="stable")
    return [int(i) + 1 for i in cross.index[:n]]
