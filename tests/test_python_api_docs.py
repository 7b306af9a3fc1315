"""The examples of docs/python-api.md run as written (doctest), from the project's root."""

from __future__ import annotations

import doctest
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]


def test_python_api_page_examples_run(monkeypatch):
    monkeypatch.chdir(ROOT)
    outcome = doctest.testfile(str(ROOT / "docs" / "python-api.md"), module_relative=False,
                               optionflags=doctest.NORMALIZE_WHITESPACE)
    assert outcome.attempted > 10 and outcome.failed == 0, outcome
