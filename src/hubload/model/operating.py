"""Operating points: wheel forces and speed from the hydraulics and from the vehicle.

Every function is elementwise numpy and broadcasts over any array shape (the
case or sample axis last), so a measured log of millions of samples costs one
call. SI units throughout: pressure [Pa], displacement [m^3 per revolution],
flow [m^3/s], torque [N m], force [N], lengths [m], lateral acceleration in
units of g (dimensionless, as a_y / g).

Sign conventions (docs/conventions.md): a positive pressure difference drives
the wheel (the motor works as a motor, tractive force + driving); a negative
one brakes it (the wheel drives the motor, which then works as a pump against
the return pressure). Lateral acceleration is positive when this wheel is on
the outside of the turn; the side force of the ground on the tyre is then
positive, i.e. inboard.

References
----------
[1] A. Esposito, Fluid Power with Applications, 7th ed., Pearson 2009,
    ch. 5 (pumps: volumetric efficiency = actual / theoretical flow, mechanical
    efficiency = theoretical / actual torque) and ch. 6 (hydraulic motors:
    theoretical torque T = V_D p / (2 pi), actual torque = eta_m x theoretical,
    speed N = Q_T / V_D with Q_T = eta_v x actual flow). From memory; the same
    relations are in any fluid-power text.
[2] T. D. Gillespie, Fundamentals of Vehicle Dynamics, SAE 1992, ch. 9
    (quasi-static rollover of a rigid vehicle: moments about the outside tyre
    contact, F_zi t = M g t/2 - M a_y h, rollover threshold a_y/g = t/(2h),
    Eq. 9-1; equation number from memory).
[3] W. F. Milliken, D. L. Milliken, Race Car Vehicle Dynamics, SAE 1995,
    ch. 18 (steady-state lateral load transfer of a rigid vehicle,
    dW = W a_y h / t; from memory).
[4] J. Y. Wong, Theory of Ground Vehicles, 4th ed., Wiley 2008, sec. 1.3
    (tractive effort limited by adhesion: F_max = mu W; from memory).
[5] Rolling without slip: v = omega r; power = torque x angular speed (any
    mechanics text, e.g. J. L. Meriam, L. G. Kraige, Engineering Mechanics:
    Dynamics).
"""

from __future__ import annotations

import numpy as np

from hubload.model import statics
from hubload.units import SECONDS_PER_MINUTE

TWO_PI = 2.0 * np.pi
# Tyre-ground adhesion coefficient of pneumatic tyres on dry ground (common practice; Wong [4]
# tabulates 0.6-0.9 for dry earth and gravel roads, from memory): the default cap of a force.
DEFAULT_ADHESION_MU = 0.6


def effective_displacement_m3(displacement_m3, half_mode):
    """Displacement [m^3/rev] in use: halved where ``half_mode`` is true.

    A two-speed motor switched to half displacement turns twice as fast on the
    same flow and gives half the torque on the same pressure [1].
    """
    return np.where(half_mode, 0.5 * np.asarray(displacement_m3, dtype=float),
                    displacement_m3)


def hydraulic_torque_nm(pressure_pa, displacement_m3, efficiency_mechanical):
    """Shaft torque [N m] of a hydraulic motor at a pressure difference [Pa] [1].

    Motoring (dp >= 0): T = dp Vg eta_hm / (2 pi); the friction losses reduce
    the torque the shaft gives out. Braking (dp < 0, the wheel drives the motor
    as a pump): T = dp Vg / (2 pi eta_hm); the wheel must supply the friction
    losses as well, so the braking torque on the shaft exceeds the ideal one.
    """
    ideal_nm = np.asarray(pressure_pa, dtype=float) * displacement_m3 / TWO_PI
    return np.where(ideal_nm >= 0, ideal_nm * efficiency_mechanical,
                    ideal_nm / efficiency_mechanical)


def motor_speed_rpm(flow_m3s, displacement_m3, efficiency_volumetric, pressure_pa=0.0):
    """Shaft speed [r/min] from the flow through the motor [m^3/s] [1].

    Motoring (dp >= 0): n = Q eta_v / Vg; leakage bypasses the working chambers.
    Braking (dp < 0): the motor pumps, and the flow it delivers is the swept
    volume less leakage, n = Q / (Vg eta_v).
    """
    ideal_rpm = SECONDS_PER_MINUTE * np.asarray(flow_m3s, dtype=float) / displacement_m3
    return np.where(np.asarray(pressure_pa) >= 0, ideal_rpm * efficiency_volumetric,
                    ideal_rpm / efficiency_volumetric)


