"""Write the hostile LAS corpus in this folder (run: python tests/data/hostile/make_hostile.py).

Each file has one quirk, named in its file name.  ``good_*`` files must be screened
(possibly with a warning); ``bad_*`` files must be refused with one line
``FILE: what is wrong; what to do``.  :data:`CASES` gives, per file, the expected status
and a piece of the expected message or warning; README.md lists them and
``tests/test_hostile.py`` runs the folder as one batch.  Cases that cannot live in a
repository (odd file names, links, a 1 GiB sparse file) are made at test time by
:func:`make_runtime_cases`.  Everything is generated, deterministic and fictitious.
"""

from __future__ import annotations

import gzip
import io
import os
import zipfile
from pathlib import Path

import numpy as np

HERE = Path(__file__).parent


def column(n: int = 80, step: float = 0.5, top: float = 1000.0, random_state: int = 1):
    """Depth (m) and a noisy sand-shale-sand GR (API): 40 API sands, 110 API shale."""
    rng = np.random.default_rng(random_state)
    z = top + step * np.arange(n)
    shale = (z >= top + 0.3 * step * n) & (z < top + 0.6 * step * n)
    gr = np.where(shale, 110.0, 40.0) + rng.normal(0, 4, n)
    return z, gr


def las2(rows=None, *, well="HOSTILE-1", unit="M", vers="2.0", wrap="NO", null="-999.25",
         curves=(("GR", "GAPI"),), index=("DEPT", "M"), extra_well="", fmt="{:.4f}",
         sep=" ", data=None, eol="\n") -> str:
    """A LAS 2.0 text; ``rows`` default to :func:`column` (depth, GR)."""
    if rows is None:
        z, gr = column()
        rows = list(zip(z, gr))
    head = [
        "~VERSION INFORMATION",
        f" VERS.   {vers} : CWLS LOG ASCII STANDARD",
        f" WRAP.   {wrap} : LINE MODE",
        "~WELL INFORMATION",
        f" STRT.{unit}  {rows[0][0] if rows else 0} : START DEPTH",
        f" STOP.{unit}  {rows[-1][0] if rows else 0} : STOP DEPTH",
        f" STEP.{unit}  0.5 : STEP",
        f" NULL.   {null} : NULL VALUE",
        f" WELL.   {well} : WELL",
    ]
    if extra_well:
        head.append(extra_well)
    head.append("~CURVE INFORMATION")
    head.append(f" {index[0]}.{index[1]} : DEPTH")
    head += [f" {m}.{u} : {m} CURVE" for m, u in curves]
    head.append("~A")
    body = data if data is not None else [sep.join(fmt.format(v) for v in r) for r in rows]
    return eol.join(head + body) + eol


def _rows(n=80, **kw):
    z, gr = column(n, **kw)
    return [list(r) for r in zip(z, gr)]


def _gr_rows(values):
    z, _ = column(len(values))
    return [[a, b] for a, b in zip(z, values)]


def _las3() -> str:
    z, gr = column()
    rows = "".join(f"{a:.4f},{b:.4f}\n" for a, b in zip(z, gr))
    return ("~Version\n VERS. 3.0 : CWLS LOG ASCII STANDARD - VERSION 3.0\n"
            " WRAP. NO : ONE LINE PER DEPTH STEP\n DLM . COMMA : DELIMITING CHARACTER\n"
            "~Well\n STRT.M 1000.0 :\n STOP.M 1039.5 :\n STEP.M 0.5 :\n NULL. -999.25 :\n"
            " WELL. HOSTILE-L3 : WELL\n~Log_Parameter\n BHT.DEGC 35.5 : BOTTOM HOLE TEMPERATURE\n"
            "~Log_Definition\n DEPT.M : DEPTH {F}\n GR.GAPI : GAMMA RAY {F}\n"
            "~Core_Definition\n CORT.M : CORE TOP {F}\n CORB.M : CORE BASE {F}\n"
            "~Core_Data | Core_Definition\n1010.0,1012.0\n"
            "~Log_Data | Log_Definition\n" + rows)


def _wrapped() -> str:
    z, gr = column()
    body = []
    for a, b in zip(z, gr):
        body += [f"{a:.4f}", f"{b:.4f} {b / 2:.4f}"]
    return las2(wrap="YES", curves=(("GR", "GAPI"), ("GRH", "GAPI")), data=body)


