"""Command line: parses options and hands them to the Python API.  No science here."""

from __future__ import annotations

import argparse
import sys
import warnings
from pathlib import Path

from logprep import __version__
from logprep.cli_batch import UsageParser, add_batch_options, batch_backend
from logprep.cli_rock import print_tune_summary, rock_options, tune_rock_options
from logprep.cli_conventions import fault_convention_options
from logprep.errors import LogprepError
from logprep.io.safetext import escape_line
from logprep.run.fault_options import add_fault_options, faults_after_batch, faults_before_batch

# the science is imported only where a command or its options need it (fast --version)

EXIT_OK, EXIT_SOME_FAILED, EXIT_USAGE = 0, 1, 2


def _clay_options(p: argparse.ArgumentParser, d) -> None:
    from logprep.clay.vshale import TRANSFORMS
    g = p.add_argument_group("clay volume")
    g.add_argument("--transform", dest="transform", choices=list(TRANSFORMS),
                   help=f"IGR to Vsh transform (default: {d.clay.transform})")
    g.add_argument("--gr-clean", dest="gr_clean", metavar="VALUE|pN",
                   help=f"clean-sand GR line: API value or percentile such as p5 (default: {d.clay.gr_clean})")
    g.add_argument("--gr-shale", dest="gr_shale", metavar="VALUE|pN",
                   help=f"shale GR line: API value or percentile such as p95 (default: {d.clay.gr_shale})")
    g.add_argument("--gr-curve", dest="gr_curve", metavar="MNEMONIC",
                   help="gamma-ray curve to use (default: first of the known GR mnemonics)")
    g.add_argument("--depth-unit", dest="depth_unit", choices=["m", "ft"],
                   help="depth unit when a file does not state one")
    g.add_argument("--tops", dest="tops_file", metavar="FILE",
                   help="formation tops: CSV of well, top_m, name; a markers file; or a folder of them")


def _blocking_options(p: argparse.ArgumentParser, d) -> None:
    from logprep.layers.blocking import BLOCKING_METHODS
    g = p.add_argument_group("blocking")
    g.add_argument("--blocking", dest="blocking", choices=list(BLOCKING_METHODS),
                   help=f"blocking method (default: {d.layers.blocking})")
    g.add_argument("--sand-cutoff", dest="sand_cutoff", type=float, metavar="VSH",
                   help=f"Vsh at or below which a sample is sand (default: {d.layers.sand_cutoff})")
    g.add_argument("--shale-cutoff", dest="shale_cutoff", type=float, metavar="VSH",
                   help=f"Vsh at or above which a sample is shale (default: {d.layers.shale_cutoff})")
    g.add_argument("--min-bed", dest="min_bed_m", type=float, metavar="M",
                   help=f"minimum layer thickness in metres; thinner beds merge (default: {d.layers.min_bed_m})")
    g.add_argument("--changepoint-penalty", dest="changepoint_penalty", type=float, metavar="X",
                   help="changepoint blocking: cost of one change of mean Vsh as a multiple of "
                        f"noise variance x ln(samples); larger gives fewer layers (default: {d.layers.changepoint_penalty})")
    g.add_argument("--honour-tops", dest="honour_tops", action=argparse.BooleanOptionalAction,
                   help="force a layer boundary at every formation top from --tops (default: off)")


def _fault_options(p: argparse.ArgumentParser, d) -> None:
    from logprep.fault.sgr import SGR_FIELD_SOURCES
    g = p.add_argument_group("fault")
    g.add_argument("--throw-max", dest="throw_max_m", type=float, metavar="M",
                   help=f"largest throw screened, metres (default: {d.field.throw_max_m})")
    g.add_argument("--sgr-threshold", dest="sgr_threshold_pct", type=float, metavar="PCT",
                   help=f"SGR (%%) below which a window is flagged; verdict 'seal' from here up "
                        f"(default: {d.capacity.sgr_threshold_pct})")
    g.add_argument("--sgr-field-from", dest="sgr_field_source", choices=list(SGR_FIELD_SOURCES),
                   help="clay source of the SGR field (sgr_field.npz, triangle diagram): blocked "
                        f"layers or the continuous Vsh curve (default: {d.field.sgr_field_source})")
    g.add_argument("--field-depth-step", dest="field_depth_step_m", type=float, metavar="M",
                   help="row spacing of the SGR field in metres, rounded to whole log samples "
                        f"(default: {d.field.field_depth_step_m})")
    g.add_argument("--field-throw-step", dest="field_throw_step_m", type=float, metavar="M",
                   help=f"throw spacing of the SGR field in metres (default: {d.field.field_throw_step_m})")


