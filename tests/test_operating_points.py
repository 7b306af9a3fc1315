"""Load cases written as pressures and flows or as lateral accelerations, end to end."""

import copy
import json
import math

import pytest
from click.testing import CliRunner
from hypothesis import given, settings
from hypothesis import strategies as st

from conftest import BASE_DOCUMENT
from hubload.casefile import study_from_document
from hubload.cli import main
from hubload.engine import evaluate

MOTOR = {"displacement_cc": 3000, "half_mode": True}
VEHICLE = {"axle_load_kN": 30, "track_mm": 1500, "cog_height_mm": 900}


def document_with(cases, motor=None, vehicle=None, **wheel):
    document = copy.deepcopy(BASE_DOCUMENT)
    document["case"] = cases
    document["wheel"].update(wheel)
    if motor is not None:
        document["motor"] = motor
    if vehicle is not None:
        document["vehicle"] = vehicle
    return document


def hydraulic_case(name="drive", percent=100, **keys):
    return {"name": name, "time_percent": percent, **keys}


def check_json(path):
    result = CliRunner().invoke(main, ["check", path, "--json"])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


def test_400_bar_on_3000_cm3_gives_19_1_kNm_and_the_force_at_the_rolling_radius(
        document, write_case_file):
    # Common practice figure of the trade: 3000 cm3/rev at 400 bar, ideal -> 19.10 kN m.
    # Tractive force = T / rolling radius = 19.10 kN m / 0.5 m = 38.2 kN; speed 60 l/min /
    # 3 l/rev = 20 r/min.
    path = write_case_file(document_with(
        [hydraulic_case(wheel_load_kN=80, pressure_bar=400, flow_lpm=60)], MOTOR,
        rolling_radius_mm=500))
    case = check_json(path)["cases"][0]
    assert case["torque_Nm"] / 1e3 == pytest.approx(19.10, abs=0.01)
    assert case["tractive_force_kN"] == pytest.approx(400e5 * 3000e-6 / (2 * math.pi) / 0.5 / 1e3)
    assert case["speed_rpm"] == pytest.approx(20.0)
    assert case["flags"] == []


def test_efficiencies_enter_torque_and_speed_as_in_the_issue():
    # T = dp Vg eta_hm / (2 pi), n = Q eta_v / Vg (Esposito, Fluid Power with Applications,
    # 7th ed., ch. 6, from memory): 250 bar, 800 cm3, eta_hm 0.9 -> 2864.8 N m; 50 l/min,
    # eta_v 0.95 -> 59.375 r/min.
    motor = {"displacement_cc": 800, "efficiency_mechanical": 0.9, "efficiency_volumetric": 0.95}
    study = study_from_document(document_with(
        [hydraulic_case(wheel_load_kN=30, pressure_bar=250, flow_lpm=50)], motor))
    points = study.cases.operating
    assert points.torque_nm[0] == pytest.approx(250e5 * 800e-6 * 0.9 / (2 * math.pi))
    assert study.cases.speed_rpm[0] == pytest.approx(50 * 0.95 / 0.8)
    assert study.cases.tractive_force_n[0] == pytest.approx(points.torque_nm[0] / 0.4)


def test_half_mode_case_turns_twice_as_fast_with_half_the_torque():
    # N = Q eta_v / V_D and T = V_D p eta_m / (2 pi) (Esposito, Fluid Power with Applications,
    # 7th ed., ch. 6, from memory) with V_D halved; power T 2 pi N is unchanged.
    cases = [hydraulic_case("full", 50, wheel_load_kN=60, pressure_bar=200, flow_lpm=90),
             hydraulic_case("half", 50, wheel_load_kN=60, pressure_bar=200, flow_lpm=90,
                            mode="half")]
    study = study_from_document(document_with(cases, MOTOR))
    points = study.cases.operating
    assert study.cases.speed_rpm[1] == pytest.approx(2 * study.cases.speed_rpm[0])
    assert points.torque_nm[1] == pytest.approx(0.5 * points.torque_nm[0])
    assert points.shaft_power_w[1] == pytest.approx(points.shaft_power_w[0])


