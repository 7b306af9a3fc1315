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
