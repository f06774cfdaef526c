"""Command-line options of a batch: where wells run, what is written, reruns (argparse only)."""

from __future__ import annotations

import argparse


class UsageParser(argparse.ArgumentParser):
    """An argument parser whose usage errors say what to do, as every logprep error does:
    ``argument --zone-min: invalid float value: 'x'; see 'logprep screen --help' ...``
    (its subcommands' parsers are of this class too)."""

    def error(self, message: str):
        super().error(f"{message}; see '{self.prog} --help' for the options and the values they take")


def add_batch_options(p: argparse.ArgumentParser) -> None:
    g = p.add_argument_group("batch: where wells run, what is written, reruns")
    g.add_argument("--jobs", type=int, default=1, metavar="N",
                   help="screen wells in N worker processes on this machine (default: 1)")
    g.add_argument("--scheduler", metavar="ADDRESS",
                   help="send one task per well and per pair to the Dask cluster whose "
                        "scheduler listens at ADDRESS (e.g. tcp://10.0.0.5:8786); inputs must "
                        "be on a path every worker sees; this process writes the outputs "
                        "(needs pip install 'logprep[dask]')")
    g.add_argument("--dask-local", type=int, metavar="N",
                   help="start a Dask cluster of N worker processes on this machine for the run")
    g.add_argument("--no-sheet", action="store_true",
                   help="write tables and fields only, no PDF/PNG sheets (fast, for large batches)")
    g.add_argument("--no-field", action="store_true",
                   help="do not write sgr_field.npz (the triangle diagram on the sheet is still drawn)")
    g.add_argument("--field-smear", action="store_true",
                   help="also store the smear fields (SSF, CSP) in sgr_field.npz (about doubles it)")
    g.add_argument("--force", action="store_true",
                   help="redo every well, also those unchanged since the last run on --out")
    g.add_argument("--quiet", action="store_true",
                   help="no progress on stderr (errors and the final line are still printed)")


def batch_backend(args):
    """The :class:`~logprep.run.executor.Backend` the batch options ask for."""
    from logprep.run.executor import Backend

    return Backend(jobs=args.jobs, scheduler=args.scheduler, dask_local=args.dask_local)
