"""JSON keys of the operating setting, its band and the bearings' friction (a contract,
docs/json-output.md): ``setting``, ``setting_band``, ``cases[].operating_setting_um``,
``cases[].setting_loss_um``, ``cases[].bearings.*.friction_torque_Nm`` and ``power_W``."""

from __future__ import annotations

import numpy as np

from hubload.engine import Result
from hubload.report.numbers import json_number, json_numbers, json_rows
from hubload.units import UM


def add_setting(document: dict, result: Result) -> None:
    """The setting of every case and, with a [pair.setting], how it came about (in place)."""
    setting = result.setting
    cases = document.get("cases", [])   # a sweep point's document has no cases
    for case, value in zip(cases, json_numbers(setting.operating_m / UM)):
        case["operating_setting_um"] = value
    if setting.assembly_m is None:
        document["setting"] = None
        document["setting_band"] = None
        return
    document["setting"] = {"assembly_um": json_number(setting.assembly_m / UM),
                           "tolerance_um": json_number(setting.tolerance_m / UM),
                           "basis": setting.basis}
    document["setting_band"] = band_entry(result)
    if not cases:
        return
    terms = setting.terms
    take_up = np.broadcast_to(terms.fit_take_up_m if setting.basis == "unmounted" else 0.0,
                              np.shape(setting.operating_m))
    rows = json_rows({"fit_take_up": take_up / UM, "radial_thermal": terms.radial_thermal_m / UM,
                      "fit_thermal": terms.fit_thermal_m / UM,
                      "axial_thermal": terms.axial_thermal_m / UM}, len(cases))
    for case, row in zip(cases, rows):
        case["setting_loss_um"] = row


def band_entry(result: Result) -> dict | None:
    """The band's ends and the refined lives there, on the governing basis (L10mr, L10r)."""
    setting = result.setting
    if result.band is None:
        return None
    refined = [c for c in result.governing.candidates if c.method == "refined"]
    by_end = {c.band_end: c for c in refined}
    assembly, tolerance = float(setting.assembly_m), float(setting.tolerance_m)
    return {"low_um": json_number((assembly - tolerance) / UM),
            "high_um": json_number((assembly + tolerance) / UM),
            "symbol": by_end[""].symbol,
            "system_low_h": json_number(by_end["low"].system_life_h),
            "system_mid_h": json_number(by_end[""].system_life_h),
            "system_high_h": json_number(by_end["high"].system_life_h)}


def add_friction(document: dict, result: Result) -> None:
    """Friction torque and power loss of each bearing per case, and the spectrum's means."""
    friction = result.friction
    if friction is None:
        document["friction"] = None
        return
    cases = document.get("cases", [])
    for label, bearing in (friction.bearings.items() if cases else ()):
        rows = json_rows({"friction_torque_Nm": bearing.torque_nm, "power_W": bearing.power_w},
                         len(cases))
        for case, row in zip(cases, rows):
            case["bearings"][label].update(row)
    document["friction"] = {
        "model": "Palmgren (as given by Harris & Kotzalas): M = M0 + M1",
        "f0": friction.f0,
        "bearings": {label: {"mean_power_W": json_number(b.mean_power_w)}
                     for label, b in friction.bearings.items()},
        "mean_power_W": json_number(friction.mean_power_w)}
