"""Machine files end to end, the physics: operations -> wheel ends -> lives (hubload machine).

The model's own free-body, mirror and load-transfer checks are in tests/model/test_machine.py;
these check what the file, the conversion and the command add to them.
"""

import json
import math
import tempfile
import tomllib
from pathlib import Path

import pytest
import sympy
import tomli_w
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

import hubload
from machinesupport import (G, MACHINES, WHEEL_END, machine_document, machine_json, operation,
                            run, wheel, write_machine)


# -- the free body of the machine, from the file's numbers -------------------------------------

def test_axle_loads_balance_forces_and_pitch_moments_about_the_cog(tmp_path):
    # Rigid body in the machine's plane of symmetry, solved by sympy (Meriam & Kraige, Statics:
    # equilibrium; composite centre of mass): contact points s ahead of and L - s behind the
    # combined CoG, h below it; gravity m g (-sin theta, -cos theta) in machine axes with
    # tan theta = grade; the ground's forces along X add to m g (a_x + sin theta) (Newton).
    op = operation(payload_kg=1500.0, accel_g=-0.2, grade_percent=-10.0, speed_kmh=8.0)
    found = machine_json(tmp_path, machine_document([op], machine__rolling_resistance=0.03))
    mass = 4000 + 1500
    s = sympy.Rational(4000 * 1100 - 1500 * 800, mass) / 1000
    h = sympy.Rational(4000 * 900 + 1500 * 1000, mass) / 1000
    wheelbase = sympy.Rational(24, 10)
    theta = sympy.atan(sympy.Rational(-10, 100))
    front, rear, along = sympy.symbols("front rear along")
    weight = mass * sympy.nsimplify(G)
    solution = sympy.solve([
        sympy.Eq(front + rear, weight * sympy.cos(theta)),
        sympy.Eq(along, weight * (sympy.Rational(-2, 10) + sympy.sin(theta))),
        # moments about the CoG (y component of r x F): z F_x - x F_z with z = -h
        sympy.Eq(-h * along - s * front + (wheelbase - s) * rear, 0)], [front, rear, along])
    loads = {name: wheel(found, name)["cases"][0]["wheel_load_kN"] * 1000
             for name in ("front left", "front right", "rear left", "rear right")}
    assert loads["front left"] + loads["front right"] == pytest.approx(
        float(solution[front]), rel=1e-9)
    assert loads["rear left"] + loads["rear right"] == pytest.approx(
        float(solution[rear]), rel=1e-9)


def test_wheel_loads_add_to_the_weight_normal_to_the_ground_on_grade_and_cross_slope(tmp_path):
    # Normal component of gravity m g cos(theta) cos(phi) for grade theta and roll angle phi
    # (ISO 8855 yaw-pitch-roll angles, from memory; rotation matrices of any dynamics text).
    op = operation(payload_kg=800.0, grade_percent=12.0, cross_slope_percent=-9.0,
                   lateral_accel_g=0.05, mirror=False)
    found = machine_json(tmp_path, machine_document([op]))
    total = sum(w["cases"][0]["wheel_load_kN"] for w in found["wheel_ends"]) * 1000
    expected = 4800 * G * math.cos(math.atan(0.12)) * math.cos(math.atan(-0.09))
    assert total == pytest.approx(expected, rel=1e-12)


def test_static_axle_loads_by_the_lever_rule(tmp_path):
    # Lever rule (Meriam & Kraige, Statics; Gillespie 1992, ch. 2). Hand example: 4000 kg at
    # 1.10 m behind the front axle of a 2.40 m wheelbase and 1500 kg 0.80 m ahead of it:
    # front = g (4000 * 1.30 + 1500 * 3.20) / 2.40 = 40,861.0 N, rear = g (4000 * 1.10 -
    # 1500 * 0.80) / 2.40 = 13,075.5 N; each wheel half of its axle's load.
    found = machine_json(tmp_path, machine_document([operation(payload_kg=1500.0,
                                                               speed_kmh=0.0)]))
    assert wheel(found, "front left")["cases"][0]["wheel_load_kN"] == pytest.approx(
        40.8610 / 2, abs=1e-4)
    assert wheel(found, "rear right")["cases"][0]["wheel_load_kN"] == pytest.approx(
        13.0755 / 2, abs=1e-4)


# -- symmetry --------------------------------------------------------------------------------

def test_a_symmetric_machine_in_straight_travel_gives_left_and_right_the_same_lives(tmp_path):
    # Mirror symmetry of the free body (Meriam & Kraige, Statics): nothing pushes sideways.
    ops = [operation("travel", 60.0, 10.0), operation("climb", 25.0, 4.0, grade_percent=15.0,
                                                        payload_kg=1000.0),
           operation("brake", 15.0, 8.0, accel_g=-0.3)]
    found = machine_json(tmp_path, machine_document(ops, machine__rolling_resistance=0.04))
    for axle in ("front", "rear"):
        left, right = wheel(found, f"{axle} left"), wheel(found, f"{axle} right")
        assert left["cases"] == right["cases"]
        assert left["governing_life"]["life_h"] == pytest.approx(
            right["governing_life"]["life_h"], rel=1e-12)
        assert all(case["side_force_kN"] == 0 for case in left["cases"])


