"""Numeric keys of a load-case file addressed by dotted paths, and variants of a file.

A key path names a key as it is written in the file: ``wheel.offset_mm``,
``pair.outboard.C_kN``, ``case[3].side_force_kN`` (arrays of tables and number
lists are indexed from 0). Paths are resolved against the format definition,
so every numeric key of the format -- present in the file or defaulted -- can
be varied, and nothing else.
"""

from __future__ import annotations

import re
from collections.abc import Mapping
from dataclasses import dataclass

from hubload.casefile.finite import check_finite
from hubload.casefile.load import study_from_validated
from hubload.casefile.validate import (nearest_key_hint, validate_document, validate_number,
                                      validate_value)
from hubload.domain.batch import stack_studies
from hubload.domain.study import Study
from hubload.errors import InputError
from hubload.schema import FORMAT
from hubload.schema.fleetformat import FORECAST_TABLES
from hubload.schema.spec import Field, Table

SEGMENT = re.compile(r"^(?P<name>[A-Za-z_][A-Za-z0-9_]*)(?:\[(?P<index>\d+)\])?$")
NUMERIC_KINDS = ("number", "integer", "number-list")


@dataclass(frozen=True)
class KeyPath:
    """A resolved path: the segments (name, index or None) and the field they end in."""

    text: str
    segments: tuple[tuple[str, int | None], ...]
    field: Field

    @property
    def integer(self) -> bool:
        return self.field.kind == "integer"


def parse_key_path(text: str, document: Mapping, table: Table = FORMAT) -> KeyPath:
    """Resolve ``text`` against the format and the file; InputError when it names no number."""
    segments = []
    for raw in text.split("."):
        match = SEGMENT.match(raw)
        if not match:
            raise InputError(f"expected a dotted key path like wheel.offset_mm or "
                             f"case[0].side_force_kN, got {text!r}", key_path=text)
        index = match["index"]
        segments.append((match["name"], None if index is None else int(index)))
    field = resolve(segments, document, table, text)
    return KeyPath(text=text, segments=tuple(segments), field=field)


def resolve(segments: list, document: Mapping, table: Table, text: str) -> Field:
    if segments[0][0] in FORECAST_TABLES and table.table_named(segments[0][0]) is not None:
        raise InputError(f"[{segments[0][0]}] enters only `hubload forecast`; a sweep varies "
                         "the check's inputs (give the forecast's options instead)",
                         key_path=text)
    node: object = document
    for position, (name, index) in enumerate(segments):
        last = position == len(segments) - 1
        sub = table.table_named(name)
        if sub is not None and not last:
            node = step_into_table(node, sub, index, text)
            table = sub
            continue
        field = table.field_named(name)
        if field is not None and not last:
            raise InputError(f"'{name}' is a value, not a table: the key path ends there "
                             f"(e.g. {'.'.join(s for s, _ in segments[:position + 1])})",
                             key_path=text)
        if field is None:
            raise unknown_key(name, table, text)
        check_numeric(field, index, node, text)
        check_choice_free(table, name, node, text)
        return field
    raise InputError("expected a path that ends in a numeric key", key_path=text)


def step_into_table(node: object, sub: Table, index: int | None, text: str) -> object:
    if sub.array and index is None:
        raise InputError(f"[[{sub.name}]] is a list of blocks: give an index, "
                         f"e.g. {sub.name}[0]", key_path=text)
    if not sub.array and index is not None:
        raise InputError(f"[{sub.name}] is a single table: no index expected", key_path=text)
    child = node.get(sub.name) if isinstance(node, Mapping) else None
    if sub.array:
        count = len(child) if isinstance(child, list) else 0
        if index >= count:
            raise InputError(f"the file has {count} [[{sub.name}]] block(s), indices 0 to "
                             f"{count - 1}; got index {index}", key_path=text)
        return child[index]
    return child if isinstance(child, Mapping) else {}


def unknown_key(name: str, table: Table, text: str) -> InputError:
    return InputError(f"unknown key '{name}'; {nearest_key_hint(name, table)}", key_path=text)


def check_numeric(field: Field, index: int | None, node: object, text: str) -> None:
    if field.kind not in NUMERIC_KINDS:
        raise InputError(f"'{field.key}' is {field.kind}, not a number: it cannot be varied",
                         key_path=text)
    if field.kind == "number-list":
        values = node.get(field.key) if isinstance(node, Mapping) else None
        count = len(values) if isinstance(values, list) else 0
        if index is None or index >= count:
            raise InputError(f"'{field.key}' is a list of {count} numbers: give an index "
                             f"from 0 to {count - 1}", key_path=text)
    elif index is not None:
        raise InputError(f"'{field.key}' is a single number: no index expected", key_path=text)


