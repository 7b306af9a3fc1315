"""Per-sample operating points of a log, as a batch of engine load cases.

Every sample becomes one case (wheel forces [N], wheel speed [r/min]) with its
hold time as weight, so the engine that evaluates a load-case file evaluates the
log too: one life model, not two. Pressures, flows, modes and lateral
accelerations go through the same operating-point conversion as the [[case]]
blocks of a file (hubload.casefile.operating_points), adhesion cap included.
"""

from __future__ import annotations

import dataclasses

import numpy as np

from hubload.domain.operating import OperatingPoints, derive_operating_points
from hubload.domain.study import Cases, Study
from hubload.errors import InputError
from hubload.logs.clean import Samples
from hubload.logs.columns import ColumnPlan
from hubload.model import operating
from hubload.model.kinematics import kmh_to_rpm
from hubload.units import BAR, CELSIUS_ZERO_K, KN, LPM

HALF = 1.0  # code of "half" in the mode channel (reader.DISCRETE_LEVELS order)
FLAGS = ("slips", "tyre_slides", "pressure_above_rating", "speed_above_rating")


def operating_points(samples: Samples, plan: ColumnPlan, study: Study,
                     file: str) -> OperatingPoints:
    """Wheel forces and speed of every sample, by the load-case file's rules."""
    channels, size = samples.channels, len(samples)
    absent = np.full(size, np.nan)

    def given(key: str, scale: float = 1.0) -> np.ndarray:
        return channels[key] * scale if key in channels else absent

    half_mode = given("mode") == HALF
    if np.any(half_mode) and not study.motor.half_mode:
        row = int(samples.rows[np.argmax(half_mode)])
        raise InputError('expected mode "full": the motor has no half-displacement mode (set '
                         "[motor] half_mode = true if it can switch)", file=file,
                         key_path=f"row {row}, column {plan.headers['mode']!r}")
    pressure_pa = given("pressure_bar", BAR) if plan.hydraulic else absent
    speed_rpm, flow_m3s = sample_speed(channels, plan, study, half_mode, pressure_pa)
    points = derive_operating_points(
        wheel_load_n=given("wheel_load_kN", KN), side_force_n=given("side_force_kN", KN),
        tractive_force_n=given("tractive_force_kN", KN), speed_rpm=speed_rpm,
        pressure_pa=pressure_pa, flow_m3s=flow_m3s, half_mode=half_mode,
        lateral_accel_g=given("lateral_accel_g"), rolling_radius_m=study.wheel.rolling_radius_m,
        adhesion_mu=study.wheel.adhesion_mu, motor=study.motor, vehicle=study.vehicle)
    lifted = np.flatnonzero(points.wheel_load_n < 0)
    if lifted.size:
        raise InputError(
            f"wheel would lift: the load transfer at {channels['lateral_accel_g'][lifted[0]]:g} g "
            f"leaves {points.wheel_load_n[lifted[0]] / KN:.2f} kN on this wheel; give a "
            "wheel_load_kN column for such manoeuvres", file=file,
            key_path=f"row {int(samples.rows[lifted[0]])}, column "
                     f"{plan.headers['lateral_accel_g']!r}")
    return points


def sample_speed(channels: dict, plan: ColumnPlan, study: Study, half_mode, pressure_pa):
    """Wheel speed [r/min] and motor flow [m^3/s] (NaN without a motor) per sample.

    A logged speed wins; a logged flow gives the speed through the motor. For a
    hydraulic sample with a logged speed the flow is the one that gives that
    speed, so the conversion returns the logged speed unchanged.
    """
    motor, size = study.motor, len(channels[plan.speed_channel])
    if plan.speed_channel == "flow_lpm":
        flow = channels["flow_lpm"] * LPM
        displacement = operating.effective_displacement_m3(motor.displacement_m3, half_mode)
        sign_pa = np.nan_to_num(pressure_pa, nan=0.0)
        return operating.motor_speed_rpm(flow, displacement, motor.efficiency_volumetric,
                                         sign_pa), flow
    speed = channels[plan.speed_channel]
    if plan.speed_channel == "speed_kmh":
        speed = kmh_to_rpm(speed, study.wheel.rolling_radius_m)
    if not plan.hydraulic:
        return speed, np.full(size, np.nan)
    displacement = operating.effective_displacement_m3(motor.displacement_m3, half_mode)
    return speed, operating.motor_flow_m3s(speed, displacement, motor.efficiency_volumetric,
                                           pressure_pa)


def sample_cases(points: OperatingPoints, hold_s: np.ndarray) -> Cases:
    """One case per sample; ``time_fraction`` is the sample's share of the chunk."""
    total_s = float(np.sum(hold_s))
    return Cases(
        names=("",) * hold_s.size,
        time_fraction=hold_s / total_s if total_s > 0 else np.zeros_like(hold_s),
        wheel_load_n=np.asarray(points.wheel_load_n, dtype=float),
        side_force_n=np.asarray(points.side_force_n, dtype=float),
        tractive_force_n=np.asarray(points.tractive_force_n, dtype=float),
        # reverse travel turns the bearings as fast as forward travel
        speed_rpm=np.abs(np.asarray(points.speed_rpm, dtype=float)),
    )


def flag_time_s(points: OperatingPoints, hold_s: np.ndarray) -> dict[str, float]:
    """Hold time [s] of the samples carrying each operating-point flag."""
    return {flag: float(np.sum(hold_s[np.asarray(getattr(points, flag), dtype=bool)]))
            for flag in FLAGS}


def with_cases(study: Study, cases: Cases, temperature_c: np.ndarray | None = None) -> Study:
    """The study with ``cases``; a per-case temperature [C] replaces the lubrication's."""
    if temperature_c is not None and study.lubrication is not None:
        lubrication = dataclasses.replace(study.lubrication,
                                          temperature_k=temperature_c + CELSIUS_ZERO_K)
        return dataclasses.replace(study, cases=cases, lubrication=lubrication)
    return dataclasses.replace(study, cases=cases)


def sample_temperature_c(samples: Samples, study: Study) -> np.ndarray:
    """Logged temperature [C], else the lubrication's, else 0 (no modified life)."""
    if "temperature_C" in samples.channels:
        return samples.channels["temperature_C"]
    if study.lubrication is None:
        return np.zeros(len(samples))
    default_k = np.broadcast_to(study.lubrication.temperature_k, (1,))[0]
    return np.full(len(samples), float(default_k) - CELSIUS_ZERO_K)
