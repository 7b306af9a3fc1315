"""JSON of the shaft check and the overall verdict (contract: docs/json-output.md).

Adds ``shaft``, ``overall_verdict`` and, per case, ``permissible_utilisation``
(ratio, 1 = 100 %) and the shaft's per-section values to the result document.
"""

from __future__ import annotations

import numpy as np

from hubload.engine import Result
from hubload.report.numbers import json_number, json_rows
from hubload.units import KN, MM, MPA



def case_name(result: Result, value, index) -> str | None:
    """The case's name where ``value`` is finite (a minimum over the cases), else None."""
    return result.study.cases.names[int(index)] if np.isfinite(value) else None


def section_summary(result: Result, given, section) -> dict:
    marin = section.marin
    return {
        "name": section.name,
        "position_mm": json_number(given.position_m / MM),
        "diameter_mm": json_number(given.diameter_m / MM),
        "kf_bending": json_number(section.kf_bending),
        "kf_torsion": json_number(section.kf_torsion),
        "marin": {key: json_number(value) for key, value in (
            ("ka", marin.surface), ("kb", marin.size), ("kc", marin.load),
            ("kd", marin.temperature), ("ke", marin.reliability))},
        "endurance_limit_MPa": json_number(section.endurance_pa / MPA),
        "min_safety": json_number(section.min_safety),
        "min_safety_case": case_name(result, section.min_safety, section.min_safety_case),
        "yield_safety": json_number(section.yield_safety),
        "yield_safety_case": case_name(result, section.yield_safety, section.yield_case),
        "fatigue_life_h": json_number(section.fatigue_life_h),
        "fatigue_life_km": json_number(section.fatigue_life_km),
        "infinite_life": bool(np.isinf(section.fatigue_life_h)),
    }


def permissible_summary(result: Result) -> dict | None:
    permissible = result.shaft.permissible
    if permissible is None:
        return None
    return {"load_position_mm": json_number(permissible.position_m / MM),
            "inside_curve": bool(permissible.inside),
            "permissible_radial_load_kN": json_number(permissible.permissible_n / KN)}


def shaft_summary(result: Result) -> dict | None:
    shaft = result.shaft
    if shaft is None:
        return None
    material = result.study.shaft
    return {
        "method": "Shigley's Mechanical Engineering Design, 10th ed.",
        "criterion": shaft.criterion,
        "required_safety": json_number(shaft.required_safety),
        "ultimate_strength_MPa": json_number(material.ultimate_pa / MPA),
        "yield_strength_MPa": json_number(material.yield_pa / MPA),
        "fatigue_strength_fraction": json_number(shaft.fatigue_strength_fraction),
        "sections": [section_summary(result, given, section)
                     for given, section in zip(material.sections, shaft.sections)],
        "permissible": permissible_summary(result),
    }


def case_sections(section, count: int) -> list[dict]:
    """One section's values per case."""
    return json_rows({
        "bending_Nm": section.loads.bending_nm, "torque_Nm": section.loads.torque_nm,
        "axial_kN": section.loads.axial_n / KN,
        "stress_amplitude_MPa": section.stresses.alternating_pa / MPA,
        "stress_mean_MPa": section.stresses.mean_pa / MPA, "safety": section.safety,
        "yield_safety": section.case_yield_safety, "life_h": section.case_life_h,
        "damage_share": section.damage_share}, count)


def extend_cases(document: dict, result: Result) -> None:
    cases = document.get("cases", [])   # a sweep point's document has no cases
    if not cases:
        return
    shaft = result.shaft
    permissible = None if shaft is None else shaft.permissible
    if permissible is None:
        for entry in cases:
            entry["permissible_utilisation"] = None
    else:
        rows = json_rows({
            "permissible_utilisation": permissible.utilisation,
            "radial_wheel_force_kN": permissible.radial_wheel_force_n / KN,
            "moment_equivalent_force_kN": permissible.moment_equivalent_force_n / KN,
            "permissible_utilisation_radial": permissible.utilisation_radial,
            "permissible_utilisation_moment": permissible.utilisation_moment}, len(cases))
        for entry, row, moment in zip(cases, rows, permissible.moment_governs.tolist()):
            entry.update(row, permissible_governs="moment" if moment else "radial force")
    if shaft is not None:
        sections = {section.name: case_sections(section, len(cases))
                    for section in shaft.sections}
        for index, entry in enumerate(cases):
            entry["shaft"] = {name: rows[index] for name, rows in sections.items()}


def verdict_summary(result: Result) -> dict | None:
    return overall_summary(result.overall)


def overall_summary(found) -> dict | None:
    """``overall_verdict`` of an OverallVerdict: every item, the worst, passed."""
    if found is None:
        return None
    items = [{"item": item.name, "value": json_number(item.value),
              "limit": json_number(item.limit),
              "load_margin": json_number(item.margin), "passed": bool(item.passed),
              "unit": item.unit, "at_most": item.at_most, "kind": item.kind}
             for item in found.items]
    return {"passed": bool(found.passed), "worst": items[int(found.worst_index)],
            "items": items}


def extend_document(document: dict, result: Result) -> None:
    """Add the shaft check and the overall verdict to a result document (in place)."""
    extend_cases(document, result)
    document["shaft"] = shaft_summary(result)
    document["overall_verdict"] = verdict_summary(result)
