"""How each case was built (docs/operating-points.md): the JSON keys per case."""

from __future__ import annotations

import math

from hubload.domain.study import Study
from hubload.engine.findings import OPERATING_FLAGS
from hubload.report.messages import flag_text
from hubload.report.numbers import json_numbers, json_rows
from hubload.units import BAR, KN, LPM


def flags_by_case(findings, count: int) -> list[list]:
    """The operating flags among ``findings``, per case in case order."""
    flags: list[list] = [[] for _ in range(count)]
    for finding in findings:
        if finding.kind in OPERATING_FLAGS:
            flags[finding.case].append(finding)
    return flags


def case_entries(study: Study, findings) -> list[dict]:
    """The operating-point keys of each case in the JSON output (flags from the findings)."""
    cases = study.cases
    count = len(cases)
    forces = json_rows({"wheel_load_kN": cases.wheel_load_n / KN,
                        "side_force_kN": cases.side_force_n / KN,
                        "tractive_force_kN": cases.tractive_force_n / KN}, count)
    points = cases.operating
    if points is None:
        return [{**entry, "torque_Nm": None, "flags": [], "flag_codes": []} for entry in forces]
    torque = json_numbers(points.torque_nm)
    derived = json_rows({
        "pressure_bar": points.pressure_pa / BAR, "flow_lpm": points.flow_m3s / LPM,
        "motor_power_kW": points.shaft_power_w / KN, "speed_kmh": points.speed_kmh,
        "lateral_accel_g": points.lateral_accel_g,
        "tractive_force_demand_kN": points.tractive_demand_n / KN,
        "adhesion_limit_kN": points.adhesion_limit_n / KN}, count)
    entries = []
    flags_of = flags_by_case(findings, count)
    for index, entry in enumerate(forces):
        flags = flags_of[index]
        with_motor = math.isfinite(points.pressure_pa[index])
        entries.append({
            **entry,
            "torque_Nm": torque[index],
            "flags": [flag_text(flag) for flag in flags],
            "flag_codes": [flag.kind for flag in flags],
            "given_as": "pressure and flow" if points.hydraulic[index] else "forces",
            "mode": ("half" if points.half_mode[index] else "full") if with_motor else None,
            **derived[index],
        })
    return entries
