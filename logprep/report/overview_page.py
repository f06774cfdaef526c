"""``overview.pdf``: the field overview as one printable A4 landscape page.

The map of the wells coloured by worst verdict on the left, the rows worst first on the
right (as many as fit; the rest are in ``overview.html`` and ``summary.csv``, and the page
says how many), failures with their message, and the caution.  A Figure only: written by
:func:`logprep.report.overview.write_overview`.
"""

from __future__ import annotations

import math

from matplotlib.figure import Figure

from logprep import __version__
from logprep.fault.capacity import VERDICTS
from logprep.report.caution import CAUTION
from logprep.io.locations import GEOGRAPHIC, map_xy
from logprep.report.overview import (
    WORST_ORDER,
    WORST_STYLE,
    OverviewRow,
    pair_colour,
    pair_ends,
)
from logprep.report.overview_html import place_labels

A4_LANDSCAPE_IN = (11.69, 8.27)
FONT_PT = 9.0
MONO_ADVANCE_EM = 1233 / 2048  # DejaVu Sans Mono advance width, ems
TABLE_HEAD = ("well / pair", "status", "worst", "layers", "sands", "leak", "uncert.", "seal",
              "low SGR %", "oil col m", "CO2 col m")
NAME_CHARS = 24
MAX_FAIL_LINES = 10
PITCH_EM = 1.2 * 1.17
"""Line pitch of multi-line text in ems: linespacing 1.2 times DejaVu's line height (about
1.17 em), kept safe so the estimate never falls short."""


def _cell(value, digits: int = 1) -> str:
    if value is None:
        return "-"
    if isinstance(value, int):
        return str(value)
    return f"{value:.{digits}f}"


def table_lines(rows: list[OverviewRow]) -> list[str]:
    """Fixed-width lines of the page's table (heading first)."""
    def fields(r: OverviewRow) -> list[str]:
        name = r.name if len(r.name) <= NAME_CHARS else r.name[: NAME_CHARS - 1] + "~"
        v = r.verdicts or {}
        return [name, r.status, r.worst, _cell(r.layers), _cell(r.sands),
                *(_cell(v.get(w)) if v else "-" for w in VERDICTS),
                _cell(r.min_sgr_pct), _cell(r.min_oil_column_m, 0), _cell(r.min_co2_column_m, 0)]

    body = [fields(r) for r in rows]
    widths = [max(len(h), *(len(b[i]) for b in body)) if body else len(h)
              for i, h in enumerate(TABLE_HEAD)]
    def fmt(f) -> str:
        return "  ".join(x.ljust(w) if i < 3 else x.rjust(w) for i, (x, w) in enumerate(zip(f, widths)))

    return [fmt(TABLE_HEAD)] + [fmt(b) for b in body]


def worst_first(rows: list[OverviewRow]) -> list[OverviewRow]:
    """Rows by worst verdict, then lowest window SGR, then name."""
    def key(r: OverviewRow):
        sgr = r.min_sgr_pct if r.min_sgr_pct is not None else math.inf
        return (WORST_ORDER.index(r.worst), sgr, r.name)
    return sorted(rows, key=key)


def draw_map(ax, rows: list[OverviewRow]) -> str:
    """Wells as markers by worst verdict with their names, pairs as dashed lines; returns
    a note on what is not drawn."""
    wells = [r for r in rows if r.kind == "well" and r.location is not None]
    ax.set_xticks([])
    ax.set_yticks([])
    if not wells:
        ax.text(0.5, 0.5, "no well locations in the LAS headers\nor a locations file",
                ha="center", va="center", fontsize=8, transform=ax.transAxes)
        return ""
    xy, kind, note = map_xy([r.location for r in wells])
    drawn = [(r, p) for r, p in zip(wells, xy) if p is not None]
    xs, ys = [p[0] for _, p in drawn], [p[1] for _, p in drawn]
    span = max(max(xs) - min(xs), max(ys) - min(ys)) or 1.0
    cx, cy = (max(xs) + min(xs)) / 2, (max(ys) + min(ys)) / 2
    ax.set_xlim(cx - 0.62 * span, cx + 0.62 * span)
    ax.set_ylim(cy - 0.62 * span, cy + 0.62 * span)
    ax.set_aspect("equal", adjustable="box", anchor="N")
    where = {id(r.location): p for r, p in drawn}
    ends = pair_ends(rows)
    for r in rows:
        a, b = ends.get(r.name, (None, None)) if r.kind == "pair" else (None, None)
        if id(a) in where and id(b) in where:
            (x1, y1), (x2, y2) = where[id(a)], where[id(b)]
            ax.plot([x1, x2], [y1, y2], color=pair_colour(r.worst), lw=2.2, ls=(0, (4, 2)),
                    zorder=1)
    for worst in WORST_ORDER:
        pts = [p for r, p in drawn if r.worst == worst]
        if pts:
            colour, marker = WORST_STYLE[worst]
            ax.scatter([p[0] for p in pts], [p[1] for p in pts], marker=marker, s=46,
                       c=colour, edgecolors="#222222" if marker != "x" else None,
                       linewidths=0.6 if marker != "x" else 1.8, zorder=3, label=worst)
    fig = ax.get_figure()
    ax.apply_aspect()
    box = ax.get_window_extent()
    box_pt = [v * 72.0 / fig.dpi for v in (box.x0, box.y0, box.x1, box.y1)]
    pts = [tuple(ax.transData.transform(p) * 72.0 / fig.dpi) for _, p in drawn]
    # place_labels works downwards (screen y); flip the point y to use it
    flipped = [(x, -y) for x, y in pts]
    anchors = place_labels(flipped, [r.name for r, _ in drawn], char_w=3.9, height=8.0,
                           box=(box_pt[0] + 2, -box_pt[3] + 2, box_pt[2] - 2, -box_pt[1] - 2))
    inv = ax.transData.inverted()
    for (r, _), anchor in zip(drawn, anchors):
        if anchor is None:
            continue
        ax_, ay_, ha = anchor
        x, y = inv.transform((ax_ * fig.dpi / 72.0, (-ay_ + 2.5) * fig.dpi / 72.0))
        ax.text(x, y, r.name, fontsize=6.5, ha={"start": "left", "end": "right"}.get(ha, "center"),
                va="baseline", parse_math=False, zorder=4)
    unit = "degrees, equirectangular" if kind == GEOGRAPHIC else "grid units as given"
    ax.set_xlabel(f"east ({unit})", fontsize=7)
    ax.set_ylabel("north", fontsize=7)
    ax.annotate("", xy=(0.985, 0.985), xytext=(0.985, 0.905), xycoords="axes fraction",
                arrowprops={"arrowstyle": "-|>", "lw": 0.8, "color": "#222222"})  # north arrow
    ax.text(0.97, 0.945, "N", transform=ax.transAxes, ha="right", va="center", fontsize=8)
    from matplotlib.lines import Line2D

    handles = [Line2D([], [], ls="none", marker=WORST_STYLE[w][1], color=WORST_STYLE[w][0],
                      markeredgecolor="#222222" if WORST_STYLE[w][1] != "x" else WORST_STYLE[w][0],
                      markersize=6, label=w) for w in WORST_ORDER]
    handles.append(Line2D([], [], color="#555555", lw=2.2, ls=(0, (4, 2)), label="well pair"))
    ax.legend(handles=handles, loc="upper left", bbox_to_anchor=(0.0, -0.07), ncol=4,
              fontsize=6.5, frameon=False, title="worst verdict", title_fontsize=7,
              alignment="left")
    return note


