"""``overview.html``: one self-contained page (no server, no network, no external file).

The table is plain HTML, so it reads even with scripts off; a few lines of inline script
sort it on a click of a column head and filter it by text, kind, status and worst
verdict.  The map is inline SVG.  A Content-Security-Policy forbids every fetch, so the
page can never reach out to a network, whatever a well name holds.
"""

from __future__ import annotations

import datetime as _dt
import os
import html
from urllib.parse import quote

from logprep import __version__
from logprep.fault.capacity import VERDICTS
from logprep.report.caution import CAUTION
from logprep.io.locations import GEOGRAPHIC, map_xy
from logprep.report.overview import (
    WORST_ORDER,
    WORST_STYLE,
    OverviewRow,
    pair_colour,
    pair_ends,
)

COLUMNS = [
    # key, heading, tooltip, numeric
    ("kind", "kind", "a single well or a well pair across a fault", False),
    ("name", "well / pair", "WELL name from the LAS header (pairs: footwall / hanging wall)", False),
    ("status", "status", "ok, or error with its message", False),
    ("worst", "worst verdict", "worst window verdict of the well or pair", True),
    ("layers", "layers", "blocked layers", True),
    ("sands", "sands", "reservoir sands (layers classed sand)", True),
    ("leak", "leak", "windows with verdict leak", True),
    ("uncertain", "uncertain", "windows with verdict uncertain", True),
    ("seal", "seal", "windows with verdict seal", True),
    ("min_sgr", "lowest SGR %", "lowest SGR over the sand-sand windows", True),
    ("min_oil", "smallest oil column m", "smallest oil column a window holds", True),
    ("min_co2", "smallest CO2 column m", "smallest CO2 column a window holds", True),
    ("notes", "notes and warnings", "what was assumed, converted or left out (notes.txt)", False),
    ("files", "files", "the sheet and tables of the well or pair", False),
]

_CSS = """
body{font-family:system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;margin:1.2em 1.6em;color:#222}
h1{font-size:1.35em;margin:0 0 .2em}
.sub{color:#555;margin:0 0 .8em}
.caution{background:#FFF4E5;border:1px solid #D55E00;color:#7A1F00;padding:.5em .8em;max-width:70em}
.top{display:flex;gap:1.5em;flex-wrap:wrap;align-items:flex-start;margin:1em 0}
.controls label{margin-right:1em;white-space:nowrap}
table{border-collapse:collapse;font-size:.86em;margin-top:.6em}
th,td{border:1px solid #ccc;padding:.25em .45em;vertical-align:top}
th{background:#eee;position:sticky;top:0}
th button{font:inherit;font-weight:600;border:0;background:none;cursor:pointer;padding:0;text-align:left}
th[aria-sort=ascending] button::after{content:" \\25B2"}
th[aria-sort=descending] button::after{content:" \\25BC"}
td.num{text-align:right;font-variant-numeric:tabular-nums}
tbody tr:nth-child(even){background:#F7F7F7}
.chip{display:inline-block;width:.8em;height:.8em;margin-right:.3em;border:1px solid #444;vertical-align:-.05em}
.notes{max-width:28em;font-size:.92em;color:#444}
.err{color:#7A1F00}
svg text{font-size:11px;font-family:inherit}
@media print{.controls{display:none}th{position:static}}
"""

_SCRIPT = """
(function(){
 var table=document.getElementById('wells'), body=table.tBodies[0];
 var heads=Array.prototype.slice.call(table.tHead.rows[0].cells);
 function key(row,i){var c=row.cells[i];return c.hasAttribute('data-v')?c.getAttribute('data-v'):c.textContent.trim().toLowerCase();}
 heads.forEach(function(th,i){
  th.querySelector('button').addEventListener('click',function(){
   var asc=th.getAttribute('aria-sort')!=='ascending', num=th.getAttribute('data-num')==='1';
   heads.forEach(function(h){h.removeAttribute('aria-sort');});
   th.setAttribute('aria-sort',asc?'ascending':'descending');
   var rows=Array.prototype.slice.call(body.rows);
   rows.sort(function(a,b){
    var x=key(a,i), y=key(b,i);
    if(num){ if(x===''&&y==='')return 0; if(x==='')return 1; if(y==='')return -1; x=+x; y=+y; }
    var d=x<y?-1:(x>y?1:0); return asc?d:-d;});
   rows.forEach(function(r){body.appendChild(r);});
  });
 });
 var text=document.getElementById('f-text'), kind=document.getElementById('f-kind'),
     status=document.getElementById('f-status'), worst=document.getElementById('f-worst'),
     count=document.getElementById('shown');
 function filter(){
  var t=text.value.trim().toLowerCase(), n=0;
  Array.prototype.forEach.call(body.rows,function(r){
   var ok=(!t||r.textContent.toLowerCase().indexOf(t)>=0)
     &&(!kind.value||r.getAttribute('data-kind')===kind.value)
     &&(!status.value||r.getAttribute('data-status')===status.value)
     &&(!worst.value||r.getAttribute('data-worst')===worst.value);
   r.hidden=!ok; if(ok)n++;});
  count.textContent=n+' of '+body.rows.length+' rows shown';
 }
 [text,kind,status,worst].forEach(function(e){e.addEventListener('input',filter);e.addEventListener('change',filter);});
 filter();
})();
"""


