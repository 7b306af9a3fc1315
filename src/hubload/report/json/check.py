"""The JSON document of ``hubload check --json`` (the contract of docs/json-output.md).

Built from the typed result, only when JSON is asked for; nothing computes on it.
Infinite lives (and undefined values) are written as null.
"""

from __future__ import annotations


import numpy as np

from hubload.engine import MethodLives, Result
from hubload.engine.governing import GoverningLife, LifeCandidate
from hubload.report.cautions import CAUTIONS
from hubload.report.json import assembly, modified, refined, shaft
from hubload.report.json.operating import case_entries as operating_entries
from hubload.report.messages import warning_texts
from hubload.report.json.text import document_text
from hubload.report.numbers import json_number, json_numbers, json_rows
from hubload.units import KN


def case_entries(result: Result) -> list[dict]:
    cases = result.study.cases
    count = len(cases)
    governing = result.governing
    bearings = {label: json_rows({
        "fr_kN": bearing.radial_n / KN, "fa_kN": bearing.axial_n / KN,
        "p_kN": bearing.equivalent_n / KN, "p0_kN": bearing.static_equivalent_n / KN,
        "l10_h": bearing.case_life_h, "damage_share": bearing.damage_share,
        "governing_damage_share": governing.bearing_damage_share(label)}, count)
        for label, bearing in result.bearings.items()}
    spectrum = json_rows({"time_fraction": cases.time_fraction, "speed_rpm": cases.speed_rpm},
                         count)
    system_share = json_numbers(result.system_damage_share)
    governing_share = json_numbers(governing.system_damage_share)
    return [{"name": name, **spectrum[index],
             "bearings": {label: rows[index] for label, rows in bearings.items()},
             "system_damage_share": system_share[index],
             "governing_damage_share": governing_share[index], **operating}
            for index, (name, operating) in enumerate(zip(
                cases.names, operating_entries(result.study, result.findings), strict=True))]


def bearing_summaries(result: Result) -> dict:
    pair = result.study.pair.bearings()
    return {label: {
        "name": pair[label].label,
        "l10_h": json_number(bearing.life_h),
        "l10_km": json_number(bearing.life_km),
        "s0": json_number(bearing.static_safety),
    } for label, bearing in result.bearings.items()}


def candidate_entry(candidate: LifeCandidate) -> dict:
    return {"symbol": candidate.symbol, "life_h": json_number(candidate.system_life_h),
            "life_km": json_number(candidate.system_life_km), "method": candidate.method,
            "basis": candidate.basis}


def governing_entry(result: Result) -> dict:
    """``governing_life``: the one life every output judges, with its basis."""
    governing: GoverningLife = result.governing
    dominant = governing.dominant_case
    other = governing.other()
    return {
        **candidate_entry(governing.choice),
        "reliability_percent": governing.choice.reliability,
        "verdict_basis": governing.rule,
        "bearings": {label: {"life_h": json_number(governing.bearing_life_h(label))}
                     for label in result.bearings},
        "dominant_case": None if dominant is None else {
            "index": dominant, "name": result.study.cases.names[dominant]},
        "alternative": None if other is None else candidate_entry(other),
    }


def iso281_entry(result: Result) -> dict | None:
    """With the refined method: the ISO 281 rule's lives beside it (the core contract's keys)."""
    lives: MethodLives | None = result.iso281
    if lives is None:
        return None
    pair = result.study.pair.bearings()
    bearings = {label: {"name": pair[label].label, "l10_h": json_number(b.life_h),
                        "l10_km": json_number(b.life_km), "s0": json_number(b.static_safety)}
                for label, b in lives.bearings.items()}
    system = {"l10_h": json_number(lives.system_life_h),
              "l10_km": json_number(lives.system_life_km)}
    if lives.modified is not None:
        for label, b in lives.modified.bearings.items():
            bearings[label].update({"l10m_h": json_number(b.life_h),
                                    "l10m_km": json_number(b.life_km)})
        system.update({"l10m_h": json_number(lives.modified.system_life_h),
                       "l10m_km": json_number(lives.modified.system_life_km)})
    return {"system": system, "bearings": bearings}


def verdict_entry(result: Result) -> dict | None:
    found = result.verdict
    if found is None:
        return None
    return {"life": found.life_name, "life_h": json_number(found.life_h),
            "target_h": found.target_h, "passed": bool(found.passed), "basis": found.basis}


def finding_entries(result: Result) -> list[dict]:
    """``warning_records``: every finding with its kind, case, subject and values (SI)."""
    names = result.study.cases.names
    return [{"kind": f.kind, "case": None if f.case is None else names[f.case],
             "case_index": f.case, "subject": f.subject,
             "values": {key: json_number(value) if isinstance(value, float) else value
                        for key, value in f.values.items()}}
            for f in result.findings]


def result_document(result: Result, per_case: bool = True) -> dict:
    """The whole result as plain JSON-ready data (``per_case`` False: without ``cases``, as a
    sweep point carries it)."""
    study = result.study
    dominant = int(np.argmax(result.system_damage_share))
    document = {
        "title": study.title,
        "source": study.source,
        "method": result.method,
        "governing_life": governing_entry(result),
        **({"cases": case_entries(result)} if per_case else {}),
        "bearings": bearing_summaries(result),
        "system": {"l10_h": json_number(result.system_life_h),
                   "l10_km": json_number(result.system_life_km)},
        "mean_speed_rpm": json_number(result.mean_speed_rpm),
        "dominant_case": {"index": dominant, "name": study.cases.names[dominant]}
        if np.any(result.system_damage_share > 0) else None,
        "verdict": verdict_entry(result),
        "warnings": warning_texts(result.findings, study.cases.names),
        "warning_records": finding_entries(result),
        "cautions": CAUTIONS,
    }
    modified.add_modified_life(document, result)
    refined.add_refined(document, result)
    document["iso281"] = iso281_entry(result)
    assembly.add_setting(document, result)
    assembly.add_friction(document, result)
    shaft.extend_document(document, result)
    return document


def to_json(result: Result) -> str:
    return document_text(result_document(result))