def motor_pressure_pa(torque_nm, displacement_m3, efficiency_mechanical):
    """Pressure difference [Pa] a motor needs for a shaft torque [N m] (inverse of
    :func:`hydraulic_torque_nm`, same sign convention) [1]."""
    ideal_pa = TWO_PI * np.asarray(torque_nm, dtype=float) / displacement_m3
    return np.where(ideal_pa >= 0, ideal_pa / efficiency_mechanical,
                    ideal_pa * efficiency_mechanical)


def motor_flow_m3s(speed_rpm, displacement_m3, efficiency_volumetric, pressure_pa=0.0):
    """Flow [m^3/s] through a motor at a shaft speed [r/min] (inverse of
    :func:`motor_speed_rpm`, same sign convention) [1]."""
    ideal_m3s = np.asarray(speed_rpm, dtype=float) * displacement_m3 / SECONDS_PER_MINUTE
    return np.where(np.asarray(pressure_pa) >= 0, ideal_m3s / efficiency_volumetric,
                    ideal_m3s * efficiency_volumetric)


def tractive_force_n(torque_nm, rolling_radius_m):
    """Longitudinal force [N] of the ground on the tyre from the wheel torque [N m]
    (steady state, rolling without slip: F = T / r) [4, 5]."""
    return np.asarray(torque_nm, dtype=float) / rolling_radius_m


def shaft_power_w(torque_nm, speed_rpm):
    """Mechanical power [W] at the motor shaft, P = T 2 pi n / 60 [5]; negative
    when the wheel brakes."""
    return np.asarray(torque_nm, dtype=float) * TWO_PI * np.asarray(speed_rpm) / SECONDS_PER_MINUTE


def cornering_wheel_load_n(axle_load_n, lateral_accel_g, cog_height_m, track_m):
    """Wheel load [N] in a steady turn: W = A/2 + A a_y h / t [2, 3].

    ``axle_load_n`` A is the static load on the axle, ``lateral_accel_g`` a_y
    is signed (+ this wheel outside the turn). Rigid vehicle: the axle's load
    transfer is taken with its own share of the weight and the CoG height; roll
    of the body and the suspension's roll-stiffness split are not modelled. A
    negative result means the wheel has lifted (the formula no longer holds).
    """
    return (0.5 * np.asarray(axle_load_n, dtype=float)
            + axle_load_n * np.asarray(lateral_accel_g) * cog_height_m / track_m)


def cornering_side_force_n(wheel_load_n, lateral_accel_g):
    """Side force [N] of the ground on the tyre in a steady turn, S = W a_y [2, 3].

    Each tyre carries lateral force in proportion to its load (equal friction
    use), so the two wheels of an axle add up to A a_y. Positive (inboard) on
    the outside wheel, negative (outboard) on the inside wheel.
    """
    return np.asarray(wheel_load_n, dtype=float) * np.asarray(lateral_accel_g)


def lift_off_accel_g(cog_height_m, track_m):
    """Lateral acceleration [g] at which the inside wheel's load reaches zero,
    a_y = t / (2 h) (static stability factor of a rigid vehicle) [2]."""
    with np.errstate(divide="ignore"):
        return np.asarray(track_m, dtype=float) / (2.0 * np.asarray(cog_height_m, dtype=float))


def adhesion_limit_n(wheel_load_n, adhesion_mu):
    """Largest longitudinal force [N] the tyre can transmit, mu W [4]; zero for a
    wheel without load."""
    return adhesion_mu * np.maximum(np.asarray(wheel_load_n, dtype=float), 0.0)


def adhesion_capped_force_n(force_n, wheel_load_n, adhesion_mu):
    """Tractive or braking force [N] capped at +-mu W, and where it was capped [4].

    Returns ``(capped_force_n, slips)``; ``slips`` is true where the asked-for
    force exceeds what the tyre can transmit (the wheel would spin or lock).
    """
    limit_n = adhesion_limit_n(wheel_load_n, adhesion_mu)
    force_n = np.asarray(force_n, dtype=float)
    return np.clip(force_n, -limit_n, limit_n), np.abs(force_n) > limit_n


def exceeds_friction_circle(tractive_force_n, side_force_n, wheel_load_n, adhesion_mu):
    """True where the combined ground force sqrt(F^2 + S^2) exceeds mu W: the tyre
    would slide (friction circle of an isotropic tyre) [4]."""
    return (statics.resultant(tractive_force_n, side_force_n)
            > adhesion_limit_n(wheel_load_n, adhesion_mu) * (1.0 + 1e-12))
