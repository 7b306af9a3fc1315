"""The tables of ``hubload machine``: the wheel ends and each wheel end's derived spectrum.

Shared by the terminal and the HTML report.
"""

from __future__ import annotations

from hubload.engine.findings import STATIC_SAFETY_WARNING
from hubload.engine.machine import MachineResult, WheelEndResult
from hubload.report.columns import Column, TableSpec, cut_to_cases
from hubload.report.numbers import fixed, hours, percent, safety
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
               hours, legend="governing life of the wheel end's bearing pair"),
        Column("lowest_static_safety", "s0", [w.result.lowest_static_safety for w in wheels],
               "", safety, legend="lower static safety of the pair (ISO 76)",
               alert=lambda value: value < STATIC_SAFETY_WARNING),
        Column("lowest_shaft_safety", "shaft", [None if s is None else float(s) for s in shaft],
               "", lambda v: "-" if v is None else safety(v),
               legend="lowest fatigue safety of the shaft's sections"),
        Column("dominant_case", "dominant operation", [dominant_name(w) for w in wheels],
               name=True),
        Column("dominant_share", "dmg", [dominant_share(w) for w in wheels], "%", percent,
               legend="the dominant operation's share of the pair's damage"),
    ]
    return TableSpec("wheel_ends", "Wheel ends", tuple(columns))


def cases_table(wheel: WheelEndResult, limit: int | None) -> TableSpec:
    """The derived spectrum, cut to the ``limit`` most damaging cases (None: every case)."""
    cases = wheel.result.study.cases
    columns = [
        Column("case_index", "#", list(range(len(cases)))),
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
    governing = wheel.result.governing
    spec = TableSpec("cases", f"Derived spectrum of the {wheel.name} wheel", tuple(columns),
                     keep_first=2)
    return cut_to_cases(spec, governing.system_damage_share, governing.symbol, limit)


def optional_hours(value) -> str:
    return "-" if value is None else hours(value)


def wheel_end_lives_table(machine: MachineResult) -> TableSpec:
    """Each wheel end's system and bearing lives and static safeties (the sheets' detail)."""
    wheels = machine.wheel_ends

    def modified(wheel: WheelEndResult, label: str | None):
        found = wheel.result.modified
        if found is None:
            return None
        return float(found.system_life_h if label is None else found.bearings[label].life_h)

    columns = [
        Column("name", "wheel end", [w.name for w in wheels], name=True),
        Column("system.l10_h", "L10 pair", [float(w.result.system_life_h) for w in wheels],
               "h", hours, legend="basic system life of the pair"),
        Column("system.l10m_h", "L10m pair", [modified(w, None) for w in wheels], "h",
               optional_hours, legend="modified system life of the pair (with [lubrication])"),
    ]
    for label in wheels[0].result.bearings:
        columns += [
            Column(f"bearings.{label}.l10_h", f"L10 {label}",
                   [float(w.result.bearings[label].life_h) for w in wheels], "h", hours),
            Column(f"bearings.{label}.l10m_h", f"L10m {label}",
                   [modified(w, label) for w in wheels], "h", optional_hours),
            Column(f"bearings.{label}.s0", f"s0 {label}",
                   [float(w.result.bearings[label].static_safety) for w in wheels], "", safety),
        ]
    return TableSpec("wheel_end_lives", "Lives of the wheel ends", tuple(columns))


def machine_table(machine: MachineResult) -> TableSpec:
    """The machine's lives as a series system of its wheel ends, and its verdict."""
    governing = machine.governing
    verdict = machine.verdict
    overall = machine.overall
    columns = [
        Column("l10_h", "L10", [machine.l10_h], "h", hours,
               legend="basic life of every bearing of every wheel end in series"),
        Column("l10m_h", "L10m", [machine.l10m_h], "h", optional_hours,
               legend="modified life likewise (every wheel end with [lubrication])"),
        Column("governing_life.symbol", "governing", [governing.symbol], name=True),
        Column("governing_life.life_h", "life", [governing.life_h], "h", hours,
               legend=f"governing life: {governing.basis}"),
        Column("weakest", "weakest wheel end", [machine.weakest.name], name=True),
        Column("target_life_h", "target", [machine.study.target_life_h], "h", optional_hours),
        Column("verdict", "verdict", ["-" if verdict is None else
                                      "PASS" if verdict.passed else "FAIL"], name=True,
               legend="the machine's governing life against the target"),
        Column("overall_verdict", "overall", ["-" if overall is None else
                                              "PASS" if overall.passed else "FAIL"], name=True,
               legend="bearings and every wheel end's shaft checks"),
    ]
    return TableSpec("machine", "The machine", tuple(columns))
