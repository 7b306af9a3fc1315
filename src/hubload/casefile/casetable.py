"""Load cases from a spreadsheet: ``[cases] table = "duty.csv"`` instead of ``[[case]]`` blocks.

Each row becomes the dict a ``[[case]]`` block gives (its header's keys, the cells as TOML
values; an empty cell is a key not given) and is checked by the same validator, so a
cell breaks the same rules with the same words as a key of a block. Errors name the
table file, the row and the column (``duty.xlsx: row 7, column wheel_load_kN: ...``);
the cross-key rules checked later on the study are located there too
(:meth:`CaseTable.relocated`).
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from pathlib import Path
from typing import TYPE_CHECKING

from hubload.casefile.validate import nearest_key_hint, shortened, validate_table
from hubload.errors import InputError
from hubload.schema.fileformat import CASE, CASE_TABLE_SUFFIXES, CASES

if TYPE_CHECKING:
    from hubload.casefile.sheets import Grid

CASE_PATH = re.compile(r"^case\[(?P<index>\d*)\](?:\.(?P<key>.+))?$")
TEXT_KINDS = ("string",)


@dataclass(frozen=True)
class CaseTable:
    """Where the cases of a document came from: the table file and each case's row."""

    file: str
    rows: tuple[int, ...]

    def relocated(self, error: InputError) -> InputError:
        """``error`` at the row and column of the table when it names a case key."""
        match = CASE_PATH.match(error.key_path or "")
        if match is None:
            return error
        place = []
        if match["index"]:
            place.append(f"row {self.rows[int(match['index'])]}")
        if match["key"]:
            place.append(f"column {match['key']}")
        return InputError(error.message, file=self.file, key_path=", ".join(place) or None)


def expand_case_table(document: dict, source: str) -> tuple[dict, CaseTable | None]:
    """``document`` with the rows of its ``[cases]`` table as ``case`` blocks, and their
    origin; unchanged (origin None) without a ``[cases]`` table."""
    if not isinstance(document, dict) or "cases" not in document:
        return document, None
    given = validate_table(document["cases"], CASES, "cases")
    if "case" in document:
        raise InputError("give the cases as [[case]] blocks or as a [cases] table, not both",
                         key_path="cases.table")
    path = Path(source).parent / given["table"]
    file = str(path)
    if path.suffix.lower() not in CASE_TABLE_SUFFIXES:
        raise InputError(f"expected a table file ending in {' or '.join(CASE_TABLE_SUFFIXES)}, "
                         f"got {shortened(given['table'])!r}", key_path="cases.table")
    from hubload.casefile.sheets import read_grid   # only a file with a table pays for it

    grid = read_grid(path, file, given.get("sheet"))
    blocks = case_blocks(grid, file)
    origin = CaseTable(file, tuple(number for number, _ in grid.rows))
    for index, block in enumerate(blocks):
        try:
            validate_table(block, CASE, f"case[{index}]")
        except InputError as error:
            raise origin.relocated(error) from None
    expanded = {key: value for key, value in document.items() if key != "cases"}
    expanded["case"] = blocks
    return expanded, origin


def header_keys(grid: Grid, file: str) -> list[str | None]:
    """The [[case]] key of each column (None: an empty column without a header)."""
    from hubload.casefile.sheets import column_letter
    keys: list[str | None] = []
    for column, cell in enumerate(grid.header):
        place = f"row {grid.header_row}, column {column_letter(column)}"
        key = text_of(cell).strip() if cell is not None else ""
        if not key:
            keys.append(None)
            continue
        if CASE.field_named(key) is None:
            raise InputError(f"unknown column; {nearest_key_hint(shortened(key), CASE)}",
                             file=file, key_path=f"row {grid.header_row}, column "
                                                 f"{shortened(key)}")
        if key in keys:
            raise InputError(f"column {key} appears twice", file=file, key_path=place)
        keys.append(key)
    for spec in CASE.fields:
        if spec.required and spec.key not in keys:
            raise InputError(f"missing required column {spec.key} ({spec.doc})", file=file,
                             key_path=f"row {grid.header_row}")
    return keys


def case_blocks(grid: Grid, file: str) -> list[dict]:
    from hubload.casefile.sheets import column_letter

    keys = header_keys(grid, file)
    if not grid.rows:
        raise InputError("expected at least 1 row of cases below the header", file=file)
    blocks = []
    for number, cells in grid.rows:
        block = {}
        for column, cell in enumerate(cells):
            if is_blank(cell):
                continue
            key = keys[column] if column < len(keys) else None
            if key is None:
                raise InputError("a value in a column without a header; expected a [[case]] "
                                 "key above it", file=file,
                                 key_path=f"row {number}, column {column_letter(column)}")
            block[key] = cell_value(cell, CASE.field_named(key).kind, grid.decimal_comma)
        blocks.append(block)
    return blocks


def is_blank(cell) -> bool:
    return cell is None or (isinstance(cell, str) and not cell.strip())


def cell_value(cell, kind: str, decimal_comma: bool):
    """The cell as the TOML value of a block: text in a number column that reads as a
    number is that number (a CSV holds text only); a number in a text column is its text
    (a spreadsheet stores a name typed as 3 as a number). Anything else is left for the
    validator to refuse, in its words."""
    if kind in TEXT_KINDS:
        if isinstance(cell, str):
            return cell.strip()       # as a CSV cell: spaces around a name are no part of it
        return text_of(cell) if isinstance(cell, (int, float)) and \
            not isinstance(cell, bool) else cell
    if isinstance(cell, str):
        text = cell.strip()
        if decimal_comma:
            text = text.replace(",", ".")
        if "_" in text:      # Python's 1_1 (= 11) is no number a spreadsheet writes
            return cell.strip()
        try:
            return float(text)
        except ValueError:
            return cell.strip()
    return cell


def text_of(cell) -> str:
    if isinstance(cell, float) and cell.is_integer():
        return str(int(cell))
    return str(cell)


@dataclass(frozen=True)
class WrittenCases:
    """A file's cases as written (validated), with the files they were read from."""

    title: str
    blocks: tuple[dict, ...]
    inputs: tuple[str, ...]       # the load-case file and its table, if any


def written_cases(path: str | Path) -> WrittenCases:
    """The validated cases of the file at ``path``, after the whole file has been checked."""
    from hubload.casefile.load import load_study, read_toml

    file = str(path)
    study = load_study(path)     # the whole file checked: its blocks below are valid
    document, origin = expand_case_table(read_toml(path), file)
    inputs = (file,) if origin is None else (file, origin.file)
    return WrittenCases(study.title, tuple(document["case"]), inputs)


def input_files(path: str | Path) -> tuple[str, ...]:
    """The load-case file at ``path`` and the table its ``[cases]`` names, if any: the files
    that no output of a run on it may replace."""
    from hubload.casefile.load import read_toml

    file = str(path)
    cases = read_toml(path).get("cases")
    table = cases.get("table") if isinstance(cases, dict) else None
    return (file,) if not isinstance(table, str) else (file, str(Path(file).parent / table))