def _e(text) -> str:
    return html.escape(str(text), quote=True)


def _fmt(value, digits: int = 1) -> tuple[str, str]:
    """Shown text and sort value of a number (blank when unknown)."""
    if value is None:
        return "", ""
    if isinstance(value, int):
        return str(value), str(value)
    return f"{value:.{digits}f}", f"{value:.6g}"


def _chip(worst: str) -> str:
    colour = WORST_STYLE[worst][0]
    return f'<span class="chip" style="background:{colour}"></span>{_e(worst)}'


def _row_html(r: OverviewRow) -> str:
    cells = []

    def cell(text: str, value: str | None = None, cls: str = "", raw: bool = False) -> None:
        attrs = (f' data-v="{_e(value)}"' if value is not None else "") + (f' class="{cls}"' if cls else "")
        cells.append(f"<td{attrs}>{text if raw else _e(text)}</td>")

    cell(r.kind)
    first_link = r.links[0][1] if r.links else ""
    name = (f'<a href="{_e(quote(first_link))}">{_e(r.name)}</a>' if first_link else _e(r.name))
    cell(name, r.name.lower(), raw=True)
    cell(r.status, cls="" if r.status == "ok" else "err")
    cell(_chip(r.worst), str(WORST_ORDER.index(r.worst)), raw=True)
    for value in (r.layers, r.sands):
        cell(*_fmt(value), cls="num")
    for v in VERDICTS:
        cell(*_fmt(r.verdicts.get(v) if r.verdicts else None), cls="num")
    cell(*_fmt(r.min_sgr_pct), cls="num")
    cell(*_fmt(r.min_oil_column_m, 0), cls="num")
    cell(*_fmt(r.min_co2_column_m, 0), cls="num")
    notes = [r.message] if r.status != "ok" and r.message else []
    notes += r.notes
    cell("<br>".join(_e(n) for n in notes), cls="notes" + (" err" if r.status != "ok" else ""),
         raw=True)
    links = " ".join(f'<a href="{_e(quote(path))}">{_e(label)}</a>' for label, path in r.links)
    cell(links, raw=True)
    return (f'<tr data-kind="{_e(r.kind)}" data-status="{_e(r.status)}" '
            f'data-worst="{_e(r.worst)}">' + "".join(cells) + "</tr>")


def _marker_svg(x: float, y: float, worst: str, size: float = 6.0) -> str:
    colour, marker = WORST_STYLE[worst]
    s = size
    if marker == "^":
        return (f'<polygon points="{x:.1f},{y - s:.1f} {x - s:.1f},{y + s * .8:.1f} '
                f'{x + s:.1f},{y + s * .8:.1f}" fill="{colour}" stroke="#222"/>')
    if marker == "D":
        return (f'<polygon points="{x:.1f},{y - s:.1f} {x + s:.1f},{y:.1f} {x:.1f},{y + s:.1f} '
                f'{x - s:.1f},{y:.1f}" fill="{colour}" stroke="#222"/>')
    if marker == "o":
        return f'<circle cx="{x:.1f}" cy="{y:.1f}" r="{s * .8:.1f}" fill="{colour}" stroke="#222"/>'
    if marker == "v":
        return (f'<polygon points="{x:.1f},{y + s:.1f} {x - s:.1f},{y - s * .8:.1f} '
                f'{x + s:.1f},{y - s * .8:.1f}" fill="{colour}" stroke="#222"/>')
    if marker == "s":
        return (f'<rect x="{x - s * .7:.1f}" y="{y - s * .7:.1f}" width="{s * 1.4:.1f}" '
                f'height="{s * 1.4:.1f}" fill="{colour}" stroke="#222"/>')
    return (f'<path d="M{x - s:.1f},{y - s:.1f}L{x + s:.1f},{y + s:.1f}M{x - s:.1f},{y + s:.1f}'
            f'L{x + s:.1f},{y - s:.1f}" stroke="{colour}" stroke-width="2.2"/>')


