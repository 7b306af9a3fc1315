"""Helpers for the studies tests: writing variants of the bundled files as real TOML files."""

from __future__ import annotations

import json
import tomllib
from pathlib import Path

import pytest
import tomli_w
from click.testing import CliRunner

from hubload.cli import main

LOAD_CASES = Path(__file__).resolve().parents[2] / "load_cases"
SCENARIOS = sorted(LOAD_CASES.glob("*.toml"))
YARD_LOADER = LOAD_CASES / "yard_loader.toml"


def read_toml(path: Path) -> dict:
    """The parsed file; a [cases] table named by its absolute path, so that a variant
    written elsewhere reads the same table."""
    document = tomllib.loads(path.read_text(encoding="utf-8"))
    if "cases" in document:
        document["cases"] = {**document["cases"],
                             "table": str(path.parent / document["cases"]["table"])}
    return document


def set_key(document: dict, segments, value) -> None:
    """Set a key of a parsed TOML document in place (segments: [(name, index|None), ...])."""
    node = document
    for name, index in segments[:-1]:
        node = node.setdefault(name, {}) if index is None else node[name][index]
    name, index = segments[-1]
    if index is None:
        node[name] = value
    else:
        node[name][index] = value


def write_toml(document: dict, path: Path) -> Path:
    path.write_text(tomli_w.dumps(document), encoding="utf-8")
    return path


def run_json(*args) -> dict:
    result = CliRunner().invoke(main, [*map(str, args), "--json"])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


def assert_close(actual, expected, where: str = "", rel: float = 1e-12) -> None:
    """Recursive equality of JSON data, floats within ``rel`` (None = infinite must match)."""
    if isinstance(expected, dict):
        assert isinstance(actual, dict) and actual.keys() == expected.keys(), where
        for key in expected:
            assert_close(actual[key], expected[key], f"{where}.{key}", rel)
    elif isinstance(expected, list):
        assert isinstance(actual, list) and len(actual) == len(expected), where
        for index, (a, e) in enumerate(zip(actual, expected)):
            assert_close(a, e, f"{where}[{index}]", rel)
    elif isinstance(expected, float) and not isinstance(actual, bool):
        assert actual == pytest.approx(expected, rel=rel, abs=1e-300), where
    else:
        assert actual == expected, where
