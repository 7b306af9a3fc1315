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
def test_bundled_scenario_checks_in_text_and_json(scenario):
    runner = CliRunner()
    text = runner.invoke(main, ["check", str(scenario)])
    assert text.exit_code == 0, text.output
    assert "Caution" in text.output
    document = json.loads(runner.invoke(main, ["check", str(scenario), "--json"]).output)
    assert document["system"]["l10_h"] is None or document["system"]["l10_h"] > 0
    assert set(document["bearings"]) == {"outboard", "inboard"}


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
