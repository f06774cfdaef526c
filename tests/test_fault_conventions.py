"""Fault-seal conventions: clay fraction, burial below the sea floor or ground, structural
closure, CO2-brine capillary pressure and fault geometry, each against a hand-worked or
published value (source beside each)."""

import math

import numpy as np
import pandas as pd
import pytest

from logprep.errors import SettingsError
from logprep.fault import burial, closure, clayfraction, co2, geometry
from logprep.model import Layers


# ----------------------------------------------------------------------------- clay fraction
def test_clay_fraction_of_shale():
    # Worked by hand: Vcl = 0.6 x Vsh; a 20 m shale of Vsh 0.8 and 30 m sand of Vsh 0.1
    # (METHODS.md s.2: SGR 38.0 % on Vsh) give SGR 0.6 x 38.0 = 22.8 % on clay.
    from logprep.fault.juxtaposition import sgr_layered_pct

    L = Layers([0.0, 20.0], [20.0, 50.0], [0.8, 0.1], ["shale", "sand"])
    assert float(sgr_layered_pct(L, 50.0, 50.0)) == pytest.approx(38.0, abs=1e-9)
    C = clayfraction.clay_layers(L, "shale_fraction", 0.6)
    assert float(sgr_layered_pct(C, 50.0, 50.0)) == pytest.approx(22.8, abs=1e-9)
    assert C.lithology == L.lithology  # the cut-offs stay on Vsh
    assert clayfraction.clay_layers(L).vsh.tolist() == L.vsh.tolist()  # default: Vsh as clay
    with pytest.raises(SettingsError, match="shale-clay-fraction"):
        clayfraction.shale_fraction_clay(0.5, 1.2)
    with pytest.raises(SettingsError, match="use one of shale_fraction"):
        clayfraction.get_clay_conversion("nope")


# ----------------------------------------------------------------------------- burial
def test_burial_offshore_from_the_header_water_depth():
    # Worked by hand: contact 2100 m below sea level under 120 m of water is 1980 m below
    # the sea floor; with 500 m of uplift it was buried to 2480 m.
    elev, note = burial.surface_elevation_m({"WDEP": "120"}, {"WDEP": "M"}, "M")
    assert elev == -120.0 and "WDEP 120 m" in note
    assert float(burial.burial_depth_m(2100.0, elev)) == 1980.0
    assert float(burial.burial_depth_m(2100.0, elev, 500.0)) == 2480.0
    # feet in the header: 400 ft = 121.92 m (1 ft = 0.3048 m exactly)
    assert burial.surface_elevation_m({"WD": "400"}, {"WD": "FT"}, "M")[0] == pytest.approx(-121.92)


def test_burial_onshore_keeps_the_ground_elevation():
    # Worked by hand: MD 2000 m from a kelly bushing 105 m above sea level, ground 100 m:
    # depth below sea level 2000 - 105 = 1895 m, below the ground 1895 + 100 = 1995 m
    # (the 5 m of rig floor above the ground, not the 105 m).
    elev, note = burial.surface_elevation_m({"EGL": "100", "EKB": "105"}, {"EGL": "M"}, "M")
    assert elev == 100.0 and note.startswith("ground")
    assert float(burial.burial_depth_m(2000.0 - 105.0, elev)) == 1995.0
    # the setting wins over the header; no information: sea level, said so
    assert burial.surface_elevation_m({"EGL": "100"}, {}, "M", water_depth_m=80.0)[0] == -80.0
    assert "sea level" in burial.surface_elevation_m({}, {}, "M")[1]


def test_one_class_step_is_the_stated_pressure_factor():
    # Bretan et al. (2003) envelope: C 0.5 above 3.0 km burial, 0.25 to 3.5 km, 0 deeper;
    # 3100 m below sea level under 200 m of water is 2900 m below the sea floor: class 1
    # instead of 2, pressure lower by 10^0.25 = 1.778.
    from logprep.fault.envelope import fault_zone_pressure_bar

    ss = fault_zone_pressure_bar(30.0, 3100.0)
    sf = fault_zone_pressure_bar(30.0, float(burial.burial_depth_m(3100.0, -200.0)))
    assert ss / sf == pytest.approx(10 ** 0.25, rel=1e-12)


