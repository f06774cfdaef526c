"""The per-well screening sheet: the list of its pages, in order.  Builds matplotlib
Figures, never saves or shows them.

Each page module (``page_*.py``) holds one function ``result -> list of Figures`` drawn from
a :class:`~logprep.run.pipeline.WellScreening`, with the helpers of
:mod:`logprep.report.draw`.  To add a page, write its module and add its function to
:data:`PAGES`; no page imports another, and this module is the only one that imports them.
"""

from __future__ import annotations

from collections.abc import Callable

from matplotlib.figure import Figure

from logprep.report.page_capacity import seal_capacity_page
from logprep.report.page_fault import fault_pages
from logprep.report.page_logs import log_page
from logprep.report.page_smear import smear_page
from logprep.report.page_tables import window_table_pages

PAGES: list[Callable[[object], list[Figure]]] = [log_page, seal_capacity_page, smear_page,
                                                 fault_pages, window_table_pages]
"""Functions ``result -> list of Figures``, in page order."""


def build_sheet(result) -> list[Figure]:
    """The screening sheet for one :class:`~logprep.run.pipeline.WellScreening`."""
    pages = []
    for make in PAGES:
        pages += make(result)
    return pages