def _wrapped_flag_no() -> str:
    z, gr = column()
    body = []
    for a, b in zip(z, gr):
        body += [f"{a:.4f}", f"{b:.4f} {b / 2:.4f}"]
    return las2(wrap="NO", curves=(("GR", "GAPI"), ("GRH", "GAPI")), data=body)


def _clipped() -> str:
    z, gr = column(200, random_state=3)
    gr = np.minimum(gr + 40, 150.0)  # the shale reads flat at 150 API
    return las2(list(zip(z, gr)))


def _zip_bytes() -> bytes:
    buf = io.BytesIO()
    with zipfile.ZipFile(buf, "w") as z:
        z.writestr(zipfile.ZipInfo("well.las", date_time=(2000, 1, 1, 0, 0, 0)), las2())
    return buf.getvalue()


def _repeated_mnemonics(n=400) -> str:
    z, gr = column(40)
    curves = tuple(("GR", "GAPI") for _ in range(n))
    body = [" ".join([f"{a:.2f}"] + [f"{b:.2f}"] * n) for a, b in zip(z, gr)]
    return las2(curves=curves, data=body)


def _text(s: str) -> bytes:
    return s.encode("utf-8")


CASES: dict[str, tuple[str, str, bytes]] = {}
"""File name -> (expected status ``ok``/``error``, a piece of its message or warning,
content)."""


def case(name: str, status: str, expect: str, content) -> None:
    CASES[name] = (status, expect, content if isinstance(content, bytes) else _text(content))


