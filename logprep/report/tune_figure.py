"""The one-page figure of a blocking sweep: where the verdicts hold and where they flip.

Builds a matplotlib Figure with the object API; never saves or shows it.  Colours: the
perceptually uniform cividis and viridis maps and the Okabe & Ito (2008) palette.
"""

from __future__ import annotations

import numpy as np
from matplotlib.figure import Figure
from matplotlib.ticker import MaxNLocator

from logprep import __version__
from logprep.report.caution import CAUTION

LEAK_COLOUR, SEAL_COLOUR, INK = "#D55E00", "#0072B2", "#222222"
VERDICT_BAR_COLOURS = {"leak": LEAK_COLOUR, "uncertain": "#E69F00", "seal": SEAL_COLOUR}
"""Bar colour of each reference verdict (Okabe & Ito 2008: vermilion, orange, blue)."""
PAGE_SIZE_IN = (16.5, 11.7)  # A3 landscape, as the screening sheet
MAX_BED_PANELS = 6


def _grid(table, value: str, bed: float):
    """``(sand values, shale values, 2-D array [shale, sand])`` of one column at one bed."""
    t = table[(table["min_bed_m"] == bed) & ~table["is_reference"]]
    sands = np.sort(t["sand_cutoff"].unique())
    shales = np.sort(t["shale_cutoff"].unique())
    z = np.full((len(shales), len(sands)), np.nan)
    for r in t.itertuples():
        z[np.searchsorted(shales, r.shale_cutoff), np.searchsorted(sands, r.sand_cutoff)] = getattr(r, value)
    return sands, shales, z


def _heatmap(ax, table, value, bed, cmap, vmin, vmax, fmt, ref):
    sands, shales, z = _grid(table, value, bed)
    im = ax.imshow(z, origin="lower", cmap=cmap, vmin=vmin, vmax=vmax, aspect="auto",
                   extent=(-0.5, len(sands) - 0.5, -0.5, len(shales) - 0.5))
    for i in range(len(shales)):
        for j in range(len(sands)):
            if np.isfinite(z[i, j]):
                r, g, b, _ = im.cmap(im.norm(z[i, j]))
                dark = 0.299 * r + 0.587 * g + 0.114 * b < 0.5
                ax.text(j, i, fmt(z[i, j]), ha="center", va="center", fontsize=6.5,
                        color="white" if dark else INK)
    ax.set_xticks(range(len(sands)), [f"{x:g}" for x in sands], fontsize=7)
    ax.set_yticks(range(len(shales)), [f"{x:g}" for x in shales], fontsize=7)
    if np.isclose(bed, ref.layers.min_bed_m) and ref.layers.sand_cutoff in sands and ref.layers.shale_cutoff in shales:
        j, i = list(sands).index(ref.layers.sand_cutoff), list(shales).index(ref.layers.shale_cutoff)
        ax.add_patch(_box(j, i))
    return im


def _box(j, i):
    from matplotlib.patches import Rectangle

    return Rectangle((j - 0.5, i - 0.5), 1, 1, fill=False, ec=INK, lw=2.2)


