"""The shale gouge ratio field over footwall depth x throw (the triangle diagram).

SGR at footwall depth ``z`` and throw ``t`` is ``100 / t`` times the clay thickness in the
slipped interval ``[z - t, z]`` (Yielding, Freeman & Needham 1997).  With the cumulative
clay ``C(z) = integral of Vsh from the column top to z`` this is
``SGR = 100 (C(z) - C(z - t)) / t``: one cumulative sum and one difference per cell.

Two sources of ``C`` are offered (:data:`SGR_FIELD_SOURCES`):

``layers``
    the blocked column: ``C`` is linear within each layer with slope the layer's Vsh;
``curve``
    the continuous Vsh curve: each sample stands for its sample interval (midpoints between
    samples, :func:`logprep.layers.blocking.sample_edges_m`), so partial samples at the window
    edges count with the length inside the window; ``C`` is linear within each interval.

Both are piecewise-linear cumulative functions; :func:`sgr_field` evaluates them on a
uniform grid of "nodes" at the log's sample step.  ``C(z - t)`` for a whole throw column
is a shifted slice of the node values plus one constant-fraction linear interpolation, so
the field costs a few array passes per throw column, linear in the number of cells.  The
result is exact wherever the breakpoints of ``C`` lie on nodes (true for both sources on a
uniformly sampled log).  Where they do not (an uneven depth axis, such as the TVD of a
deviated well), node interpolation would blur every kink, worst in the ``t -> 0`` column,
so the field is then evaluated exactly, ``C`` interpolated at ``z - t`` per throw column
(:func:`logprep.fault.juxtaposition.sgr_from_cumulative_pct`), at a few times the cost.

Convention: normal fault, hanging wall down, ``t > 0``; a negative throw (reverse fault)
takes the slipped interval ``[z, z - t]`` below ``z`` and falls out of the same formula.
The field is NaN where the slipped interval leaves the logged column.

References
----------
1. Yielding, G., Freeman, B. and Needham, D.T. (1997). Quantitative fault seal prediction.
   AAPG Bulletin 81(6), 897-917.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from logprep.layers.blocking import sample_edges_m
from logprep.errors import SettingsError
from logprep.fault.fieldcodec import field_arrays, npz_bytes, read_field_arrays
from logprep.fault.juxtaposition import (
    JUXTAPOSITION_CLASSES, _PAIR_CODE, cumulative_clay, juxtaposition_grid, sgr_from_cumulative_pct,
)
from logprep.model import Layers

SGR_FIELD_SOURCES = {
    "layers": "cumulative clay of the blocked layers",
    "curve": "cumulative clay of the continuous Vsh curve (sample intervals)",
}
"""Where the SGR field takes its clay from (``ScreenSettings.sgr_field_source``)."""


def cumulative_clay_curve(depth_m, vsh) -> tuple[np.ndarray, np.ndarray]:
    """Sample-interval edges (m) and the clay thickness above each edge (m) of a Vsh curve.

    Each sample stands for the interval between the midpoints to its neighbours
    (:func:`logprep.layers.blocking.sample_edges_m`), so ``C`` is piecewise linear with slope the
    sample's Vsh, and the clay of any interval is a difference of two interpolations:
    samples cut by a window edge count with the length inside the window.
    """
    edges = sample_edges_m(depth_m)
    v = np.asarray(vsh, float)
    if np.isnan(v).any():
        raise SettingsError("Vsh curve has missing values; fill them before the SGR field")
    clay = np.concatenate(([0.0], np.cumsum(v * np.diff(edges))))
    return edges, clay


@dataclass(frozen=True)
class SgrField:
    """SGR and juxtaposition over footwall depth x throw for one well (or a well pair).

    Attributes
    ----------
    depth_m : ndarray, shape (nz,)
        Footwall depth of each row (metres, the well's depth axis: MD, or TVD with a survey).
    throw_m : ndarray, shape (nt,)
        Throw of each column (metres; positive: normal fault, hanging wall down).
    sgr_pct : ndarray of float32, shape (nz, nt)
        Shale gouge ratio (%), NaN where the slipped interval leaves the logged column.
    juxtaposition : ndarray of int8, shape (nz, nt)
        Class codes of :data:`logprep.fault.juxtaposition.JUXTAPOSITION_CLASSES` (0 outside).
    source : str
        Key of :data:`SGR_FIELD_SOURCES` (or a two-well description).
    extra : dict of str to ndarray
        Further fields on the same axes (the smear indicators ``ssf``, ``csp_m``).
    """

    depth_m: np.ndarray
    throw_m: np.ndarray
    sgr_pct: np.ndarray
    juxtaposition: np.ndarray
    source: str = "layers"
    extra: dict = field(default_factory=dict)

    def npz_bytes(self, smear: bool = False) -> bytes:
        """The ``sgr_field.npz`` file in the lean format of :mod:`logprep.fault.fieldcodec`
        (SGR in 0.1 % steps as int16, class codes int8); the smear fields of ``extra``
        only with ``smear=True``."""
        return npz_bytes(field_arrays(self.depth_m, self.throw_m, self.sgr_pct, self.juxtaposition,
                                      JUXTAPOSITION_CLASSES, self.source, self.extra, smear))

    @classmethod
    def from_npz(cls, path_or_bytes) -> SgrField:
        """An :class:`SgrField` read back from an ``sgr_field.npz`` (path or bytes)."""
        a = read_field_arrays(path_or_bytes)
        known = {"depth_m", "throw_m", "sgr_pct", "juxtaposition", "juxtaposition_codes",
                 "juxtaposition_names", "source"}
        return cls(a["depth_m"], a["throw_m"], a["sgr_pct"], a["juxtaposition"], str(a["source"]),
                   {k: v for k, v in a.items() if k not in known})


def node_step_m(depth_m) -> float:
    """The node step of the field: the median sample step of the log (m)."""
    d = np.diff(np.asarray(depth_m, float))
    if d.size == 0 or not np.median(d) > 0:
        raise SettingsError("the SGR field needs at least two increasing depth samples; "
                            "check the depth column")
    return float(np.median(d))


MAX_FIELD_CELLS = 50_000_000
"""Largest SGR field (depth rows x throws) computed: about 1 GB with the smear fields.
A field larger than this is almost always a step or a maximum throw given in the wrong
unit, so it is refused with a message instead of exhausting the memory."""


def throw_axis_m(throw_max_m: float, throw_step_m: float, throw_min_m: float = 0.0) -> np.ndarray:
    """Throws ``throw_min_m, ..., throw_max_m`` in steps of ``throw_step_m`` (the last step
    may be shorter so that ``throw_max_m`` is included)."""
    if not throw_step_m > 0:
        raise SettingsError(f"throw step must be > 0 m (got {throw_step_m:g}); give "
                            "--field-throw-step a step above 0 m")
    n = int(np.floor((throw_max_m - throw_min_m) / throw_step_m + 1e-9))
    t = throw_min_m + throw_step_m * np.arange(n + 1)
    if t[-1] < throw_max_m - 1e-9:
        t = np.append(t, throw_max_m)
    return t


SNAP_NODE_FRACTION = 1e-6
"""A throw this close to a whole number of node steps (as a fraction of one step, the same
tolerance as :func:`breaks_on_nodes`) is taken as on it."""


class _Nodes:
    """Uniform nodes ``x_k = top + k g`` over a column with ``pad`` NaN nodes either side."""

    def __init__(self, bounds_m, clay_m, g: float, throw_abs_max_m: float):
        bounds = np.asarray(bounds_m, float)
        self.top, self.base, self.g = float(bounds[0]), float(bounds[-1]), float(g)
        self.K = int(np.floor((self.base - self.top) / g + 1e-6))
        self.pad = int(np.ceil(throw_abs_max_m / g)) + 2
        x = self.top + g * np.arange(self.K + 1)
        self.E = np.full(self.K + 1 + 2 * self.pad, np.nan)
        self.E[self.pad:self.pad + self.K + 1] = np.interp(x, bounds, clay_m)
        self.dE = np.full_like(self.E, np.nan)  # dE[k] = E[k] - E[k-1]
        self.dE[1:] = np.diff(self.E)

    def shift(self, t: float) -> tuple[int, float]:
        """Throw as a whole number of nodes ``q`` plus a fraction ``f`` in [0, 1).

        A throw within :data:`SNAP_NODE_FRACTION` of a node of a whole number of nodes
        is snapped onto it: the node step is the median of the sampled depths' steps, and
        its rounding error grows with the number of steps (0.1 m sampling gives a step of
        0.09999999999990905 m, so 110 m is 1100.000000001 nodes)."""
        s = t / self.g
        q = int(np.floor(s))
        f = s - q
        if f < SNAP_NODE_FRACTION:
            f = 0.0
        elif f > 1 - SNAP_NODE_FRACTION:
            q, f = q + 1, 0.0
        return q, f


def breaks_on_nodes(bounds_m, top_m: float, g: float) -> bool:
    """True when every breakpoint lies on a node ``top + k g`` (within 1e-6 of a step)."""
    k = (np.asarray(bounds_m, float) - top_m) / g
    return bool(np.all(np.abs(k - np.round(k)) < 1e-6))


def sgr_field_pct(bounds_m, clay_m, g: float, throw_m, rows_every: int = 1,
                  dtype=np.float32) -> tuple[np.ndarray, np.ndarray]:
    """SGR (%) on rows ``top + i * rows_every * g`` x ``throw_m`` from a cumulative clay
    function (see the module notes for the method and its exactness).

    Parameters
    ----------
    bounds_m, clay_m : ndarray
        Breakpoints (m, increasing) and cumulative clay thickness (m) there.
    g : float
        Node step (m); the log's sample step.
    throw_m : ndarray
        Throws (m), any order, any sign.
    rows_every : int
        Row spacing in nodes (>= 1).
    dtype : numpy dtype
        Output type (float32 keeps 7 digits, ample for a percentage).

    Returns
    -------
    depth_m : ndarray, shape (nz,)
    sgr_pct : ndarray, shape (nz, nt), Fortran-ordered (each throw column contiguous).
    """
    throw = np.asarray(throw_m, float)
    m = max(1, int(rows_every))
    nodes = _Nodes(bounds_m, clay_m, g, float(np.abs(throw).max(initial=0.0)))
    P, E, dE = nodes.pad, nodes.E, nodes.dE
    rows = np.arange(0, nodes.K + 1, m)
    nz = rows.size
    span = (nz - 1) * m + 1
    depth = nodes.top + g * rows
    out = np.empty((throw.size, nz), dtype=dtype)
    if not breaks_on_nodes(bounds_m, nodes.top, g):
        # uneven depth axis (e.g. TVD of a deviated well): exact per throw column
        for j, t in enumerate(throw):
            out[j] = sgr_from_cumulative_pct(bounds_m, clay_m, depth, t)
        return depth, out.T
    Cz = E[P:P + span:m]
    buf = np.empty(nz)
    tmp = np.empty(nz)
    # slope just above each row (the first row takes the slope below): the t -> 0 limit
    above = dE[P:P + span:m].copy()
    above[0] = dE[P + 1]
    above *= 100.0 / g
    for j, t in enumerate(throw):
        row = out[j]
        if t == 0:
            row[:] = above
            continue
        q, f = nodes.shift(t)
        a = P - q
        # C(z - t) = E[i - q] - f * (E[i - q] - E[i - q - 1])
        np.subtract(Cz, E[a:a + span:m], out=buf)
        if f:
            np.multiply(dE[a:a + span:m], f, out=tmp)
            buf += tmp
        np.multiply(buf, 100.0 / t, out=row, casting="same_kind")
    return depth, out.T


def juxtaposition_field(layers: Layers, g: float, throw_m, rows_every: int = 1) -> np.ndarray:
    """Juxtaposition class codes on the same rows and throws as :func:`sgr_field_pct`.

    A depth on a layer boundary belongs to the layer below it (as
    :func:`logprep.fault.juxtaposition.layer_index`).  Returns int8, shape (nz, nt).
    """
    throw = np.asarray(throw_m, float)
    m = max(1, int(rows_every))
    bounds, clay = cumulative_clay(layers)
    nodes = _Nodes(bounds, clay, g, float(np.abs(throw).max(initial=0.0)))
    K, P = nodes.K, nodes.pad
    if not breaks_on_nodes(bounds, nodes.top, g):
        return juxtaposition_grid(layers, nodes.top + g * np.arange(0, K + 1, m), throw)
    mid = nodes.top + g * (np.arange(max(K, 1)) + 0.5)
    code = layers.lithology_code[np.clip(np.searchsorted(layers.base_m, mid, side="right"),
                                         0, len(layers) - 1)]
    padded = np.full(K + 2 * P + 1, -1, dtype=np.int16)
    padded[P:P + K] = code
    rows = np.arange(0, K + 1, m)
    fw = code[np.minimum(rows, K - 1)].astype(np.int16)
    lut = np.zeros((3, 4), dtype=np.int8)
    lut[:, 1:] = _PAIR_CODE  # column 0: hanging-wall point outside the column
    flat = lut.ravel()
    fw4 = fw * 4 + 1
    out = np.empty((throw.size, rows.size), dtype=np.int8)
    span = (rows.size - 1) * m + 1
    for j, t in enumerate(throw):
        q, f = nodes.shift(t)
        a = P - q - (1 if f else 0)
        np.take(flat, fw4 + padded[a:a + span:m], out=out[j])
        if not f and (K + q) % m == 0 and 0 <= (K + q) // m < rows.size:
            i = (K + q) // m  # hanging-wall point exactly on the base: the last layer
            out[j, i] = flat[fw4[i] + code[-1]]
    return out.T


def contact_polygon(f_top_m, f_base_m, h_top_m, h_base_m, throw_min_m, throw_max_m) -> np.ndarray:
    """Vertices ``(throw_m, depth_m)`` of the area of the triangle diagram where footwall
    bed ``[f_top, f_base]`` faces hanging-wall bed ``[h_top, h_base]`` (hanging-wall depths
    in the footwall's frame) for throws in ``[throw_min_m, throw_max_m]``: the
    parallelogram ``f_top <= z <= f_base, h_top <= z - t <= h_base`` clipped to the throw
    range.  Empty (shape (0, 2)) where they never touch."""
    a, b, c, e = map(float, (f_top_m, f_base_m, h_top_m, h_base_m))
    poly = [(a - e, a), (a - c, a), (b - c, b), (b - e, b)]
    for sign, bound in ((1.0, float(throw_min_m)), (-1.0, float(throw_max_m))):
        inside = [sign * (p[0] - bound) >= 0 for p in poly]
        clipped = []
        for k, p in enumerate(poly):
            q = poly[k - 1]
            if inside[k] != inside[k - 1]:
                w = (bound - q[0]) / (p[0] - q[0])
                clipped.append((bound, q[1] + w * (p[1] - q[1])))
            if inside[k]:
                clipped.append(p)
        poly = [p for k, p in enumerate(clipped) if k == 0 or p != clipped[k - 1]]
        if len(poly) > 1 and poly[0] == poly[-1]:
            poly.pop()
        if not poly:
            break
    return np.array(poly, float).reshape(-1, 2)


def layered_or_curve_clay(source: str, layers: Layers, depth_m, vsh):
    """``(bounds_m, clay_m)`` for a key of :data:`SGR_FIELD_SOURCES`."""
    if source == "layers":
        return cumulative_clay(layers)
    if source == "curve":
        return cumulative_clay_curve(depth_m, vsh)
    raise SettingsError(f"unknown SGR field source {source!r}; use one of {', '.join(SGR_FIELD_SOURCES)}")


def sgr_field(layers: Layers, depth_m, vsh, *, throw_max_m: float, throw_step_m: float,
              depth_step_m: float | None = None, source: str = "layers",
              throw_min_m: float = 0.0) -> SgrField:
    """The SGR and juxtaposition field of one well.

    Rows are every ``round(depth_step_m / g)`` nodes (at least one) from the top of the
    blocked column, where ``g`` is the log's sample step; ``depth_step_m=None`` takes every
    node.  Columns are :func:`throw_axis_m`.
    """
    g = node_step_m(depth_m)
    m = 1 if depth_step_m is None else max(1, int(round(depth_step_m / g)))
    throw = throw_axis_m(throw_max_m, throw_step_m, throw_min_m)
    rows = int((np.asarray(depth_m)[-1] - np.asarray(depth_m)[0]) / (m * g)) + 2
    if rows * throw.size > MAX_FIELD_CELLS:
        raise SettingsError(
            f"the SGR field would have {rows * throw.size / 1e6:.0f} million cells ({rows} depths "
            f"x {throw.size} throws, limit {MAX_FIELD_CELLS / 1e6:.0f} million); raise "
            "--field-throw-step or --field-depth-step, or lower --throw-max")
    bounds, clay = layered_or_curve_clay(source, layers, depth_m, vsh)
    # both sources share the column of the blocked layers (the sample edges)
    depth, sgr = sgr_field_pct(bounds, clay, g, throw, rows_every=m)
    jux = juxtaposition_field(layers, g, throw, rows_every=m)
    return SgrField(depth_m=depth, throw_m=throw, sgr_pct=sgr, juxtaposition=jux, source=source)
