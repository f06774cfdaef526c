"""Write the tiny LAS fixtures in this folder (run: python tests/data/make_fixtures.py).

Each file has one quirk, named in its file name; README.md lists them.  The layered GR
is a simple sand-shale-sand column so results can be worked by hand.
"""

from pathlib import Path

HERE = Path(__file__).parent

HEADER = """~VERSION INFORMATION
 VERS.                 2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0
 WRAP.                  NO : ONE LINE PER DEPTH STEP
~WELL INFORMATION
 STRT.{u}           {strt} : START DEPTH
 STOP.{u}           {stop} : STOP DEPTH
 STEP.{u}           {step} : STEP
 NULL.             -999.25 : NULL VALUE
 WELL.          {well} : WELL
 FLD .          FIXTURE FIELD : FIELD
~CURVE INFORMATION
 {dmn}.{u}                 : DEPTH
{curves}~A
"""


def las_text(rows, *, well="FIX-1", unit="M", depth_mnemonic="DEPT", curves=("GR", "GAPI")):
    names = [curves[i] for i in range(0, len(curves), 2)]
    units = [curves[i + 1] for i in range(0, len(curves), 2)]
    cdef = "".join(f" {n:<6}.{u:<6}           : {n} CURVE\n" for n, u in zip(names, units))
    step = rows[1][0] - rows[0][0] if len(rows) > 1 else 0
    head = HEADER.format(u=unit, strt=rows[0][0], stop=rows[-1][0], step=step, well=well,
                         dmn=depth_mnemonic, curves=cdef)
    body = "".join(" ".join(f"{v:10.4f}" for v in r) + "\n" for r in rows)
    return head + body


def column(step=0.5, unit_factor=1.0):
    """GR 30 API (sand) 100-110 m, 120 API (shale) 110-120 m, 30 API 120-130 m."""
    rows = []
    z = 100.0
    while z <= 130.0 + 1e-9:
        gr = 120.0 if 110.0 <= z < 120.0 else 30.0
        rows.append((round(z / unit_factor, 4), gr))
        z += step
    return rows


def main():
    files = {
        "layered_metres.las": las_text(column()),
        "depth_in_feet.las": las_text(column(step=0.5), unit="FT"),
        "decreasing_depth.las": las_text(column()[::-1]),
        "null_sentinels.las": las_text(
            [(z, -999.25 if 112 <= z <= 113 else (-9999.0 if z == 125.0 else g))
             for z, g in column()]),
        "duplicate_depth.las": las_text(column()[:5] + column()[4:10]),
        "depth_goes_back.las": las_text(column()[:6] + [column()[3]] + column()[6:10]),
        "no_gamma_ray.las": las_text([(z, 2.3) for z, _ in column()], curves=("RHOB", "G/C3")),
        "gr_alias_ecgr.las": las_text(column(), curves=("ECGR", "GAPI")),
        "time_index.las": las_text(column(), unit="S", depth_mnemonic="ETIM"),
        "all_gr_null.las": las_text([(z, -999.25) for z, _ in column()]),
        "empty.las": "",
        "not_las.las": "This is a field report, not a log.\nDepth, GR\n100, 30\n",
    }
    for name, text in files.items():
        (HERE / name).write_text(text)


if __name__ == "__main__":
    main()
