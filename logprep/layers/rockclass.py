"""Rock classes and unusable intervals on the blocked column.

The clay-volume blocking gives each layer ``sand``, ``heterolith`` or ``shale``.  Here
the per-sample rock classes (:func:`logprep.clay.lithology.classify_rock`) and unusable
samples (:mod:`logprep.clay.holecheck`) act on it in two steps:

1. :func:`class_boundaries_m`: depths where a run of one rock class (or of unusable
   samples) at least a minimum bed thick starts or ends.  The blocking is forced to put a
   layer boundary there, so a limestone streak is not averaged into the sand around it.
2. :func:`assign_rock`: a layer whose unusable share exceeds ``max_unusable`` becomes
   ``no data``; else a layer whose samples are mostly (> half) one rock class takes that
   class; else it keeps its clay-volume class.

Pure numpy: arrays in, arrays out.
"""

from __future__ import annotations

import numpy as np

from logprep.model import NO_DATA

__all__ = ["NO_DATA", "assign_rock", "class_boundaries_m", "layer_shares", "sample_classes"]


def _runs(values) -> list[tuple[int, int, object]]:
    """``(start, stop, value)`` runs of equal values."""
    v = np.asarray(values, dtype=object)
    if v.size == 0:
        return []
    change = np.flatnonzero(v[1:] != v[:-1]) + 1
    starts = np.concatenate(([0], change))
    stops = np.concatenate((change, [v.size]))
    return [(int(a), int(b), v[a]) for a, b in zip(starts, stops)]


def sample_classes(rock, unusable) -> np.ndarray:
    """One name per sample: ``no data`` where unusable, else the rock class (``""`` for
    the sand/shale family)."""
    r = np.asarray(rock, dtype=object).copy()
    r[np.asarray(unusable, dtype=bool)] = NO_DATA
    return r


def class_boundaries_m(depth_m, classes, min_bed_m: float) -> np.ndarray:
    """Depths (m, sample edges) where a run of a non-empty class at least ``min_bed_m``
    thick starts or ends."""
    depth = np.asarray(depth_m, dtype=float)
    if depth.size < 2:
        return np.array([])
    step = float(np.median(np.diff(depth)))
    edges = np.concatenate(([depth[0] - step / 2], 0.5 * (depth[1:] + depth[:-1]),
                            [depth[-1] + step / 2]))
    out = []
    for a, b, v in _runs(classes):
        if v != "" and edges[b] - edges[a] >= min_bed_m:
            out += [edges[a], edges[b]]
    return np.unique(np.asarray(out, dtype=float))


def layer_shares(depth_m, classes, top_m, base_m, names) -> dict[str, np.ndarray]:
    """Share of each layer's samples in each of ``names``."""
    depth = np.asarray(depth_m, dtype=float)
    c = np.asarray(classes, dtype=object)
    top, base = np.asarray(top_m, dtype=float), np.asarray(base_m, dtype=float)
    k = np.searchsorted(top, depth, side="right") - 1
    inside = (k >= 0) & (depth < base[np.clip(k, 0, None)])
    n = np.bincount(k[inside], minlength=top.size).astype(float)
    out = {}
    for name in names:
        hit = np.bincount(k[inside & (c == name)], minlength=top.size).astype(float)
        out[name] = np.divide(hit, n, out=np.zeros(top.size), where=n > 0)
    return out


def assign_rock(vsh_class, depth_m, rock, unusable, top_m, base_m, rock_names, *,
                max_unusable: float = 0.5) -> tuple[tuple[str, ...], np.ndarray]:
    """``(lithology, unusable_fraction)`` per layer (see the module notes).

    Parameters
    ----------
    vsh_class : sequence of str
        The clay-volume class of each layer.
    depth_m, rock, unusable : array_like
        Samples: depth (m), rock class name (``""`` for none) and the unusable mask.
    top_m, base_m : array_like
        The layers.
    rock_names : sequence of str
        The rock classes that may name a layer.
    max_unusable : float
        A layer with a larger unusable share is ``no data``.
    """
    names = list(rock_names)
    unusable = np.asarray(unusable, dtype=bool)
    rock = np.where(unusable, "", np.asarray(rock, dtype=object))
    shares = layer_shares(depth_m, rock, top_m, base_m, names)
    bad = layer_shares(depth_m, np.where(unusable, NO_DATA, ""), top_m, base_m, [NO_DATA])[NO_DATA]
    out = []
    for i, v in enumerate(vsh_class):
        if bad[i] > max_unusable:
            out.append(NO_DATA)
            continue
        best = max(names, key=lambda n: shares[n][i]) if names else None
        out.append(best if best is not None and shares[best][i] > 0.5 else str(v))
    return tuple(out), bad
