"""The ``screen`` options for named faults and their steps around the batch, kept light:
argparse only at import, the science imported when a fault is screened."""

from __future__ import annotations

import sys
from dataclasses import dataclass, field
from pathlib import Path


def add_fault_options(p) -> None:
    """The ``screen`` options of this module (an argparse parser)."""
    g = p.add_argument_group("named faults with uncertainty",
                             "Spreads of the drawn inputs: the [uncertainty] table of --config.")
    g.add_argument("--faults", metavar="FILE",
                   help="screen named faults at their throw (CSV or TOML: name, footwall, hangingwall, "
                        "marker or shift_m, throw_m, throw_low_m, throw_high_m, ...); writes faults.csv "
                        "and a page per fault")
    g.add_argument("--uncertainty", action="store_true",
                   help="also append P10/P50/P90 of minimum SGR, p_juxtaposed and p_seal to every "
                        "well's juxtapositions.csv")
    g.add_argument("--realisations", type=int, metavar="N",
                   help="Monte Carlo realisations per fault and well (default: 1000)")
    g.add_argument("--random-state", dest="random_state", type=int, metavar="N",
                   help="whole number that fixes the random draws; the same number gives the same "
                        "tables (default: 1)")



@dataclass
class FaultRun:
    """The faults of one ``screen`` run: the spreads, the results, the failures, and the
    keyword arguments they add to :func:`logprep.run.batch.screen_paths`."""

    spreads: object
    results: list = field(default_factory=list)
    errors: list = field(default_factory=list)
    internal: list = field(default_factory=list)
    """``(where, traceback)`` of each unexpected exception, logged after the batch (the
    output folder is made by the batch)."""
    batch_kwargs: dict = field(default_factory=dict)


def spreads_from_args(args):
    """Monte Carlo spreads from ``--config``'s [uncertainty] table, then the options."""
    from logprep.run.config import read_uncertainty

    spreads = read_uncertainty(getattr(args, "config", None))
    changes = {k: getattr(args, k) for k in ("realisations", "random_state") if getattr(args, k) is not None}
    return spreads.updated(**changes) if changes else spreads


def faults_before_batch(args, paths, settings) -> FaultRun:
    """Screen the faults of ``--faults`` (the bundled faults file in the demo run, without
    PATHS); the file is checked first, so a bad one is a usage error.  Each failure is
    printed on one line of stderr."""
    if not args.paths and args.faults is None:
        from logprep.io.examples import example_logs_dir

        args.faults = str(example_logs_dir() / "faults.csv")
    run = FaultRun(spreads=spreads_from_args(args))
    run.batch_kwargs["spreads"] = run.spreads if args.uncertainty else None
    if not args.faults:
        return run
    from logprep.io.faults import read_faults
    from logprep.run.fault_batch import faults_by_footwall, screen_faults

    read_faults(args.faults)

    def report(msg: str) -> None:
        run.errors.append(msg)
        print(f"error: {msg}", file=sys.stderr)

    run.results = screen_faults(paths, args.faults, settings, run.spreads, on_error=report,
                                on_internal=lambda where, trace: run.internal.append((where, trace)))
    run.batch_kwargs["faults"] = faults_by_footwall(run.results) or None
    return run


def faults_after_batch(args, run: FaultRun, settings) -> bool:
    """Write ``faults.csv``, the fault pages and the settings with their spreads, and print
    a summary line; True when a fault failed (nothing is done without ``--faults``)."""
    if not args.faults:
        return False
    from logprep.run.config import SETTINGS_FILE_NAME, write_settings
    from logprep.run.fault_batch import FAULTS_FILE_NAME, write_faults

    from logprep.run.contain import internal_clause, log_internal

    write_faults(run.results, args.out, settings, sheets=not args.no_sheet)
    write_settings(Path(args.out) / SETTINGS_FILE_NAME, settings, uncertainty=run.spreads)
    for where, trace in run.internal:
        log_internal(Path(args.out), where, trace)
    print(f"screened {len(run.results) + len(run.errors)} fault(s) in {run.spreads.realisations} "
          f"realisations each: {len(run.results)} ok, {len(run.errors)} failed"
          f"{internal_clause(len(run.internal), args.out)}; table {args.out}/{FAULTS_FILE_NAME}")
    return bool(run.errors)
