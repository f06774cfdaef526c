"""Tops tables: the project's CSV layout and the F3 markers files (open data:
nlog_f3_netherlands/tops, CC BY-SA, dGB Earth Sciences and TNO; see PROVENANCE.md)."""

import pytest

from conftest import open_logs_path
from logprep.io.tops import TopsError, read_tops, tops_for_well, well_key


def test_csv_layout(tmp_path):
    p = tmp_path / "t.csv"
    p.write_text("name, well, top_m\nB, W-1, 120.5\nA, W-1, 100\nC, W 2, 50\n")
    t = read_tops(p)
    assert tops_for_well(t, "W-1")["top_m"].tolist() == [100.0, 120.5]  # sorted per well
    assert tops_for_well(t, "w2")["name"].tolist() == ["C"]


def test_csv_errors(tmp_path):
    p = tmp_path / "t.csv"
    p.write_text("well,depth\nA,1\n")
    with pytest.raises(TopsError, match="missing column"):
        read_tops(p)
    p.write_text("well,top_m,name\nA,deep,X\n")
    with pytest.raises(TopsError, match="line 2: top_m is not a number"):
        read_tops(p)


def test_well_key():
    assert well_key("F03-2") == well_key("f03_2") == well_key("F 03 2")


def test_f3_markers_unsorted_and_duplicates():
    # PROVENANCE.md: F03-2 markers are not sorted and MFS10/MFS9/MFS8 share 564.4 m.
    folder = open_logs_path("nlog_f3_netherlands", "tops")
    t = tops_for_well(read_tops(folder), "F03-2")
    assert t["top_m"].is_monotonic_increasing
    assert (t["top_m"] == 564.4).sum() == 3
    assert t["top_m"].iloc[0] == 30.0 and t["name"].iloc[0] == "Seasurface"
