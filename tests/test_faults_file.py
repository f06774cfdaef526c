"""The faults file: CSV and TOML read alike; every error names the row and the column."""

import pytest

from logprep.io.faults import FaultsError, read_faults


def write(tmp_path, text, name="faults.csv", encoding="utf-8"):
    p = tmp_path / name
    p.write_bytes(text.encode(encoding))
    return p


GOOD = (
    "name,footwall,hangingwall,marker,shift_m,throw_m,throw_low_m,throw_high_m,throw_dist,fault_dip_deg,closure_m\n"
    "# a comment line\n"
    "F1,HRM-2,HRM-3,Kellan Marker,,40,30,55,,65,120\n"
    "F2,HRM-1,,,,25,,,,,\n"
    "F3,HRM-4,HRM-5,,12.5,30,20,45,uniform,,\n"
)


def test_csv_reads_every_key(tmp_path):
    f1, f2, f3 = read_faults(write(tmp_path, GOOD))
    assert (f1.name, f1.footwall, f1.hangingwall, f1.marker) == ("F1", "HRM-2", "HRM-3", "Kellan Marker")
    assert (f1.throw_m, f1.throw_low_m, f1.throw_high_m, f1.throw_dist) == (40, 30, 55, "triangular")
    assert (f1.fault_dip_deg, f1.closure_m, f1.shift_m) == (65, 120, None)
    assert f2.hangingwall is None and not f2.two_wells and f2.throw_dist == "fixed"
    assert f2.fault_dip_deg == 60.0 and f2.closure_m is None and f2.throw_range_m == (25, 25)
    assert f3.shift_m == 12.5 and f3.marker is None and f3.throw_dist == "uniform"


def test_semicolons_and_decimal_commas_as_spreadsheets_save_them(tmp_path):
    text = "name;footwall;throw_m;throw_low_m;throw_high_m\nA;HRM-1;40,5;30,25;55\n"
    (f,) = read_faults(write(tmp_path, text, encoding="cp1252"))
    assert (f.throw_m, f.throw_low_m) == (40.5, 30.25)


def test_toml_gives_the_same_faults(tmp_path):
    toml = write(tmp_path, """
[[fault]]
name = "F1"
footwall = "HRM-2"
hangingwall = "HRM-3"
marker = "Kellan Marker"
throw_m = 40
throw_low_m = 30
throw_high_m = 55
fault_dip_deg = 65
closure_m = 120

[[fault]]
name = "F2"
footwall = "HRM-1"
throw_m = 25

[[fault]]
name = "F3"
footwall = "HRM-4"
hangingwall = "HRM-5"
shift_m = 12.5
throw_m = 30
throw_low_m = 20
throw_high_m = 45
throw_dist = "uniform"
""", name="faults.toml")
    from_csv = read_faults(write(tmp_path, GOOD))
    from_toml = read_faults(toml)
    strip = [lambda f: {k: v for k, v in vars(f).items() if k != "where"}]
    assert [strip[0](f) for f in from_toml] == [strip[0](f) for f in from_csv]


@pytest.mark.parametrize("row, expected", [
    ("F1,HRM-2,HRM-3,Kellan Marker,,forty,30,55,,,", "row 1, column throw_m: 'forty' is not a number"),
    ("F1,HRM-2,HRM-3,Kellan Marker,,40,45,55,,,", "need 0 <= low <= throw_m <= high"),
    ("F1,HRM-2,HRM-3,,,40,30,55,,,", "row 1, column marker: two wells need a tie"),
    ("F1,HRM-2,,Kellan Marker,,40,30,55,,,", "column marker: a tie is only for two wells"),
    ("F1,HRM-2,HRM-3,Kellan Marker,,40,30,,,,", "row 1, column throw_high_m: missing"),
    ("F1,HRM-2,HRM-3,Kellan Marker,,40,30,55,lognormal,,", "column throw_dist: unknown 'lognormal'"),
    ("F1,HRM-2,HRM-3,Kellan Marker,,40,30,55,,95,", "column fault_dip_deg: 95"),
    ("F1,HRM-2,HRM-3,Kellan Marker,,40,30,55,,,-5", "column closure_m: -5"),
    (",HRM-2,HRM-3,Kellan Marker,,40,30,55,,,", "row 1, column name: missing"),
    ("F1,HRM-2,HRM-3,Kellan Marker,,-40,,,,,", "column throw_m: -40 m"),
])
def test_errors_name_file_row_and_column(tmp_path, row, expected):
    head = GOOD.splitlines()[0]
    p = write(tmp_path, head + "\n" + row + "\n")
    with pytest.raises(FaultsError) as exc:
        read_faults(p)
    msg = str(exc.value)
    assert msg.startswith(str(p)) and expected in msg
    assert "\n" not in msg


def test_duplicate_names_and_unknown_columns_are_refused(tmp_path):
    with pytest.raises(FaultsError, match=r"row 2, column name: 'f1' repeats row 1"):
        read_faults(write(tmp_path, "name,footwall,throw_m\nF1,HRM-1,20\nf1,HRM-2,30\n"))
    with pytest.raises(FaultsError, match=r"unknown column 'thrown'; valid columns"):
        read_faults(write(tmp_path, "name,footwall,throw_m,thrown\nF1,HRM-1,20,3\n"))
    with pytest.raises(FaultsError, match=r"\[\[fault\]\] 1, column throw_m: missing"):
        read_faults(write(tmp_path, '[[fault]]\nname = "A"\nfootwall = "HRM-1"\n', name="f.toml"))
    with pytest.raises(FaultsError, match="not valid TOML"):
        read_faults(write(tmp_path, "[[fault]\n", name="g.toml"))
    with pytest.raises(FaultsError, match="faults file not found"):
        read_faults(tmp_path / "none.csv")
