"""The layers stage of one well: gaps filled, the Vsh curve blocked with rock-class and
unusable-interval boundaries forced, then each layer named (clay-volume class, rock class
or ``no data``) and marked reservoir or not.  The functions of
:mod:`logprep.layers.blocking` and :mod:`logprep.layers.rockclass` in order."""

from __future__ import annotations

from dataclasses import dataclass, replace

import numpy as np

from logprep.layers.blocking import block_with_boundaries, fill_gaps
from logprep.layers.rockclass import NO_DATA, assign_rock, class_boundaries_m, layer_shares, sample_classes
from logprep.layers.settings import LayerSettings
from logprep.model import ROCK_CLASSES, Layers


@dataclass(frozen=True)
class Column:
    """The blocked column of one well: ``layers`` (as ``layers.csv``), the Vsh with gaps
    filled (``vsh``), which samples were interpolated (``filled``) and notes."""

    layers: Layers
    vsh: np.ndarray
    filled: np.ndarray
    notes: tuple[str, ...]


def blocked_column(depth_m, vsh_raw, settings: LayerSettings = LayerSettings(), *,
                   forced_m=(), rock=None, unusable=None, flagged=None) -> Column:
    """Block one well.

    Parameters
    ----------
    depth_m, vsh_raw : array_like
        Samples of the screened interval; ``vsh_raw`` NaN where missing (filled here).
    settings : LayerSettings
    forced_m : sequence of float
        Boundaries to force (formation tops).
    rock : array_like of str, optional
        Rock class per sample (``""`` for the sand/shale family).
    unusable : dict of bool arrays, optional
        Unusable-sample masks by reason (:func:`logprep.clay.holecheck.unusable_flags`).
    flagged : array_like of bool, optional
        Samples with a QC flag; with the unusable ones, their share per layer is the
        layer's ``flagged_fraction``.
    """
    depth = np.asarray(depth_m, dtype=float)
    vsh, filled = fill_gaps(depth, vsh_raw, extend_ends=True)
    ends = ~np.isfinite(vsh)
    if ends.any() and (~ends).any():  # leading/trailing replaced samples: nearest value
        ok = np.flatnonzero(~ends)
        vsh = vsh.copy()
        vsh[: ok[0]] = vsh[ok[0]]
        vsh[ok[-1] + 1:] = vsh[ok[-1]]
        filled = filled | ends
    notes = []
    n = depth.size
    rock = np.full(n, "", dtype=object) if rock is None else np.asarray(rock, dtype=object)
    bad = np.zeros(n, dtype=bool)
    for mask in (unusable or {}).values():
        bad |= np.asarray(mask, dtype=bool)
    cls = sample_classes(rock, bad)
    forced = np.concatenate([np.asarray(forced_m, dtype=float).ravel(),
                             class_boundaries_m(depth, cls, settings.min_bed_m)])
    layers = block_with_boundaries(settings.blocking, depth, vsh, forced, filled=filled,
                                   **settings.blocking_kwargs())
    lith, bad_share = assign_rock(layers.lithology, depth, rock, bad, layers.top_m, layers.base_m,
                                  ROCK_CLASSES, max_unusable=settings.max_unusable)
    marked = bad if flagged is None else bad | np.asarray(flagged, dtype=bool)
    share = layer_shares(depth, np.where(marked, NO_DATA, ""), layers.top_m, layers.base_m, [NO_DATA])
    layers = replace(layers, lithology=lith,
                     reservoir=np.array([x in settings.reservoir_classes for x in lith], dtype=bool),
                     unusable_fraction=bad_share, flagged_fraction=share[NO_DATA])
    counts = {c: sum(x == c for x in lith) for c in (*ROCK_CLASSES, "no data")}
    named = [f"{v} {k}" for k, v in counts.items() if v]
    if named:
        notes.append("layers named from the rock logs and hole checks: " + ", ".join(named)
                     + " (not reservoir unless listed in --reservoir)")
    return Column(layers=layers, vsh=vsh, filled=filled, notes=tuple(notes))
