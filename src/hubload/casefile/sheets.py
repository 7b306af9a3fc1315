"""Reading a table file (CSV or an XLSX sheet) into rows of cells; no meaning given to them.

Rows are numbered as a spreadsheet numbers them (the first line is row 1), so that an
error names the row the user sees. Lines before the header whose first cell starts
with '#' are comments (hubload writes its notes and cautions there). A CSV file may be
separated by commas or, as spreadsheets in many locales save it, by semicolons; it may
start with a byte-order mark (UTF-8 with BOM, as spreadsheets save it).
"""

from __future__ import annotations

import csv
import io
from dataclasses import dataclass
from pathlib import Path

from hubload.errors import InputError

COMMENT = "#"
# A spreadsheet's "CSV (semicolon)" export; its decimal separator is then often a comma.
SEMICOLON = ";"


@dataclass(frozen=True)
class Grid:
    """The header (row number, cells) and the data rows (row number, cells) of a table."""

    header_row: int
    header: tuple
    rows: tuple[tuple[int, tuple], ...]
    decimal_comma: bool = False        # a semicolon CSV: "1,5" is one and a half


def read_grid(path: Path, file: str, sheet: str | None) -> Grid:
    """The cells of the CSV file or XLSX sheet at ``path`` (``file``: its name in messages)."""
    suffix = path.suffix.lower()
    if suffix == ".csv":
        if sheet is not None:
            raise InputError("a CSV file has no sheets: remove 'sheet'", key_path="cases.sheet")
        return csv_grid(read_text(path, file), file)
    return xlsx_grid(path, file, sheet)


def read_text(path: Path, file: str) -> str:
    try:
        return path.read_text(encoding="utf-8-sig")
    except FileNotFoundError:
        raise InputError("file not found", file=file) from None
    except (OSError, UnicodeDecodeError) as error:
        raise InputError(f"cannot read the file ({error}); expected a UTF-8 CSV file",
                         file=file) from None


def csv_grid(text: str, file: str) -> Grid:
    lines = text.splitlines()
    first = next((line for line in lines if line.strip() and not is_comment(line)), "")
    delimiter = SEMICOLON if SEMICOLON in first and "," not in first else ","
    reader = csv.reader(io.StringIO(text), delimiter=delimiter, strict=True)
    try:
        records = list(reader)
    except csv.Error as error:
        raise InputError(f"CSV syntax error ({error})", file=file,
                         key_path=f"row {reader.line_num}") from None
    numbered = [(index + 1, tuple(cell.strip() for cell in record))
                for index, record in enumerate(records)]
    return split_header(numbered, file, decimal_comma=delimiter == SEMICOLON)


def is_comment(cell) -> bool:
    return isinstance(cell, str) and cell.lstrip().startswith(COMMENT)


def split_header(numbered: list, file: str, decimal_comma: bool = False) -> Grid:
    """Skip the comment lines and empty rows before the header; drop empty data rows."""
    rows = [(number, cells) for number, cells in numbered if not is_empty(cells)]
    while rows and is_comment(rows[0][1][0]):
        rows.pop(0)
    if not rows:
        raise InputError("the table is empty: expected a header row of [[case]] keys and one "
                         "row per case", file=file)
    (header_row, header), data = rows[0], rows[1:]
    return Grid(header_row, header, tuple(data), decimal_comma)


def is_empty(cells) -> bool:
    return all(cell is None or (isinstance(cell, str) and not cell.strip()) for cell in cells)


def xlsx_grid(path: Path, file: str, sheet: str | None) -> Grid:
    if not path.exists():
        raise InputError("file not found", file=file)
    return split_header(saved_values(path, file, sheet), file)


def saved_values(path: Path, file: str, sheet: str | None = None) -> list:
    """(row number, cell values) of the sheet (the first without ``sheet``), a formula by
    the value the spreadsheet program saved with it; InputError where none was saved."""
    values = sheet_values(path, file, sheet, computed=False)
    if any(is_formula(cell) for _, cells in values for cell in cells):
        computed = sheet_values(path, file, sheet, computed=True)
        values = [(number, tuple(uncomputed(file, number, column, formula, value)
                                 for column, (formula, value) in enumerate(zip(cells, saved))))
                  for (number, cells), (_, saved) in zip(values, computed)]
    return values


def is_formula(cell) -> bool:
    return isinstance(cell, str) and cell.startswith("=")


def uncomputed(file: str, row: int, column: int, formula, value):
    if is_formula(formula) and value is None:
        raise InputError("a formula without a saved value (the workbook was not saved by a "
                         "spreadsheet program); open and save it there, or type the value",
                         file=file, key_path=f"row {row}, column {column_letter(column)}")
    return value


def column_letter(index: int) -> str:
    """The spreadsheet's name of the column at 0-based ``index``: A, B, ..., Z, AA, ..."""
    letters = ""
    index += 1
    while index:
        index, remainder = divmod(index - 1, 26)
        letters = chr(ord("A") + remainder) + letters
    return letters


def sheet_values(path: Path, file: str, sheet: str | None, computed: bool) -> list:
    """(row number, cell values) of every row of the sheet (formulas as text, or their
    saved values when ``computed``)."""
    from openpyxl import load_workbook   # only a run that reads a workbook pays for it

    try:
        workbook = load_workbook(path, read_only=True, data_only=computed)
    except Exception as error:  # openpyxl raises many kinds for a file that is no workbook
        raise InputError(f"cannot read the workbook ({type(error).__name__}: "
                         f"{str(error)[:120]}); expected an .xlsx file", file=file) from None
    try:
        if sheet is None:
            worksheet = workbook.worksheets[0]
        elif sheet in workbook.sheetnames:
            worksheet = workbook[sheet]
        else:
            raise InputError(f"no sheet named {sheet!r}; the workbook has "
                             f"{', '.join(repr(name) for name in workbook.sheetnames)}",
                             file=file)
        return [(number, tuple(row)) for number, row in
                enumerate(worksheet.iter_rows(values_only=True), start=1)]
    finally:
        workbook.close()
