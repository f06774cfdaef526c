"""Sensitivity of the screening to the blocking choices: sweep the sand and shale cut-offs
and the minimum bed thickness, and see where each window's verdict holds and where it flips.

>>> from logprep.run.tune import sweep_file                                    # doctest: +SKIP
>>> sw = sweep_file("A-1.las", sand_cutoffs=[0.25, 0.3, 0.35])              # doctest: +SKIP
>>> sw.table[["sand_cutoff", "sands", "windows_changed"]]                  # doctest: +SKIP

The clay volume curve is computed once; each setting only re-blocks it (the changepoint
search is also remembered per minimum bed) and recomputes the windows.

Verdict of a window: the sheet's words (:data:`logprep.fault.capacity.VERDICTS`) from its
lowest SGR, ``leak`` below ``sgr_leak_pct``, ``seal`` from ``sgr_threshold_pct`` up,
``uncertain`` between.  Windows are numbered as on the sheet and in ``juxtapositions.csv``
(``w24`` here is the sheet's ``#24``).  To follow a window of the reference setting through
other settings, its area of the triangle diagram (footwall depth x throw) is kept fixed and
asked, for each setting: what is the lowest SGR where a sand faces sand there (its verdict
word), or does no sand face sand there at all (``apart``)?  The SGR extremes over each
overlap are exact, as in :func:`logprep.fault.juxtaposition.sand_windows`.
"""

from __future__ import annotations

import itertools
from dataclasses import dataclass, replace
from pathlib import Path

import numpy as np
import pandas as pd

from logprep.errors import SettingsError
from logprep.fault.capacity import verdict
from logprep.fault.juxtaposition import _sgr_extremes, cumulative_clay, sand_windows
from logprep.io.descriptions import (
    descriptions_for_well, labels_at, labels_from_codes, read_descriptions,
)
from logprep.io.las import read_well
from logprep.layers.blocking import net_to_gross
from logprep.layers.rockscore import called_reservoir, rock_scores
from logprep.layers.stage import blocked_column
from logprep.model import Layers
from logprep.report.tune_figure import sweep_figure
from logprep.report.writers import (csv_bytes, pdf_bytes, plain_text, png_from_pdf,
                                     write_bytes_atomic)
from logprep.run.config import SETTINGS_FILE_NAME, settings_toml
from logprep.run.pipeline import WellScreening, qc_flagged, screen_well
from logprep.run.settings import ScreenSettings

DEFAULT_SAND_CUTOFFS = (0.20, 0.25, 0.30, 0.35, 0.40, 0.45, 0.50)
DEFAULT_SHALE_CUTOFFS = (0.50, 0.55, 0.60, 0.65, 0.70, 0.75, 0.80)
DEFAULT_MIN_BEDS_M = (0.5, 1.0, 2.0, 4.0)

VERDICTS = ("leak", "uncertain", "seal", "apart")
"""Words of a window in the sweep: the sheet's three verdicts, or ``apart`` (no sand faces
sand over the window's area at that setting)."""

SWEEP_COLUMNS = [
    "sand_cutoff", "shale_cutoff", "min_bed_m", "is_reference", "layers", "sands",
    "net_to_gross", "sand_sand_windows", "min_window_sgr_pct", "leak_windows",
    "verdicts_flipped", "new_leak_windows", "windows_changed",
]
"""Leading columns of the sweep table; with a rock reference :data:`ROCK_COLUMNS` follow,
then one ``w<k>`` verdict column per reference window."""

ROCK_COLUMNS = ["rock_precision", "rock_recall", "rock_balanced_accuracy", "best_rock_match"]
"""Scores of each setting's reservoir layers against described rock
(:mod:`logprep.layers.rockscore`); ``best_rock_match`` marks the settings with the highest
balanced accuracy."""

LABEL_CURVES = ("FORCE_2020_LITHOFACIES_LITHOLOGY",)
"""Lithology label curves used as the rock reference when a well carries one."""


