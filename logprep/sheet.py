"""The per-well screening sheet: builds matplotlib Figures, never saves or shows them.

Colours come from the colour-blind-safe palette of Okabe & Ito (2008, "Color Universal
Design"), with neutral greys for shale.  The layout is logprep's own.
"""

from __future__ import annotations

import numpy as np
from matplotlib.colors import BoundaryNorm, ListedColormap
from matplotlib.figure import Figure
from matplotlib.patches import Patch

from logprep import __version__
from logprep.caution import CAUTION
from logprep.juxtaposition import JUXTAPOSITION_CLASSES

LITHOLOGY_COLOURS = {"sand": "#F0E442", "heterolith": "#E69F00", "shale": "#8C8C8C"}
CLASS_COLOURS = {
    0: "#FFFFFF",
    1: "#D55E00",  # sand/sand: the windows that can leak across the fault
    2: "#E69F00",
    3: "#56B4E9",
    4: "#F0E442",
    5: "#009E73",
    6: "#C8C8C8",
}
SGR_CONTOURS_PCT = (10, 20, 30, 40, 60)
PAGE_SIZE_IN = (16.5, 11.7)  # A3 landscape
ROWS_PAGE1 = 18
ROWS_PER_PAGE = 40


def _window_rows(windows, threshold_pct):
    rows = []
    for k, w in enumerate(windows.itertuples(index=False), start=1):
        low = w.sgr_min_pct < threshold_pct and not w.self_juxtaposed
        rows.append([
            str(k),
            f"{w.footwall_top_m:.1f}-{w.footwall_base_m:.1f}",
            f"{w.hangingwall_top_m:.1f}-{w.hangingwall_base_m:.1f}",
            f"{w.throw_min_m:.1f}-{w.throw_max_m:.1f}",
            f"{w.sgr_min_pct:.1f}",
            f"{w.sgr_max_pct:.1f}",
            "same sand" if w.self_juxtaposed else ("below threshold" if low else ""),
        ])
    return rows


_TABLE_HEAD = ["#", "footwall sand (m)", "hanging-wall sand (m)", "throw (m)",
               "SGR min %", "SGR max %", "note"]


def _draw_table(ax, rows, title):
    ax.set_axis_off()
    ax.set_title(title, loc="left", fontsize=10, fontweight="bold")
    if not rows:
        ax.text(0, 0.95, "No sand-sand windows within the screened throws.", va="top", fontsize=9)
        return
    table = ax.table(cellText=rows, colLabels=_TABLE_HEAD, loc="upper left", cellLoc="center",
                     colWidths=[0.05, 0.19, 0.19, 0.14, 0.1, 0.1, 0.2])
    table.auto_set_font_size(False)
    table.set_fontsize(7.5)
    table.scale(1.0, 1.15)
    for (r, _c), cell in table.get_celld().items():
        cell.set_edgecolor("#BBBBBB")
        if r == 0:
            cell.set_facecolor("#EEEEEE")


def _footer(fig, result):
    s = result.settings
    w = result.well
    prov = (
        f"Source: {w.source}   sha256 {w.sha256[:16]}...   WELL '{w.name}'   depth unit as read: "
        f"{w.depth_unit}   GR curve: {w.gr_mnemonic}   logprep {__version__}\n"
        f"Settings: transform {s.transform}; GR clean {s.gr_clean} = {result.gr_clean_api:.1f} API; "
        f"GR shale {s.gr_shale} = {result.gr_shale_api:.1f} API; cut-offs sand <= {s.sand_cutoff:g}, "
        f"shale >= {s.shale_cutoff:g}; min bed {s.min_bed_m:g} m; blocking {s.blocking}; "
        f"throws 0-{s.throw_max_m:g} m; SGR threshold {s.sgr_threshold_pct:g} %."
    )
    if result.notes:
        prov += "\nNotes: " + "; ".join(result.notes)
    fig.text(0.015, 0.058, prov, fontsize=7, va="bottom", family="monospace", wrap=True)
    fig.text(0.015, 0.012, "CAUTION: " + CAUTION, fontsize=8, va="bottom", wrap=True,
             color="#7A1F00", bbox=dict(facecolor="#FFF4E5", edgecolor="#D55E00", pad=4))


