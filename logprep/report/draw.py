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
from logprep.report.rockdraw import ROCK_COLOURS

LITHOLOGY_COLOURS = {"sand": "#F0E442", "heterolith": "#E69F00", "shale": "#8C8C8C", **ROCK_COLOURS}
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
FIELD_COLOURS = 250
"""Colour steps of a field image (0.4 % SGR apart: finer than the eye tells on the bar).
With the no-data grey it keeps an image within 256 colours, which the PDF stores as an
indexed image, a third of the size of a true-colour one."""


def field_cmap(name: str):
    """The colormap ``name`` in :data:`FIELD_COLOURS` steps, no-data cells :data:`NO_DATA`."""
    return matplotlib.colormaps[name].resampled(FIELD_COLOURS).with_extremes(bad=NO_DATA)
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


def draw_contours(ax, x, y, z, levels, fmt: str = "", **kwargs):
    """Contours of ``z`` at ``levels``, or nothing when ``z`` is too small.

    The levels are not written along the lines (such labels pile on each other and on the
    window numbers in a crowded diagram): the caller marks them on the colour bar
    (:func:`draw_sgr_colourbar`, ``Colorbar.add_lines``)."""
    if not contourable(z):
        return None
    return ax.contour(x, y, z, levels=levels, **kwargs)


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
    cmap = field_cmap(SGR_CMAP)
    im = ax.imshow(np.ma.masked_invalid(sgr), cmap=cmap, vmin=0, vmax=100, aspect="auto",
                   interpolation="nearest", origin="upper",
                   extent=(throw[0] - dt / 2, throw[-1] + dt / 2, depth[-1] + dz / 2, depth[0] - dz / 2))
    for code, hatch in CLASS_HATCHES.items() if contourable(jux) else ():
        cf = ax.contourf(throw, depth, (jux == code).astype(np.float32), levels=[0.5, 1.5],
                         colors="none", hatches=[hatch])
        cf.set_edgecolor("#FFFFFF")
        cf.set_linewidth(0)
        cf.set_rasterized(True)  # hatching as vector paths is slow to write and to view
    levels = sgr_levels(threshold_pct)
    widths = [1.6 if lv == threshold_pct else 0.6 for lv in levels]
    ax.set_xlim(min(0.0, throw[0]), throw_max_m)
    ax.set_ylim(*field_ylim(depth, dz))
    im.contours = draw_contours(ax, throw, depth, sgr, levels, colors=INK, linewidths=widths)
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
        draw_window_numbers(ax, {k: polys[k] for k in labelled if k in polys})
    return im


def draw_window_numbers(ax, polys: dict) -> None:
    """Number each window outline (``{number: polygon}``) where the number overlaps no
    other number, inside the outline where there is room, else nearby with a leader line."""
    from matplotlib.collections import LineCollection

    from logprep.report.labels import place_number_labels

    anchors = {}
    for k, poly in polys.items():
        mid = poly.mean(axis=0)
        anchors[str(k)] = [mid] + [0.5 * (mid + v) for v in poly]
    spots = place_number_labels(ax, anchors)
    leaders = []
    for k, (x, y, moved) in spots.items():
        ax.text(x, y, k, fontsize=6.5, ha="center", va="center",
                bbox={"boxstyle": "round,pad=0.15", "fc": "white", "ec": WINDOW_INK, "lw": 0.6})
        if moved:
            leaders.append([anchors[k][0], (x, y)])
    if leaders:
        ax.add_collection(LineCollection(leaders, colors=WINDOW_INK, linewidths=0.5, zorder=2.5))


def plain_log_ticks(axis) -> None:
    """Label a logarithmic ``axis`` (an ``Axis`` of an axes or a colour bar) in plain numbers
    (0.01, 1, 100, 1000) and mark the minor ticks at 2 and 5 of each decade, unlabelled.

    Matplotlib's default log labels are math text; every sheet text is drawn as plain text
    (:func:`logprep.report.writers.plain_text`), so they would print as markup.  Fewer
    minor ticks also draw faster."""
    from matplotlib.ticker import FuncFormatter, LogLocator, NullFormatter

    axis.set_major_locator(LogLocator(base=10.0, numticks=12))
    axis.set_major_formatter(FuncFormatter(lambda v, _pos: f"{v:g}"))
    axis.set_minor_locator(LogLocator(base=10.0, subs=(2.0, 5.0), numticks=12))
    axis.set_minor_formatter(NullFormatter())


