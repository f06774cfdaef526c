"""Settings files (TOML round trip, unknown keys, precedence) and the blocking sweep."""

import numpy as np
import pandas as pd
import pytest

from logprep.cli import main
from logprep.run.config import ConfigError, read_config, settings_toml, write_settings
from logprep.model import Layers
from logprep.run.settings import ScreenSettings
from logprep.run.tune import parse_values, sweep_file, window_verdicts
from logprep.fault.juxtaposition import sand_windows


def test_settings_round_trip(tmp_path):
    s = ScreenSettings(sand_cutoff=0.3, shale_cutoff=0.7, gr_clean=42.5, gr_shale="p97",
                       blocking="changepoint", changepoint_penalty=5, honour_tops=True,
                       tops_file="tops.csv")
    path = write_settings(tmp_path / "a.toml", s, {"sand_sweep": [0.2, 0.3]})
    got, tune = read_config(path)
    assert ScreenSettings(**got) == s.updated(tops_file=str((tmp_path.cwd() / "tops.csv").resolve()))
    assert tune == {"sand_sweep": [0.2, 0.3]}
    # writing it again gives the same text: the file is a fixed point
    assert settings_toml(ScreenSettings(**got), tune) == path.read_text()


def test_unknown_key_names_key_and_valid_keys(tmp_path):
    p = tmp_path / "bad.toml"
    p.write_text("sand_cutof = 0.3\n")
    with pytest.raises(ConfigError, match=r"bad.toml: unknown key 'sand_cutof'; valid keys: the tables \[input\], \[clay\].*sand_cutoff.*did you mean 'sand_cutoff'"):
        read_config(p)
    p.write_text("[tune]\nsand_range = [0.1]\n")
    with pytest.raises(ConfigError, match="unknown key \\[tune\\] 'sand_range'; valid keys: sand_sweep"):
        read_config(p)
    p.write_text('sand_cutoff = "low"\n')
    with pytest.raises(ConfigError, match="sand_cutoff = 'low' is not a float"):
        read_config(p)
    p.write_text("sand_cutoff = \n")
    with pytest.raises(ConfigError, match="not valid TOML"):
        read_config(p)


def test_settings_file_has_one_table_per_group_and_flat_files_still_read(tmp_path):
    s = ScreenSettings(sand_cutoff=0.3, transform="clavier", throw_max_m=120.0)
    text = settings_toml(s)
    for table in ("[input]", "[clay]", "[layers]", "[field]", "[capacity]", "[fault_rock]"):
        assert table in text
    grouped = tmp_path / "grouped.toml"
    grouped.write_text(text)
    flat = tmp_path / "flat.toml"  # a file of the first release: every field at the top level
    flat.write_text('sand_cutoff = 0.3\ntransform = "clavier"\nthrow_max_m = 120.0\n')
    assert ScreenSettings(**read_config(grouped)[0]) == ScreenSettings(**read_config(flat)[0]) == s


def test_settings_file_key_in_wrong_table_or_unknown_in_table(tmp_path):
    p = tmp_path / "bad.toml"
    p.write_text("[clay]\nsand_cutoff = 0.3\n")
    with pytest.raises(ConfigError, match=r"bad.toml: \[clay\] sand_cutoff belongs in the \[layers\] table"):
        read_config(p)
    p.write_text("[layers]\nsand_cutof = 0.3\n")
    with pytest.raises(ConfigError, match=r"unknown key \[layers\] 'sand_cutof'.*did you mean 'sand_cutoff'"):
        read_config(p)
    p.write_text("sand_cutoff = 0.2\n[layers]\nsand_cutoff = 0.3\n")
    with pytest.raises(ConfigError, match="sand_cutoff is given twice"):
        read_config(p)


def test_settings_groups_validate_and_read_through():
    from logprep.errors import SettingsError
    from logprep.layers.settings import LayerSettings

    s = ScreenSettings(layers=LayerSettings(sand_cutoff=0.25), transform="larionov_tertiary")
    assert s.layers.sand_cutoff == s.sand_cutoff == 0.25
    assert s.clay.transform == "larionov_tertiary"
    assert s.updated(min_bed_m=2.0).layers == LayerSettings(sand_cutoff=0.25, min_bed_m=2.0)
    with pytest.raises(SettingsError, match="unknown setting 'sand_cutof'; did you mean 'sand_cutoff'"):
        ScreenSettings(sand_cutof=0.3)
    with pytest.raises(SettingsError, match="--min-bed must be >= 0 m"):
        LayerSettings(min_bed_m=-1.0)


