"""A sheet from table specifications (report.columns): the labels, units and values that the
terminal and the HTML report show, decided once, with numbers as numbers.

A column's header is its label with its unit in brackets (``Fr out [kN]``); a column in %
holds fractions (its text multiplies them), so its numbers are multiplied by 100 here,
the one place a spreadsheet's value differs from the spec's; an index column headed '#' is
headed by its key (``case_index``). The legend and notes of the specs go into the note rows.
"""

from __future__ import annotations

from collections.abc import Sequence

from hubload.report.columns import Column, TableSpec
from hubload.report.spreadsheet.workbook import NOTE, Sheet

PERCENT = "%"


def heading(column: Column) -> str:
    """``label [unit]``; a label '#' (an index) is named by its key instead, since a row that
    starts with '#' is a note row."""
    label = column.key if column.label.startswith(NOTE.strip()) else column.label
    return f"{label} [{column.unit}]" if column.unit else label


def numbers(column: Column) -> list:
    if column.unit != PERCENT:
        return list(column.values)
    return [None if value is None else 100.0 * float(value) for value in column.values]


def spec_sheet(name: str, spec: TableSpec | None, empty_note: str = "",
               notes: Sequence[str] = ()) -> Sheet:
    """The sheet of one spec; a sheet with ``empty_note`` only when there is no spec."""
    if spec is None:
        return Sheet(name=name, title=empty_note, header=(), rows=(), notes=tuple(notes))
    header = unique_headings(spec.columns)
    if len({len(column.values) for column in spec.columns}) > 1:
        raise ValueError(f"the columns of table {spec.key!r} differ in length")   # a bug
    rows = tuple(zip(*(numbers(column) for column in spec.columns)))
    legend = [f"{heading(column)}: {column.legend}" for column in spec.columns if column.legend]
    return Sheet(name=name, title=spec.title, header=header, rows=rows,
                 notes=(*spec.notes, *legend, *notes))


def unique_headings(columns: Sequence[Column]) -> tuple[str, ...]:
    """Headings; one met again gets its key beside it (``s0 (iso281.s0)``): one name, one
    column."""
    plain = [heading(column) for column in columns]
    return tuple(text if plain.index(text) == index else f"{text} ({column.key})"
                 for index, (text, column) in enumerate(zip(plain, columns)))


def merged(key: str, title: str, specs: Sequence[TableSpec | None]) -> TableSpec:
    """Tables with the same rows side by side (rows = cases): each column once, by its key."""
    present = [spec for spec in specs if spec is not None]
    columns: dict[str, Column] = {}
    for spec in present:
        for column in spec.columns:
            columns.setdefault(column.key, column)
    notes = tuple(note for spec in present for note in spec.notes)
    return TableSpec(key, title, tuple(columns.values()), notes=notes)
