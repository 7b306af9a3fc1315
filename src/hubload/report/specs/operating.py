"""The operating-points table of ``hubload check``: how each case was built, with its flags."""

from __future__ import annotations

import numpy as np

from hubload.domain.study import Study
from hubload.report.columns import Column, TableSpec, cut_to_cases
from hubload.report.json.operating import flags_by_case
from hubload.report.messages import FLAG_SHORT
from hubload.report.numbers import fixed
from hubload.units import BAR, KN, LPM


def worth_showing(study: Study, flags) -> bool:
    """Show the table when the file used the motor or the vehicle, or a case is flagged."""
    points = study.cases.operating
    if points is None:
        return False
    return bool(study.motor is not None or study.vehicle is not None
                or np.any(np.isfinite(points.lateral_accel_g)) or any(flags))


def operating_table(result, limit: int | None) -> TableSpec | None:
    """Derived operating points per case, or None for a plain force file."""
    study = result.study
    cases, points = study.cases, study.cases.operating
    flags = flags_by_case(result.findings, len(cases))
    if not worth_showing(study, [f for case in flags for f in case]):
        return None
    source = [("half" if half else "full") if hydraulic else "force"
              for hydraulic, half in zip(points.hydraulic, points.half_mode)]
    spec = TableSpec("operating", "Operating points (forces after the adhesion cap)", (
        Column("case_index", "#", list(range(len(cases)))),
        Column("given_as", "from", source, name=True),
        Column("pressure_bar", "dp", list(points.pressure_pa / BAR), "bar", fixed(0)),
        Column("flow_lpm", "Q", list(points.flow_m3s / LPM), "l/min", fixed(1)),
        Column("torque_kNm", "T", list(points.torque_nm / KN), "kN m", fixed(2),
               legend="drive torque"),
        Column("motor_power_kW", "P", list(points.shaft_power_w / KN), "kW", fixed(1)),
        Column("wheel_load_kN", "W", list(cases.wheel_load_n / KN), "kN", fixed(2),
               legend="wheel load"),
        Column("side_force_kN", "S", list(cases.side_force_n / KN), "kN", fixed(2),
               legend="side force (+ inboard)"),
        Column("tractive_force_kN", "F", list(cases.tractive_force_n / KN), "kN", fixed(2),
               legend="tractive force"),
        Column("flags", "flags", [", ".join(FLAG_SHORT[f.kind] for f in case) for case in flags],
               name=True, alert=bool)))
    governing = result.governing
    return cut_to_cases(spec, governing.system_damage_share, governing.symbol, limit)
