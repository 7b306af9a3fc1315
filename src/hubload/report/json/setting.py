"""The JSON document of ``hubload setting --json``: lives against the axial setting."""

from __future__ import annotations


import numpy as np

from hubload.report.cautions import CAUTIONS
from hubload.report.messages import setting_warnings
from hubload.report.json.text import document_text
from hubload.report.numbers import json_number
from hubload.studies.setting import BEST_RANGE_SHARE, SettingSweep
from hubload.units import MPA, UM


def microns(metres) -> float | None:
    """A setting [m] in um, rounded to 1e-6 um: the m -> um round trip leaves last-digit noise."""
    return json_number(round(float(metres) / UM, 6))


def governing_entry(sweep: SettingSweep, index: int) -> dict:
    """The governing life at one setting, as ``check --json`` writes it (verdict basis)."""
    governing = sweep.result.governing
    chosen = governing.candidates[int(governing.chosen[index])]
    return {"symbol": chosen.symbol, "life_h": json_number(governing.life_h[index]),
            "basis": chosen.basis, "method": chosen.method,
            "reliability_percent": chosen.reliability, "verdict_basis": governing.rule}


def point_entry(sweep: SettingSweep, index: int) -> dict:
    result = sweep.result
    modified = result.modified
    bearings = {}
    for label, bearing in result.bearings.items():
        found = result.refined.bearings[label]
        bearings[label] = {
            "l10_h": json_number(bearing.life_h[index]),
            "min_load_zone_deg": json_number(np.degrees(np.min(found.load_zone_rad[index]))),
            "max_contact_pressure_MPa": json_number(
                np.max(found.max_contact_pressure_pa[index]) / MPA),
        }
        if modified is not None:
            bearings[label]["l10m_h"] = json_number(modified.bearings[label].life_h[index])
    system = {"l10_h": json_number(result.system_life_h[index])}
    if modified is not None:
        system["l10m_h"] = json_number(modified.system_life_h[index])
    return {"setting_um": microns(sweep.settings_m[index]), "system": system,
            "bearings": bearings, "equilibrium": not bool(sweep.unsolved[index]),
            "governing_life": governing_entry(sweep, index)}


def iso281_entry(sweep: SettingSweep) -> dict:
    """The ISO 281 rule's lives (the same at every setting: the rule assumes line-to-line)."""
    lives = sweep.result.iso281

    def first(value) -> float | None:   # shared by every setting, or repeated along them
        return json_number(np.asarray(value).flat[0])

    system = {"l10_h": first(lives.system_life_h)}
    bearings = {label: {"l10_h": first(b.life_h)} for label, b in lives.bearings.items()}
    if lives.modified is not None:
        system["l10m_h"] = first(lives.modified.system_life_h)
        for label, b in lives.modified.bearings.items():
            bearings[label]["l10m_h"] = first(b.life_h)
    return {"system": system, "bearings": bearings}


def sweep_document(sweep: SettingSweep) -> dict:
    best = sweep.best
    return {
        "title": sweep.study.title, "source": sweep.study.source, "method": "refined",
        "life": sweep.life_name, "target_life_h": sweep.study.target_life_h,
        "points": [point_entry(sweep, i) for i in range(len(sweep.settings_m))],
        "iso281": iso281_entry(sweep),
        "best": None if best is None else {
            "setting_um": microns(best.setting_m), "life_h": json_number(best.life_h),
            "range_um": [microns(best.low_m), microns(best.high_m)],
            "criterion": f"system {sweep.life_name} within {1 - BEST_RANGE_SHARE:.0%} of the "
                         f"best found"},
        "warnings": setting_warnings(sweep.settings_m[sweep.unsolved] / UM),
        "cautions": CAUTIONS,
    }


def to_json(sweep: SettingSweep) -> str:
    return document_text(sweep_document(sweep))
