"""Quirks that still give a result are told, not passed over: a file of very few samples,
a GR clipped flat at the tool's ceiling, and a ``WRAP. NO`` file whose rows wrap each
carry their warning in the ``warnings`` column of ``summary.csv``, as ``warning`` rows of
``qc.csv`` and in the notes of the sheet.  Files from the hostile corpus
(tests/data/hostile, made by make_hostile.py).  Behaviour checks (common practice, no source).
"""

from __future__ import annotations

import io
from pathlib import Path

import pandas as pd
import pytest

HOSTILE = Path(__file__).parent / "data" / "hostile"

QUIRKS = {
    "good_three_samples.las": "only 3 depth samples",
    "good_clipped_gr.las": "flat at its maximum",
    "good_wrap_flag_no_but_wrapped.las": "WRAP. NO",
}


@pytest.mark.parametrize("name", sorted(QUIRKS))
def test_quirk_warning_in_summary_qc_and_sheet(name, tmp_path):
    from matplotlib.text import Text

    from logprep.report.sheet import build_sheet
    from logprep.report.writers import plain_text
    from logprep.run.batch import screen_one
    from logprep.run.settings import ScreenSettings

    expect = QUIRKS[name]
    settings = ScreenSettings(co2_density_mode="fixed")
    row = screen_one(HOSTILE / name, "w", tmp_path, settings, sheets=False)
    assert row["status"] == "ok" and expect in row["warnings"], row
    qc = pd.read_csv(io.StringIO((tmp_path / "w" / "qc.csv").read_text()), keep_default_na=False)
    warned = qc[qc["flag"] == "warning"]["meaning"].tolist()
    assert any(expect in w for w in warned), warned
    from logprep.run.pipeline import screen_file

    with plain_text():
        pages = build_sheet(screen_file(HOSTILE / name, settings))
    text = " ".join(t.get_text() for fig in pages for t in fig.findobj(Text)).replace("\n", " ")
    chunks = " ".join(text.split()).split("warning: ")[1:]  # the notes line of the sheet
    assert any(expect in c[:200] for c in chunks), name
