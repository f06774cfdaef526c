"""The small figure the tuning notebook redraws when a blocking slider moves: only what the
blocking changes (the layer column, the triangle diagram with the windows numbered as on
the sheet, and the verdict counts), not the whole sheet."""

from __future__ import annotations

from matplotlib.figure import Figure

from logprep.report.draw import LITHOLOGY_COLOURS, draw_field, draw_sgr_colourbar, riskiest_windows
from logprep.report.labels import formation_labels


def blocking_figure(result, n_numbered: int = 15) -> Figure:
    """Layer column and triangle diagram of ``result`` (a screened or re-blocked well)."""
    s = result.settings
    fig = Figure(figsize=(11, 6.5))
    gs = fig.add_gridspec(1, 2, left=0.07, right=0.98, top=0.86, bottom=0.1, width_ratios=[0.9, 5],
                          wspace=0.04)
    ax_l = fig.add_subplot(gs[0])
    ax_t = fig.add_subplot(gs[1], sharey=ax_l)
    L = result.layers
    for top, base, lith in zip(L.top_m, L.base_m, L.lithology):
        ax_l.axhspan(top, base, color=LITHOLOGY_COLOURS[lith], lw=0)
    ax_l.set_xticks([])
    ax_l.set_ylabel("Depth (m)")
    numbers = riskiest_windows(result, n_numbered)
    im = draw_field(ax_t, result.grid, threshold_pct=s.capacity.sgr_threshold_pct,
                    throw_max_m=s.field.throw_max_m, windows=result.windows, labelled=numbers)
    ax_l.set_ylim(ax_t.get_ylim())
    if len(result.tops):
        formation_labels(ax_l, result.tops["top_m"].to_numpy(float), [str(n) for n in result.tops["name"]])
    draw_sgr_colourbar(ax_t, im)
    ax_t.tick_params(labelleft=False)
    ax_t.set_xlabel("Throw (m)")
    cross = result.windows[~result.windows["self_juxtaposed"]]
    counts = cross["verdict"].value_counts() if "verdict" in cross else {}
    fig.text(0.07, 0.985, f"{result.well.name}: sand <= {s.layers.sand_cutoff:g}, shale >= "
             f"{s.layers.shale_cutoff:g}, min bed {s.layers.min_bed_m:g} m, {s.layers.blocking}: "
             f"{len(L)} layers, {len(cross)} windows: "
             + ", ".join(f"{counts.get(v, 0)} {v}" for v in ("leak", "uncertain", "seal"))
             + f"\nthe {len(numbers)} lowest-SGR windows numbered as on the sheet and in juxtapositions.csv",
             fontsize=9, va="top", parse_math=False)
    return fig
