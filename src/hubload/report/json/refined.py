"""The refined-method keys of the JSON output (docs/json-output.md; a contract).

``method`` names the method of the life keys. Ratings from the internal
geometry are written whenever the file gives the geometry; the load
distribution keys only with the refined method.
"""

from __future__ import annotations

import numpy as np

from hubload.engine import Result
from hubload.report.numbers import json_number, json_rows
from hubload.units import KN, MPA, MRAD, UM



def nominal_setting_m(result: Result) -> float:
    """The pair's setting: the assembly setting of a [pair.setting], else the file's one."""
    setting = result.setting
    if setting.assembly_m is not None:
        return float(setting.assembly_m)
    return float(np.asarray(setting.operating_m).flat[0])


def add_refined(document: dict, result: Result) -> dict:
    """``document`` (the result_document) with the refined-method keys added in place."""
    for label, rated in result.geometry_ratings.items():
        document["bearings"][label].update({
            "c_from_geometry_kN": json_number(rated.dynamic_n / KN),
            "c0_from_geometry_kN": json_number(rated.static_n / KN)})
    refined = result.refined
    if refined is None:
        return document
    pair = result.study.pair
    document["refined"] = {
        "axial_setting_um": json_number(nominal_setting_m(result) / UM),
        "rotating_ring": pair.rotating_ring,
        "life": "ISO/TS 16281 reference rating life from the lamina loads (l10_h keys)",
        "contact_pressure_limit_MPa": 4000.0,
    }
    cases = document.get("cases", [])   # a sweep point's document has no cases
    if not cases:
        return document
    per_case = json_rows({
        "tilt_mrad": refined.tilt_rad / MRAD,
        "axial_displacement_um": refined.axial_displacement_m / UM,
        "radial_displacement_um": refined.radial_displacement_at_wheel_m / UM,
        "equilibrium": np.asarray(refined.converged, dtype=bool)}, len(cases))
    per_bearing = {label: json_rows({
        "load_zone_deg": np.degrees(bearing.load_zone_rad),
        "max_roller_load_kN": bearing.max_roller_load_n / KN,
        "max_contact_pressure_MPa": bearing.max_contact_pressure_pa / MPA}, len(cases))
        for label, bearing in refined.bearings.items()}
    for index, case in enumerate(cases):
        case.update(per_case[index])
        for label, rows in per_bearing.items():
            case["bearings"][label].update(rows[index])
    return document