def build_cases() -> None:
    CASES.clear()
    good = las2()
    # --- readable files: screened, some with a warning -------------------------------
    case("good_plain_metres.las", "ok", "", good)
    case("good_depth_in_feet.las", "ok", "", las2(unit="FT", index=("DEPT", "FT")))
    case("good_decreasing_depth.las", "ok", "", las2(_rows()[::-1]))
    case("good_las12.las", "ok", "", las2(vers="1.2"))
    case("good_wrapped_rows.las", "ok", "", _wrapped())
    case("good_las30_comma_delimited.las", "ok", "LAS 3.0 sections not used", _las3())
    case("good_tab_separated.las", "ok", "", las2(sep="\t"))
    case("good_crlf_line_ends.las", "ok", "", las2(eol="\r\n"))
    case("good_cr_only_line_ends.las", "ok", "", las2(eol="\r"))
    case("good_utf8_accented_name.las", "ok", "", las2(well="Brønn-7"))
    case("good_utf8_bom.las", "ok", "", b"\xef\xbb\xbf" + _text(las2(well="Brønn-8")))
    case("good_cp1252_header.las", "ok", "read as cp1252", las2(well="Br\u00f8nn-9").encode("cp1252"))
    case("good_utf16_bom.las", "ok", "", las2(well="UTF16-1").encode("utf-16"))
    case("good_comma_decimal_marks.las", "ok", "", las2(fmt="{:.4f}").replace("~A\n", "~A\n", 1)
         .replace(".", ",").replace(" VERS,", " VERS.").replace(" WRAP,", " WRAP.")
         .replace("STRT,M", "STRT.M").replace("STOP,M", "STOP.M").replace("STEP,M", "STEP.M")
         .replace("NULL,", "NULL.").replace("WELL,", "WELL.").replace("DEPT,M", "DEPT.M")
         .replace("GR,GAPI", "GR.GAPI").replace("-999,25", "-999.25"))
    case("good_null_minus9999.las", "ok", "", las2(null="-9999"))
    case("good_gr_alias_gam.las", "ok", "", las2(curves=(("GAM", "GAPI"),)))
    case("good_trailing_blank_lines.las", "ok", "", good + "\n\n\n   \n")
    case("good_leading_blank_lines.las", "ok", "", "\n\n" + good)
    case("good_dollar_math_well_name.las", "ok", "", las2(well="A$\\foo$"))
    case("good_formula_well_name.las", "ok", "", las2(well='=HYPERLINK("http://x.invalid","y")'))
    case("good_escape_sequence_name.las", "ok", "control character", las2(well="RED\x1b[31mWELL\x07"))
    case("pair_HRM-2_HRM-3.las", "ok", "", good)
    case("good_three_samples.las", "ok", "only 3 depth samples", las2(_rows(3)))
    case("good_clipped_gr.las", "ok", "flat at its maximum", _clipped())
    case("good_wrap_flag_no_but_wrapped.las", "ok", "WRAP. NO", _wrapped_flag_no())
    case("good_long_header_line.las", "ok", "header line(s) over",
         las2(extra_well=" COMP. " + "A" * 200_000 + " : COMPANY"))
    case("good_400_repeated_mnemonics.las", "ok", "repeated curve mnemonics", _repeated_mnemonics())
    case("good_repeated_well_items.las", "ok", "",
         las2(extra_well="\n".join(f" EPD.M {k} : ELEVATION" for k in range(30))))
    case("good_gr_1e308_values.las", "ok", "set missing",
         las2(_gr_rows(np.where(np.arange(80) % 17 == 0, 1e308, column()[1]))))
    case("good_gr_overflow_1e999.las", "ok", "set missing",
         las2(data=[f"{a:.4f} {'1e+999' if k % 13 == 0 else f'{b:.4f}'}"
                    for k, (a, b) in enumerate(zip(*column()))]))
    case("good_inf_in_other_curve.las", "ok", "set missing",
         las2(curves=(("GR", "GAPI"), ("RHOB", "G/CC")),
              data=[f"{a:.4f} {b:.4f} {'inf' if k % 9 == 0 else '2.4'}"
                    for k, (a, b) in enumerate(zip(*column()))]))
    case("good_text_column.las", "ok", "",
         las2(curves=(("GR", "GAPI"), ("LITH", "")),
              data=[f"{a:.4f} {b:.4f} SAND" for a, b in zip(*column())]))
    case("good_nan_words.las", "ok", "",
         las2(data=[f"{a:.4f} {'NaN' if k % 7 == 0 else f'{b:.4f}'}"
                    for k, (a, b) in enumerate(zip(*column()))]))
    case("bad_run_together_numbers.las", "error", "holds text",
         las2(curves=(("GR", "GAPI"), ("SP", "MV")),
              data=[f"{a:.4f} {b:.4f}-12.5000" for a, b in zip(*column())]))
    case("good_comment_lines_in_data.las", "ok", "",
         las2(data=["# data follow"] + [f"{a:.4f} {b:.4f}" for a, b in zip(*column())]))
    case("good_index_null_row.las", "ok", "",
         las2(data=["-999.25 50.0"] + [f"{a:.4f} {b:.4f}" for a, b in zip(*column())]))
    case("good_negative_depth_above_datum.las", "ok", "", las2(_rows(top=-20.0)))
    case("good_other_section.las", "ok", "", good.replace("~A", "~OTHER\n free text. with dots: and colons\n~A"))
    case("good_lowercase_sections.las", "ok", "", good.replace("~VERSION", "~version").replace("~A", "~a"))
    # --- refused: one line saying what is wrong and what to do -------------------------
    case("bad_empty.las", "error", "file is empty", b"")
    case("bad_only_whitespace.las", "error", "not a readable LAS file", b"   \n\n \t\n")
    case("bad_plain_text.las", "error", "not a readable LAS file", b"These are my notes on well 7.\n")
    case("bad_html_page.las", "error", "web page", b"<!DOCTYPE html>\n<html><body>~A</body></html>\n")
    case("bad_gzip_archive.las", "error", "gzip", gzip.compress(_text(good), mtime=0))
    case("bad_zip_archive.las", "error", "zip archive", _zip_bytes())
    case("bad_pdf_document.las", "error", "PDF", b"%PDF-1.4\n%\xe2\xe3\xcf\xd3\n1 0 obj\n")
    case("bad_png_image.las", "error", "PNG", b"\x89PNG\r\n\x1a\n" + bytes(64))
    case("bad_nul_tail.las", "error", "NUL", _text(good) + bytes(65536))
    case("bad_mostly_nul.las", "error", "NUL", _text(good[:300]) + bytes(200_000))
    case("bad_nul_in_middle.las", "error", "NUL", _text(good[:600]) + b"\0\0\0" + _text(good[600:]))
    case("bad_random_binary.las", "error", "",
         np.random.default_rng(5).integers(1, 256, 4096, dtype=np.uint8).tobytes())
    case("bad_truncated_mid_row.las", "error", "~A values do not fill whole rows", good[:-9])
    case("bad_truncated_in_header.las", "error", "no log data section", good[:good.index("~CURVE")])
    case("bad_no_data_rows.las", "error", "no", las2(data=[]))
    case("bad_no_curve_section.las", "error", "no ~Curve section", good[:good.index("~CURVE")] + good[good.index("~A"):])
    case("bad_one_row.las", "error", "fewer than two depth samples", las2(_rows(1)))
    case("bad_depth_1e15.las", "error", "beyond any borehole",
         las2([[1e15 + 0.05 * k, 50.0 + k % 7] for k in range(80)], fmt="{!r}"))
    case("bad_depth_step_1e-7.las", "error", "finer than any logging tool",
         las2([[1000.0 + 1e-7 * k, 50.0 + k % 7] for k in range(80)], fmt="{:.9f}"))
    case("bad_depth_minus_20000.las", "error", "beyond any borehole",
         las2([[-20000.0 + 0.5 * k, 50.0] for k in range(80)]))
    case("bad_duplicate_depth.las", "error", "remove the repeated rows",
         las2([[1000.0 + 0.5 * (k - (k > 10)), 50.0] for k in range(80)]))
    case("bad_depth_goes_back.las", "error", "sort the rows",
         las2([[1000.0 + 0.5 * k - (20.0 if k > 40 else 0.0), 50.0] for k in range(80)]))
    case("bad_all_depth_null.las", "error", "fewer than two depth samples",
         las2([[-999.25, 50.0] for _ in range(80)]))
    case("bad_time_index.las", "error", "time, not depth", las2(index=("ETIM", "S"), unit="S"))
    case("bad_unknown_depth_unit.las", "error", "--depth-unit", las2(index=("DEPT", "XX"), unit="XX"))
    case("bad_no_depth_unit.las", "error", "--depth-unit", las2(index=("DEPT", ""), unit=""))
    case("bad_no_gr_curve.las", "error", "--gr-curve", las2(curves=(("RHOB", "G/CC"),)))
    case("bad_all_gr_null.las", "error", "--gr-curve", las2(_gr_rows([-999.25] * 80)))
    case("bad_gr_all_text.las", "error", "holds text", las2(data=[f"{a:.4f} ERR" for a in column()[0]]))
    case("bad_all_gr_1e308.las", "error", "--gr-curve", las2(_gr_rows([1e308] * 80)))
    case("bad_constant_gr.las", "error", "", las2(_gr_rows([60.0] * 80)))
    case("good_fewer_columns_than_curves.las", "ok", "not the 4 columns",
         las2(curves=(("GR", "GAPI"), ("RHOB", "G/CC"), ("NPHI", "V/V")),
              data=[f"{a:.4f} {b:.4f}" for a, b in list(zip(*column()))[:79]]))
    case("bad_las30_header_only.las", "error", "no log data section",
         _las3()[:_las3().index("~Log_Data")])
    case("bad_utf16_bom_then_garbage.las", "error", "", b"\xff\xfe" + b"\x00\xd8" * 3)
    case("good_stray_tilde_line.las", "ok", "",
         las2(extra_well=" ~~~ this line is not a header item ~~~"))


