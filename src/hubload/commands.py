"""Plain functions behind each CLI command: read inputs, run the engine, report."""

from __future__ import annotations

import json

import click
from rich.console import Console

from hubload.casefile import load_study
from hubload.engine import evaluate
from hubload.report import jsonout, terminal
from hubload.schema import FORMAT
from hubload.schema.export import json_schema, template_text


def check(file: str, as_json: bool = False) -> None:
    result = evaluate(load_study(file))
    if as_json:
        click.echo(jsonout.to_json(result))
    else:
        terminal.render(result, Console())


def schema() -> None:
    click.echo(json.dumps(json_schema(FORMAT), indent=2))


def template() -> None:
    click.echo(template_text(FORMAT), nl=False)
