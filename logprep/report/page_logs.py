"""Page 1 of the sheet: GR, Vsh and layer tracks, the triangle diagram (SGR over footwall
depth x throw), the legend and the riskiest windows."""

from __future__ import annotations

import numpy as np
from matplotlib.figure import Figure
from matplotlib.patches import Patch

from matplotlib.ticker import MaxNLocator

from logprep.report.labels import formation_labels
from logprep.report.layout import robust_upper
from logprep.report.rockdraw import ROCK_COLOURS, hatch_no_data_field, hatch_no_data_layers, rock_legend_handles
from logprep.report.draw import (
    INK, LITHOLOGY_COLOURS, NO_DATA, PAGE_SIZE_IN, QC_COLOURS, ROWS_PAGE1, WINDOW_INK, draw_field,
    draw_footer, draw_sgr_colourbar, draw_window_table, riskiest_windows, window_rows,
)


# ----------------------------------------------------------------------------- tracks
CLIPPED_INK = "#CC79A7"  # Okabe & Ito reddish purple: readings beyond the GR scale


def draw_gr_track(ax, result) -> None:
    """GR with the clean and shale lines of each zone, zone boundaries, and QC flags as
    coloured ticks along the right edge.  The scale runs from 0 to a nice number above the
    99.5th percentile (and the shale lines), so spikes do not squeeze the curve; readings
    beyond it are drawn at the edge and marked."""
    gr_max = robust_upper(result.gr_api, result.gr_shale_line if result.gr_shale_line is not None
                          else [result.gr_shale_api])
    clipped = np.isfinite(result.gr_api) & (result.gr_api > gr_max)
    ax.plot(np.minimum(result.gr_api, gr_max), result.depth_m, color=INK, lw=0.6)
    if clipped.any():
        ax.scatter(np.full(int(clipped.sum()), 0.985), result.depth_m[clipped], s=9, marker="4",
                   color=CLIPPED_INK, transform=ax.get_yaxis_transform(),
                   label=f"{int(clipped.sum())} > {gr_max:g} API, at edge")
    if result.gr_clean_line is not None:
        ax.plot(result.gr_clean_line, result.depth_m, color="#0072B2", ls="--", lw=1,
                label="clean line per zone")
        ax.plot(result.gr_shale_line, result.depth_m, color="#D55E00", ls="--", lw=1,
                label="shale line per zone")
        for top in result.picks["top_m"].iloc[1:]:
            ax.axhline(top, color="#999999", lw=0.6, ls=":")
    else:
        ax.axvline(result.gr_clean_api, color="#0072B2", ls="--", lw=1,
                   label=f"clean {result.gr_clean_api:.0f}")
        ax.axvline(result.gr_shale_api, color="#D55E00", ls="--", lw=1,
                   label=f"shale {result.gr_shale_api:.0f}")
    trans = ax.get_yaxis_transform()
    for name, mask in result.qc_flags.items():
        if np.any(mask):
            ax.scatter(np.full(int(mask.sum()), 0.97), result.depth_m[mask], s=6, marker="_",
                       color=QC_COLOURS.get(name, INK), transform=trans,
                       label=f"QC: {name.replace('_', ' ')}")
    ax.set_xlim(0, gr_max)
    ax.set_xticks([v for v in MaxNLocator(3).tick_values(0, gr_max) if 0 <= v < 0.9 * gr_max])
    ax.set_xlabel(f"GR ({result.well.gr_mnemonic}), API\n{len(result.picks)} zone(s)", fontsize=8,
                  parse_math=False)
    ax.set_ylabel(f"Depth (m, {getattr(result, 'depth_reference', 'as logged')})")
    ax.legend(loc="lower left", fontsize=6, framealpha=0.9)
    L = result.layers
    ax.set_ylim(L.base_m[-1], L.top_m[0])