def rock_reference(result: WellScreening, descriptions: str | Path | pd.DataFrame | None = None,
                   label_curve: str | None = None) -> np.ndarray | None:
    """Rock group per sample of ``result.depth_m`` from a core or cuttings description file
    (:func:`logprep.io.descriptions.read_descriptions`), else from a lithology label curve
    of the well (``label_curve`` or one of :data:`LABEL_CURVES`); None when neither exists."""
    well = result.well
    if descriptions is not None:
        desc = descriptions if isinstance(descriptions, pd.DataFrame) else read_descriptions(descriptions)
        mine = descriptions_for_well(desc, well.name, Path(well.source).stem)
        if len(mine) == 0:
            raise SettingsError(f"{descriptions}: no described interval for well {well.name}; "
                                "add rows for it (well column) or give --rock a file that describes it")
        return labels_at(result.depth_m, mine)
    names = [label_curve] if label_curve else [c for c in LABEL_CURVES if c in well.curves]
    for name in names:
        if name not in well.curves:
            raise SettingsError(f"{well.source}: no label curve {name!r}; found "
                                f"{', '.join(well.curves)}; name one of them with --label-curve or give --rock")
        i0 = int(np.searchsorted(well.depth_m, result.depth_m[0]))
        return labels_from_codes(well.curves[name][i0:i0 + result.depth_m.size])
    return None


MAX_SWEEP_VALUES = 200
"""Most values one sweep axis may take."""


def parse_values(text, name: str = "range") -> tuple[float, ...]:
    """Values from ``"a,b,c"``, ``"start:stop:step"`` (stop included when on the step), a
    number, or a list of numbers.

    >>> parse_values("0.2:0.3:0.05")
    (0.2, 0.25, 0.3)
    """
    form = (f"{name}: {text!r} is not 'a,b,c' or 'start:stop:step' with stop >= start, "
            "step > 0; write for example 0.2,0.3 or 0.2:0.4:0.05")
    if isinstance(text, (list, tuple)):
        vals = [float(x) for x in text]
    elif isinstance(text, (int, float)):
        vals = [float(text)]
    elif ":" in str(text):
        try:
            start, stop, step = (float(x) for x in str(text).split(":"))
        except ValueError:
            raise SettingsError(form) from None
        n = (stop - start) / step if step > 0 else float("nan")
        if not (np.isfinite([start, stop, step, n]).all() and n >= 0):
            raise SettingsError(form)
        if n > MAX_SWEEP_VALUES:
            raise SettingsError(f"{name}: {text!r} gives {int(n) + 1} values; use at most "
                                f"{MAX_SWEEP_VALUES} (a larger step)")
        vals = [round(start + i * step, 10) for i in range(int(np.floor(n + 1e-9)) + 1)]
    else:
        try:
            vals = [float(x) for x in str(text).split(",") if x.strip()]
        except ValueError:
            raise SettingsError(form) from None
    if not vals:
        raise SettingsError(f"{name}: no values given; give at least one number")
    if not np.isfinite(vals).all():
        raise SettingsError(f"{name}: {text!r} holds a value that is not a finite number; "
                            "give plain numbers")
    if len(vals) > MAX_SWEEP_VALUES:
        raise SettingsError(f"{name}: {len(vals)} values; use at most {MAX_SWEEP_VALUES}")
    return tuple(sorted(set(vals)))


@dataclass(frozen=True)
class Sweep:
    """Result of :func:`sweep_screening`.

    Attributes
    ----------
    reference : WellScreening
        The screening at the reference settings.
    table : DataFrame
        One row per setting (:data:`SWEEP_COLUMNS`, then one ``w<k>`` column per
        reference window, ``k`` its number on the sheet and in ``juxtapositions.csv``,
        holding its verdict word).  ``leak_windows`` counts windows with verdict ``leak``,
        as the sheet does.  ``verdicts_flipped`` counts reference windows that leak
        here but not at the reference, or the other way round (``apart`` counts as not
        leaking: no sand faces sand), plus ``new_leak_windows``: windows of this setting
        that leak where nothing leaks at the reference (a sand the reference does not
        have, for example); ``windows_changed`` counts any change of a reference window's
        verdict, ``apart`` included.
    windows : DataFrame
        The reference windows between different sands: ``window`` (the number on the
        sheet and in ``juxtapositions.csv``), footwall and
        hanging-wall sand tops and bases (m), ``sgr_min_pct``, ``verdict`` at the reference,
        ``flipped_fraction``, the share of settings where its leak / no-leak verdict
        differs, and ``changed_fraction``, where its verdict differs at all.
    ranges : dict
        The swept values: ``sand_sweep``, ``shale_sweep``, ``bed_sweep``.
    """

    reference: WellScreening
    table: pd.DataFrame
    windows: pd.DataFrame
    ranges: dict

    @property
    def settings(self) -> ScreenSettings:
        return self.reference.settings


def _window_arrays(w: pd.DataFrame) -> dict[str, np.ndarray]:
    return {k: w[k].to_numpy(float) for k in
            ("footwall_top_m", "footwall_base_m", "hangingwall_top_m", "hangingwall_base_m",
             "throw_max_m")} | {
        "fw": w["footwall_layer"].to_numpy(int), "hw": w["hangingwall_layer"].to_numpy(int)}


