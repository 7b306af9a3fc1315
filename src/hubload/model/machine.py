"""Forces and speeds at the four wheels of a two-axle machine in steady operation.

A rigid machine (no suspension, no body roll) on plane ground: operating mass
plus a payload, two axles, one wheel end per side. Elementwise numpy over the
operations (the operation axis last); per-wheel results stack the wheels first,
in the order of :data:`WHEELS`. SI: kg, m, N, m/s, rad; accelerations in g.

Machine axes (ISO 8855 vehicle axes; from memory): X forward along the
ground, Y to the left, Z normal to the ground, up. The ground's attitude is
given by two Euler angles (yaw, pitch, roll sequence): the grade theta is the
inclination of the direction of travel (+ uphill ahead, tan theta = grade
percent / 100) and the cross slope phi the roll angle of the machine about its
own X axis (+ left side higher), as a transverse inclinometer on the machine
reads it. Gravity then has the components g (-sin theta, -cos theta sin phi,
-cos theta cos phi) in machine axes [5]. A cross fall C measured in plan,
perpendicular to the path, gives tan phi = C cos theta.

Signs (docs/conventions.md): forces of the ground on the tyre; wheel load W
up; side force + inboard of that wheel (a leftward ground force is - on a left
wheel, + on a right one); tractive force + driving. A left turn has a_y > 0
and its outside wheels on the right.

Modelling choices: steady state, the accelerations a_x, a_y are those of the
CoG along the ground (a_y = v^2 / R), not accelerometer readings; no
rotational acceleration, wheel inertia neglected. Steer angles neglected:
every force is taken in machine axes (at a steered wheel side and tractive
force mix by the steer angle). The CoG lies on the centreline. Rolling
resistance f W acts on every rolling wheel (v > 0) at the contact patch; the
forward shift f r of the normal force that carries it is neglected in the
pitch balance (about f r / L of the normal load). A given tractive demand
beyond what the motion needs is balanced by an external force along X at
ground level on the centreline (pushing into a pile low down): the axle loads
stay as the motion sets them.

References
----------
[1] T. D. Gillespie, Fundamentals of Vehicle Dynamics, SAE 1992: ch. 2 (axle
    loads from weight, acceleration and grade), ch. 6 (steady-state cornering:
    axle lateral forces from the yaw balance), ch. 9 (lateral load transfer of
    a rigid vehicle, dW = F_y h / t), ch. 10 (rolling resistance). From memory.
[2] J. Y. Wong, Theory of Ground Vehicles, 4th ed., Wiley 2008, sec. 1.3
    (tractive effort limited by adhesion, mu W) and ch. 3 (normal loads of a
    vehicle on a grade with tractive effort). From memory.
[3] W. F. Milliken, D. L. Milliken, Race Car Vehicle Dynamics, SAE 1995,
    ch. 18 (lateral load transfer per axle; through a roll centre without roll
    stiffness only the geometric part F_y h_rc / t). From memory.
[4] J. L. Meriam, L. G. Kraige, Engineering Mechanics, vol. 1 Statics (rigid
    body equilibrium, centre of mass of composite bodies) and vol. 2 Dynamics
    (v = omega r of a body in plane rotation).
[5] ISO 8855:2011, Road vehicles - Vehicle dynamics and road-holding ability -
    Vocabulary (vehicle axes, yaw-pitch-roll angles). From memory.
[6] A. Esposito, Fluid Power with Applications, 7th ed., Pearson 2009,
    hydraulic circuit design (motors in parallel see one pressure; without a
    flow divider the motor with the least resistance takes the flow). From memory.
[7] Standard acceleration of gravity, 3rd CGPM (1901), as in ISO 80000-3.
"""

from __future__ import annotations

from dataclasses import dataclass, fields, replace

import numpy as np

STANDARD_GRAVITY_MS2 = 9.80665  # [7]
WHEELS = ("front-left", "front-right", "rear-left", "rear-right")
MIRRORED_WHEELS = (1, 0, 3, 2)  # index of each wheel's left-right counterpart
DRIVE_RULES = ("equal-torque", "by-load")
INBOARD_SIGN = (-1.0, 1.0, -1.0, 1.0)  # machine +Y (left) is outboard on a left wheel


