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
