"""The fault page: one named fault at its throw range, with the spread of the answer.

Drawn from a :class:`~logprep.run.faults.FaultResult` and the footwall well's SGR field
(one well) or the pair's two-well field: the triangle diagram cut to throws around the
fault's range with that range shaded and the reservoir-pair contacts outlined; per pair
the P10-P50-P90 of minimum SGR and of the oil column, the probabilities of juxtaposition
and of seal as bars; the first-order sensitivity of the weakest pair as bars; and one
plain sentence per pair.  Object API only (no pyplot state).
"""

from __future__ import annotations

import numpy as np
from matplotlib.figure import Figure

from logprep.report.caution import CAUTION

MAX_PAIRS = 10
"""Pairs drawn on the page (most often juxtaposed first); every pair is in faults.csv."""
RANGE_INK = "#0072B2"  # Okabe & Ito blue: the fault's throw range
SEAL_INK = "#009E73"   # bluish green: probability of seal
JUXT_INK = "#BBBBBB"


def shown_pairs(table, n: int = MAX_PAIRS):
    """Row positions of up to ``n`` pairs: cross-fault pairs before a sand against itself,
    then most often juxtaposed, then lowest P(seal)."""
    t = table.reset_index(drop=True)
    order = t.assign(_k=t["self_juxtaposed"].astype(int), _p=-t["p_juxtaposed"], _s=t["p_seal"])
    order = order.sort_values(["_k", "_p", "_s"], kind="stable")
    return list(order.index[:n])


def pair_sentence(row) -> str:
    """One plain sentence for a pair (a row of ``faults.csv``)."""
    who = f"{row['footwall_unit']} against {row['hangingwall_unit']}"
    if row["self_juxtaposed"]:
        who = f"{row['footwall_unit']} against itself"
    pj, ps = row["p_juxtaposed"], row["p_seal"]
    text = f"{who}: juxtaposed in {pj:.0%} of realisations"
    if np.isfinite(ps):
        text += (f"; where juxtaposed it seals in {ps:.0%} (minimum SGR P50 "
                 f"{row['sgr_min_pct_p50']:.0f} %, oil column P50 {row['column_oil_m_p50']:.0f} m)")
    if row["main_driver"]:
        text += f"; the answer depends mostly on the {row['main_driver']}"
    return text + "."


def _short(unit: str) -> str:
    """``"Ostrel Sandstone 1748.2-1761.6 m"`` -> ``"Ostrel 1748-1762"``."""
    parts = unit.rsplit(" ", 2)
    if len(parts) < 3:
        return unit
    lo, _, hi = parts[1].partition("-")
    try:
        span = f"{float(lo):.0f}-{float(hi):.0f}"
    except ValueError:
        span = parts[1]
    return f"{parts[0].split()[0][:12]} {span}"


def _pair_label(row, k: int) -> str:
    return f"{k}  {_short(row['footwall_unit'])} / {_short(row['hangingwall_unit'])}"


def _spread_axis(ax, rows, name: str, unit: str, base=None, log=False, lines=()):
    y = np.arange(len(rows))[::-1]
    p10, p50, p90 = (np.array([r[f"{name}_p{q}"] for r in rows], float) for q in (10, 50, 90))
    ax.hlines(y, p10, p90, color="#555555", lw=3.0, alpha=0.6)
    ax.plot(p50, y, "|", color="#111111", ms=12, mew=2)
    if base is not None:
        ax.plot(np.array([r[base] for r in rows], float), y, "o", mfc="white", mec="#D55E00", ms=5,
                label="deterministic")
    for k, (x, text) in enumerate(lines):
        ax.axvline(x, color="#D55E00", lw=0.8, ls="--")
        ax.text(x, 1.0, text, transform=ax.get_xaxis_transform(), fontsize=6.5, color="#D55E00",
                ha="right" if k == 0 else "left", va="bottom")
    if log:
        from logprep.report.draw import plain_log_ticks

        ax.set_xscale("log")
        plain_log_ticks(ax.xaxis)
    ax.set_yticks(y)
    ax.set_yticklabels([])
    ax.set_ylim(-0.6, len(rows) - 0.4)
    ax.set_xlabel(unit, fontsize=8)
    ax.tick_params(labelsize=7)
    ax.grid(axis="x", lw=0.3, color="#DDDDDD")