@dataclass(frozen=True)
class Axle:
    """Track [m], driven, oscillating (pendulum); roll pivot height [m] if oscillating."""

    track_m: float
    driven: bool
    oscillating: bool = False
    pivot_height_m: float = 0.0


@dataclass(frozen=True)
class Machine:
    """The machine without payload.

    ``cog_behind_front_m`` [m] is measured from the front axle, + rearwards;
    ``rolling_radius_m`` gives the four wheels' rolling radii [m] in the order
    of :data:`WHEELS`; ``drive`` is one of :data:`DRIVE_RULES`. At least one
    axle is driven and at most one oscillates (checked at the file boundary).
    """

    mass_kg: float
    cog_behind_front_m: float
    cog_height_m: float
    wheelbase_m: float
    front: Axle
    rear: Axle
    rolling_radius_m: tuple
    drive: str = "equal-torque"


@dataclass(frozen=True)
class Operations:
    """Operations as columns: arrays that broadcast together (scalars allowed)."""

    payload_kg: np.ndarray
    payload_behind_front_m: np.ndarray  # payload CoG behind the front axle, - ahead of it
    payload_height_m: np.ndarray
    speed_ms: np.ndarray                # ground speed >= 0 in the direction of travel
    longitudinal_accel_g: np.ndarray    # + accelerating, - braking
    lateral_accel_g: np.ndarray         # + turning left
    grade_rad: np.ndarray               # + uphill ahead
    cross_slope_rad: np.ndarray         # + left side higher
    adhesion_mu: np.ndarray
    rolling_resistance: np.ndarray = 0.0
    tractive_demand_n: np.ndarray | None = None  # total of the machine; NaN: from the motion


@dataclass(frozen=True)
class WheelForces:
    """Results, the operations' shape last; per wheel (4, ...) in the order of :data:`WHEELS`."""

    axle_load_n: np.ndarray           # (2, ...) front, rear [N]
    axle_side_force_n: np.ndarray     # (2, ...) lateral ground force on each axle, + left [N]
    wheel_load_n: np.ndarray          # (4, ...) [N]
    side_force_n: np.ndarray          # (4, ...) + inboard of that wheel [N]
    tractive_force_n: np.ndarray      # (4, ...) motor's force T / r, + driving [N]
    longitudinal_force_n: np.ndarray  # (4, ...) ground on tyre along travel: tractive - f W [N]
    speed_ms: np.ndarray              # (4, ...) ground speed of each wheel [m/s]
    capped: np.ndarray                # (4, ...) tractive force cut to the adhesion limit
    lifted: np.ndarray                # (4, ...) W <= 0: the results no longer hold
    too_tight: np.ndarray             # (...) turn radius below half the wider track
    tractive_demand_n: np.ndarray     # (...) total asked of the driven wheels [N]


def slope_angle_rad(percent):
    """Slope angle [rad] from a slope in percent, theta = atan(percent / 100)."""
    return np.arctan(np.asarray(percent, dtype=float) / 100.0)


def columns(operations: Operations) -> Operations:
    """The operations as float arrays of one shape (at least 1-d); no demand -> NaN."""
    values = {f.name: getattr(operations, f.name) for f in fields(operations)}
    if values["tractive_demand_n"] is None:
        values["tractive_demand_n"] = np.nan
    arrays = np.broadcast_arrays(*(np.asarray(v, dtype=float) for v in values.values()),
                                 np.zeros(1))[:-1]
    return Operations(**{name: np.array(a) for name, a in zip(values, arrays)})


def combined_centre(machine: Machine, operations: Operations):
    """Mass [kg], CoG behind the front axle [m] and height [m] with the payload [4]."""
    mass_kg = machine.mass_kg + operations.payload_kg
    behind_m = (machine.mass_kg * machine.cog_behind_front_m
                + operations.payload_kg * operations.payload_behind_front_m) / mass_kg
    height_m = (machine.mass_kg * machine.cog_height_m
                + operations.payload_kg * operations.payload_height_m) / mass_kg
    return mass_kg, behind_m, height_m