def window_verdicts(ref_windows: pd.DataFrame, layers: Layers, windows: pd.DataFrame,
                    sgr_threshold_pct: float, sgr_leak_pct: float | None = None) -> list[str]:
    """Verdict (:data:`VERDICTS`) over the area of each row of ``ref_windows`` under
    another blocking (``layers`` and its ``windows``, self-juxtaposed ones included):
    ``leak`` below ``sgr_leak_pct`` (the threshold itself when None: two words only),
    ``seal`` from ``sgr_threshold_pct``, ``uncertain`` between, ``apart`` where no sand
    faces sand.

    The overlap of two windows' areas is again a window-shaped area (footwall interval x
    hanging-wall interval x throws), inside which SGR of ``layers`` is linear-fractional;
    its exact minimum decides.
    """
    leak_pct = sgr_threshold_pct if sgr_leak_pct is None else sgr_leak_pct
    if len(ref_windows) == 0:
        return []
    if len(windows) == 0:
        return ["apart"] * len(ref_windows)
    r, c = _window_arrays(ref_windows), _window_arrays(windows)
    a = np.maximum(r["footwall_top_m"][:, None], c["footwall_top_m"][None, :])
    b = np.minimum(r["footwall_base_m"][:, None], c["footwall_base_m"][None, :])
    lo_h = np.maximum(r["hangingwall_top_m"][:, None], c["hangingwall_top_m"][None, :])
    hi_h = np.minimum(r["hangingwall_base_m"][:, None], c["hangingwall_base_m"][None, :])
    cap = np.minimum(r["throw_max_m"][:, None], c["throw_max_m"][None, :])
    t_lo = np.maximum(a - hi_h, 0.0)
    t_hi = np.minimum(b - lo_h, cap)
    overlap = (a < b) & (lo_h < hi_h) & (t_lo < t_hi)
    bounds, clay = cumulative_clay(layers)
    out = []
    for i in range(len(ref_windows)):
        js = np.flatnonzero(overlap[i])
        if js.size == 0:
            out.append("apart")
            continue
        lowest = np.inf
        for j in js:
            fi, hi = c["fw"][j], c["hw"][j]
            smin, _ = _sgr_extremes(
                a[i, j], b[i, j], lo_h[i, j], hi_h[i, j], layers.vsh[fi], layers.vsh[hi],
                float(np.interp(a[i, j], bounds, clay)), float(np.interp(lo_h[i, j], bounds, clay)),
                fi == hi, float(cap[i, j]),
            )
            lowest = min(lowest, smin)
            if lowest < leak_pct:
                break  # no lower word than leak
        out.append(str(verdict(lowest, leak_pct, sgr_threshold_pct)))
    return out


def _reference(result: WellScreening):
    """The reference windows of ``result``: ``(all rows, rows between different sands,
    their sheet numbers, their verdicts)``."""
    s = result.settings
    ref_all = result.windows.reset_index(drop=True)
    cross_rows = np.flatnonzero(~ref_all["self_juxtaposed"].to_numpy(bool))
    ref = ref_all.iloc[cross_rows].reset_index(drop=True)
    ref_verdict = [str(v) for v in verdict(ref["sgr_min_pct"].to_numpy(float),
                                           s.capacity.sgr_leak_pct, s.capacity.sgr_threshold_pct)]
    return ref_all, ref, [int(k) + 1 for k in cross_rows], ref_verdict


def verdict_changes(result: WellScreening, layers: Layers, windows: pd.DataFrame,
                    reference=None) -> tuple[dict, list[str]]:
    """How another blocking (``layers``, ``windows``) of ``result``'s clay volume changes
    ``result``'s verdicts: ``({"verdicts_flipped", "new_leak_windows", "windows_changed"},
    verdict of each reference window)`` (the sweep's columns; see the module notes)."""
    ref_all, ref, _, ref_verdict = reference or _reference(result)
    thr, leak = result.settings.capacity.sgr_threshold_pct, result.settings.capacity.sgr_leak_pct
    cross = windows[~windows["self_juxtaposed"]]
    verdicts = window_verdicts(ref, layers, windows, thr, leak)
    leaking = cross[cross["sgr_min_pct"] < leak]
    new_leaks = sum(v != "leak" for v in window_verdicts(leaking, result.layers, ref_all, thr, leak))
    flips = sum((v == "leak") != (r == "leak") for v, r in zip(verdicts, ref_verdict))
    return {"verdicts_flipped": flips + new_leaks, "new_leak_windows": new_leaks,
            "windows_changed": sum(v != r for v, r in zip(verdicts, ref_verdict))}, verdicts