def draw_fault_triangle(ax, res, grid, settings, pairs=()) -> None:
    """The triangle diagram around the fault's throw range with the contacts of the pairs
    at row positions ``pairs`` of the table outlined and numbered."""
    from logprep.fault.sgr import contact_polygon
    from logprep.report.draw import draw_field, draw_sgr_colourbar

    lo, hi = np.percentile(res.draws["throw_m"], [0.5, 99.5])
    t_max = float(min(grid.throw_m[-1], max(2.0 * hi, hi + 20.0)))
    im = draw_field(ax, grid, threshold_pct=settings.sgr_threshold_pct, throw_max_m=t_max)
    draw_sgr_colourbar(ax, im)
    ax.axvspan(lo, hi, color=RANGE_INK, alpha=0.12, lw=0)
    ax.axvline(res.spec.throw_m, color=RANGE_INK, lw=1.4)
    nh = len(res.hw_units[0])
    tops, bases = [], []
    for k, idx in enumerate(pairs, start=1):
        i, j = divmod(res.pair_index[idx], nh)
        poly = contact_polygon(res.fw_units[0][i], res.fw_units[1][i], res.hw_units[0][j] - res.shift_m,
                               res.hw_units[1][j] - res.shift_m, lo, hi)
        if len(poly) >= 3:
            ax.fill(poly[:, 0], poly[:, 1], facecolor="none", edgecolor="#D55E00", lw=1.0)
            tmid, zmid = poly.mean(axis=0)
            ax.text(tmid, zmid, str(k), fontsize=6.5, ha="center", va="center",
                    bbox=dict(boxstyle="round,pad=0.15", fc="white", ec="#D55E00", lw=0.6))
            tops.append(poly[:, 1].min())
            bases.append(poly[:, 1].max())
    if tops:
        ax.set_ylim(auto=False)
        pad = max(15.0, 0.15 * (max(bases) - min(tops)))
        ax.set_ylim(max(bases) + pad, min(tops) - pad)
    ax.set_xlabel("Throw (m) of the tie horizon; shaded: the fault's throw range, line: best estimate",
                  fontsize=8)
    ax.set_ylabel("Footwall depth (m)", fontsize=8)
    ax.set_title("Triangle diagram at the fault's throw range (reservoir contacts outlined)",
                 fontsize=9, loc="left", pad=14)


def fault_page(res, grid, settings) -> Figure:
    """One page for one fault (see the module notes)."""
    t = res.table.reset_index(drop=True)
    spec = res.spec
    fig = Figure(figsize=(16.5, 11.7))
    if spec.two_wells:
        wells = f"{spec.footwall} footwall / {spec.hangingwall} hanging wall"
    else:
        wells = f"within {spec.footwall} (its column on both sides)"
    rng = f"{spec.throw_low_m:g}-{spec.throw_high_m:g} m, {spec.throw_dist}" if spec.throw_low_m is not None \
        else "fixed"
    fig.suptitle(f"Fault {spec.name}: throw {spec.throw_m:g} m ({rng}); {wells}", x=0.015, ha="left",
                 fontsize=14, fontweight="bold")
    gs = fig.add_gridspec(2, 5, left=0.05, right=0.985, top=0.9, bottom=0.33,
                          width_ratios=[2.0, 0.62, 1.2, 1.0, 0.75], height_ratios=[1.0, 1.0],
                          wspace=0.1, hspace=0.35)
    keep = shown_pairs(t)
    draw_fault_triangle(fig.add_subplot(gs[:, 0]), res, grid, settings, keep)
    rows = [t.iloc[k] for k in keep]
    if not rows:
        ax = fig.add_subplot(gs[:, 1:])
        ax.set_axis_off()
        ax.text(0.0, 0.5, "No reservoir pair is juxtaposed at this fault's throw range.", fontsize=11)
    else:
        y = np.arange(len(rows))[::-1]
        ax_n = fig.add_subplot(gs[0, 1])
        ax_n.set_axis_off()
        ax_n.set_ylim(-0.6, len(rows) - 0.4)
        for yy, (k, r) in zip(y, enumerate(rows, start=1)):
            ax_n.text(1.0, yy, _pair_label(r, k), fontsize=6.5, ha="right", va="center")
        ax_n.set_title("pair: footwall / hanging wall", fontsize=7.5, loc="right", pad=12)
        ax_l = fig.add_subplot(gs[0, 2])
        th, leak = settings.sgr_threshold_pct, settings.sgr_leak_pct
        _spread_axis(ax_l, rows, "sgr_min_pct", "minimum SGR (%): P10-P90 bar, P50 tick", base="sgr_min_pct_base",
                     lines=((leak, f"leak {leak:g}"), (th, f"seal {th:g}")))
        ax_l.set_title("Spread of minimum SGR per pair", fontsize=9, loc="left", pad=12)
        ax_c = fig.add_subplot(gs[0, 3])
        _spread_axis(ax_c, rows, "column_oil_m", "oil column (m), log scale", log=True)
        closure = getattr(res, "closure_m", spec.closure_m)
        if closure is not None:
            ax_c.axvline(closure, color=RANGE_INK, lw=0.8, ls="--")
        ax_c.set_title("Spread of oil column per pair", fontsize=9, loc="left", pad=12)
        ax_p = fig.add_subplot(gs[0, 4])
        ax_p.barh(y + 0.18, [r["p_juxtaposed"] for r in rows], height=0.34, color=JUXT_INK, label="P(juxtaposed)")
        ax_p.barh(y - 0.18, [np.nan_to_num(r["p_seal"]) for r in rows], height=0.34, color=SEAL_INK,
                  label="P(seal | juxtaposed)")
        ax_p.set_xlim(0, 1)
        ax_p.set_yticks(y)
        ax_p.set_yticklabels([])
        ax_p.set_ylim(-0.6, len(rows) - 0.4)
        ax_p.tick_params(labelsize=7)
        ax_p.legend(fontsize=6.5, loc="upper right", bbox_to_anchor=(1.0, -0.1), frameon=False)
        ax_p.set_title("Probabilities", fontsize=9, loc="left", pad=12)
        draw_sensitivity(fig.add_subplot(gs[1, 2:]), res, t, keep)
    lines = [f"{k}. {pair_sentence(r)}" for k, r in enumerate(rows, start=1)]
    fig.text(0.015, 0.285, "\n".join(lines) if lines else "", fontsize=7.5, va="top")
    fig.text(0.015, 0.06, footer_text(res, settings), fontsize=7, va="bottom", family="monospace")
    fig.text(0.015, 0.012, "CAUTION: " + CAUTION, fontsize=8, va="bottom", wrap=True, color="#7A1F00",
             bbox=dict(facecolor="#FFF4E5", edgecolor="#D55E00", pad=4))
    return fig