def _capacity_options(p: argparse.ArgumentParser, d) -> None:
    from logprep.fault.envelope import CO2_DENSITY_MODES
    from logprep.units import LENGTH_UNITS

    g = p.add_argument_group(
        "seal capacity",
        "Fault-zone pressure from SGR, column heights, verdicts and fault-rock properties. "
        "Defaults are starting points, not calibrations.",
    )
    for fluid, attr in (("brine", "brine_density_kgm3"), ("oil", "oil_density_kgm3"),
                        ("gas", "gas_density_kgm3"), ("co2", "co2_density_kgm3")):
        g.add_argument(f"--{fluid}-density", dest=attr, type=float, metavar="KG/M3",
                       help=f"{fluid.upper() if fluid == 'co2' else fluid} density (default: {getattr(d, attr):g})")
    g.add_argument("--co2-density-mode", dest="co2_density_mode", choices=list(CO2_DENSITY_MODES),
                   help="CO2 density: the fixed value, or from an equation of state at each "
                        f"contact's pressure and temperature (needs CoolProp) (default: {d.capacity.co2_density_mode})")
    g.add_argument("--surface-temp", dest="surface_temp_c", type=float, metavar="DEGC",
                   help=f"temperature at sea level for --co2-density-mode eos (default: {d.capacity.surface_temp_c:g})")
    g.add_argument("--geothermal-gradient", dest="geothermal_gradient_c_per_km", type=float,
                   metavar="DEGC/KM", help=f"geothermal gradient (default: {d.capacity.geothermal_gradient_c_per_km:g})")
    g.add_argument("--envelope-scale", dest="envelope_sgr_scale_pct", type=float, metavar="PCT",
                   help=f"SGR per decade of fault-zone pressure (default: {d.capacity.envelope_sgr_scale_pct:g})")
    g.add_argument("--envelope-bounds", dest="envelope_class_bounds_m", metavar="M,M",
                   help="burial class boundaries, metres (default: "
                        f"{','.join(f'{v:g}' for v in d.capacity.envelope_class_bounds_m)})")
    g.add_argument("--envelope-c", dest="envelope_class_c", metavar="C,C,C",
                   help="envelope constant C per burial class, shallow to deep (default: "
                        f"{','.join(f'{v:g}' for v in d.capacity.envelope_class_c)})")
    g.add_argument("--sgr-leak", dest="sgr_leak_pct", type=float, metavar="PCT",
                   help="verdict 'leak' below this window SGR; 'seal' from --sgr-threshold up; "
                        f"'uncertain' between (default: {d.capacity.sgr_leak_pct:g})")
    g.add_argument("--length-unit", dest="length_unit", choices=list(LENGTH_UNITS),
                   help=f"unit of column heights on the sheet; ft adds column_*_ft (default: {d.capacity.length_unit})")
    g.add_argument("--cell-length", dest="cell_length_m", type=float, metavar="M",
                   help=f"cell length for the transmissibility multiplier (default: {d.fault_rock.cell_length_m:g})")
    g.add_argument("--matrix-perm", dest="matrix_perm_md", type=float, metavar="MD",
                   help=f"matrix permeability for the transmissibility multiplier (default: {d.fault_rock.matrix_perm_md:g})")
    g.add_argument("--faulting-depth", dest="faulting_depth_m", type=float, metavar="M",
                   help="depth at the time of faulting, for the Sperrevik permeability (default: burial depth)")


