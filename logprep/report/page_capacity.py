"""The seal-capacity page of the screening sheet: column height against throw for the
riskiest sand-sand windows, the verdict thresholds as lines, and the cautions that go with
the numbers.  Builds a Figure only; never saves."""

from __future__ import annotations

import numpy as np
from matplotlib.figure import Figure

from logprep.fault.capacity import window_columns_m, window_throws
from logprep.fault.envelope import envelope_c, fault_zone_pressure_bar, column_height_m
from logprep.report.draw import PAGE_SIZE_IN, draw_footer, plain_log_ticks, riskiest_windows
from logprep.units import M_PER_FT

N_CURVES = 8
# Okabe & Ito (2008) colours that read on white (their yellow does not), then black and grey;
# the line style changes from curve to curve too, so the curves stay apart in grey print
CURVE_COLOURS = ["#D55E00", "#0072B2", "#009E73", "#E69F00", "#CC79A7", "#56B4E9", "#000000", "#7F7F7F"]
LINESTYLES = ["-", "--", "-.", ":"]
COLUMN_CAP_M = 2000.0
"""Top of the column-height axis (m): a fault holding more holds any realistic column, and
the axis says so instead of running to 10^4 m."""

CAPACITY_CAUTION = (
    "Screening estimate only. Fault-zone pressure uses the envelope of Bretan, Yielding & Jones (2003), "
    "a bound drawn around published calibration data from other basins (SGR against across-fault "
    "pressure differences), with burial classes < 3.0, 3.0-3.5 and > 3.5 km; it is not a calibration "
    "for this basin. Calibrate to local pressure data (across-fault pressure differences, contacts) "
    "before relying on any column height. Fault-rock permeabilities (after Manzocchi et al. 1999; "
    "Sperrevik et al. 2002) use equations recalled from memory, not verified. Defer to local "
    "regulations and licensed professional judgement, especially for CO2 storage containment decisions."
)


def _fluid_contrasts(result):
    s = result.settings
    return {
        "oil": s.capacity.brine_density_kgm3 - s.capacity.oil_density_kgm3,
        "gas": s.capacity.brine_density_kgm3 - s.capacity.gas_density_kgm3,
        "co2": None,  # per window: fixed or from the equation of state
    }


def draw_column_panel(ax, result, fluid: str, numbers, columns_fn=None) -> list:
    """Leak-point column height against throw for the windows ``numbers`` (from 1), one
    fluid, with the heights equivalent to the two verdict thresholds as lines (for the
    weakest burial class among the windows drawn, i.e. the largest C).  Returns the
    legend handles; nothing is written on the curves.  ``columns_fn(w, c, drho, throws)``
    gives a window's columns (default: one well's, :func:`window_columns_m`)."""
    from matplotlib.lines import Line2D

    s, w_all = result.settings, result.windows
    per = 1.0 if s.capacity.length_unit == "m" else 1.0 / M_PER_FT
    cap = COLUMN_CAP_M * per
    if columns_fn is None:
        def columns_fn(w, c, drho, t):
            return window_columns_m(result.layers, w, c, [drho], t, s.capacity.envelope_sgr_scale_pct)[0]
    drho_fixed = _fluid_contrasts(result)[fluid]
    weakest_c, handles, lows = None, [], []
    for i, k in enumerate(numbers):
        w = w_all.iloc[k - 1]
        c = float(envelope_c(w.burial_depth_m, s.capacity.envelope_class_bounds_m, s.capacity.envelope_class_c))
        weakest_c = c if weakest_c is None else max(weakest_c, c)
        drho = drho_fixed if drho_fixed is not None else s.capacity.brine_density_kgm3 - w.co2_density_kgm3
        t = window_throws(w)
        h = np.asarray(columns_fn(w, c, drho, t), float) * per
        lows.append(np.nanmin(h) if np.isfinite(h).any() else cap)
        handles += ax.plot(t, np.minimum(h, cap * 1.5), color=CURVE_COLOURS[i % len(CURVE_COLOURS)],
                           ls=LINESTYLES[i % len(LINESTYLES)], lw=1.4, label=f"#{k} ({w.verdict})")
    if weakest_c is not None:
        drho = drho_fixed if drho_fixed is not None else s.capacity.brine_density_kgm3 - float(
            np.nanmedian(w_all.iloc[[k - 1 for k in numbers]]["co2_density_kgm3"]))
        for sgr, style, word in ((s.capacity.sgr_leak_pct, ":", "leak below"),
                                 (s.capacity.sgr_threshold_pct, "--", "seal from")):
            p = fault_zone_pressure_bar(sgr, 0.0, sgr_scale_pct=s.capacity.envelope_sgr_scale_pct,
                                        class_bounds_m=(0.0,), class_c=(weakest_c, weakest_c))
            h = float(column_height_m(p, drho, 0.0)) * per
            ax.axhline(h, color="#555555", ls=style, lw=1)
            handles.append(Line2D([], [], color="#555555", ls=style, lw=1,
                                  label=f"column at SGR {sgr:g} % ({word}), C {weakest_c:g}"))
    ax.set_yscale("log")
    plain_log_ticks(ax.yaxis)
    ax.set_ylim(max(0.5 * min(lows), 0.1 * per) if lows else 1.0, cap)
    tmax = max(float(w_all.iloc[k - 1].throw_max_m) for k in numbers) if numbers else s.field.throw_max_m
    ax.set_xlim(0, min(s.field.throw_max_m, 1.05 * tmax))
    ax.set_xlabel("Throw (m)")
    ax.text(0.0, 1.01, "CO2" if fluid == "co2" else fluid.capitalize(), transform=ax.transAxes,
            ha="left", va="bottom", fontsize=10)  # as a title, without the title's layout pass
    ax.grid(True, which="both", color="#E5E5E5", lw=0.5)
    ax.tick_params(labelsize=7.5)
    return handles


