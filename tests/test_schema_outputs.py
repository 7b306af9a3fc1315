"""The format definition drives validation, JSON Schema, template and the reference page."""

import json
from pathlib import Path

import jsonschema
import pytest
import tomllib
from click.testing import CliRunner

from hubload.cli import main
from hubload.schema import FORMAT
from hubload.schema.export import reference_markdown

ROOT = Path(__file__).parent.parent
SCENARIOS = sorted((ROOT / "load_cases").glob("*.toml"))


def cli_output(*args):
    result = CliRunner().invoke(main, list(args))
    assert result.exit_code == 0, result.output
    return result.output


def test_docs_file_format_page_is_generated_from_the_format():
    expected = reference_markdown(FORMAT)
    assert (ROOT / "docs" / "file-format.md").read_text() == expected, (
        "regenerate: PYTHONPATH=src python -m hubload.schema.export > docs/file-format.md")


@pytest.mark.parametrize("scenario", SCENARIOS, ids=lambda p: p.name)
def test_bundled_scenarios_validate_against_the_printed_json_schema(scenario):
    # jsonschema (independent validator of the JSON Schema standard) checks our export.
    schema = json.loads(cli_output("schema"))
    jsonschema.Draft202012Validator.check_schema(schema)
    jsonschema.validate(tomllib.loads(scenario.read_text()), schema)


def test_json_schema_rejects_an_unknown_key():
    schema = json.loads(cli_output("schema"))
    document = tomllib.loads(SCENARIOS[0].read_text())
    document["wheel"]["ofset_mm"] = 1
    with pytest.raises(jsonschema.ValidationError):
        jsonschema.validate(document, schema)


def test_template_is_a_valid_file_that_checks(tmp_path):
    path = tmp_path / "template.toml"
    path.write_text(cli_output("template"))
    assert "Caution" in cli_output("check", str(path))
