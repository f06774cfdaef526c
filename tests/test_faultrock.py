"""Fault-rock permeability, thickness and transmissibility (../shared/METHODS.md s.5).

Every equation here is tagged [M] in METHODS.md: from memory, not verified against the
papers.  The checks below are therefore "value from memory" (Sperrevik) or hand-worked [D]
from the remembered formulas (Manzocchi); they guard the implementation of those
formulas, not the formulas themselves.  Sources: Manzocchi, Walsh, Nell & Yielding (1999),
Petroleum Geoscience 5(1) 53-63; Sperrevik, Gillespie, Fisher, Halvorsen & Knipe (2002),
NPF Special Publication 11, 109-125.
"""

import numpy as np
import pytest

from logprep.errors import SettingsError
from logprep.fault.faultrock import (
    fault_rock_thickness_m, manzocchi_permeability_md, sperrevik_permeability_md,
    transmissibility_multiplier, transmissibility_multiplier_cells,
)


def test_sperrevik_check_value():
    # value from memory (METHODS.md s.5 [M], Sperrevik et al. 2002): Vcl 0.2, z_max 3000 m,
    # z_f 2000 m -> 0.012706 mD, quoted to 5 significant figures (tolerance half a unit).
    assert float(sperrevik_permeability_md(0.2, 3000.0, 2000.0)) == pytest.approx(0.012706, abs=5e-7)


def test_manzocchi_hand_worked():
    # Hand-worked [D] from the remembered formula (METHODS.md s.5 [M]):
    # SGR 0.5, D 100 m: log10 k = -4 x 0.5 - 0.25 x 2 x 0.5^5 = -2.015625 -> 0.0096466 mD.
    assert float(manzocchi_permeability_md(0.5, 100.0)) == pytest.approx(0.0096466, abs=5e-8)
    # SGR 0, D 1 m: log10 k = 0 -> 1 mD; the recalled +0.4 variant gives 10^0.4 = 2.51189 mD.
    assert float(manzocchi_permeability_md(0.0, 1.0)) == pytest.approx(1.0, rel=1e-15)
    assert float(manzocchi_permeability_md(0.0, 1.0, offset=0.4)) == pytest.approx(2.51189, abs=5e-6)
    # all-clay fault rock: the displacement term vanishes, log10 k = -4
    np.testing.assert_allclose(manzocchi_permeability_md(1.0, [1.0, 1000.0]), 1e-4, rtol=1e-12)


def test_manzocchi_rejects_percent_input():
    with pytest.raises(SettingsError, match="fraction"):
        manzocchi_permeability_md(35.0, 10.0)
    with pytest.raises(SettingsError, match="displacement"):
        manzocchi_permeability_md(0.3, 0.0)


def test_thickness_ratio():
    # value from memory (METHODS.md s.5 [M]): t_f = D / 66.
    assert float(fault_rock_thickness_m(66.0)) == pytest.approx(1.0, rel=1e-15)
    assert float(fault_rock_thickness_m(100.0, ratio=100.0)) == 1.0


def test_transmissibility_equal_cells():
    # Hand-worked [D] (Manzocchi et al. 1999 form): t_f 1 m, L 100 m, k_m 100 mD, k_f 1 mD:
    # T = 1 / (1 + 0.01 x 99 / 1) = 1 / 1.99 = 0.50251.
    assert float(transmissibility_multiplier(1.0, 1.0, 100.0, 100.0)) == pytest.approx(0.50251, abs=5e-6)
    assert float(transmissibility_multiplier(1.0, 100.0, 100.0, 100.0)) == 1.0  # k_f = k_m
    with pytest.raises(SettingsError):
        transmissibility_multiplier(1.0, 0.0, 100.0, 100.0)


def test_general_form_reduces_to_equal_cells():
    # METHODS.md s.5 [D]: with k_i = k_j = k_m and L_i = L_j = L the general form is the
    # equal-cell form; checked over a spread of values.
    tf = np.array([0.01, 0.5, 2.0])
    kf = np.array([1e-3, 0.5, 20.0])
    km, L = 150.0, 80.0
    np.testing.assert_allclose(
        transmissibility_multiplier_cells(tf, kf, km, km, L, L),
        transmissibility_multiplier(tf, kf, km, L), rtol=1e-12,
    )


def test_permeability_outside_the_fitted_range_is_flagged():
    # Hand-worked from the Sperrevik et al. (2002) form (constants from memory): clay 0.1,
    # z_max = z_f = 353 m: k = 80000 exp(-(1.94 + 1.42259 + (1.9415 - 12.5) 0.9^7))
    # = 80000 exp(1.68762) = 432,479 mD, and 353 m is shallower than
    # the 1.5-5 km the relation was fitted on (from memory): flagged, as is a fault rock
    # more permeable than its 100 mD matrix.
    from logprep.fault.faultrock import calibration_note, sperrevik_permeability_md

    k = float(sperrevik_permeability_md(0.1, 353.0, 353.0))
    expect = 80000 * np.exp(-(19.4 * 0.1 + 0.00403 * 353 + (0.0055 * 353 - 12.5) * 0.9 ** 7))
    assert k == pytest.approx(expect, rel=1e-12) and k > 1e5
    note = calibration_note(0.1, 20.0, 353.0, k, 1.0, 100.0)
    assert "Sperrevik: burial 353 m outside the fitted 1500-5000 m" in note
    assert "above the matrix 100 mD" in note and "Manzocchi" not in note
    assert calibration_note(0.3, 20.0, 2500.0, 0.01, 0.05, 100.0) == ""
    assert "Manzocchi: SGR 0.75" in calibration_note(0.75, 20.0, 2500.0, 1e-4, 1e-4, 100.0)