def draw_vsh_track(ax, result) -> None:
    """Vsh per sample, the blocked Vsh, the cut-offs, and interpolated stretches."""
    L, s = result.layers, result.settings
    if result.vsh_nd is not None and np.any(np.isfinite(result.vsh_nd)):
        ax.plot(result.vsh_nd, result.depth_m, color="#009E73", lw=0.4, alpha=0.7,
                label="Vsh neutron-density")
    ax.plot(result.vsh, result.depth_m, color="#777777", lw=0.5, label=f"Vsh ({s.clay.vsh_combine})")
    z = np.column_stack([L.top_m, L.base_m]).ravel()
    ax.plot(np.repeat(L.vsh, 2), z, color="#0072B2", lw=1.2, label="blocked")
    for cut in (s.layers.sand_cutoff, s.layers.shale_cutoff):
        ax.axvline(cut, color="#999999", lw=0.8, ls=":")
    if result.filled.any():
        ax.plot(np.where(result.filled, result.vsh, np.nan), result.depth_m, color="#CC79A7",
                lw=2.5, label="interpolated")
    ax.set_xlim(0, 1)
    ax.set_xticks([0.25, 0.5, 0.75])
    ax.set_xlabel(f"Vsh ({s.clay.transform})", fontsize=8)
    ax.legend(loc="lower left", fontsize=6.5, framealpha=0.9)
    ax.tick_params(labelleft=False)


def draw_layer_track(ax, result) -> None:
    """The blocked column coloured by lithology; samples with any QC flag are marked
    by a dark tick in the right third of the column."""
    from matplotlib.collections import PolyCollection

    L = result.layers
    spans = [((0, t), (1, t), (1, b), (0, b)) for t, b in zip(L.top_m, L.base_m)]
    ax.add_collection(PolyCollection(  # one collection: a patch per layer costs 1-2 ms each
        spans, facecolors=[LITHOLOGY_COLOURS[lith] for lith in L.lithology], linewidths=0,
        antialiaseds=False, transform=ax.get_yaxis_transform()), autolim=False)
    hatch_no_data_layers(ax, L)
    if result.qc_flags:
        bad = np.zeros(result.depth_m.size, dtype=bool)
        for mask in result.qc_flags.values():
            bad |= mask
        if bad.any():
            ax.scatter(np.full(int(bad.sum()), 0.85), result.depth_m[bad], s=8, marker="_",
                       color=INK, transform=ax.get_yaxis_transform())
    ax.set_xticks([])
    tops = getattr(result, "tops", None)
    if tops is not None and len(tops):
        formation_labels(ax, tops["top_m"].to_numpy(float), [str(n) for n in tops["name"]])
        ax.set_xlabel("Layers and\nformation tops", fontsize=8)
    else:
        ax.set_xlabel("Layers", fontsize=8)
    ax.tick_params(labelleft=False)


# ----------------------------------------------------------------------------- triangle and legend
def draw_triangle(ax, result, labelled=()) -> None:
    """Triangle diagram: footwall depth against throw, the SGR field coloured, contours at
    the screening threshold and fixed levels, juxtaposition classes, and the sand-sand
    windows outlined (``labelled`` row numbers from 1 numbered)."""
    s = result.settings
    im = draw_field(ax, result.grid, threshold_pct=s.capacity.sgr_threshold_pct, throw_max_m=s.field.throw_max_m,
                    windows=result.windows, labelled=labelled)
    hatch_no_data_field(ax, result.grid, result.layers)
    draw_sgr_colourbar(ax, im)
    ax.set_xlabel("Throw (m); normal fault, hanging wall down")
    ax.text(0.0, 1.012, f"Triangle diagram: SGR from {result.grid.source},\nsand-sand windows outlined",
            transform=ax.transAxes, fontsize=7.5, ha="left", va="bottom")
    ax.tick_params(labelleft=False)


