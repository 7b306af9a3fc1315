"""``hubload sweep`` on the terminal: lives and safeties per point, or a life map for two keys."""

from __future__ import annotations

import math

import numpy as np
from rich import box
from rich.console import Console
from rich.table import Table
from rich.text import Text

from hubload.report.cautions import CAUTIONS
from hubload.report.keywords import key_words
from hubload.report.specs.sweep import point_table
from hubload.report.terminal.tables import render as render_spec
from hubload.report.usertext import plain
from hubload.studies.sweep import Sweep

MAP_MAX_COLUMNS = 7
NO_TARGET = "No target life given ([project] target_life_h): no target crossing."


def compact_hours(value: float) -> str:
    """Hours in at most 5 characters: 908, 7,605, 45.8k, 1.2M."""
    if math.isinf(value):
        return "inf"
    if value < 1e4:
        return f"{value:,.0f}" if value >= 10 else f"{value:.2g}"
    return f"{value / 1e3:.3g}k" if value < 1e6 else f"{value / 1e6:.3g}M"


def life_map(sweep: Sweep) -> Table:
    """Governing system life over two keys: rows = first key, columns = second key."""
    rows, columns = sweep.axes[0], sweep.axes[1]
    count = len(columns.values)
    shown = sorted({round(i) for i in np.linspace(0, count - 1, min(count, MAP_MAX_COLUMNS))})
    table = Table(title=f"System {sweep.first.governing.symbol} (h); rows: {rows.key}, "
                        f"columns: {columns.key}", title_justify="left", box=box.SIMPLE_HEAD,
                  pad_edge=False, collapse_padding=True)
    table.add_column(rows.key, justify="right", min_width=min(len(rows.key), 24))
    for j in shown:
        table.add_column(f"{columns.values[j]:.4g}", justify="right")
    lives = sweep.governing_life_h
    targets = sweep.targets_h
    for i, row_value in enumerate(rows.values):
        cells = [f"{row_value:g}"]
        for j in shown:
            point = i * count + j
            text = compact_hours(float(lives[point]))
            cells.append(Text(text) if targets is None else
                         Text(text, style="green" if lives[point] >= targets[point] else "red"))
        table.add_row(*cells)
    if len(shown) < count:
        table.caption = f"{len(shown)} of {count} columns shown; --json has all"
    return table


def direction(crossing) -> str:
    return "falls below" if crossing.falls_below else "rises above"


def crossing_lines(sweep: Sweep) -> list[str]:
    """One key: where the governing life crosses the target and the shaft's lowest safety
    its required value (each reported on its own: a file may give one without the other)."""
    name, key = sweep.first.governing.symbol, sweep.axes[-1].key
    targets = sweep.targets_h
    lines = [NO_TARGET] if targets is None else [
        f"System {name} {direction(crossing)} the target at {key} = {crossing.value:.4g} "
        f"({'interpolated' if crossing.interpolated else 'next to an infinite or zero life'})."
        for _, found in sweep.crossings() for crossing in found]
    if not lines:
        passed = sweep.governing_life_h[0] >= targets[0]
        lines = [f"System {name} stays {'above' if passed else 'below'} the target "
                 "over the whole sweep."]
    return lines + [f"Shaft's lowest safety {direction(crossing)} its required safety at "
                    f"{key} = {crossing.value:.4g}."
                    for _, found in sweep.shaft_crossings() for crossing in found]


def crossing_tables(sweep: Sweep) -> list:
    """Grid sweeps: one table row per crossing (values of the other keys, where, which way),
    for the governing life and for the shaft's lowest safety, each on its own."""
    name = sweep.first.governing.symbol
    life = crossing_table(sweep, f"Where the system {name} crosses the target",
                          sweep.crossings())
    shaft = crossing_table(sweep, "Where the shaft's lowest safety crosses its required safety",
                           sweep.shaft_crossings())
    if sweep.targets_h is None:
        note = [NO_TARGET]
    else:
        note = [] if life else [f"System {name} does not cross the target on the grid."]
    return note + [table for table in (life, shaft) if table is not None]


def crossing_table(sweep: Sweep, title: str, found) -> Table | None:
    rows = [(where, crossing) for where, crossings in found for crossing in crossings]
    if not rows:
        return None
    table = Table(title=title, title_justify="left", box=box.SIMPLE_HEAD)
    for axis in sweep.axes:
        table.add_column(axis.key, justify="right")
    table.add_column("")
    for where, crossing in rows:
        table.add_row(*(f"{v:g}" for v in where.values()), f"{crossing.value:.4g}",
                      direction(crossing))
    return table


def axis_lines(sweep: Sweep) -> list[str]:
    """What each axis moves, in the file format's words."""
    study = sweep.first.study
    sections = [s.name for s in study.shaft.sections] if study.shaft is not None else []
    return [f"{path.text}: {key_words(path, study.cases.names, sections)}"
            for axis in sweep.axes for path, _ in axis.moving()]


def render(sweep: Sweep, console: Console) -> None:
    console.print(Text.assemble((plain(sweep.title), "bold"), f"  ({plain(sweep.source)})"))
    for line in axis_lines(sweep):
        console.print(Text(plain(line)))
    if len(sweep.axes) == 2:
        console.print(life_map(sweep))
    else:
        render_spec(point_table(sweep, "life"), console)
        render_spec(point_table(sweep, "safety"), console)
    if len(sweep.axes) >= 2:
        for table in crossing_tables(sweep):
            console.print(table)
    else:
        for line in crossing_lines(sweep):
            console.print(line)
    console.print(Text(f"Caution: {CAUTIONS}", style="dim"))
