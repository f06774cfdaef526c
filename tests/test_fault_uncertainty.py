"""Monte Carlo screening of a fault at its throw: exact at zero spread, an analytic case,
reproducible tables, and the exact contact geometry against independent routes."""

import numpy as np
import pytest

from logprep.fault.capacity import CapacityParams, verdict
from logprep.fault.atthrow import contacts_at_throw, contact_sgr_min_pct, window_sgr_min_pct
from logprep.fault.sensitivity import first_order_index, rank_inputs
from logprep.fault.uncertainty import (
    BaseInputs, FaultCase, Spreads, draw_inputs, draw_throw_m, evaluate_at_throw, fault_realisations,
    percentiles, spreads_from_dict,
)
from logprep.errors import SettingsError
from logprep.fault.juxtaposition import sand_windows, sgr_layered_pct
from logprep.model import Layers
from logprep.run.faults import WellColumnModel, screen_fault, window_uncertainty
from logprep.fault.twowell import two_well_sgr_pct

G = 9.80665


def three_bed_model():
    """Sand A 1000-1020 m (Vsh 0.1), shale 1020-1100 m (0.9), sand B 1100-1200 m (0.1) as
    a 0.1 m GR log (linear IGR between 20 and 120 API): the real clay and blocking chain."""
    depth = 1000.05 + 0.1 * np.arange(2000)
    gr = np.where((depth > 1020) & (depth < 1100), 110.0, 30.0)
    n = depth.size
    return WellColumnModel(depth_m=depth, gr_api=gr, clean_line=np.full(n, 20.0),
                           shale_line=np.full(n, 120.0), gr_for_pct=gr, base_clean=20.0,
                           base_shale=120.0, vsh_nd=np.full(n, np.nan), combine="gr",
                           blocking="cutoff", forced_m=(), changepoint_penalty=2.0)


def three_bed_case(model, **cap):
    L = model.layers(20.0, 120.0, "linear", 0.35, 0.65, 1.0)
    sands = [i for i, x in enumerate(L.lithology) if x == "sand"]
    units = (L.top_m[sands], L.base_m[sands])
    return L, FaultCase(fw_model=model, hw_model=None, shift_m=0.0, units_fw=units, units_hw=units,
                        capacity=CapacityParams(**cap), burial_datum_m=0.0)


def test_three_bed_column_is_blocked_as_built():
    L, _ = three_bed_case(three_bed_model())
    assert L.lithology == ("sand", "shale", "sand")
    np.testing.assert_allclose(L.base_m, [1020, 1100, 1200], atol=1e-9)
    np.testing.assert_allclose(L.vsh, [0.1, 0.9, 0.1], atol=1e-12)


def test_hand_worked_sgr_and_column_at_one_throw():
    # worked by hand: at throw t in (80, 100] sand B (footwall) faces sand A over z in
    # [1100, 1020 + t]; the slipped interval holds 0.1 (t - 80) m of sand clay and 72 m of
    # shale clay, so SGR = 100 (72 + 0.1 (t - 80)) / t = 10 + 6400 / t, constant on the contact
    L, case = three_bed_case(three_bed_model())
    out = evaluate_at_throw(L, L, case, 90.0, clay_fraction=1.0, c_offset=0.0, scale_pct=27.0,
                            burial_offset_m=0.0)
    k = 1 * 2 + 0  # footwall unit B, hanging-wall unit A
    assert out["juxtaposed"][k]
    assert out["sgr_min_pct"][k] == pytest.approx(10 + 6400 / 90, abs=1e-7)
    # constant SGR: the leak point is the contact top; burial 1100 m -> C = 0.5 (Bretan et al. 2003)
    fzp = 10 ** ((10 + 6400 / 90) / 27 - 0.5)
    assert out["fzp_bar"][k] == pytest.approx(fzp, rel=1e-7)
    assert out["column_oil_m"][k] == pytest.approx(fzp * 1e5 / ((1050 - 750) * G), rel=1e-7)
    # a sand against itself: SGR 100 x 0.1 over its own contact
    assert out["sgr_min_pct"][3] == pytest.approx(10.0, abs=1e-9)
    assert not out["juxtaposed"][1]  # a deeper hanging-wall sand never faces a normal fault's footwall