def ground_resultant_n(mass_kg, operations: Operations):
    """The ground forces' resultant [N] the steady motion needs, in machine axes.

    Newton's second law with gravity g (-sin theta, -cos theta sin phi,
    -cos theta cos phi) in machine axes [1, 5]: returns (longitudinal
    m g (a_x + sin theta), + forward; lateral m g (a_y + cos theta sin phi),
    + left; normal m g cos theta cos phi). The cos theta on the cross-slope
    term belongs there: it is the lateral component of gravity for phi the
    roll angle about the machine's own X axis, not an approximation.
    """
    weight_n = mass_kg * STANDARD_GRAVITY_MS2
    cos_grade = np.cos(operations.grade_rad)
    longitudinal_n = weight_n * (operations.longitudinal_accel_g + np.sin(operations.grade_rad))
    lateral_n = weight_n * (operations.lateral_accel_g
                            + cos_grade * np.sin(operations.cross_slope_rad))
    normal_n = weight_n * cos_grade * np.cos(operations.cross_slope_rad)
    return longitudinal_n, lateral_n, normal_n


def tractive_demand_n(longitudinal_n, normal_n, operations: Operations):
    """Total force [N] the driven wheels must give: f N + m g (a_x + sin theta) [1, 2].

    The net ground force along travel is the motion's m g (a_x + sin theta)
    (:func:`ground_resultant_n`); the driven wheels give that plus the rolling
    resistance f W of every wheel, whose sum is f N = f m g cos theta cos phi
    (``rolling_resistance`` already 0 where the machine stands). A given
    demand (not NaN) replaces the derived one.
    """
    derived_n = operations.rolling_resistance * normal_n + longitudinal_n
    given_n = operations.tractive_demand_n
    return np.where(np.isnan(given_n), derived_n, given_n)


def axle_loads_n(longitudinal_n, normal_n, behind_m, height_m, wheelbase_m):
    """Front and rear axle loads [N]: lever rule plus longitudinal transfer [1, 2].

    Pitch moments about the CoG with every horizontal ground force at ground
    level: W_rear = (N s + F_x h) / L, W_front = N - W_rear, with s the CoG
    behind the front axle and F_x the net ground force along travel (+ forward).
    Accelerating or climbing loads the rear axle, braking or descending the
    front one.
    """
    rear_n = (normal_n * behind_m + longitudinal_n * height_m) / wheelbase_m
    return normal_n - rear_n, rear_n


def roll_levers_m(machine: Machine, height_m):
    """Levers [m] that give each axle's roll moment from the axles' lateral forces.

    ((c_ff, c_fr), (c_rf, c_rr)): M_front = c_ff F_yf + c_fr F_yr, M_rear = c_rf F_yf
    + c_rr F_yr, M = (W_right - W_left) t / 2. Rigid axles: each takes its own
    lateral force times the CoG height [1, ch. 9]. An oscillating axle takes its
    own lateral force times its pivot height (its moments about the pivot; none
    at ground level), the other axle the rest of the machine's F_y h [3].
    """
    zero = np.zeros_like(height_m)
    if machine.front.oscillating:
        pivot_m = machine.front.pivot_height_m + zero
        return (pivot_m, zero), (height_m - pivot_m, height_m)
    if machine.rear.oscillating:
        pivot_m = machine.rear.pivot_height_m + zero
        return (height_m, height_m - pivot_m), (zero, pivot_m)
    return (height_m, zero), (zero, height_m)


def drive_shares(machine: Machine, wheel_n):
    """Share of the total tractive force asked of each wheel (list of 4) [6].

    Equal torque: motors of one displacement in a parallel circuit see one
    pressure, hence one torque T; wheel i gives T / r_i, so its share is
    (1 / r_i) / sum(1 / r_j) over the driven wheels. By load: W_i over the
    driven wheels' total load. Undriven wheels: 0. The shares add to 1.
    """
    if machine.drive == "equal-torque":
        weights = [1.0 / np.asarray(radius_m, dtype=float)
                   for radius_m in machine.rolling_radius_m]
    elif machine.drive == "by-load":
        weights = list(wheel_n)
    else:
        raise ValueError(f"unknown drive rule {machine.drive!r}; expected one of {DRIVE_RULES}")
    driven = (machine.front.driven,) * 2 + (machine.rear.driven,) * 2
    weights = [w if is_driven else 0.0 * w for w, is_driven in zip(weights, driven)]
    total = sum(weights)
    return [np.divide(w, total, out=np.zeros(np.broadcast(w, total).shape), where=total != 0)
            for w in weights]