@settings(max_examples=40, deadline=None)
@given(pressure=st.floats(-300, 400), flow=st.one_of(st.just(0.0), st.floats(0.1, 120)),
       wheel=st.floats(5, 80), side=st.floats(-20, 20))
def test_hydraulic_case_loads_the_bearings_like_the_force_case_it_stands_for(
        pressure, flow, wheel, side):
    # Property: the bearings see only the ground forces (rigid-shaft statics), however the case
    # was written.
    motor = {"displacement_cc": 1200, "efficiency_mechanical": 0.92,
             "efficiency_volumetric": 0.96}
    hydraulic = study_from_document(document_with([hydraulic_case(
        wheel_load_kN=wheel, side_force_kN=side, pressure_bar=pressure, flow_lpm=flow)], motor))
    forces = study_from_document(document_with([hydraulic_case(
        wheel_load_kN=wheel, side_force_kN=side,
        tractive_force_kN=float(hydraulic.cases.tractive_force_n[0]) / 1e3,
        speed_rpm=float(hydraulic.cases.speed_rpm[0]))]))
    for label in ("outboard", "inboard"):
        one, other = evaluate(hydraulic).bearings[label], evaluate(forces).bearings[label]
        assert one.radial_n[0] == pytest.approx(other.radial_n[0], rel=1e-9)
        assert one.axial_n[0] == pytest.approx(other.axial_n[0], rel=1e-9)


def test_negative_pressure_brakes_the_wheel(document, write_case_file):
    # The wheel drives the motor as a pump: braking torque dp Vg / (2 pi eta_hm)
    # (Esposito, 7th ed., ch. 5, from memory) = 100 bar x 1000 cm3 / (2 pi 0.9) = 1768 N m.
    motor = {"displacement_cc": 1000, "efficiency_mechanical": 0.9}
    case = check_json(write_case_file(document_with(
        [hydraulic_case(wheel_load_kN=20, pressure_bar=-100, flow_lpm=30)], motor)))["cases"][0]
    assert case["torque_Nm"] == pytest.approx(-100e5 * 1000e-6 / (2 * math.pi * 0.9))
    assert case["tractive_force_kN"] == pytest.approx(case["torque_Nm"] / 0.4 / 1e3)


def test_outer_and_inner_wheel_from_the_vehicle_block(document, write_case_file):
    # Steady-state lateral load transfer (Milliken & Milliken, RCVD, ch. 18, from memory):
    # 30 kN axle, 0.3 g, h 0.9 m, t 1.5 m -> 15 +- 5.4 kN; side forces W a_y.
    cases = [hydraulic_case("outer", 50, lateral_accel_g=0.3, speed_rpm=30),
             hydraulic_case("inner", 50, lateral_accel_g=-0.3, speed_rpm=30)]
    outer, inner = check_json(write_case_file(document_with(cases, vehicle=VEHICLE)))["cases"]
    assert outer["wheel_load_kN"] == pytest.approx(20.4)
    assert inner["wheel_load_kN"] == pytest.approx(9.6)
    assert outer["side_force_kN"] == pytest.approx(20.4 * 0.3)
    assert inner["side_force_kN"] == pytest.approx(-9.6 * 0.3)


def test_vehicle_block_without_lateral_acceleration_gives_half_the_axle_load():
    # Static equilibrium of a symmetric axle at rest: each wheel carries half; no side force.
    study = study_from_document(document_with(
        [hydraulic_case(speed_rpm=30)], vehicle=VEHICLE))
    assert study.cases.wheel_load_n[0] == pytest.approx(15e3)
    assert study.cases.side_force_n[0] == 0.0