def test_cli_options_override_config_and_effective_settings_are_written(tmp_path, example_dir):
    cfg = tmp_path / "mine.toml"
    cfg.write_text("sand_cutoff = 0.25\nshale_cutoff = 0.7\nmin_bed_m = 2\n")
    out = tmp_path / "out"
    rc = main(["screen", str(example_dir / "HRM-3.las"), "--out", str(out), "--config", str(cfg),
               "--shale-cutoff", "0.6"])
    assert rc == 0
    used, _ = read_config(out / "logprep-settings.toml")
    assert (used["sand_cutoff"], used["shale_cutoff"], used["min_bed_m"]) == (0.25, 0.6, 2)
    # the written file repeats the run exactly
    out2 = tmp_path / "again"
    assert main(["screen", str(example_dir / "HRM-3.las"), "--out", str(out2),
                 "--config", str(out / "logprep-settings.toml")]) == 0
    assert (out2 / "HRM-3" / "layers.csv").read_bytes() == (out / "HRM-3" / "layers.csv").read_bytes()


def test_cli_bad_config_is_one_line(tmp_path, example_dir, capsys):
    cfg = tmp_path / "typo.toml"
    cfg.write_text("min_bed = 2\n")
    rc = main(["screen", str(example_dir / "HRM-3.las"), "--out", str(tmp_path / "o"), "--config", str(cfg)])
    err = capsys.readouterr().err.strip()
    assert rc == 2 and len(err.splitlines()) == 1
    assert "typo.toml: unknown key 'min_bed'" in err


def test_parse_values():
    assert parse_values("0.2:0.3:0.05") == (0.2, 0.25, 0.3)
    assert parse_values("1,0.5, 2") == (0.5, 1.0, 2.0)
    assert parse_values([0.3, 0.1]) == (0.1, 0.3)
    with pytest.raises(Exception, match="start:stop:step"):
        parse_values("0.3:0.1:0.05")


# ---------------------------------------------------------------- window verdicts, hand-worked
def _column(vsh_mid):
    # sand A 0-10 m (Vsh 0.1), a middle layer 10-20 m, sand B 20-30 m (0.1)
    lith = "shale" if vsh_mid >= 0.65 else ("heterolith" if vsh_mid > 0.35 else "sand")
    return Layers(top_m=[0, 10, 20], base_m=[10, 20, 30], vsh=[0.1, vsh_mid, 0.1],
                  lithology=("sand", lith, "sand"))


def test_window_verdict_flips_with_the_middle_layer():
    # Normal fault, hanging wall down: footwall sand B (20-30 m) faces hanging-wall sand A
    # (0-10 m) for throws 10-30 m (the only pair of different sands).  SGR = 100/t x clay
    # in [z - t, z] (Yielding et al. 1997) is linear-fractional there, so its minimum is at
    # a corner of the area (hand-worked, v = Vsh of the middle layer):
    #   z=20,t=10: 100 v;  z=20,t=20 and z=30,t=20: 100 (1 + 10 v)/20;
    #   z=30,t=30: 100 (1 + 10 v + 1)/30.
    # v = 0.9: min(90, 50, 36.7) = 36.7 %.  v = 0.45: min(45, 27.5, 21.7) = 21.7 %.
    ref = _column(0.9)
    w = sand_windows(ref, 300)
    cross = w[~w["self_juxtaposed"]]
    assert len(cross) == 1
    ba = cross[cross["footwall_top_m"] == 20]
    assert ba["sgr_min_pct"].iloc[0] == pytest.approx(100 * (1 + 9 + 1) / 30)
    assert window_verdicts(ba, ref, w, 20.0) == ["seal"]
    assert window_verdicts(ba, ref, w, 40.0) == ["leak"]
    # Another blocking where the middle layer is cleaner (0.45): min SGR (1 + 4.5 + 1)/30
    # = 21.7 % -> seal at 20 %, leak at 25 %.
    other = _column(0.45)
    assert window_verdicts(ba, other, sand_windows(other, 300), 20.0) == ["seal"]
    assert window_verdicts(ba, other, sand_windows(other, 300), 25.0) == ["leak"]
    # Middle layer a sand: B faces sand everywhere in that area; sand against sand with
    # SGR far below 20 % -> leak.
    sandy = _column(0.3)
    assert window_verdicts(ba, sandy, sand_windows(sandy, 300), 20.0) == ["leak"]
    # No sands at all below: apart
    none = Layers(top_m=[0, 10, 20], base_m=[10, 20, 30], vsh=[0.1, 0.9, 0.9],
                  lithology=("sand", "shale", "shale"))
    assert window_verdicts(ba, none, sand_windows(none, 300), 20.0) == ["apart"]


