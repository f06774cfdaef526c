"""The window-table pages of the sheet: the windows between different sands that page 1
could not show, lowest SGR first, in side-by-side blocks across the page width, on at most
:data:`MAX_TABLE_PAGES` pages.  The complete table (every window, sands against themselves
included, with the same numbers) is ``juxtapositions.csv``; the pages say so."""

from __future__ import annotations

from matplotlib.figure import Figure

from logprep.report.draw import PAGE_SIZE_IN, ROWS_PAGE1, draw_footer, draw_window_table, window_rows

MAX_TABLE_PAGES = 2
"""Most window-table pages on a sheet."""


def window_table_pages(result) -> list[Figure]:
    """Table pages for the windows beyond page 1's, lowest SGR first (page 1 holds the
    :data:`~logprep.report.draw.ROWS_PAGE1` lowest)."""
    w = result.windows
    cross = w[~w["self_juxtaposed"]].sort_values("sgr_min_pct", kind="stable")
    if len(cross) <= ROWS_PAGE1:
        return []
    numbers = [int(i) + 1 for i in cross.index[ROWS_PAGE1:]]  # page 1 holds the first ones
    s = result.settings
    rows = window_rows(w, numbers, s.capacity.sgr_threshold_pct, s.capacity.length_unit,
                       tops=getattr(result, "tops", None))
    pages, left, shown = [], rows, ROWS_PAGE1
    while left and len(pages) < MAX_TABLE_PAGES:
        page = Figure(figsize=PAGE_SIZE_IN)
        page.text(0.015, 0.975, f"{result.well.name}: sand-sand windows between different sands, "
                  "lowest SGR first (numbers as on page 1 and in juxtapositions.csv)",
                  ha="left", va="top", fontsize=13, fontweight="bold", parse_math=False)
        ax = page.add_axes([0.015, 0.13, 0.97, 0.79])
        before = len(left)
        left = draw_window_table(ax, left, "", blocks=0, fontsize=6.5)
        first, last = shown + 1, shown + before - len(left)
        shown = last
        note = f"windows {first}-{last} of {len(cross)} by lowest SGR (the first {ROWS_PAGE1} on page 1)"
        if left and len(pages) == MAX_TABLE_PAGES - 1:
            note += (f"; the other {len(left)} (higher SGR) are not printed: every window is in "
                     "juxtapositions.csv")
        else:
            note += "; every window, sands against themselves included, is in juxtapositions.csv"
        page.text(0.015, 0.935, note, fontsize=9, parse_math=False)
        draw_footer(page, result, short=True)
        pages.append(page)
        if len(left) == before:  # nothing fitted (cannot happen with a sane page): stop
            break
    return pages
