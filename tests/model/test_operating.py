"""Operating points from the hydraulics and from the vehicle (hubload.model.operating)."""

import numpy as np
import pytest
import sympy
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.optimize import brentq

from hubload.model import operating

BAR = 1e5
CM3 = 1e-6
LPM = 1e-3 / 60

efficiency = st.floats(0.5, 1.0)
pressure_pa = st.floats(0, 500 * BAR)
signed_pressure_pa = st.floats(-500 * BAR, 500 * BAR)
displacement_m3 = st.floats(50 * CM3, 10_000 * CM3)
flow_m3s = st.floats(0, 400 * LPM)
axle_load_n = st.floats(1e3, 200e3)
lateral_g = st.floats(-0.6, 0.6)
cog_m = st.floats(0.2, 2.0)
track_m = st.floats(0.8, 2.5)


# -- hydraulic torque and speed ---------------------------------------------------------------

def test_3000_cm3_motor_at_400_bar_ideal_gives_19_1_kNm():
    # Common practice figure of the trade: a 3000 cm3/rev motor gives 19.1 kN m at 400 bar
    # differential (T = dp Vg / 2 pi, ideal efficiency).
    torque = operating.hydraulic_torque_nm(400 * BAR, 3000 * CM3, 1.0)
    assert torque / 1e3 == pytest.approx(19.10, abs=0.01)


def test_speed_of_an_ideal_motor_is_flow_over_displacement():
    # Esposito, Fluid Power with Applications, 7th ed., ch. 6 (from memory): N = Q / V_D;
    # 60 l/min through a 500 cm3/rev motor turns it at 120 r/min.
    assert operating.motor_speed_rpm(60 * LPM, 500 * CM3, 1.0) == pytest.approx(120.0)


@settings(max_examples=100, deadline=None)
@given(dp=signed_pressure_pa, q=flow_m3s, vg=displacement_m3, eta_v=efficiency, eta_hm=efficiency)
def test_half_mode_doubles_speed_and_halves_torque_at_equal_flow_and_pressure(
        dp, q, vg, eta_v, eta_hm):
    # N = Q / V_D and T = V_D p / (2 pi) (Esposito, 7th ed., ch. 6, from memory), V_D halved.
    full = operating.effective_displacement_m3(vg, False)
    half = operating.effective_displacement_m3(vg, True)
    assert operating.motor_speed_rpm(q, half, eta_v, dp) == pytest.approx(
        2 * operating.motor_speed_rpm(q, full, eta_v, dp), rel=1e-12)
    assert operating.hydraulic_torque_nm(dp, half, eta_hm) == pytest.approx(
        0.5 * operating.hydraulic_torque_nm(dp, full, eta_hm), rel=1e-12, abs=1e-9)


@settings(max_examples=100, deadline=None)
@given(dp=pressure_pa, vg=displacement_m3, eta_hm=efficiency)
def test_efficiencies_below_one_never_raise_torque_per_pressure_when_motoring(dp, vg, eta_hm):
    # Actual torque = eta_m x theoretical torque of a motor (Esposito, 7th ed., ch. 6, from memory).
    assert (operating.hydraulic_torque_nm(dp, vg, eta_hm)
            <= operating.hydraulic_torque_nm(dp, vg, 1.0) * (1 + 1e-12))


@settings(max_examples=100, deadline=None)
@given(dp=st.floats(-500 * BAR, -1.0), vg=displacement_m3, eta_hm=efficiency)
def test_braking_wheel_supplies_the_friction_losses_too(dp, vg, eta_hm):
    # Pump operation (Esposito, 7th ed., ch. 5, from memory): the shaft torque needed is the
    # theoretical torque divided by the mechanical efficiency, so it is never below it.
    braking = operating.hydraulic_torque_nm(dp, vg, eta_hm)
    assert braking < 0
    assert abs(braking) >= abs(operating.hydraulic_torque_nm(dp, vg, 1.0)) * (1 - 1e-12)


@settings(max_examples=100, deadline=None)
@given(dp=signed_pressure_pa, q=flow_m3s, vg=displacement_m3, eta_v=efficiency, eta_hm=efficiency)
def test_energy_balance_of_motor_and_pump(dp, q, vg, eta_v, eta_hm):
    # Overall efficiency = volumetric x mechanical (Esposito, 7th ed., ch. 5 and 6, from memory):
    # a motor gives out eta_o times the hydraulic power dp Q; a pump (braking wheel) takes in
    # 1 / eta_o times the hydraulic power it delivers.
    torque = operating.hydraulic_torque_nm(dp, vg, eta_hm)
    speed = operating.motor_speed_rpm(q, vg, eta_v, dp)
    shaft_w = operating.shaft_power_w(torque, speed)
    hydraulic_w = dp * q
    overall = eta_v * eta_hm
    expected = hydraulic_w * overall if dp >= 0 else hydraulic_w / overall
    assert shaft_w == pytest.approx(expected, rel=1e-9, abs=1e-6)


