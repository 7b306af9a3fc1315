"""``hubload machine FILE --table out.xlsx``: the machine's results as sheets, built from the
specs the terminal renders (report/specs/machine.py), every case, nothing cut.

Sheets: ``wheel_ends`` (one row per wheel end: governing life, the pair's and the bearings'
lives and s0, lowest shaft safety, dominant operation), ``cases`` (every wheel end's derived
cases, the wheel end as a column) and ``machine`` (its lives, governing life and verdict).
A machine sweep gives one sheet ``points`` (one row per point), a comparison of machines one
sheet ``machines`` (one row per machine).
"""

from __future__ import annotations

from dataclasses import replace

from hubload.engine.machine import MachineResult
from hubload.report.columns import Column, TableSpec
from hubload.report.specs.machine_compare import machines_table
from hubload.report.specs.machine_sweep import point_table
from hubload.report.specs.machine import (cases_table, machine_table, wheel_end_lives_table,
                                          wheel_end_table)
from hubload.report.spreadsheet.specsheet import merged, spec_sheet
from hubload.report.spreadsheet.workbook import Sheet

SHEETS = ("wheel_ends", "cases", "machine")
SWEEP_SHEETS = ("points",)
COMPARE_SHEETS = ("machines",)


def stacked(key: str, title: str, parts: list[tuple[str, TableSpec]]) -> TableSpec:
    """Tables of the same columns one below the other, each row named by its part."""
    first = parts[0][1]
    part = Column("wheel_end", "wheel end",
                  [name for name, spec in parts for _ in spec.columns[0].values], name=True)
    columns = [replace(column, values=[value for _, spec in parts
                                       for value in spec.columns[index].values])
               for index, column in enumerate(first.columns)]
    return TableSpec(key, title, (part, *columns), notes=first.notes)


def machine_sheets(machine: MachineResult) -> list[Sheet]:
    study = machine.study
    about = f"{study.title} ({study.source})"
    wheel_ends = merged("wheel_ends", f"Wheel ends of {about}",
                        [wheel_end_table(machine), wheel_end_lives_table(machine)])
    cases = stacked("cases", f"Derived cases of every wheel end of {about}",
                    [(wheel.name, cases_table(wheel, None)) for wheel in machine.wheel_ends])
    return [spec_sheet("wheel_ends", wheel_ends),
            spec_sheet("cases", cases, notes=("Each case is one operation (or its mirrored "
                                              "half) at that wheel end.",)),
            spec_sheet("machine", machine_table(machine), notes=(f"Machine: {about}.",))]


def machine_sweep_sheets(sweep) -> list[Sheet]:
    """``sweep``: studies.machine_sweep.MachineSweep."""
    return [spec_sheet("points", point_table(sweep),
                       notes=(f"Sweep of the machine {sweep.title} ({sweep.source}).",))]


def machine_compare_sheets(machines) -> list[Sheet]:
    """``machines``: engine.machine.MachineResult, one per machine file."""
    return [spec_sheet("machines", machines_table(machines))]
