"""Every error logprep can raise says ``what is wrong; what to do``.

The raise sites of the error family (:class:`logprep.errors.LogprepError` and its
subclasses, and the small functions that build one) are found by reading logprep's own
source (``ast``).  Each must carry the fix after ``"; "`` in its text (a re-raise that only
puts the file name in front of an error checked at its own site is exempt), and each must
be reached by one of the cases below, which provoke the real error through the public
functions, settings, readers and input files and check both parts of the message.  A new
raise site without a case fails :func:`test_every_raise_site_has_a_case`; add a case to
:func:`cases` (or, for a site no input can reach, a reason to :data:`NOT_REACHABLE`).

Behaviour checks of the error contract (common practice, no source); no science values.
"""

from __future__ import annotations

import ast
import importlib
import pkgutil
import sys
import time
from functools import cache
from pathlib import Path

import numpy as np
import pytest

import logprep
from logprep.errors import LogprepError

ROOT = Path(logprep.__file__).parent
HOSTILE = Path(__file__).parent / "data" / "hostile"

NOT_REACHABLE = {
    # "path::function": why no test input reaches it (each a guard against a race or a
    # missing optional package, tested where that package is)
    "io/lastext.py::check_file#cannot be read": "stat() failing right after exists() "
    "succeeded: only a race or a permission change between the two calls",
    "run/dask_runner.py::_distributed": "Dask missing; tests/test_dask.py runs where it is installed",
    "run/dask_runner.py::dask_client": "needs a Dask scheduler address that refuses (15 s timeout)",
    "run/dask_runner.py::run_on_dask": "needs a Dask cluster that goes away during a run",
    "fault/envelope.py::co2_density_kgm3": "CoolProp missing; the test extra installs it",
}


# ----------------------------------------------------------------------------- the sites
@cache
def family_names() -> frozenset[str]:
    """Names of every class of the error family, with every module of logprep imported."""
    for mod in pkgutil.walk_packages([str(ROOT)], "logprep."):
        if not mod.name.startswith("logprep.example_logs"):
            importlib.import_module(mod.name)

    def subclasses(c):
        for s in c.__subclasses__():
            yield s
            yield from subclasses(s)

    return frozenset({"LogprepError"} | {c.__name__ for c in subclasses(LogprepError)})


def _builders(tree: ast.Module, family: frozenset[str]) -> set[str]:
    """Functions that return an error of the family, and parameters typed as one."""
    names = set()
    for fn in ast.walk(tree):
        if isinstance(fn, ast.FunctionDef):
            for r in ast.walk(fn):
                if isinstance(r, ast.Return) and isinstance(r.value, ast.Call) \
                        and getattr(r.value.func, "id", None) in family:
                    names.add(fn.name)
            for a in fn.args.args + fn.args.kwonlyargs:
                if a.annotation is not None and "LogprepError" in ast.unparse(a.annotation):
                    names.add(a.arg)
    return names


def _text(arg: ast.expr | None) -> str:
    if arg is None:
        return ""
    return "".join(v.value for v in ast.walk(arg) if isinstance(v, ast.Constant) and isinstance(v.value, str))


@cache
def raise_sites() -> dict[tuple[str, int, int], tuple[str, str, str]]:
    """``(module path, first line, last line) -> (function, text, kind, piece)`` of every
    raise of the family; kind ``wrap`` for ``f"{where}: {exc}"`` re-raises, ``name`` for a
    message held in a variable, else ``text``; ``piece`` the longest literal part."""
    family = family_names()
    sites = {}
    for path in sorted(ROOT.rglob("*.py")):
        rel = path.relative_to(ROOT).as_posix()
        tree = ast.parse(path.read_text(encoding="utf-8"))
        makers = family | _builders(tree, family)
        for fn in ast.walk(tree):
            if not isinstance(fn, ast.FunctionDef):
                continue
            for node in ast.walk(fn):
                if not (isinstance(node, ast.Raise) and isinstance(node.exc, ast.Call)):
                    continue
                f = node.exc.func
                if (getattr(f, "id", None) or getattr(f, "attr", None)) not in makers:
                    continue
                arg = node.exc.args[0] if node.exc.args else None
                text = _text(arg)
                kind = "name" if isinstance(arg, ast.Name) else \
                    "wrap" if isinstance(arg, ast.JoinedStr) and text.strip(": ") == "" else "text"
                pieces = [v.value for v in ast.walk(arg) if isinstance(v, ast.Constant)
                          and isinstance(v.value, str)] if arg is not None else []
                key = (rel, node.lineno, node.end_lineno)
                if key not in sites or fn.lineno > sites[key][4]:  # the innermost function
                    sites[key] = (fn.name, text, kind, max(pieces, key=len, default=""), fn.lineno)
    return {k: v[:4] for k, v in sites.items()}