def test_throw_uniform_across_the_column_matches_the_integrated_distribution():
    # throw ~ U(70, 100): juxtaposed when t > 80, so P = 2/3; given juxtaposition t ~ U(80, 100)
    # and SGR = 10 + 6400/t falls with t, so its q-quantile is 10 + 6400 / (100 - 20 q);
    # P(SGR >= 85 | juxtaposed) = P(t <= 6400/75) = (6400/75 - 80) / 20 (all worked by hand)
    model = three_bed_model()
    _, case = three_bed_case(model, leak_below_pct=15.0, seal_from_pct=85.0)
    base = BaseInputs(throw=("uniform", 85.0, 70.0, 100.0), gr_clean=(20.0, 20.0),
                      gr_shale=(120.0, 120.0), transform="linear", sand_cutoff=0.35,
                      shale_cutoff=0.65, min_bed_m=1.0)
    n = 4000
    d = draw_inputs(base, Spreads.zero("linear", realisations=n, draw_throw=True, random_state=7))
    real = fault_realisations(case, d)
    k = 2
    m = real["juxtaposed"][:, k]
    se = np.sqrt(2 / 9 / n)
    assert m.mean() == pytest.approx(2 / 3, abs=4 * se)
    p10, p50, p90 = percentiles(real["sgr_min_pct"], real["juxtaposed"])[:, k]
    for q, got in ((0.1, p10), (0.5, p50), (0.9, p90)):
        want = 10 + 6400 / (100 - 20 * q)
        # quantile standard error sqrt(q(1-q)/n_j) x 20 m x dSGR/dt, about 0.1-0.2 % SGR here
        assert got == pytest.approx(want, abs=0.6), q
    p_seal = (6400 / 75 - 80) / 20
    assert real["seal"][m, k].mean() == pytest.approx(p_seal, abs=4 * np.sqrt(p_seal * (1 - p_seal) / m.sum()))


def test_throw_distributions_by_inverse_cdf():
    u = np.array([0.0, 0.25, 0.5, 0.75, 1.0])
    np.testing.assert_allclose(draw_throw_m(u, "uniform", 40, 30, 50), [30, 35, 40, 45, 50])
    # triangular (30, 40, 60): F(40) = 1/3; median where (60 - t)^2 = 0.5 x 30 x 20
    tri = draw_throw_m(np.array([1 / 3, 0.5]), "triangular", 40, 30, 60)
    np.testing.assert_allclose(tri, [40.0, 60 - np.sqrt(300.0)])
    # normal: low and high are the P10 and P90
    np.testing.assert_allclose(draw_throw_m(np.array([0.1, 0.5, 0.9]), "normal", 40, 30, 50), [30, 40, 50])
    assert np.all(draw_throw_m(u[1:4], "fixed", 40, 30, 50) == 40)


# ----------------------------------------------------------------------------- bundled wells
@pytest.fixture(scope="module")
def harrowmere(example_dir):
    from logprep.run.pipeline import ScreenSettings, screen_file

    s = ScreenSettings(tops_file=str(example_dir / "tops.csv"))
    return s, screen_file(example_dir / "HRM-2.las", s), screen_file(example_dir / "HRM-3.las", s)


def _spec(two_wells=True, **kw):
    from logprep.io.faults import FaultSpec

    base = dict(name="F1", footwall="HRM-2", throw_m=40.0, throw_low_m=30.0, throw_high_m=55.0,
                throw_dist="triangular")
    if two_wells:
        base.update(hangingwall="HRM-3", marker="Kellan Marker")
    return FaultSpec(**(base | kw))


@pytest.mark.parametrize("two_wells", [True, False])
def test_zero_spread_equals_the_deterministic_screening_exactly(harrowmere, two_wells):
    s, fw, hw = harrowmere
    res = screen_fault(_spec(two_wells), fw, hw if two_wells else None, s,
                       Spreads.zero(s.transform, realisations=4))
    t = res.table
    assert len(t) and t["juxtaposed_base"].all()
    for q in (10, 50, 90):
        assert np.array_equal(t[f"sgr_min_pct_p{q}"].to_numpy(), t["sgr_min_pct_base"].to_numpy())
        assert np.array_equal(t[f"column_oil_m_p{q}"].to_numpy(),
                              res.base["column_oil_m"][list(res.pair_index)])
    assert (t["p_juxtaposed"] == 1.0).all()
    assert np.array_equal(t["p_seal"].to_numpy() == 1.0, (t["verdict_base"] == "seal").to_numpy())
    # every realisation is the deterministic screening, bit for bit
    for key, arr in res.realisations.items():
        assert np.array_equal(arr, np.broadcast_to(res.base[key], arr.shape), equal_nan=True), key