def drive_yaw_terms(machine: Machine, demand_n, axle_n, adhesion_mu):
    """Yaw moment of the tractive forces, sum Y_i F_i, as ``(constant_nm, kappa)`` [1, 4].

    sum Y_i F_i = constant_nm - kappa (roll moments of the driven axles), Y_i + left.
    Equal torque: D sum Y_i share_i (0 for equal left and right radii), kappa 0.
    By load: F_i = kappa W_i, kappa = D / (driven load) held at +-mu (where all
    driven wheels reach adhesion at once), and sum Y_i W_i = -M per axle.
    """
    if machine.drive == "by-load":
        driven_n = machine.front.driven * axle_n[0] + machine.rear.driven * axle_n[1]
        kappa = np.divide(demand_n, driven_n, out=np.zeros_like(demand_n), where=driven_n > 0)
        return np.zeros_like(demand_n), np.clip(kappa, -adhesion_mu, adhesion_mu)
    front_m, rear_m = 0.5 * machine.front.track_m, 0.5 * machine.rear.track_m
    arm_m = sum(y * share for y, share in zip((front_m, -front_m, rear_m, -rear_m),
                                              drive_shares(machine, None)))
    return demand_n * arm_m, np.zeros_like(demand_n)


def axle_side_forces_n(lateral_n, behind_m, height_m, wheelbase_m, rolling_resistance,
                       yaw_terms, levers_m, driven):
    """Lateral ground force on the front and rear axle [N], + left.

    Yaw balance about the CoG [1, ch. 6; 4]: s F_yf - (L - s) F_yr = sum Y_i F_x,i,
    F_x,i = F_i - f W_i, F_yf + F_yr = F_y. Rolling resistance adds f h F_y (roll
    balance: sum Y_i W_i = -F_y h), the drive :func:`drive_yaw_terms`. Equal left
    and right forces, f = 0: the lever rule F_yf = F_y (L - s) / L; forces in
    proportion to load on all wheels: F_y times the front share of the load.
    """
    constant_nm, kappa = yaw_terms
    (c_ff, c_fr), (c_rf, c_rr) = levers_m
    driven_lever_f_m = driven[0] * c_ff + driven[1] * c_rf
    driven_lever_r_m = driven[0] * c_fr + driven[1] * c_rr
    front_n = (((wheelbase_m - behind_m + rolling_resistance * height_m
                 - kappa * driven_lever_r_m) * lateral_n + constant_nm)
               / (wheelbase_m + kappa * (driven_lever_f_m - driven_lever_r_m)))
    return front_n, lateral_n - front_n


def split_axle(axle_n, side_n, roll_moment_nm, track_m):
    """Loads and lateral forces (+ left) [N] of an axle's (left, right) wheels.

    The roll moment moves M / t from the left to the right wheel [1, ch. 9]; the
    wheels share the axle's lateral force in proportion to their loads (equal
    friction use: statics leaves this split open) [1, 3].
    """
    transfer_n = roll_moment_nm / track_m
    loads_n = [0.5 * axle_n - transfer_n, 0.5 * axle_n + transfer_n]
    per_load = np.divide(side_n, axle_n, out=np.zeros_like(side_n), where=axle_n != 0)
    return loads_n, [per_load * load_n for load_n in loads_n]