def site_label(key) -> str:
    rel, _, _ = key
    fn = raise_sites()[key][0]
    return f"{rel}::{fn}"


def test_raise_sites_are_found():
    # the scan sees the whole family: well over a hundred sites across the stages
    sites = raise_sites()
    modules = {k[0].split("/")[0] for k in sites}
    assert len(sites) > 150 and {"io", "clay", "layers", "fault", "run", "cli.py"} <= modules


def test_every_raise_site_states_the_fix():
    bad = [f"{k[0]}:{k[1]}: {t}" for k, (_, t, kind, _) in raise_sites().items()
           if kind == "text" and "; " not in t]
    assert not bad, "\n".join(bad)


# ----------------------------------------------------------------------------- the cases
def _write(tmp: Path, name: str, text: str | bytes) -> Path:
    p = tmp / name
    p.parent.mkdir(parents=True, exist_ok=True)
    p.write_bytes(text if isinstance(text, bytes) else text.encode("utf-8"))
    return p


def cases(tmp: Path) -> list:
    """Callables, each expected to raise an error of the family."""
    from logprep.changepoint import pelt_mean_breaks
    from logprep.clay import endpoints, holecheck, qc, sonicdensity, vshale
    from logprep.fault import burial, capacity, clayfraction, closure, co2, envelope, faultrock, geometry, sgr
    from logprep.fault import twowell, uncertainty
    from logprep.io import csvtable, descriptions, faults, las, locations, sanity, survey, tops
    from logprep.layers import blocking
    from logprep.report import writers
    from logprep.run import batch, config, contain, executor, fault_batch, manifest, pairs, scan, store, tune
    from logprep.run.settings import ScreenSettings
    from logprep import units

    sys.path.insert(0, str(HOSTILE))
    import make_hostile

    good = _write(tmp, "good/W-1.las", make_hostile.las2(well="W-1"))
    good2 = _write(tmp, "good/W-2.las", make_hostile.las2(well="W-2"))
    a_file = _write(tmp, "a_file.txt", "x")
    z = np.linspace(1000.0, 1010.0, 21)
    out: list = []
    add = out.append

    # settings: every field of every group with values out of range, of the wrong kind,
    # non-finite, unknown names (the checks of each group's __post_init__)
    from dataclasses import fields

    from logprep.run.settings import GROUPS

    for f in (f for cls in GROUPS.values() for f in fields(cls)):
        kind = str(f.type)
        if "bool" in kind:
            continue
        bad = (["x,y", (1.0, 0.0), (5.0,)] if "tuple" in kind else ["no-such-choice"] if "str" in kind
               else [-1e9, -1.0, 0.0, 1.5, 95.0, 1e9, float("nan")])
        name = f.name
        for v in bad:
            add(lambda n=name, v=v: ScreenSettings(**{n: v}))
    add(lambda: ScreenSettings(sgr_threshold_pct=20, sgr_leak_pct=30))
    add(lambda: ScreenSettings(water_depth_m=10, ground_elevation_m=5))
    add(lambda: ScreenSettings(zone_min_mm=3))
    add(lambda: ScreenSettings(clay=ScreenSettings().layers))
    add(lambda: ScreenSettings(calibration_contact_deg=95))
    add(lambda: ScreenSettings(oil_density_kgm3=1200))
    add(lambda: ScreenSettings(gr_clean="p120"))
    add(lambda: ScreenSettings(gr_clean="clean"))
    add(lambda: ScreenSettings(gr_clean=150, gr_shale=100).clay and vshale.gamma_ray_index([1.0], 150, 100))
    add(lambda: vshale.gamma_ray_index([1.0], float("nan"), 100))
    # Monte Carlo spreads and their table in a settings file
    for kw in ({"realisations": 0}, {"random_state": -1}, {"gr_clean_spread_api": -1.0},
               {"transform_weights": {"linear": 0}}, {"min_bed_spread_frac": 2.0}):
        add(lambda kw=kw: uncertainty.Spreads(**kw))
    for table in ({"nope": 1}, {"transform_weights": 1}, {"realisations": 1.5},
                  {"draw_throw": "yes"}, {"gr_clean_spread_api": "x"}, {"realisations": 0}):
        add(lambda t=table: uncertainty.spreads_from_dict(t, "s.toml"))
    add(lambda: uncertainty.draw_throw_m([0.5], "lognormal", 10.0, 5.0, 20.0))

    # science functions called with impossible arguments (the guards of the public API)
    add(lambda: pelt_mean_breaks(np.zeros(10), penalty=-1))
    add(lambda: endpoints.zone_bounds(z, np.zeros(z.size), zoning="no-such"))
    add(lambda: endpoints.pick_endpoints(z, np.zeros(z.size), [], one_sided="no-such"))
    add(lambda: endpoints.pick_endpoints(z, np.full(z.size, np.nan), []))
    add(lambda: endpoints.pick_endpoints(z, np.linspace(0, 100, z.size), [], clean=90.0, shale=10.0))
    add(lambda: holecheck.bad_hole_flags([9.0], [8.5], limit_in=0))
    add(lambda: holecheck.long_gap_flags(z, np.zeros(z.size, bool), limit_m=-1))
    add(lambda: qc.inches([8.5], "furlong"))
    add(lambda: vshale.get_transform("no-such"))
    add(lambda: vshale.get_combination("no-such"))
    add(lambda: vshale.resolve_endpoint("p5", np.array([])))
    add(lambda: vshale.density_porosity([2.3], 1.0, 2.0))
    add(lambda: vshale.vsh_neutron_density([0.3], [0.2], 0.0))
    add(lambda: sonicdensity.sonic_porosity([90.0], 189.0, 55.5))
    add(lambda: sonicdensity.vsh_sonic_density([0.1], 0.0))
    add(lambda: vshale.density_g_cm3([2300.0], "stone"))
    add(lambda: units.length(1.0, "league", "m"))
    add(lambda: burial.surface_elevation_m(water_depth_m=10, ground_elevation_m=5))
    add(lambda: burial.surface_elevation_m(water_depth_m=-10))
    add(lambda: burial.burial_depth_m([1000.0], uplift_m=-1))
    add(lambda: clayfraction.check_shale_clay_fraction(0))
    add(lambda: clayfraction.get_clay_conversion("no-such"))
    add(lambda: closure.check_closure(-1, 100))
    add(lambda: closure.check_closure(None, 0))
    add(lambda: co2.co2_pressure_factor(calibration_ift_mn_m=0))
    add(lambda: co2.co2_pressure_factor(co2_contact_deg=95))
    add(lambda: envelope.envelope_c([1000.0], (3000.0,), (0.5,)))
    add(lambda: faultrock.manzocchi_permeability_md([0.2], [0.0]))
    add(lambda: faultrock.manzocchi_permeability_md([1.5], [10.0]))
    add(lambda: faultrock.transmissibility_multiplier(1.0, 1.0, 0.0, 1.0))
    add(lambda: geometry.check_fault_dip(0))
    add(lambda: geometry.csp_factor(60.0, 95.0))
    add(lambda: sgr.cumulative_clay_curve(z, np.full(z.size, np.nan)))
    add(lambda: sgr.node_step_m(np.array([1000.0])))
    add(lambda: sgr.throw_axis_m(10.0, 0.0))
    add(lambda: sgr.layered_or_curve_clay("no-such", None, None, None))
    add(lambda: sgr.sgr_field(None, np.linspace(0, 5000, 200001), None, throw_max_m=5000,
                              throw_step_m=0.01))
    add(lambda: capacity.seal_capacity_table(None, None, capacity.CapacityParams(), length_unit="league"))
    add(lambda: capacity._co2_density(None, capacity.CapacityParams(co2_density_mode="no-such"), 0.0, 0.0))
    add(lambda: blocking.check_cutoffs(0.6, 0.4))
    add(lambda: blocking.block_cutoff(z, np.zeros(z.size), sand_cutoff=0.3, shale_cutoff=0.6, min_bed_m=-1))
    add(lambda: blocking.block_cutoff(z, np.zeros(3), sand_cutoff=0.3, shale_cutoff=0.6, min_bed_m=1))
    add(lambda: blocking.block_cutoff(z, np.full(z.size, np.nan), sand_cutoff=0.3, shale_cutoff=0.6, min_bed_m=1))
    add(lambda: blocking.block_cutoff(z, np.zeros(z.size), sand_cutoff=0.3, shale_cutoff=0.6, min_bed_m=1,
                                      edges_m=z))
    add(lambda: blocking.block_changepoint(z, np.zeros(z.size), sand_cutoff=0.3, shale_cutoff=0.6,
                                           min_bed_m=1, changepoint_penalty=-1))
    add(lambda: blocking.get_blocking_method("no-such"))
    add(lambda: twowell.check_hanging_wall_down(-5.0, "A", "B"))
    add(lambda: twowell.two_well_sgr_pct(None, None, 0.0, z, np.zeros(1), "no-such"))
    import pandas as pd

    no_tops = pd.DataFrame({"name": ["Other"], "top_m": [1000.0]})
    add(lambda: twowell.marker_shift_m(no_tops, no_tops, "Kellan"))

    # well files: the hostile corpus (each bad file read and screened) and a few more
    from logprep.run.pipeline import screen_well

    make_hostile.build_cases()
    for name, (status, _, _) in make_hostile.CASES.items():
        if status == "error":
            add(lambda p=HOSTILE / name: screen_well(las.read_well(p)))
    add(lambda: las.read_well(tmp / "missing.las"))
    add(lambda: las.read_well(a_file / "x.las"))
    add(lambda: las.read_well(tmp))
    add(lambda: las.read_well(good, gr_curve="NOPE"))
    big = tmp / "huge.las"
    with big.open("wb") as f:  # sparse: no space taken
        f.truncate(2 * 1024**3 + 1)
    add(lambda: las.read_well(big))
    from logprep.io.lastext import HEAD_BYTES

    tail = _write(tmp, "nul_tail.las", b"~Version\n#" + b"-" * HEAD_BYTES + b"\n")
    with tail.open("r+b") as f:  # text over the first bytes read, then zeros (sparse)
        f.truncate(3 * HEAD_BYTES)
    add(lambda: las.read_well(tail))
    one = make_hostile.las2([(1000.0, 50.0), (1000.5, -999.25), (1001.0, -999.25)], well="W-4")
    add(lambda: screen_well(las.read_well(_write(tmp, "one_gr.las", one))))
    add(lambda: sanity.check_depth_range(np.broadcast_to(np.float64(1000.0), (sanity.MAX_SAMPLES + 1,))))

    # side inputs: tops, surveys, pairs, faults, locations, descriptions, settings files
    csv = {
        "tops_nocol.csv": "well,depth\nW-1,1000\n", "tops_nan.csv": "well,top_m,name\nW-1,x,A\n",
        "tops_empty.csv": "", "tops_bad.csv": 'well,top_m,name\n"W-1,1000\n',
    }
    for name, text in csv.items():
        add(lambda p=_write(tmp, name, text): tops.read_tops(p))
    add(lambda: tops.read_tops(_write(tmp, "markers.txt", "1000\tA\nnot-a-depth\n")))
    add(lambda: tops.read_tops(tmp / "no_tops.csv"))
    (tmp / "empty_dir").mkdir()
    add(lambda: tops.read_tops(tmp / "empty_dir"))
    add(lambda: csvtable.read_csv_table(tmp / "empty_dir", tops.TopsError, "tops CSV", "--tops"))
    for name, text in {"s_cols.csv": "md,inc\n1,2\n", "s_nan.csv": "md_m,inc_deg,azi_deg\n0,x,0\n10,0,0\n",
                       "s_one.csv": "md_m,inc_deg,azi_deg\n0,0,0\n", "s_back.csv": "md_m,inc_deg,azi_deg\n10,0,0\n0,0,0\n",
                       "s_inc.csv": "md_m,inc_deg,azi_deg\n0,0,0\n10,200,0\n"}.items():
        add(lambda p=_write(tmp, name, text): survey.read_survey(p))
    add(lambda: survey.check_survey_dir(a_file))
    add(lambda: survey.read_survey(tmp / "no_survey.csv"))
    add(lambda: survey.true_stratigraphic_thickness_m(z, 95.0))
    add(lambda: survey.well_to_tvd(las.read_well(good), np.array([0.0, 900.0, 1005.0, 1200.0]),
                                   np.array([0.0, 0.0, 120.0, 120.0]), np.zeros(4), "W-1.csv"))
    for name, text in {"p_cols.csv": "a,b\n1,2\n", "p_name.csv": "footwall,hangingwall,shift_m\nA,,5\n",
                       "p_tie.csv": "footwall,hangingwall,marker,shift_m\nA,B,,\n",
                       "p_nan.csv": "footwall,hangingwall,shift_m\nA,B,nan\n"}.items():
        add(lambda p=_write(tmp, name, text): pairs.read_pairs(p))
    add(lambda: pairs._find("NOPE", [good], {}))
    add(lambda: pairs._screen_pair(ScreenSettings(), None, None, {"marker": "Kellan", "footwall": "W-1",
                                                                  "hangingwall": "W-1"},
                                   (str(good), str(good)), (str(good), str(good))))
    head = "name,footwall,hangingwall,throw_m,throw_low_m,throw_high_m,throw_dist,fault_dip_deg,closure_m,marker,shift_m\n"
    for k, row in enumerate(["F,W-1,,x,,,,,,,", "F,W-1,,inf,,,,,,,", "F,W-1,,-5,,,,,,,", "F,W-1,,10,5,,,,,,",
                             "F,W-1,,10,12,20,,,,,", "F,W-1,,10,5,20,gamma,,,,", "F,W-1,,10,,,uniform,,,,",
                             "F,W-1,,10,10,10,normal,,,,", "F,W-1,,10,,,,95,,,", "F,W-1,,10,,,,,-1,,",
                             "F,W-1,,10,,,,,,Kellan,", "F,W-1,W-2,10,,,,,,,", ",W-1,,10,,,,,,,",
                             "F,W-1,,10,,,,,,,\nF,W-1,,12,,,,,,,"]):
        add(lambda p=_write(tmp, f"faults{k}.csv", head + row + "\n"): faults.read_faults(p))
    add(lambda: faults.read_faults(_write(tmp, "f_col.csv", "name,footwall,throw_m,colour\nF,W-1,10,red\n")))
    add(lambda: faults.read_faults(_write(tmp, "f_none.csv", "name,footwall,throw_m\n")))
    add(lambda: faults.read_faults(tmp / "f_missing.csv"))
    add(lambda: faults.read_faults(_write(tmp, "f_bad.toml", "[[fault]\n")))
    add(lambda: faults.read_faults(_write(tmp, "f_other.toml", "[well]\nname = 1\n")))
    add(lambda: faults.read_faults(_write(tmp, "f_enc.toml", b"\xff\xfe\x00[")))
    add(lambda: faults.read_faults(_write(tmp, "f_bool.toml", "[[fault]]\nname = 'F'\nfootwall = 'W-1'\n"
                                          "throw_m = true\n")))
    spec = faults.read_faults(_write(tmp, "f_ok.csv", "name,footwall,throw_m,marker,hangingwall\n"
                                     "F,W-1,10,Kellan,W-2\n"))[0]
    add(lambda: fault_batch._find("NOPE", [good], {}, spec))
    add(lambda: fault_batch.screen_faults([good, good2], tmp / "f_ok.csv", ScreenSettings(),
                                          on_error=_raise))
    add(lambda: locations.read_locations(_write(tmp, "loc_cols.csv", "well,east\nW-1,5\n")))
    add(lambda: locations.read_locations(_write(tmp, "loc_bad.csv", "well,x,y\nW-1,a,b\n")))
    for name, text in {"d_cols.csv": "top_m,lithology\n1,sand\n", "d_nan.csv": "top_m,base_m,lithology\nx,2,sand\n",
                       "d_order.csv": "top_m,base_m,lithology\n5,2,sand\n"}.items():
        add(lambda p=_write(tmp, name, text): descriptions.read_descriptions(p))
    toml = {
        "c_bad.toml": "zone_min_m = \n", "c_group.toml": "[clay]\nsand_cutoff = 0.3\n",
        "c_unknown.toml": "[clay]\nzone_minn_m = 3\n", "c_twice.toml": "sand_cutoff = 0.3\n[layers]\nsand_cutoff = 0.3\n",
        "c_twice2.toml": "[layers]\nsand_cutoff = 0.3\n[layers2]\n", "c_tune.toml": "[tune]\nnope = [1]\n",
        "c_tune2.toml": "[tune]\nsand_sweep = true\n", "c_key.toml": "nope = 1\n",
        "c_type.toml": "zone_min_m = 'x'\n", "c_enc.toml": b"\xff\xfe zone_min_m = 3",
    }
    for name, text in toml.items():
        add(lambda p=_write(tmp, name, text): config.read_config(p))
    add(lambda: config.parse_settings_dict({"layers": {"sand_cutoff": 0.3}, "sand_cutoff": 0.3}))
    add(lambda: config.read_config(tmp / "c_missing.toml"))
    add(lambda: config.read_uncertainty(_write(tmp, "u_bad.toml", "[uncertainty\n")))
    add(lambda: config.read_uncertainty(_write(tmp, "u_type.toml", "uncertainty = 3\n")))

    # the batch, its output and its options
    add(lambda: scan.scan_las_files([tmp / "nowhere"]))
    add(lambda: batch.screen_paths([tmp / "empty_dir"], tmp / "o1"))
    add(lambda: batch.screen_paths([good], tmp / "o2", jobs=0))
    add(lambda: executor.Backend(jobs=0))
    add(lambda: executor.Backend(dask_local=0))
    add(lambda: executor.Backend(scheduler="tcp://x:1", dask_local=2))
    add(lambda: writers.write_bytes_atomic(a_file / "x.csv", b"x"))
    add(lambda: writers.prepare_out_dir(a_file))
    add(lambda: writers.prepare_out_dir(a_file / "sub"))
    add(lambda: store.write_file_atomic(a_file / "x.csv", b"x"))
    add(lambda: store.commit_folder(a_file, "W-1", {"x": b"x"}))
    add(lambda: manifest.Manifest(a_file).drop("W") or manifest.Manifest(a_file)._append({}))

    def stalled():
        with contain.time_limit(0.05, "W-1.las"):
            time.sleep(2)

    add(stalled)
    for text in ("0.2:0.1:0.1", "a:b:c", "0:1:0.001", "a,b", "", "0.1,inf",
                 ",".join(str(i / 1000) for i in range(300))):
        add(lambda t=text: tune.parse_values(t, "sand cut-offs"))
    from logprep.run.pipeline import screen_file

    screened = screen_file(good)
    add(lambda: tune.sweep_screening(screened, sand_cutoffs="-1", shale_cutoffs="0.6", min_beds_m="1"))
    add(lambda: tune.sweep_screening(screened, sand_cutoffs="0.7", shale_cutoffs="0.6", min_beds_m="1"))
    add(lambda: tune.rock_reference(screened, _write(tmp, "d_ok.csv", "well,top_m,base_m,lithology\n"
                                                                      "OTHER,1,2,sand\n")))
    add(lambda: tune.rock_reference(screened, label_curve="NOPE"))

    # the closures file (closure per well) and a pair's closure
    from logprep.io import closures

    for name, text in {"k_neg.csv": "well,closure_m\nW-1,-40\n", "k_nan.csv": "well,closure_m\nW-1,tall\n",
                       "k_twice.csv": "well,closure_m\nW-1,100\nW 1,200\n",
                       "k_cols.csv": "well,height\nW-1,100\n", "k_name.csv": "well,closure_m\n,100\n"}.items():
        add(lambda p=_write(tmp, name, text): closures.read_closures(p))
    add(lambda: pairs.read_pairs(_write(tmp, "p_closure.csv", "footwall,hangingwall,shift_m,closure_m\nA,B,20,0\n")))

    # the command line
    from logprep.cli import build_parser

    add(lambda: (lambda a: a.func(a))(build_parser().parse_args(["overview", str(tmp / "empty_dir")])))
    return out


