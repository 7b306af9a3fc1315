"""``hubload machine`` on the terminal: the wheel ends, the machine's life, the verdict.

The wheel-end table and (with ``--cases``) each wheel end's derived spectrum are
table specs rendered by :mod:`hubload.report.terminal.tables`, so they fit the
terminal without cutting a number.
"""

from __future__ import annotations

from rich.console import Console
from rich.text import Text

from hubload.engine.governing import symbol_of
from hubload.engine.machine import MachineResult, WheelEndResult
from hubload.report.cautions import CAUTIONS
from hubload.report.columns import Column, TableSpec
from hubload.report.numbers import fixed, hours, hours_with_unit, percent, safety, share
from hubload.report.messages import summary_lines
from hubload.report.specs.shaft import item_limit, item_value
from hubload.report.terminal.tables import plain, render
from hubload.units import KN


def dominant_name(wheel: WheelEndResult) -> str:
    index = wheel.result.dominant_case
    return "none" if index is None else wheel.result.study.cases.names[index]


def dominant_share(wheel: WheelEndResult) -> float:
    index = wheel.result.dominant_case
    return 0.0 if index is None else float(wheel.result.governing.system_damage_share[index])


def wheel_end_table(machine: MachineResult) -> TableSpec:
    wheels = machine.wheel_ends
    symbol = machine.governing.symbol
    shaft = [w.result.lowest_shaft_safety for w in wheels]
    columns = [
        Column("name", "wheel end", [w.name for w in wheels], name=True),
        Column("governing_life.life_h", symbol, [w.governing_life_h for w in wheels], "h",
               hours, legend=f"governing life of the wheel end's bearing pair"),
        Column("lowest_static_safety", "s0", [w.result.lowest_static_safety for w in wheels],
               "", safety, legend="lower static safety of the pair (ISO 76)",
               alert=lambda value: value < 2.0),
        Column("lowest_shaft_safety", "shaft", [None if s is None else float(s) for s in shaft],
               "", lambda v: "-" if v is None else safety(v),
               legend="lowest fatigue safety of the shaft's sections"),
        Column("dominant_case", "dominant operation", [dominant_name(w) for w in wheels],
               name=True),
        Column("dominant_share", "dmg", [dominant_share(w) for w in wheels], "%", percent,
               legend="the dominant operation's share of the pair's damage"),
    ]
    return TableSpec("wheel_ends", "Wheel ends", tuple(columns))


def cases_table(wheel: WheelEndResult) -> TableSpec:
    cases = wheel.result.study.cases
    columns = [
        Column("name", "case", list(cases.names), name=True),
        Column("time_fraction", "time", list(cases.time_fraction), "%", percent),
        Column("wheel_load_kN", "W", list(cases.wheel_load_n / KN), "kN", fixed(2),
               legend="wheel load"),
        Column("side_force_kN", "S", list(cases.side_force_n / KN), "kN", fixed(2),
               legend="side force, + inboard"),
        Column("tractive_force_kN", "F", list(cases.tractive_force_n / KN), "kN", fixed(2),
               legend="tractive force after the adhesion cap"),
        Column("speed_rpm", "n", list(cases.speed_rpm), "r/min", fixed(1),
               legend="wheel speed"),
        Column("governing_damage_share", "dmg",
               list(wheel.result.governing.system_damage_share), "%", percent,
               legend="share of the pair's damage"),
    ]
    return TableSpec("cases", f"Derived spectrum of the {wheel.name} wheel", tuple(columns))


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


def warning_lines(machine: MachineResult) -> list[Text]:
    """Each wheel end's warnings; one line for the wheel ends that share its words."""
    wheels_of: dict[str, list[str]] = {}
    for wheel in machine.wheel_ends:
        for line in summary_lines(wheel.result.findings, wheel.result.study.cases.names):
            wheels_of.setdefault(line, []).append(wheel.name)
    return [Text.assemble(("Warning", "yellow"), f" ({', '.join(wheels)}): {plain(line)}")
            for line, wheels in wheels_of.items()]


def render_machine(machine: MachineResult, console: Console, show_cases: bool = False) -> None:
    study = machine.study
    console.print(Text.assemble((plain(study.title), "bold"), f"  ({plain(study.source)})"))
    mirrored = int(study.case_mirrored.sum())
    console.print(Text(f"{len(study.operation_names)} operations, {len(study.case_names)} "
                       f"cases per wheel end ({mirrored} mirrored halves: turns and slopes "
                       f"both ways)."))
    if show_cases:
        for wheel in machine.wheel_ends:
            render(cases_table(wheel), console)
    render(wheel_end_table(machine), console)
    for line in machine_lines(machine) + verdict_lines(machine) + warning_lines(machine):
        console.print(line)
    console.print(Text(f"Caution: {CAUTIONS}", style="dim"))
