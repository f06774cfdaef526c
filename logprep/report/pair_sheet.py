"""The two-well sheet of a well pair across a fault: the columns and the two-well triangle
diagram with the tie marked on both columns, the window table with verdicts, and the
seal-capacity page, each with the pair's provenance and the caution at its foot.
Builds Figures only; :mod:`logprep.run.pairs` writes them."""

from __future__ import annotations

from dataclasses import dataclass
from types import SimpleNamespace

import pandas as pd
from matplotlib.figure import Figure
from matplotlib.patches import Patch

from logprep.fault.pair_capacity import footwall_frame, pair_clay_layers, pair_window_columns_m
from logprep.report.draw import (
    LITHOLOGY_COLOURS, PAGE_SIZE_IN, ROWS_PAGE1, caution_box, draw_field, draw_sgr_colourbar,
    draw_window_table, riskiest_windows, window_rows,
)
from logprep.report.layout import wrap_to_width
from logprep.report.page_capacity import seal_capacity_page

TIE_INK = "#000000"  # black, dash-dot: the tie horizon (no rock class or contour uses this ink and dash)


@dataclass(frozen=True)
class PairScreening:
    """What the pair sheet draws: both wells' screenings (``fw``, ``hw``), the tie
    ``shift_m`` (hanging-wall minus footwall depth of the tie horizon), its ``marker`` name
    ("" for a datum shift), the pair windows (with seal-capacity columns) and field."""

    fw: object
    hw: object
    shift_m: float
    marker: str
    windows: pd.DataFrame
    grid: object
    settings: object
    closure_note: str = ""

    @property
    def title(self) -> str:
        return f"Two-well screening: {self.fw.well.name} (footwall) / {self.hw.well.name} (hanging wall)"


def pair_footer(fig, pair: PairScreening) -> None:
    """Provenance of both wells and the tie, wrapped to the page, and the caution."""
    fw, hw = pair.fw.well, pair.hw.well
    tie = f"tie on top {pair.marker!r}" if pair.marker else "tie by a datum shift"
    text = (f"Footwall {fw.source} (sha256 {fw.sha256[:12]}...); hanging wall {hw.source} (sha256 "
            f"{hw.sha256[:12]}...); {tie}: hanging-wall depth = footwall depth - throw + "
            f"{pair.shift_m:.2f} m; slipped interval from the {pair.settings.field.pair_slip_source}; "
            "settings as for the single wells (logprep-settings.toml)"
            + (f"; {pair.closure_note}." if pair.closure_note else "."))
    fig.text(0.015, 0.058, wrap_to_width(text, 0.95 * fig.get_figwidth() * 72, 7), fontsize=7,
             va="bottom", family="monospace", parse_math=False)
    caution_box(fig)


def pair_columns_page(pair: PairScreening) -> Figure:
    """Page 1: both blocked columns on the footwall's depth frame (the hanging wall at zero
    throw), the tie horizon on both, and the two-well triangle diagram."""
    fw, hw, shift, s = pair.fw, pair.hw, pair.shift_m, pair.settings
    fig = Figure(figsize=PAGE_SIZE_IN)
    fig.text(0.015, 0.975, pair.title, ha="left", va="top", fontsize=14, fontweight="bold",
             parse_math=False)
    gs = fig.add_gridspec(1, 3, left=0.05, right=0.985, top=0.88, bottom=0.17,
                          width_ratios=[0.55, 0.55, 5.0], wspace=0.06)
    ax_f = fig.add_subplot(gs[0])
    ax_h = fig.add_subplot(gs[1], sharey=ax_f)
    ax_t = fig.add_subplot(gs[2], sharey=ax_f)
    for ax, L, dz, label in ((ax_f, fw.layers, 0.0, "footwall\nlayers"),
                             (ax_h, hw.layers, -shift, "hanging wall\nat zero throw")):
        for top, base, lith in zip(L.top_m, L.base_m, L.lithology):
            ax.axhspan(top + dz, base + dz, color=LITHOLOGY_COLOURS[lith], lw=0)
        ax.set_xticks([])
        ax.set_xlabel(label, fontsize=8)
    ax_h.tick_params(labelleft=False)
    ax_f.set_ylabel(f"Footwall depth (m, {fw.depth_reference})")
    numbers = riskiest_windows(pair, ROWS_PAGE1)
    im = draw_field(ax_t, pair.grid, threshold_pct=s.capacity.sgr_threshold_pct,
                    throw_max_m=s.field.throw_max_m, windows=pair.windows, labelled=numbers,
                    hw_shift_m=shift)
    # the tie horizon: the marker in the footwall well, and in the hanging-wall well shifted
    # to zero throw (the same level), drawn across both columns
    tie_fw = tie_depth(fw.tops, pair.marker)
    if tie_fw is not None:
        for ax in (ax_f, ax_h):
            ax.axhline(tie_fw, color=TIE_INK, lw=2.2, ls="-.")
        ax_t.plot([0.0, s.field.throw_max_m], [tie_fw, tie_fw + s.field.throw_max_m], color=TIE_INK,
                  lw=1.4, ls="-.")
    draw_sgr_colourbar(ax_t, im)
    ax_t.tick_params(labelleft=False)
    ax_t.set_xlabel("Throw of the tie horizon (m); normal fault, hanging wall down")
    ax_t.text(0.0, 1.012, f"Two-well triangle diagram: SGR ({pair.grid.source}),\nsand-sand windows "
              "outlined, the lowest-SGR ones numbered (table overleaf)", transform=ax_t.transAxes,
              fontsize=7.5, ha="left", va="bottom")
    handles = [Patch(facecolor=c, edgecolor="#666666", label=n) for n, c in LITHOLOGY_COLOURS.items()]
    if tie_fw is not None:
        from matplotlib.lines import Line2D

        handles.append(Line2D([], [], color=TIE_INK, lw=2.2, ls="-.", label=f"tie: {pair.marker}"))
    ax_t.legend(handles=handles, loc="lower left", fontsize=7, framealpha=0.9)
    pair_footer(fig, pair)
    return fig


