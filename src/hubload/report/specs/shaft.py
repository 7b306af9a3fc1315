"""The shaft's tables and the checks table of ``hubload check`` (terminal and HTML)."""

from __future__ import annotations

import math

import numpy as np

from hubload.engine import Result
from hubload.engine.verdict import CheckItem
from hubload.report.columns import Column, TableSpec, cut_to_cases
from hubload.report.numbers import fixed, hours, hours_with_unit, safety
from hubload.units import KN, MM, MPA

CRITERION_NAMES = {"goodman": "DE-Goodman", "asme-elliptic": "DE-ASME elliptic"}


def below(required: float):
    return lambda value: value is not None and float(value) < required


def sections_table(result: Result) -> TableSpec:
    shaft, given = result.shaft, result.study.shaft.sections
    required = float(shaft.required_safety)
    sections = shaft.sections

    def case_index(value, index) -> int | None:
        return int(index) if np.isfinite(value) else None

    columns = (
        Column("name", "section", [s.name for s in sections], name=True),
        Column("position_mm", "x", [float(g.position_m) / MM for g in given], "mm", fixed(0)),
        Column("diameter_mm", "d", [float(g.diameter_m) / MM for g in given], "mm", fixed(0)),
        Column("kf_bending", "Kf", [float(s.kf_bending) for s in sections], "", fixed(2),
               legend="fatigue notch factor, bending"),
        Column("kf_torsion", "Kfs", [float(s.kf_torsion) for s in sections], "", fixed(2),
               legend="torsion"),
        Column("endurance_limit_MPa", "Se", [float(s.endurance_pa) / MPA for s in sections],
               "MPa", fixed(0), legend="endurance limit"),
        Column("min_safety", "n", [float(s.min_safety) for s in sections], "", safety,
               legend=f"lowest {CRITERION_NAMES[shaft.criterion]} fatigue safety",
               alert=below(required)),
        Column("min_safety_case", "#", [case_index(s.min_safety, s.min_safety_case)
                                        for s in sections],
               text=lambda index: "-" if index is None else str(index), legend="its case"),
        Column("yield_safety", "n yield", [float(s.yield_safety) for s in sections], "",
               safety, legend="first-cycle yield safety", alert=below(required)),
        Column("fatigue_life_h", "life", [float(s.fatigue_life_h) for s in sections], "h",
               hours, legend="S-N fatigue life of the spectrum"))
    notes = []
    endless = [f"'{s.name}'" for s in sections if np.isinf(s.fatigue_life_h)]
    if endless and np.any(result.study.cases.speed_rpm > 0):
        notes.append(f"Infinite fatigue life (every case stays below the endurance limit Se) "
                     f"in {', '.join(endless)}.")
    return TableSpec("shaft_sections", f"Shaft sections (required n >= {required:g}; Shigley, "
                                       f"10th ed.)", columns, notes=tuple(notes))


def utilisation_text(value) -> str:
    value = float(value)
    return "-" if math.isnan(value) else f"{100 * value:.0f}"


def cases_table(result: Result, limit: int | None) -> TableSpec:
    """Per case: fatigue safety of each section and the utilisation of the supplier's curve."""
    shaft, cases = result.shaft, result.study.cases
    required = float(shaft.required_safety)
    columns = [Column("case_index", "#", list(range(len(cases))))]
    columns += [Column(f"shaft.{s.name}.safety", s.name, list(s.safety), "", safety,
                       alert=below(required)) for s in shaft.sections]
    permissible = shaft.permissible
    notes = ["Fatigue safety of each section ('-': standstill)."]
    if permissible is not None:
        columns += [Column("radial_wheel_force_kN", "radial",
                           list(permissible.radial_wheel_force_n / KN), "kN", fixed(2),
                           legend="radial wheel force"),
                    Column("permissible_utilisation", "used", list(permissible.utilisation),
                           "%", utilisation_text, legend="utilisation of the supplier's curve", alert=lambda u: float(u) > 1.0)]
        if bool(permissible.inside):
            notes[0] += (f" Supplier's permissible radial load "
                         f"{float(permissible.permissible_n) / KN:.1f} kN at the wheel offset "
                         f"{float(permissible.position_m) / MM:g} mm.")
    spec = TableSpec("shaft_cases", "Shaft per case", tuple(columns), notes=tuple(notes))
    governing = result.governing
    return cut_to_cases(spec, governing.system_damage_share, governing.symbol, limit)


def item_value(item: CheckItem) -> str:
    value = float(item.value)
    if math.isnan(value):
        return "not assessed"
    if item.at_most:
        return f"{100 * value:.0f} %"
    return hours_with_unit(value) if item.unit == "h" else safety(value)


def item_limit(item: CheckItem) -> str:
    limit = float(item.limit)
    if item.at_most:
        return f"<= {100 * limit:.0f} %"
    return f">= {hours_with_unit(limit)}" if item.unit == "h" else f">= {limit:g}"


def checks_table(result: Result) -> TableSpec | None:
    """Every item with a limit: bearings, shaft sections, supplier's curve."""
    found = result.overall
    if found is None:
        return None
    items = found.items
    return TableSpec("checks", "Checks", (
        Column("item", "item", [item.name for item in items], name=True),
        Column("value", "value", [item_value(item) for item in items]),
        Column("limit", "limit", [item_limit(item) for item in items]),
        Column("load_margin", "margin", [margin_text(item) for item in items],
               legend="factor on the loads until the limit is reached"),
        Column("result", "result", ["pass" if item.passed else "FAIL" for item in items],
               alert=lambda text: text == "FAIL")))


def margin_text(item: CheckItem) -> str:
    """The load margin; an item not assessed has none."""
    margin = float(item.margin)
    return "-" if math.isnan(margin) else safety(margin)


def item_number(item: CheckItem) -> tuple[float, float, str]:
    """Value, limit and unit of an item as numbers: a utilisation in %."""
    scale, unit = (100.0, "%") if item.at_most else (1.0, item.unit)
    return scale * float(item.value), scale * float(item.limit), unit


def check_items_table(result: Result) -> TableSpec | None:
    """The items of :func:`checks_table` with numbers as numbers (for spreadsheets)."""
    found = result.overall
    if found is None:
        return None
    items = found.items
    numbers = [item_number(item) for item in items]
    return TableSpec("check_items", "Checks: every item with a limit", (
        Column("item", "item", [item.name for item in items], name=True),
        Column("kind", "kind", [item.kind for item in items], name=True),
        Column("value", "value", [value for value, _, _ in numbers], text=safety),
        Column("relation", "must be", ["<=" if item.at_most else ">=" for item in items]),
        Column("limit", "limit", [limit for _, limit, _ in numbers], text=safety),
        Column("unit", "unit", [unit for _, _, unit in numbers]),
        Column("load_margin", "margin", [float(item.margin) for item in items], text=safety,
               legend="factor on the loads until the limit is reached"),
        Column("result", "result", ["pass" if item.passed else "FAIL" for item in items])),
        notes=(f"Overall: {'PASS' if found.passed else 'FAIL'}; worst item: {found.worst.name}.",
               "A value or margin left empty: not assessed."))
