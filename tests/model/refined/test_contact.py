"""Line-contact law, Hertz pressure and roller profile of the laminae."""

import math

import numpy as np
import pytest

from hubload.model.refined import contact


def test_single_contact_stiffness_inverts_palmgren_approach():
    # Palmgren (Ball and Roller Bearing Engineering, 3rd ed.; Harris & Kotzalas, Essential
    # Concepts, 5th ed., ch. 6): delta = 3.84e-5 Q^0.9 / l^0.8 [mm, N, mm] per contact, i.e.
    # Q = 8.06e4 l^(8/9) delta^(10/9) for one contact (H&K's rounded constant).
    length_mm, load_n = 20.0, 5000.0
    delta_mm = 2 * 3.84e-5 * load_n ** 0.9 / length_mm ** 0.8
    stiffness = contact.roller_stiffness_n_per_m(length_mm * 1e-3)
    assert stiffness * (delta_mm * 1e-3) ** (10 / 9) == pytest.approx(load_n, rel=1e-12)
    single_n_mm = (stiffness * 1e-3 ** (10 / 9)) * 2 ** (10 / 9) / length_mm ** (8 / 9)
    assert single_n_mm == pytest.approx(8.06e4, rel=2e-3)


def test_laminae_of_a_uniform_roller_carry_the_roller_load():
    # Consistency of slicing (ISO/TS 16281:2008 laminae): n equal laminae at the same approach
    # carry what the whole roller carries by Palmgren's law, whatever n.
    delta = 12e-6
    whole = contact.roller_stiffness_n_per_m(0.02) * delta ** (10 / 9)
    for laminae in (10, 30, 51):
        assert laminae * contact.lamina_stiffness_n_per_m(0.02, laminae) * delta ** (10 / 9) \
            == pytest.approx(whole, rel=1e-12)


def test_line_contact_pressure_matches_roark_steel_formula():
    # Roark's Formulas for Stress and Strain, 7th ed., table 14.1 case 2 (cylinders, nu = 0.3):
    # sigma_max = 0.591 sqrt(p E / K_D) with K_D = D1 D2 / (D1 + D2) (from memory).
    d1, d2, q = 0.012, 0.070, 1.5e6
    k_d = d1 * d2 / (d1 + d2)
    roark = 0.591 * math.sqrt(q * contact.STEEL_MODULUS_PA / k_d)
    radius = 1.0 / (2 / d1 + 2 / d2)
    assert contact.line_contact_pressure_pa(q, radius) == pytest.approx(roark, rel=2e-3)


def test_log_profile_reaches_the_end_drop_and_is_flat_in_the_middle():
    # Lundberg's logarithmic profile (Forsch. Ing.-Wes. 1939): zero at mid-length, symmetric,
    # growing towards the ends; here scaled to the given drop at the ends of the effective length.
    length, drop = 0.02, 8e-6
    x = np.array([0.0, 0.25, 0.5, 0.9, 1.0]) * length / 2
    profile = contact.profile_drop_m(x, length, drop)
    assert profile[0] == 0.0 and profile[-1] == pytest.approx(drop)
    assert np.all(np.diff(profile) > 0)
    assert profile[1] < 0.05 * drop
    assert contact.profile_drop_m(-x, length, drop) == pytest.approx(profile)
    assert np.all(contact.profile_drop_m(x, length, 0.0) == 0.0)