def draw_sgr_colourbar(ax, im, label="SGR %; lines: contours"):
    """A small horizontal colour bar above ``ax``, its label to its left; the field's
    contour levels (if drawn) are marked on it and its ticks are the levels themselves."""
    cax = ax.inset_axes([0.62, 1.015, 0.38, 0.018])
    ax.text(0.61, 1.024, label, transform=ax.transAxes, ha="right", va="center", fontsize=6.5)
    cb = ax.figure.colorbar(im, cax=cax, orientation="horizontal")
    cs = getattr(im, "contours", None)
    if cs is not None:
        cb.add_lines(cs)
        cb.set_ticks([0, *cs.levels, 100])
    cb.ax.tick_params(labelsize=6, length=2, pad=1)
    cb.ax.xaxis.set_ticks_position("top")
    return cb


from logprep.report.table import (  # noqa: E402  the window table lives beside the helpers
    MONO_ADVANCE_EM, TABLE_HEAD, VERDICT_COLOURS, draw_window_table, formation_at, window_rows,
)

__all__ = ["MONO_ADVANCE_EM", "TABLE_HEAD", "VERDICT_COLOURS", "draw_window_table", "formation_at",
           "window_rows"]


FOOTER_TOP = 0.165
"""Figure fraction the foot (provenance, notes, caution) may reach: page content ends above."""
NOTE_LINES = 3
"""Most lines of notes on a page; the rest are in ``notes.txt`` (the foot says so)."""


def caution_box(fig, y: float = 0.012, fontsize: float = 8.0, width: float = 0.97):
    """The caution in its box at the foot of ``fig``, wrapped to the page width (computed,
    not matplotlib's wrap, which measures every word while drawing)."""
    from logprep.report.layout import wrap_to_width

    width_pt = width * fig.get_figwidth() * 72.0 - 12
    text = wrap_to_width("CAUTION: " + CAUTION, width_pt, fontsize, mono=False)
    return fig.text(0.015, y, text, fontsize=fontsize, va="bottom", color="#7A1F00", parse_math=False,
                    bbox={"facecolor": "#FFF4E5", "edgecolor": "#D55E00", "pad": 4})


def draw_footer(fig, result, short: bool = False) -> None:
    """Provenance, settings, notes and the caution, along the foot of a page, wrapped to
    the page width.  ``short``: one line of provenance (pages after the first)."""
    from logprep.report.layout import wrap_to_width

    s, w = result.settings, result.well
    head = (f"Source: {w.source}   sha256 {w.sha256[:16]}...   WELL '{w.name}'   depth unit as read: "
            f"{w.depth_unit}   GR curve: {w.gr_mnemonic}   logprep {__version__}")
    width_pt = 0.95 * fig.get_figwidth() * 72.0
    if short:
        prov = wrap_to_width(head + "   settings, notes: page 1", width_pt, 7)
    else:
        prov = head + (
            f"\nSettings: transform {s.clay.transform}; GR clean {s.clay.gr_clean}, shale "
            f"{s.clay.gr_shale} per zone ({len(result.picks)} zone(s), {s.clay.zoning}; whole well "
            f"{result.gr_clean_api:.1f}-{result.gr_shale_api:.1f} API; picks.csv); Vsh "
            f"{s.clay.vsh_combine} of GR and neutron-density; QC flags in qc.csv; cut-offs sand <= "
            f"{s.layers.sand_cutoff:g}, shale >= {s.layers.shale_cutoff:g}; min bed {s.layers.min_bed_m:g} m; "
            f"blocking {s.layers.blocking}"
            f"{f' (penalty {s.layers.changepoint_penalty:g})' if s.layers.blocking == 'changepoint' else ''}"
            f"{', tied to tops' if s.layers.honour_tops else ''}; throws 0-{s.field.throw_max_m:g} m; "
            f"SGR threshold {s.capacity.sgr_threshold_pct:g} %.")
        prov = wrap_to_width(prov, width_pt, 7)
        if result.notes:
            notes = wrap_to_width("Notes: " + "; ".join(result.notes), width_pt, 7).splitlines()
            if len(notes) > NOTE_LINES:
                notes = notes[:NOTE_LINES - 1] + [notes[NOTE_LINES - 1][: 150] + " ... (all notes in notes.txt)"]
            prov += "\n" + "\n".join(notes)
    fig.text(0.015, 0.058, prov, fontsize=7, va="bottom", family="monospace", parse_math=False)
    caution_box(fig)


# ----------------------------------------------------------------------------- window choice
def riskiest_windows(result, n: int) -> list[int]:
    """Row numbers (from 1) of up to ``n`` windows between different sands, lowest
    minimum SGR first."""
    w = result.windows
    cross = w[~w["self_juxtaposed"]].sort_values("sgr_min_pct", kind="stable")
    return [int(i) + 1 for i in cross.index[:n]]
