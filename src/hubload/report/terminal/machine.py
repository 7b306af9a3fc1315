"""``hubload machine`` on the terminal: the wheel ends, the machine's life, the verdict.

The wheel-end table and (with ``--cases``) each wheel end's derived spectrum are
the table specs of :mod:`hubload.report.specs.machine` rendered by
:mod:`hubload.report.terminal.tables`, so they fit the terminal without cutting a number.
"""

from __future__ import annotations

from rich.console import Console
from rich.text import Text

from hubload.engine.governing import symbol_of
from hubload.engine.machine import MachineResult
from hubload.report.cautions import CAUTIONS
from hubload.report.columns import CASE_ROWS_SHOWN
from hubload.report.numbers import hours, hours_with_unit, share
from hubload.report.messages import summary_lines, warning_texts
from hubload.report.specs.machine import cases_table, wheel_end_table
from hubload.report.specs.shaft import item_limit, item_value
from hubload.report.terminal.tables import render
from hubload.report.usertext import plain


def machine_lines(machine: MachineResult) -> list[Text]:
    governing = machine.governing
    method = machine.wheel_ends[0].result.method
    basic = symbol_of(method, 90.0, False)
    modified = symbol_of(method, float(machine.study.reliability_percent), True)
    l10m = "" if machine.l10m_h is None else f", {modified} = {hours_with_unit(machine.l10m_h)}"
    weakest = machine.weakest
    lines = [Text(f"Machine: {basic} = {hours_with_unit(machine.l10_h)}{l10m}; governing "
                  f"{governing.symbol} = {hours_with_unit(governing.life_h)} "
                  f"({hours(governing.life_km)} km) as a {governing.basis}.")]
    lines.append(Text(f"Weakest wheel end: {weakest.name} ({governing.symbol} = "
                      f"{hours_with_unit(weakest.governing_life_h)})."))
    dominant = governing.dominant_case
    if dominant is not None:
        lines.append(Text(f"Dominant case of the machine: "
                          f"'{plain(machine.study.case_names[dominant])}' "
                          f"({share(governing.case_damage_share[dominant])} of its damage)."))
    return lines


def verdict_lines(machine: MachineResult) -> list[Text]:
    found = machine.verdict
    lines = []
    if found is None:
        lines.append(Text("No target life given ([project] target_life_h): no verdict."))
    else:
        word, style, relation = ("PASS", "bold green", ">=") if found.passed else \
            ("FAIL", "bold red", "<")
        lines.append(Text.assemble((word, style), f": machine {found.life_name} = "
                                   f"{hours_with_unit(found.life_h)} {relation} target "
                                   f"{hours_with_unit(found.target_h)}"))
    overall = machine.overall
    if overall is not None and len(overall.items) > 1:
        worst = overall.worst
        verdict = ("PASS", "bold green") if overall.passed else ("FAIL", "bold red")
        lines.append(Text.assemble("Overall verdict (bearings and shafts): ", verdict,
                                   f"; worst item: {plain(worst.name)} = {item_value(worst)} "
                                   f"(limit {item_limit(worst)})."))
    return lines


def warning_lines(machine: MachineResult, show_all: bool = False) -> list[Text]:
    """Each wheel end's warnings (summarised unless ``show_all``); one line for the wheel
    ends that share its words."""
    wheels_of: dict[str, list[str]] = {}
    words = warning_texts if show_all else summary_lines
    for wheel in machine.wheel_ends:
        for line in words(wheel.result.findings, wheel.result.study.cases.names):
            wheels_of.setdefault(line, []).append(wheel.name)
    return [Text.assemble(("Warning", "yellow"), f" ({', '.join(wheels)}): {plain(line)}")
            for line, wheels in wheels_of.items()]


def counted(number: int, one: str, many: str | None = None) -> str:
    return f"{number} {one if number == 1 else many or one + 's'}"


def render_machine(machine: MachineResult, console: Console, show_cases: bool = False,
                   show_all: bool = False) -> None:
    """The wheel ends, the machine's life, the verdict; ``show_cases`` each wheel end's
    derived spectrum (its most damaging cases unless ``show_all``)."""
    study = machine.study
    console.print(Text.assemble((plain(study.title), "bold"), f"  ({plain(study.source)})"))
    mirrored = int(study.case_mirrored.sum())
    halves = (f" ({counted(mirrored, 'mirrored half', 'mirrored halves')}: turns and slopes "
              f"both ways)" if mirrored else "")
    console.print(Text(f"{counted(len(study.operation_names), 'operation')}, "
                       f"{counted(len(study.case_names), 'case')} per wheel end{halves}."))
    if show_cases:
        for wheel in machine.wheel_ends:
            render(cases_table(wheel, None if show_all else CASE_ROWS_SHOWN), console)
    render(wheel_end_table(machine), console)
    for line in machine_lines(machine) + verdict_lines(machine) + warning_lines(machine,
                                                                                 show_all):
        console.print(line)
    console.print(Text(f"Caution: {CAUTIONS}", style="dim"))
