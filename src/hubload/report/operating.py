"""How each case was built (docs/operating-points.md): JSON keys per case and a compact table."""

from __future__ import annotations

import math

import numpy as np
from rich import box
from rich.table import Table

from hubload.casefile.study import Cases, Study
from hubload.report.numbers import json_number

KN = 1e3
BAR = 1e5
LPM = 1e-3 / 60.0
FLAG_LABELS = {"slip": "slip", "tyre_slides": "slide", "pressure_above_rating": "p>max",
               "speed_above_rating": "n>max"}


def case_entry(cases: Cases, index: int) -> dict:
    """The operating-point keys of ``cases[index]`` in the JSON output."""
    entry = {"wheel_load_kN": json_number(cases.wheel_load_n[index] / KN),
             "side_force_kN": json_number(cases.side_force_n[index] / KN),
             "tractive_force_kN": json_number(cases.tractive_force_n[index] / KN)}
    points = cases.operating
    if points is None:
        return {**entry, "torque_Nm": None, "flags": [], "flag_codes": []}
    flags = points.flags(index)
    with_motor = math.isfinite(points.pressure_pa[index])
    return {
        **entry,
        "torque_Nm": json_number(points.torque_nm[index]),
        "flags": [flag.message for flag in flags],
        "flag_codes": [flag.code for flag in flags],
        "given_as": "pressure and flow" if points.hydraulic[index] else "forces",
        "mode": ("half" if points.half_mode[index] else "full") if with_motor else None,
        "pressure_bar": json_number(points.pressure_pa[index] / BAR),
        "flow_lpm": json_number(points.flow_m3s[index] / LPM),
        "motor_power_kW": json_number(points.shaft_power_w[index] / KN),
        "speed_kmh": json_number(points.speed_kmh[index]),
        "lateral_accel_g": json_number(points.lateral_accel_g[index]),
        "tractive_force_demand_kN": json_number(points.tractive_demand_n[index] / KN),
        "adhesion_limit_kN": json_number(points.adhesion_limit_n[index] / KN),
    }


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
