"""Building blocks of the file-format definition."""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property
from typing import Any

KINDS = ("number", "integer", "string", "boolean", "number-list")


@dataclass(frozen=True)
class Field:
    """One key of a table: its type, unit, limits and documentation."""

    key: str
    kind: str
    doc: str
    required: bool = False
    default: Any = None
    minimum: float | None = None
    exclusive_minimum: float | None = None
    maximum: float | None = None
    exclusive_maximum: float | None = None
    choices: tuple[str, ...] = ()
    example: Any = None
    label: str = ""          # a few words for axes and headers where the doc's start reads poorly

    def __post_init__(self):
        if self.kind not in KINDS:
            raise ValueError(f"unknown field kind {self.kind!r}")

    def describe_limits(self) -> str:
        """Human-readable limits, e.g. '> 0' or 'one of "a", "b"'."""
        parts = []
        if self.choices:
            parts.append("one of " + ", ".join(f'"{c}"' for c in self.choices))
        for symbol, bound in ((">=", self.minimum), (">", self.exclusive_minimum),
                              ("<=", self.maximum), ("<", self.exclusive_maximum)):
            if bound is not None:
                parts.append(f"{symbol} {bound:g}")
        return ", ".join(parts)


@dataclass(frozen=True)
class Choice:
    """Exactly one of several key groups must be given (or at most one if optional).

    Each group is a tuple of keys that come together, e.g. ("e", "Y", "Y0").
    With ``exclusive=False`` several groups may be given together (at least one
    when required).
    """

    name: str
    groups: tuple[tuple[str, ...], ...]
    required: bool = True
    doc: str = ""
    exclusive: bool = True


@dataclass(frozen=True)
class Table:
    """A TOML table (or array of tables when ``array``) with its keys and sub-tables."""

    name: str
    doc: str
    fields: tuple[Field, ...] = ()
    tables: tuple["Table", ...] = ()
    choices: tuple[Choice, ...] = ()
    array: bool = False
    required: bool = True
    min_items: int = 1

    def field_named(self, key: str) -> Field | None:
        return next((f for f in self.fields if f.key == key), None)

    def table_named(self, name: str) -> "Table | None":
        return next((t for t in self.tables if t.name == name), None)

    @cached_property    # asked once per key of every case: 60,000 times for 10,000 cases
    def keys(self) -> tuple[str, ...]:
        return tuple(f.key for f in self.fields) + tuple(t.name for t in self.tables)
