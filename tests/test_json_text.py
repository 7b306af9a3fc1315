"""The JSON writer against the standard library's json module (the reference encoder)."""

from __future__ import annotations

import doctest
import json

from hypothesis import given, strategies as st

from hubload.report.json import text

JSON_VALUES = st.recursive(
    st.none() | st.booleans() | st.integers() | st.floats(allow_nan=False, allow_infinity=False)
    | st.text(),
    lambda children: st.lists(children, max_size=70)
    | st.dictionaries(st.text(), children, max_size=5),
    max_leaves=200)


@given(JSON_VALUES)
def test_the_text_reads_back_as_the_standard_encoder_writes(document):
    assert json.loads(text.document_text(document)) == json.loads(json.dumps(document))


def test_a_small_document_is_indented_as_the_standard_encoder_indents():
    document = {"system": {"l10_h": 1520.5, "l10m_h": None}, "cases": [{"name": "a"}, 2]}
    assert text.document_text(document) == json.dumps(document, indent=2)


def test_the_examples_in_the_docstring_run():
    assert doctest.testmod(text).failed == 0
