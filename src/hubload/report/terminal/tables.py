"""Table specs on the terminal: never a cut number or name, whatever the width.

Numbers never wrap: a column of numbers is as wide as its widest cell. Names may
wrap. A table wider than the terminal is split into several, each repeating the
leading (identifying) columns. Text from files (titles, names) goes out as rich
Text with control characters removed, never as markup.
"""

from __future__ import annotations

import textwrap

from rich.console import Console
from rich.text import Text

from hubload.report.columns import Column, TableSpec
from hubload.report.usertext import one_line, plain

NAME_MIN_WIDTH = 12
GAP = "   "              # between columns


def heading_lines(column: Column, width: int = 0) -> list[str]:
    """The label (wrapped at spaces to ``width`` when given) over the unit."""
    lines = textwrap.wrap(column.label, width) if width else [column.label]
    return (lines or [""]) + ([column.unit] if column.unit else [])


def column_width(spec: TableSpec, column: Column, wrap: bool) -> int:
    """The narrowest a column can be without cutting a number or a word (a name column
    keeps at least NAME_MIN_WIDTH, or its longest name when shorter)."""
    cells = [one_line(column.cell(row)) for row in range(spec.row_count)]
    if column.name:
        words = [word for text in cells + [column.label, column.unit] for word in text.split()]
        shortest = min(NAME_MIN_WIDTH, max((len(cell) for cell in cells), default=1))
        return max([len(word) for word in words] + [shortest])
    label_words = column.label.split() if wrap else [column.label]
    return max([len(cell) for cell in cells] + [len(column.unit)]
               + [len(word) for word in label_words])


def fits(console: Console, spec: TableSpec, columns: list[Column], wrap: bool) -> bool:
    """Whether the columns fit the console without cutting a number or a word."""
    widths = [column_width(spec, column, wrap) for column in columns]
    return sum(widths) + len(GAP) * (len(widths) - 1) <= console.width


def column_groups(spec: TableSpec, console: Console) -> tuple[list[list[Column]], bool]:
    """The columns in groups that each fit the console, the leading ones in every group, and
    whether the headers wrap: one table with headers on one line if it fits, else with
    headers wrapped at spaces, else split."""
    columns = list(spec.columns)
    for wrap in (False, True):
        if fits(console, spec, columns, wrap):
            return [columns], wrap
    lead, rest = columns[:spec.keep_first], columns[spec.keep_first:]
    groups: list[list[Column]] = []
    current: list[Column] = []
    for column in rest:
        trial = lead + current + [column]
        if current and not fits(console, spec, trial, True):
            groups.append(lead + current)
            current = [column]
        else:
            current.append(column)
    groups.append(lead + current)
    return groups, True


def widths_for(spec: TableSpec, columns: list[Column], wrap: bool, width: int) -> list[int]:
    """Each column's width: numbers at their full width, names at their longest entry as
    far as the console allows, narrowed (never below their minimum) to fit it."""
    widths = [column_width(spec, column, wrap) for column in columns]
    spare = width - sum(widths) - len(GAP) * (len(widths) - 1)
    for index, column in enumerate(columns):
        if column.name and spare > 0:
            longest = max([len(one_line(column.cell(row))) for row in range(spec.row_count)]
                          + [len(line) for line in heading_lines(column)])
            grown = min(longest, widths[index] + spare)
            spare -= grown - widths[index]
            widths[index] = grown
    return widths


def cell_lines(text: str, width: int, name: bool) -> list[str]:
    """A cell as lines of ``width``: names wrap at spaces (a longer word is folded)."""
    if not name or len(text) <= width:
        return [text]
    return textwrap.wrap(text, width, break_long_words=True) or [""]


def table_text(spec: TableSpec, columns: list[Column], title: str, wrap: bool,
               width: int) -> Text:
    """The table as one styled text: title, bold headers (bottom-aligned) over a rule,
    then the rows; names left-aligned, numbers right-aligned; alerted cells in red."""
    widths = widths_for(spec, columns, wrap, width)
    headers = [heading_lines(c, w if wrap or c.name else 0) for c, w in zip(columns, widths)]
    text = Text(plain(title) + "\n" if title else "", style="italic")
    text.append_text(rows_text([[""] * (max(map(len, headers)) - len(h)) + h for h in headers],
                               columns, widths, lambda _column: "bold"))
    text.append("─" * (sum(widths) + len(GAP) * (len(widths) - 1)) + "\n")
    for row in range(spec.row_count):
        cells = [cell_lines(one_line(c.cell(row)), w, c.name) for c, w in zip(columns, widths)]
        height = max(map(len, cells))
        text.append_text(rows_text([cell + [""] * (height - len(cell)) for cell in cells],
                                   columns, widths,
                                   lambda column: "bold red" if column.alerted(row) else ""))
    text.rstrip()
    return text


def rows_text(cells: list[list[str]], columns: list[Column], widths: list[int],
              style_of) -> Text:
    """Lines of cells (one list of lines per column, all of one height) joined by GAP."""
    text = Text()
    for line in range(len(cells[0])):
        for index, (column, width) in enumerate(zip(columns, widths)):
            value = cells[index][line]
            if index:
                text.append(GAP)
            text.append(value.ljust(width) if column.name else value.rjust(width),
                        style=style_of(column) if value else "")
        text.rstrip()
        text.append("\n")
    return text


def render(spec: TableSpec, console: Console) -> None:
    """Print ``spec`` (split to fit), then what was left out, its legend and its notes.

    The tables are drawn here rather than by rich's Table: their widths are already known
    from the cells, and drawing them directly is a tenth of the cost at start-up."""
    groups, wrap = column_groups(spec, console)
    for index, group in enumerate(groups):
        title = spec.title if index == 0 else "(continued)"
        console.print(table_text(spec, group, title, wrap, console.width), no_wrap=True,
                      overflow="ignore", crop=False, highlight=False)
    for line in ([spec.omitted_note] if spec.omitted_note else []) + legend_lines(spec) \
            + list(spec.notes):
        console.print(Text(plain(line)))


def legend_lines(spec: TableSpec) -> list[str]:
    legend = spec.legend()
    return ["; ".join(legend) + "."] if legend else []
