"""Table specs on the terminal: never a cut number or name, whatever the width.

Numbers never wrap: a column of numbers is as wide as its widest cell. Names may
wrap. A table wider than the terminal is split into several, each repeating the
leading (identifying) columns. Text from files (titles, names) goes out as rich
Text with control characters removed, never as markup.
"""

from __future__ import annotations

import io
import re
import textwrap

from rich import box
from rich.console import Console
from rich.table import Table
from rich.text import Text

from hubload.report.columns import Column, TableSpec

# Terminal escape sequences whole (ECMA-48: CSI ... final byte, OSC ... BEL or ST, and the
# two-byte ones), so that no remnant like "[31m" stays behind; then any control character.
ESCAPE_SEQUENCE = re.compile(r"(\x1b\[|\x9b)[0-?]*[ -/]*[@-~]?"
                             r"|(\x1b[\]PX^_]|[\x90\x98\x9d\x9e\x9f]).*?(\x07|\x1b\\|\x9c|$)"
                             r"|\x1b[ -/]*[0-~]?", re.DOTALL)
CONTROL = re.compile(r"[\x00-\x08\x0b-\x1f\x7f-\x9f]")
NAME_MIN_WIDTH = 12


def plain(text: str) -> str:
    """User text for the terminal: escape sequences and control characters removed (line
    breaks and tabs stay)."""
    return CONTROL.sub("", ESCAPE_SEQUENCE.sub("", str(text)))


def heading(column: Column, width: int = 0) -> Text:
    """The label (wrapped at spaces to ``width`` when given) over the unit."""
    lines = textwrap.wrap(column.label, width) if width else [column.label]
    return Text("\n".join(lines or [""]) + (f"\n{column.unit}" if column.unit else ""))


def rich_table(spec: TableSpec, columns: list[Column], title: str,
               wrap: bool = False) -> Table:
    """The columns as a rich table; ``wrap``: headers wrapped at spaces to the cells' width."""
    table = Table(title=Text(plain(title)), title_justify="left", box=box.SIMPLE_HEAD,
                  pad_edge=False, show_edge=False)
    for column in columns:
        if column.name:
            table.add_column(heading(column), justify="left", overflow="fold",
                             min_width=min(NAME_MIN_WIDTH, max(
                                 (len(column.cell(r)) for r in range(spec.row_count)),
                                 default=1)))
        else:
            words = column.label.split() if wrap else [column.label]
            width = max([len(column.cell(r)) for r in range(spec.row_count)]
                        + [len(column.unit)] + [len(word) for word in words])
            table.add_column(heading(column, width if wrap else 0), justify="right",
                             no_wrap=True, min_width=width)
    for row in range(spec.row_count):
        table.add_row(*(Text(plain(c.cell(row)), style="bold red" if c.alerted(row) else "")
                        for c in columns))
    return table


def fits(console: Console, table: Table) -> bool:
    """Whether ``table`` fits without cutting a number (rich clamps a measurement to the
    console's width, so the natural width is measured on an unbounded console)."""
    unbounded = Console(width=100_000, file=io.StringIO())
    return unbounded.measure(table).minimum <= console.width


def column_groups(spec: TableSpec, console: Console) -> tuple[list[list[Column]], bool]:
    """The columns in groups that each fit the console, the leading ones in every group, and
    whether the headers wrap: one table with headers on one line if it fits, else with
    headers wrapped at spaces, else split."""
    columns = list(spec.columns)
    for wrap in (False, True):
        if fits(console, rich_table(spec, columns, "", wrap)):
            return [columns], wrap
    lead, rest = columns[:spec.keep_first], columns[spec.keep_first:]
    groups: list[list[Column]] = []
    current: list[Column] = []
    for column in rest:
        trial = lead + current + [column]
        if current and not fits(console, rich_table(spec, trial, "", True)):
            groups.append(lead + current)
            current = [column]
        else:
            current.append(column)
    groups.append(lead + current)
    return groups, True


def render(spec: TableSpec, console: Console) -> None:
    """Print ``spec`` (split to fit), then what was left out, its legend and its notes."""
    groups, wrap = column_groups(spec, console)
    for index, group in enumerate(groups):
        title = spec.title if index == 0 else "(continued)"
        console.print(rich_table(spec, group, title, wrap))
    for line in ([spec.omitted_note] if spec.omitted_note else []) + legend_lines(spec) \
            + list(spec.notes):
        console.print(Text(plain(line)))


def legend_lines(spec: TableSpec) -> list[str]:
    legend = spec.legend()
    return ["; ".join(legend) + "."] if legend else []
