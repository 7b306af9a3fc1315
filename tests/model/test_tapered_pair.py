"""The axial rule for two single-row tapered bearings, each of its cases.

Reference: ISO 281:2007 clause 7.3.2 (induced force Fr / 2Y) and the load cases of a
pair mounted without clearance or preload as tabulated in bearing makers' catalogues and
Harris & Kotzalas, Essential Concepts of Bearing Technology, 5th ed., ch. 7 (from memory);
each expected value below is worked by hand from those rules.
"""

import numpy as np
import pytest
from hypothesis import given
from hypothesis import strategies as st

from hubload.model import tapered_pair


def test_case_1_induced_forces_balanced_and_external_thrust_on_a():
    # Fi_A = 10/3 <= Fi_B + Ka = 10/3 + 2: Fa_A = Fi_B + Ka, Fa_B = Fi_B
    fa_a, fa_b = tapered_pair.pair_axial_loads(10.0, 1.5, 10.0, 1.5, 2.0)
    assert fa_a == pytest.approx(10 / 3 + 2)
    assert fa_b == pytest.approx(10 / 3)


def test_case_2_b_induced_force_large():
    # Fi_A = 5/3 < Fi_B + Ka = 20/3 + 1
    fa_a, fa_b = tapered_pair.pair_axial_loads(5.0, 1.5, 20.0, 1.5, 1.0)
    assert fa_a == pytest.approx(20 / 3 + 1)
    assert fa_b == pytest.approx(20 / 3)


def test_case_3_a_induced_force_exceeds_b_plus_thrust():
    # Fi_A = 30/3 = 10 > Fi_B + Ka = 5/3 + 2: Fa_A = Fi_A, Fa_B = Fi_A - Ka
    fa_a, fa_b = tapered_pair.pair_axial_loads(30.0, 1.5, 5.0, 1.5, 2.0)
    assert fa_a == pytest.approx(10.0)
    assert fa_b == pytest.approx(8.0)


@given(st.floats(0, 1e5), st.floats(0, 1e5), st.floats(0, 1e5), st.floats(0.5, 3), st.floats(0.5, 3))
def test_pair_rule_equilibrium_and_minimum_axial_loads(fr_a, fr_b, ka, y_a, y_b):
    # Axial equilibrium of the shaft (Fa_A - Fa_B = Ka) and each bearing carrying at
    # least its own induced force (catalogue rule, from memory).
    fa_a, fa_b = tapered_pair.pair_axial_loads(fr_a, y_a, fr_b, y_b, ka)
    assert fa_a - fa_b == pytest.approx(ka, abs=1e-9 * max(1, fr_a, fr_b, ka))
    assert fa_a >= 0.5 * fr_a / y_a * (1 - 1e-12)
    assert fa_b >= 0.5 * fr_b / y_b * (1 - 1e-12)


@pytest.mark.parametrize("arrangement, loaded", [("back-to-back", "outboard"),
                                                  ("face-to-face", "inboard")])
def test_inboard_push_goes_to_the_bearing_the_arrangement_names(arrangement, loaded):
    # The definition: back-to-back, the outboard bearing carries inboard push.
    fa_o, fa_i = tapered_pair.axial_loads(1.0, 1.5, 1.0, 1.5, np.array(-5.0), arrangement)
    carried = {"outboard": fa_o, "inboard": fa_i}
    other = "inboard" if loaded == "outboard" else "outboard"
    assert carried[loaded] - carried[other] == pytest.approx(5.0)
