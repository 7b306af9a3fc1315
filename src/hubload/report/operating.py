"""How each case was built (docs/operating-points.md): JSON keys per case and a compact table."""

from __future__ import annotations

import math

import numpy as np
from rich import box
from rich.table import Table

from hubload.domain.study import Cases, Study
from hubload.report.numbers import json_numbers, json_rows
from hubload.units import BAR, KN, LPM

FLAG_LABELS = {"slip": "slip", "tyre_slides": "slide", "pressure_above_rating": "p>max",
               "speed_above_rating": "n>max"}


def case_entries(cases: Cases) -> list[dict]:
    """The operating-point keys of each case in the JSON output."""
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
    for index, entry in enumerate(forces):
        flags = points.flags(index)
        with_motor = math.isfinite(points.pressure_pa[index])
        entries.append({
            **entry,
            "torque_Nm": torque[index],
            "flags": [flag.message for flag in flags],
            "flag_codes": [flag.code for flag in flags],
            "given_as": "pressure and flow" if points.hydraulic[index] else "forces",
            "mode": ("half" if points.half_mode[index] else "full") if with_motor else None,
            **derived[index],
        })
    return entries


def worth_showing(study: Study) -> bool:
    """Show the table when the file used the motor or the vehicle, or a case is flagged."""
    points = study.cases.operating
    if points is None:
        return False
    return bool(study.motor is not None or study.vehicle is not None
                or np.any(np.isfinite(points.lateral_accel_g))
                or any(points.flags(index) for index in range(len(study.cases))))


def cell(value, scale: float = 1.0, digits: int = 1) -> str:
    value = float(value) / scale
    return f"{value:.{digits}f}" if math.isfinite(value) else "-"


def operating_table(study: Study) -> Table | None:
    """Derived operating points per case, or None for a plain force file."""
    if not worth_showing(study):
        return None
    cases, points = study.cases, study.cases.operating
    table = Table(title="Operating points: as given, F after the adhesion cap (n: see above)",
                  title_justify="left", box=box.SIMPLE_HEAD, pad_edge=False)
    table.add_column("#", justify="right")
    table.add_column("from")
    for heading in ("dp bar", "Q l/min", "T kN m", "P kW", "W kN", "S kN", "F kN"):
        table.add_column(heading, justify="right")
    table.add_column("flags")
    for index in range(len(cases)):
        source = (("half" if points.half_mode[index] else "full") if points.hydraulic[index]
                  else "force")
        flags = ", ".join(FLAG_LABELS[flag.code] for flag in points.flags(index))
        table.add_row(
            str(index), source, cell(points.pressure_pa[index], BAR, 0),
            cell(points.flow_m3s[index], LPM), cell(points.torque_nm[index], KN, 2),
            cell(points.shaft_power_w[index], KN), cell(cases.wheel_load_n[index], KN, 2),
            cell(cases.side_force_n[index], KN, 2), cell(cases.tractive_force_n[index], KN, 2),
            f"[yellow]{flags}[/]" if flags else "")
    return table
