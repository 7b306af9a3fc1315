"""ISO 281 / ISO 76 equations against the standards' own relations."""

import math
import warnings

import numpy as np
import pytest
from hypothesis import given
from hypothesis import strategies as st

from hubload.model import iso281


def test_load_factors_from_contact_angle_follow_iso281_table8_note():
    # ISO 281:2007 table 8: e = 1.5 tan a, Y = 0.4 cot a; ISO 76:2006 table 1: Y0 = 0.22 cot a.
    e, y, y0 = iso281.factors_from_contact_angle(math.radians(15.0))
    assert e == pytest.approx(1.5 * math.tan(math.radians(15)))
    assert y == pytest.approx(0.4 / math.tan(math.radians(15)))
    assert y0 == pytest.approx(0.22 / math.tan(math.radians(15)))


@given(st.floats(5.0, 30.0), st.floats(1.0, 1e5))
def test_equivalent_load_is_continuous_at_fa_over_fr_equal_e(angle_deg, radial):
    # ISO 281:2007 6.2: with e and Y from the contact angle, X = 0.4 and Y e = 0.6 make
    # P = 0.4 Fr + Y e Fr = Fr at Fa/Fr = e, so both branches meet.
    e, y, _ = iso281.factors_from_contact_angle(math.radians(angle_deg))
    below = iso281.equivalent_dynamic_load_n(radial, e * radial * (1 - 1e-12), e, y)
    above = iso281.equivalent_dynamic_load_n(radial, e * radial * (1 + 1e-12), e, y)
    assert below == pytest.approx(radial, rel=1e-9)
    assert above == pytest.approx(radial, rel=1e-9)


def test_equivalent_load_switches_to_x_04_above_e():
    # ISO 281:2007 6.2, table 8: Fa/Fr > e -> X = 0.4, Y as given.
    assert iso281.equivalent_dynamic_load_n(10.0, 5.0, 0.4, 1.5) == pytest.approx(0.4 * 10 + 1.5 * 5)
    assert iso281.equivalent_dynamic_load_n(10.0, 4.0, 0.4, 1.5) == pytest.approx(10.0)
    assert iso281.equivalent_dynamic_load_n(0.0, 3.0, 0.4, 1.5) == pytest.approx(4.5)


def test_basic_rating_life_uses_exponent_10_over_3_for_roller_bearings():
    # ISO 281:2007 7.1: L10 = (C/P)^p, p = 10/3 for roller bearings.
    assert iso281.basic_rating_life_mrev(100.0, 50.0) == pytest.approx(2 ** (10 / 3))
    assert iso281.basic_rating_life_mrev(100.0, 0.0) == math.inf


def test_life_hours_from_revolutions_and_speed():
    # ISO 281:2007 7.1: L10h = 10^6 L10 / (60 n).
    assert iso281.life_hours(3.0, 50.0) == pytest.approx(1e6 * 3 / 3000)
    assert iso281.life_hours(3.0, 0.0) == math.inf


def test_static_equivalent_load_never_below_radial_load():
    # ISO 76:2006 6.2: P0 = 0.5 Fr + Y0 Fa, but not less than Fr.
    assert iso281.equivalent_static_load_n(10.0, 2.0, 0.8) == pytest.approx(10.0)
    assert iso281.equivalent_static_load_n(10.0, 8.0, 0.8) == pytest.approx(5 + 6.4)


@given(st.floats(1.0, 1e6), st.floats(1.0, 1e6))
def test_system_life_is_shorter_than_either_and_matches_equal_pair(life_a, life_b):
    # Lundberg-Palmgren series system, e = 9/8 (Harris & Kotzalas, from memory):
    # two equal lives L give L * 2^(-1/e).
    system = iso281.system_life(life_a, life_b)
    assert system <= min(life_a, life_b) * (1 + 1e-12)
    assert iso281.system_life(life_a, life_a) == pytest.approx(life_a * 2 ** (-8 / 9))


def test_miner_sum_and_shares():
    # Palmgren-Miner: 1/L = sum t_j / L_j.
    rates = iso281.damage_rate_per_hour(np.array([0.5, 0.3, 0.2]), np.array([1000.0, 500.0, np.inf]))
    assert iso281.spectrum_life_h(rates) == pytest.approx(1 / (0.5 / 1000 + 0.3 / 500))
    shares = iso281.damage_shares(rates)
    assert shares.sum() == pytest.approx(1.0)
    assert shares[2] == 0.0


def test_zero_life_case_takes_the_whole_miner_damage():
    # Palmgren-Miner, 1/L = sum t_j / L_j: a case that fails at once (life 0: no equilibrium in
    # the refined model) with time in it makes the spectrum life 0 and carries all the damage;
    # a case without time adds none, whatever its life. No NaN, no numpy warning on the way.
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        rates = iso281.damage_rate_per_hour(np.array([0.5, 0.3, 0.2, 0.0]),
                                            np.array([1000.0, 0.0, np.inf, 0.0]))
        assert iso281.spectrum_life_h(rates) == 0.0
        assert iso281.damage_shares(rates).tolist() == [0.0, 1.0, 0.0, 0.0]


def test_zero_life_bearing_takes_the_whole_system_share():
    # Bearings in series (Lundberg-Palmgren, L = (sum L_k^-e)^(-1/e)): a bearing of zero life
    # makes the system life 0, and the system's damage is all that bearing's.
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        assert iso281.system_life(0.0, 500.0) == 0.0
        assert iso281.system_life(np.inf, 500.0) == pytest.approx(500.0)
        shares = iso281.system_damage_shares(
            [0.0, 500.0], [np.array([0.2, 0.8]), np.array([0.5, 0.5])])
        assert shares.tolist() == pytest.approx([0.2, 0.8])