def tie_depth(tops, marker: str) -> float | None:
    """Depth (m) of the tie marker in a well's tops, or None (no marker or not found)."""
    if not marker or tops is None or not len(tops):
        return None
    hit = tops[tops["name"].astype(str).str.strip().str.lower() == marker.strip().lower()]
    return float(hit["top_m"].iloc[0]) if len(hit) else None


def pair_table_page(pair: PairScreening) -> Figure:
    """The pair windows with verdicts, lowest SGR first, in blocks across the page."""
    s = pair.settings
    w = pair.windows
    order = [int(i) + 1 for i in w.sort_values("sgr_min_pct", kind="stable").index]
    rows = window_rows(w, order, s.capacity.sgr_threshold_pct, s.capacity.length_unit,
                       tops=pair.fw.tops, hw_tops=pair.hw.tops)
    fig = Figure(figsize=PAGE_SIZE_IN)
    fig.text(0.015, 0.975, f"{pair.title}: windows, lowest SGR first", ha="left", va="top",
             fontsize=13, fontweight="bold", parse_math=False)
    ax = fig.add_axes([0.015, 0.13, 0.97, 0.79])
    left = draw_window_table(ax, rows, "", blocks=0, fontsize=6.5)
    counts = w["verdict"].value_counts() if "verdict" in w else {}
    note = (f"{len(rows) - len(left)} of {len(rows)} windows (numbers as in the pair's juxtapositions.csv, "
            "which holds them all); hanging-wall depths in the hanging-wall well's own depths; verdicts: "
            + ", ".join(f"{counts.get(v, 0)} {v}" for v in ("leak", "uncertain", "seal"))
            + f" (leak below SGR {s.capacity.sgr_leak_pct:g} %, seal from {s.capacity.sgr_threshold_pct:g} %)")
    fig.text(0.015, 0.935, note, fontsize=8.5, parse_math=False)
    pair_footer(fig, pair)
    return fig


def pair_capacity_page(pair: PairScreening) -> Figure:
    """The seal-capacity page of the pair: the one-well page drawn with the pair's columns."""
    s = pair.settings
    as_result = SimpleNamespace(settings=s, well=SimpleNamespace(name=pair.title.split(": ", 1)[1]),
                                windows=pair.windows.apply(
                                    lambda r: footwall_frame(r, pair.shift_m), axis=1)
                                if len(pair.windows) else pair.windows)

    fw_clay, hw_clay = pair_clay_layers(pair.fw.layers, pair.hw.layers, s.field)

    def columns(w, c, drho, t):
        return pair_window_columns_m(fw_clay, hw_clay, pair.shift_m, w, c, [drho], t,
                                     s.field.pair_slip_source, s.capacity.envelope_sgr_scale_pct)[0]

    return seal_capacity_page(as_result, columns_fn=columns, footer=lambda f: pair_footer(f, pair))[0]


def build_pair_sheet(pair: PairScreening) -> list[Figure]:
    """Every page of the two-well sheet."""
    return [pair_columns_page(pair), pair_table_page(pair), pair_capacity_page(pair)]