def sweep_figure(sweep, stable) -> Figure:
    """One page: verdict flips and lowest window SGR over the cut-offs for each minimum
    bed, the stability of every reference window, and a summary.

    ``sweep`` is a :class:`~logprep.run.tune.Sweep`; ``stable`` its stable settings (the
    table of :func:`~logprep.run.tune.stable_settings`), passed in by the caller.
    """
    table, ref = sweep.table, sweep.settings
    res = sweep.reference
    beds = sorted(table.loc[~table["is_reference"], "min_bed_m"].unique())
    if len(beds) > MAX_BED_PANELS:  # spread the panels over the range
        beds = [beds[int(round(k))] for k in np.linspace(0, len(beds) - 1, MAX_BED_PANELS)]
    nb = max(len(beds), 1)
    fig = Figure(figsize=PAGE_SIZE_IN)
    gs = fig.add_gridspec(3, nb + 1, width_ratios=[1] * nb + [0.06], height_ratios=[1, 1, 0.8],
                          left=0.05, right=0.95, top=0.90, bottom=0.17, hspace=0.42, wspace=0.25)
    n_win = len(sweep.windows)
    flips_max = max(1, int(table["verdicts_flipped"].max()) if len(table) else 1)
    sgr = table["min_window_sgr_pct"].to_numpy(float)
    s_lo, s_hi = (np.nanmin(sgr), np.nanmax(sgr)) if np.isfinite(sgr).any() else (0, 100)
    im1 = im2 = None
    for k, bed in enumerate(beds):
        ax = fig.add_subplot(gs[0, k])
        im1 = _heatmap(ax, table, "verdicts_flipped", bed, "cividis_r", 0, flips_max,
                       lambda v: f"{v:.0f}", ref)
        ax.set_title(f"min bed {bed:g} m", fontsize=9)
        if k == 0:
            ax.set_ylabel("shale cut-off (Vsh)")
        ax2 = fig.add_subplot(gs[1, k])
        im2 = _heatmap(ax2, table, "min_window_sgr_pct", bed, "viridis", s_lo, max(s_hi, s_lo + 1),
                       lambda v: f"{v:.0f}", ref)
        ax2.set_xlabel("sand cut-off (Vsh)", fontsize=8)
        if k == 0:
            ax2.set_ylabel("shale cut-off (Vsh)")
    if im1 is not None:
        cb = fig.colorbar(im1, cax=fig.add_subplot(gs[0, nb]))
        cb.set_label(f"verdict flips ({n_win} reference windows)", fontsize=8)
        cb.locator = MaxNLocator(integer=True)
        cb.update_ticks()
        cb2 = fig.colorbar(im2, cax=fig.add_subplot(gs[1, nb]))
        cb2.set_label("lowest window SGR (%)", fontsize=8)
        cb2.ax.axhline(ref.capacity.sgr_threshold_pct, color=LEAK_COLOUR, lw=2)
    fig.text(0.05, 0.925, "Row 1: windows whose leak / no-leak verdict differs from the reference "
             "(reference windows that flip, plus new leaking windows; 0 = stable).\nRow 2: lowest SGR over windows between different sands; "
             f"verdict leak below {ref.capacity.sgr_leak_pct:g} %, seal from "
             f"{ref.capacity.sgr_threshold_pct:g} % (red mark on the scale), uncertain between. "
             "Framed cell: the reference setting.", fontsize=8.5)

    ax = fig.add_subplot(gs[2, : max(nb - 2, 1)])
    w = sweep.windows.sort_values(["footwall_top_m", "hangingwall_top_m"], kind="stable")
    if len(w):
        x = np.arange(len(w))
        ax.bar(x, 100 * w["flipped_fraction"], width=0.85,
               color=[VERDICT_BAR_COLOURS.get(v, SEAL_COLOUR) for v in w["verdict"]])
        ax.set_xlim(-0.6, len(w) - 0.4)
        step = max(1, len(w) // 40)
        ax.set_xticks(x[::step], [f"#{k}" for k in w["window"]][::step], fontsize=6, rotation=90)
        if not w["flipped_fraction"].any():
            ax.text(0.5, 0.6, "no reference window flips in any setting\n(row 1 also counts "
                    "new leaks at sands the reference does not have)",
                    ha="center", va="center", transform=ax.transAxes, fontsize=9)
    else:
        ax.text(0.5, 0.5, "no windows between different sands at the reference setting",
                ha="center", va="center", transform=ax.transAxes)
    ax.set_ylim(0, 100)
    ax.set_ylabel("settings where it flips (%)", fontsize=8)
    ax.set_title("Each reference window (numbers as on the sheet, by footwall depth): share of "
                 "settings where it turns leak or stops leaking; colour = reference verdict "
                 "(vermilion leak, orange uncertain, blue seal)", fontsize=9, loc="left")

    tx = fig.add_subplot(gs[2, max(nb - 2, 1):])
    tx.set_axis_off()
    r0 = table[table["is_reference"]].iloc[0]
    lines = [
        f"Reference: sand <= {ref.layers.sand_cutoff:g}, shale >= {ref.layers.shale_cutoff:g}, min bed "
        f"{ref.layers.min_bed_m:g} m, blocking {ref.layers.blocking}",
        f"  {int(r0.layers)} layers, {int(r0.sands)} sands, net-to-gross {r0.net_to_gross:.2f}",
        f"  {int(r0.sand_sand_windows)} windows, {int(r0.leak_windows)} leak; lowest SGR "
        f"{r0.min_window_sgr_pct:.1f} %",
        f"Settings swept: {int((~table['is_reference']).sum())}; with no flip: "
        f"{int((table['verdicts_flipped'] == 0).sum() - 1)}",
        f"Settings with no flip here or one step away: {len(stable)}",
    ]
    if len(stable):
        d = ((stable["sand_cutoff"] - ref.layers.sand_cutoff) ** 2 + (stable["shale_cutoff"] - ref.layers.shale_cutoff) ** 2
             + ((stable["min_bed_m"] - ref.layers.min_bed_m) / 10) ** 2)
        b = stable.loc[d.idxmin()]
        lines.append(f"  nearest to the reference: sand {b.sand_cutoff:g}, shale {b.shale_cutoff:g}, "
                     f"min bed {b.min_bed_m:g} m")
    tx.text(0, 1, "\n".join(lines), va="top", fontsize=8.5, family="monospace")

    fig.suptitle(f"Blocking sensitivity: {res.well.name}", x=0.05, ha="left", fontsize=15,
                 fontweight="bold")
    fig.text(0.05, 0.085,
             f"Source: {res.well.source}   sha256 {res.well.sha256[:16]}...   logprep {__version__}   "
             f"transform {ref.clay.transform}; GR clean {res.gr_clean_api:.1f} API, shale "
             f"{res.gr_shale_api:.1f} API; throws 0-{ref.field.throw_max_m:g} m; SGR threshold "
             f"{ref.capacity.sgr_threshold_pct:g} %", fontsize=7, family="monospace")
    fig.text(0.05, 0.02, "CAUTION: " + CAUTION, fontsize=8, va="bottom", wrap=True,
             color="#7A1F00", bbox=dict(facecolor="#FFF4E5", edgecolor=LEAK_COLOUR, pad=4))
    return fig
