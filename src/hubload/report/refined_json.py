"""The refined-method keys of the JSON output (docs/json-output.md; a contract).

``method`` names the method of the life keys. Ratings from the internal
geometry are written whenever the file gives the geometry; the load
distribution keys only with the refined method.
"""

from __future__ import annotations

import numpy as np

from hubload.engine import Result
from hubload.report.numbers import json_number

KN = 1e3
MPA = 1e6
UM = 1e-6
MRAD = 1e-3


def add_refined(document: dict, result: Result) -> dict:
    """``document`` (the result_document) with the refined-method keys added in place."""
    for label, rated in result.geometry_ratings.items():
        document["bearings"][label].update({
            "c_from_geometry_kN": json_number(rated.dynamic_n / KN),
            "c0_from_geometry_kN": json_number(rated.static_n / KN)})
    refined = result.refined
    document["method"] = "iso281" if refined is None else "refined"
    if refined is None:
        return document
    pair = result.study.pair
    document["refined"] = {
        "axial_setting_um": json_number(np.asarray(refined.setting_m) / UM),
        "rotating_ring": pair.rotating_ring,
        "life": "ISO/TS 16281 reference rating life from the lamina loads (l10_h keys)",
        "contact_pressure_limit_MPa": 4000.0,
    }
    for index, case in enumerate(document["cases"]):
        case.update({
            "tilt_mrad": json_number(refined.tilt_rad[index] / MRAD),
            "axial_displacement_um": json_number(refined.axial_displacement_m[index] / UM),
            "radial_displacement_um": json_number(refined.radial_displacement_at_wheel_m[index] / UM),
            "equilibrium": bool(refined.converged[index]),
        })
        for label, bearing in refined.bearings.items():
            case["bearings"][label].update({
                "load_zone_deg": json_number(np.degrees(bearing.load_zone_rad[index])),
                "max_roller_load_kN": json_number(bearing.max_roller_load_n[index] / KN),
                "max_contact_pressure_MPa": json_number(bearing.max_contact_pressure_pa[index] / MPA),
            })
    return document