# ----------------------------------------------------------------------------- closure
def _table():
    return pd.DataFrame({"verdict": ["seal", "uncertain", "leak", "seal"],
                         "column_oil_m": [120.0, 1500.0, 40.0, 300.0],
                         "column_gas_m": [50.0, 600.0, 10.0, 100.0],
                         "column_co2_m": [100.0, 1300.0, 30.0, 250.0]})


def test_closure_caps_columns_and_names_the_limit():
    # Worked by hand: a 200 m closure caps the 1500 m and 300 m oil columns; a leaking
    # window holds no sealing column.
    t = closure.with_closure(_table(), 200.0)
    assert t["column_oil_m"].tolist() == [120.0, 200.0, 0.0, 200.0]
    assert t["column_oil_limit"].tolist() == ["fault rock", "closure", "leak", "closure"]
    assert t["column_gas_limit"].tolist() == ["fault rock", "closure", "leak", "fault rock"]
    assert not t["column_unconstrained"].any()


def test_without_closure_tall_columns_are_unconstrained():
    t = closure.with_closure(_table(), None)
    assert t["column_unconstrained"].tolist() == [False, True, False, False]
    assert t["column_oil_m"].tolist() == [120.0, 1500.0, 0.0, 300.0]
    with pytest.raises(SettingsError, match="--closure"):
        closure.with_closure(_table(), -5.0)


# ----------------------------------------------------------------------------- CO2
def test_co2_pressure_factor():
    # Worked by hand from P = 2 gamma cos(theta) / r (Washburn 1921): 26 cos 30 / (30 cos 0)
    # = 22.5167 / 30 = 0.75056; 10 bar of hydrocarbon-water pressure is 7.506 bar CO2-brine.
    assert co2.co2_pressure_factor() == pytest.approx(26 * math.cos(math.radians(30)) / 30, rel=1e-12)
    assert 10 * co2.co2_pressure_factor() == pytest.approx(7.5056, abs=1e-4)
    assert co2.co2_pressure_factor(30, 0, 30, 0) == 1.0
    with pytest.raises(SettingsError, match="not water-wet"):
        co2.co2_pressure_factor(co2_contact_deg=95.0)


def test_co2_density_along_the_default_path():
    # Span & Wagner (1996) through CoolProp on logprep's hydrostatic (1050 kg/m3 from 1 atm)
    # and 10 C + 30 C/km path: at 500 m 5.25 MPa, 25 C -> about 143 kg/m3 (gas-like); at
    # 1 km 10.4 MPa, 40 C -> about 655 kg/m3; a fixed 700 kg/m3 overstates the 500 m CO2
    # column (1050 - 143) / (1050 - 700) = 2.6 times.
    pytest.importorskip("CoolProp")
    from logprep.fault.envelope import co2_density_kgm3, geothermal_temperature_k, hydrostatic_pressure_pa

    z = np.array([500.0, 1000.0])
    rho = co2_density_kgm3(hydrostatic_pressure_pa(z, 1050.0), geothermal_temperature_k(z, 10.0, 30.0))
    assert rho[0] == pytest.approx(143.1, abs=0.5) and rho[1] == pytest.approx(654.6, abs=0.5)
    assert (1050 - rho[0]) / (1050 - 700) == pytest.approx(2.59, abs=0.01)


# ----------------------------------------------------------------------------- geometry
def test_displacement_and_csp_along_the_fault():
    # Worked by hand: 100 m of throw on a 60 deg fault is 100 / sin 60 = 115.47 m of
    # displacement; CSP from vertical distances is 1 / sin 60 = 1.1547 times too large.
    assert float(geometry.displacement_m(100.0, 60.0)) == pytest.approx(115.470, abs=1e-3)
    assert 1 / geometry.csp_factor(60.0) == pytest.approx(1.1547, abs=1e-4)
    # METHODS.md s.2: 10 m bed at 50 m -> CSP 2.0 m (vertical); on a 60 deg fault 1.732 m
    assert 2.0 * geometry.csp_factor(60.0) == pytest.approx(1.7321, abs=1e-4)
    assert geometry.csp_factor(90.0, 0.0) == 1.0
    with pytest.raises(SettingsError, match="--fault-dip"):
        geometry.displacement_m(1.0, 0.0)
