"""The window-table pages of the sheet: every row of ``juxtapositions.csv`` when page 1
could not show them all."""

from __future__ import annotations

from matplotlib.figure import Figure

from logprep.report.draw import (
    PAGE_SIZE_IN, ROWS_PAGE1, ROWS_PER_PAGE, draw_footer, draw_window_table, window_rows,
)


def window_table_pages(result) -> list[Figure]:
    """Every row of ``juxtapositions.csv``, in file order, when page 1 could not show all."""
    w = result.windows
    n_cross = int((~w["self_juxtaposed"]).sum())
    if n_cross <= ROWS_PAGE1 and len(w) == n_cross:
        return []
    numbers = list(range(1, len(w) + 1))
    pages = []
    for start in range(0, len(numbers), ROWS_PER_PAGE):
        page = Figure(figsize=PAGE_SIZE_IN)
        page.suptitle(f"{result.well.name}: all sand-sand windows (rows of juxtapositions.csv)",
                      x=0.015, ha="left", fontsize=13, fontweight="bold")
        ax = page.add_axes([0.03, 0.15, 0.6, 0.78])
        chunk = numbers[start:start + ROWS_PER_PAGE]
        draw_window_table(ax, window_rows(w, chunk, result.settings.capacity.sgr_threshold_pct,
                                          result.settings.capacity.length_unit),
                          f"rows {chunk[0]}-{chunk[-1]} of {len(w)}")
        draw_footer(page, result)
        pages.append(page)
    return pages
