"""The modified-life keys of the JSON output (docs/json-output.md; a contract).

Without [lubrication] only ``a1``, ``reliability_percent`` and ``lubrication: null``
are written: a missing modified life must not read as an infinite one (null).
"""

from __future__ import annotations

import numpy as np

from hubload.engine import Result
from hubload.engine.governing import symbol_of
from hubload.report.numbers import json_number, json_rows
from hubload.units import CELSIUS_ZERO_K, CST, KN, MM



def add_modified_life(document: dict, result: Result) -> dict:
    """``document`` (the result_document) with the modified-life keys added in place."""
    document["reliability_percent"] = result.study.reliability_percent
    document["a1"] = json_number(result.a1)
    modified = result.modified
    if modified is None:
        document["lubrication"] = None
        return document
    document["lubrication"] = lubrication_entry(result)
    cases = document.get("cases", [])   # a sweep point's document has no cases
    per_case = [] if not cases else json_rows({
        "temperature_C": result.study.lubrication.temperature_k - CELSIUS_ZERO_K,
        "viscosity_cSt": modified.viscosity_m2_s / CST,
        "system_damage_share_modified": modified.system_damage_share}, len(cases))
    per_bearing = {} if not cases else {label: json_rows({
        "nu1_cSt": bearing.reference_viscosity_m2_s / CST, "kappa": bearing.kappa,
        "kappa_outside_scope": np.asarray(bearing.kappa_outside_scope, dtype=bool),
        "e_c": bearing.e_c, "a_iso": bearing.a_iso, "l10m_h": bearing.case_life_h,
        "damage_share_modified": bearing.damage_share}, len(cases))
        for label, bearing in modified.bearings.items()}
    for index, case in enumerate(cases):
        case.update(per_case[index])
        for label, rows in per_bearing.items():
            case["bearings"][label].update(rows[index])
    pair = result.study.pair.bearings()
    for label, bearing in modified.bearings.items():
        document["bearings"][label].update({
            "l10m_h": json_number(bearing.life_h), "l10m_km": json_number(bearing.life_km),
            "mean_diameter_mm": json_number(pair[label].mean_diameter_m / MM),
            "cu_kN": json_number(bearing.fatigue_limit_n / KN),
            "cu_estimated": bearing.fatigue_limit_estimated,
        })
    document["system"].update({"l10m_h": json_number(modified.system_life_h),
                               "l10m_km": json_number(modified.system_life_km)})
    dominant = int(np.argmax(modified.system_damage_share))
    document["dominant_case_modified"] = (
        {"index": dominant, "name": result.study.cases.names[dominant]}
        if modified.system_damage_share[dominant] > 0 else None)
    return document


def lubrication_entry(result: Result) -> dict:
    lubrication, modified = result.study.lubrication, result.modified
    return {
        "method": lubrication.method,
        "cleanliness": lubrication.cleanliness,
        "contamination_row": modified.contamination.label,
        "contamination_note": modified.contamination_note,
        "viscosity_40C_cSt": json_number(lubrication.viscosity_40c_m2_s / CST),
        "viscosity_100C_cSt": json_number(lubrication.viscosity_100c_m2_s / CST),
        "life_symbol": symbol_of(result.method, float(result.study.reliability_percent), True),
    }
