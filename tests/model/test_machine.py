"""Wheel forces and speeds of a two-axle machine (hubload.model.machine)."""

from dataclasses import replace

import numpy as np
import pytest
import sympy
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from hubload.model import machine as mm
from hubload.model import operating

G = 9.80665  # standard gravity, 3rd CGPM 1901


def rigid_machine(front_track=1.6, rear_track=1.6, cog_height=1.0, drive="equal-torque",
                  radii=(0.5, 0.5, 0.5, 0.5), front_driven=True, rear_driven=True):
    return mm.Machine(mass_kg=5000.0, cog_behind_front_m=1.2, cog_height_m=cog_height,
                      wheelbase_m=2.5, front=mm.Axle(front_track, front_driven),
                      rear=mm.Axle(rear_track, rear_driven), rolling_radius_m=radii,
                      drive=drive)


def operations(**given):
    base = dict(payload_kg=0.0, payload_behind_front_m=-0.8, payload_height_m=0.9,
                speed_ms=2.0, longitudinal_accel_g=0.0, lateral_accel_g=0.0, grade_rad=0.0,
                cross_slope_rad=0.0, adhesion_mu=0.9, rolling_resistance=0.0)
    base.update(given)
    return mm.Operations(**base)


# -- free body of the whole machine, solved by sympy ------------------------------------------

def rotation_x(angle):
    return sympy.Matrix([[1, 0, 0], [0, sympy.cos(angle), -sympy.sin(angle)],
                         [0, sympy.sin(angle), sympy.cos(angle)]])


def rotation_y(angle):
    return sympy.Matrix([[sympy.cos(angle), 0, sympy.sin(angle)], [0, 1, 0],
                         [-sympy.sin(angle), 0, sympy.cos(angle)]])


