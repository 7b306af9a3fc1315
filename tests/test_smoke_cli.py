"""End-to-end: every bundled scenario checks through the CLI, in text and JSON."""

import copy
import json
from pathlib import Path

import pytest
import tomli_w
from click.testing import CliRunner
from hypothesis import given, settings
from hypothesis import strategies as st

from conftest import BASE_DOCUMENT
from hubload.cli import main

SCENARIOS = sorted(Path(__file__).parent.parent.joinpath("load_cases").glob("*.toml"))


@pytest.mark.parametrize("scenario", SCENARIOS, ids=lambda p: p.name)
def test_bundled_scenario_lives_follow_palmgren_miner_and_the_system_rule(scenario):
    # Each bearing's spectrum life is 1 / sum(t_i / L_i) of its case lives (Palmgren-Miner,
    # ISO 281:2007 annex, from memory) and the pair's is (L_o^-e + L_i^-e)^(-1/e) with the
    # Weibull slope e = 9/8 of roller bearings (Lundberg-Palmgren system life); the terminal
    # shows the governing life the JSON gives.
    runner = CliRunner()
    document = json.loads(runner.invoke(main, ["check", str(scenario), "--json"]).output)
    cases = document["cases"]
    lives = {}
    for label in ("outboard", "inboard"):
        damage = sum(case["time_fraction"] / case["bearings"][label]["l10_h"]
                     for case in cases if case["bearings"][label]["l10_h"] is not None)
        lives[label] = 1 / damage
        assert document["bearings"][label]["l10_h"] == pytest.approx(lives[label], rel=1e-12)
    system = (lives["outboard"] ** -1.125 + lives["inboard"] ** -1.125) ** (-1 / 1.125)
    assert document["system"]["l10_h"] == pytest.approx(system, rel=1e-12)
    text = runner.invoke(main, ["check", str(scenario)], env={"COLUMNS": "80"})
    assert text.exit_code == 0 and "Caution" in text.output
    governing = document["governing_life"]
    assert f"{governing['symbol']} = {governing['life_h']:,.0f} h" in text.output


@settings(max_examples=30, deadline=None)
@given(name=st.text(alphabet="ab[]/\\=#", min_size=1, max_size=10))
def test_names_with_brackets_print_as_written(tmp_path_factory, name):
    # Titles and case names are the user's text, not terminal markup (common practice:
    # a report shows what the file says); "[/]" once ended the run with a traceback.
    document = copy.deepcopy(BASE_DOCUMENT)
    document["project"]["title"] = f"title {name}"
    document["case"][0]["name"] = name
    path = tmp_path_factory.mktemp("names") / "case.toml"
    path.write_text(tomli_w.dumps(document))
    text = CliRunner().invoke(main, ["check", str(path)])
    assert text.exit_code == 0, text.output
    assert f"title {name}" in text.output
    rows = [line.split(None, 1) for line in text.output.splitlines()]
    assert any(row[0] == "0" and row[1].startswith(f"{name} ") for row in rows if len(row) == 2)
    assert "([project] target_life_h)" in text.output or "PASS" in text.output or "FAIL" in text.output


@pytest.mark.parametrize("command", [["sweep", "--vary", "wheel.offset_mm=80:120:3"], ["compare"]])
def test_study_commands_print_bracketed_titles_as_written(write_case_file, command):
    # Same rule as for check: the user's title is text, not terminal markup.
    document = copy.deepcopy(BASE_DOCUMENT)
    document["project"]["title"] = "Loader [front axle] [/]"
    path = write_case_file(document)
    arguments = [command[0], path, *command[1:]] + ([path] if command[0] == "compare" else [])
    text = CliRunner().invoke(main, arguments)
    assert text.exit_code == 0, text.output
    assert "Loader [front axle] [/]" in text.output