def place_labels(points, labels, char_w: float = 6.3, height: float = 12.0, box=(0, 0, 1e9, 1e9)):
    """Label anchors ``(x, y, text-anchor)`` beside each point so that no two labels
    overlap each other or a point and all stay in ``box`` (x0, y0, x1, y1), trying right,
    left, above and below in turn; a label that fits nowhere is left out (None)."""
    placed, out = [], []
    marks = [(x - 7, y - 7, x + 7, y + 7) for x, y in points]
    for (x, y), text in zip(points, labels):
        w = char_w * len(text)
        choice = None
        for ax, ay, anchor, rect in (
                (x + 9, y + 4, "start", (x + 8, y - height / 2, x + 8 + w, y + height / 2)),
                (x - 9, y + 4, "end", (x - 8 - w, y - height / 2, x - 8, y + height / 2)),
                (x, y - 10, "middle", (x - w / 2, y - 9 - height, x + w / 2, y - 9)),
                (x, y + 19, "middle", (x - w / 2, y + 9, x + w / 2, y + 9 + height))):
            inside = box[0] <= rect[0] and rect[2] <= box[2] and box[1] <= rect[1] and rect[3] <= box[3]
            clash = any(not (rect[2] <= o[0] or o[2] <= rect[0] or rect[3] <= o[1] or o[3] <= rect[1])
                        for o in placed + [m for m in marks if m != (x - 7, y - 7, x + 7, y + 7)])
            if inside and not clash:
                choice = (ax, ay, anchor)
                placed.append(rect)
                break
        out.append(choice)
    return out


def map_svg(rows: list[OverviewRow], width: int = 460, height: int = 340) -> tuple[str, str]:
    """Inline SVG map of the located wells (and pair lines) coloured by worst verdict,
    each well linking to its sheet; ``("", reason)`` when no well is located."""
    wells = [r for r in rows if r.kind == "well" and r.location is not None]
    if not wells:
        return "", "no well locations in the LAS headers or a locations file"
    xy, kind, note = map_xy([r.location for r in wells])
    drawn = [(r, p) for r, p in zip(wells, xy) if p is not None]
    xs, ys = [p[0] for _, p in drawn], [p[1] for _, p in drawn]
    span = max(max(xs) - min(xs), max(ys) - min(ys)) or 1.0
    pad, foot = 40, 30
    scale = min((width - 2 * pad) / span, (height - 2 * pad - foot) / span)
    cx, cy = (max(xs) + min(xs)) / 2, (max(ys) + min(ys)) / 2

    def to_px(px: float, py: float) -> tuple[float, float]:
        return width / 2 + (px - cx) * scale, (height - foot) / 2 - (py - cy) * scale

    parts = [(f'<svg xmlns="http://www.w3.org/2000/svg" width="{width}" height="{height}" '
              f'viewBox="0 0 {width} {height}" role="img" aria-label="map of wells">'),
             f'<rect x="0.5" y="0.5" width="{width - 1}" height="{height - 1}" fill="#FFF" stroke="#999"/>']
    pts = [to_px(*p) for _, p in drawn]
    px_of = {id(r.location): pt for (r, _), pt in zip(drawn, pts)}
    ends = pair_ends(rows)
    for r in rows:
        a, b = ends.get(r.name, (None, None)) if r.kind == "pair" else (None, None)
        if id(a) in px_of and id(b) in px_of:
            (x1, y1), (x2, y2) = px_of[id(a)], px_of[id(b)]
            parts.append(f'<line x1="{x1:.1f}" y1="{y1:.1f}" x2="{x2:.1f}" y2="{y2:.1f}" '
                         f'stroke="{pair_colour(r.worst)}" stroke-width="3" stroke-dasharray="6 3">'
                         f'<title>pair {_e(r.name)}: {_e(r.worst)}</title></line>')
    anchors = place_labels(pts, [r.name for r, _ in drawn], box=(2, 2, width - 2, height - foot))
    for (r, _), (x, y), anchor in zip(drawn, pts, anchors):
        mark = _marker_svg(x, y, r.worst) + f"<title>{_e(r.name)}: {_e(r.worst)}</title>"
        link = next((p for label, p in r.links if label == "png"), r.links[0][1] if r.links else "")
        parts.append(f'<a href="{_e(quote(link))}">{mark}</a>' if link else f"<g>{mark}</g>")
        if anchor:
            parts.append(f'<text x="{anchor[0]:.1f}" y="{anchor[1]:.1f}" text-anchor="{anchor[2]}">'
                         f"{_e(r.name)}</text>")
    unit = "degrees (equirectangular)" if kind == GEOGRAPHIC else "grid units as given"
    bar = 10 ** int(f"{span / 4:e}".split("e")[1]) if span > 0 else 1
    bar_px = bar * scale
    y0 = height - 14
    parts.append(f'<path d="M12,{y0}h{bar_px:.1f}" stroke="#222" stroke-width="2"/>'
                 f'<text x="{16 + bar_px:.1f}" y="{y0 + 4}">{bar:g} ({_e(unit)})</text>'
                 f'<text x="{width - 14}" y="18" text-anchor="end">N &#8593;</text>')
    parts.append("</svg>")
    missing = len(rows) - len(drawn) - sum(r.kind == "pair" for r in rows)
    notes = [note] if note else []
    if missing:
        notes.append(f"{missing} well(s) without a location are not on the map")
    return "".join(parts), "; ".join(notes)


