"""Read field data (CSV or XLSX): hours and status per unit, optional unit id and position.

The first row names the columns: ``hours`` and ``status`` (``failed`` or
``suspended``) are required, ``unit`` and ``position`` optional; names are matched
without regard to case or surrounding spaces, and any other column is an error.
Rows are numbered as a spreadsheet shows them (the header is row 1); empty rows are
skipped, and so are a CSV file's comment lines (starting with #). Every error names
the file, the row and the column.
"""

from __future__ import annotations

import csv
import difflib
import math
from pathlib import Path

import numpy as np

from hubload.domain.field import FieldData
from hubload.errors import InputError
from hubload.schema.limits import MAX_TARGET_LIFE_H

REQUIRED_COLUMNS = ("hours", "status")
OPTIONAL_COLUMNS = ("unit", "position")
STATUSES = {"failed": True, "suspended": False}
SUFFIXES = (".csv", ".xlsx")
# More units than any wheel-end fleet returns in a season; a larger file is not field data.
MAX_ROWS = 1_000_000
MAX_TEXT_CHARS = 200


def read_field_data(path: str | Path) -> FieldData:
    """The field data of ``path``; InputError naming file, row and column on bad input."""
    file = str(path)
    suffix = Path(path).suffix.lower()
    if suffix not in SUFFIXES:
        raise InputError(f"expected a .csv or .xlsx file, got '{Path(path).name}'", file=file)
    if not Path(path).is_file():
        raise InputError("file not found", file=file)
    rows = xlsx_rows(path) if suffix == ".xlsx" else csv_rows(path)
    try:
        return field_data_of(rows, file)
    except InputError as error:
        raise error.located(file) from None


def csv_rows(path):
    """(row number, cells) of a CSV file: comma or semicolon separated, by the header."""
    try:
        text = Path(path).read_text(encoding="utf-8-sig")
    except (OSError, UnicodeDecodeError) as error:
        raise InputError(f"cannot read the file ({error})", file=str(path)) from None
    # comment lines (# ...) become empty rows: skipped, and the row numbers stay the file's
    lines = ["" if line.lstrip().startswith("#") else line for line in text.splitlines()]
    header = next((line for line in lines if line.strip()), "")
    delimiter = ";" if header.count(";") > header.count(",") else ","
    reader = csv.reader(lines, delimiter=delimiter, strict=True)
    try:
        for cells in reader:
            yield reader.line_num, cells
    except csv.Error as error:
        raise InputError(f"CSV syntax error ({error})", file=str(path),
                         key_path=f"row {reader.line_num}") from None


def xlsx_rows(path):
    """(row number, cells) of the first worksheet of an XLSX workbook (casefile.sheets:
    formulas by their saved values)."""
    from hubload.casefile.sheets import saved_values

    for number, cells in saved_values(Path(path), str(path)):
        yield number, ["" if cell is None else cell for cell in cells]


def column_names(cells) -> dict[str, int]:
    """Column name -> index of the header row; unknown, missing or repeated names are errors."""
    found: dict[str, int] = {}
    known = REQUIRED_COLUMNS + OPTIONAL_COLUMNS
    for index, cell in enumerate(cells):
        name = str(cell).strip().lower()
        if not name:
            continue
        if name not in known:
            close = difflib.get_close_matches(name, known, n=1, cutoff=0.5)
            hint = f"did you mean '{close[0]}'?" if close else "expected " + ", ".join(known)
            raise InputError(f"unknown column {str(cell)[:60]!r}; {hint}",
                             key_path=f"row 1, column {index + 1}")
        if name in found:
            raise InputError(f"column '{name}' appears twice", key_path=f"row 1, column {index + 1}")
        found[name] = index
    for name in REQUIRED_COLUMNS:
        if name not in found:
            raise InputError(f"missing column '{name}' (the first row names the columns: "
                             f"hours, status, and optionally unit, position)", key_path="row 1")
    return found


def cell_of(cells, index: int) -> object:
    return cells[index] if index < len(cells) else ""


# A unit's hours below 36 s of operation are a slip of the keyboard (a fit to them spans
# hundreds of decades); common practice.
MIN_UNIT_HOURS = 0.01


def hours_of(value, where: str) -> float:
    text = str(value).strip()
    try:
        if "_" in text:      # Python's 1_000 is no number a spreadsheet writes
            raise ValueError(text)
        hours = float(value) if isinstance(value, (int, float)) and not isinstance(value, bool) \
            else float(text)
    except ValueError:
        raise InputError(f"expected a number of operating hours, got {text[:60]!r}",
                         key_path=where) from None
    if not math.isfinite(hours) or not MIN_UNIT_HOURS <= hours <= MAX_TARGET_LIFE_H:
        raise InputError(f"expected operating hours from {MIN_UNIT_HOURS:g} to "
                         f"{MAX_TARGET_LIFE_H:,.0f}, got {text[:60]}", key_path=where)
    return hours


def status_of(value, where: str) -> bool:
    text = str(value).strip().lower()
    if text not in STATUSES:
        raise InputError(f"expected status failed or suspended, got {str(value)[:60]!r}",
                         key_path=where)
    return STATUSES[text]


def text_of(value, where: str) -> str:
    text = str(value).strip()
    if len(text) > MAX_TEXT_CHARS:
        raise InputError(f"expected at most {MAX_TEXT_CHARS} characters", key_path=where)
    return text


def field_data_of(rows, file: str) -> FieldData:
    """Validate the rows (header first) and build the field data."""
    columns = None
    hours, failed, units, positions, numbers = [], [], [], [], []
    for number, cells in rows:
        if not any(str(cell).strip() for cell in cells):
            continue
        if columns is None:
            columns = column_names(cells)
            continue
        if len(hours) >= MAX_ROWS:
            raise InputError(f"more than {MAX_ROWS:,} rows; field data of one wheel end "
                             "are far fewer", key_path=f"row {number}")
        where = {name: f"row {number}, column {name}" for name in columns}
        numbers.append(number)
        hours.append(hours_of(cell_of(cells, columns["hours"]), where["hours"]))
        failed.append(status_of(cell_of(cells, columns["status"]), where["status"]))
        if "unit" in columns:
            units.append(text_of(cell_of(cells, columns["unit"]), where["unit"]))
        if "position" in columns:
            positions.append(text_of(cell_of(cells, columns["position"]), where["position"]) or "-")
    if columns is None:
        raise InputError("empty file: expected a header row (hours, status) and one row per unit")
    if not hours:
        raise InputError("no data rows: expected one row per unit below the header")
    return FieldData(source=file, hours=np.array(hours), failed=np.array(failed, dtype=bool),
                     unit=tuple(units) if "unit" in columns else None,
                     position=tuple(positions) if "position" in columns else None,
                     row_number=tuple(numbers))
