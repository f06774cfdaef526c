"""Command-line options of the fault-seal conventions (clay fraction, heteroliths, fault
dip, burial surface and uplift, closure, CO2-brine capillary conversion): one option
group, each ``dest`` a :class:`~logprep.run.settings.ScreenSettings` field."""

from __future__ import annotations

import argparse


def fault_convention_options(p: argparse.ArgumentParser, d) -> None:
    """Add the group to ``p``; ``d`` holds the default settings (for the help texts)."""
    g = p.add_argument_group(
        "fault-seal conventions",
        "Clay fraction, burial surface, closure, CO2-brine conversion and fault geometry; each "
        "default is stated in the README Method section and on the sheet.")
    g.add_argument("--shale-clay-fraction", dest="shale_clay_fraction", type=float, metavar="FRACTION",
                   help="clay fraction of pure shale: SGR, smear and fault rock use this x Vsh "
                        f"(default: {d.field.shale_clay_fraction:g}, Vsh taken as clay)")
    g.add_argument("--heterolith-reservoir-ntg", dest="heterolith_reservoir_ntg", type=float,
                   metavar="FRACTION", help="also screen heteroliths with at least this net-to-gross "
                                            "as reservoir (default: sands only)")
    g.add_argument("--fault-dip", dest="fault_dip_deg", type=float, metavar="DEG",
                   help="fault dip: displacement = throw / sin(dip) for fault rock, CSP along the "
                        f"fault (default: {d.field.fault_dip_deg:g})")
    g.add_argument("--smear-clay-min", dest="smear_clay_min", type=float, metavar="FRACTION",
                   help="least clay fraction of a shale or heterolith layer to count as a smear "
                        f"source bed in SSF and CSP (default: {d.field.smear_clay_min:g})")
    g.add_argument("--water-depth", dest="water_depth_m", type=float, metavar="M",
                   help="water depth: burial is measured below the sea floor (default: from the "
                        "LAS header, else the surface at sea level)")
    g.add_argument("--ground-elevation", dest="ground_elevation_m", type=float, metavar="M",
                   help="ground elevation above sea level onshore (default: EGL from the header)")
    g.add_argument("--uplift", dest="uplift_m", type=float, metavar="M",
                   help=f"section removed since maximum burial, added to burial (default: {d.capacity.uplift_m:g})")
    g.add_argument("--closure", dest="closure_m", type=float, metavar="M",
                   help="structural closure that caps every column (default: none; columns over "
                        f"{d.capacity.unconstrained_column_m:g} m flagged unconstrained)")
    g.add_argument("--closures", dest="closures_file", metavar="FILE",
                   help="CSV of well, closure_m: the closure of the trap at each well, used "
                        "instead of --closure for the wells it lists (pairs: a closure_m column "
                        "in the pairs file comes first; faults: closure_m in the faults file)")
    g.add_argument("--unconstrained-column", dest="unconstrained_column_m", type=float, metavar="M",
                   help=f"column flagged unconstrained without a closure (default: {d.capacity.unconstrained_column_m:g})")
    for opt, dest, unit in (("--calibration-ift", "calibration_ift_mn_m", "MN/M"),
                            ("--calibration-contact-angle", "calibration_contact_deg", "DEG"),
                            ("--co2-ift", "co2_ift_mn_m", "MN/M"),
                            ("--co2-contact-angle", "co2_contact_deg", "DEG")):
        g.add_argument(opt, dest=dest, type=float, metavar=unit,
                       help=f"for the CO2-brine capillary pressure (default: {getattr(d.capacity, dest):g})")
    g.add_argument("--max-burial", dest="max_burial_m", type=float, metavar="M",
                   help="maximum burial depth for the pressure envelope (default: each contact's "
                        "depth below the sea floor or ground, plus --uplift)")
    g.add_argument("--bed-dip-azimuth", dest="bed_dip_azimuth_deg", type=float, metavar="DEG",
                   help="direction of that dip, degrees from north; with a survey, tst_m follows "
                        f"the well's direction against it (default: {d.input.bed_dip_azimuth_deg})")
