"""The sand-sand window table of the sheet: rows as fixed-width text, in as many side-by-side
blocks as the width allows, so a long table fills the page instead of a narrow strip."""

from __future__ import annotations

import numpy as np

from logprep.report.layout import MONO_ADVANCE_EM

TABLE_HEAD = ["#", "footwall\nsand (m)", "hanging-wall\nsand (m)", "throw\nrange (m)",
              "SGR\nmin %", "SGR\nmax %", "oil\ncolumn", "verdict"]
FORMATION_HEAD = "formations\nfootwall / hw"
VERDICT_COLOURS = {"leak": "#F6C9A8", "uncertain": "#FBE8A6", "seal": "#CFE8F7", "self": "#E0AFCA"}
"""Cell shades of the verdict column: light tints of the Okabe & Ito (2008) colour-blind-safe
palette, vermilion (leak), yellow (uncertain), sky blue (seal) and reddish purple (``self``, a
sand against itself).  The ``self`` tint is the darkest in grey print (WCAG relative
luminance 0.51 against 0.64-0.81 for the others) and black text on it keeps a contrast
ratio of about 11:1 (WCAG 2.0 asks 7:1 for the highest level)."""
MIN_FONT_PT = 5.0

__all__ = ["FORMATION_HEAD", "MONO_ADVANCE_EM", "TABLE_HEAD", "VERDICT_COLOURS", "draw_verdict_key",
           "draw_window_table",
           "formation_at", "table_head", "window_rows"]


def formation_at(tops, depth_m, max_chars: int = 11):
    """Name of the formation a depth lies in: the deepest top at or above it (``""`` above
    the first top or without tops), shortened to ``max_chars``.  ``depth_m`` may be an
    array: a list of names is returned."""
    one = np.ndim(depth_m) == 0
    depth = np.atleast_1d(np.asarray(depth_m, float))
    if tops is None or not len(tops):
        names = [""] * depth.size
    else:
        t = tops.sort_values("top_m", kind="stable")
        top_m = t["top_m"].to_numpy(float)
        labels = [str(n).strip() for n in t["name"]]
        k = np.searchsorted(top_m, depth + 1e-6, side="right") - 1
        names = [labels[i] if i >= 0 else "" for i in k]
        names = [n if len(n) <= max_chars else n[: max_chars - 1] + "." for n in names]
    return names[0] if one else names


def table_head(with_formations: bool) -> list[str]:
    return TABLE_HEAD + ([FORMATION_HEAD] if with_formations else [])


def window_rows(windows, numbers, threshold_pct=None, length_unit: str = "m", tops=None,
                hw_tops=None) -> list[list[str]]:
    """Table rows (:func:`table_head`) for the windows with the given numbers (from 1, row
    order of ``juxtapositions.csv``).  The oil column height is in ``length_unit``; with
    ``tops``, the last field names the formations of the footwall and hanging-wall sands
    (``hw_tops`` for a pair's hanging-wall well; the same tops otherwise)."""
    per_m = 1.0 if length_unit == "m" else 1.0 / 0.3048
    with_tops = tops is not None and len(tops) > 0
    hw_tops = tops if hw_tops is None else hw_tops
    rows = []
    sub = windows.iloc[[k - 1 for k in numbers]]
    if with_tops:
        fw_names = formation_at(tops, ((sub["footwall_top_m"] + sub["footwall_base_m"]) / 2).to_numpy())
        hw_names = formation_at(hw_tops, ((sub["hangingwall_top_m"] + sub["hangingwall_base_m"]) / 2).to_numpy())
    for i, (k, w) in enumerate(zip(numbers, sub.itertuples(index=False))):
        col = getattr(w, "column_oil_m", np.nan) * per_m
        row = [str(k), f"{w.footwall_top_m:.1f}-{w.footwall_base_m:.1f}",
               f"{w.hangingwall_top_m:.1f}-{w.hangingwall_base_m:.1f}",
               f"{w.throw_min_m:.1f}-{w.throw_max_m:.1f}", f"{w.sgr_min_pct:.1f}",
               f"{w.sgr_max_pct:.1f}", f"{col:.0f} {length_unit}" if np.isfinite(col) else "",
               str(getattr(w, "verdict", ""))]
        if with_tops:
            row.append(f"{fw_names[i] or '-'} / {hw_names[i] or '-'}")
        rows.append(row)
    return rows


def table_layout(rows, head, width_pt: float, height_pt: float, fontsize: float, blocks: int = 0):
    """Font size, column widths (characters), blocks side by side and rows per block for
    ``rows`` in a box of ``width_pt`` x ``height_pt``.  ``blocks=0`` takes as many as fit
    at the given font size."""
    heads = [h.split("\n") for h in head]
    widths = [2 + max([len(x) for x in heads[c]] + [len(r[c]) for r in rows]) for c in range(len(head))]
    line_chars = sum(widths) + 2
    if blocks <= 0:
        blocks = max(1, int(width_pt / (line_chars * fontsize * MONO_ADVANCE_EM)))
    size = max(MIN_FONT_PT, min(fontsize, width_pt / (blocks * line_chars * MONO_ADVANCE_EM)))
    n_head = max(len(h) for h in heads)
    per_block = max(0, int(height_pt / (1.65 * size)) - n_head - 1)
    return size, widths, blocks, per_block


