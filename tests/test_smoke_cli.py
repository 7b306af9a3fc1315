"""End-to-end: every bundled scenario checks through the CLI, in text and JSON."""

import json
from pathlib import Path

import pytest
from click.testing import CliRunner

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