def draw_sensitivity(ax, res, t, keep) -> None:
    """First-order sensitivity of P(seal) (or of minimum SGR where the verdict never changes)
    for the shown cross-fault pair with the lowest P(seal)."""
    from logprep.fault.uncertainty import INPUTS

    cands = [k for k in keep if not t.iloc[k]["self_juxtaposed"]] or keep
    k = min(cands, key=lambda i: (np.nan_to_num(t.iloc[i]["p_seal"], nan=2.0), -t.iloc[i]["p_juxtaposed"]))
    ranking = [(n, s) for n, s in res.sensitivity.get(res.pair_index[k], []) if np.isfinite(s)]
    if not ranking:
        ax.set_axis_off()
        ax.text(0, 0.5, "Sensitivity: no input changes the answer (every spread zero).", fontsize=9)
        return
    names = [INPUTS[n] for n, _ in ranking][::-1]
    vals = [s for _, s in ranking][::-1]
    ax.barh(np.arange(len(vals)), vals, color="#56B4E9")
    ax.set_yticks(np.arange(len(vals)))
    ax.set_yticklabels(names, fontsize=7)
    ax.set_xlim(0, 1)
    ax.tick_params(labelsize=7)
    ax.set_xlabel("share of the variance explained by the input alone (first-order index)", fontsize=8)
    ax.set_title(f"What drives pair {keep.index(k) + 1}: first-order sensitivity from the realisations",
                 fontsize=9, loc="left")


def closure_text(res) -> str:
    """Which closure capped the fault's columns, and where it came from."""
    closure = getattr(res, "closure_m", res.spec.closure_m)
    source = getattr(res, "closure_source", "faults file")
    if closure is None:
        return f"no closure ({source}): columns uncapped"
    return f"closure {closure:g} m caps the columns ({source})"


def footer_text(res, settings) -> str:
    spec = res.spec
    n = len(res.draws["throw_m"])
    return (f"{n} realisations; throw {spec.throw_dist}; GR lines, Vsh transform, cut-offs, minimum bed, clay "
            f"fraction, envelope constant and burial drawn (spreads in the settings file [uncertainty] table).\n"
            f"P10/P50/P90: values 10/50/90 % of the juxtaposed realisations fall below.  Verdict rule: seal where "
            f"minimum SGR >= {settings.sgr_threshold_pct:g} %.  Fault dip {spec.fault_dip_deg:g} deg"
            f"; {closure_text(res)}; "
            f"tie shift {res.shift_m:.2f} m.")


def fault_pages(result) -> list[Figure]:
    """The pages of the faults whose footwall is this well (``result.faults``; none for a
    well screened without a faults file)."""
    return [fault_page(r, r.grid, result.settings) for r in getattr(result, "faults", ())]