def test_sweep_reuses_reference_and_counts(example_dir):
    s = ScreenSettings(sgr_threshold_pct=21.0)
    sw = sweep_file(example_dir / "HRM-1.las", s, sand_cutoffs="0.3,0.35,0.45",
                    shale_cutoffs=[0.65], min_beds_m=[1.0, 2.0])
    t = sw.table
    assert len(t) == 1 + 3 * 2 and t["is_reference"].sum() == 1
    ref = t[t["is_reference"]].iloc[0]
    # the grid point equal to the reference gives the same row (re-blocked independently)
    same = t[(~t["is_reference"]) & (t["sand_cutoff"] == 0.35) & (t["min_bed_m"] == 1.0)].iloc[0]
    for col in ("layers", "sands", "net_to_gross", "sand_sand_windows", "min_window_sgr_pct"):
        assert same[col] == pytest.approx(ref[col])
    assert same["verdicts_flipped"] == 0 and ref["verdicts_flipped"] == 0
    assert ref["leak_windows"] == (sw.windows["verdict"] == "leak").sum()
    assert np.all((t["net_to_gross"] > 0) & (t["net_to_gross"] < 1))
    wcols = [c for c in t.columns if c.startswith("w") and c[1:].isdigit()]
    assert len(wcols) == len(sw.windows) == ref["sand_sand_windows"]
    assert set(t[wcols].to_numpy().ravel()) <= {"leak", "uncertain", "seal", "apart"}


def test_tune_numbers_and_words_are_the_sheets(example_dir):
    # one numbering and one vocabulary: tune's w<k> is row k of juxtapositions.csv (the
    # sheet's #k) and its reference verdicts are the sheet's words (leak / uncertain / seal)
    s = ScreenSettings(sgr_leak_pct=18.5, sgr_threshold_pct=24.0)  # puts windows in all three
    sw = sweep_file(example_dir / "HRM-5.las", s, sand_cutoffs=[0.3], shale_cutoffs=[0.65],
                    min_beds_m=[1.0])
    w = sw.reference.windows
    assert set(w.loc[~w["self_juxtaposed"], "verdict"]) == {"leak", "uncertain", "seal"}
    for row in sw.windows.itertuples():
        sheet_row = w.iloc[row.window - 1]
        assert not sheet_row["self_juxtaposed"]
        assert sheet_row["footwall_top_m"] == row.footwall_top_m
        assert sheet_row["hangingwall_top_m"] == row.hangingwall_top_m
        assert sheet_row["verdict"] == row.verdict
    ref = sw.table[sw.table["is_reference"]].iloc[0]
    cross = w[~w["self_juxtaposed"]]
    assert ref["leak_windows"] == (cross["verdict"] == "leak").sum()
    assert all(ref[f"w{k}"] == w.iloc[k - 1]["verdict"] for k in sw.windows["window"])


def test_cli_tune_writes_table_figure_and_settings(tmp_path, example_dir, capsys):
    out = tmp_path / "t"
    rc = main(["tune", str(example_dir / "HRM-4.las"), "--out", str(out),
               "--sand-sweep", "0.3:0.4:0.05", "--shale-sweep", "0.6,0.7", "--bed-sweep", "1"])
    assert rc == 0, capsys.readouterr().err
    for name in ("tune.csv", "tune-windows.csv", "tune.pdf", "tune.png", "logprep-settings.toml"):
        assert (out / name).stat().st_size > 0
    t = pd.read_csv(out / "tune.csv")
    assert len(t) == 1 + 3 * 2
    _, ranges = read_config(out / "logprep-settings.toml")
    assert ranges == {"sand_sweep": [0.3, 0.35, 0.4], "shale_sweep": [0.6, 0.7], "bed_sweep": [1.0]}
    rc = main(["tune", str(example_dir / "HRM-4.las"), "--out", str(out), "--sand-sweep", "a:b"])
    assert rc == 2 and "sand cut-offs" in capsys.readouterr().err
