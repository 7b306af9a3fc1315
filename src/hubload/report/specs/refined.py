"""Tables of the refined method: load distribution and shaft displacement per case."""

from __future__ import annotations

import numpy as np

from hubload.engine import Result
from hubload.engine.findings import STATIC_RATING_PRESSURE_PA
from hubload.report.columns import Column, TableSpec, cut_to_cases
from hubload.report.numbers import fixed
from hubload.report.specs.check import SHORT
from hubload.units import KN, MPA, MRAD, UM


def limited(result: Result, spec: TableSpec, limit: int | None) -> TableSpec:
    governing = result.governing
    return cut_to_cases(spec, governing.system_damage_share, governing.symbol, limit)


def distribution_table(result: Result, limit: int | None) -> TableSpec:
    """Load zone, peak roller load and contact pressure per case of each bearing."""
    columns = [Column("case_index", "#", list(range(len(result.study.cases))))]
    for label, found in result.refined.bearings.items():
        short = SHORT[label]
        columns += [
            Column(f"{label}.load_zone_deg", f"zone {short}",
                   list(np.degrees(found.load_zone_rad)), "deg", fixed(0)),
            Column(f"{label}.max_roller_load_kN", f"Qmax {short}",
                   list(found.max_roller_load_n / KN), "kN", fixed(2)),
            Column(f"{label}.max_contact_pressure_MPa", f"pmax {short}",
                   list(found.max_contact_pressure_pa / MPA), "MPa", fixed(0),
                   alert=lambda p: float(p) > STATIC_RATING_PRESSURE_PA / MPA)]
    spec = TableSpec("distribution", "Load distribution per case (refined method)",
                     tuple(columns), notes=(
                         "zone: load zone angle; Qmax: peak roller load; pmax: peak contact "
                         f"pressure (red above {STATIC_RATING_PRESSURE_PA / MPA:.0f} MPa, the "
                         "ISO 76 basis of C0).",))
    return limited(result, spec, limit)


def displacement_table(result: Result, limit: int | None) -> TableSpec:
    refined = result.refined
    spec = TableSpec("displacement", "Shaft in the housing per case", (
        Column("case_index", "#", list(range(len(result.study.cases)))),
        Column("tilt_mrad", "tilt", list(refined.tilt_rad / MRAD), "mrad", fixed(3)),
        Column("axial_displacement_um", "axial", list(refined.axial_displacement_m / UM), "um",
               fixed(1)),
        Column("radial_displacement_um", "radial at wheel",
               list(refined.radial_displacement_at_wheel_m / UM), "um", fixed(1)),
        Column("equilibrium", "equilibrium", ["yes" if c else "none found"
                                              for c in refined.converged],
               alert=lambda text: text != "yes")),
        notes=(f"{result.study.pair.rotating_ring.capitalize()} ring rotating; axial from the "
               f"middle of the end play, + outboard; each case at its operating setting (see the "
               f"setting table).",))
    return limited(result, spec, limit)