def wheel_tractive_n(machine: Machine, demand_n, wheel_n, adhesion_mu):
    """Tractive force per wheel [N] and where it was capped at +-mu W (lists of 4) [2, 6].

    Each wheel asks D share_i (:func:`drive_shares`). A wheel asking more than
    mu W is held there, and the force it loses is not moved to the others.
    Equal torque: a parallel circuit would lose pressure and lower every
    wheel's torque; keeping the others at their asked-for share never
    under-states a wheel's force (the conservative side for its bearings) and
    invents no traction control. By load every driven wheel reaches the limit
    at once. Braking (negative) follows the same rules.
    """
    forces, capped = [], []
    for share, load_n in zip(drive_shares(machine, wheel_n), wheel_n):
        asked_n = demand_n * share
        limit_n = adhesion_mu * np.maximum(load_n, 0.0)
        forces.append(np.clip(asked_n, -limit_n, limit_n))
        capped.append(np.abs(asked_n) > limit_n)
    return forces, capped


def wheel_speeds_ms(speed_ms, lateral_accel_g, front_track_m, rear_track_m):
    """Ground speed [m/s] of each wheel (list of 4) and where the turn is too tight [4].

    The machine turns at the yaw rate omega = a_y g / v about a centre R = v^2 /
    (a_y g) from its CoG; a wheel t / 2 to the side runs at v -+ omega t / 2 =
    v (1 -+ t / (2 R)), the outside (right in a left turn) faster. The wheels'
    longitudinal offsets from the turn centre are neglected. Too tight: R below
    half the wider track, 2 v^2 < |a_y| g t; the inside wheel's speed is then
    negative (and a_y with v = 0 is always too tight).
    """
    accel_ms2 = lateral_accel_g * STANDARD_GRAVITY_MS2
    yaw_rate = np.divide(accel_ms2, speed_ms, out=np.zeros_like(accel_ms2), where=speed_ms > 0)
    half_f, half_r = 0.5 * yaw_rate * front_track_m, 0.5 * yaw_rate * rear_track_m
    speeds = [speed_ms - half_f, speed_ms + half_f, speed_ms - half_r, speed_ms + half_r]
    wider_m = np.maximum(front_track_m, rear_track_m)
    return speeds, 2.0 * speed_ms**2 < np.abs(accel_ms2) * wider_m


def balanced_with_the_tyres(machine: Machine, wheels_at, yaw_terms, iterations: int = 200):
    """The wheels of ``wheels_at(yaw_terms)`` with the yaw moment of the tractive forces the
    tyres give [1, ch. 6; 4].

    By load every driven wheel reaches adhesion at once, which :func:`drive_yaw_terms`
    already holds. With equal torque a wheel held at mu W gives less than its share, and the
    yaw moment sum Y_i F_i of the forces given shifts lateral force between the axles, so
    the loads and their limits: a fixed point, found by iterating (each step changes the
    moment by at most about mu h / L of the last change, where h / L < 1 / mu keeps the
    wheels on the ground in a capped turn). Where it does not settle within ``iterations``
    the last step stands: such an operation is flagged as capped all the same.
    """
    found = wheels_at(yaw_terms)
    if machine.drive != "equal-torque":
        return found
    arms_m = (0.5 * machine.front.track_m, -0.5 * machine.front.track_m,
              0.5 * machine.rear.track_m, -0.5 * machine.rear.track_m)
    constant_nm, kappa = yaw_terms
    for _ in range(iterations):
        moment_nm = sum(arm_m * force_n for arm_m, force_n in zip(arms_m, found[3]))
        if np.allclose(moment_nm, constant_nm, rtol=1e-13, atol=1e-9):
            break
        constant_nm = moment_nm
        found = wheels_at((constant_nm, kappa))
    return found


def stacked(per_wheel):
    """Wheel arrays stacked on a new first axis, broadcast to one shape."""
    return np.stack(np.broadcast_arrays(*per_wheel))


def wheels_of_axles(axle_n, axle_side_n, levers_m, machine: Machine):
    """Loads and lateral forces (+ left) [N] of the four wheels (lists of 4)."""
    wheel_n, lateral_n = [], []
    for axle_load_n, side_n, (lever_f_m, lever_r_m), track_m in zip(
            axle_n, axle_side_n, levers_m, (machine.front.track_m, machine.rear.track_m)):
        moment_nm = lever_f_m * axle_side_n[0] + lever_r_m * axle_side_n[1]
        loads_n, sides_n = split_axle(axle_load_n, side_n, moment_nm, track_m)
        wheel_n += loads_n
        lateral_n += sides_n
    return wheel_n, lateral_n