def test_zero_spread_window_uncertainty_equals_juxtapositions_csv(harrowmere):
    s, fw, _ = harrowmere
    u = window_uncertainty(fw, Spreads.zero(s.transform, realisations=3))
    for q in (10, 50, 90):
        assert np.array_equal(u[f"sgr_min_pct_p{q}"].to_numpy(), fw.windows["sgr_min_pct"].to_numpy())
    assert (u["p_juxtaposed"] == 1).all()
    cross = ~fw.windows["self_juxtaposed"].to_numpy(bool)  # a sand against itself: verdict "self"
    assert np.array_equal((u["p_seal"].to_numpy() == 1)[cross], (fw.windows["verdict"] == "seal").to_numpy()[cross])


def test_percentiles_are_ordered_and_a_fixed_random_state_gives_identical_tables(harrowmere):
    s, fw, hw = harrowmere
    sp = Spreads(realisations=60, random_state=11)
    a = screen_fault(_spec(), fw, hw, s, sp).table
    b = screen_fault(_spec(), fw, hw, s, sp).table
    c = screen_fault(_spec(), fw, hw, s, sp.updated(random_state=12)).table
    assert a.to_csv(index=False).encode() == b.to_csv(index=False).encode()
    assert a.to_csv(index=False) != c.to_csv(index=False)
    for name in ["sgr_min_pct", "fzp_bar", "column_oil_m", "column_gas_m", "column_co2_m"]:
        p10, p50, p90 = (a[f"{name}_p{q}"].to_numpy() for q in (10, 50, 90))
        assert np.all(p10 <= p50) and np.all(p50 <= p90), name
    assert a["p_seal"].between(0, 1).all() and a["p_juxtaposed"].between(0, 1).all()
    assert a["main_driver"].str.len().gt(0).any()


# ----------------------------------------------------------------------------- geometry
def random_column(rng, n=12, top=2000.0):
    thick = rng.uniform(1.0, 25.0, n)
    edges = top + np.concatenate(([0.0], np.cumsum(thick)))
    lith = rng.choice(["sand", "heterolith", "shale"], n, p=[0.45, 0.2, 0.35])
    vsh = np.where(lith == "sand", rng.uniform(0, 0.3, n),
                   np.where(lith == "shale", rng.uniform(0.7, 1, n), rng.uniform(0.35, 0.65, n)))
    return Layers(top_m=edges[:-1], base_m=edges[1:], vsh=vsh, lithology=tuple(lith))


@pytest.mark.parametrize("k", range(6))
def test_vectorised_window_minimum_equals_sand_windows(k):
    L = random_column(np.random.default_rng(100 + k))
    F, H, smin = window_sgr_min_pct(L, 80.0)
    w = sand_windows(L, 80.0)
    assert list(zip(F, H)) == list(zip(w["footwall_layer"], w["hangingwall_layer"]))
    np.testing.assert_array_equal(smin, w["sgr_min_pct"].to_numpy())


@pytest.mark.parametrize("k", range(4))
def test_contact_minimum_against_dense_sampling_one_and_two_wells(k):
    rng = np.random.default_rng(200 + k)
    fw, hw = random_column(rng), random_column(rng, top=2150.0)
    t = float(rng.uniform(5, 60))
    for a, b, shift, src in ((fw, fw, 0.0, "footwall"), (fw, hw, 150.0, "footwall"),
                             (fw, hw, 150.0, "hangingwall"), (fw, hw, 150.0, "average")):
        c = contacts_at_throw(a, b, shift, t, slip_source=src)
        smin = contact_sgr_min_pct(c)
        for i in range(len(c)):
            z = np.linspace(c.top_m[i], c.base_m[i], 4001)
            if a is b:
                dense = sgr_layered_pct(a, z, t)
            else:
                dense = two_well_sgr_pct(a, b, shift, z, t, src)
            if np.isfinite(dense).all():
                # the exact minimum is at a kink; dense sampling may only approach it from above
                assert smin[i] <= np.min(dense) + 1e-9
                assert smin[i] >= np.min(dense) - 0.05