def _clay_quality_options(p: argparse.ArgumentParser, d) -> None:
    from logprep.clay.endpoints import ZONINGS
    from logprep.clay.vshale import COMBINATIONS

    g = p.add_argument_group("clay volume: zones, neutron-density, GR checks")
    g.add_argument("--zoning", dest="zoning", choices=list(ZONINGS),
                   help="zones for the clean/shale picks: auto = tops if the well has them, else "
                        f"steps of the GR baseline; bit-size changes always cut (default: {d.clay.zoning})")
    g.add_argument("--zone-min", dest="zone_min_m", type=float, metavar="M",
                   help=f"shortest zone made from GR baseline steps, metres (default: {d.clay.zone_min_m})")
    g.add_argument("--zone-step", dest="zone_step_api", type=float, metavar="API",
                   help=f"least GR baseline step between such zones (default: {d.clay.zone_step_api})")
    g.add_argument("--min-contrast", dest="min_contrast", type=float, metavar="FRACTION",
                   help="zone contrast, as a fraction of the well's, below which a zone is "
                        f"treated as all shale or all sand (default: {d.clay.min_contrast})")
    g.add_argument("--vsh-combine", dest="vsh_combine", choices=list(COMBINATIONS),
                   help="join GR and neutron-density Vsh: mean, min, gr (GR only), nd "
                        f"(neutron-density where usable) (default: {d.clay.vsh_combine})")
    g.add_argument("--washout", dest="washout_in", type=float, metavar="INCHES",
                   help=f"caliper over bit size that flags a washout (default: {d.clay.washout_in})")
    g.add_argument("--drho-max", dest="drho_max_g_cm3", type=float, metavar="G_CM3",
                   help="density correction |DRHO| above which neutron-density is not used, "
                        f"g/cm3 (default: {d.clay.drho_max_g_cm3})")


def _survey_options(p: argparse.ArgumentParser, d) -> None:
    g = p.add_argument_group("deviated wells")
    g.add_argument("--survey-dir", dest="survey_dir", metavar="DIR",
                   help="folder of deviation surveys named <well or file stem>.csv with columns "
                        "md_m, inc_deg, azi_deg; wells with one are screened on TVD (minimum "
                        "curvature), others are taken as vertical")
    g.add_argument("--bed-dip", dest="bed_dip_deg", type=float, metavar="DEG",
                   help="bed dip in degrees for the true stratigraphic thickness tst_m in "
                        f"layers.csv (default: {d.input.bed_dip_deg})")


def _pair_options(p: argparse.ArgumentParser, d) -> None:
    from logprep.fault.twowell import SLIP_SOURCES

    g = p.add_argument_group("well pairs across a fault")
    g.add_argument("--pair-slip-from", dest="pair_slip_source", choices=list(SLIP_SOURCES),
                   help="for --pairs: take the slipped interval from the footwall well, the "
                        f"hanging-wall well, or average the two (default: {d.field.pair_slip_source})")


SETTINGS_OPTION_GROUPS = [_clay_options, _clay_quality_options, rock_options, _blocking_options,
                          _fault_options, _capacity_options, fault_convention_options,
                          _survey_options, _pair_options]
"""Each adds one group of options whose ``dest`` is a :class:`ScreenSettings` field and
whose default is None (not given); add a function here for a new group."""


def _add_screen_options(p: argparse.ArgumentParser) -> None:
    from logprep.run.settings import ScreenSettings

    d = ScreenSettings()
    for add_group in SETTINGS_OPTION_GROUPS:
        add_group(p, d)


def _given_settings(args) -> dict:
    """The :class:`ScreenSettings` fields given on the command line (flat names)."""
    from logprep.run.settings import FIELD_GROUP

    return {k: v for k, v in vars(args).items() if k in FIELD_GROUP and v is not None}


def _config_from_args(args) -> tuple[dict, dict]:
    """Settings and tune ranges from ``--config`` (empty without one)."""
    from logprep.run.config import read_config

    return read_config(args.config) if getattr(args, "config", None) else ({}, {})


def _settings_from_args(args):
    """ScreenSettings from defaults, then ``--config``, then the options given."""
    from logprep.run.settings import ScreenSettings

    from_file, _ = _config_from_args(args)
    return ScreenSettings(**{**from_file, **_given_settings(args)})


def _add_config_option(p: argparse.ArgumentParser) -> None:
    p.add_argument("--config", metavar="FILE.toml",
                   help="settings file (TOML; keys are the settings' field names); options "
                        "given on the command line override it. Every run writes the settings "
                        "it used to logprep-settings.toml in its output folder")


def _add_locations_option(p: argparse.ArgumentParser) -> None:
    p.add_argument("--locations", metavar="FILE",
                   help="well locations for the overview map: CSV of well and x, y (or "
                        "latitude, longitude); default: the LAS header items (LATI/LONG, "
                        "X/Y, or X and Y in LOC)")


