"""The clay-volume stage of one well: GR quality flags, zoned endpoint picks, GR and
neutron-density Vsh and their combination (the functions of :mod:`logprep.clay.qc`,
:mod:`logprep.clay.endpoints` and :mod:`logprep.clay.vshale` in order)."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
import pandas as pd

from logprep.clay.endpoints import (
    lines_per_sample, nd_shale_separation, one_sided_note, pick_endpoints, zone_bounds,
)
from logprep.clay.holecheck import inferred_bit_size_in, unusable_flags
from logprep.clay.lithology import classify_rock, missing_curve_notes, pef_trusted
from logprep.clay.sonicdensity import slowness_us_ft, sonic_density_separation, vsh_sonic_density
from logprep.clay.qc import (
    ND_ONLY, REPLACED, QcSettings, any_flag, density_correction_flags, gr_flags, inches, washout_flags,
)
from logprep.clay.settings import ClaySettings
from logprep.clay.vshale import (
    density_correction_g_cm3, density_g_cm3, density_porosity, gamma_ray_index, gas_crossover,
    get_combination, get_transform, neutron_v_v, vsh_neutron_density,
)
from logprep.errors import SettingsError
from logprep.io.las import well_curve
from logprep.model import WellLog


@dataclass(frozen=True)
class ClayVolume:
    """The clay-volume stage of one well (see :func:`clay_volume`)."""

    depth_m: np.ndarray
    gr_api: np.ndarray
    vsh_gr: np.ndarray
    vsh_nd: np.ndarray
    vsh: np.ndarray
    qc_flags: dict
    picks: pd.DataFrame
    gr_clean_line: np.ndarray
    gr_shale_line: np.ndarray
    gr_clean_api: float
    gr_shale_api: float
    notes: tuple[str, ...]
    rock: np.ndarray | None = None
    unusable: dict | None = None
    vsh_sd: np.ndarray | None = None


def _curve_in(well: WellLog, kind: str, sl: slice, convert, notes: list[str]):
    """An auxiliary curve (caliper, bit size, neutron, density...) in logprep's units, or
    None when the well has none.  A unit logprep cannot convert leaves the curve out with a
    note (on the sheet) rather than failing the well: the gamma ray alone still screens it."""
    found = well_curve(well, kind)
    if found is None:
        return None
    values, unit = found
    try:
        return convert(values[sl], unit)
    except SettingsError as exc:
        notes.append(f"{kind.upper()} not used: {exc}")
        return None


def clay_volume(well: WellLog, settings: ClaySettings = ClaySettings(),
                tops: pd.DataFrame | None = None) -> ClayVolume:
    """GR QC, zoned endpoint picks, GR and neutron-density Vsh and their combination,
    over the interval from the first to the last valid GR sample.

    ``tops`` are this well's tops (columns ``well, top_m, name``) or None.  ``vsh`` is
    NaN where the GR is missing or was replaced after QC (interpolated later).
    """
    gr_all = well.gr_api
    valid = np.flatnonzero(np.isfinite(gr_all))
    if valid.size < 2:
        raise SettingsError(f"{well.source}: fewer than two valid GR samples; check the GR "
                            "curve (or name another with --gr-curve)")
    sl = slice(valid[0], valid[-1] + 1)
    depth, gr_read = well.depth_m[sl], gr_all[sl]
    notes = []
    cali = _curve_in(well, "cali", sl, inches, notes)
    bs = _curve_in(well, "bs", sl, inches, notes)
    # no bit-size curve: washouts judged on the bit size inferred from the caliper (as
    # the bad-hole check does), so the neutron-density is not read in enlarged hole
    hole_bs = inferred_bit_size_in(depth, cali) if (bs is None and cali is not None) else bs
    flags = gr_flags(depth, gr_read, cali_in=cali, bs_in=hole_bs,
                     settings=QcSettings(washout_in=settings.washout_in))
    gr = np.where(any_flag(flags, REPLACED), np.nan, gr_read)
    exclude = any_flag(flags, [k for k in flags if k not in ND_ONLY])
    bounds, source, names = zone_bounds(
        depth, np.where(exclude, np.nan, gr), settings.zoning, tops, bs_in=bs,
        min_zone_m=settings.zone_min_m, min_step_api=settings.zone_step_api,
    )
    try:
        picks = pick_endpoints(depth, gr, bounds, clean=settings.gr_clean, shale=settings.gr_shale,
                               exclude=exclude, min_contrast=settings.min_contrast,
                               source=source, names=names, one_sided=settings.one_sided)
        whole = pick_endpoints(depth, gr, [], clean=settings.gr_clean, shale=settings.gr_shale,
                               exclude=exclude)
    except SettingsError as exc:
        raise SettingsError(f"{well.source}: {exc}") from None
    clean_line = lines_per_sample(depth, picks, "gr_clean_api")
    shale_line = lines_per_sample(depth, picks, "gr_shale_api")
    vsh_gr = get_transform(settings.transform)(gamma_ray_index(gr, clean_line, shale_line))

    vsh_nd = np.full(depth.size, np.nan)
    nphi = _curve_in(well, "nphi", sl, neutron_v_v, notes)
    rhob = _curve_in(well, "rhob", sl, density_g_cm3, notes)
    flags["gas_crossover"] = np.zeros(depth.size, dtype=bool)
    drho = _curve_in(well, "drho", sl, density_correction_g_cm3, notes)
    flags["bad_density"] = (density_correction_flags(drho, settings.drho_max_g_cm3)
                            if drho is not None else np.zeros(depth.size, dtype=bool))
    if nphi is not None and rhob is not None and settings.vsh_combine != "gr":
        phid = density_porosity(rhob)
        sep = nphi - phid
        nd_bad = flags["washout"] | flags["bad_density"]
        picks["nd_shale_separation"] = nd_shale_separation(depth, gr, sep, picks,
                                                           exclude=exclude | nd_bad)
        sep_line = lines_per_sample(depth, picks, "nd_shale_separation")
        usable = np.isfinite(sep_line) & ~nd_bad
        for value in np.unique(sep_line[usable]):
            m = usable & (sep_line == value)
            vsh_nd[m] = vsh_neutron_density(nphi[m], phid[m], float(value))
        flags["gas_crossover"] = gas_crossover(nphi, phid) & usable & np.isfinite(gr)
        if not usable.any():
            notes.append("neutron-density: no usable shale point; GR Vsh alone")
    dt = _curve_in(well, "dt", sl, slowness_us_ft, notes)
    vsh_sd = np.full(depth.size, np.nan)
    if settings.sonic_density and dt is not None and rhob is not None and settings.vsh_combine != "gr":
        vsh_sd = sonic_density_vsh(depth, gr, dt, rhob, picks,
                                   exclude=exclude | flags["washout"] | flags["bad_density"],
                                   where=~np.isfinite(vsh_nd))
        if np.isfinite(vsh_sd).any():
            notes.append(f"sonic-density Vsh used where the neutron-density is missing "
                         f"({np.isfinite(vsh_sd).mean():.0%} of the samples)")
    second = np.where(np.isfinite(vsh_nd), vsh_nd, vsh_sd)
    vsh = get_combination(settings.vsh_combine)(vsh_gr, second)
    note = one_sided_note(picks)
    if note:
        notes.append(note)
    rock, unusable = rock_and_unusable(well, sl, settings, depth=depth, vsh=vsh, flags=flags,
                                       igr=gamma_ray_index(gr, clean_line, shale_line),
                                       curves=dict(rhob=rhob, nphi=nphi, cali=cali, bs=bs, dt=dt),
                                       notes=notes)
    return ClayVolume(
        depth_m=depth, gr_api=gr_read, vsh_gr=vsh_gr, vsh_nd=vsh_nd, vsh=vsh, qc_flags=flags,
        picks=picks, gr_clean_line=clean_line, gr_shale_line=shale_line,
        gr_clean_api=float(whole["gr_clean_api"].iloc[0]),
        gr_shale_api=float(whole["gr_shale_api"].iloc[0]), notes=tuple(notes),
        rock=rock, unusable=unusable, vsh_sd=vsh_sd,
    )


def sonic_density_vsh(depth, gr, dt_us_ft, rhob_g_cm3, picks: pd.DataFrame, *, exclude, where):
    """Sonic-density Vsh (:mod:`logprep.clay.sonicdensity`) at the samples ``where`` (NaN
    elsewhere), each zone's shale separation read like the neutron-density one
    (:func:`logprep.clay.endpoints.nd_shale_separation`: the median over the zone's
    shaliest samples by GR, at least 0.02)."""
    sep = sonic_density_separation(dt_us_ft, rhob_g_cm3)
    shale_sep = nd_shale_separation(depth, gr, sep, picks, exclude=exclude)
    line = lines_per_sample(depth, picks.assign(sd_shale_separation=shale_sep),
                            "sd_shale_separation")
    out = np.full(depth.size, np.nan)
    use = np.asarray(where, dtype=bool) & np.isfinite(line) & np.isfinite(sep) & ~exclude
    for value in np.unique(line[use]):
        m = use & (line == value)
        out[m] = vsh_sonic_density(sep[m], float(value))
    return out


def rock_and_unusable(well: WellLog, sl: slice, settings: ClaySettings, *, depth, vsh, flags,
                      igr, curves: dict, notes: list[str]):
    """Rock class per sample (:func:`logprep.clay.lithology.classify_rock`) and the
    unusable-sample masks (:func:`logprep.clay.holecheck.unusable_flags`); the
    ``bad_hole``, ``long_gap`` and ``top_hole`` masks are also added to ``flags`` (they are
    QC findings of ``qc.csv``), and a note per missing curve goes to ``notes``."""
    rhob, nphi, cali, bs, dt = (curves[k] for k in ("rhob", "nphi", "cali", "bs", "dt"))
    pef = _curve_in(well, "pef", sl, lambda v, _u: np.asarray(v, dtype=float), notes)
    enlarged = flags["washout"]
    hole = bs
    if cali is not None and bs is None:  # no bit size: judge the washout on the inferred one
        hole = inferred_bit_size_in(depth, cali)
        enlarged = enlarged | washout_flags(cali, hole, settings.washout_in)
    if pef is not None and settings.pef_shale_check and settings.rock_classes:
        section = np.nan_to_num(np.zeros(depth.size) if hole is None else hole, nan=-1.0)
        ok, high = pef_trusted(pef, igr, section)
        if not ok.all():
            step = float(np.median(np.diff(depth))) if depth.size > 1 else 0.0
            notes.append(f"lithology: PEF not used over {(~ok).sum() * step:.0f} m, where the "
                         f"shales read {', '.join(high)} (above 4.11 b/e, a carbonate's Pe: "
                         "barite mud or a shifted tool)")
            pef = np.where(ok, pef, np.nan)
    if settings.rock_classes and ((rhob is not None and nphi is not None) or pef is not None):
        rock = classify_rock(rhob_g_cm3=rhob, nphi_v_v=nphi, pef_b_e=pef, igr=igr,
                             washout=enlarged)
    else:
        rock = np.full(depth.size, "", dtype=object)
    if settings.rock_classes:
        notes.extend(missing_curve_notes(rhob=rhob is not None, nphi=nphi is not None,
                                         pef=pef is not None, cali=cali is not None,
                                         bs=bs is not None))
    qc_failed = any_flag(flags, list(REPLACED) + ["missing", "null_gap"])
    unusable = unusable_flags(depth, filled=~np.isfinite(vsh), qc_failed=qc_failed, cali_in=cali,
                              bs_in=bs, aux_curves=[rhob, nphi, dt],
                              bad_hole_in=settings.bad_hole_in, gap_limit_m=settings.gap_limit_m,
                              top_hole_run_m=settings.top_hole_run_m)
    for k in ("bad_hole", "long_gap", "top_hole", "log_tail"):
        flags[k] = unusable[k]
    for k, what in (("top_hole", "top hole without usable logs"),
                    ("log_tail", "gamma ray alone below the last lithology logs"),
                    ("bad_hole", "badly enlarged hole"), ("long_gap", "long filled gaps")):
        if unusable[k].any():
            step = float(np.median(np.diff(depth))) if depth.size > 1 else 0.0
            notes.append(f"{what}: {unusable[k].sum() * step:.0f} m unusable "
                         "(layers mostly of it are 'no data')")
    return rock, unusable