@settings(max_examples=100, deadline=None)
@given(dp=signed_pressure_pa, q=flow_m3s, vg=displacement_m3, eta_v=efficiency, eta_hm=efficiency)
def test_pressure_and_flow_from_torque_and_speed_invert_the_motor_relations(
        dp, q, vg, eta_v, eta_hm):
    # Property: the force-case relations are the exact inverses of the hydraulic ones.
    torque = operating.hydraulic_torque_nm(dp, vg, eta_hm)
    speed = operating.motor_speed_rpm(q, vg, eta_v, dp)
    assert operating.motor_pressure_pa(torque, vg, eta_hm) == pytest.approx(dp, rel=1e-9,
                                                                             abs=1e-6)
    assert operating.motor_flow_m3s(speed, vg, eta_v, dp) == pytest.approx(q, rel=1e-9, abs=1e-15)


def test_functions_broadcast_over_a_leading_batch_axis_and_the_case_axis():
    # Variants on a leading axis, cases on the last one.
    pressures = np.array([100.0, 200.0, -150.0]) * BAR
    displacement = np.array([[500.0], [1000.0]]) * CM3
    torque = operating.hydraulic_torque_nm(pressures, displacement, 0.9)
    assert torque.shape == (2, 3)
    assert torque[1, 1] == pytest.approx(200 * BAR * 1000 * CM3 * 0.9 / (2 * np.pi))
    assert torque[0, 2] == pytest.approx(-150 * BAR * 500 * CM3 / 0.9 / (2 * np.pi))


# -- lateral load transfer ----------------------------------------------------------------------

def lift_off_by_root(cog, track):
    return brentq(lambda a: operating.cornering_wheel_load_n(1.0, -a, cog, track), 0.0, 20.0)


@pytest.mark.parametrize("vehicle, cog_range_cm, track_range_cm, threshold_range_g", [
    ("sports car", (46, 51), (127, 154), (1.2, 1.7)),
    ("pickup truck", (76, 89), (165, 178), (0.9, 1.1)),
    ("heavy truck", (154, 218), (178, 183), (0.4, 0.6)),
])
def test_lift_off_within_gillespie_table_9_1_rollover_thresholds(
        vehicle, cog_range_cm, track_range_cm, threshold_range_g):
    # Gillespie, Fundamentals of Vehicle Dynamics, SAE 1992, table 9.1 (from memory): CG
    # height, tread and rigid-vehicle rollover threshold a_y/g = t / 2h of vehicle classes.
    # The inside wheel's load from our transfer formula reaches zero at the tabulated threshold
    # for the middle of each class's ranges.
    cog = np.mean(cog_range_cm) / 100
    track = np.mean(track_range_cm) / 100
    threshold = lift_off_by_root(cog, track)
    assert threshold_range_g[0] <= threshold <= threshold_range_g[1]
    assert operating.lift_off_accel_g(cog, track) == pytest.approx(threshold, rel=1e-9)


def test_axle_free_body_solved_by_sympy_matches_the_transfer_formula():
    # Independent derivation with sympy: rigid axle in a steady turn (Milliken & Milliken,
    # Race Car Vehicle Dynamics, SAE 1995, ch. 18; Gillespie 1992, ch. 9). Unknowns: outer and
    # inner wheel loads and lateral forces (towards the turn centre). Equations: vertical and
    # lateral force balance, moments about the centre of gravity, equal friction use.
    w_out, w_in, y_out, y_in = sympy.symbols("w_out w_in y_out y_in")
    axle, a_y, h, t = sympy.Rational(30_000), sympy.Rational(3, 10), sympy.Rational(9, 10), \
        sympy.Rational(3, 2)
    solution = sympy.solve([
        w_out + w_in - axle,
        y_out + y_in - axle * a_y,
        (w_out - w_in) * t / 2 - (y_out + y_in) * h,
        y_out * w_in - y_in * w_out,
    ], [w_out, w_in, y_out, y_in], dict=True)[0]
    outer = operating.cornering_wheel_load_n(30e3, 0.3, 0.9, 1.5)
    inner = operating.cornering_wheel_load_n(30e3, -0.3, 0.9, 1.5)
    assert outer == pytest.approx(float(solution[w_out]), rel=1e-12)
    assert inner == pytest.approx(float(solution[w_in]), rel=1e-12)
    assert operating.cornering_side_force_n(outer, 0.3) == pytest.approx(
        float(solution[y_out]), rel=1e-12)
    # The inside wheel's inboard direction points away from the turn centre: S = -y_in.
    assert operating.cornering_side_force_n(inner, -0.3) == pytest.approx(
        -float(solution[y_in]), rel=1e-12)


