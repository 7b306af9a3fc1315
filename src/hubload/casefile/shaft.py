"""Read the [shaft] table: cross-key rules the format cannot express, conversion to SI."""

from __future__ import annotations

import numpy as np

from hubload.domain.study import Pair, PermissibleCurve, Shaft, ShaftSection
from hubload.errors import InputError
from hubload.model.shaft.strength import NOTCH_SENSITIVITY_RANGE_PA, SIZE_FACTOR_RANGE_MM
from hubload.units import KN, MM, MPA

ROOM_TEMPERATURE_C = 20.0


def read_shaft(data: dict, pair: Pair) -> Shaft:
    ultimate_mpa, yield_mpa = data["ultimate_strength_MPa"], data["yield_strength_MPa"]
    if yield_mpa >= ultimate_mpa:
        raise InputError(f"expected a yield strength below the tensile strength "
                         f"({ultimate_mpa:g} MPa), got {yield_mpa:g} MPa",
                         key_path="shaft.yield_strength_MPa")
    blocks = data["section"]
    check_unique_names(blocks)
    return Shaft(
        ultimate_pa=ultimate_mpa * MPA, yield_pa=yield_mpa * MPA, surface=data["surface"],
        temperature_c=data.get("temperature_C", ROOM_TEMPERATURE_C),
        reliability_percent=data["reliability_percent"], criterion=data["criterion"],
        required_safety=data["required_safety"],
        sections=tuple(read_section(block, f"shaft.section[{index}]", ultimate_mpa, pair)
                       for index, block in enumerate(blocks)),
        permissible=read_permissible(data["permissible"]) if "permissible" in data else None)


def check_unique_names(blocks: list[dict]) -> None:
    seen = set()
    for index, block in enumerate(blocks):
        if block["name"] in seen:
            raise InputError(f"section name '{block['name']}' is used twice; expected unique "
                             f"names", key_path=f"shaft.section[{index}].name")
        seen.add(block["name"])


def read_section(block: dict, path: str, ultimate_mpa: float, pair: Pair) -> ShaftSection:
    low_mm, high_mm = SIZE_FACTOR_RANGE_MM
    if not low_mm <= block["diameter_mm"] <= high_mm:
        raise InputError(f"expected a diameter of {low_mm:g}-{high_mm:g} mm (range of the size "
                         f"factor, Shigley 10th ed. eq. 6-20), got {block['diameter_mm']:g} mm",
                         key_path=f"{path}.diameter_mm")
    if "notch_radius_mm" in block:
        check_neuber_range(ultimate_mpa, f"{path}.notch_radius_mm")
    check_position(block, path, pair)
    radius = block.get("notch_radius_mm")
    return ShaftSection(
        name=block["name"], position_m=block["position_mm"] * MM,
        diameter_m=block["diameter_mm"] * MM, kt_bending=block["kt_bending"],
        kt_torsion=block["kt_torsion"], notch_sensitivity=block.get("notch_sensitivity"),
        notch_radius_m=None if radius is None else radius * MM,
        carries_torque=block["carries_torque"])


def check_neuber_range(ultimate_mpa: float, key_path: str) -> None:
    low, high = (bound / MPA for bound in NOTCH_SENSITIVITY_RANGE_PA)
    if not low <= ultimate_mpa <= high:
        raise InputError(f"the notch sensitivity estimate from the radius holds for steels of "
                         f"{low:.0f}-{high:.0f} MPa tensile strength, the shaft has "
                         f"{ultimate_mpa:g} MPa; give notch_sensitivity instead", key_path=key_path)


def check_position(block: dict, path: str, pair: Pair) -> None:
    """Refuse a section that no load reaches (most often a sign slip in position_mm).

    The wheel is bolted to the shaft's outboard end, so only a section inboard of
    both bearings is free of bending; without torque it carries nothing.
    """
    position_mm = block["position_mm"]
    inboard_mm = float(pair.inboard.position_m) / MM
    if position_mm <= inboard_mm and not block["carries_torque"]:
        raise InputError(f"section at {position_mm:g} mm lies inboard of both bearings (inboard "
                         f"bearing at {inboard_mm:g} mm) and carries no torque: no load acts "
                         f"there. Positions run from the mounting face, positive outboard",
                         key_path=f"{path}.position_mm")


def read_permissible(data: dict) -> PermissibleCurve:
    positions, loads = data["load_position_mm"], data["radial_load_kN"]
    path = "shaft.permissible"
    if len(positions) != len(loads):
        raise InputError(f"load_position_mm has {len(positions)} points, radial_load_kN "
                         f"{len(loads)}; expected one load per position",
                         key_path=f"{path}.radial_load_kN")
    if len(positions) < 2:
        raise InputError("expected at least 2 points on the curve",
                         key_path=f"{path}.load_position_mm")
    for index in range(1, len(positions)):
        if positions[index] <= positions[index - 1]:
            raise InputError(f"expected strictly increasing positions, got {positions[index]:g} "
                             f"after {positions[index - 1]:g}",
                             key_path=f"{path}.load_position_mm[{index}]")
    return PermissibleCurve(load_position_m=np.array(positions) * MM,
                            radial_load_n=np.array(loads) * KN)