def rock_match(result: WellScreening, layers: Layers, labels) -> dict:
    """Scores of the reservoir layers of ``layers`` against a rock group per sample of
    ``result.depth_m`` (:func:`rock_reference`): the sweep's ``rock_precision``,
    ``rock_recall`` and ``rock_balanced_accuracy`` (:func:`logprep.layers.rockscore.rock_scores`)."""
    sc = rock_scores(called_reservoir(result.depth_m, layers.top_m, layers.base_m,
                                      layers.reservoir), labels)
    return {"rock_precision": sc["precision"], "rock_recall": sc["recall"],
            "rock_balanced_accuracy": sc["balanced_accuracy"]}


def sweep_screening(
    result: WellScreening,
    sand_cutoffs=DEFAULT_SAND_CUTOFFS,
    shale_cutoffs=DEFAULT_SHALE_CUTOFFS,
    min_beds_m=DEFAULT_MIN_BEDS_M,
    reference_labels=None,
) -> Sweep:
    """Re-block the clay volume of ``result`` at every combination of cut-offs and minimum
    bed thickness (combinations with sand >= shale cut-off are skipped) and record, per
    setting, the layers, sands, net-to-gross (sand layers over gross), windows between
    different sands, their lowest SGR, how many leak, and the verdict of each reference
    window (``result``'s own windows; see the module notes).

    Every other setting (method, penalty, tops, throws, threshold) stays as in
    ``result.settings``, which is also the reference row.  With ``reference_labels`` (a
    rock group per sample of ``result.depth_m``, see :func:`rock_reference`) each row is
    also scored against the rock (:data:`ROCK_COLUMNS`): which settings agree with the
    described rock, beside how many verdicts flip.
    """
    s = result.settings
    sands, shales, beds = (parse_values(v, n) for v, n in (
        (sand_cutoffs, "sand cut-offs"), (shale_cutoffs, "shale cut-offs"),
        (min_beds_m, "minimum beds")))
    if min(beds) < 0 or min(sands) < 0 or max(shales) > 1:
        raise SettingsError("sweep: cut-offs must lie in 0-1 and minimum beds be >= 0 m; fix "
                            "--sand-sweep, --shale-sweep or --bed-sweep")
    forced = result.tops["top_m"].to_numpy(float) if s.layers.honour_tops and len(result.tops) else ()
    reference = _reference(result)
    ref, numbers, ref_verdict = reference[1], reference[2], reference[3]
    names = [f"w{k}" for k in numbers]

    combos = [(s.layers.sand_cutoff, s.layers.shale_cutoff, s.layers.min_bed_m)]
    combos += [c for c in itertools.product(sands, shales, beds) if c[0] < c[1]]
    if len(combos) == 1:
        raise SettingsError(
            f"sweep: no sand cut-off ({', '.join(f'{v:g}' for v in sands)}) is below a shale "
            f"cut-off ({', '.join(f'{v:g}' for v in shales)}); nothing to sweep")
    rows = []
    for k, (sand, shale, bed) in enumerate(combos):
        if k == 0:
            layers, windows = result.layers, result.windows
        else:
            lay = replace(s.layers, sand_cutoff=sand, shale_cutoff=shale, min_bed_m=bed)
            raw = np.where(result.filled, np.nan, result.vsh)
            layers = blocked_column(result.depth_m, raw, lay, forced_m=forced, rock=result.rock,
                                    unusable=result.unusable,
                                    flagged=qc_flagged(result.qc_flags)).layers
            windows = sand_windows(layers, s.field.throw_max_m)
        cross = windows[~windows["self_juxtaposed"]]
        changes, verdicts = verdict_changes(result, layers, windows, reference)
        row = {
            "sand_cutoff": sand, "shale_cutoff": shale, "min_bed_m": bed,
            "is_reference": k == 0, "layers": len(layers),
            "sands": int(np.sum(layers.reservoir)),
            "net_to_gross": net_to_gross(layers),
            "sand_sand_windows": len(cross),
            "min_window_sgr_pct": float(cross["sgr_min_pct"].min()) if len(cross) else np.nan,
            "leak_windows": int((cross["sgr_min_pct"] < s.capacity.sgr_leak_pct).sum()),
        } | changes
        if reference_labels is not None:
            row |= rock_match(result, layers, reference_labels)
        row.update(zip(names, verdicts))
        rows.append(row)
    rock_cols = ROCK_COLUMNS if reference_labels is not None else []
    table = pd.DataFrame(rows, columns=SWEEP_COLUMNS + rock_cols + names)
    if rock_cols:
        ba = table["rock_balanced_accuracy"]
        table["best_rock_match"] = ba.notna() & (ba >= ba.max() - 1e-9)
    got = table[names].to_numpy(dtype=object).reshape(len(table), len(names))
    want = np.array(ref_verdict, dtype=object)[None, :]
    changed = got != want
    flipped = (got == "leak") != (want == "leak")
    win = pd.DataFrame({
        "window": numbers,
        "footwall_top_m": ref["footwall_top_m"], "footwall_base_m": ref["footwall_base_m"],
        "hangingwall_top_m": ref["hangingwall_top_m"],
        "hangingwall_base_m": ref["hangingwall_base_m"],
        "sgr_min_pct": ref["sgr_min_pct"], "verdict": ref_verdict,
        "flipped_fraction": flipped.mean(axis=0),
        "changed_fraction": changed.mean(axis=0),
    })
    ranges = {"sand_sweep": list(sands), "shale_sweep": list(shales), "bed_sweep": list(beds)}
    return Sweep(reference=result, table=table, windows=win, ranges=ranges)


