"""Rigid-shaft statics against sympy's beam solver and the equilibrium equations."""

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from beam_reference import sympy_two_support_beam
from hubload.model import statics

finite = st.floats(-1e5, 1e5, allow_nan=False)
position = st.floats(-0.3, 0.3, allow_nan=False)


@pytest.mark.parametrize("force_n, couple_nm, load_x_m, outboard_x_m, inboard_x_m, section_x_m", [
    (20e3, -1.6e3, 0.10, 0.03, -0.05, 0.06),   # wheel outboard of both bearings
    (15e3, 2.0e3, -0.02, 0.04, -0.06, 0.00),   # wheel centre between the bearings
    (-8e3, 0.0, 0.25, 0.02, -0.08, -0.03),     # section between the bearings
])
def test_plane_reactions_and_moment_match_sympy_beam_solver(
        force_n, couple_nm, load_x_m, outboard_x_m, inboard_x_m, section_x_m):
    # Reference: sympy.physics.continuum_mechanics.beam.Beam (independent beam solver).
    ref_out, ref_in, ref_moment, _ = sympy_two_support_beam(
        force_n, couple_nm, load_x_m, outboard_x_m, inboard_x_m, section_x_m)
    out_n, in_n = statics.plane_reactions(force_n, couple_nm, load_x_m, outboard_x_m, inboard_x_m)
    assert out_n == pytest.approx(ref_out, rel=1e-9)
    assert in_n == pytest.approx(ref_in, rel=1e-9)
    side_n = -couple_nm / 0.4
    vertical_nm, horizontal_nm, _ = statics.section_moments(
        section_x_m, force_n, side_n, 0.0, load_x_m, 0.4, outboard_x_m, inboard_x_m)
    assert abs(vertical_nm) == pytest.approx(abs(ref_moment), rel=1e-9, abs=1e-6)
    assert horizontal_nm == 0.0


@settings(max_examples=200)
@given(wheel=st.floats(0, 1e5), side=finite, tractive=finite, offset=position,
       radius=st.floats(0.1, 0.8), outboard=position, spread=st.floats(0.01, 0.3))
def test_bearing_reactions_satisfy_force_and_moment_equilibrium(
        wheel, side, tractive, offset, radius, outboard, spread):
    # Statics of a rigid body (Gere & Goodno, Mechanics of Materials, ch. 4): sum F = 0, sum M = 0.
    inboard = outboard - spread
    v_o, v_i, h_o, h_i = statics.bearing_reactions(
        wheel, side, tractive, offset, radius, outboard, inboard)
    scale = max(1.0, abs(wheel), abs(side), abs(tractive)) * (1 + abs(offset) / spread)
    assert v_o + v_i + wheel == pytest.approx(0.0, abs=1e-9 * scale)
    assert h_o + h_i + tractive == pytest.approx(0.0, abs=1e-9 * scale)
    # moments about the origin, vertical plane: x F_y plus the tyre couple -R S
    vertical_moment = outboard * v_o + inboard * v_i + offset * wheel - radius * side
    horizontal_moment = outboard * h_o + inboard * h_i + offset * tractive
    assert vertical_moment == pytest.approx(0.0, abs=1e-9 * scale)
    assert horizontal_moment == pytest.approx(0.0, abs=1e-9 * scale)


def test_reactions_broadcast_over_cases_and_batch_axes():
    wheel = np.array([10e3, 20e3, 30e3])
    offsets = np.array([[0.05], [0.10]])
    fr_o, fr_i = statics.radial_loads(wheel, 0.0, 0.0, offsets, 0.4, 0.03, -0.05)
    assert fr_o.shape == (2, 3)
    assert np.all(np.diff(fr_o, axis=0) > 0)


@settings(max_examples=100)
@given(wheel=st.floats(0, 1e5), side=finite, tractive=finite, offset=position,
       radius=st.floats(0.1, 0.8), point=position)
def test_tyre_moments_are_the_cross_product_of_lever_and_ground_force(
        wheel, side, tractive, offset, radius, point):
    # Moment of a force about a point, M = r x F (Meriam & Kraige, Engineering Mechanics:
    # Statics, ch. 2), evaluated by numpy's cross product: ground force (-S, W, T) at the
    # contact patch (offset, -R, 0), point (x, 0, 0) on the axis; M_x is the drive torque.
    expected = np.cross([offset - point, -radius, 0.0], [-side, wheel, tractive])
    moment_y, moment_z = statics.tyre_moments_nm(point, wheel, side, tractive, offset, radius)
    scale = max(1.0, abs(wheel), abs(side), abs(tractive))
    assert moment_y == pytest.approx(expected[1], abs=1e-9 * scale)
    assert moment_z == pytest.approx(expected[2], abs=1e-9 * scale)