def draw_verdict_key(ax, y: float, fontsize: float = 7.0) -> None:
    """The key of the verdict tints, one line at height ``y`` (axes fraction, top of the
    line) from the left of ``ax``: each verdict word of :data:`VERDICT_COLOURS` on its own
    tint, ``self`` explained."""
    fig = ax.get_figure()
    width_pt = ax.get_position().width * fig.get_figwidth() * 72.0
    char_w = fontsize * MONO_ADVANCE_EM / width_pt
    style = {"family": "monospace", "fontsize": fontsize, "va": "top", "ha": "left",
             "parse_math": False}
    label = "verdict tints:"
    ax.text(0.0, y, label, **style)
    x = (len(label) + 2) * char_w
    for v, colour in VERDICT_COLOURS.items():
        word = f"{v} (sand against itself)" if v == "self" else v
        ax.text(x, y, word, bbox={"facecolor": colour, "edgecolor": "#999999", "pad": 1.2,
                                  "linewidth": 0.4}, **style)
        x += (len(word) + 2) * char_w


def draw_window_table(ax, rows, title, *, fontsize: float = 7.5, head=None, blocks: int = 1,
                      verdict_key: bool = False) -> list:
    """A table of ``rows`` under ``head`` (default :data:`TABLE_HEAD`, or with the
    formations column when the rows have it) in ``ax``, in ``blocks`` side-by-side blocks
    (0: as many as fit).  Returns the rows that did not fit.

    Each row is one line of fixed-width text, so a long table costs one text per row.
    Rows are zebra-shaded and the verdict field tinted by :data:`VERDICT_COLOURS`; with
    ``verdict_key`` the key of the tints is drawn on a line below the table.
    """
    from matplotlib.collections import LineCollection, PatchCollection
    from matplotlib.patches import Rectangle

    ax.set_axis_off()
    ax.set_xlim(0, 1)
    ax.set_ylim(0, 1)
    ax.set_title(title, loc="left", fontsize=9, fontweight="bold", parse_math=False)
    if not rows:
        ax.text(0, 0.95, "No sand-sand windows between different sands.", va="top", fontsize=9)
        return []
    head = head or table_head(len(rows[0]) > len(TABLE_HEAD))
    fig = ax.get_figure()
    pos = ax.get_position()
    width_pt = pos.width * fig.get_figwidth() * 72.0
    height_pt = pos.height * fig.get_figheight() * 72.0
    size, widths, blocks, per_block = table_layout(rows, head, width_pt, height_pt, fontsize, blocks)
    heads = [h.split("\n") for h in head]
    n_head = max(len(h) for h in heads)
    heads = [[""] * (n_head - len(h)) + h for h in heads]
    char_w = size * MONO_ADVANCE_EM / width_pt  # axes fraction per character
    row_h = 1.65 * size / height_pt
    head_h = (n_head + 0.4) * row_h
    starts = np.concatenate(([0], np.cumsum(widths)))
    block_w = starts[-1] * char_w
    gap_w = 2 * char_w
    top = 1.0 - head_h
    vcol = head.index("verdict") if "verdict" in head else None

    def line(fields) -> str:
        return "".join(f.center(w) for f, w in zip(fields, widths))

    shades, rules = [], []
    text = {"family": "monospace", "fontsize": size, "va": "center", "ha": "left",
            "parse_math": False}
    shown = 0
    for b in range(blocks):
        chunk = rows[b * per_block:(b + 1) * per_block]
        if not chunk:
            break
        x0 = b * (block_w + gap_w)
        shades.append(Rectangle((x0, top), block_w, head_h, facecolor="#EEEEEE"))
        for r, row in enumerate(chunk):
            y0 = top - (r + 1) * row_h
            if r % 2:
                shades.append(Rectangle((x0, y0), block_w, row_h, facecolor="#F4F4F4"))
            if vcol is not None and row[vcol] in VERDICT_COLOURS:
                shades.append(Rectangle((x0 + starts[vcol] * char_w, y0), widths[vcol] * char_w, row_h,
                                        facecolor=VERDICT_COLOURS[row[vcol]]))
        for k in range(n_head):
            ax.text(x0, 1.0 - (0.2 + k + 0.5) * row_h, line([h[k] for h in heads]), **text)
        for r, row in enumerate(chunk):
            ax.text(x0, top - (r + 0.5) * row_h, line(row), **text)
        bottom = top - len(chunk) * row_h
        rules += [[(x0, y), (x0 + block_w, y)] for y in (1.0, top, bottom)]
        rules += [[(x0 + x * char_w, bottom), (x0 + x * char_w, 1.0)] for x in starts]
        shown += len(chunk)
    ax.add_collection(PatchCollection(shades, match_original=True, linewidths=0))
    ax.add_collection(LineCollection(rules, colors="#BBBBBB", linewidths=0.5))
    if verdict_key:  # below the longest block
        draw_verdict_key(ax, top - (min(len(rows), per_block) + 0.6) * row_h, fontsize=min(7.0, size))
    return rows[shown:]
