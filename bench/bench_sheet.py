"""What a sheet costs: each well screened with its sheet against the same well tables-only
(``--no-sheet``), measured in the same run, best of N.

Targets: a well with its sheet costs at most 2x the same well tables-only on the bundled
examples, and at most 3x on a 20,000-sample well with about 1,200 windows (made here,
written to a temporary LAS file: invented sand-shale cycles, fixed random state).

The two runs of a well alternate (tables, sheet, tables, sheet, ...) so both meet the
same load; the best wall time and the best CPU time of each are kept, and both ratios are
printed (on a shared machine the CPU ratio is the steadier one); one untimed run of
each kind first warms imports and font caches.  Each run screens the
well from its LAS file and puts its folder in place, as the batch does.

Run:  cd bench && python bench_sheet.py [--repeat N] [--no-big]
"""

from __future__ import annotations

import argparse
import re
import tempfile
from pathlib import Path

import lasio
import numpy as np
from logprep.io.examples import example_logs_dir
from logprep.run.batch import screen_one
from logprep.run.pipeline import ScreenSettings
from timing import best_cpu_s, best_interleaved_s


def big_well(path: Path, n: int = 20_000, step_m: float = 0.1524, random_state: int = 7) -> Path:
    """A 20,000-sample LAS file of invented sand-shale cycles (3-20 m beds)."""
    rng = np.random.default_rng(random_state)
    depth = 1500.0 + step_m * np.arange(n)
    gr = np.empty(n)
    i = 0
    sand = True
    while i < n:
        beds = int(rng.uniform(3.0, 20.0) / step_m)
        level = rng.uniform(25, 45) if sand else rng.uniform(95, 130)
        gr[i:i + beds] = level
        i += beds
        sand = not sand if rng.random() < 0.8 else sand
    gr += rng.normal(0, 4, n)
    las = lasio.LASFile()
    las.well["WELL"].value = "BENCH-BIG"
    las.append_curve("DEPT", depth, unit="M")
    las.append_curve("GR", gr, unit="GAPI")
    with open(path, "w") as f:
        las.write(f, version=2.0)
    return path


def ratio(path: Path, settings: ScreenSettings, tops, repeat: int, out: Path):
    """(tables wall, tables CPU), (sheet wall, sheet CPU) in s, best of ``repeat``
    interleaved runs, and the summary row of the last run with the sheet."""
    rows = []

    def with_sheet():
        rows.append(screen_one(path, "s", out, settings, tops, True))

    tables, sheet = best_interleaved_s(
        [lambda: screen_one(path, "t", out, settings, tops, False), with_sheet], repeat)
    return tables, sheet, rows[-1]


def page_split(result, repeat: int) -> list[tuple[str, float]]:
    """CPU seconds (best of ``repeat``) of each sheet page (built and written to a PDF of
    its own) and of the PNG preview, for one screened well."""
    from logprep.report import writers
    from logprep.report.sheet import PAGES

    def page(make):
        figs = make(result)
        if figs:
            writers.pdf_bytes(figs)
        return figs

    out = []
    with writers.plain_text():
        for make in PAGES:
            best, figs = best_cpu_s(lambda: page(make), repeat)
            if figs:
                out.append((make.__name__, best))
        pdf = writers.pdf_bytes(PAGES[0](result))
        out.append(("PNG of page 1", best_cpu_s(lambda: writers.png_from_pdf(pdf), repeat)[0]))
    return out


def frame_floor(result, repeat: int) -> float:
    """CPU seconds (best of ``repeat``) to build every sheet page and write them as one PDF
    with the data removed: every line, image, collection and patch taken off the axes, the
    axes, ticks, legends, tables and text kept.  No drawing of this sheet layout in
    matplotlib can cost less, so ``1 + floor / tables-only`` bounds the ratio from below."""
    from logprep.report import writers
    from logprep.report.sheet import PAGES

    def frames():
        figs = [fig for make in PAGES for fig in make(result)]
        for fig in figs:
            for ax in fig.axes:
                for artist in [*ax.lines, *ax.collections, *ax.images, *ax.patches]:
                    artist.remove()
        return writers.pdf_bytes(figs)

    with writers.plain_text():
        return best_cpu_s(frames, repeat)[0]