def test_given_wheel_load_and_side_force_override_the_derived_ones():
    # Derived values by Milliken & Milliken, RCVD, ch. 18 (from memory): W = A/2 + A a_y h / t
    # and S = W a_y; a value the file gives replaces its derived one.
    cases = [hydraulic_case("load given", 50, wheel_load_kN=12, lateral_accel_g=0.2, speed_rpm=9),
             hydraulic_case("side given", 50, side_force_kN=1.5, lateral_accel_g=0.2,
                            speed_rpm=9)]
    study = study_from_document(document_with(cases, vehicle=VEHICLE))
    assert list(study.cases.wheel_load_n) == pytest.approx([12e3, 15e3 + 30e3 * 0.2 * 0.9 / 1.5])
    assert list(study.cases.side_force_n) == pytest.approx([12e3 * 0.2, 1.5e3])


def test_tractive_force_above_adhesion_is_capped_and_flagged(document, write_case_file):
    # Wong, Theory of Ground Vehicles, 4th ed., sec. 1.3 (from memory): F <= mu W.
    cases = [hydraulic_case("push", 50, wheel_load_kN=10, tractive_force_kN=9, speed_rpm=5),
             hydraulic_case("brake", 50, wheel_load_kN=10, tractive_force_kN=-9, speed_rpm=5)]
    path = write_case_file(document_with(cases, adhesion_mu=0.5))
    push, brake = check_json(path)["cases"]
    assert push["tractive_force_kN"] == pytest.approx(5.0)
    assert brake["tractive_force_kN"] == pytest.approx(-5.0)
    assert push["flag_codes"] == ["slip"]
    assert push["flags"][0].startswith("wheel would slip: force capped at 5.00 kN")
    text = CliRunner().invoke(main, ["check", path]).output
    assert "wheel would slip" in " ".join(text.split())


def test_default_adhesion_is_0_6():
    # Default mu = 0.6 (common practice for tyres on dry ground): cap 0.6 x 10 kN = 6 kN
    # (Wong, Theory of Ground Vehicles, 4th ed., sec. 1.3, from memory: F <= mu W).
    study = study_from_document(document_with(
        [hydraulic_case(wheel_load_kN=10, tractive_force_kN=7, speed_rpm=5)]))
    assert study.cases.tractive_force_n[0] == pytest.approx(6e3)


def test_pressure_and_speed_above_the_motor_rating_are_flagged(write_case_file):
    motor = {**MOTOR, "max_pressure_bar": 350, "max_speed_rpm": 30}
    cases = [hydraulic_case("hard", 50, wheel_load_kN=90, pressure_bar=380, flow_lpm=30),
             hydraulic_case("fast", 25, wheel_load_kN=90, pressure_bar=100, flow_lpm=60,
                            mode="half"),
             hydraulic_case("force", 25, wheel_load_kN=90, tractive_force_kN=45, speed_rpm=5)]
    hard, fast, force = check_json(write_case_file(document_with(
        cases, motor, rolling_radius_mm=500)))["cases"]
    assert hard["flag_codes"] == ["pressure_above_rating"]
    assert fast["flag_codes"] == ["speed_above_rating"]   # 60 / 1.5 = 40 r/min > 30
    # 45 kN x 0.5 m = 22.5 kN m needs 2 pi 22.5e3 / 3e-3 = 471 bar.
    assert force["pressure_bar"] == pytest.approx(2 * math.pi * 22.5e3 / 3e-3 / 1e5)
    assert force["flag_codes"] == ["pressure_above_rating"]


def test_side_and_tractive_force_beyond_the_friction_circle_are_flagged():
    # Friction circle (Wong, 4th ed., sec. 1.3, from memory): hypot(4, 4.5) = 6.02 kN exceeds
    # 0.6 x 10 kN, while 4 kN alone stays below it (no slip flag).
    study = study_from_document(document_with(
        [hydraulic_case(wheel_load_kN=10, side_force_kN=4.5, tractive_force_kN=4, speed_rpm=5)]))
    assert [flag.code for flag in study.cases.operating.flags(0)] == ["tyre_slides"]


