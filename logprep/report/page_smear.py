"""Sheet page with the shale smear indicators over the triangle diagram (SSF and CSP).

Registered in :data:`logprep.report.sheet.PAGES`.  Colours: perceptually uniform matplotlib
maps (viridis) and the Okabe & Ito (2008) vermillion for the sand-sand windows.
"""

from __future__ import annotations

import matplotlib
import numpy as np
from matplotlib.colors import LogNorm
from matplotlib.figure import Figure

from logprep.fault.sgr import contact_polygon
from logprep.fault.smear import SSF_INCOMPLETE
from logprep.report.draw import (
    INK, MAX_DRAWN_ROWS, PAGE_SIZE_IN, WINDOW_INK, draw_contours, draw_footer, field_cmap, field_ylim,
    plain_log_ticks,
)

SSF_RANGE = (0.0, 2 * SSF_INCOMPLETE)
SSF_CONTOURS = (4.0, SSF_INCOMPLETE)
CSP_RANGE_M = (0.1, 1000.0)
CSP_CONTOURS_M = (1.0, 10.0, 100.0)


def _outline_windows(ax, windows, throw_max_m, ink):
    """The windows between different sands outlined, as one collection."""
    from matplotlib.collections import PolyCollection

    if windows is None or not len(windows):
        return
    polys = [contact_polygon(w.footwall_top_m, w.footwall_base_m, w.hangingwall_top_m,
                             w.hangingwall_base_m, 0.0, throw_max_m)
             for w in windows[~windows["self_juxtaposed"]].itertuples()]
    polys = [p for p in polys if len(p) >= 3]
    if polys:
        ax.add_collection(PolyCollection(polys, facecolors="none", edgecolors=ink, linewidths=0.6))


def _image(ax, grid, values, cmap, norm):

    step = max(1, int(np.ceil(grid.depth_m.size / MAX_DRAWN_ROWS)))
    depth, throw = grid.depth_m[::step], grid.throw_m
    v = np.asarray(values[::step], float)
    dt = throw[1] - throw[0] if throw.size > 1 else 1.0
    dz = depth[1] - depth[0] if depth.size > 1 else 1.0
    im = ax.imshow(np.ma.masked_invalid(np.where(np.isinf(v), 1e30, v)),
                   cmap=field_cmap(cmap), norm=norm,
                   aspect="auto", interpolation="nearest", origin="upper",
                   extent=(throw[0] - dt / 2, throw[-1] + dt / 2, depth[-1] + dz / 2, depth[0] - dz / 2))
    ax.set_ylim(*field_ylim(depth, dz))
    ax.set_xlim(min(0.0, throw[0]), throw[-1])
    return depth, throw, v, im


def smear_page(result) -> list[Figure]:
    """SSF and CSP fields of the well, sand-sand windows outlined."""

    grid = result.grid
    if grid is None or "ssf" not in grid.extra:
        return []
    fig = Figure(figsize=PAGE_SIZE_IN)
    fig.suptitle(f"{result.well.name}: shale smear indicators over the triangle diagram",
                 x=0.015, ha="left", fontsize=13, fontweight="bold")
    gs = fig.add_gridspec(1, 2, left=0.05, right=0.98, top=0.88, bottom=0.2, wspace=0.12)
    ax1 = fig.add_subplot(gs[0])
    ax2 = fig.add_subplot(gs[1], sharey=ax1)
    throw_max = result.settings.field.throw_max_m

    depth, throw, ssf, im = _image(ax1, grid, grid.extra["ssf"], "viridis",
                                   matplotlib.colors.Normalize(*SSF_RANGE))
    finite = np.where(np.isfinite(ssf), ssf, np.where(np.isinf(ssf), 1e6, np.nan))
    cs1 = draw_contours(ax1, throw, depth, finite, SSF_CONTOURS, colors=INK, linewidths=[0.7, 1.6])
    _outline_windows(ax1, result.windows, throw_max, WINDOW_INK)
    cb = fig.colorbar(im, ax=ax1, orientation="horizontal", fraction=0.04, pad=0.08, extend="max")
    if cs1 is not None:
        cb.add_lines(cs1)  # the contour levels, marked on the bar instead of along the lines
    cb.set_label("SSF = throw / thickness of the thickest source bed passed (bold: 7, above which "
                 "smears may be incomplete; top colour also where no source bed has passed)", fontsize=7)
    ax1.text(0.0, 1.01, "Shale smear factor (Lindsay et al. 1993)", transform=ax1.transAxes,
             ha="left", va="bottom", fontsize=10)
    ax1.set_ylabel("Footwall depth (m)")
    ax1.set_xlabel("Throw (m)")

    depth, throw, csp, im = _image(ax2, grid, np.maximum(grid.extra["csp_m"], CSP_RANGE_M[0]),
                                   "viridis", LogNorm(*CSP_RANGE_M))
    cs2 = draw_contours(ax2, throw, depth, csp, CSP_CONTOURS_M, colors=INK, linewidths=0.7)
    _outline_windows(ax2, result.windows, throw_max, WINDOW_INK)
    cb = fig.colorbar(im, ax=ax2, orientation="horizontal", fraction=0.04, pad=0.08, extend="both")
    if cs2 is not None:
        cb.add_lines(cs2)
    plain_log_ticks(cb.ax.xaxis)
    cb.set_label("CSP = sum of thickness^2 / smear distance over the source beds passed, from "
                 "both cut-offs (m; bottom colour also where none has passed)", fontsize=7)
    ax2.text(0.0, 1.01, "Clay smear potential (Bouvier et al. 1989; Fulljames et al. 1997)",
             transform=ax2.transAxes, ha="left", va="bottom", fontsize=10)
    ax2.set_xlabel("Throw (m)")
    ax2.tick_params(labelleft=False)
    clay_min = result.settings.field.smear_clay_min
    fig.text(0.05, 0.905, f"Source beds: the shale and heterolith layers of the blocked column whose "
             f"clay fraction reaches {clay_min:g} (--smear-clay-min), each with its full thickness. "
             "Vermillion "
             "outlines: sand-sand windows between different sands. Grey: the slipped interval "
             "leaves the log.", fontsize=8)
    draw_footer(fig, result)
    return [fig]
