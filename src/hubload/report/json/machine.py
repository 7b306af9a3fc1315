"""The JSON document of ``hubload machine --json`` (the contract of docs/json-output.md).

Each wheel end carries the shapes of ``hubload check --json`` (``governing_life``,
``verdict``, ``overall_verdict``) for its own spectrum; the machine's governing life
and verdict take the same shapes. Built from the typed result; nothing computes on it.
"""

from __future__ import annotations


from hubload.engine.machine import MachineResult, WheelEndResult
from hubload.report.cautions import CAUTIONS
from hubload.report.json.check import governing_entry, verdict_entry
from hubload.report.json.shaft import overall_summary
from hubload.report.messages import warning_texts
from hubload.report.numbers import json_number, json_numbers, json_rows
from hubload.units import KN
from hubload.report.json.text import document_text


def bearing_entries(wheel: WheelEndResult) -> dict:
    result = wheel.result
    modified = result.modified
    pair = result.study.pair.bearings()
    return {label: {"name": pair[label].label, "l10_h": json_number(bearing.life_h),
                    "l10m_h": None if modified is None
                    else json_number(modified.bearings[label].life_h),
                    "s0": json_number(bearing.static_safety)}
            for label, bearing in result.bearings.items()}


def case_entries(wheel: WheelEndResult, machine: MachineResult) -> list[dict]:
    cases = wheel.result.study.cases
    study = machine.study
    rows = json_rows({"time_fraction": cases.time_fraction,
                      "wheel_load_kN": cases.wheel_load_n / KN,
                      "side_force_kN": cases.side_force_n / KN,
                      "tractive_force_kN": cases.tractive_force_n / KN,
                      "speed_rpm": cases.speed_rpm,
                      "governing_damage_share": wheel.result.governing.system_damage_share},
                     len(cases))
    return [{"name": name, "operation": study.operation_names[int(operation)],
             "mirrored": bool(mirrored), **row}
            for name, operation, mirrored, row in zip(
                cases.names, study.case_operation, study.case_mirrored, rows, strict=True)]


def wheel_end_entry(wheel: WheelEndResult, machine: MachineResult) -> dict:
    result = wheel.result
    modified = result.modified
    shaft = result.lowest_shaft_safety
    return {
        "name": wheel.name, "axle": wheel.wheel_end.axle, "position": wheel.wheel_end.position,
        "side": wheel.wheel_end.side, "wheel_end_file": wheel.wheel_end.wheel_end_file,
        "method": result.method,
        "governing_life": governing_entry(result),
        "system": {"l10_h": json_number(result.system_life_h),
                   "l10m_h": None if modified is None
                   else json_number(modified.system_life_h)},
        "bearings": bearing_entries(wheel),
        "lowest_static_safety": json_number(result.lowest_static_safety),
        "lowest_shaft_safety": None if shaft is None else json_number(shaft),
        "verdict": verdict_entry(result),
        "overall_verdict": overall_summary(result.overall),
        "cases": case_entries(wheel, machine),
        "warnings": warning_texts(result.findings, result.study.cases.names),
    }


def governing_document(machine: MachineResult) -> dict:
    governing = machine.governing
    dominant = governing.dominant_case
    weakest = machine.weakest
    first = machine.wheel_ends[0].result.governing
    return {
        "symbol": governing.symbol, "life_h": json_number(governing.life_h),
        "life_km": json_number(governing.life_km),
        "method": "/".join(sorted({w.result.governing.method for w in machine.wheel_ends})),
        "basis": governing.basis, "reliability_percent": first.choice.reliability,
        "verdict_basis": first.rule,
        "wheel_ends": {w.name: {"life_h": json_number(life)}
                       for w, life in zip(machine.wheel_ends, governing.wheel_end_life_h)},
        "weakest_wheel_end": {"index": governing.weakest, "name": weakest.name},
        "dominant_case": None if dominant is None else {
            "index": dominant, "name": machine.study.case_names[dominant],
            "operation": machine.study.operation_names[int(
                machine.study.case_operation[dominant])]},
        "case_damage_share": json_numbers(governing.case_damage_share),
    }


def verdict_document(machine: MachineResult) -> dict | None:
    found = machine.verdict
    if found is None:
        return None
    return {"life": found.life_name, "life_h": json_number(found.life_h),
            "target_h": found.target_h, "passed": bool(found.passed), "basis": found.basis}


def machine_document(machine: MachineResult) -> dict:
    study = machine.study
    return {
        "title": study.title,
        "source": study.source,
        "operations": [{"name": name, "cases": [study.case_names[j]
                                                for j in range(len(study.case_names))
                                                if study.case_operation[j] == k]}
                       for k, name in enumerate(study.operation_names)],
        "wheel_ends": [wheel_end_entry(wheel, machine) for wheel in machine.wheel_ends],
        "machine": {"l10_h": json_number(machine.l10_h),
                    "l10m_h": None if machine.l10m_h is None
                    else json_number(machine.l10m_h)},
        "governing_life": governing_document(machine),
        "verdict": verdict_document(machine),
        "overall_verdict": overall_summary(machine.overall),
        "cautions": CAUTIONS,
    }


def to_json(machine: MachineResult) -> str:
    return document_text(machine_document(machine))