def test_a_left_turn_equals_a_right_turn_with_the_wheels_swapped(tmp_path):
    # Mirror symmetry of a machine symmetric left to right (Meriam & Kraige, Statics).
    def turn(sign):
        folder = tmp_path / ("left" if sign > 0 else "right")
        folder.mkdir()
        return machine_json(folder, machine_document([operation(
            lateral_accel_g=0.18 * sign, cross_slope_percent=5.0 * sign, mirror=False)]))
    left_turn, right_turn = turn(1), turn(-1)
    for axle in ("front", "rear"):
        for side, other in (("left", "right"), ("right", "left")):
            a, b = wheel(left_turn, f"{axle} {side}"), wheel(right_turn, f"{axle} {other}")
            for key in ("wheel_load_kN", "side_force_kN", "tractive_force_kN", "speed_rpm"):
                assert a["cases"][0][key] == pytest.approx(b["cases"][0][key], rel=1e-12,
                                                           abs=1e-12)
            assert a["governing_life"]["life_h"] == pytest.approx(
                b["governing_life"]["life_h"], rel=1e-9)
    assert left_turn["machine"]["l10_h"] == pytest.approx(right_turn["machine"]["l10_h"],
                                                          rel=1e-9)


def test_an_oscillating_axle_shows_no_lateral_load_transfer(tmp_path):
    # A pendulum axle with its pivot at ground level takes no roll moment (statics of the
    # pivoted axle; Milliken & Milliken 1995, ch. 18, from memory): its wheels stay equally
    # loaded in a turn, and the other axle moves F_y h / t between its wheels.
    op = operation(lateral_accel_g=0.2, mirror=False)
    found = machine_json(tmp_path, machine_document([op], axle__oscillating1=True))
    rear = [wheel(found, f"rear {side}")["cases"][0]["wheel_load_kN"] for side in ("left",
                                                                                  "right")]
    assert rear[0] == pytest.approx(rear[1], rel=1e-12)
    front = [wheel(found, f"front {side}")["cases"][0]["wheel_load_kN"] for side in ("left",
                                                                                    "right")]
    assert (front[1] - front[0]) / 2 == pytest.approx(0.2 * 4000 * G * 0.9 / 1.5 / 1000,
                                                      rel=1e-12)


def test_a_mirrored_operation_spends_half_its_time_each_way(tmp_path):
    # The duty of a machine that turns both ways (issue contract: mirror = true by default).
    found = machine_json(tmp_path, machine_document([operation(lateral_accel_g=0.15)]))
    cases = wheel(found, "front left")["cases"]
    assert [c["time_fraction"] for c in cases] == [0.5, 0.5]
    assert cases[0]["side_force_kN"] < 0 < cases[1]["side_force_kN"]   # inside, then outside


# -- properties --------------------------------------------------------------------------------

operation_values = st.fixed_dictionaries({
    "payload_kg": st.floats(0, 1500), "speed_kmh": st.floats(6, 15),  # R > t / 2
    "accel_g": st.floats(-0.15, 0.15), "lateral_accel_g": st.floats(-0.12, 0.12),
    "grade_percent": st.floats(-10, 10), "cross_slope_percent": st.floats(-8, 8),
})


def lives(document):
    with tempfile.TemporaryDirectory() as folder:
        found = hubload.machine(write_machine(Path(folder), document)).to_dict()
    return ([w["governing_life"]["life_h"] for w in found["wheel_ends"]],
            found["machine"], found["governing_life"]["life_h"])


