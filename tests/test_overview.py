"""The field overview: locations from LAS headers and locations files, the rows it
gathers from a batch's folder, and the one-page PDF figure."""

from __future__ import annotations

import re

import pandas as pd
import pytest
from conftest import open_logs_path
from layout_check import collisions, off_page, text_boxes

from logprep.run.batch import screen_paths
from logprep.errors import LogprepError
from logprep.io.locations import (
    GEOGRAPHIC,
    GRID,
    header_location,
    las_header_location,
    map_xy,
    parse_angle_deg,
    read_locations,
)
from logprep.report.overview import overview_rows
from logprep.report.overview_files import write_overview
from logprep.report.overview_html import overview_html, place_labels
from logprep.report.overview_page import overview_figure


def test_angle_text_to_degrees():
    # arithmetic: 43 + 35/60 + 47.74/3600 = 43.5965944...; W and S are negative
    assert parse_angle_deg("43 35' 47.74\" N") == pytest.approx(43.596594444, abs=1e-9)
    assert parse_angle_deg("60 41' 22.69\" W") == pytest.approx(-60.689636111, abs=1e-9)
    assert parse_angle_deg("60°41'22.69\"W") == pytest.approx(-60.689636111, abs=1e-9)
    assert parse_angle_deg("-12.5") == -12.5
    assert parse_angle_deg("S 33 30") == pytest.approx(-33.5)
    with pytest.raises(ValueError):
        parse_angle_deg("43 75 00 N")  # minutes must be below 60
    with pytest.raises(ValueError):
        parse_angle_deg("unknown")


def test_open_f3_wells_located_from_loc_text_match_their_well_tracks():
    # The F3 LAS headers hold "X = ... Y = ..." in LOC; the same dataset's well-track files
    # (an independent file of the same wells) start at the same surface location.
    for stem in ("F02-1", "F03-2", "F03-4", "F06-1"):
        las = open_logs_path("nlog_f3_netherlands", f"{stem}_logs.las")
        track = open_logs_path("nlog_f3_netherlands", "track", f"{stem}.track")
        x, y = map(float, track.read_text().split()[:2])
        loc = las_header_location(las)
        assert loc is not None and loc.kind == GRID
        assert (loc.x, loc.y) == (x, y)


def test_open_well_with_dms_latitude_longitude():
    # ALMA 3 (PROVENANCE.md: LATI/LONG hold DMS text): 43 35' 47.74" N, 60 41' 22.69" W
    las = open_logs_path("cnsopb_nova_scotia", "ALMA_3_D399_SON_DEN_NEUT_2393-3388M_LAS.las")
    loc = las_header_location(las)
    assert loc.kind == GEOGRAPHIC
    assert loc.y == pytest.approx(43.596594, abs=1e-6) and loc.x == pytest.approx(-60.689636, abs=1e-6)


def test_open_well_without_location_is_left_off():
    assert las_header_location(open_logs_path("force2020_norway", "31_3-1.las")) is None


def test_header_location_forms():
    assert header_location({"XCOORD": "431250.5 M", "YCOORD": "226870"}) == \
        header_location({"XCOORD": "431250.5 M", "YCOORD": "226870"})
    loc = header_location({"X": "431250.5", "Y": "226870"})
    assert (loc.x, loc.y, loc.kind) == (431250.5, 226870.0, GRID)
    assert header_location({"LATI": "0", "LONG": "0"}) is None  # placeholder, not a place
    assert header_location({"LOC": "Slot A, licence DL-07"}) is None
    loc = header_location({"LOC": "local grid X 431250 Y 226870"})
    assert (loc.x, loc.y) == (431250.0, 226870.0)


def test_locations_file_forms_and_errors(tmp_path):
    p = tmp_path / "wells.csv"
    p.write_text("Well;Latitude;Longitude\nA-1;58,5;1,25\nB-2;58 30 00 N;1 15 00 W\n")
    locs = read_locations(p)
    assert locs["A-1"].kind == GEOGRAPHIC and (locs["A-1"].y, locs["A-1"].x) == (58.5, 1.25)
    assert locs["B-2"].x == pytest.approx(-1.25)
    bad = tmp_path / "bad.csv"
    bad.write_text("well,east\nA-1,3\n")
    with pytest.raises(LogprepError, match=r"bad\.csv: needs columns well and x, y"):
        read_locations(bad)
    bad.write_text("well,x,y\nA-1,3,north\n")
    with pytest.raises(LogprepError, match=r"bad\.csv: line 2: x/y of 'A-1'"):
        read_locations(bad)


def test_map_draws_the_kind_most_wells_share():
    from logprep.io.locations import Location

    locs = [Location(1, 2, GRID, ""), Location(3, 4, GRID, ""), Location(5, 50, GEOGRAPHIC, "")]
    xy, kind, note = map_xy(locs)
    assert kind == GRID and xy[2] is None and "1 well(s)" in note


def test_labels_never_overlap_and_stay_in_the_box():
    pts = [(100 + 3 * k, 100 + 2 * k) for k in range(12)] + [(5, 5), (395, 295)]
    labels = [f"WELL-{k:02d}" for k in range(len(pts))]
    box = (0, 0, 400, 300)
    anchors = place_labels(pts, labels, box=box)
    rects = []
    for (x, y), text, a in zip(pts, labels, anchors):
        if a is None:
            continue
        w = 6.3 * len(text)
        x0 = {"start": a[0], "end": a[0] - w, "middle": a[0] - w / 2}[a[2]]
        rects.append((x0, a[1] - 10, x0 + w, a[1] + 2))
    assert len(rects) >= 4
    for i, a in enumerate(rects):
        assert box[0] - 1 <= a[0] and a[2] <= box[2] + 1
        for b in rects[i + 1:]:
            assert min(a[2], b[2]) <= max(a[0], b[0]) + 1 or min(a[3], b[3]) <= max(a[1], b[1]) + 1