def build_sheet(result) -> list[Figure]:
    """The screening sheet for one :class:`~logprep.pipeline.WellScreening`: page 1 with
    the log tracks, the triangle diagram and the first windows; more pages when the window
    table is long."""
    fig = Figure(figsize=PAGE_SIZE_IN)
    fig.suptitle(f"Fault-seal screening sheet: {result.well.name}", x=0.015, ha="left",
                 fontsize=15, fontweight="bold")
    gs = fig.add_gridspec(1, 5, left=0.045, right=0.985, top=0.92, bottom=0.17,
                          width_ratios=[1.0, 1.0, 0.45, 4.2, 3.6], wspace=0.08)
    ax_gr = fig.add_subplot(gs[0])
    ax_vsh = fig.add_subplot(gs[1], sharey=ax_gr)
    ax_lith = fig.add_subplot(gs[2], sharey=ax_gr)
    ax_tri = fig.add_subplot(gs[3], sharey=ax_gr)
    right = gs[4].subgridspec(2, 1, height_ratios=[1.0, 2.6], hspace=0.15)
    ax_leg = fig.add_subplot(right[0])
    ax_tab = fig.add_subplot(right[1])

    d, L = result.depth_m, result.layers
    ax_gr.plot(result.gr_api, d, color="#222222", lw=0.6)
    ax_gr.axvline(result.gr_clean_api, color="#0072B2", ls="--", lw=1, label="clean line")
    ax_gr.axvline(result.gr_shale_api, color="#D55E00", ls="--", lw=1, label="shale line")
    ax_gr.set_xlabel(f"GR ({result.well.gr_mnemonic}), API")
    ax_gr.set_ylabel("Depth (m, as logged)")
    ax_gr.legend(loc="lower left", fontsize=6.5, framealpha=0.9)
    ax_gr.set_ylim(L.base_m[-1], L.top_m[0])

    ax_vsh.plot(result.vsh, d, color="#444444", lw=0.5, label="Vsh")
    step_z = np.repeat(np.column_stack([L.top_m, L.base_m]).ravel(), 1)
    step_v = np.repeat(L.vsh, 2)
    ax_vsh.plot(step_v, step_z, color="#0072B2", lw=1.2, label="blocked")
    for cut in (result.settings.sand_cutoff, result.settings.shale_cutoff):
        ax_vsh.axvline(cut, color="#999999", lw=0.8, ls=":")
    if result.filled.any():
        ax_vsh.plot(np.where(result.filled, result.vsh, np.nan), d, color="#CC79A7", lw=2,
                    label="interpolated")
    ax_vsh.set_xlim(0, 1)
    ax_vsh.set_xlabel(f"Vsh ({result.settings.transform})")
    ax_vsh.legend(loc="lower left", fontsize=6.5, framealpha=0.9)
    ax_vsh.tick_params(labelleft=False)

    for top, base, lith in zip(L.top_m, L.base_m, L.lithology):
        ax_lith.axhspan(top, base, color=LITHOLOGY_COLOURS[lith], lw=0)
    ax_lith.set_xticks([])
    ax_lith.set_xlabel("Layers")
    ax_lith.tick_params(labelleft=False)

    depth, throw, sgr, jux = result.grids()
    cmap = ListedColormap([CLASS_COLOURS[k] for k in sorted(CLASS_COLOURS)])
    norm = BoundaryNorm(np.arange(-0.5, len(CLASS_COLOURS)), cmap.N)
    ax_tri.pcolormesh(throw, depth, jux, cmap=cmap, norm=norm, shading="nearest",
                      rasterized=True)
    cs = ax_tri.contour(throw, depth, np.where(np.isfinite(sgr), sgr, np.nan),
                        levels=SGR_CONTOURS_PCT, colors="#111111", linewidths=0.6)
    ax_tri.clabel(cs, fmt="%d%%", fontsize=6.5)
    ax_tri.set_xlim(0, result.settings.throw_max_m)
    ax_tri.set_xlabel("Throw (m), normal fault, hanging wall down")
    ax_tri.set_title("Triangle diagram: footwall depth vs throw; juxtaposition class, SGR contours",
                     fontsize=9, loc="left")
    ax_tri.tick_params(labelleft=False)
    for k, w in enumerate(result.windows.itertuples(index=False), start=1):
        if w.self_juxtaposed:
            continue
        tmid = 0.5 * (w.throw_min_m + w.throw_max_m)
        zmid = 0.5 * (max(w.footwall_top_m, w.hangingwall_top_m + tmid)
                      + min(w.footwall_base_m, w.hangingwall_base_m + tmid))
        ax_tri.text(tmid, zmid, str(k), fontsize=6.5, ha="center", va="center",
                    bbox=dict(boxstyle="round,pad=0.15", fc="white", ec="#D55E00", lw=0.6))

    ax_leg.set_axis_off()
    handles = [Patch(facecolor=CLASS_COLOURS[k], edgecolor="#666666", label=JUXTAPOSITION_CLASSES[k])
               for k in sorted(CLASS_COLOURS) if k != 0]
    handles += [Patch(facecolor=c, edgecolor="#666666", label=f"layer: {n}")
                for n, c in LITHOLOGY_COLOURS.items()]
    ax_leg.legend(handles=handles, loc="upper left", ncol=2, fontsize=8, frameon=False,
                  title="Footwall / hanging-wall lithology", title_fontsize=9)
    n_sand = sum(1 for x in L.lithology if x == "sand")
    cross = result.windows[~result.windows["self_juxtaposed"]]
    summary = (f"{len(L)} layers, {n_sand} sands, net-to-gross "
               f"{L.thickness_m[np.array(L.lithology) == 'sand'].sum() / L.thickness_m.sum():.2f}; "
               f"{len(cross)} sand-sand windows between different sands; "
               f"lowest window SGR {result.min_window_sgr_pct:.1f} %")
    ax_leg.text(0, 0.02, summary, fontsize=8.5, va="bottom", wrap=True)

    rows = _window_rows(result.windows, result.settings.sgr_threshold_pct)
    title = "Sand-sand windows (numbers as on the diagram)"
    if len(rows) > ROWS_PAGE1:
        title += f": first {ROWS_PAGE1} of {len(rows)}, the rest overleaf"
    _draw_table(ax_tab, rows[:ROWS_PAGE1], title)
    _footer(fig, result)
    pages = [fig]
    rest = rows[ROWS_PAGE1:]
    while rest:
        page = Figure(figsize=PAGE_SIZE_IN)
        page.suptitle(f"{result.well.name}: sand-sand windows (continued)", x=0.015, ha="left",
                      fontsize=13, fontweight="bold")
        ax = page.add_axes([0.03, 0.17, 0.94, 0.75])
        _draw_table(ax, rest[:ROWS_PER_PAGE], "")
        _footer(page, result)
        pages.append(page)
        rest = rest[ROWS_PER_PAGE:]
    return pages
