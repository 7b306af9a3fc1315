"""ISO/TS 16281 reference life from lamina loads, against Lundberg-Palmgren and ISO 281."""

import math

import numpy as np
import pytest

from hubload.model.refined import life, pair_response, ratings
from hubload.model.refined.integrals import relative_roller_load

from refined_pairs import ALPHA, roller_set, symmetric_pair


def test_lamina_sum_does_not_depend_on_the_number_of_laminae():
    # ISO/TS 16281:2008: a lamina's rating scales with its width^(7/9) and its damage with
    # (q_e/q_c)^(9/2), so uniformly loaded rollers give the same life for any slicing.
    rollers = roller_set()
    roller_loads = np.linspace(0.0, 4000.0, 20)
    lives = [life.reference_life_mrev(
        rollers, np.repeat(roller_loads[:, None] / n, n, axis=1)) for n in (1, 30, 77)]
    assert lives[1] == pytest.approx(lives[0], rel=1e-12)
    assert lives[2] == pytest.approx(lives[0], rel=1e-12)


def test_lamina_ratings_rebuild_iso281_rating_by_lundberg_palmgren_integrals():
    # Lundberg & Palmgren (1952) / Harris & Kotzalas, Essential Concepts, 5th ed., ch. 11: with
    # a rotating inner ring and the half load zone, C = Z Qc,i cos(a) Jr/J1
    # [1 + (J2 Qc,i / (J1 Qc,o))^(9/2)]^(-2/9), J1, J2 the 4th and 4.5th power means of the
    # Stribeck distribution. The lamina ratings summed over the roller must rebuild
    # ISO 281:2007's C (table 7 with bm) within the cos(a)^(2/9) that ISO 281 folds into
    # (Lwe cos a)^(7/9): here within 2 %.
    rollers = roller_set(rollers=19, diameter_mm=13.0, length_mm=22.0, angle_deg=16.0,
                         pitch_mm=90.0)
    qci, qco = (np.array(r) * 1 ** (7 / 9) for r in life.lamina_ratings_n(rollers, 1))
    psi = np.linspace(-np.pi, np.pi, 200_001)
    shape = relative_roller_load(psi, 0.5, 10 / 9)
    jr = np.trapezoid(shape * np.cos(psi), psi) / (2 * np.pi)
    j1 = (np.trapezoid(shape ** 4, psi) / (2 * np.pi)) ** 0.25
    j2 = (np.trapezoid(shape ** 4.5, psi) / (2 * np.pi)) ** (1 / 4.5)
    rebuilt = (19 * qci * math.cos(rollers.contact_angle_rad) * jr / j1
               * (1 + (j2 * qci / (j1 * qco)) ** 4.5) ** (-2 / 9))
    iso = ratings.dynamic_rating_n(19, 13e-3, 22e-3, rollers.contact_angle_rad, 90e-3)
    assert rebuilt == pytest.approx(iso, rel=0.02)


@pytest.mark.parametrize("c_over_p", [1.0, 2.0, 4.0, 8.0])
def test_refined_life_at_nominal_conditions_against_iso281(c_over_p):
    # Nominal ISO 281 conditions (zero setting, radial load, half load zone, no tilt): the
    # reference life is Lundberg-Palmgren's line-contact life (C/P)^4 on ISO 281's C, less the
    # cos(a)^(8/9) and discreteness above (ratio 0.972 at a = 15 deg), while ISO 281 uses
    # (C/P)^(10/3). So L10r / L10 = 0.97 (C/P)^(2/3): 0.97 at C/P = 1, 2.45 at C/P = 4.
    bearings = symmetric_pair()
    c = ratings.dynamic_rating_n(20, 12e-3, 20e-3, ALPHA, 85e-3)
    radial = c / c_over_p
    response = pair_response(bearings, 2 * radial, 0.0, 0.0, 0.0, 0.35, 0.0)
    iso = c_over_p ** (10 / 3)
    ratio = float(response.bearings[0].life_mrev) / iso
    assert ratio == pytest.approx(math.cos(ALPHA) ** (8 / 9) * c_over_p ** (2 / 3), rel=0.01)


def test_rotating_outer_ring_shortens_life_under_a_partial_load_zone():
    # Lundberg-Palmgren: the ring that stands still relative to the load sees the 4.5th-power
    # mean, the higher one; with a rotating outer ring that falls on the weaker inner raceway.
    args = (symmetric_pair(), 30e3, 0.0, 0.0, 0.0, 0.35, 0.0)
    inner = pair_response(*args, rotating_ring="inner").bearings[0].life_mrev
    outer = pair_response(*args, rotating_ring="outer").bearings[0].life_mrev
    assert outer < inner


def test_rotating_ring_does_not_matter_when_every_roller_carries_the_same_load():
    # Pure axial load (side force applied on the axis, loaded radius 0): uniform loads round
    # the ring, both means are equal.
    args = (symmetric_pair(), 0.0, 10e3, 0.0, 0.0, 0.0, 50e-6)
    inner = pair_response(*args, rotating_ring="inner").bearings[0].life_mrev
    outer = pair_response(*args, rotating_ring="outer").bearings[0].life_mrev
    assert outer == pytest.approx(inner, rel=1e-9)


def test_unloaded_bearing_has_infinite_life():
    response = pair_response(symmetric_pair(), 0.0, 10e3, 0.0, 0.0, 0.0, 50e-6)
    assert np.isinf(response.bearings[1].life_mrev)


def test_reference_equivalent_load_inverts_iso281_life():
    # ISO/TS 16281: Pref = C / L10r^(3/10), so that (C / Pref)^(10/3) = L10r.
    assert life.reference_equivalent_load_n(100e3, 1000.0) ** (-10 / 3) * 100e3 ** (10 / 3) \
        == pytest.approx(1000.0)