@pytest.fixture(scope="module")
def tables_batch(tmp_path_factory, example_dir):
    out = tmp_path_factory.mktemp("tables")
    bad = out.parent / "NOT-A-WELL.las"
    bad.write_text("not a log\n")
    screen_paths([example_dir / "HRM-4.las", example_dir / "HRM-5.las", bad], out, sheets=False)
    return out


def test_python_batch_writes_the_overview(tables_batch):
    # screen_paths (the notebook's batch) ends with the field overview, as the CLI does
    page = (tables_batch / "overview.html").read_text(encoding="utf-8")
    assert (tables_batch / "overview.pdf").read_bytes().startswith(b"%PDF")
    for name in ("HRM-4", "HRM-5", "NOT-A-WELL"):
        assert name in page
    assert "CAUTION" in page


def test_python_batch_overview_off_and_bad_locations(tmp_path, example_dir):
    out = tmp_path / "no-overview"
    report = screen_paths([example_dir / "HRM-5.las"], out, sheets=False, field=False, overview=False)
    assert report.overview == {} and (out / "summary.csv").is_file()
    assert not (out / "overview.html").exists() and not (out / "overview.pdf").exists()
    bad = tmp_path / "wells.csv"
    bad.write_text("name;colour\nA;red\n")
    with pytest.raises(LogprepError, match="wells.csv"):
        screen_paths([example_dir / "HRM-5.las"], tmp_path / "bad-loc", sheets=False, locations=bad)
    assert not (tmp_path / "bad-loc" / "summary.csv").exists()  # refused before any well


def test_rows_recount_the_tables(tables_batch):
    rows = {r.name: r for r in overview_rows(tables_batch)}
    assert set(rows) == {"HRM-4", "HRM-5", "NOT-A-WELL"}
    for name in ("HRM-4", "HRM-5"):
        folder = tables_batch / rows[name].folder
        w = pd.read_csv(folder / "juxtapositions.csv")
        cross = w[~w["self_juxtaposed"]]
        assert rows[name].windows == len(cross)
        assert sum(rows[name].verdicts.values()) == len(cross)
        assert rows[name].verdicts["leak"] == int((cross["verdict"] == "leak").sum())
        assert rows[name].min_sgr_pct == pytest.approx(cross["sgr_min_pct"].min())
        assert rows[name].min_oil_column_m == pytest.approx(cross["column_oil_m"].min())
        layers = pd.read_csv(folder / "layers.csv")
        assert rows[name].sands == int((layers["lithology"] == "sand").sum())
        assert rows[name].location is not None  # the Harrowmere headers give local X/Y in LOC
        assert rows[name].notes == (folder / "notes.txt").read_text().splitlines()
        assert all((tables_batch / p).is_file() for _, p in rows[name].links)
        assert "sheet" not in dict(rows[name].links)  # tables-only run: no sheet to link
    bad = rows["NOT-A-WELL"]
    assert bad.status == "error" and bad.worst == "failed" and "NOT-A-WELL.las" in bad.message


def test_locations_file_wins_over_headers(tables_batch, tmp_path):
    p = tmp_path / "loc.csv"
    p.write_text("well,x,y\nhrm 4,10,20\n")  # matched as tops are: case, space, - ignored
    rows = {r.name: r for r in overview_rows(tables_batch, p)}
    assert (rows["HRM-4"].location.x, rows["HRM-4"].location.y) == (10.0, 20.0)
    assert rows["HRM-5"].location.source == "LAS header LOC"


def test_html_is_self_contained_and_escapes_names(tables_batch):
    rows = overview_rows(tables_batch)
    rows[0].name = "A<b>&$x$"
    page = overview_html(rows, "rule")
    assert "A&lt;b&gt;&amp;$x$" in page and "<b>&" not in page
    assert "CAUTION" in page and "default-src 'none'" in page
    # nothing loaded from elsewhere: no src attributes, no links off the folder
    assert not re.search(r"\bsrc\s*=", page)
    assert not re.search(r"href=\"(?:https?:|//)", page)


def test_html_carries_no_wall_clock_time(tables_batch, monkeypatch):
    # reproducible builds: the time comes from SOURCE_DATE_EPOCH or not at all
    # (https://reproducible-builds.org/specs/source-date-epoch/)
    rows = overview_rows(tables_batch)
    monkeypatch.delenv("SOURCE_DATE_EPOCH", raising=False)
    assert "written" not in overview_html(rows, "rule")
    monkeypatch.setenv("SOURCE_DATE_EPOCH", "1700000000")  # 2023-11-14 22:13:20 UTC
    assert ", written 2023-11-14 22:13 UTC." in overview_html(rows, "rule")


def test_pdf_page_text_is_legible(tables_batch):
    write_overview(tables_batch)
    assert (tables_batch / "overview.pdf").read_bytes().startswith(b"%PDF")
    fig = overview_figure(overview_rows(tables_batch), "leak below 15 %")
    boxes = text_boxes(fig)
    assert any(t.startswith("CAUTION") for t, _ in boxes)
    assert collisions(boxes) == []
    assert off_page(fig, boxes) == []
