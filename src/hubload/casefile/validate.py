"""Check a parsed TOML document against the format definition (``hubload.schema``).

Unknown keys are errors (with the nearest valid key suggested), missing
required keys, wrong types, NaN/inf and values outside their limits too.
Returns the document with defaults filled in.
"""

from __future__ import annotations

import difflib
import math
from typing import Any

from hubload.errors import InputError
from hubload.schema.spec import Choice, Field, Table

# A name, a title or a code, not a document: long enough for any real label, short enough
# that no table or terminal line is flooded by one.
MAX_STRING_CHARS = 200
# 2**53: every integer up to it is exact as a float; far beyond any limit of the format.
MAX_EXACT_INTEGER = 2 ** 53
TYPE_NAMES = {"number": "a number", "integer": "a whole number", "string": "a string",
              "boolean": "true or false", "number-list": "a list of numbers"}


def join_path(prefix: str, key: str) -> str:
    return f"{prefix}.{key}" if prefix else key


def validate_document(document: dict, table: Table) -> dict:
    """Validate ``document`` against the root ``table``; return it with defaults."""
    return validate_table(document, table, "")


def validate_table(data: Any, table: Table, path: str) -> dict:
    if not isinstance(data, dict):
        raise InputError(f"expected a table, got {describe(data)}", key_path=path or None)
    reject_unknown_keys(data, table, path)
    result: dict[str, Any] = {}
    for spec in table.fields:
        key_path = join_path(path, spec.key)
        if spec.key in data:
            result[spec.key] = validate_value(data[spec.key], spec, key_path)
        elif spec.required:
            raise InputError(f"missing required key ({spec.doc})", key_path=key_path)
        elif spec.default is not None:
            result[spec.key] = spec.default
    for sub in table.tables:
        key_path = join_path(path, sub.name)
        if sub.name in data:
            result[sub.name] = validate_subtable(data[sub.name], sub, key_path)
        elif sub.required:
            header = f"[[{key_path}]]" if sub.array else f"[{key_path}]"
            raise InputError(f"missing required table {header} ({sub.doc})", key_path=key_path)
    for choice in table.choices:
        check_choice(data, choice, path)
    return result


def validate_subtable(data: Any, table: Table, path: str) -> Any:
    if not table.array:
        return validate_table(data, table, path)
    if not isinstance(data, list) or not all(isinstance(item, dict) for item in data):
        raise InputError(f"expected an array of tables [[{path}]], got {describe(data)}",
                         key_path=path)
    if len(data) < table.min_items:
        raise InputError(f"expected at least {table.min_items} [[{path}]] block(s)",
                         key_path=path)
    return [validate_table(item, table, f"{path}[{index}]") for index, item in enumerate(data)]


def reject_unknown_keys(data: dict, table: Table, path: str) -> None:
    for key in data:
        if key not in table.keys:
            raise InputError(f"unknown key; {nearest_key_hint(shortened(key), table)}",
                             key_path=join_path(path, shortened(key)))


def nearest_key_hint(key: str, table: Table) -> str:
    """'did you mean ...?' with the closest valid key of ``table``, else the valid keys."""
    close = difflib.get_close_matches(key, table.keys, n=1, cutoff=0.5)
    return f"did you mean '{close[0]}'?" if close else "valid keys: " + ", ".join(table.keys)


def validate_value(value: Any, spec: Field, path: str) -> Any:
    expected = TYPE_NAMES[spec.kind]
    if spec.kind == "number-list":
        if not isinstance(value, list) or not value:
            raise InputError(f"expected {expected}, got {describe(value)}", key_path=path)
        return [validate_number(item, spec, f"{path}[{i}]") for i, item in enumerate(value)]
    if spec.kind in ("number", "integer"):
        if spec.kind == "integer" and not (isinstance(value, int) and not isinstance(value, bool)):
            raise InputError(f"expected {expected}, got {describe(value)}", key_path=path)
        return validate_number(value, spec, path)
    python_type = {"string": str, "boolean": bool}[spec.kind]
    if not isinstance(value, python_type):
        raise InputError(f"expected {expected}, got {describe(value)}", key_path=path)
    if spec.kind == "string" and len(value) > MAX_STRING_CHARS:
        raise InputError(f"expected at most {MAX_STRING_CHARS} characters, got "
                         f"{len(value):,}", key_path=path)
    if spec.choices and value not in spec.choices:
        close = difflib.get_close_matches(str(value), spec.choices, n=1, cutoff=0.5)
        hint = f" (did you mean '{close[0]}'?)" if close else ""
        raise InputError(f"expected {spec.describe_limits()}, got {value!r}{hint}", key_path=path)
    return value


def validate_number(value: Any, spec: Field, path: str) -> float:
    if isinstance(value, bool) or not isinstance(value, (int, float)):
        raise InputError(f"expected a number, got {describe(value)}", key_path=path)
    if isinstance(value, int) and abs(value) > MAX_EXACT_INTEGER:
        # beyond any limit of the format, and too large for a float (OverflowError)
        raise InputError(f"expected a value {spec.describe_limits() or 'of a sensible size'}, "
                         f"got a whole number of {digits(value)} digits", key_path=path)
    if not math.isfinite(value):
        raise InputError(f"expected a finite number, got {value}", key_path=path)
    violated = ((spec.minimum is not None and value < spec.minimum)
                or (spec.exclusive_minimum is not None and value <= spec.exclusive_minimum)
                or (spec.maximum is not None and value > spec.maximum)
                or (spec.exclusive_maximum is not None and value >= spec.exclusive_maximum))
    if violated:
        raise InputError(f"expected a value {spec.describe_limits()}, got {value:g}", key_path=path)
    return value if spec.kind == "integer" else float(value)


def check_choice(data: dict, choice: Choice, path: str) -> None:
    present = [group for group in choice.groups if any(key in data for key in group)]
    for group in present:
        missing = [key for key in group if key not in data]
        if missing:
            raise InputError(f"'{', '.join(group)}' go together: missing {', '.join(missing)}. "
                             f"{choice.doc}", key_path=join_path(path, missing[0]))
    if choice.exclusive and len(present) > 1:
        given = " and ".join("/".join(group) for group in present)
        raise InputError(f"give only one of these, not {given}. {choice.doc}",
                         key_path=join_path(path, present[1][0]))
    if choice.required and not present:
        raise InputError(f"missing {choice.name}. {choice.doc}", key_path=path or None)


def digits(value: int) -> int:
    """The decimal digits of a whole number (str() refuses those over 4,300 digits)."""
    return len(str(abs(value))) if value.bit_length() < 10_000 else \
        int(value.bit_length() * math.log10(2)) + 1


def describe(value: Any) -> str:
    if isinstance(value, bool):
        return f"a boolean ({str(value).lower()})"
    if isinstance(value, dict):
        return "a table"
    if isinstance(value, list):
        return "a list" if value else "an empty list"
    if isinstance(value, int) and abs(value) > MAX_EXACT_INTEGER:
        return f"a whole number of {digits(value)} digits"
    if isinstance(value, str):
        return f"a string ({shortened(value)!r})"
    return f"{type(value).__name__} ({shortened(repr(value))})"


def shortened(text: str, limit: int = 60) -> str:
    """``text`` cut to ``limit`` characters for a message (a hostile file may hold megabytes)."""
    return text if len(text) <= limit else text[:limit] + "..."
