"""faults.csv and the fault pages from the bundled Harrowmere scenario."""

import re

import pandas as pd
import pytest

from logprep.report.caution import CAUTION
from logprep.fault.uncertainty import Spreads
from logprep.run.fault_batch import faults_table, screen_faults, write_faults
from logprep.run.faults import FAULT_COLUMNS


@pytest.fixture(scope="module")
def demo(example_dir):
    from logprep.run.pipeline import ScreenSettings

    s = ScreenSettings(tops_file=str(example_dir / "tops.csv"))
    errors = []
    res = screen_faults([example_dir], example_dir / "faults.csv", s, Spreads(realisations=40),
                        on_error=errors.append)
    return s, res, errors


def test_bundled_faults_give_juxtaposed_pairs(demo):
    _, res, errors = demo
    assert errors == []
    assert [r.spec.name for r in res] == ["Harrowmere Fault", "Ostrel Fault"]
    t = faults_table(res)
    assert list(t.columns) == FAULT_COLUMNS
    assert set(t["fault"]) == {"Harrowmere Fault", "Ostrel Fault"}
    two = t[t["fault"] == "Harrowmere Fault"]
    assert (two["hangingwall_well"] == "HRM-3").all() and (two["closure_m"] == 150).all()
    assert (two["column_oil_m_p90"] <= 150 + 1e-9).all()  # the closure caps every column
    assert t["p_juxtaposed"].between(0, 1).all() and t["juxtaposed_base"].any()


def test_written_table_and_one_page_pdf_per_fault(demo, tmp_path):
    s, res, _ = demo
    paths = write_faults(res, tmp_path, s)
    names = sorted(p.relative_to(tmp_path).as_posix() for p in paths)
    assert names == ["faults.csv", "faults/Harrowmere_Fault.pdf", "faults/Harrowmere_Fault.png",
                     "faults/Ostrel_Fault.pdf", "faults/Ostrel_Fault.png"]
    back = pd.read_csv(tmp_path / "faults.csv")
    assert list(back.columns) == FAULT_COLUMNS and len(back) == sum(len(r.table) for r in res)
    pdf = (tmp_path / "faults" / "Ostrel_Fault.pdf").read_bytes()
    assert pdf.startswith(b"%PDF") and len(re.findall(rb"/Type /Page\b(?!s)", pdf)) == 1


def test_fault_page_carries_sentences_bars_and_the_caution(demo):
    from logprep.report.page_fault import fault_page, pair_sentence

    s, res, _ = demo
    fig = fault_page(res[0], res[0].grid, s)
    text = "\n".join(t.get_text() for t in fig.texts)
    assert CAUTION in text
    first = pair_sentence(res[0].table.iloc[0])
    assert "juxtaposed in" in first and first.endswith(".")
    titles = [ax.get_title(loc="left") for ax in fig.axes]
    assert any("first-order sensitivity" in t for t in titles)
    assert any("Probabilities" in t for t in titles)


def test_a_fault_with_a_missing_well_is_reported_and_the_others_run(example_dir, tmp_path):
    from logprep.run.pipeline import ScreenSettings

    f = tmp_path / "faults.csv"
    f.write_text("name,footwall,hangingwall,shift_m,throw_m\nGhost,HRM-9,,,20\nReal,HRM-1,,,20\n")
    errors = []
    res = screen_faults([example_dir / "HRM-1.las"], f, ScreenSettings(), Spreads(realisations=5),
                        on_error=errors.append)
    assert [r.spec.name for r in res] == ["Real"]
    assert len(errors) == 1 and errors[0].startswith(f"{f}: row 1: well 'HRM-9' not found")


OSTREL = "name,footwall,throw_m,throw_low_m,throw_high_m,throw_dist\nOstrel Fault,HRM-1,25,15,35,uniform\n"


def test_cli_faults_uncertainty_and_identical_reruns(example_dir, tmp_path, capsys):
    from logprep.cli import main
    from logprep.run.faults import UNCERTAINTY_COLUMNS

    f = tmp_path / "faults.csv"
    f.write_text(OSTREL)
    runs = []
    for k in (1, 2):
        out = tmp_path / f"o{k}"
        args = ["screen", str(example_dir / "HRM-1.las"), "--tops", str(example_dir / "tops.csv"),
                "--faults", str(f), "--realisations", "15", "--random-state", "3", "--out", str(out),
                "--no-sheet", "--uncertainty"]
        assert main(args) == 0
        runs.append(out)
    a, b = ((o / "faults.csv").read_bytes() for o in runs)
    assert a == b and len(pd.read_csv(runs[0] / "faults.csv"))
    jux = pd.read_csv(runs[0] / "HRM-1" / "juxtapositions.csv")
    assert list(jux.columns[-len(UNCERTAINTY_COLUMNS):]) == UNCERTAINTY_COLUMNS
    assert (jux["sgr_min_pct_p10"] <= jux["sgr_min_pct_p90"]).all()
    settings = (runs[0] / "logprep-settings.toml").read_text()
    assert "[uncertainty]" in settings and "realisations = 15" in settings and "random_state = 3" in settings


@pytest.mark.parametrize("text, config, message", [
    ("name,footwall,throw_m\nA,HRM-1,ten\n", None, "row 1, column throw_m: 'ten' is not a number"),
    (OSTREL, "[uncertainty]\nburial_sd = 3\n", "unknown key [uncertainty] 'burial_sd'"),
])
def test_cli_bad_faults_file_or_spreads_are_one_line_usage_errors(example_dir, tmp_path, capsys, text,
                                                                   config, message):
    from logprep.cli import main

    f = tmp_path / "faults.csv"
    f.write_text(text)
    args = ["screen", str(example_dir / "HRM-1.las"), "--faults", str(f), "--out", str(tmp_path / "o")]
    if config:
        (tmp_path / "c.toml").write_text(config)
        args += ["--config", str(tmp_path / "c.toml")]
    assert main(args) == 2
    err = capsys.readouterr().err
    assert err.count("\n") == 1 and message in err