def overview_figure(rows: list[OverviewRow], verdict_rule: str = "") -> Figure:
    """The one-page overview Figure."""
    fig = Figure(figsize=A4_LANDSCAPE_IN)
    n_well = sum(r.kind == "well" for r in rows)
    failed = [r for r in rows if r.status != "ok"]
    fig.text(0.03, 0.955, f"Field overview: {n_well} well(s), {len(rows) - n_well} pair(s), "
             f"{len(failed)} failed", fontsize=13, fontweight="bold", parse_math=False)
    fig.text(0.03, 0.925, (verdict_rule + ".  " if verdict_rule else "") +
             f"logprep {__version__}; every row with its notes and links: overview.html",
             fontsize=7.5, color="#444444", parse_math=False)
    note = draw_map(fig.add_axes([0.03, 0.3, 0.33, 0.58]), rows)
    if note:
        fig.text(0.03, 0.13, note, fontsize=6.5, color="#444444", parse_math=False)

    left, top, bottom = 0.39, 0.89, 0.2
    fig_h_pt = fig.get_figheight() * 72
    height_pt = (top - bottom) * fig_h_pt
    width_pt = (0.985 - left) * fig.get_figwidth() * 72
    lines = table_lines(worst_first([r for r in rows if r.status == "ok"]))
    fail_lines = [f"{r.name}: {r.message}" for r in failed]
    n_fail = min(len(fail_lines), MAX_FAIL_LINES)
    fail_block = (n_fail + 1 + (len(fail_lines) > n_fail) + 1) if fail_lines else 0
    size = max(5.0, min(FONT_PT, width_pt / (max(map(len, lines)) * MONO_ADVANCE_EM),
                        height_pt / (PITCH_EM * (len(lines) + 1 + fail_block))))
    pitch_pt = PITCH_EM * size
    room = max(3, int(height_pt / pitch_pt) - 1 - fail_block)
    shown = lines[: room + 1]
    more = len(lines) - len(shown)
    text = "\n".join(shown) + (f"\n... {more} more row(s): see overview.html or summary.csv"
                               if more else "")
    fig.text(left, top, text, family="monospace", fontsize=size, va="top",
             linespacing=1.2, parse_math=False)
    if fail_lines:
        max_chars = int(width_pt / (size * MONO_ADVANCE_EM))
        cut = [f if len(f) <= max_chars else f[: max_chars - 1] + "~" for f in fail_lines[:n_fail]]
        if len(fail_lines) > n_fail:
            cut.append(f"... {len(fail_lines) - n_fail} more: see overview.html or summary.csv")
        y = top - (len(shown) + (1 if more else 0) + 1) * pitch_pt / fig_h_pt
        fig.text(left, y, f"Failed ({len(fail_lines)}):\n" + "\n".join(cut), family="monospace",
                 fontsize=size, va="top", color="#7A1F00", linespacing=1.2, parse_math=False)
    fig.text(0.03, 0.03, "CAUTION: " + CAUTION, fontsize=7.5, va="bottom", wrap=True,
             color="#7A1F00", parse_math=False,
             bbox={"facecolor": "#FFF4E5", "edgecolor": "#D55E00", "pad": 4})
    return fig
