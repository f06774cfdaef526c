"""Write the invented deviation survey of HRM-5 (fictitious Harrowmere Field).

Usage (from the repository root)::

    python example_logs/make_survey.py

Writes ``surveys/HRM-5.csv`` next to itself: stations every 30 m of measured depth from
surface to 2,490 m; vertical to a kick-off at 1,200 m, then a build of 2.0 degrees per
30 m at azimuth 65 degrees to 32 degrees, held to total depth.  Nothing is random, so the
file is identical on every run.  Used to show the deviated-well mode:
``logprep screen --survey-dir example_logs/surveys``.
"""

from __future__ import annotations

from pathlib import Path

import numpy as np

OUT = Path(__file__).resolve().parent / "surveys" / "HRM-5.csv"
KICK_OFF_M = 1200.0
BUILD_DEG_PER_30M = 2.0
HOLD_INC_DEG = 32.0
AZIMUTH_DEG = 65.0


def main() -> None:
    md = np.arange(0.0, 2490.0 + 1e-9, 30.0)
    inc = np.clip((md - KICK_OFF_M) / 30.0 * BUILD_DEG_PER_30M, 0.0, HOLD_INC_DEG)
    azi = np.where(inc > 0, AZIMUTH_DEG, 0.0)
    OUT.parent.mkdir(exist_ok=True)
    lines = ["md_m,inc_deg,azi_deg"] + [f"{m:.2f},{i:.2f},{a:.2f}" for m, i, a in zip(md, inc, azi)]
    OUT.write_text("\n".join(lines) + "\n")
    print(f"wrote {OUT} ({md.size} stations)")


if __name__ == "__main__":
    main()