def _density_note(result) -> str:
    s = result.settings
    co2 = (f"CO2 {s.capacity.co2_density_kgm3:g}" if s.capacity.co2_density_mode == "fixed" else
           f"CO2 from Span & Wagner (1996) via CoolProp at each contact (hydrostatic, "
           f"{s.capacity.surface_temp_c:g} C + {s.capacity.geothermal_gradient_c_per_km:g} C/km)")
    return (f"Densities (kg/m3): brine {s.capacity.brine_density_kgm3:g}, oil {s.capacity.oil_density_kgm3:g}, "
            f"gas {s.capacity.gas_density_kgm3:g}, {co2}. Envelope FZP (bar) = 10^(SGR/{s.capacity.envelope_sgr_scale_pct:g} - C), "
            f"C {', '.join(f'{c:g}' for c in s.capacity.envelope_class_c)} for burial classes split at "
            f"{', '.join(f'{b:g}' for b in s.capacity.envelope_class_bounds_m)} m.")


def seal_capacity_page(result, columns_fn=None, footer=None) -> list[Figure]:
    """Page 2: column heights against throw for the riskiest windows (numbers as on page 1).
    ``columns_fn`` as in :func:`draw_column_panel`; ``footer(fig)`` draws the foot (default:
    the well's, :func:`draw_footer`)."""
    from logprep.report.layout import wrap_to_width

    s = result.settings
    fig = Figure(figsize=PAGE_SIZE_IN)
    fig.text(0.015, 0.975, f"{result.well.name}: seal capacity of the sand-sand windows", ha="left",
             va="top", fontsize=14, fontweight="bold", parse_math=False)
    numbers = riskiest_windows(result, N_CURVES)
    unit = s.capacity.length_unit
    width_pt = 0.95 * fig.get_figwidth() * 72
    fig.text(0.015, 0.93, wrap_to_width(
             f"Leak-point column height ({unit}) above the free-water level that the fault rock can hold, "
             f"against throw, for the {len(numbers)} windows with the lowest SGR (numbers as on page 1). "
             "At each throw the weakest point of the whole contact limits the column. The axis stops at "
             f"{COLUMN_CAP_M * (1.0 if unit == 'm' else 1.0 / M_PER_FT):g} {unit}: a curve above it holds "
             "any realistic column.", width_pt, 9, mono=False), fontsize=9, va="top")
    if not numbers:
        fig.text(0.015, 0.8, "No sand-sand windows between different sands: nothing to draw.", fontsize=11)
    else:
        gs = fig.add_gridspec(1, 3, left=0.05, right=0.985, top=0.86, bottom=0.42, wspace=0.15)
        axes = [fig.add_subplot(gs[i]) for i in range(3)]
        for ax, fluid in zip(axes, ("oil", "gas", "co2")):
            handles = draw_column_panel(ax, result, fluid, numbers, columns_fn)
        axes[0].set_ylabel(f"Column height ({unit})")
        fig.legend(handles=handles, loc="upper left", bbox_to_anchor=(0.05, 0.365), ncol=5,
                   fontsize=7.5, frameon=False, title="window (verdict) and the verdict thresholds",
                   title_fontsize=8, alignment="left")
    fig.text(0.015, 0.285, wrap_to_width(_density_note(result), width_pt, 8, mono=False), fontsize=8, va="top")
    fig.text(0.015, 0.245, wrap_to_width("CAUTION (seal capacity): " + CAPACITY_CAUTION, width_pt, 9,
                                         mono=False),
             fontsize=9, va="top", color="#7A1F00", linespacing=1.4)
    (footer or (lambda f: draw_footer(f, result, short=True)))(fig)
    return [fig]
