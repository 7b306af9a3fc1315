"""Running the command line in-process (click's runner), for the end-to-end tests."""

from __future__ import annotations

import json

from click.testing import CliRunner

from hubload.cli import main


def run(*arguments):
    """The result of ``hubload ARGUMENTS`` (paths may be given as Path objects)."""
    return CliRunner().invoke(main, [str(a) for a in arguments])


def run_json(*arguments):
    """The --json document of a run that must succeed."""
    result = run(*arguments, "--json")
    assert result.exit_code == 0, result.output
    return json.loads(result.output)
