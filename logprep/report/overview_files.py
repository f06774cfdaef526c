"""Writing the field overview: ``overview.html`` and ``overview.pdf`` in a batch's
output folder (see :mod:`logprep.report.overview`)."""

from __future__ import annotations

from pathlib import Path

from logprep.report.overview import overview_rows, verdict_rule
from logprep.report.overview_html import overview_html
from logprep.report.overview_page import overview_figure
from logprep.report.writers import pdf_bytes, write_bytes_atomic


def write_overview(out_dir: str | Path, locations_file: str | Path | None = None) -> dict[str, Path]:
    """Write ``overview.html`` and ``overview.pdf`` into ``out_dir`` (atomically, as every
    output) from what the batch left there; returns their paths by name."""
    out = Path(out_dir)
    rows = overview_rows(out, locations_file)
    rule = verdict_rule(out)
    paths = {"overview.html": out / "overview.html", "overview.pdf": out / "overview.pdf"}
    html = overview_html(rows, rule)
    pdf = pdf_bytes([overview_figure(rows, rule)])
    write_bytes_atomic(paths["overview.html"], html.encode("utf-8"))
    write_bytes_atomic(paths["overview.pdf"], pdf)
    return paths
