"""The small frozen data model shared by every stage.

Depths are metres, positive down, measured as in the file (MD unless the file says
otherwise); feet become metres once, in :mod:`logprep.io.las`.  Arrays stored on these
objects are made read-only so a stage cannot change another stage's input by accident.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from types import MappingProxyType
from collections.abc import Mapping

import numpy as np
import pandas as pd

LITHOLOGIES = ("sand", "heterolith", "shale")
"""Clay-volume layer classes, from clean to clay-rich (the juxtaposition roles)."""

ROCK_CLASSES = ("limestone", "dolomite", "coal", "anhydrite", "halite", "tuff")
"""Rock classes recognised beyond sand and shale (see :mod:`logprep.clay.lithology`)."""

NO_DATA = "no data"
"""Layer class of an interval whose logs cannot tell the rock (see
:mod:`logprep.clay.holecheck`)."""

LAYER_CLASSES = LITHOLOGIES + ROCK_CLASSES + (NO_DATA,)
"""Every name a layer's ``lithology`` may take; the index is the ``class_code``."""


def _frozen(a) -> np.ndarray:
    """A read-only float array of ``a``: a copy, unless ``a`` is already a read-only
    float64 array that owns its memory (a reader's own column, or an array of another
    frozen object), which nothing else can change, so it is shared instead of copied."""
    if isinstance(a, np.ndarray) and a.dtype == np.float64 and a.base is None \
            and not a.flags.writeable:
        return a
    arr = np.array(a, dtype=float, copy=True)
    arr.setflags(write=False)
    return arr


@dataclass(frozen=True)
class WellLog:
    """One well's logs as read, with provenance.

    Attributes
    ----------
    name : str
        Well name from the LAS ``WELL`` header item (file stem when blank).
    source : str
        Path of the file as given.
    sha256 : str
        Hex digest of the file bytes.
    depth_m : ndarray
        Depth index in metres, strictly increasing.
    curves : mapping of str to ndarray
        Every curve except the index, by mnemonic as read, NaN where missing.
    units : mapping of str to str
        Curve units as read (before any conversion), by mnemonic.
    depth_unit : str
        Unit of the depth index as read (``M``, ``FT``, ...).
    gr_mnemonic : str
        The curve used as gamma ray.
    header : mapping of str to str
        ``~Well`` and ``~Parameter`` items (mnemonic -> value as text).
    header_units : mapping of str to str
        Units of those header items as read (``EKB`` in ``M`` or ``FT``, ...).
    warnings : tuple of str
        What the reader changed or doubts (encoding guessed, readings set missing, too
        few samples, a clipped GR...), shown in ``qc.csv``, on the sheet and in
        ``summary.csv``.
    """

    name: str
    source: str
    sha256: str
    depth_m: np.ndarray
    curves: Mapping[str, np.ndarray]
    units: Mapping[str, str]
    depth_unit: str
    gr_mnemonic: str
    header: Mapping[str, str] = field(default_factory=dict)
    header_units: Mapping[str, str] = field(default_factory=dict)
    warnings: tuple[str, ...] = ()

    def __post_init__(self) -> None:
        object.__setattr__(self, "depth_m", _frozen(self.depth_m))
        object.__setattr__(
            self, "curves", MappingProxyType({k: _frozen(v) for k, v in self.curves.items()})
        )
        object.__setattr__(self, "units", MappingProxyType(dict(self.units)))
        object.__setattr__(self, "header", MappingProxyType(dict(self.header)))
        object.__setattr__(self, "header_units", MappingProxyType(dict(self.header_units)))

    @property
    def gr_api(self) -> np.ndarray:
        """The gamma-ray curve (API units as read)."""
        return self.curves[self.gr_mnemonic]


