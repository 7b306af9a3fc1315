"""The [pair.setting] table: the assembly setting, its fits, materials and temperatures, in SI.

Raceway diameters at the roller mid-length come from each bearing's internal geometry:
cup D_o = Dpw + Dwe cos(a), cone d_i = Dpw - Dwe cos(a) (the roller set's pitch circle
and mean roller diameter; common practice, within the roller's taper of the exact
raceway diameters). The spread between the raceways follows from the load centres
(hubload.model.setting.raceway_spread_m).
"""

from __future__ import annotations

import dataclasses

import numpy as np

from hubload.domain.study import AssemblySetting, Bearing, Pair
from hubload.errors import InputError
from hubload.model.materials import BEARING_RING, material
from hubload.model.setting import PairMounting, SeatedBearing, raceway_spread_m
from hubload.units import CELSIUS_ZERO_K, GPA, MM, UM

PATH = "pair.setting"
# Placeholders where a seat diameter is not given: used only where no fit can act (no
# interference, and a shaft or housing that expands as the rings do: its fit stays
# line-to-line at every temperature), so they never change a result; kept inside the ring
# so the thick-cylinder ratios stay finite.
BORE_PLACEHOLDER = 0.8
OUTSIDE_PLACEHOLDER = 1.25


def chosen_material(data: dict, part: str):
    """The shaft's or housing's material, with the file's own coefficients where given."""
    found = material(data[f"{part}_material"])
    if f"{part}_expansion_per_K" in data:
        found = dataclasses.replace(found, expansion_per_k=data[f"{part}_expansion_per_K"])
    if f"{part}_modulus_GPa" in data:
        found = dataclasses.replace(found, youngs_modulus_pa=data[f"{part}_modulus_GPa"] * GPA)
    return found


def seated(bearing: Bearing, data: dict, bearing_data: dict, label: str) -> SeatedBearing:
    geometry = bearing.geometry
    if geometry is None:
        raise InputError("a [pair.setting] needs the internal geometry of both bearings "
                         "(rollers, roller_diameter_mm, pitch_diameter_mm, contact_angle_deg): "
                         "the raceway diameters and angles set the thermal change",
                         key_path=f"pair.{label}.rollers")
    radial = geometry.roller_diameter_m * np.cos(geometry.contact_angle_rad)
    cup, cone = geometry.pitch_diameter_m + radial, geometry.pitch_diameter_m - radial
    cone_fit, cup_fit = data.get("cone_interference_um", 0.0), data.get("cup_interference_um", 0.0)
    for key, why in seat_needs(data, cone_fit, cup_fit):
        if key not in bearing_data:
            raise InputError(why, key_path=f"pair.{label}.{key}")
    bore = bearing_data.get("bore_mm", 0.0) * MM or BORE_PLACEHOLDER * cone
    outside = bearing_data.get("outside_diameter_mm", 0.0) * MM or OUTSIDE_PLACEHOLDER * cup
    if not bore < cone < cup < outside:
        raise InputError(f"expected bore < cone raceway ({cone / MM:.1f} mm) < cup raceway "
                         f"({cup / MM:.1f} mm) < outside diameter, from the internal geometry",
                         key_path=f"pair.{label}.{'bore_mm' if bore >= cone else 'outside_diameter_mm'}")
    housing = data.get("housing_outside_diameter_mm")
    if housing is not None and housing * MM <= outside:
        raise InputError(f"expected the housing's outside diameter above the cup's "
                         f"({outside / MM:g} mm)", key_path=f"{PATH}.housing_outside_diameter_mm")
    shaft_bore = data["shaft_bore_mm"] * MM
    if shaft_bore >= bore:
        raise InputError(f"expected the hollow shaft's bore below the cone bore "
                         f"({bore / MM:g} mm)", key_path=f"{PATH}.shaft_bore_mm")
    return SeatedBearing(
        contact_angle_rad=geometry.contact_angle_rad, cup_raceway_diameter_m=cup,
        cone_raceway_diameter_m=cone, bore_m=bore, outside_diameter_m=outside,
        shaft_interference_m=cone_fit * UM, housing_interference_m=cup_fit * UM,
        shaft_bore_m=shaft_bore,
        housing_outside_diameter_m=np.inf if housing is None else housing * MM)