def test_every_case_carries_the_operating_point_keys(document, write_case_file):
    # Wheel torque = tractive force x rolling radius (0.4 m here; rolling without slip).
    for case in check_json(write_case_file(document))["cases"]:
        assert {"torque_Nm", "tractive_force_kN", "wheel_load_kN", "side_force_kN",
                "flags"} <= set(case)
        assert case["torque_Nm"] == pytest.approx(case["tractive_force_kN"] * 0.4 * 1e3)


# -- bad input ---------------------------------------------------------------------------------

def run_bad(path):
    result = CliRunner().invoke(main, ["check", path])
    assert result.exit_code == 2, result.output
    assert "Traceback" not in result.output
    message = result.output.strip()
    assert message.count("\n") == 0, message
    return message


@pytest.mark.parametrize("case, motor, vehicle, key_path, expected", [
    ({"pressure_bar": 200, "flow_lpm": 30, "speed_rpm": 10, "wheel_load_kN": 9}, MOTOR, None,
     "case[0].pressure_bar", "only one of"),
    ({"pressure_bar": 200, "flow_lpm": 30, "tractive_force_kN": 3, "wheel_load_kN": 9}, MOTOR,
     None, "case[0].pressure_bar", "do not give tractive_force_kN too"),
    ({"pressure_bar": 200, "wheel_load_kN": 9}, MOTOR, None, "case[0].flow_lpm", "go together"),
    ({"pressure_bar": 200, "flow_lpm": 30, "wheel_load_kN": 9}, None, None,
     "case[0].pressure_bar", "needs a [motor] block"),
    ({"pressure_bar": 200, "flow_lpm": 30, "wheel_load_kN": 9, "mode": "half"},
     {"displacement_cc": 500}, None, "case[0].mode", "no half-displacement mode"),
    ({"speed_rpm": 10, "wheel_load_kN": 9, "mode": "half"}, None, None, "case[0].mode",
     "needs a [motor] block"),
    ({"pressure_bar": 200, "flow_lpm": 30, "wheel_load_kN": 9, "mode": "hafl"}, MOTOR, None,
     "case[0].mode", "did you mean 'half'"),
    ({"pressure_bar": 200, "flow_lpm": -3, "wheel_load_kN": 9}, MOTOR, None,
     "case[0].flow_lpm", ">= 0"),
    ({"speed_rpm": 10}, None, None, "case[0].wheel_load_kN", "[vehicle] block"),
    ({"speed_rpm": 10, "lateral_accel_g": -0.9}, None, VEHICLE, "case[0].lateral_accel_g",
     "wheel would lift"),
    ({"speed_rpm": 10, "wheel_load_kN": 9}, {"displacement_cc": 500, "efficiency_mechanical": 1.2},
     None, "motor.efficiency_mechanical", "<= 1"),
    ({"speed_rpm": 10, "wheel_load_kN": 9}, {"half_mode": True}, None,
     "motor.displacement_cc", "missing required key"),
    ({"speed_rpm": 10, "wheel_load_kN": 9}, None, {**VEHICLE, "track": 3}, "vehicle.track",
     "did you mean 'track_mm'"),
])
def test_bad_operating_input_names_the_case_and_exits_2(write_case_file, case, motor, vehicle,
                                                        key_path, expected):
    document = document_with([hydraulic_case("climb", **case)], motor, vehicle)
    message = run_bad(write_case_file(document))
    assert key_path in message and expected in message


def test_wheel_lift_message_names_the_case_and_the_lift_off_acceleration(write_case_file):
    # Lift-off at t / 2h = 1.5 / 1.8 = 0.83 g (Gillespie 1992, ch. 9, from memory).
    document = document_with([hydraulic_case("tight turn", speed_rpm=10, lateral_accel_g=-0.9)],
                             vehicle=VEHICLE)
    message = run_bad(write_case_file(document))
    assert "'tight turn'" in message and "0.83 g" in message