def free_body_solution(machine, op):
    """Newton-Euler equations of the rigid machine, solved by sympy.

    Independent of the model's formulas: gravity comes from the rotation matrices of the
    ground's attitude (ISO 8855 yaw-pitch-roll; nose up by the grade, left side up by the cross
    slope), the moments from sympy cross products about the centre of gravity (Meriam &
    Kraige, Statics: rigid-body equilibrium; composite centre of mass). The closures are the
    modelling rules: drive forces T / r_i (equal torque) or k W_i (by load), rolling resistance
    f W_i, each axle's side force shared in proportion to its wheel loads, and per axle either
    (rigid) its own side force times the CoG height taken by its wheel loads, or (oscillating)
    the moment balance of the axle about its pivot (no roll moment passes the pivot).
    A given tractive demand is balanced by an external force at ground level on the centreline.
    """
    p = {key: sympy.nsimplify(value) for key, value in op.items()}
    g = sympy.nsimplify(G)
    mass = machine.mass_kg + p["payload"]
    behind = (machine.mass_kg * sympy.nsimplify(machine.cog_behind_front_m)
              + p["payload"] * p["payload_behind"]) / mass
    height = (machine.mass_kg * sympy.nsimplify(machine.cog_height_m)
              + p["payload"] * p["payload_height"]) / mass
    wheelbase = sympy.nsimplify(machine.wheelbase_m)
    tracks = [sympy.nsimplify(machine.front.track_m), sympy.nsimplify(machine.rear.track_m)]
    load = sympy.symbols("w0:4")
    lateral = sympy.symbols("y0:4")
    drive = sympy.symbols("d0:4")
    torque, ratio, external = sympy.symbols("torque ratio external")
    f = p["rolling_resistance"]
    # contact points relative to the CoG, machine axes X forward, Y left, Z up
    points = [sympy.Matrix([behind - wheelbase * (i // 2), tracks[i // 2] / 2 * (1 - 2 * (i % 2)),
                            -height]) for i in range(4)]
    forces = [sympy.Matrix([drive[i] - f * load[i], lateral[i], load[i]]) for i in range(4)]
    attitude = rotation_y(-sympy.atan(p["grade_tan"])) * rotation_x(sympy.atan(p["cross_tan"]))
    gravity = mass * g * attitude.T * sympy.Matrix([0, 0, -1])
    inertia = mass * g * sympy.Matrix([p["accel_x"], p["accel_y"], 0])
    has_demand = "demand" in p
    push = sympy.Matrix([external if has_demand else 0, 0, 0])
    force_balance = sum(forces, sympy.zeros(3, 1)) + push + gravity - inertia
    moment_balance = sum((r.cross(F) for r, F in zip(points, forces)), sympy.zeros(3, 1))
    moment_balance += sympy.Matrix([0, 0, -height]).cross(push)
    equations = list(force_balance) + list(moment_balance)
    driven = [machine.front.driven] * 2 + [machine.rear.driven] * 2
    for i in range(4):
        if not driven[i]:
            equations.append(drive[i])
        elif machine.drive == "equal-torque":
            equations.append(drive[i] - torque / sympy.nsimplify(machine.rolling_radius_m[i]))
        else:
            equations.append(drive[i] - ratio * load[i])
    if has_demand:
        equations.append(sum(drive) - p["demand"])
    one_oscillates = machine.front.oscillating or machine.rear.oscillating
    for axle, spec in enumerate((machine.front, machine.rear)):
        left, right = 2 * axle, 2 * axle + 1
        equations.append(lateral[left] * load[right] - lateral[right] * load[left])
        roll_moment = (tracks[axle] / 2) * (load[left] - load[right])
        side = lateral[left] + lateral[right]
        if spec.oscillating:
            equations.append(roll_moment + sympy.nsimplify(spec.pivot_height_m) * side)
        elif not one_oscillates:
            equations.append(roll_moment + height * side)
    unknowns = [*load, *lateral, *drive, torque if machine.drive == "equal-torque" else ratio]
    if has_demand:
        unknowns.append(external)
    solutions = sympy.solve(equations, unknowns, dict=True)
    assert len(solutions) == 1
    return {key: float(value) for key, value in solutions[0].items()}, load, lateral, drive


def model_operation(op):
    return operations(
        payload_kg=op["payload"], payload_behind_front_m=op["payload_behind"],
        payload_height_m=op["payload_height"], speed_ms=3.0,
        longitudinal_accel_g=op["accel_x"], lateral_accel_g=op["accel_y"],
        grade_rad=np.arctan(op["grade_tan"]), cross_slope_rad=np.arctan(op["cross_tan"]),
        adhesion_mu=0.9, rolling_resistance=op["rolling_resistance"],
        tractive_demand_n=op.get("demand", np.nan))


FREE_BODY_OP = dict(payload=800, payload_behind=-0.9, payload_height=0.7, accel_x=0.08,
                    accel_y=0.15, grade_tan=17 / 144, cross_tan=33 / 544, rolling_resistance=0.04)


@pytest.mark.parametrize("machine, op", [
    (rigid_machine(front_track=1.5, rear_track=1.7), FREE_BODY_OP),
    (rigid_machine(drive="by-load"), {**FREE_BODY_OP, "accel_x": -0.15, "cross_tan": -40 / 399}),
    (replace(rigid_machine(drive="by-load", front_driven=False),
             front=mm.Axle(1.6, False, oscillating=True, pivot_height_m=0.55)), FREE_BODY_OP),
    (replace(rigid_machine(radii=(0.5, 0.55, 0.6, 0.6)),
             rear=mm.Axle(1.8, True, oscillating=True)), {**FREE_BODY_OP, "demand": 9000.0}),
    (rigid_machine(drive="by-load", rear_driven=False),
     {**FREE_BODY_OP, "accel_y": -0.2, "grade_tan": -13 / 84, "demand": -6000.0}),
])
def test_wheel_forces_solve_the_free_body_of_the_machine(machine, op):
    # Sympy solves the rigid machine's six equilibrium equations with the modelling closures
    # (see free_body_solution); the model must give the same loads, side forces and
    # tractive forces. This also checks the normal loads add to m g cos(theta) cos(phi)
    # and that pitch, roll and yaw balance about the CoG.
    solution, load, lateral, drive = free_body_solution(machine, op)
    result = mm.wheel_forces(machine, model_operation(op))
    assert not result.capped.any() and not result.lifted.any()
    inboard = [-1, 1, -1, 1]
    for i in range(4):
        assert result.wheel_load_n[i, 0] == pytest.approx(solution[load[i]], rel=1e-9)
        assert result.side_force_n[i, 0] == pytest.approx(inboard[i] * solution[lateral[i]],
                                                          rel=1e-9, abs=1e-6)
        assert result.tractive_force_n[i, 0] == pytest.approx(solution[drive[i]], rel=1e-9,
                                                              abs=1e-6)
        assert result.longitudinal_force_n[i, 0] == pytest.approx(
            solution[drive[i]] - op["rolling_resistance"] * solution[load[i]], rel=1e-9)
    mass = machine.mass_kg + op["payload"]
    cos_grade, cos_cross = [1 / np.sqrt(1 + op[k] ** 2) for k in ("grade_tan", "cross_tan")]
    assert result.wheel_load_n.sum() == pytest.approx(mass * G * cos_grade * cos_cross, rel=1e-12)


# -- hand examples ----------------------------------------------------------------------------

def test_static_axle_loads_by_the_lever_rule_with_a_bucket_ahead_of_the_front_axle():
    # Lever rule, moments about each axle (Meriam & Kraige, Statics; Gillespie 1992, ch. 2).
    # Hand example: machine 4000 kg at 1.30 m behind the front axle (mid-wheelbase of 2.60 m)
    # carries 39,226.6 N, half on each axle: 19,613.3 N. A 1000 kg payload 0.65 m ahead of
    # the front axle puts 9,806.65 * (2.60 + 0.65) / 2.60 = 12,258.3 N on the front axle and
    # lifts the rear by 9,806.65 * 0.65 / 2.60 = 2,451.7 N.
    # Front 19,613.3 + 12,258.3 = 31,871.6 N; rear 19,613.3 - 2,451.7 = 17,161.6 N.
    machine = mm.Machine(4000.0, 1.30, 1.0, 2.60, mm.Axle(1.6, True), mm.Axle(1.6, True),
                         (0.5,) * 4)
    result = mm.wheel_forces(machine, operations(payload_kg=1000.0,
                                                 payload_behind_front_m=-0.65, speed_ms=0.0))
    assert result.axle_load_n[:, 0] == pytest.approx([31_871.6, 17_161.6], abs=0.1)
    assert result.wheel_load_n[:, 0] == pytest.approx([15_935.8] * 2 + [8_580.8] * 2, abs=0.1)


def test_slope_angle_of_a_100_percent_grade_is_45_degrees():
    # Grade in percent is rise over run (tan theta), common practice.
    assert mm.slope_angle_rad(100.0) == pytest.approx(np.pi / 4)


def test_wheel_speeds_in_a_left_turn_follow_rigid_body_rotation():
    # Rigid body in plane rotation, v = omega r (Meriam & Kraige, Dynamics). Hand example:
    # v = 2 m/s at a_y = 0.2 g: R = 4 / (0.2 * 9.80665) = 2.0394 m, omega = v / R.
    # Track 1.6 m: the inside (left) wheel runs on R - 0.8 = 1.2394 m at 1.2155 m/s, the outside
    # (right) on 2.8394 m at 2.7845 m/s; rear track 1.8 m: 1.1174 and 2.8826 m/s.
    result = mm.wheel_forces(rigid_machine(rear_track=1.8),
                             operations(speed_ms=2.0, lateral_accel_g=0.2))
    assert result.speed_ms[:, 0] == pytest.approx([1.2155, 2.7845, 1.1174, 2.8826], abs=1e-4)
    assert not result.too_tight[0]


def test_a_turn_tighter_than_half_the_track_is_flagged():
    # R = 1 / (0.3 * 9.80665) = 0.34 m is inside the machine (half track 0.8 m); lateral
    # acceleration at standstill has no radius at all.
    result = mm.wheel_forces(rigid_machine(), operations(speed_ms=[1.0, 0.0, 3.0],
                                                         lateral_accel_g=[0.3, 0.1, 0.3]))
    assert result.too_tight.tolist() == [True, True, False]


def test_uphill_wheels_lift_at_the_static_stability_factor_on_a_cross_slope():
    # A rigid vehicle at rest tips on a tilt table when tan(phi) = t / (2 h) (Gillespie 1992,
    # ch. 9, static stability factor; from memory). Track 1.6 m, CoG 1.0 m: tan phi = 0.8.
    tipping = np.arctan(0.8)
    result = mm.wheel_forces(rigid_machine(), operations(
        speed_ms=0.0, cross_slope_rad=[tipping - 0.005, tipping + 0.005]))
    assert not result.lifted[:, 0].any()
    assert result.lifted[:, 1].tolist() == [True, False, True, False]


def test_the_demand_on_a_grade_is_grade_resistance_plus_rolling_resistance_only_while_rolling():
    # Tractive effort = rolling resistance f W cos(theta) + grade resistance W sin(theta) +
    # m a (Wong, Theory of Ground Vehicles, 4th ed., ch. 3, from memory); a machine held at
    # rest on the grade does not roll, so it needs only W sin(theta) (common practice).
    # 5000 kg on a 10 % grade, f = 0.05: W sin = 4879.0 N, f W cos = 2439.5 N.
    grade = np.arctan(0.10)
    result = mm.wheel_forces(rigid_machine(), operations(
        speed_ms=[0.0, 1.0], grade_rad=grade, rolling_resistance=0.05))
    assert result.tractive_demand_n == pytest.approx([4879.0, 4879.0 + 2439.5], abs=0.1)


def test_equal_torque_gives_force_inverse_to_the_rolling_radius():
    # One pressure, one displacement: one torque T, F_i = T / r_i (docs/operating-points.md;
    # Esposito, Fluid Power with Applications, 7th ed., from memory). Front radii 0.5 m, rear
    # 0.6 m: T (2 / 0.5 + 2 / 0.6) = D, so the front wheels take 2 / 7.333 = 0.2727 D each and
    # the rear 0.2273 D, with D = 5000 kg * 0.1 g = 4903.3 N on level ground.
    machine = rigid_machine(radii=(0.5, 0.5, 0.6, 0.6))
    result = mm.wheel_forces(machine, operations(longitudinal_accel_g=0.1))
    demand = 5000 * 0.1 * G
    assert result.tractive_force_n[:, 0] / demand == pytest.approx(
        [0.272727, 0.272727, 0.227273, 0.227273], abs=1e-6)


def test_a_slipping_wheel_is_held_at_mu_w_and_the_others_keep_their_share():
    # Adhesion limit mu W (Wong, Theory of Ground Vehicles, 4th ed., sec. 1.3, from memory).
    # Rule of the model: equal torque, the lost force is not moved to the other wheels. The
    # front inside wheel is the lightest (the turn and the acceleration both unload it).
    result = mm.wheel_forces(rigid_machine(), operations(
        longitudinal_accel_g=0.2, lateral_accel_g=0.3, adhesion_mu=0.3))
    asked = 5000 * 0.2 * G / 4
    load = result.wheel_load_n[:, 0]
    assert result.capped[:, 0].tolist() == [True, False, False, False]
    assert 0.3 * load[0] < asked
    assert result.tractive_force_n[:, 0] == pytest.approx(
        [0.3 * load[0], asked, asked, asked], rel=1e-12)


@pytest.mark.parametrize("machine", [rigid_machine(), rigid_machine(front_driven=False),
                                     rigid_machine(radii=(0.45, 0.5, 0.55, 0.6), cog_height=1.3)])
def test_a_wheel_held_at_adhesion_leaves_the_machine_in_yaw_and_lateral_balance(machine):
    # Yaw balance about the CoG of the forces the tyres give (Gillespie 1992, ch. 6;
    # Meriam & Kraige, Statics): sum x_i F_y,i - y_i F_x,i = 0 with the capped wheel's force,
    # not the share it asked for; the lateral forces still add to m a_y. A steady turn has no
    # yaw acceleration whatever the drive does.
    result = mm.wheel_forces(machine, operations(
        longitudinal_accel_g=0.25, lateral_accel_g=0.3, adhesion_mu=0.3, rolling_resistance=0.03))
    assert result.capped[:, 0].any()
    behind = machine.cog_behind_front_m
    x = np.array([behind, behind, behind - machine.wheelbase_m, behind - machine.wheelbase_m])
    y = np.array([machine.front.track_m, -machine.front.track_m,
                  machine.rear.track_m, -machine.rear.track_m]) / 2
    lateral_left = result.side_force_n[:, 0] * np.array([-1, 1, -1, 1])   # + left
    yaw_nm = np.sum(x * lateral_left - y * result.longitudinal_force_n[:, 0])
    assert abs(yaw_nm) < 1e-9 * machine.mass_kg * G
    assert lateral_left.sum() == pytest.approx(machine.mass_kg * G * 0.3, rel=1e-12)


def test_braking_in_a_gentle_turn_unloads_the_rear_outside_wheel_more_with_a_higher_cog():
    # Longitudinal transfer m a_x g h / L (Gillespie 1992, ch. 2) outweighs the lateral one
    # F_y,rear h / t (ch. 9) at 0.4 g braking and 0.05 g lateral: the rear outside wheel
    # gets lighter as the CoG rises, so "a higher CoG never lowers the outside wheel's load"
    # holds only for the wheels on the axle that longitudinal transfer loads.
    low, high = (mm.wheel_forces(rigid_machine(cog_height=h), operations(
        longitudinal_accel_g=-0.4, lateral_accel_g=0.05)) for h in (0.8, 1.6))
    assert high.wheel_load_n[3, 0] < low.wheel_load_n[3, 0]
    assert high.wheel_load_n[1, 0] > low.wheel_load_n[1, 0]


# -- properties -------------------------------------------------------------------------------

@st.composite
def machines(draw, symmetric=True):
    wheelbase = draw(st.floats(1.8, 3.5))
    drive = draw(st.sampled_from(mm.DRIVE_RULES))
    front_driven, rear_driven = draw(st.sampled_from([(True, True), (True, False),
                                                      (False, True)]))
    oscillating = draw(st.sampled_from([None, "front", "rear"]))
    pivot = draw(st.floats(0.0, 0.8))
    axles = [mm.Axle(draw(st.floats(1.2, 2.4)), driven, oscillating == name, pivot)
             for name, driven in (("front", front_driven), ("rear", rear_driven))]
    front_radius, rear_radius = draw(st.floats(0.3, 0.8)), draw(st.floats(0.3, 0.8))
    return mm.Machine(
        mass_kg=draw(st.floats(2000, 20_000)),
        cog_behind_front_m=wheelbase * draw(st.floats(0.25, 0.75)),
        cog_height_m=draw(st.floats(0.5, 2.0)), wheelbase_m=wheelbase,
        front=axles[0], rear=axles[1],
        rolling_radius_m=(front_radius, front_radius, rear_radius, rear_radius),
        drive=drive)


def operation_columns(draw, size, **fixed):
    def column(name, low, high):
        if name in fixed:
            return np.full(size, fixed[name], dtype=float)
        return np.array(draw(st.lists(st.floats(low, high), min_size=size, max_size=size)))
    return mm.Operations(
        payload_kg=column("payload_kg", 0, 5000),
        payload_behind_front_m=column("payload_behind_front_m", -1.5, 2.0),
        payload_height_m=column("payload_height_m", 0.3, 2.5),
        speed_ms=column("speed_ms", 0.5, 8.0),
        longitudinal_accel_g=column("longitudinal_accel_g", -0.4, 0.4),
        lateral_accel_g=column("lateral_accel_g", -0.4, 0.4),
        grade_rad=column("grade_rad", -0.3, 0.3),
        cross_slope_rad=column("cross_slope_rad", -0.2, 0.2),
        adhesion_mu=column("adhesion_mu", 0.3, 1.0),
        rolling_resistance=column("rolling_resistance", 0.0, 0.1))


@st.composite
def operation_sets(draw, size=4, **fixed):
    return operation_columns(draw, size, **fixed)


PER_WHEEL = ("wheel_load_n", "side_force_n", "tractive_force_n", "longitudinal_force_n",
             "speed_ms", "capped", "lifted")


@settings(max_examples=60, deadline=None)
@given(machine=machines(), ops=operation_sets(lateral_accel_g=0.0, cross_slope_rad=0.0))
def test_a_symmetric_machine_in_straight_travel_loads_left_and_right_alike(machine, ops):
    # Mirror symmetry of the free body (Meriam & Kraige, Statics): nothing pushes sideways.
    result = mm.wheel_forces(machine, ops)
    for name in PER_WHEEL:
        values = getattr(result, name)
        np.testing.assert_allclose(values[0], values[1], rtol=1e-12, atol=1e-9)
        np.testing.assert_allclose(values[2], values[3], rtol=1e-12, atol=1e-9)
    np.testing.assert_allclose(result.side_force_n, 0.0, atol=1e-9)


@settings(max_examples=60, deadline=None)
@given(machine=machines(), ops=operation_sets())
def test_a_left_turn_equals_the_mirrored_right_turn_with_the_wheels_swapped(machine, ops):
    # Mirror symmetry of a machine that is symmetric left to right (Meriam & Kraige, Statics):
    # negating a_y and the cross slope swaps left and right; every wheel's force in its own
    # (inboard) convention is unchanged, the axles' lateral forces change sign.
    mirrored, index = mm.mirrored_operations(ops)
    original = mm.wheel_forces(machine, ops)
    mirror = mm.wheel_forces(machine, mirrored)
    swap = list(mm.MIRRORED_WHEELS)
    for name in PER_WHEEL:
        np.testing.assert_allclose(getattr(mirror, name)[swap],
                                   getattr(original, name)[:, index], rtol=1e-9, atol=1e-6)
    np.testing.assert_allclose(mirror.axle_side_force_n, -original.axle_side_force_n[:, index],
                               rtol=1e-9, atol=1e-6)
    np.testing.assert_allclose(mirror.axle_load_n, original.axle_load_n[:, index], rtol=1e-12)


def test_mirror_picks_the_operations_with_a_lateral_component_and_is_its_own_inverse():
    ops = operations(lateral_accel_g=[0.0, 0.2, 0.0, -0.1], cross_slope_rad=[0.0, 0.0, 0.05, 0.0])
    mirrored, index = mm.mirrored_operations(ops)
    assert index.tolist() == [1, 2, 3]
    assert mirrored.lateral_accel_g.tolist() == [-0.2, 0.0, 0.1]
    assert mirrored.cross_slope_rad.tolist() == [0.0, -0.05, 0.0]
    twice, _ = mm.mirrored_operations(mirrored)
    assert twice.lateral_accel_g.tolist() == [0.2, 0.0, -0.1]


@settings(max_examples=60, deadline=None)
@given(machine=machines(), ops=operation_sets(longitudinal_accel_g=0.0, grade_rad=0.0,
                                              cross_slope_rad=0.0, rolling_resistance=0.0))
def test_each_rigid_axle_reproduces_the_per_wheel_lateral_transfer_of_the_operating_model(
        machine, ops):
    # hubload.model.operating gives one axle's wheels in a steady turn on level ground:
    # W = A / 2 + A a_y h / t and S = W a_y (Gillespie 1992, ch. 9; Milliken & Milliken,
    # ch. 18), a_y + for the outside wheel. Two rigid axles on level ground without
    # acceleration must give each axle exactly that, with A the axle's load and h the CoG
    # height of machine and payload.
    machine = replace(machine, front=replace(machine.front, oscillating=False),
                      rear=replace(machine.rear, oscillating=False))
    result = mm.wheel_forces(machine, ops)
    _, _, height = mm.combined_centre(machine, mm.columns(ops))
    accel = ops.lateral_accel_g
    for axle, track in enumerate((machine.front.track_m, machine.rear.track_m)):
        axle_load = result.axle_load_n[axle]
        left = operating.cornering_wheel_load_n(axle_load, -accel, height, track)
        right = operating.cornering_wheel_load_n(axle_load, accel, height, track)
        np.testing.assert_allclose(result.wheel_load_n[2 * axle], left, rtol=1e-9)
        np.testing.assert_allclose(result.wheel_load_n[2 * axle + 1], right, rtol=1e-9)
        np.testing.assert_allclose(result.side_force_n[2 * axle],
                                   operating.cornering_side_force_n(left, -accel),
                                   rtol=1e-9, atol=1e-6)
        np.testing.assert_allclose(result.side_force_n[2 * axle + 1],
                                   operating.cornering_side_force_n(right, accel),
                                   rtol=1e-9, atol=1e-6)


@pytest.mark.parametrize("oscillating", ["front", "rear"])
def test_an_oscillating_axle_takes_no_load_transfer_and_the_other_axle_takes_all(oscillating):
    # An oscillating (pendulum) axle with its pivot at ground level takes no roll moment; the
    # other axle carries all of it (rigid-body statics of the pivoted axle, Milliken &
    # Milliken ch. 18, from memory). Level ground, 0.2 g left turn, 5000 kg, CoG 1.0 m: the
    # whole machine's roll moment 0.2 * 5000 * 9.80665 * 1.0 N m moves
    # that moment / track from the left to the right wheel of the rigid axle.
    machine = rigid_machine(front_track=1.5, rear_track=1.8)
    pendulum = replace(getattr(machine, oscillating), oscillating=True, pivot_height_m=0.0)
    machine = replace(machine, **{oscillating: pendulum})
    result = mm.wheel_forces(machine, operations(lateral_accel_g=0.2))
    loads = result.wheel_load_n[:, 0]
    swinging, rigid = ((0, 1), (2, 3)) if oscillating == "front" else ((2, 3), (0, 1))
    rigid_track = 1.8 if oscillating == "front" else 1.5
    assert loads[swinging[0]] == pytest.approx(loads[swinging[1]], rel=1e-12)
    assert (loads[rigid[1]] - loads[rigid[0]]) / 2 == pytest.approx(
        0.2 * 5000 * G * 1.0 / rigid_track, rel=1e-12)


def test_an_oscillating_axle_with_a_raised_pivot_transfers_its_own_force_times_pivot_height():
    # Moments of the pendulum axle about its pivot (Meriam & Kraige, Statics): its lateral
    # force F_yf at the ground acts with the pivot height as lever, so its wheel loads differ
    # by 2 F_yf h_p / t. Level ground, equal torque, f = 0: F_yf = F_y (L - s) / L, the lever
    # rule about the CoG; 5000 kg, s = 1.2 m, L = 2.5 m, 0.2 g: F_yf = 5099.5 N; h_p = 0.6 m,
    # t = 1.5 m: difference 2 * 5099.5 * 0.6 / 1.5 = 4079.6 N.
    machine = rigid_machine(front_track=1.5)
    machine = replace(machine, front=replace(machine.front, oscillating=True,
                                             pivot_height_m=0.6))
    result = mm.wheel_forces(machine, operations(lateral_accel_g=0.2))
    assert result.wheel_load_n[1, 0] - result.wheel_load_n[0, 0] == pytest.approx(4079.6,
                                                                                  abs=0.1)


def outside_wheels(ops):
    lateral = ops.lateral_accel_g + np.cos(ops.grade_rad) * np.sin(ops.cross_slope_rad)
    return lateral > 0  # leftward ground force: the right wheels are outside / downhill


@settings(max_examples=80, deadline=None)
@given(machine=machines(), ops=operation_sets(size=2, longitudinal_accel_g=0.0, grade_rad=0.0,
                                              rolling_resistance=0.0),
       extra_height=st.floats(0.05, 1.0))
def test_a_higher_cog_never_lowers_the_outside_wheels_load_or_side_force_in_a_level_turn(
        machine, ops, extra_height):
    # Lateral load transfer grows with the CoG height (Gillespie 1992, ch. 9): in a turn or
    # on a cross slope without longitudinal transfer, the outside wheels' loads and side
    # forces never fall as the CoG rises.
    low = mm.wheel_forces(machine, ops)
    high = mm.wheel_forces(replace(machine, cog_height_m=machine.cog_height_m + extra_height),
                           ops)
    assume(not low.lifted.any() and not high.lifted.any())
    right = outside_wheels(ops)
    for left_wheel, right_wheel in ((0, 1), (2, 3)):
        outside = [np.where(right, r.wheel_load_n[right_wheel], r.wheel_load_n[left_wheel])
                   for r in (low, high)]
        side = [np.where(right, r.side_force_n[right_wheel], r.side_force_n[left_wheel])
                for r in (low, high)]
        assert np.all(outside[1] >= outside[0] * (1 - 1e-12))
        assert np.all(np.abs(side[1]) >= np.abs(side[0]) * (1 - 1e-12) - 1e-9)


@settings(max_examples=80, deadline=None)
@given(machine=machines(), ops=operation_sets(size=1, rolling_resistance=0.0),
       extra_height=st.floats(0.05, 1.0))
def test_a_higher_cog_never_lowers_the_load_of_the_outside_wheel_the_transfer_loads(
        machine, ops, extra_height):
    # With longitudinal transfer (Gillespie 1992, ch. 2) only the axle it loads keeps the
    # property: the front one braking or downhill, the rear one accelerating or uphill.
    low = mm.wheel_forces(machine, ops)
    high = mm.wheel_forces(replace(machine, cog_height_m=machine.cog_height_m + extra_height),
                           ops)
    assume(not (low.lifted.any() or high.lifted.any() or low.capped.any() or high.capped.any()))
    right = outside_wheels(ops)
    rearward = ops.longitudinal_accel_g + np.sin(ops.grade_rad) > 0
    left_wheel, right_wheel = np.where(rearward, 2, 0), np.where(rearward, 3, 1)
    wheel = np.where(right, right_wheel, left_wheel)
    columns = np.arange(wheel.size)
    assert np.all(high.wheel_load_n[wheel, columns]
                  >= low.wheel_load_n[wheel, columns] * (1 - 1e-12))


@settings(max_examples=80, deadline=None)
@given(machine=machines(), ops=operation_sets(size=1))
def test_both_drive_rules_deliver_the_whole_demand_and_the_net_force_moves_the_machine(
        machine, ops):
    # Newton's second law along travel (Gillespie 1992, ch. 2; Wong 2008, ch. 3): the net
    # ground forces on the tyres (tractive less rolling resistance) add to m g (a_x +
    # sin theta) whichever way the driven wheels share it, as long as no wheel is capped.
    results = [mm.wheel_forces(replace(machine, drive=rule), ops) for rule in mm.DRIVE_RULES]
    assume(not any(r.capped.any() for r in results))
    mass, _, _ = mm.combined_centre(machine, mm.columns(ops))
    motion = mass * G * (ops.longitudinal_accel_g + np.sin(ops.grade_rad))
    for result in results:
        np.testing.assert_allclose(result.longitudinal_force_n.sum(axis=0), motion,
                                   rtol=1e-9, atol=1e-6)
    np.testing.assert_allclose(results[0].tractive_force_n.sum(axis=0),
                               results[1].tractive_force_n.sum(axis=0), rtol=1e-9, atol=1e-6)


def test_operations_broadcast_over_a_leading_axis():
    # Variants on a leading axis, operations on the last (DEVELOPERS.md, arrays).
    ops = operations(payload_kg=np.array([[0.0], [1500.0]]), lateral_accel_g=[0.1, -0.2, 0.0])
    result = mm.wheel_forces(rigid_machine(), ops)
    assert result.wheel_load_n.shape == (4, 2, 3)
    assert result.too_tight.shape == (2, 3)
    single = mm.wheel_forces(rigid_machine(), operations(payload_kg=1500.0,
                                                         lateral_accel_g=[0.1, -0.2, 0.0]))
    np.testing.assert_allclose(result.wheel_load_n[:, 1], single.wheel_load_n, rtol=1e-15)