def draw_legend(ax, result) -> None:
    """Class and lithology keys and a one-paragraph summary of the well."""
    ax.set_axis_off()
    from matplotlib.lines import Line2D

    th = result.settings.capacity.sgr_threshold_pct
    handles = [
        Patch(facecolor="#7F7F7F", edgecolor="#FFFFFF", hatch="////", label="sand/sand juxtaposition"),
        Patch(facecolor="#7F7F7F", edgecolor="#FFFFFF", hatch="....", label="sand/heterolith juxtaposition"),
        Line2D([], [], color=INK, lw=1.6, label=f"SGR {th:g} % (screening threshold)"),
        Line2D([], [], color=INK, lw=0.6, label="SGR contours (levels on the colour bar)"),
        Patch(facecolor="none", edgecolor=WINDOW_INK, label="sand-sand window (numbered: in table)"),
        Patch(facecolor=NO_DATA, edgecolor="#666666", label="slipped interval leaves the log"),
    ]
    handles += [Patch(facecolor=c, edgecolor="#666666", label=f"layer: {n}")
                for n, c in LITHOLOGY_COLOURS.items() if n not in ROCK_COLOURS]
    handles += rock_legend_handles(result.layers)
    ax.legend(handles=handles, loc="upper left", ncol=2, fontsize=8, frameon=False,
              title="Triangle diagram and layers", title_fontsize=9)
    L = result.layers
    sand = np.asarray(L.reservoir, dtype=bool)  # reservoir layers (default: sand)
    cross = result.windows[~result.windows["self_juxtaposed"]]
    low = cross[cross["sgr_min_pct"] < result.settings.capacity.sgr_threshold_pct]
    lines = [
        f"{len(L)} layers, {int(sand.sum())} sands, net-to-gross "
        f"{L.thickness_m[sand].sum() / L.thickness_m.sum():.2f}",
        f"{len(cross)} windows between different sands within throws 0-"
        f"{result.settings.field.throw_max_m:g} m",
        f"{len(low)} reach SGR below {result.settings.capacity.sgr_threshold_pct:g} %; "
        f"lowest window SGR {result.min_window_sgr_pct:.1f} %",
    ]
    if "verdict" in cross:
        counts = cross["verdict"].value_counts()
        lines.append("verdicts: " + ", ".join(f"{counts.get(v, 0)} {v}" for v in ("leak", "uncertain", "seal"))
                     + f" (leak below SGR {result.settings.capacity.sgr_leak_pct:g} %, seal from "
                     f"{result.settings.capacity.sgr_threshold_pct:g} %)")
        lines.append("column heights against throw: page 2")
    ax.text(0, 0.0, "\n".join(lines), fontsize=8.5, va="bottom")


# ----------------------------------------------------------------------------- the page
def log_page(result) -> list[Figure]:
    """Page 1: the logs, the triangle diagram and the riskiest windows."""
    fig = Figure(figsize=PAGE_SIZE_IN)
    fig.text(0.015, 0.975, f"Fault-seal screening: {result.well.name}", ha="left", va="top",
             fontsize=15, fontweight="bold", parse_math=False)
    has_tops = getattr(result, "tops", None) is not None and len(result.tops) > 0
    gs = fig.add_gridspec(1, 5, left=0.045, right=0.985, top=0.9, bottom=0.2,
                          width_ratios=[1.0, 1.0, 0.95 if has_tops else 0.45, 4.0, 3.6], wspace=0.1)
    ax_gr = fig.add_subplot(gs[0])
    ax_vsh = fig.add_subplot(gs[1], sharey=ax_gr)
    ax_lith = fig.add_subplot(gs[2], sharey=ax_gr)
    ax_tri = fig.add_subplot(gs[3], sharey=ax_gr)
    right = gs[4].subgridspec(2, 1, height_ratios=[1.0, 2.7], hspace=0.12)
    numbers = riskiest_windows(result, ROWS_PAGE1)
    draw_gr_track(ax_gr, result)
    draw_vsh_track(ax_vsh, result)
    draw_layer_track(ax_lith, result)
    draw_triangle(ax_tri, result, labelled=numbers)
    draw_legend(fig.add_subplot(right[0]), result)
    n_cross = int((~result.windows["self_juxtaposed"]).sum())
    title = "Sand-sand windows, lowest SGR first"
    if n_cross > len(numbers):
        title += f" ({len(numbers)} of {n_cross}; more overleaf)"
    draw_window_table(fig.add_subplot(right[1]),
                      window_rows(result.windows, numbers, result.settings.capacity.sgr_threshold_pct,
                                  result.settings.capacity.length_unit, tops=getattr(result, "tops", None)),
                      title, verdict_key=True)
    draw_footer(fig, result)
    return [fig]
