"""Core/cuttings description files and label curves as a rock reference."""

import numpy as np
import pytest

from logprep.errors import LogprepError
from logprep.io.descriptions import (
    descriptions_for_well,
    group_of,
    labels_at,
    labels_from_codes,
    read_descriptions,
)


@pytest.mark.parametrize("text,group", [
    ("Sandstone, fine", "sandstone"), ("SST", "sandstone"), ("Claystone", "shale"),
    ("Shale, silty", "shale"), ("Sandstone/shale interbedded", "sandy shale"),
    ("Chalk, white", "chalk"), ("Limestone, micritic", "limestone"), ("Dolomite", "dolomite"),
    ("Coal", "coal"), ("Lignite", "coal"), ("Anhydrite", "anhydrite"), ("Salt", "halite"),
    ("Tuff, green", "tuff"), ("Marl", "marl"), ("Conglomerate", "other"),
])
def test_group_keywords(text, group):
    assert group_of(text) == group


def test_read_and_sample_descriptions(tmp_path):
    p = tmp_path / "core.csv"
    p.write_text("well,top_m,base_m,lithology\nA-1,100,105,Sandstone\nA-1,105,110,Shale\n"
                 "B-2,50,60,Chalk\n", encoding="utf-8")
    d = read_descriptions(p)
    a = descriptions_for_well(d, "A 1")
    assert list(a["group"]) == ["sandstone", "shale"]
    lab = labels_at([99.0, 100.0, 104.9, 105.0, 111.0], a)
    assert list(lab) == ["", "sandstone", "sandstone", "shale", ""]


def test_feet_and_bad_rows(tmp_path):
    p = tmp_path / "ft.csv"
    p.write_text("top_ft;base_ft;lithology\n1000;1010;Sandstone\n", encoding="utf-8")
    d = read_descriptions(p)
    assert d["top_m"].iloc[0] == pytest.approx(304.8)
    bad = tmp_path / "bad.csv"
    bad.write_text("top_m,base_m,lithology\n10,5,Shale\n", encoding="utf-8")
    with pytest.raises(LogprepError, match="line 2: base_m must be below top_m"):
        read_descriptions(bad)
    with pytest.raises(LogprepError, match="missing column"):
        nolith = tmp_path / "n.csv"
        nolith.write_text("top_m,base_m\n1,2\n", encoding="utf-8")
        read_descriptions(nolith)


def test_label_codes():
    # FORCE 2020 codes (lithology_key.csv of the competition repository)
    assert list(labels_from_codes([30000, 65000, np.nan, 12345])) == ["sandstone", "shale", "", "other"]