def pdf_pages(path: Path) -> int:
    return len(re.findall(rb"/Type\s*/Page[^s]", path.read_bytes()))


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--repeat", type=int, default=3)
    ap.add_argument("--no-big", action="store_true", help="skip the 20,000-sample well")
    args = ap.parse_args()
    from logprep.io.tops import read_tops

    demo = example_logs_dir()
    settings = ScreenSettings(tops_file=str(demo / "tops.csv"), survey_dir=str(demo / "surveys"))
    tops = read_tops(settings.tops_file)
    print("seconds per well, best of", args.repeat, "interleaved runs; ratio = with sheet / tables only")
    total_t = total_s = total_tc = total_sc = 0.0
    with tempfile.TemporaryDirectory() as tmp:
        out = Path(tmp)
        wells = sorted(demo.glob("*.las"))
        for sheets in (False, True):  # imports and font caches warmed once, untimed
            screen_one(wells[0], "warm", out, settings, tops, sheets)
        for f in wells:
            (t, tc), (s, sc), row = ratio(f, settings, tops, args.repeat, out)
            total_t, total_s, total_tc, total_sc = total_t + t, total_s + s, total_tc + tc, total_sc + sc
            print(f"  {f.stem:<10} wall: tables {t:6.2f} sheet {s:6.2f} ratio {s / t:5.2f}   "
                  f"cpu: tables {tc:6.2f} sheet {sc:6.2f} ratio {sc / tc:5.2f}  "
                  f"({row['sand_sand_windows']} windows, {pdf_pages(out / 's' / 'sheet.pdf')} pages, "
                  f"sheet.pdf {(out / 's' / 'sheet.pdf').stat().st_size / 1e3:.0f} kB)")
        print(f"  examples, all wells: ratio wall {total_s / total_t:.2f}, cpu {total_sc / total_tc:.2f} "
              "(target <= 2)")
        first = wells[0]
        (t, tc), _, _ = ratio(first, settings, tops, args.repeat, out)
        print(f"  where {first.stem}'s sheet time goes, CPU per page (built and written alone) "
              f"as a share of the well tables-only ({tc:.2f} s):")
        from logprep.io.las import read_well
        from logprep.run.pipeline import screen_well

        first_result = screen_well(read_well(first), settings, tops=tops)
        for name, cpu in page_split(first_result, args.repeat):
            print(f"    {name:<22} {cpu:6.3f} s  {cpu / tc:5.2f}x tables-only")
        floor = frame_floor(first_result, args.repeat)
        print(f"  {first.stem}'s pages with the data removed (axes, ticks, legends, tables, text "
              f"only): {floor:.3f} s = {floor / tc:.2f}x tables-only, so its ratio cannot fall "
              f"below {1 + floor / tc:.2f} with this layout drawn by matplotlib")
        if not args.no_big:
            big = big_well(out / "BENCH-BIG.las")
            plain = ScreenSettings()
            (t, tc), (s, sc), row = ratio(big, plain, None, max(1, args.repeat - 1), out)
            n_rows = len((out / "s" / "juxtapositions.csv").read_text().splitlines()) - 1
            print(f"  20,000 samples: wall: tables {t:6.2f} sheet {s:6.2f} ratio {s / t:5.2f}   "
                  f"cpu: tables {tc:6.2f} sheet {sc:6.2f} ratio {sc / tc:5.2f} "
                  f"(target <= 3; {row['sand_sand_windows']} windows between different sands, "
                  f"{n_rows} rows, {pdf_pages(out / 's' / 'sheet.pdf')} pages, "
                  f"sheet.pdf {(out / 's' / 'sheet.pdf').stat().st_size / 1e6:.2f} MB)")

if __name__ == "__main__":
    main()