def check_choice_free(table: Table, name: str, node: object, text: str) -> None:
    """Refuse to vary a key whose alternative is what the file gives (speed_kmh vs speed_rpm)."""
    present = node if isinstance(node, Mapping) else {}
    for choice in table.choices:
        mine = [group for group in choice.groups if name in group]
        others = [key for group in choice.groups if group not in mine for key in group
                  if key in present]
        if mine and others and name not in present:
            raise InputError(f"the file gives {', '.join(others)} instead; vary that key "
                             f"({choice.doc})", key_path=text)


def with_values(document: Mapping, values: Mapping[KeyPath, float]) -> dict:
    """A copy of ``document`` with each key path set; only the tables on the paths are copied."""
    result = dict(document)
    for path, value in values.items():
        set_value(result, path, int(value) if path.integer else float(value))
    return result


def set_value(document: dict, path: KeyPath, value: float) -> None:
    node = document
    for name, index in path.segments[:-1]:
        child = node.get(name)
        if index is None:
            child = dict(child) if isinstance(child, Mapping) else {}
            node[name] = child
        else:
            blocks = list(child)
            blocks[index] = dict(blocks[index])
            node[name] = blocks
            child = blocks[index]
        node = child
    name, index = path.segments[-1]
    if index is None:
        node[name] = value
    else:
        numbers = list(node[name])
        numbers[index] = value
        node[name] = numbers


def current_value(document: Mapping, path: KeyPath) -> float | None:
    """The value the file gives for ``path`` (its default when absent; None without one)."""
    node: object = document
    for name, index in path.segments:
        node = node.get(name) if isinstance(node, Mapping) else None
        if index is not None and isinstance(node, list) and index < len(node):
            node = node[index]
    if isinstance(node, (int, float)) and not isinstance(node, bool):
        return float(node)
    return None if path.field.default is None else float(path.field.default)


def variant_studies(document: Mapping, points: list[dict[KeyPath, float]],
                    source: str) -> list[Study]:
    """The study of ``document`` at each point (key path -> value).

    The whole document is validated once, at the first point; the keys present are
    the same at every point, so the others only need their varied values checked
    against the format before conversion (whose cross-key rules run per point).
    InputError names the point.
    """
    studies = unchecked_variants(document, points, source)
    for study, values in zip(studies, points):
        finite_at_point(study, values, source)
    return studies


def stacked_variants(document: Mapping, points: list[dict[KeyPath, float]],
                     source: str) -> tuple[list[Study], Study]:
    """The studies of :func:`variant_studies` and their stack (domain.batch), checked finite
    after conversion all at once: point by point only when a number is not, to name it."""
    studies = unchecked_variants(document, points, source)
    batched = stack_studies(studies)
    try:
        check_finite(batched)
    except InputError:
        for study, values in zip(studies, points):
            finite_at_point(study, values, source)
        raise
    return studies, batched


def unchecked_variants(document: Mapping, points: list[dict[KeyPath, float]],
                       source: str) -> list[Study]:
    try:
        data = validate_document(with_values(document, points[0]), FORMAT)
    except InputError as error:
        raise at_point(error, points[0], source) from None
    cases_memo: dict = {}
    return [variant_from_validated(data, values, source, cases_memo) for values in points]


def finite_at_point(study: Study, values: dict[KeyPath, float], source: str) -> None:
    try:
        check_finite(study)
    except InputError as error:
        raise at_point(error, values, source) from None


def variant_from_validated(data: dict, values: dict[KeyPath, float], source: str,
                           cases_memo: dict | None = None) -> Study:
    try:
        for path, value in values.items():
            if path.field.kind == "number-list":
                validate_number(value, path.field, path.text)
            else:
                validate_value(int(value) if path.integer else float(value), path.field,
                               path.text)
        return study_from_validated(with_values(data, values), source=source, finite=False,
                                    cases_memo=cases_memo)
    except InputError as error:
        raise at_point(error, values, source) from None


def at_point(error: InputError, values: Mapping[KeyPath, float], source: str) -> InputError:
    at = ", ".join(f"{path.text} = {value:g}" for path, value in values.items())
    return InputError(f"{error.message} (at {at})", file=source, key_path=error.key_path)
