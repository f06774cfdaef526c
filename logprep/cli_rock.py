"""Command-line options of the rock classes, unusable intervals and rock scoring (a part of
:mod:`logprep.cli`, kept apart to keep modules small).  No science here."""

from __future__ import annotations

import argparse


def rock_options(p: argparse.ArgumentParser, d) -> None:
    """Options of the rock classes and unusable intervals (dest = settings field)."""
    from logprep.clay.endpoints import ONE_SIDED

    g = p.add_argument_group("clay volume: one-sided zones")
    g.add_argument("--one-sided", dest="one_sided", choices=list(ONE_SIDED),
                   help="lines of a zone with too little contrast: recentre on its own side, or "
                        f"take the well's lines (default: {d.clay.one_sided})")
    g = p.add_argument_group("rock classes and unusable intervals")
    g.add_argument("--rock-classes", dest="rock_classes", action=argparse.BooleanOptionalAction,
                   help="recognise limestone/chalk, dolomite, coal, anhydrite, halite from "
                        "density, neutron and PEF (default: on)")
    g.add_argument("--sonic-density", dest="sonic_density", action=argparse.BooleanOptionalAction,
                   help="where the neutron-density Vsh is missing, use the sonic-density "
                        f"separation as the second clay indicator (default: {'on' if d.clay.sonic_density else 'off'})")
    g.add_argument("--pef-shale-check", dest="pef_shale_check", action=argparse.BooleanOptionalAction,
                   help="leave out the PEF of a hole section whose shales read a carbonate's Pe "
                        f"(barite mud) (default: {'on' if d.clay.pef_shale_check else 'off'})")
    g.add_argument("--bad-hole", dest="bad_hole_in", type=float, metavar="INCHES",
                   help="caliper over bit size beyond which the logs are unusable "
                        f"(default: {d.clay.bad_hole_in})")
    g.add_argument("--gap-limit", dest="gap_limit_m", type=float, metavar="M",
                   help=f"Vsh interpolated over a longer gap is unusable (default: {d.clay.gap_limit_m})")
    g.add_argument("--top-hole-run", dest="top_hole_run_m", type=float, metavar="M",
                   help="the top hole ends (and the foot begins) where density, neutron or "
                        "sonic are measured this long; GR beyond is unusable "
                        f"(default: {d.clay.top_hole_run_m})")
    g.add_argument("--max-unusable", dest="max_unusable", type=float, metavar="FRACTION",
                   help="a layer with a larger unusable share is 'no data' "
                        f"(default: {d.layers.max_unusable})")
    g.add_argument("--reservoir", dest="reservoir_classes", metavar="CLASSES",
                   help="layer classes counted as reservoir, comma-separated, e.g. "
                        f"sand,limestone (default: {','.join(d.layers.reservoir_classes)})")
    g.add_argument("--thin-bed", dest="thin_bed_m", type=float, metavar="M",
                   help="a window sand thinner than this is marked thin in juxtapositions.csv "
                        f"(default: {d.layers.thin_bed_m})")


def tune_rock_options(p: argparse.ArgumentParser) -> None:
    """``logprep tune`` options naming a rock reference."""
    p.add_argument("--rock", dest="rock_file", metavar="FILE.csv",
                   help="core or cuttings description (top_m, base_m, lithology[, well]): score "
                        "every setting's sands against it (precision, recall, balanced accuracy)")
    p.add_argument("--label-curve", dest="label_curve", metavar="MNEMONIC",
                   help="lithology label curve of the well to score against (default: a known "
                        "label curve when the well has one)")


def print_tune_summary(sweep, paths) -> None:
    """The one-line summary of ``logprep tune``, and the rock scores when there are some."""
    t = sweep.table
    print(f"{sweep.reference.well.name}: {len(t) - 1} settings swept; "
          f"{int((t['verdicts_flipped'] == 0).sum()) - 1} keep every window verdict of the reference; "
          f"table {paths['tune.csv']}, figure {paths['tune.pdf']}")
    print_rock_summary(t)


def print_rock_summary(t) -> None:
    """One line on how the swept settings agree with the described rock (when scored)."""
    if "rock_balanced_accuracy" not in t:
        return
    best = t[t["best_rock_match"]].iloc[0]
    ref = t[t["is_reference"]].iloc[0]
    print(f"against the described rock: reference balanced accuracy "
          f"{ref['rock_balanced_accuracy']:.2f} (precision {ref['rock_precision']:.2f}); best "
          f"{best['rock_balanced_accuracy']:.2f} at sand {best['sand_cutoff']:g}, shale "
          f"{best['shale_cutoff']:g}, min bed {best['min_bed_m']:g} m "
          f"({int(t['best_rock_match'].sum())} setting(s); column best_rock_match)")