def sweep_file(path: str | Path, settings: ScreenSettings = ScreenSettings(), *,
               tops: pd.DataFrame | None = None, descriptions=None, label_curve=None,
               **ranges) -> Sweep:
    """Screen a LAS file at ``settings`` and sweep it (ranges as in
    :func:`sweep_screening`; rock reference as in :func:`sweep_well`)."""
    well = read_well(path, gr_curve=settings.input.gr_curve, depth_unit=settings.input.depth_unit)
    return sweep_well(well, settings, tops=tops, descriptions=descriptions,
                      label_curve=label_curve, **ranges)


def sweep_well(well, settings: ScreenSettings = ScreenSettings(), *, tops=None,
               descriptions=None, label_curve=None, **ranges) -> Sweep:
    """As :func:`sweep_file` for a :class:`~logprep.model.WellLog` already read.  The rock
    reference (:func:`rock_reference`) is used when ``descriptions`` is given or the well
    carries a label curve."""
    result = screen_well(well, settings, tops=tops)
    labels = rock_reference(result, descriptions, label_curve)
    return sweep_screening(result, reference_labels=labels, **ranges)


def stable_settings(sweep: Sweep) -> pd.DataFrame:
    """Rows of the sweep table where no verdict flips against the reference and none
    of the settings one step away on any axis flips either: the middle of a stable
    region, where a setting can be chosen with some margin."""
    t = sweep.table[~sweep.table["is_reference"]]
    axes = {k: sorted(t[k].unique()) for k in ("sand_cutoff", "shale_cutoff", "min_bed_m")}
    pos = {k: {v: i for i, v in enumerate(vals)} for k, vals in axes.items()}
    flips = {(pos["sand_cutoff"][r.sand_cutoff], pos["shale_cutoff"][r.shale_cutoff],
              pos["min_bed_m"][r.min_bed_m]): r.verdicts_flipped for r in t.itertuples()}
    keep = []
    for key, n in flips.items():
        near = [flips.get(tuple(k + d for k, d in zip(key, step)), 0)
                for step in itertools.product((-1, 0, 1), repeat=3)]
        keep.append(n == 0 and max(near) == 0)
    return t[keep].reset_index(drop=True)


def write_sweep(sweep: Sweep, out_dir: str | Path) -> dict[str, Path]:
    """Write ``tune.csv`` (the table), ``tune-windows.csv``, ``tune.pdf`` and ``tune.png``
    (the one-page figure) and ``logprep-settings.toml`` (the reference settings and the
    ranges) into ``out_dir``, each atomically.  Returns the paths by file name."""
    with plain_text():
        fig = sweep_figure(sweep, stable_settings(sweep))
        pdf = pdf_bytes([fig])
        png = png_from_pdf(pdf)
    files = {
        "tune.csv": csv_bytes(sweep.table),
        "tune-windows.csv": csv_bytes(sweep.windows),
        "tune.pdf": pdf,
        "tune.png": png,
        SETTINGS_FILE_NAME: settings_toml(sweep.settings, sweep.ranges).encode("utf-8"),
    }
    out = Path(out_dir)
    paths = {}
    for name, data in files.items():
        write_bytes_atomic(out / name, data)
        paths[name] = out / name
    return paths