def test_hand_worked_dumper_axle_in_a_turn():
    # Hand calculation with Milliken & Milliken's dW = W a_y h / t (RCVD, ch. 18, from memory):
    # 30 kN axle, h = 0.9 m, t = 1.5 m, 0.3 g -> dW = 30 * 0.3 * 0.9 / 1.5 = 5.4 kN;
    # outer 15 + 5.4 = 20.4 kN, inner 9.6 kN; side forces 20.4 * 0.3 = 6.12 kN inboard and
    # 9.6 * 0.3 = 2.88 kN outboard.
    outer = operating.cornering_wheel_load_n(30e3, 0.3, 0.9, 1.5)
    inner = operating.cornering_wheel_load_n(30e3, -0.3, 0.9, 1.5)
    assert (outer, inner) == (pytest.approx(20.4e3), pytest.approx(9.6e3))
    assert operating.cornering_side_force_n(outer, 0.3) == pytest.approx(6.12e3)
    assert operating.cornering_side_force_n(inner, -0.3) == pytest.approx(-2.88e3)


@settings(max_examples=100, deadline=None)
@given(axle=axle_load_n, a_y=lateral_g, h=cog_m, t=track_m)
def test_two_wheels_of_an_axle_carry_the_axle_load_and_its_lateral_force(axle, a_y, h, t):
    outer = operating.cornering_wheel_load_n(axle, a_y, h, t)
    inner = operating.cornering_wheel_load_n(axle, -a_y, h, t)
    assert outer + inner == pytest.approx(axle, rel=1e-12)
    # In a common frame (towards the turn centre) the inside wheel's force is -S_local.
    lateral_sum = (operating.cornering_side_force_n(outer, a_y)
                   - operating.cornering_side_force_n(inner, -a_y))
    assert lateral_sum == pytest.approx(axle * a_y, rel=1e-9, abs=1e-9)


@settings(max_examples=100, deadline=None)
@given(axle=axle_load_n, a_y=st.floats(0.0, 0.6), h=cog_m, t=track_m)
def test_outside_wheel_side_force_points_inboard(axle, a_y, h, t):
    # Load transfer goes to the outside wheel (Gillespie 1992, ch. 9, from memory), and the
    # ground pushes it towards the turn centre, i.e. inboard (docs/conventions.md).
    outer = operating.cornering_wheel_load_n(axle, a_y, h, t)
    assert outer >= 0.5 * axle
    assert operating.cornering_side_force_n(outer, a_y) >= 0


# -- adhesion ------------------------------------------------------------------------------------

@settings(max_examples=100, deadline=None)
@given(force=st.floats(-100e3, 100e3), load=st.floats(0, 100e3), mu=st.floats(0.05, 1.2))
def test_adhesion_cap_keeps_sign_and_never_exceeds_mu_times_wheel_load(force, load, mu):
    # Wong, Theory of Ground Vehicles, 4th ed., sec. 1.3 (from memory): F_max = mu W.
    capped, slips = operating.adhesion_capped_force_n(force, load, mu)
    assert abs(capped) <= mu * load * (1 + 1e-12)
    assert capped * force >= 0
    assert bool(slips) == (abs(force) > mu * load)
    if not slips:
        assert capped == force


def test_wheel_in_the_air_transmits_no_force():
    # F <= mu W (Wong, 4th ed., sec. 1.3, from memory) with W = 0.
    capped, slips = operating.adhesion_capped_force_n(np.array([5e3, -2e3, 0.0]), 0.0, 0.6)
    assert np.all(capped == 0) and list(slips) == [True, True, False]


def test_friction_circle_combines_tractive_and_side_force():
    # 3-4-5: 3 kN tractive and 4 kN side force make 5 kN; limit 0.6 x 8 kN = 4.8 kN.
    assert operating.exceeds_friction_circle(3e3, 4e3, 8e3, 0.6)
    assert not operating.exceeds_friction_circle(3e3, 4e3, 8.5e3, 0.6)
