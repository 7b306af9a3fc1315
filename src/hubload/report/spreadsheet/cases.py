"""A file's load cases as a table that ``[cases] table = ...`` reads back (``hubload cases``).

One row per ``[[case]]`` block, one column per key given in any block, in the order of the
file format; the values as written in the file, so that the table reads back to the same
study (an empty cell: the key was not given).
"""

from __future__ import annotations

from hubload.casefile.casetable import WrittenCases
from hubload.report.spreadsheet.workbook import Sheet
from hubload.schema.fileformat import CASE


def cases_sheet(cases: WrittenCases) -> Sheet:
    given = {key for block in cases.blocks for key in block}
    keys = tuple(spec.key for spec in CASE.fields if spec.key in given)
    return Sheet(
        name="cases", title=f"Load cases of {cases.title} ({cases.inputs[0]})", header=keys,
        rows=tuple(tuple(block.get(key) for key in keys) for block in cases.blocks),
        notes=("One row per [[case]] block, headed by its keys (units in the names); an empty "
               "cell is a key not given. A load-case file reads it with [cases] table = "
               "\"<this file>\" (docs/spreadsheets.md).",))
