"""Drawing the rock classes and ``no data`` intervals: colours, hatching of unusable layers
on the layer track and of the SGR field that rests on them.  Object API only."""

from __future__ import annotations

import numpy as np
from matplotlib.patches import Patch

ROCK_COLOURS = {
    "limestone": "#56B4E9",   # sky blue
    "dolomite": "#009E73",    # bluish green
    "coal": "#3B2F2F",        # near-black brown
    "anhydrite": "#CC79A7",   # reddish purple
    "halite": "#D9D2E9",      # pale lilac
    "tuff": "#A6761D",        # ochre brown
    "no data": "#FFFFFF",     # white, hatched
}
"""Colours of the layer classes beyond sand / heterolith / shale (from the colour-blind
safe set of Okabe & Ito 2008 where it has enough hues)."""

NO_DATA_HATCH = "xxx"
NO_DATA_INK = "#7F7F7F"


def hatch_no_data_layers(ax, layers) -> None:
    """Hatch the ``no data`` layers of the layer track (already filled white)."""
    for top, base, lith in zip(layers.top_m, layers.base_m, layers.lithology):
        if lith == "no data":
            ax.axhspan(top, base, facecolor="none", edgecolor=NO_DATA_INK, hatch=NO_DATA_HATCH, lw=0)


def no_data_mask(layers, depth_m, throw_m) -> np.ndarray:
    """True on the (depth x throw) grid where the footwall point or the hanging-wall point
    facing it lies in a ``no data`` layer: the SGR there rests on unusable logs."""
    nd = np.array([x == "no data" for x in layers.lithology])
    z = np.asarray(depth_m, float)[:, None]
    t = np.asarray(throw_m, float)[None, :]

    def in_nd(d):
        k = np.searchsorted(layers.base_m, d, side="right")
        inside = (d >= layers.top_m[0]) & (k < len(layers))
        return inside & nd[np.clip(k, 0, len(layers) - 1)]

    return in_nd(z) | in_nd(z - t)


def hatch_no_data_field(ax, grid, layers, max_rows: int = 700) -> bool:
    """Hatch the part of a triangle diagram that rests on ``no data`` layers; returns
    whether anything was hatched."""
    if not any(x == "no data" for x in layers.lithology):
        return False
    step = max(1, int(np.ceil(grid.depth_m.size / max_rows)))
    depth, throw = grid.depth_m[::step], grid.throw_m
    mask = no_data_mask(layers, depth, throw)
    if not mask.any() or min(mask.shape) < 2:
        return False
    cf = ax.contourf(throw, depth, mask.astype(np.float32), levels=[0.5, 1.5], colors="none",
                     hatches=[NO_DATA_HATCH])
    cf.set_edgecolor(NO_DATA_INK)
    cf.set_linewidth(0)
    cf.set_rasterized(True)
    return True


def rock_legend_handles(layers) -> list[Patch]:
    """Legend entries for the rock classes present in ``layers``."""
    present = set(layers.lithology)
    out = []
    for name, colour in ROCK_COLOURS.items():
        if name in present:
            hatch = NO_DATA_HATCH if name == "no data" else None
            label = ("layer: no data (hatched)"
                     if name == "no data" else f"layer: {name}")
            out.append(Patch(facecolor=colour, edgecolor=NO_DATA_INK, hatch=hatch, label=label))
    return out
