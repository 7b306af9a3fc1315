"""Internal geometry of the bearings, and what the refined method requires of a file."""

from __future__ import annotations

import math
from dataclasses import replace

from hubload.domain.study import Pair, RollerGeometry, Study
from hubload.errors import InputError
from hubload.model.refined.ratings import GAMMA_MAX, GAMMA_MIN
from hubload.units import MM, UM

GEOMETRY_KEYS = "rollers, roller_diameter_mm, roller_length_mm, pitch_diameter_mm"


def read_geometry(data: dict, label: str) -> RollerGeometry | None:
    """The bearing's internal geometry in SI, or None when the file gives none."""
    path = f"pair.{label}"
    crown = data.get("crown_drop_um")
    if "rollers" not in data:
        if crown is not None or data.get("roller_profile") == "logarithmic":
            raise InputError(f"a roller profile needs the internal geometry ({GEOMETRY_KEYS} "
                             f"and contact_angle_deg)", key_path=f"{path}.rollers")
        return None
    if "contact_angle_deg" not in data:
        raise InputError("the internal geometry needs the contact angle of the outer raceway "
                         "(contact_angle_deg)", key_path=f"{path}.contact_angle_deg")
    check_profile(data.get("roller_profile", "straight"), crown, path)
    geometry = RollerGeometry(
        rollers=data["rollers"], roller_diameter_m=data["roller_diameter_mm"] * MM,
        roller_length_m=data["roller_length_mm"] * MM,
        contact_angle_rad=math.radians(data["contact_angle_deg"]),
        pitch_diameter_m=data["pitch_diameter_mm"] * MM,
        crown_drop_m=0.0 if crown is None else crown * UM)
    check_proportions(data, path)
    return geometry


def check_profile(profile: str, crown_um: float | None, path: str) -> None:
    if profile == "logarithmic" and crown_um is None:
        raise InputError("expected crown_drop_um (the profile's drop at the roller ends) with "
                         'roller_profile = "logarithmic"', key_path=f"{path}.crown_drop_um")
    if profile == "straight" and crown_um is not None:
        raise InputError('crown_drop_um applies to roller_profile = "logarithmic"; '
                         "remove it or set the profile", key_path=f"{path}.crown_drop_um")


def check_proportions(data: dict, path: str) -> None:
    """Rollers that fit on their pitch circle, inside ISO 281's table of fc."""
    diameter, pitch = data["roller_diameter_mm"], data["pitch_diameter_mm"]
    gamma = diameter * math.cos(math.radians(data["contact_angle_deg"])) / pitch
    if not GAMMA_MIN <= gamma <= GAMMA_MAX:
        raise InputError(f"Dwe cos(a) / Dpw = {gamma:.3g} is outside ISO 281's table of fc "
                         f"({GAMMA_MIN:g} to {GAMMA_MAX:g}); check roller_diameter_mm and "
                         f"pitch_diameter_mm", key_path=f"{path}.pitch_diameter_mm")
    if data["rollers"] * diameter >= math.pi * pitch:
        raise InputError(f"{data['rollers']} rollers of {diameter:g} mm do not fit on a pitch "
                         f"circle of {pitch:g} mm (Z Dwe must stay below pi Dpw = "
                         f"{math.pi * pitch:.1f} mm)", key_path=f"{path}.rollers")


def require_geometry(pair: Pair) -> None:
    """InputError unless both bearings give their internal geometry (refined method)."""
    for label, bearing in pair.bearings().items():
        if bearing.geometry is None:
            raise InputError(f"the refined method needs the internal geometry of both bearings: "
                             f"{GEOMETRY_KEYS} and contact_angle_deg",
                             key_path=f"pair.{label}.rollers")


def with_method(study: Study, method: str | None) -> Study:
    """The study computed by ``method`` (None keeps the file's); checks what it needs."""
    method = study.method if method is None else method
    if method == "refined":
        require_geometry(study.pair)
    return study if method == study.method else replace(study, method=method)