# ----------------------------------------------------------------------------- sensitivity, settings
def test_first_order_index_on_the_ishigami_function():
    # Ishigami & Homma (1990), a = 7, b = 0.1, inputs U(-pi, pi); analytic first-order
    # indices (Saltelli et al. 2008, from memory): V1 = 0.5 (1 + b pi^4 / 5)^2, V2 = a^2 / 8,
    # V3 = 0, V = a^2/8 + b pi^4/5 + b^2 pi^8/18 + 1/2 -> S1 = 0.3139, S2 = 0.4424, S3 = 0
    a, b = 7.0, 0.1
    rng = np.random.default_rng(5)
    x = rng.uniform(-np.pi, np.pi, (3, 60000))
    y = np.sin(x[0]) + a * np.sin(x[1]) ** 2 + b * x[2] ** 4 * np.sin(x[0])
    v = a ** 2 / 8 + b * np.pi ** 4 / 5 + b ** 2 * np.pi ** 8 / 18 + 0.5
    want = [0.5 * (1 + b * np.pi ** 4 / 5) ** 2 / v, a ** 2 / 8 / v, 0.0]
    got = [first_order_index(xi, y, bins=30) for xi in x]
    np.testing.assert_allclose(got, want, atol=0.02)
    assert [k for k, _ in rank_inputs({"x1": x[0], "x2": x[1], "x3": x[2]}, y, bins=30)] == ["x2", "x1", "x3"]
    assert np.isnan(first_order_index(x[0], np.ones(60000)))


def test_spreads_from_the_settings_file_table():
    sp = spreads_from_dict({"realisations": 50, "burial_spread_m": 0, "transform_weights": {"linear": 2, "stieber": 1}})
    assert sp.realisations == 50 and sp.burial_spread_m == 0
    assert sp.transform_weights == (("linear", 2.0), ("stieber", 1.0))
    with pytest.raises(SettingsError, match=r"unknown key \[uncertainty\] 'burial_sd'"):
        spreads_from_dict({"burial_sd": 3})
    with pytest.raises(SettingsError, match="must be a finite number >= 0"):
        Spreads(sand_cutoff_spread=-0.1)
    with pytest.raises(SettingsError, match="transform_weights"):
        Spreads(transform_weights={"linear": 0})


def test_draws_of_one_input_do_not_depend_on_another_spread():
    base = BaseInputs(throw=("uniform", 40.0, 30.0, 50.0), gr_clean=("p5", "p5"), gr_shale=("p95", "p95"),
                      transform="linear", sand_cutoff=0.35, shale_cutoff=0.65, min_bed_m=1.0)
    a = draw_inputs(base, Spreads(realisations=50))
    b = draw_inputs(base, Spreads(realisations=50, burial_spread_m=0.0, sand_cutoff_spread=0.0))
    assert np.array_equal(a["throw_m"], b["throw_m"]) and np.array_equal(a["gr_clean_fw"], b["gr_clean_fw"])
    assert (b["sand_cutoff"] == 0.35).all() and (b["burial_offset_m"] == 0).all()
    assert verdict(np.array([20.0]), 15, 20)[0] == "seal"


def test_an_all_shale_column_has_no_pairs_and_no_error():
    from dataclasses import replace

    model = replace(three_bed_model(), gr_api=np.full(2000, 110.0))
    empty = (np.array([]), np.array([]))
    case = FaultCase(fw_model=model, hw_model=None, shift_m=0.0, units_fw=empty, units_hw=empty)
    base = BaseInputs(throw=("uniform", 85.0, 70.0, 100.0), gr_clean=(20.0, 20.0), gr_shale=(120.0, 120.0),
                      transform="linear", sand_cutoff=0.35, shale_cutoff=0.65, min_bed_m=1.0)
    real = fault_realisations(case, draw_inputs(base, Spreads(realisations=5)))
    assert real["juxtaposed"].shape == (5, 0)
    assert percentiles(real["sgr_min_pct"], real["juxtaposed"]).shape == (3, 0)
