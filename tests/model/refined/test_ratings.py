"""Basic ratings from the internal geometry against ISO 281 and ISO 76."""

import math
from pathlib import Path

import numpy as np
import pytest

from hubload.model.refined import contact, ratings


TABLE_7 = np.loadtxt(Path(__file__).resolve().parents[2] / "data" / "iso281_table7_fc.csv",
                     delimiter=",", skiprows=4)


def lundberg_palmgren_fc(gamma):
    """The closed form behind ISO 281 table 7 as Harris & Kotzalas write it (Essential Concepts
    of Bearing Technology, 5th ed., ch. 11; from memory): fc = 207.9 lambda nu gamma^(2/9)
    (1 - gamma)^(29/27) (1 + gamma)^(-1/4) [1 + (1.04 ((1 - gamma)/(1 + gamma))^(143/108))^(9/2)]
    ^(-2/9), with lambda nu = 0.83 for line contact."""
    ratio = (1 - gamma) / (1 + gamma)
    return (207.9 * 0.83 * gamma ** (2 / 9) * (1 - gamma) ** (29 / 27) * (1 + gamma) ** -0.25
            * (1 + (1.04 * ratio ** (143 / 108)) ** 4.5) ** (-2 / 9))


def test_table_7_stands_on_the_lundberg_palmgren_closed_form():
    # The reference data (tests/data) against the theory, written out here: within the
    # table's rounding up to gamma = 0.38; the last rows sit up to 1.4 % below it.
    gamma, fc = TABLE_7.T
    deviation = lundberg_palmgren_fc(gamma) / fc - 1.0
    assert np.all(np.abs(deviation[gamma <= 0.38]) < 1.5e-3)
    assert np.all(np.abs(deviation) < 0.015)


def test_fc_of_the_model_is_iso281_table_7():
    gamma, fc = TABLE_7.T
    np.testing.assert_allclose(ratings.fc_factor(gamma), fc, rtol=0, atol=1e-12)


@pytest.mark.parametrize("gamma, fc", [(0.05, 74.1), (0.10, 84.2), (0.15, 88.2), (0.20, 88.7),
                                       (0.30, 83.8)])
def test_dynamic_rating_at_iso281_table7_points(gamma, fc):
    # ISO 281:2007 7.1.1, Cr = bm fc (Lwe cos a)^(7/9) Z^(3/4) Dwe^(29/27), bm = 1.1 (table 1),
    # fc from table 7 at a tabulated Dwe cos(a)/Dpw (from memory); hand arithmetic in N and mm.
    z, dwe, lwe, alpha = 18, 11.0, 19.0, math.radians(14.0)
    dpw = dwe * math.cos(alpha) / gamma
    expected = 1.1 * fc * (lwe * math.cos(alpha)) ** (7 / 9) * z ** 0.75 * dwe ** (29 / 27)
    got = ratings.dynamic_rating_n(z, dwe * 1e-3, lwe * 1e-3, alpha, dpw * 1e-3)
    assert got == pytest.approx(expected, rel=1e-9)


def test_fc_interpolates_linearly_between_table_rows():
    # ISO 281:2007 7.1.1: linear interpolation in table 7 (rows 0.10 -> 84.2, 0.11 -> 85.4).
    assert ratings.fc_factor(0.105) == pytest.approx(0.5 * (84.2 + 85.4))
    assert ratings.fc_factor(0.1125) == pytest.approx(85.4 + 0.25 * (86.4 - 85.4))


def test_static_rating_iso76_hand_example():
    # ISO 76:2006 6.1.1: C0r = 44 (1 - Dwe cos a / Dpw) i Z Lwe Dwe cos a; by hand for
    # Z = 20, Dwe = 12, Lwe = 20, a = 15 deg, Dpw = 85 (N, mm):
    # gamma = 12 x 0.965926 / 85 = 0.136366; 44 x 0.863634 x 20 x 20 x 12 x 0.965926 = 176 184 N.
    got = ratings.static_rating_n(20, 12e-3, 20e-3, math.radians(15.0), 85e-3)
    assert got == pytest.approx(176_184, rel=1e-4)


def test_static_rating_is_the_4000_mpa_load_of_iso76():
    # ISO 76:2006 6.1.1 bases C0 on 4000 MPa at the most heavily loaded roller; the standard's
    # load distribution takes Qmax = 5 Fr / (Z cos a) (Stribeck's factor 5, Harris & Kotzalas,
    # Essential Concepts, 5th ed., ch. 7; from memory). Hertz line contact (Roark) at that load
    # on the inner raceway must give 4000 MPa.
    z, dwe, lwe, alpha, dpw = 17, 9.5e-3, 16e-3, math.radians(20.0), 70e-3
    c0 = ratings.static_rating_n(z, dwe, lwe, alpha, dpw)
    q_max = 5.0 * c0 / (z * math.cos(alpha))
    radius = contact.inner_contact_radius_m(dwe, alpha, dpw)
    pressure = contact.line_contact_pressure_pa(q_max / lwe, radius)
    assert pressure == pytest.approx(4000e6, rel=0.01)
