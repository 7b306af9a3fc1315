"""The sheet's table of ``hubload compare`` on machine files: one row per machine, numbers as
numbers (the terminal shows the same quantities transposed, with ratios, in
report/terminal/machine_compare.py)."""

from __future__ import annotations

from collections.abc import Sequence

from hubload.engine.machine import MachineResult
from hubload.report.columns import Column, TableSpec
from hubload.report.numbers import hours, safety


def wheel_end_life(machine: MachineResult, name: str) -> float | None:
    found = next((w for w in machine.wheel_ends if w.name == name), None)
    return None if found is None else found.governing_life_h


def machines_table(machines: Sequence[MachineResult]) -> TableSpec:
    first = machines[0]
    symbol = first.governing.symbol
    names = [w.name for w in first.wheel_ends]
    reference = first.governing.life_h
    columns = [
        Column("index", "machine", list(range(1, len(machines) + 1)),
               legend="#1 is the reference of the ratios"),
        Column("title", "title", [m.study.title for m in machines], name=True),
        Column("source", "file", [m.study.source for m in machines], name=True),
        Column("governing_life.life_h", f"machine {symbol}",
               [m.governing.life_h for m in machines], "h", hours,
               legend="every bearing of every wheel end in series"),
        Column("governing_life.ratio", "ratio",
               [m.governing.life_h / reference if 0 < reference < float("inf") else None
                for m in machines], "", lambda v: "-" if v is None else f"{v:.3g}",
               legend="the machine's governing life over #1's"),
        *(Column(f"wheel_ends.{name}.life_h", f"{name} {symbol}",
                 [wheel_end_life(m, name) for m in machines], "h",
                 lambda v: "-" if v is None else hours(v)) for name in names),
        Column("weakest", "weakest wheel end", [m.weakest.name for m in machines], name=True),
        Column("lowest_static_safety", "lowest s0",
               [min(w.result.lowest_static_safety for w in m.wheel_ends) for m in machines],
               "", safety),
        Column("verdict", "verdict", ["no target" if m.verdict is None else
                                      "PASS" if m.verdict.passed else "FAIL" for m in machines],
               name=True),
    ]
    return TableSpec("machines", "Machines side by side", tuple(columns))