def wheel_forces(machine: Machine, operations: Operations) -> WheelForces:
    """Loads, forces and speeds of the four wheels for every operation [1-6].

    See the module docstring for axes, signs and modelling choices. A capped
    operation cannot hold the asked-for motion: its forces are what the tyres
    allow and its equilibrium is not exact. Lifted wheels and too tight turns
    are flagged for the caller to reject.
    """
    if machine.front.oscillating and machine.rear.oscillating:
        raise ValueError("at most one axle can oscillate: the machine has no roll support")
    ops = columns(operations)
    ops = replace(ops, rolling_resistance=np.where(ops.speed_ms > 0, ops.rolling_resistance, 0.0))
    mass_kg, behind_m, height_m = combined_centre(machine, ops)
    longitudinal_n, lateral_n, normal_n = ground_resultant_n(mass_kg, ops)
    demand_n = tractive_demand_n(longitudinal_n, normal_n, ops)
    axle_n = axle_loads_n(longitudinal_n, normal_n, behind_m, height_m, machine.wheelbase_m)
    levers_m = roll_levers_m(machine, height_m)

    def wheels_at(yaw_terms):
        axle_side_n = axle_side_forces_n(
            lateral_n, behind_m, height_m, machine.wheelbase_m, ops.rolling_resistance,
            yaw_terms, levers_m, (machine.front.driven, machine.rear.driven))
        wheel_n, lateral_wheel_n = wheels_of_axles(axle_n, axle_side_n, levers_m, machine)
        return (axle_side_n, wheel_n, lateral_wheel_n,
                *wheel_tractive_n(machine, demand_n, wheel_n, ops.adhesion_mu))

    axle_side_n, wheel_n, lateral_wheel_n, tractive_n, capped = balanced_with_the_tyres(
        machine, wheels_at, drive_yaw_terms(machine, demand_n, axle_n, ops.adhesion_mu))
    speeds, too_tight = wheel_speeds_ms(ops.speed_ms, ops.lateral_accel_g,
                                        machine.front.track_m, machine.rear.track_m)
    wheel_loads_n = stacked(wheel_n)
    tractive_forces_n = stacked(tractive_n)
    return WheelForces(
        axle_load_n=stacked(axle_n), axle_side_force_n=stacked(axle_side_n),
        wheel_load_n=wheel_loads_n,
        side_force_n=stacked([y * sign + 0.0  # + 0.0: no -0.0 for an unloaded side
                              for y, sign in zip(lateral_wheel_n, INBOARD_SIGN)]),
        tractive_force_n=tractive_forces_n,
        longitudinal_force_n=tractive_forces_n - ops.rolling_resistance * wheel_loads_n,
        speed_ms=stacked(speeds), capped=stacked(capped), lifted=wheel_loads_n <= 0.0,
        too_tight=too_tight, tractive_demand_n=demand_n)


def mirrored_operations(operations: Operations):
    """Left-right mirror images of the operations that have a lateral component.

    Returns ``(mirrored, index)``: the operations with a_y != 0 or phi != 0 (in
    any row of a leading axis), their lateral acceleration and cross slope
    negated, and their indices along the last axis of ``operations``. For a
    machine symmetric left to right, the mirror's results are the original's
    with the wheels swapped as in :data:`MIRRORED_WHEELS`; a turn one way and
    its mirror together make a duty that turns both ways.
    """
    ops = columns(operations)
    lateral = (ops.lateral_accel_g != 0) | (ops.cross_slope_rad != 0)
    index = np.flatnonzero(lateral.reshape(-1, lateral.shape[-1]).any(axis=0))
    picked = {f.name: getattr(ops, f.name)[..., index] for f in fields(ops)}
    picked["lateral_accel_g"] = -picked["lateral_accel_g"]
    picked["cross_slope_rad"] = -picked["cross_slope_rad"]
    return Operations(**picked), index
