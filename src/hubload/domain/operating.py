"""Operating points of the load cases: wheel forces and speed from what the user knows.

A case gives its wheel forces directly (tractive force with a speed), or as a
hydraulic operating point of the motor (pressure, flow, mode). With a vehicle
the wheel load and side force follow from the lateral acceleration; a given
wheel load or side force overrides the derived value. Every tractive or braking
force is capped at the tyre's adhesion limit. The physics is in
:mod:`hubload.model.operating`; this module builds the typed operating points,
with their flags, from the given values.

:func:`derive_operating_points` works on arrays (NaN where a key is absent)
and has no Python loop, so measured logs can use it per sample.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.model import operating
from hubload.model.kinematics import rpm_to_kmh
from hubload.units import BAR, KN

ArrayLike = float | np.ndarray


@dataclass(frozen=True)
class Motor:
    displacement_m3: ArrayLike          # full mode, per revolution
    half_mode: bool                     # can switch to half displacement
    efficiency_volumetric: ArrayLike
    efficiency_mechanical: ArrayLike    # hydraulic-mechanical
    max_pressure_pa: float | None = None
    max_speed_rpm: float | None = None


@dataclass(frozen=True)
class Vehicle:
    axle_load_n: ArrayLike              # static load on this wheel's axle
    track_m: ArrayLike
    cog_height_m: ArrayLike


@dataclass(frozen=True)
class Flag:
    code: str       # slip | tyre_slides | pressure_above_rating | speed_above_rating
    message: str


@dataclass(frozen=True)
class OperatingPoints:
    """How each case was built; per-case arrays in case order (case axis last).

    ``torque_nm``, ``pressure_pa``, ``flow_m3s`` and ``shaft_power_w`` describe
    the operating point as given (for a force case: what the motor must deliver
    for the given force and speed; NaN pressure and flow without a [motor]).
    ``tractive_force_n`` is the force at the tyre after the adhesion cap, the one
    the bearings see; ``tractive_demand_n`` the one asked for.
    """

    hydraulic: np.ndarray
    half_mode: np.ndarray
    pressure_pa: np.ndarray
    flow_m3s: np.ndarray
    torque_nm: np.ndarray
    shaft_power_w: np.ndarray
    speed_rpm: np.ndarray
    speed_kmh: np.ndarray
    lateral_accel_g: np.ndarray
    wheel_load_n: np.ndarray
    side_force_n: np.ndarray
    tractive_demand_n: np.ndarray
    tractive_force_n: np.ndarray
    adhesion_limit_n: np.ndarray
    slips: np.ndarray
    tyre_slides: np.ndarray
    pressure_above_rating: np.ndarray
    speed_above_rating: np.ndarray
    max_pressure_pa: float | None = None
    max_speed_rpm: float | None = None

    def flags(self, index: int) -> list[Flag]:
        """Plain-language flags of one case (single study, no parameter arrays)."""
        found = []
        if self.slips[index]:
            found.append(Flag("slip", (
                f"wheel would slip: force capped at {self.tractive_force_n[index] / KN:.2f} kN "
                f"(adhesion_mu x wheel load); the case asks for "
                f"{self.tractive_demand_n[index] / KN:.2f} kN")))
        if self.tyre_slides[index]:
            combined = np.hypot(self.tractive_force_n[index], self.side_force_n[index])
            found.append(Flag("tyre_slides", (
                f"tyre would slide: side and tractive force together {combined / KN:.2f} kN "
                f"exceed adhesion_mu x wheel load = {self.adhesion_limit_n[index] / KN:.2f} kN "
                f"(friction circle); the side force is kept as given")))
        if self.pressure_above_rating[index]:
            verb = "" if self.hydraulic[index] else " needed"
            found.append(Flag("pressure_above_rating", (
                f"pressure{verb} {abs(self.pressure_pa[index]) / BAR:.0f} bar above the motor "
                f"rating max_pressure_bar = {self.max_pressure_pa / BAR:g}")))
        if self.speed_above_rating[index]:
            found.append(Flag("speed_above_rating", (
                f"speed {self.speed_rpm[index]:.1f} r/min above the motor rating "
                f"max_speed_rpm = {self.max_speed_rpm:g}")))
        return found

    def warnings(self, names: tuple[str, ...]) -> list[str]:
        flagged = np.flatnonzero(self.slips | self.tyre_slides | self.pressure_above_rating
                                 | self.speed_above_rating)
        return [f"Case '{names[index]}': {flag.message}."
                for index in flagged for flag in self.flags(index)]


def derive_operating_points(*, wheel_load_n, side_force_n, tractive_force_n, speed_rpm,
                            pressure_pa, flow_m3s, half_mode, lateral_accel_g,
                            rolling_radius_m, adhesion_mu, motor: Motor | None,
                            vehicle: Vehicle | None) -> OperatingPoints:
    """Wheel forces, speed and flags from the given keys [N, m, Pa, m^3/s, r/min, g].

    Arrays broadcast (case or sample axis last); NaN marks an absent key. A case
    is hydraulic where ``pressure_pa`` is given (then ``flow_m3s`` is too, and a
    ``motor``); where ``wheel_load_n`` is absent a ``vehicle`` must be given.
    """
    hydraulic = ~np.isnan(pressure_pa)
    wheel_n, side_n = ground_loads(wheel_load_n, side_force_n, lateral_accel_g, vehicle)
    given_force_n = np.nan_to_num(tractive_force_n, nan=0.0)
    torque_nm, speed, pressure, flow = motor_point(
        motor, hydraulic, half_mode, pressure_pa, flow_m3s,
        given_force_n * rolling_radius_m, speed_rpm)
    demand_n = np.where(hydraulic, operating.tractive_force_n(torque_nm, rolling_radius_m),
                        given_force_n)
    capped_n, slips = operating.adhesion_capped_force_n(demand_n, wheel_n, adhesion_mu)
    max_pressure = None if motor is None else motor.max_pressure_pa
    max_speed = None if motor is None else motor.max_speed_rpm
    return OperatingPoints(
        hydraulic=hydraulic, half_mode=np.asarray(half_mode, dtype=bool), pressure_pa=pressure,
        flow_m3s=flow, torque_nm=torque_nm, shaft_power_w=operating.shaft_power_w(torque_nm, speed),
        speed_rpm=speed, speed_kmh=rpm_to_kmh(speed, rolling_radius_m),
        lateral_accel_g=np.asarray(lateral_accel_g, dtype=float), wheel_load_n=wheel_n,
        side_force_n=side_n, tractive_demand_n=demand_n, tractive_force_n=capped_n,
        adhesion_limit_n=operating.adhesion_limit_n(wheel_n, adhesion_mu), slips=slips,
        tyre_slides=operating.exceeds_friction_circle(capped_n, side_n, wheel_n, adhesion_mu),
        pressure_above_rating=above(np.abs(pressure), max_pressure),
        speed_above_rating=above(speed, max_speed),
        max_pressure_pa=max_pressure, max_speed_rpm=max_speed)


def ground_loads(wheel_load_n, side_force_n, lateral_accel_g, vehicle: Vehicle | None):
    """Wheel load and side force [N]: as given, else from the lateral acceleration.

    The wheel load follows from the [vehicle]'s load transfer; the side force is
    the wheel load in effect times the lateral acceleration (0 where not given).
    """
    accel_g = np.nan_to_num(lateral_accel_g, nan=0.0)
    wheel_n = np.asarray(wheel_load_n, dtype=float)
    if vehicle is not None:
        wheel_n = np.where(np.isnan(wheel_n), operating.cornering_wheel_load_n(
            vehicle.axle_load_n, accel_g, vehicle.cog_height_m, vehicle.track_m), wheel_n)
    side_n = np.where(np.isnan(side_force_n),
                      operating.cornering_side_force_n(wheel_n, accel_g), side_force_n)
    return wheel_n, side_n


def motor_point(motor: Motor | None, hydraulic, half_mode, pressure_pa, flow_m3s,
                force_torque_nm, force_speed_rpm):
    """Torque [N m], speed [r/min], pressure [Pa] and flow [m^3/s] of each case.

    Hydraulic cases: from pressure and flow. Force cases: the torque of the given
    force, and the pressure and flow the motor needs for it (NaN without a motor).
    """
    if motor is None:
        nothing = np.full(np.shape(hydraulic), np.nan)
        return (np.where(hydraulic, np.nan, force_torque_nm),
                np.where(hydraulic, np.nan, force_speed_rpm), nothing, nothing)
    displacement = operating.effective_displacement_m3(motor.displacement_m3, half_mode)
    torque_nm = np.where(hydraulic, operating.hydraulic_torque_nm(
        pressure_pa, displacement, motor.efficiency_mechanical), force_torque_nm)
    speed = np.where(hydraulic, operating.motor_speed_rpm(
        flow_m3s, displacement, motor.efficiency_volumetric, pressure_pa), force_speed_rpm)
    pressure = np.where(hydraulic, pressure_pa, operating.motor_pressure_pa(
        torque_nm, displacement, motor.efficiency_mechanical))
    flow = np.where(hydraulic, flow_m3s, operating.motor_flow_m3s(
        speed, displacement, motor.efficiency_volumetric, pressure))
    return torque_nm, speed, pressure, flow


def above(values, limit) -> np.ndarray:
    """Where ``values`` exceed ``limit`` (nowhere without a limit; NaN never does)."""
    if limit is None:
        return np.zeros(np.shape(values), dtype=bool)
    return np.nan_to_num(values, nan=-np.inf) > limit
