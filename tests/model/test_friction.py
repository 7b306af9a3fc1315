"""Palmgren friction torque of a tapered roller bearing and its power loss.

Sources beside each check: the model and constants of Harris & Kotzalas, Rolling
Bearing Analysis 5th ed. (Palmgren; from memory), hand-worked below; the constant
friction coefficient of tapered bearings, mu about 0.0018..0.0025 at P about 0.1 C
under normal conditions (common practice).
"""

import math

import numpy as np
import pytest
from hypothesis import given
from hypothesis import strategies as st

from hubload.model import friction

CST = 1e-6
MM = 1e-3


def test_check_value_of_the_notes_by_hand():
    """dm 110 mm, Fr 40 kN, Fa 10 kN, Y 1.4, n 100 r/min, nu 46 cSt, f0 6.

    nu n = 4600 >= 2000: M0 = 1e-7 * 6 * 4600^(2/3) * 110^3 = 1e-7 * 6 * 276.59 * 1.331e6
    = 220.9 N mm. P1 = max(40000, 2 * 1.4 * 10000 = 28000) = 40000 N; M1 = 0.0004 * 40000
    * 110 = 1760 N mm. M = 1980.9 N mm = 1.981 N m; N = 1.9809 * 2 pi * 100 / 60 = 20.74 W.
    (The notes: 221 N mm, 1,760 N mm, 1.98 N m, 20.7 W.)
    """
    torque = friction.friction_torque(46 * CST, 100.0, 110 * MM, 40e3, 10e3, 1.4, f0=6.0)
    assert torque.viscous_nm == pytest.approx(0.2209, abs=5e-5)
    assert torque.load_nm == pytest.approx(1.760, rel=1e-12)
    assert torque.total_nm == pytest.approx(1.981, abs=5e-4)
    assert friction.power_loss_w(torque.total_nm, 100.0) == pytest.approx(20.74, abs=0.01)


def test_heavy_axial_load_sets_the_friction_load():
    # Hand-worked: 2 Y Fa = 2 * 1.6 * 20 kN = 64 kN > Fr = 30 kN; M1 = 0.0004 * 64000 * 0.1 m.
    assert friction.load_torque_nm(30e3, 20e3, 1.6, 0.1) == pytest.approx(2.56, rel=1e-12)


def test_below_nu_n_2000_the_viscous_torque_keeps_its_low_speed_value():
    # Harris & Kotzalas (Palmgren): M0 = 160e-7 f0 dm^3 for nu n < 2000; 160 is about
    # 2000^(2/3) = 158.7, so the two branches nearly meet. Hand-worked for dm 90 mm, f0 6:
    # 160e-7 * 6 * 729000 = 69.98 N mm, at standstill too.
    slow = friction.viscous_torque_nm(np.array([20, 20, 46]) * CST, np.array([0.0, 50.0, 40.0]),
                                      90 * MM, 6.0)
    np.testing.assert_allclose(slow, 0.06998, atol=1e-5)
    at_limit = friction.viscous_torque_nm(20 * CST, 100.0, 90 * MM, 6.0)
    assert at_limit == pytest.approx(1e-7 * 6 * 2000 ** (2 / 3) * 90**3 * 1e-3, rel=1e-12)
    assert at_limit == pytest.approx(slow[0], rel=0.01)


@pytest.mark.parametrize("viscosity_cst", [32.0, 46.0])
def test_implied_friction_coefficient_at_a_tenth_of_the_rating_is_the_usual_one(viscosity_cst):
    # Common practice: M = mu P d / 2 with mu about 0.0018..0.0025 for tapered bearings at
    # P about 0.1 C, good lubrication, normal speed. An invented bearing d 80, D 140 mm
    # (dm 110), C 250 kN, radial load 25 kN, 1000 r/min, oil bath.
    torque = friction.friction_torque(viscosity_cst * CST, 1000.0, 110 * MM, 25e3, 0.0, 1.5,
                                      friction.F0_TAPERED["oil-bath"]).total_nm
    mu = 2 * torque / (25e3 * 80 * MM)
    assert 0.0018 <= mu <= 0.0025


def test_power_is_zero_at_standstill_and_torque_times_angular_speed():
    # N = M omega (mechanics): 2 N m at 300 r/min = 2 * 10 pi = 62.83 W; either direction.
    power = friction.power_loss_w(np.array([2.0, 2.0, 2.0]), np.array([0.0, 300.0, -300.0]))
    np.testing.assert_allclose(power, [0.0, 20 * math.pi, 20 * math.pi], rtol=1e-12)


def test_time_weighted_mean_power_over_a_spectrum():
    # Hand-worked: (0.5 * 10 + 0.25 * 30 + 0.25 * 0) / 1 = 12.5 W; shares not adding up to
    # one are normalised ((2 * 10 + 1 * 30) / 3); a spectrum without time gives 0.
    powers = np.array([[10.0, 30.0, 0.0], [10.0, 30.0, 0.0], [10.0, 30.0, 0.0]])
    times = np.array([[0.5, 0.25, 0.25], [2.0, 1.0, 0.0], [0.0, 0.0, 0.0]])
    np.testing.assert_allclose(friction.mean_power_w(powers, times), [12.5, 50 / 3, 0.0])


def test_torque_broadcasts_over_cases():
    torque = friction.friction_torque(np.full((2, 1), 46 * CST), np.array([0.0, 50.0, 500.0]),
                                      0.11, 40e3, 10e3, 1.4, 6.0)
    assert torque.viscous_nm.shape == torque.load_nm.shape == torque.total_nm.shape == (2, 3)


@given(st.floats(2, 500), st.floats(0, 3000), st.floats(0.02, 0.5), st.floats(0, 2e5),
       st.floats(0, 2e5), st.floats(0.8, 2.5), st.sampled_from(tuple(friction.F0_TAPERED.values())),
       st.floats(1.01, 3))
def test_more_viscosity_speed_or_load_never_lowers_the_torque(nu_cst, speed, dm, fr, fa, y, f0,
                                                              factor):
    # Property of Palmgren's model: monotone in nu n and in P1, but for the source's own step
    # at nu n = 2000, where 2000^(2/3) = 158.7 meets the low-speed 160 (0.8 % of M0).
    base = friction.friction_torque(nu_cst * CST, speed, dm, fr, fa, y, f0).total_nm
    for changed in (dict(viscosity_m2_s=factor * nu_cst * CST), dict(speed_rpm=factor * speed),
                    dict(radial_n=factor * fr), dict(axial_n=factor * fa)):
        arguments = dict(viscosity_m2_s=nu_cst * CST, speed_rpm=speed, mean_diameter_m=dm,
                         radial_n=fr, axial_n=fa, y_factor=y, f0=f0) | changed
        assert friction.friction_torque(**arguments).total_nm >= base * (1 - 0.01)
