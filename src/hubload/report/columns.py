"""Table specifications shared by every output format: one per table, written once.

A :class:`TableSpec` holds its title, its columns and its rows; each :class:`Column`
its header (short label, unit, words for the legend), its values (numbers stay
numbers, for spreadsheets) and the one function that turns a value into text.
The terminal, the HTML report and the spreadsheet writers render the same specs,
so no output guesses a label or a number format from a key name.

Tables whose rows are load cases can be cut to the most damaging cases
(:func:`most_damaging`): real spectra classed from logs have a thousand cases.
"""

from __future__ import annotations

from collections.abc import Callable, Sequence
from dataclasses import dataclass, replace

import numpy as np

CASE_ROWS_SHOWN = 25       # rows of a case table shown by default (the most damaging)


@dataclass(frozen=True)
class Column:
    """One column: header, values (one per row, numbers as numbers) and their text."""

    key: str                                   # stable id: HTML data-key, spreadsheet header
    label: str                                 # short header, e.g. "Fr"
    values: Sequence
    unit: str = ""                             # e.g. "kN"
    text: Callable[[object], str] = str        # value -> cell text (the one format)
    legend: str = ""                           # the label in words, where it abbreviates
    name: bool = False                         # a name (may wrap); numbers never wrap
    alert: Callable[[object], bool] | None = None   # a value to show as a warning (red)

    @property
    def heading(self) -> str:
        return f"{self.label} {self.unit}".strip()

    def cell(self, row: int) -> str:
        return self.text(self.values[row])

    def alerted(self, row: int) -> bool:
        return self.alert is not None and bool(self.alert(self.values[row]))

    def taking(self, rows: Sequence[int]) -> "Column":
        return replace(self, values=[self.values[i] for i in rows])


@dataclass(frozen=True)
class TableSpec:
    """A table: title, columns and, below it, notes (the legend is built from the columns)."""

    key: str
    title: str
    columns: tuple[Column, ...]
    notes: tuple[str, ...] = ()
    rows_total: int | None = None       # rows before a cut (None: nothing cut)
    omitted_note: str = ""              # what the cut left out, in words
    keep_first: int = 1                 # leading columns repeated when a table is split
    row_keys: tuple[str, ...] = ()      # per row, the dotted prefix of its cells' data keys

    @property
    def row_count(self) -> int:
        return len(self.columns[0].values) if self.columns else 0

    def legend(self) -> list[str]:
        """'Fr: radial load' for every column whose label abbreviates."""
        return [f"{c.label}: {c.legend}" for c in self.columns if c.legend]

    def taking(self, rows: Sequence[int], omitted_note: str) -> "TableSpec":
        return replace(self, columns=tuple(c.taking(rows) for c in self.columns),
                       rows_total=self.row_count, omitted_note=omitted_note,
                       row_keys=tuple(self.row_keys[i] for i in rows) if self.row_keys else ())

    def data_key(self, row: int, column: Column) -> str:
        """The key a cell carries in the HTML report (``bearings.outboard.s0``), if any."""
        return f"{self.row_keys[row]}.{column.key}" if self.row_keys else ""


def most_damaging(shares, limit: int) -> list[int] | None:
    """Case indices of the ``limit`` largest damage shares, in file order; None when every
    case fits (a zero share never displaces a damaging case; ties keep file order)."""
    shares = np.nan_to_num(np.asarray(shares, dtype=float), nan=0.0)
    if shares.size <= limit:
        return None
    order = np.argsort(-shares, kind="stable")[:limit]
    return sorted(int(i) for i in order)


def cut_to_cases(spec: TableSpec, shares, basis: str, limit: int | None) -> TableSpec:
    """``spec`` (rows = cases) cut to its ``limit`` most damaging cases on ``basis``, with a
    line saying what was left out; unchanged when ``limit`` is None or every case fits."""
    if limit is None:
        return spec
    kept = most_damaging(shares, limit)
    if kept is None:
        return spec
    left = np.ones(len(shares), dtype=bool)
    left[kept] = False
    share = float(np.nansum(np.asarray(shares, dtype=float)[left]))
    note = (f"{int(left.sum()):,} more cases, {100 * share:.1f} % of the {basis} damage; "
            f"--all to list them")
    return spec.taking(kept, note)