def _raise(msg: str):
    raise LogprepError(msg)  # a reported failure, raised again so the case can check it


def _raised_at(exc: BaseException) -> list[tuple[str, int]]:
    """The (module path, line) where ``exc`` and the errors it was raised from were raised."""
    where = []
    seen = set()
    while exc is not None and id(exc) not in seen:
        seen.add(id(exc))
        tb = exc.__traceback__
        last = None
        while tb is not None:
            f = Path(tb.tb_frame.f_code.co_filename)
            if ROOT in f.parents:
                last = (f.relative_to(ROOT).as_posix(), tb.tb_lineno)
            tb = tb.tb_next
        if last and isinstance(exc, LogprepError):
            where.append(last)
        exc = exc.__cause__ or exc.__context__
    return where


@pytest.fixture(scope="module")
def provoked(tmp_path_factory):
    """Every case run once: the errors it raised, and the raise sites they reached."""
    tmp = tmp_path_factory.mktemp("every_error")
    errors, hit = [], set()
    sites = raise_sites()
    for k, fn in enumerate(cases(tmp)):
        try:
            fn()
        except LogprepError as exc:
            errors.append((k, exc))
            for rel, line in _raised_at(exc):
                hit |= {key for key in sites if key[0] == rel and key[1] <= line <= key[2]}
            # an error reported rather than raised (a batch goes on) is found by its text
            hit |= {key for key, v in sites.items() if len(v[3]) >= 20 and v[3] in str(exc)}
        except Exception:  # noqa: BLE001 - a settings value that is fine raises nothing
            raise
    return errors, hit


