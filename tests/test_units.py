"""Unit conversions against the defining constants (../shared/METHODS.md: 1 psi = 6894.757 Pa,
1 ft = 0.3048 m exactly (international foot, 1959); 1 bar = 1e5 Pa and 1 MPa = 1e6 Pa by SI
definition)."""

import numpy as np
import pytest

from logprep.errors import SettingsError
from logprep.units import length, pressure


def test_pressure_definitions():
    # 1 bar = 1e5 Pa / 6894.757 Pa per psi = 14.503774 psi (METHODS.md constants)
    assert pressure(1.0, "bar", "psi") == pytest.approx(1e5 / 6894.757, rel=1e-15)
    assert pressure(1.0, "bar", "psi") == pytest.approx(14.503774, abs=5e-7)
    assert pressure(1.0, "MPa", "bar") == pytest.approx(10.0, rel=1e-15)
    assert pressure(1.0, "psi", "Pa") == 6894.757
    assert length(1.0, "ft", "m") == 0.3048
    assert length(1000.0, "m", "ft") == pytest.approx(3280.839895, abs=1e-6)


@pytest.mark.parametrize("a,b", [("bar", "psi"), ("psi", "MPa"), ("MPa", "bar"), ("Pa", "psi")])
def test_pressure_round_trip(a, b):
    x = np.array([0.0, 1.0, 9.58262, 166.81, 3.5e4])
    np.testing.assert_allclose(pressure(pressure(x, a, b), b, a), x, rtol=1e-14)


def test_length_round_trip():
    x = np.array([0.0, 0.3048, 325.72, 2419.932])
    np.testing.assert_allclose(length(length(x, "m", "ft"), "ft", "m"), x, rtol=1e-14)


def test_unknown_unit_is_a_clear_error():
    with pytest.raises(SettingsError, match="unknown pressure unit 'atm'; use one of Pa, bar, psi, MPa"):
        pressure(1.0, "atm", "bar")