@dataclass(frozen=True)
class Layers:
    """A blocked stratigraphic column: contiguous layers, top down.

    ``top_m[i+1] == base_m[i]``; ``vsh`` is the thickness-weighted mean clay volume of each
    layer (fraction 0-1); ``lithology`` holds names from :data:`LITHOLOGIES`.
    ``filled_fraction`` is the share of each layer's thickness whose Vsh was interpolated
    across missing samples (0 where every sample was measured).  ``net_to_gross`` is the
    share of each layer's thickness in samples classed sand by the cut-offs (NaN where the
    blocking method did not record it).  ``lithology`` may also hold a rock class or
    ``no data`` (:data:`LAYER_CLASSES`).  ``reservoir`` says which layers count as
    reservoir (default: the ``sand`` layers); ``unusable_fraction`` and
    ``flagged_fraction`` are the shares of each layer's samples that are unusable (bad
    hole, long gap, top hole, QC) and that carry any flag at all.
    """

    top_m: np.ndarray
    base_m: np.ndarray
    vsh: np.ndarray
    lithology: tuple[str, ...]
    filled_fraction: np.ndarray | None = None
    net_to_gross: np.ndarray | None = None
    reservoir: np.ndarray | None = None
    unusable_fraction: np.ndarray | None = None
    flagged_fraction: np.ndarray | None = None

    def __post_init__(self) -> None:
        object.__setattr__(self, "top_m", _frozen(self.top_m))
        object.__setattr__(self, "base_m", _frozen(self.base_m))
        object.__setattr__(self, "vsh", _frozen(self.vsh))
        object.__setattr__(self, "lithology", tuple(self.lithology))
        ff = np.zeros(len(self.top_m)) if self.filled_fraction is None else self.filled_fraction
        object.__setattr__(self, "filled_fraction", _frozen(ff))
        ntg = np.full(len(self.top_m), np.nan) if self.net_to_gross is None else self.net_to_gross
        object.__setattr__(self, "net_to_gross", _frozen(ntg))
        n = len(self.top_m)
        res = (np.array([x == "sand" for x in self.lithology], dtype=bool)
               if self.reservoir is None else np.array(self.reservoir, dtype=bool, copy=True))
        res.setflags(write=False)
        object.__setattr__(self, "reservoir", res)
        for name in ("unusable_fraction", "flagged_fraction"):
            v = getattr(self, name)
            object.__setattr__(self, name, _frozen(np.zeros(n) if v is None else v))
        if not (len(self.base_m) == len(self.vsh) == len(self.lithology) == n
                == len(self.filled_fraction) == len(self.net_to_gross) == len(self.reservoir)
                == len(self.unusable_fraction) == len(self.flagged_fraction)):
            raise ValueError("Layers: arrays must have one entry per layer")
        bad = set(self.lithology) - set(LAYER_CLASSES)
        if bad:
            raise ValueError(f"Layers: unknown lithology {sorted(bad)}; use {LAYER_CLASSES}")

    def __len__(self) -> int:
        return len(self.top_m)

    @property
    def thickness_m(self) -> np.ndarray:
        return self.base_m - self.top_m

    @property
    def lithology_code(self) -> np.ndarray:
        """Juxtaposition role as integers, an index into :data:`LITHOLOGIES`: 0 for a
        reservoir layer, 1 for heterolith and ``no data`` (unknown), 2 for shale and the
        non-reservoir rock classes (limestone, coal, ... : not sand, so not a leak path)."""
        code = np.array([LITHOLOGIES.index(x) if x in LITHOLOGIES else (1 if x == NO_DATA else 2)
                         for x in self.lithology], dtype=np.int8)
        code[(code == 0) & ~self.reservoir] = 1  # a sand not counted as reservoir
        code[self.reservoir] = 0
        return code

    @property
    def class_code(self) -> np.ndarray:
        """Lithology as integers: index into :data:`LAYER_CLASSES`."""
        return np.array([LAYER_CLASSES.index(x) for x in self.lithology], dtype=np.int8)

    def to_frame(self) -> pd.DataFrame:
        """The ``layers.csv`` table."""
        return pd.DataFrame(
            {
                "top_m": self.top_m,
                "base_m": self.base_m,
                "thickness_m": self.thickness_m,
                "vsh": self.vsh,
                "lithology": list(self.lithology),
                "filled_fraction": self.filled_fraction,
                "net_to_gross": self.net_to_gross,
                "reservoir": self.reservoir,
                "unusable_fraction": self.unusable_fraction,
                "flagged_fraction": self.flagged_fraction,
            }
        )
