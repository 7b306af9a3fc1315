"""Writing sheets: one XLSX workbook, or CSV files; atomically, never over a user's file.

Every sheet starts with note rows whose first cell begins with '#' (its title, the
cautions, its notes), then its header row (units in brackets), then one row per item;
hubload's own table reader skips such note rows before the header. Numbers are
written as numbers; an infinite value (a life without damage, a safety without load)
as the text ``inf``, an undefined one as an empty cell.

A CSV path names one file for one sheet. For several sheets it names their stem:
``out.csv`` gives ``out-cases.csv``, ``out-bearings.csv``, ... beside it.
"""

from __future__ import annotations

import csv
import io
import math
from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from pathlib import Path

import numpy as np

from hubload.report.cautions import CAUTIONS
from hubload.report.files import checked_output, write_text, write_with
from hubload.report.usertext import plain

SUFFIXES = (".xlsx", ".csv")
INFINITE = "inf"
NOTE = "# "
MAX_SHEET_NAME = 31      # Excel's limit on a sheet's name
EXACT = 2.0 ** 53        # every whole number below it is exact as a float
MIN_WIDTH, MAX_WIDTH = 10, 60   # characters: a number of 8 digits; a long case name


@dataclass(frozen=True)
class Sheet:
    """One sheet: its name, the note rows above the header, the header and the rows."""

    name: str
    title: str
    header: tuple[str, ...]
    rows: tuple[tuple, ...]
    notes: tuple[str, ...] = ()

    def note_rows(self) -> list[str]:
        return [NOTE + self.title, f"{NOTE}Caution: {CAUTIONS}"] + \
            [NOTE + note for note in self.notes]


def cell(value):
    """A value as a spreadsheet cell: numbers as numbers, inf as 'inf', NaN/None as empty."""
    if value is None or isinstance(value, str):
        return value
    if isinstance(value, (bool, np.bool_)):
        return bool(value)
    if isinstance(value, (int, np.integer)):
        return int(value)
    number = float(value)
    if math.isnan(number):
        return None
    return number if math.isfinite(number) else (INFINITE if number > 0 else "-" + INFINITE)


def csv_text(sheet: Sheet) -> str:
    stream = io.StringIO()
    # note lines as they read, not quoted: a reader that skips '#' lines (hubload's, or
    # a data library's comment option) skips them whole; no quote in them opens a field
    for note in sheet.note_rows():
        stream.write(" ".join(note.replace('"', "'").splitlines()) + "\n")
    writer = csv.writer(stream, lineterminator="\n")
    writer.writerow(sheet.header)
    writer.writerows([csv_cell(value) for value in row] for row in sheet.rows)
    return stream.getvalue()


def csv_cell(value) -> str:
    value = cell(value)
    if value is None:
        return ""
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, float):   # repr: the shortest text that reads back exactly
        return str(int(value)) if value.is_integer() and abs(value) < EXACT else repr(value)
    return str(value)


def output_paths(path: str, names: Sequence[str]) -> list[str]:
    """The files a --table path names for sheets ``names`` (one workbook, or CSV files)."""
    target = Path(path)
    if target.suffix.lower() == ".xlsx" or len(names) == 1:
        return [path]
    return [str(target.with_name(f"{target.stem}-{name}{target.suffix}")) for name in names]


def check_outputs(path: str, names: Sequence[str], force: bool, inputs: Iterable[str]) -> None:
    """Refuse the output files before the work (checked again when written)."""
    inputs = tuple(inputs)
    checked_output(path, True, SUFFIXES, inputs)   # the suffix, whatever the files below
    for file in output_paths(path, names):
        checked_output(file, force, SUFFIXES, inputs)


def write_sheets(path: str, sheets: Sequence[Sheet], force: bool,
                 inputs: Iterable[str] = ()) -> list[str]:
    """Write ``sheets`` to ``path`` (.xlsx: one workbook; .csv: one file per sheet)."""
    inputs = tuple(inputs)
    check_outputs(path, [sheet.name for sheet in sheets], force, inputs)
    files = output_paths(path, [sheet.name for sheet in sheets])
    if Path(path).suffix.lower() == ".xlsx":
        write_with(path, lambda temporary: save_workbook(temporary, sheets), force,
                   SUFFIXES, inputs)
        return files
    for file, sheet in zip(files, sheets):
        write_text(file, csv_text(sheet), force, SUFFIXES, inputs)
    return files


def workbook_value(value):
    """User text without escape sequences and control characters: a workbook's XML holds
    none of C0 but tab and line breaks (Office Open XML, ECMA-376, takes XML 1.0's Char)."""
    return plain(value) if isinstance(value, str) else value


def save_workbook(target: Path, sheets: Sequence[Sheet]) -> None:
    from openpyxl import Workbook    # only a run that writes a workbook pays for it
    from openpyxl.styles import Font
    from openpyxl.utils import get_column_letter

    workbook = Workbook()
    workbook.remove(workbook.active)
    for sheet in sheets:
        worksheet = workbook.create_sheet(workbook_value(sheet.name)[:MAX_SHEET_NAME])
        for note in sheet.note_rows():
            worksheet.append([workbook_value(note)])
        worksheet.append([workbook_value(heading) for heading in sheet.header])
        header_row = worksheet.max_row
        for column, heading in enumerate(sheet.header, start=1):
            worksheet.cell(row=header_row, column=column).font = Font(bold=True)
            texts = [row[column - 1] for row in sheet.rows if isinstance(row[column - 1], str)]
            worksheet.column_dimensions[get_column_letter(column)].width = \
                min(MAX_WIDTH, max([MIN_WIDTH, len(heading) + 2, *(len(t) + 1 for t in texts)]))
        worksheet.freeze_panes = f"A{header_row + 1}"   # the header stays in view
        for row in sheet.rows:
            worksheet.append([workbook_value(cell(value)) for value in row])
    with target.open("wb") as stream:   # openpyxl would pick the format from the suffix
        workbook.save(stream)

