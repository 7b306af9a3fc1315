"""The [motor] and [vehicle] tables and the per-case rules of a file's [[case]] blocks.

The operating points themselves are built by :mod:`hubload.domain.operating`;
this module applies the file's rules (which keys need which table) and names
the case and key of every problem.
"""

from __future__ import annotations

import numpy as np

from hubload.domain.operating import Motor, OperatingPoints, Vehicle, derive_operating_points
from hubload.errors import InputError
from hubload.model import operating
from hubload.model.kinematics import kmh_to_rpm
from hubload.units import BAR, CM3, KN, LPM, MM


def read_motor(data: dict | None) -> Motor | None:
    if data is None:
        return None
    return Motor(
        displacement_m3=data["displacement_cc"] * CM3, half_mode=data["half_mode"],
        efficiency_volumetric=data["efficiency_volumetric"],
        efficiency_mechanical=data["efficiency_mechanical"],
        max_pressure_pa=data["max_pressure_bar"] * BAR if "max_pressure_bar" in data else None,
        max_speed_rpm=data.get("max_speed_rpm"))


def read_vehicle(data: dict | None) -> Vehicle | None:
    if data is None:
        return None
    return Vehicle(axle_load_n=data["axle_load_kN"] * KN, track_m=data["track_mm"] * MM,
                   cog_height_m=data["cog_height_mm"] * MM)


def derive_cases(blocks: list[dict], wheel, motor: Motor | None,
                 vehicle: Vehicle | None) -> OperatingPoints:
    """The operating points of validated [[case]] blocks; InputError naming the case."""
    check_case_rules(blocks, motor, vehicle)

    def column(key: str, scale: float = 1.0) -> np.ndarray:
        return np.array([block.get(key, np.nan) for block in blocks], dtype=float) * scale

    speed_rpm = np.where(np.isnan(column("speed_rpm")),
                         kmh_to_rpm(column("speed_kmh"), wheel.rolling_radius_m),
                         column("speed_rpm"))
    points = derive_operating_points(
        wheel_load_n=column("wheel_load_kN", KN), side_force_n=column("side_force_kN", KN),
        tractive_force_n=column("tractive_force_kN", KN), speed_rpm=speed_rpm,
        pressure_pa=column("pressure_bar", BAR), flow_m3s=column("flow_lpm", LPM),
        half_mode=np.array([block.get("mode") == "half" for block in blocks]),
        lateral_accel_g=column("lateral_accel_g"), rolling_radius_m=wheel.rolling_radius_m,
        adhesion_mu=wheel.adhesion_mu, motor=motor, vehicle=vehicle)
    check_no_wheel_lifts(blocks, points, vehicle)
    return points


def case_error(blocks: list[dict], index: int, key: str, message: str) -> InputError:
    return InputError(f"{message} (case '{blocks[index]['name']}')",
                      key_path=f"case[{index}].{key}")


def check_case_rules(blocks: list[dict], motor: Motor | None, vehicle: Vehicle | None) -> None:
    """Rules across tables that the format's Choice groups cannot express."""
    for index, block in enumerate(blocks):
        if "pressure_bar" in block and motor is None:
            raise case_error(blocks, index, "pressure_bar", (
                "a case given as pressure and flow needs a [motor] block (displacement_cc, "
                "efficiencies) to turn them into torque and speed"))
        if "mode" in block and motor is None:
            raise case_error(blocks, index, "mode", "mode needs a [motor] block")
        if block.get("mode") == "half" and not motor.half_mode:
            raise case_error(blocks, index, "mode", (
                "expected mode = \"full\": the motor has no half-displacement mode "
                "(set [motor] half_mode = true if it can switch)"))
        if "wheel_load_kN" not in block and vehicle is None:
            raise case_error(blocks, index, "wheel_load_kN", (
                "missing wheel_load_kN: give it, or add a [vehicle] block (axle_load_kN, "
                "track_mm, cog_height_mm) to derive it from lateral_accel_g"))


def check_no_wheel_lifts(blocks: list[dict], points: OperatingPoints,
                         vehicle: Vehicle | None) -> None:
    negative = np.asarray(points.wheel_load_n < 0).reshape(-1, len(blocks))
    lifted = np.flatnonzero(np.any(negative, axis=0))
    if lifted.size == 0:
        return
    index = int(lifted[0])
    lift_g = np.min(operating.lift_off_accel_g(vehicle.cog_height_m, vehicle.track_m))
    raise case_error(blocks, index, "lateral_accel_g", (
        f"wheel would lift: at lateral_accel_g = {blocks[index]['lateral_accel_g']:g} the load "
        f"transfer leaves {np.min(points.wheel_load_n[..., index]) / KN:.2f} kN on this wheel; "
        f"an inside wheel lifts beyond {lift_g:.2f} g (track / (2 x cog_height)). "
        f"Expected lateral_accel_g >= {-lift_g:.2f}, or give wheel_load_kN"))


