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
from hubload.report.numbers import json_number
from hubload.report.operating import case_entry
from hubload.report.refined_json import add_refined

KN = 1e3


def case_entries(result: Result) -> list[dict]:
    cases = result.study.cases
    entries = []
    for index, name in enumerate(cases.names):
        bearings = {}
        for label, bearing in result.bearings.items():
            bearings[label] = {
                "fr_kN": json_number(bearing.radial_n[index] / KN),
                "fa_kN": json_number(bearing.axial_n[index] / KN),
                "p_kN": json_number(bearing.equivalent_n[index] / KN),
                "p0_kN": json_number(bearing.static_equivalent_n[index] / KN),
                "l10_h": json_number(bearing.case_life_h[index]),
                "damage_share": json_number(bearing.damage_share[index]),
            }
        entries.append({
            "name": name,
            "time_fraction": json_number(cases.time_fraction[index]),
            "speed_rpm": json_number(cases.speed_rpm[index]),
            "bearings": bearings,
            "system_damage_share": json_number(result.system_damage_share[index]),
            **case_entry(cases, index),
        })
    return entries


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