def _legend() -> str:
    items = [f'<li><svg width="16" height="16">{_marker_svg(8, 8, w, 5)}</svg> {_e(w)}</li>'
             for w in WORST_ORDER]
    return ('<ul style="list-style:none;padding:0;margin:.3em 0">' + "".join(items) +
            '<li><svg width="22" height="10"><line x1="0" y1="5" x2="22" y2="5" stroke="#555" '
            'stroke-width="3" stroke-dasharray="6 3"/></svg> well pair</li></ul>')


def _options(values) -> str:
    return "".join(f'<option value="{_e(v)}">{_e(v)}</option>' for v in values)



def _written_stamp() -> str:
    """``", written YYYY-MM-DD HH:MM UTC"`` from ``SOURCE_DATE_EPOCH`` when it is set, else
    ``""``: a page that carries the wall-clock time would differ between two runs of the same
    inputs (the batch promises byte-identical outputs; the file's own time says when)."""
    epoch = os.environ.get("SOURCE_DATE_EPOCH", "").strip()
    if not epoch.isdigit():
        return ""
    when = _dt.datetime.fromtimestamp(int(epoch), tz=_dt.UTC)
    return f", written {when:%Y-%m-%d %H:%M} UTC"

def overview_html(rows: list[OverviewRow], verdict_rule: str = "", title: str = "Field overview") -> str:
    """The whole page as text."""
    n_well = sum(r.kind == "well" for r in rows)
    n_pair = len(rows) - n_well
    failed = [r for r in rows if r.status != "ok"]
    svg, map_note = map_svg(rows)
    heads = "".join(f'<th data-num="{int(num)}" title="{_e(tip)}"><button type="button">{_e(h)}'
                    "</button></th>" for _, h, tip, num in COLUMNS)
    body = "\n".join(_row_html(r) for r in rows)
    fails = ("<h2>Failed</h2><ul>" + "".join(f'<li class="err"><b>{_e(r.name)}</b>: {_e(r.message)}</li>'
                                              for r in failed) + "</ul>") if failed else ""
    stamp = _written_stamp()
    return f"""<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; script-src 'unsafe-inline'; style-src 'unsafe-inline'; img-src data:">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>{_e(title)}</title><style>{_CSS}</style></head><body>
<h1>{_e(title)}: {n_well} well(s), {n_pair} pair(s), {len(failed)} failed</h1>
<p class="sub">logprep {_e(__version__)}{stamp}. {_e(verdict_rule)}{'.' if verdict_rule else ''}
Click a column head to sort; the complete tables are in each folder and in summary.csv.</p>
<p class="caution"><b>CAUTION:</b> {_e(CAUTION)}</p>
<div class="top"><div>{svg or '<p>' + _e(map_note) + '</p>'}
{('<p class="sub">' + _e(map_note) + '</p>') if svg and map_note else ''}</div>
<div><b>Worst verdict</b>{_legend()}</div></div>
<div class="controls">
<label>Filter <input id="f-text" type="search" placeholder="any text"></label>
<label>kind <select id="f-kind"><option value="">all</option>{_options(['well', 'pair'])}</select></label>
<label>status <select id="f-status"><option value="">all</option>{_options(['ok', 'error'])}</select></label>
<label>worst verdict <select id="f-worst"><option value="">all</option>{_options(WORST_ORDER)}</select></label>
<span id="shown"></span></div>
<table id="wells"><thead><tr>{heads}</tr></thead><tbody>
{body}
</tbody></table>
{fails}
<script>{_SCRIPT}</script>
</body></html>
"""
