"""Load distribution of the pair against Sjovall's integrals and the ISO 281 pair rule."""

import math

import numpy as np
import pytest
from scipy import special

from hubload.model.refined import contact, pair_response
from hubload.model.refined.integrals import sjovall_integrals

from refined_pairs import ALPHA, symmetric_pair


def jr_half_closed_form(n):
    # Jr(0.5) = (1/pi) int_0^(pi/2) cos^(n+1) = Gamma((n+2)/2) / (2 sqrt(pi) Gamma((n+3)/2))
    # (Wallis/Beta integral, e.g. Abramowitz & Stegun 6.2.1 and 6.2.2).
    return special.gamma((n + 2) / 2) / (2 * math.sqrt(math.pi) * special.gamma((n + 3) / 2))


@pytest.mark.parametrize("epsilon, exponent, jr, ja", [
    (0.5, 1.1, 0.2453, 0.3090),   # line contact; Jr from the issue, Ja from memory
    (0.1, 1.1, 0.1268, 0.1319),   # line contact, from memory
    (0.5, 1.5, 0.2288, 0.2782),   # point contact, from memory
])
def test_sjovall_integrals_match_harris_kotzalas_table(epsilon, exponent, jr, ja):
    # Harris & Kotzalas, Essential Concepts of Bearing Technology, 5th ed., ch. 7, table of
    # Jr(epsilon) and Ja(epsilon) (4 decimals).
    got_jr, got_ja = sjovall_integrals(epsilon, exponent)
    assert got_jr == pytest.approx(jr, abs=6e-5)
    assert got_ja == pytest.approx(ja, abs=6e-5)


@pytest.mark.parametrize("exponent", [10 / 9, 1.1, 1.5])
def test_sjovall_half_ring_integral_against_closed_form(exponent):
    assert sjovall_integrals(0.5, exponent)[0] == pytest.approx(jr_half_closed_form(exponent),
                                                                rel=1e-9)


def test_exponent_10_9_differs_from_1_1_in_the_fourth_digit():
    # The pitfall named in docs/refined-method.md: 0.2448 (n = 10/9) against 0.2453 (n = 1.1).
    assert round(sjovall_integrals(0.5, 10 / 9)[0], 4) == 0.2448


@pytest.mark.parametrize("exponent, jr", [(1.1, 0.2453), (10 / 9, None)])
def test_zero_setting_radial_load_gives_half_load_zone_and_stribeck_peak(exponent, jr):
    # Stribeck/Sjovall for line contact (Harris & Kotzalas, ch. 7): with zero clearance the
    # load zone of a tapered bearing under radial load and its induced axial force is half the
    # ring (epsilon = 0.5) and Qmax = Fr / (Z Jr(0.5) cos a). A symmetric pair loaded at mid-span
    # puts each bearing in exactly that state. Roller count 60 makes the discrete ring close to
    # the integral.
    jr = jr if jr is not None else jr_half_closed_form(exponent)
    bearings = symmetric_pair(rollers=60, diameter_mm=4.0, pitch_mm=85.0)
    wheel_load = np.array([5e3, 20e3, 60e3])
    response = pair_response(bearings, wheel_load, 0.0, 0.0, 0.0, 0.35, 0.0, exponent=exponent)
    for bearing in response.bearings:
        assert np.degrees(bearing.load_zone_rad) == pytest.approx(180.0, abs=1e-6)
        stribeck = 0.5 * wheel_load / (60 * jr * math.cos(ALPHA))
        assert bearing.max_roller_load_n == pytest.approx(stribeck, rel=5e-4)


def test_half_load_zone_gives_the_iso281_induced_axial_force():
    # ISO 281:2007 7.3.2: induced axial force 0.5 Fr / Y with Y = 0.4 cot a (table 8), i.e.
    # Fa / Fr = 1.25 tan a; Sjovall at epsilon = 0.5: Fa / Fr = tan a Ja/Jr = 1.2596 tan a
    # (line contact, n = 10/9). Agreement within 1 %.
    response = pair_response(symmetric_pair(), 30e3, 0.0, 0.0, 0.0, 0.35, 0.0)
    outboard = response.bearings[0]
    assert float(outboard.axial_n / outboard.radial_n) == pytest.approx(
        1.25 * math.tan(ALPHA), rel=0.01)


def test_peak_pressure_follows_hertz_on_the_peak_roller():
    # Uniform straight roller, no tilt: every lamina of the peak roller carries Qmax / laminae.
    response = pair_response(symmetric_pair(), 40e3, 0.0, 0.0, 0.0, 0.35, 0.0)
    outboard = response.bearings[0]
    radius = contact.inner_contact_radius_m(12e-3, ALPHA, 85e-3)
    expected = contact.line_contact_pressure_pa(outboard.max_roller_load_n / 20e-3, radius)
    assert outboard.max_contact_pressure_pa == pytest.approx(expected, rel=1e-9)