def test_every_error_provoked_says_what_and_what_to_do(provoked):
    errors, _ = provoked
    assert len(errors) > 200
    for k, exc in errors:
        msg = str(exc)
        what, sep, todo = msg.partition("; ")
        assert sep and what.strip() and len(todo.strip()) >= 8, f"case {k}: {msg}"
        assert "\n" not in msg and "Traceback" not in msg, f"case {k}: {msg}"


def test_every_raise_site_has_a_case(provoked):
    _, hit = provoked
    missing = []
    for key, (fn, text, _, _) in sorted(raise_sites().items()):
        label = site_label(key)
        if key in hit or label in NOT_REACHABLE or any(
                k.startswith(label + "#") and k.split("#", 1)[1] in text for k in NOT_REACHABLE):
            continue
        missing.append(f"{key[0]}:{key[1]} ({fn}): {text[:70]}")
    assert not missing, "raise sites no case reaches:\n" + "\n".join(missing)


def test_not_reachable_names_real_sites():
    labels = {site_label(k) for k in raise_sites()}
    for label in NOT_REACHABLE:
        assert label.split("#")[0] in labels, label


@pytest.mark.parametrize("argv", [
    ["screen", "--zone-min", "x"], ["screen", "--transform", "nope"], ["nope"],
    ["tune"], ["screen", "--no-such-option"],
])
def test_command_line_usage_errors_say_what_to_do(argv, capsys):
    # argparse's own refusals (exit status 2) end with where to look, as logprep's do
    from logprep.cli import main

    with pytest.raises(SystemExit) as exc:
        main(argv)
    assert exc.value.code == 2
    last = capsys.readouterr().err.strip().splitlines()[-1]
    what, sep, todo = last.partition("; ")
    assert "error: " in what and sep and "--help" in todo, last