@settings(max_examples=15, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(values=st.lists(operation_values, min_size=2, max_size=3),
       split=st.integers(0, 2), fraction=st.floats(0.1, 0.9))
def test_splitting_an_operation_into_two_copies_leaves_every_life_unchanged(values, split,
                                                                           fraction):
    # Palmgren-Miner linear damage (Palmgren 1924; Miner 1945): damage adds over time, so an
    # operation spent as two copies with the same total time changes no life.
    split %= len(values)
    ops = [operation(f"op {i}", 100.0 / len(values), **v) for i, v in enumerate(values)]
    copies = [dict(ops[split], name="first copy", time_percent=ops[split]["time_percent"]
                   * fraction),
              dict(ops[split], name="second copy", time_percent=ops[split]["time_percent"]
                   * (1 - fraction))]
    halves = ops[:split] + copies + ops[split + 1:]
    whole, parts = lives(machine_document(ops)), lives(machine_document(halves))
    assert parts[0] == pytest.approx(whole[0], rel=1e-9)
    assert parts[1]["l10_h"] == pytest.approx(whole[1]["l10_h"], rel=1e-9)
    assert parts[1]["l10m_h"] == pytest.approx(whole[1]["l10m_h"], rel=1e-9)
    assert parts[2] == pytest.approx(whole[2], rel=1e-9)


@settings(max_examples=15, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(height=st.floats(500, 1200), extra=st.floats(50, 400),
       accel=st.floats(0.05, 0.2), speed=st.floats(6, 12))  # a turn wider than half the track
def test_more_cog_height_never_lengthens_the_outside_wheels_life_in_a_turn(height, extra,
                                                                          accel, speed):
    # Lateral load transfer grows with the CoG height (Gillespie 1992, ch. 9): the outside
    # wheel of a steady level left turn (the right one, rigid axles) carries more load and
    # more side force, and its bearings never last longer for it.
    def outside_lives(cog_height_mm):
        document = machine_document([operation(speed_kmh=speed, lateral_accel_g=accel,
                                               mirror=False)],
                                    machine__cog_height_mm=cog_height_mm)
        found, _, _ = lives(document)
        return found[1], found[3]   # front right, rear right
    low, high = outside_lives(height), outside_lives(height + extra)
    assert high[0] <= low[0] * (1 + 1e-12)
    assert high[1] <= low[1] * (1 + 1e-12)


def test_each_rigid_axle_reproduces_the_per_wheel_vehicle_lateral_transfer(tmp_path):
    # The load-case file's [vehicle] rule for one wheel, W = A / 2 + A a_y h / t and S = W a_y
    # (Gillespie 1992, ch. 9), is what a rigid axle of a machine on level ground gives its
    # wheels when nothing accelerates along the travel: the outside wheel of a left turn (front
    # right) with the axle's load, track and the CoG height must get the same forces and life.
    accel = 0.17
    found = machine_json(tmp_path, machine_document([operation(lateral_accel_g=accel,
                                                               mirror=False)]))
    axle_kN = sum(wheel(found, f"front {side}")["cases"][0]["wheel_load_kN"]
                  for side in ("left", "right"))
    outside = wheel(found, "front right")
    single = dict(tomllib.loads(WHEEL_END.read_text()),
                  vehicle={"axle_load_kN": axle_kN, "track_mm": 1500.0, "cog_height_mm": 900.0},
                  case=[{"name": "left turn, outside wheel", "time_percent": 100.0,
                         "lateral_accel_g": accel,
                         "speed_rpm": outside["cases"][0]["speed_rpm"]}])
    path = tmp_path / "single.toml"
    path.write_text(tomli_w.dumps(single))
    checked = run("check", path, "--json")
    assert checked.exit_code == 0, checked.output
    case = json.loads(checked.output)["cases"][0]
    assert case["wheel_load_kN"] == pytest.approx(outside["cases"][0]["wheel_load_kN"], rel=1e-12)
    assert case["side_force_kN"] == pytest.approx(outside["cases"][0]["side_force_kN"], rel=1e-12)
    assert json.loads(checked.output)["governing_life"]["life_h"] == pytest.approx(
        outside["governing_life"]["life_h"], rel=1e-9)

def test_the_machine_life_is_every_bearing_in_series_with_the_weibull_slope_of_rollers(tmp_path):
    # Bearings in series, L = (sum L_k^-e)^(-1/e), e = 9/8 for roller bearings
    # (Lundberg & Palmgren 1952, as given in Harris & Kotzalas, Essential Concepts of Bearing
    # Technology, 5th ed., 2007; from memory): eight bearings of four wheel ends.
    found = hubload.machine(MACHINES / "yard_loader_machine.toml").to_dict()
    for key in ("l10_h", "l10m_h"):
        lives = [b[key] for w in found["wheel_ends"] for b in w["bearings"].values()]
        assert len(lives) == 8
        expected = sum(life ** -1.125 for life in lives) ** (-1 / 1.125)
        assert found["machine"][key] == pytest.approx(expected, rel=1e-12)
    weakest = wheel(found, found["governing_life"]["weakest_wheel_end"]["name"])
    shortest = min(w["governing_life"]["life_h"] for w in found["wheel_ends"])
    assert weakest["governing_life"]["life_h"] == pytest.approx(shortest, rel=1e-12)


def test_an_axle_without_wheel_end_carries_load_but_has_no_results(tmp_path):
    # Issue contract; lever rule (Meriam & Kraige, Statics): the front wheels' loads do not
    # depend on whether the rear axle has results.
    document = machine_document([operation()])
    with_rear = machine_json(tmp_path, document)
    del document["axle"][1]["wheel_end"]
    document["axle"][1]["rolling_radius_mm"] = 395.0
    folder = tmp_path / "front only"
    folder.mkdir()
    front_only = machine_json(folder, document)
    assert [w["name"] for w in front_only["wheel_ends"]] == ["front left", "front right"]
    assert wheel(front_only, "front left")["cases"] == wheel(with_rear, "front left")["cases"]