def seat_needs(data: dict, cone_fit_um: float, cup_fit_um: float) -> list[tuple[str, str]]:
    """(seat diameter key, why it is needed) for each seat whose fit can act in operation:
    one with an interference, or whose shaft or housing expands otherwise than the rings
    (the fit then changes by (a - a_ring) dT d, d the seat's own diameter), and the seats a
    given shaft bore or housing outside diameter is measured against."""
    ring = BEARING_RING.expansion_per_k
    needs = []
    for key, part, fit_um, wall_key, seat in (
            ("bore_mm", "shaft", cone_fit_um, "shaft_bore_mm", "bore"),
            ("outside_diameter_mm", "housing", cup_fit_um, "housing_outside_diameter_mm",
             "outside diameter")):
        expansion = chosen_material(data, part).expansion_per_k
        if fit_um > 0:
            needs.append((key, f"{'cone' if part == 'shaft' else 'cup'}_interference_um needs "
                               f"each bearing's {seat} [mm]"))
        elif expansion != ring:
            needs.append((key, f"the {part} expands {expansion:g} 1/K, the rings {ring:g} 1/K: "
                               f"its fit changes with temperature in proportion to the seat "
                               f"diameter; give each bearing's {seat} [mm]"))
        elif data.get(wall_key, 0.0) > 0:
            needs.append((key, f"{wall_key} is measured against each bearing's {seat}; "
                               f"give it [mm]"))
    return needs


def case_temperatures_k(data: dict, case_blocks: list[dict], part: str, bearing_c) -> np.ndarray:
    """Per case: the case's own value, else the table's, else the bearing temperature."""
    key = f"{part}_temperature_C"
    default = data.get(key)
    return np.array([block.get(key, bearing_c[i] if default is None else default)
                     for i, block in enumerate(case_blocks)], dtype=float) + CELSIUS_ZERO_K


def read_setting(pair_data: dict, pair: Pair, case_blocks: list[dict],
                 bearing_temperature_k) -> Pair:
    """The pair with its [pair.setting], when given; case temperature keys need the table."""
    data = pair_data.get("setting")
    if data is None:
        stray = [(i, key) for i, block in enumerate(case_blocks)
                 for key in ("shaft_temperature_C", "housing_temperature_C") if key in block]
        if stray:
            index, key = stray[0]
            raise InputError(f"{key} needs a [pair.setting] table (the assembly setting it "
                             f"changes)", key_path=f"case[{index}].{key}")
        return pair
    bearings = [seated(b, data, pair_data[label], label)
                for label, b in pair.bearings().items()]
    load_centres = float(pair.outboard.position_m - pair.inboard.position_m)
    spread = raceway_spread_m(load_centres, *bearings, pair.arrangement)
    if not spread > 0:
        raise InputError("the bearings' raceways overlap along the axis: check the positions "
                         "and the internal geometry", key_path="pair.outboard.position_mm")
    assembly_c = data["assembly_temperature_C"]
    bearing_c = np.asarray(bearing_temperature_k, dtype=float) - CELSIUS_ZERO_K \
        if bearing_temperature_k is not None else np.full(len(case_blocks), assembly_c)
    mounting = PairMounting(outboard=bearings[0], inboard=bearings[1], spread_m=spread,
                            arrangement=pair.arrangement, shaft=chosen_material(data, "shaft"),
                            housing=chosen_material(data, "housing"))
    setting = AssemblySetting(
        assembly_m=data["assembly_um"] * UM, tolerance_m=data["tolerance_um"] * UM,
        basis=data["basis"], assembly_temperature_k=assembly_c + CELSIUS_ZERO_K,
        shaft_temperature_k=case_temperatures_k(data, case_blocks, "shaft", bearing_c),
        housing_temperature_k=case_temperatures_k(data, case_blocks, "housing", bearing_c),
        mounting=mounting, cone_interference_m=data.get("cone_interference_um", 0.0) * UM,
        cup_interference_m=data.get("cup_interference_um", 0.0) * UM)
    return dataclasses.replace(pair, setting=setting)