def make_runtime_cases(folder: Path, source: Path) -> dict[str, str]:
    """Cases a repository cannot hold, written into ``folder`` from the good file
    ``source``: odd file names (a line feed, a byte that is not UTF-8, a trailing space, a
    leading dash, shell and math characters), links to one file, and a 1 GiB sparse file
    of NUL bytes after 600 rows.  Returns name -> expected status (names as ``str``,
    undecodable bytes kept as surrogate escapes)."""
    data = source.read_bytes()
    expected = {}
    odd = [b"good_line\nfeed.las", b"good_not_utf8_\xff\xfe.las", b"good_trailing_space .las",
           b"-good_leading_dash.las", b"good_shell_$(echo)_;&|.las", b"good_math_$x^2$.las"]
    for raw in odd:
        path = os.path.join(os.fsencode(folder), raw)
        with open(path, "wb") as f:
            f.write(data)
        expected[os.fsdecode(raw)] = "ok"
    links = folder / "links"
    links.mkdir()
    for k in range(20):
        (links / f"link_{k:02d}.las").symlink_to(source.resolve())
    # links to a file already in the corpus: passed over as duplicates, not extra wells
    sparse = folder / "bad_sparse_1GiB_nul.las"
    z, gr = column(600)
    with sparse.open("wb") as f:
        f.write(_text(las2(list(zip(z, gr)))))
        f.truncate(1024**3)
    expected[sparse.name] = "error"
    return expected


def main() -> None:
    build_cases()
    for old in HERE.glob("*.las"):
        old.unlink()
    for name, (_status, _expect, content) in CASES.items():
        (HERE / name).write_bytes(content)
    print(f"wrote {len(CASES)} files to {HERE}")


if __name__ == "__main__":
    main()