def cmd_screen(args) -> int:
    from logprep.run.contain import final_line, overview_after_batch, pairs_line, print_error
    from logprep.run.batch import screen_paths
    from logprep.io.examples import example_logs_dir

    settings = _settings_from_args(args)
    paths = args.paths
    if not paths:
        # the bundled demo: its wells with their tops, the deviated well's survey and the
        # pair across the fault, unless the user chose otherwise
        demo = example_logs_dir()
        paths = [demo]
        given = _given_settings(args)
        extra = {}
        if "tops_file" not in given and not settings.input.tops_file:
            extra["tops_file"] = str(demo / "tops.csv")
        if "survey_dir" not in given and not settings.input.survey_dir:
            extra["survey_dir"] = str(demo / "surveys")
        settings = settings.updated(**extra) if extra else settings
        if args.pairs is None:
            args.pairs = str(demo / "pairs.csv")
    if args.pairs:
        from logprep.run.pairs import read_pairs

        read_pairs(args.pairs)  # a bad pairs file is a usage error, found before the wells run
    if args.locations:
        from logprep.io.locations import read_locations

        read_locations(args.locations)  # likewise a bad locations file
    faults = faults_before_batch(args, paths, settings)
    from logprep.run.progress import Progress

    backend = batch_backend(args)
    report = screen_paths(
        paths, args.out, settings,
        progress=Progress("quiet" if args.quiet else "auto", sys.stderr),
        backend=backend, sheets=not args.no_sheet, field=not args.no_field,
        field_smear=args.field_smear, force=args.force, **faults.batch_kwargs,
        overview=False,  # written below, once the pairs and faults are in the folder too
    )
    for msg in report.warnings:
        print(f"warning: {msg}", file=sys.stderr)
    print(final_line(report, args.out))
    failed = bool(report.failures)
    if args.pairs:
        from logprep.run.pairs import screen_pairs

        rows = screen_pairs(paths, args.pairs, args.out, settings,
                            on_error=print_error,
                            sheets=not args.no_sheet, field=not args.no_field,
                            field_smear=args.field_smear, backend=backend, force=args.force)
        print(pairs_line(rows, args.out))
        failed = failed or any(r["status"] != "ok" for r in rows)
    failed = faults_after_batch(args, faults, settings) or failed
    failed = overview_after_batch(args.out, args.locations) or failed
    return EXIT_SOME_FAILED if failed else EXIT_OK


def cmd_overview(args) -> int:
    from logprep.report.overview_files import write_overview

    out = Path(args.out_dir)
    if not (out / "summary.csv").is_file() and not (out / "pairs_summary.csv").is_file():
        raise LogprepError(f"{out}: no summary.csv or pairs_summary.csv; give the --out folder "
                           "of a 'logprep screen' run")
    written = write_overview(out, args.locations)
    print(f"field overview {written['overview.html']} and {written['overview.pdf']}")
    return EXIT_OK


def cmd_tune(args) -> int:
    from logprep.run.tune import DEFAULT_MIN_BEDS_M, DEFAULT_SAND_CUTOFFS, DEFAULT_SHALE_CUTOFFS
    from logprep.run.tune import sweep_file, write_sweep

    from logprep.report.writers import prepare_out_dir

    settings = _settings_from_args(args)
    _, ranges = _config_from_args(args)
    prepare_out_dir(args.out)  # before the sweep, not after it
    for key in ("sand_sweep", "shale_sweep", "bed_sweep"):
        if getattr(args, key) is not None:
            ranges[key] = getattr(args, key)
    sweep = sweep_file(
        args.well, settings,
        sand_cutoffs=ranges.get("sand_sweep", DEFAULT_SAND_CUTOFFS),
        shale_cutoffs=ranges.get("shale_sweep", DEFAULT_SHALE_CUTOFFS),
        min_beds_m=ranges.get("bed_sweep", DEFAULT_MIN_BEDS_M),
        descriptions=args.rock_file, label_curve=args.label_curve,
    )
    print_tune_summary(sweep, write_sweep(sweep, args.out))
    return EXIT_OK


