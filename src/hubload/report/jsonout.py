"""Machine-readable results (the JSON contract of docs/json-output.md).

Infinite lives (and undefined values) are written as null.
"""

from __future__ import annotations

import json

import numpy as np

from hubload.engine import Result, verdict
from hubload.report import shaft_json
from hubload.report.cautions import CAUTIONS
from hubload.report.modified_json import add_modified_life
from hubload.report.numbers import json_number, json_numbers, json_rows
from hubload.report.operating import case_entries as case_entries_of
from hubload.report.refined_json import add_refined
from hubload.units import KN



def case_entries(result: Result) -> list[dict]:
    cases = result.study.cases
    count = len(cases)
    bearings = {label: json_rows({
        "fr_kN": bearing.radial_n / KN, "fa_kN": bearing.axial_n / KN,
        "p_kN": bearing.equivalent_n / KN, "p0_kN": bearing.static_equivalent_n / KN,
        "l10_h": bearing.case_life_h, "damage_share": bearing.damage_share}, count)
        for label, bearing in result.bearings.items()}
    spectrum = json_rows({"time_fraction": cases.time_fraction, "speed_rpm": cases.speed_rpm},
                         count)
    system_share = json_numbers(result.system_damage_share)
    return [{"name": name, **spectrum[index],
             "bearings": {label: rows[index] for label, rows in bearings.items()},
             "system_damage_share": system_share[index], **operating}
            for index, (name, operating) in enumerate(zip(cases.names, case_entries_of(cases),
                                                          strict=True))]


def bearing_summaries(result: Result) -> dict:
    pair = result.study.pair.bearings()
    return {label: {
        "name": pair[label].label,
        "l10_h": json_number(bearing.life_h),
        "l10_km": json_number(bearing.life_km),
        "s0": json_number(bearing.static_safety),
    } for label, bearing in result.bearings.items()}


def result_document(result: Result) -> dict:
    """The whole result as plain JSON-ready data."""
    study = result.study
    found = verdict(result)
    dominant = result.dominant_case
    document = add_refined(add_modified_life({
        "title": study.title,
        "source": study.source,
        "method": "iso281",
        "cases": case_entries(result),
        "bearings": bearing_summaries(result),
        "system": {"l10_h": json_number(result.system_life_h),
                   "l10_km": json_number(result.system_life_km)},
        "mean_speed_rpm": json_number(result.mean_speed_rpm),
        "dominant_case": {"index": dominant, "name": study.cases.names[dominant]}
        if np.any(result.system_damage_share > 0) else None,
        "verdict": None if found is None else {
            "life": found.life_name, "life_h": json_number(found.life_h),
            "target_h": found.target_h, "passed": found.passed, "basis": found.basis},
        "warnings": list(result.warnings),
        "cautions": CAUTIONS,
    }, result), result)
    shaft_json.extend_document(document, result)
    return document


def to_json(result: Result) -> str:
    return json.dumps(result_document(result), indent=2)
