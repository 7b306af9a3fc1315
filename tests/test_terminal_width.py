"""Every command's tables at 80 and 120 columns: no number or name cut, no line too long, and
the key numbers of the JSON printed in full (common practice: a table that cuts a number to
'1,030,1...' has told the reader something false)."""

from __future__ import annotations

import json
from pathlib import Path

import pytest
from click.testing import CliRunner

from hubload.cli import main
from hubload.report.numbers import hours
from logsupport import realistic_log, write_log

ROOT = Path(__file__).parent.parent
SCENARIOS = sorted((ROOT / "load_cases").glob("*.toml"))
YARD = ROOT / "load_cases" / "yard_loader.toml"
ELLIPSIS = "\u2026"


def run(width: int, *args) -> str:
    found = CliRunner(env={"COLUMNS": str(width)}).invoke(main, [*map(str, args)])
    assert found.exit_code == 0, found.output
    return found.output


def assert_uncut(text: str, width: int) -> None:
    assert ELLIPSIS not in text
    assert max(len(line) for line in text.splitlines()) <= width


@pytest.mark.parametrize("width", [80, 120])
@pytest.mark.parametrize("scenario", SCENARIOS, ids=lambda p: p.stem)
@pytest.mark.parametrize("options", [(), ("--method", "refined"), ("--all",)],
                         ids=["default", "refined", "all"])
def test_check_prints_every_life_and_name_in_full(width, scenario, options):
    text = run(width, "check", scenario, *options)
    assert_uncut(text, width)
    document = json.loads(run(200, "check", scenario, "--json", *options))
    flat = " ".join(text.split())
    for label, bearing in document["bearings"].items():
        assert hours(bearing["l10_h"]) in text, label
    assert hours(document["system"]["l10_h"]) in text
    assert hours(document["governing_life"]["life_h"]) in text
    for case in document["cases"][:25]:
        assert case["name"][:10] in flat


@pytest.mark.parametrize("width", [80, 120])
@pytest.mark.parametrize("args", [
    ("sweep", YARD, "--vary", "wheel.offset_mm=40:200:5"),
    ("sweep", YARD, "--vary", "wheel.loaded_radius_mm=340:420:3&wheel.rolling_radius_mm=350:430"),
    ("sweep", YARD, "--vary", "wheel.offset_mm=40:200:9", "--vary", "pair.outboard.C_kN=60:200:8"),
    ("compare", *SCENARIOS),
    ("setting", YARD, "--from", "-40", "--to", "120", "--step", "20"),
    ("brief", YARD),
    ("forecast", ROOT / "load_cases" / "site_dumper.toml"),
    ("field", ROOT / "load_cases" / "field_returns.csv", "--against",
     ROOT / "load_cases" / "site_dumper.toml"),
    ("machine", ROOT / "load_cases" / "machines" / "yard_loader_machine.toml", "--cases"),
    ("forecast", ROOT / "load_cases" / "machines" / "yard_loader_machine.toml"),
    ("field", ROOT / "load_cases" / "field_returns.csv", "--against",
     ROOT / "load_cases" / "machines" / "yard_loader_machine.toml"),
], ids=["sweep", "linked", "grid", "compare", "setting", "brief", "forecast", "field", "machine",
        "machine-forecast", "machine-field"])
def test_study_commands_fit_the_terminal(width, args):
    text = run(width, *args)
    assert ELLIPSIS not in text
    if args[0] != "brief":   # Markdown is not a terminal table: its lines may run long
        assert_uncut(text, width)


@pytest.mark.parametrize("width", [80, 120])
def test_spectrum_of_a_log_fits_the_terminal(width, tmp_path):
    log = write_log(tmp_path / "log.csv", realistic_log(3000))
    assert_uncut(run(width, "spectrum", log, "--case-file", YARD), width)


def test_a_classed_spectrum_of_a_thousand_cases_stays_short(tmp_path):
    # Issue goal: under 150 lines at 80 columns, the most damaging cases only by default.
    import sys

    sys.path.insert(0, str(ROOT / "tests" / "benchmarks"))
    from bench_report import classed_spectrum

    big = classed_spectrum(tmp_path / "classed.toml")
    text = run(80, "check", big)
    assert_uncut(text, 80)
    assert len(text.splitlines()) < 150 and "990 more cases" in " ".join(text.split())
    assert len(run(80, "check", big, "--all").splitlines()) > 1000