def build_parser() -> argparse.ArgumentParser:
    parser = UsageParser(
        prog="logprep",
        description="Fault-seal screening from well logs: LAS -> Vshale -> layers -> "
                    "juxtaposition and SGR -> per-well sheets and tables.",
    )
    parser.add_argument("--version", action="version", version=f"logprep {__version__}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND")
    p = sub.add_parser(
        "screen", help="screen LAS files (default: the bundled example logs)",
        description="Screen every LAS file under PATHS (files or folders, searched "
                    "recursively) and write one folder of results per file under --out.",
        epilog="Exit status: 0 every file screened; 1 some files failed (each named on one "
               "line of stderr and in summary.csv, the others screened as usual); 2 a usage "
               "error (an option, --config, --tops, --survey-dir, --pairs or --out), found "
               "before any well is screened.",
    )
    p.add_argument("paths", nargs="*", metavar="PATH",
                   help="LAS files or folders (default: the bundled example logs)")
    p.add_argument("--out", default="screening", metavar="DIR",
                   help="output folder (default: ./%(default)s)")
    _add_config_option(p)
    add_batch_options(p)
    from logprep.io.settings import InputSettings

    p.add_argument("--well-time-limit", dest="well_time_limit_s", type=float, metavar="S", help="seconds "
                   "a well may take before it is stopped as an error; 0 = none (default: "
                   f"{InputSettings.well_time_limit_s:g})")
    p.add_argument("--pairs", metavar="FILE",
                   help="also screen well pairs across a fault: CSV of footwall, hangingwall and "
                        "marker (a top in both wells, needs --tops) or shift_m; one folder per pair")
    add_fault_options(p)
    _add_locations_option(p)
    _add_screen_options(p)
    p.set_defaults(func=cmd_screen)

    p = sub.add_parser(
        "overview", help="remake overview.html and overview.pdf of a screening output folder",
        description="Remake the field overview (overview.html, overview.pdf) from what a "
                    "'logprep screen' run left in its output folder.",
    )
    p.add_argument("out_dir", metavar="DIR", help="the --out folder of a screening run")
    _add_locations_option(p)
    p.set_defaults(func=cmd_overview)

    p = sub.add_parser(
        "tune", help="sweep the blocking cut-offs of one well and show where verdicts flip",
        description="Block one well at every combination of sand cut-off, shale cut-off and "
                    "minimum bed thickness, and record per setting the sands, net-to-gross, "
                    "windows, lowest window SGR and each window's seal / leak verdict against "
                    "the reference (the settings given). Writes tune.csv, tune-windows.csv, "
                    "tune.pdf, tune.png and logprep-settings.toml to --out. Ranges are "
                    "'a,b,c' or 'start:stop:step'.",
    )
    p.add_argument("well", metavar="WELL.las", help="the LAS file to sweep")
    p.add_argument("--out", default="tuning", metavar="DIR",
                   help="output folder (default: ./%(default)s)")
    p.add_argument("--sand-sweep", dest="sand_sweep", metavar="RANGE",
                   help="sand cut-offs to try (default: 0.2:0.5:0.05)")
    p.add_argument("--shale-sweep", dest="shale_sweep", metavar="RANGE",
                   help="shale cut-offs to try (default: 0.5:0.8:0.05)")
    p.add_argument("--bed-sweep", dest="bed_sweep", metavar="RANGE",
                   help="minimum bed thicknesses to try, metres (default: 0.5,1,2,4)")
    tune_rock_options(p)
    _add_config_option(p)
    _add_screen_options(p)
    p.set_defaults(func=cmd_tune)
    return parser


def _asks_version(argv: list[str]) -> bool:
    """True when ``--version`` comes before any command or help option, where argparse
    would print the version and stop: answered without building the parser (whose
    options need the science's registries)."""
    for token in argv:
        if token == "--version":
            return True
        if token in ("-h", "--help") or not token.startswith("-"):
            return False
    return False


def main(argv: list[str] | None = None) -> int:
    argv = sys.argv[1:] if argv is None else list(argv)
    if _asks_version(argv):
        print(f"logprep {__version__}")
        return EXIT_OK
    parser = build_parser()
    args = parser.parse_args(argv)
    if not getattr(args, "func", None):
        parser.print_help(sys.stderr)
        return EXIT_USAGE
    try:
        with warnings.catch_warnings():
            warnings.simplefilter("ignore", RuntimeWarning)
            return args.func(args)
    except LogprepError as exc:
        print(f"logprep: error: {escape_line(exc)}", file=sys.stderr)
        return EXIT_USAGE
    except KeyboardInterrupt:
        print("logprep: interrupted; files already written are complete", file=sys.stderr)
        return 130


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
