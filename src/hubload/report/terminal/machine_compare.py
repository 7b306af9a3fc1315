"""``hubload compare`` of machine files on the terminal: machines side by side."""

from __future__ import annotations

import math
from collections.abc import Sequence

from rich.console import Console
from rich.text import Text

from hubload.engine.machine import MachineResult
from hubload.report.cautions import CAUTIONS
from hubload.report.columns import Column, TableSpec
from hubload.report.numbers import hours, safety
from hubload.report.terminal.tables import render as render_table
from hubload.report.usertext import plain
from hubload.report.terminal.compare import ratio_text


def life_with_ratio(value: float, first: float, index: int) -> str:
    if index == 0 or not (0 < first < math.inf and value < math.inf):
        return hours(value)
    return f"{hours(value)} ({ratio_text(value / first)})"


def side_by_side(machines: Sequence[MachineResult]) -> TableSpec:
    """Quantities in rows, machines in columns (ratios against #1 in brackets)."""
    symbol = machines[0].governing.symbol
    names = [w.name for w in machines[0].wheel_ends]
    labels = [f"machine {symbol} h", *(f"{name} {symbol} h" for name in names),
              "weakest wheel end", "lowest s0", "verdict"]
    columns = [Column("quantity", "", labels, name=True)]
    for index, machine in enumerate(machines):
        first = machines[0]
        cells = [life_with_ratio(machine.governing.life_h, first.governing.life_h, index)]
        by_name = {w.name: w for w in machine.wheel_ends}
        for name, reference in zip(names, first.wheel_ends):
            found = by_name.get(name)
            cells.append("-" if found is None else life_with_ratio(
                found.governing_life_h, reference.governing_life_h, index))
        cells.append(machine.weakest.name)
        cells.append(safety(min(w.result.lowest_static_safety for w in machine.wheel_ends)))
        found = machine.verdict
        cells.append("no target" if found is None else "pass" if found.passed else "FAIL")
        columns.append(Column(f"machines[{index}]", f"#{index + 1}", cells,
                              alert=lambda text: text == "FAIL"))
    return TableSpec("machines", "Machines side by side (ratio against #1)", tuple(columns))


def render(machines: Sequence[MachineResult], console: Console) -> None:
    for index, machine in enumerate(machines, start=1):
        console.print(Text.assemble(f"#{index}: ", (plain(machine.study.title), "bold"),
                                    f" ({plain(machine.study.source)})"))
    render_table(side_by_side(machines), console)
    console.print(Text(f"Caution: {CAUTIONS}", style="dim"))
