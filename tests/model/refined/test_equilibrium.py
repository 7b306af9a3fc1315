"""Properties of every equilibrium: statics, setting and symmetry (hypothesis)."""

import math

import numpy as np
import pytest
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from hubload.model.refined import contact, layout, pair_bearings, pair_response, solver

from refined_pairs import roller_set, symmetric_pair

PROPERTY = settings(max_examples=40, deadline=None)


@st.composite
def roller_sets(draw):
    rollers = draw(st.integers(12, 30))
    diameter = draw(st.floats(6.0, 20.0))
    angle = draw(st.floats(10.0, 30.0))
    gamma = draw(st.floats(0.06, 0.3))
    pitch = max(diameter * math.cos(math.radians(angle)) / gamma, 1.1 * rollers * diameter / math.pi)
    return roller_set(rollers, diameter, draw(st.floats(0.8, 2.0)) * diameter, angle, pitch,
                      draw(st.floats(0.0, 20.0)))


@st.composite
def pairs(draw):
    return pair_bearings(draw(st.sampled_from(["back-to-back", "face-to-face"])),
                         draw(roller_sets()), draw(st.floats(5.0, 90.0)) * 1e-3,
                         draw(roller_sets()), -draw(st.floats(5.0, 90.0)) * 1e-3)


def kilonewtons(low, high):
    """Forces rounded to 1 N: sub-newton forces are noise for a wheel bearing."""
    return st.floats(low, high).map(lambda value: round(value, 3))


@st.composite
def hub_pairs(draw):
    """Pairs in wheel-hub proportions: spread at least four roller lengths (common practice)."""
    bearings = draw(pairs())
    spread = bearings[0].load_centre_m - bearings[1].load_centre_m
    assume(spread >= 4 * max(b.rollers.roller_length_m for b in bearings))
    return bearings


forces_kn = st.lists(kilonewtons(-40.0, 40.0), min_size=3, max_size=3)


def independent_residuals(bearings, loads_per_bearing, ground_force, patch):
    """Force and moment sums about the origin, rebuilt from the geometry (not the solver's matrix)."""
    forces, moments = [np.array(ground_force, dtype=float)], [np.cross(patch, ground_force)]
    for bearing, loads in zip(bearings, loads_per_bearing):
        rollers = bearing.rollers
        alpha = rollers.contact_angle_rad
        psi = 2 * np.pi * np.arange(rollers.rollers) / rollers.rollers
        normals = np.stack([np.full_like(psi, bearing.thrust_sign * math.sin(alpha)),
                            math.cos(alpha) * np.cos(psi), math.cos(alpha) * np.sin(psi)], -1)
        offsets = contact.lamina_offsets_m(rollers.roller_length_m, loads.shape[1])
        points = np.zeros((offsets.size, 3))
        points[:, 0] = bearing.load_centre_m + offsets / math.cos(alpha)
        on_shaft = -loads[:, :, None] * normals[:, None, :]
        forces.append(on_shaft.reshape(-1, 3))
        moments.append(np.cross(np.broadcast_to(points, on_shaft.shape), on_shaft).reshape(-1, 3))
    forces, moments = np.concatenate([f.reshape(-1, 3) for f in forces]), np.concatenate(
        [m.reshape(-1, 3) for m in moments])
    # Floors of 1 N and 1 N m: near zero load and setting the contacts carry millinewtons,
    # where a relative test would judge noise far below what a wheel bearing can feel.
    force_scale = max(np.abs(forces).sum(), 1.0)
    moment_scale = max(np.abs(moments[:, 1:]).sum(), 1.0)
    return (np.abs(forces.sum(axis=0)) / force_scale,
            np.abs(moments.sum(axis=0)[1:]) / moment_scale)


@PROPERTY
@given(pairs(), forces_kn, st.floats(-0.05, 0.25), st.floats(0.2, 0.6), st.floats(-80.0, 300.0))
def test_every_solution_balances_forces_and_moments(bearings, forces, offset, radius, setting_um):
    wheel, side, tractive = abs(forces[0]) * 1e3, forces[1] * 1e3, forces[2] * 1e3
    laminae = layout.build_laminae(bearings)
    external = layout.external_load_vector(np.array([wheel]), np.array([side]),
                                           np.array([tractive]), offset, radius,
                                           laminae.mid_x_m, laminae.half_spread_m)
    found = solver.solve_equilibrium(laminae, external, np.array([setting_um * 1e-6]))
    assert found.converged.all()
    force_error, moment_error = independent_residuals(
        bearings, [loads[..., 0] for loads in laminae.per_bearing(found.lamina_loads_n)],
        [-side, wheel, tractive], np.array([offset, -radius, 0.0]))
    assert np.all(force_error < 1e-6) and np.all(moment_error < 1e-6)


@PROPERTY
@given(hub_pairs(), kilonewtons(0.0, 60.0), kilonewtons(-40.0, 40.0), st.floats(-0.05, 0.25),
       st.lists(st.floats(-40.0, 300.0), min_size=2, max_size=6))
def test_more_end_play_never_enlarges_the_load_zone_under_radial_load(
        bearings, wheel_kn, tractive_kn, offset, settings_um):
    # Pure radial load: no side force, so no axial force and no tyre couple. With simple
    # supports the radial loads are fixed by statics and both load zones shrink as the play
    # grows (Harris & Kotzalas, ch. 7). Long rollers on a short spread carry enough moment to
    # shift radial load between the bearings and can widen a load zone slightly (found with
    # this test; docs/refined-method.md), so the property is checked in hub proportions.
    setting = np.sort(np.array(settings_um)) * 1e-6
    response = pair_response(bearings, wheel_kn * 1e3, 0.0, tractive_kn * 1e3, offset, 0.4,
                             setting)
    assert response.converged.all()
    for bearing in response.bearings:
        assert np.all(np.diff(bearing.load_zone_rad) <= 1e-9)


@PROPERTY
@given(kilonewtons(0.0, 60.0), kilonewtons(-40.0, 40.0), st.floats(-60.0, 200.0),
       st.sampled_from(["back-to-back", "face-to-face"]), st.floats(0.0, 15.0))
def test_symmetric_bearings_under_symmetric_load_share_it_equally(
        wheel_kn, tractive_kn, setting_um, arrangement, crown_um):
    response = pair_response(symmetric_pair(arrangement=arrangement, crown_um=crown_um),
                             wheel_kn * 1e3, 0.0, tractive_kn * 1e3, 0.0, 0.4, setting_um * 1e-6)
    outboard, inboard = response.bearings
    scale = max(float(outboard.radial_n), 1.0)
    for name in ("radial_n", "axial_n", "max_roller_load_n"):
        assert abs(float(getattr(outboard, name)) - float(getattr(inboard, name))) < 1e-6 * scale
    assert float(outboard.life_mrev) == pytest.approx(float(inboard.life_mrev), rel=1e-6)
    assert float(response.tilt_rad) < 1e-9


def test_large_end_play_and_pure_axial_load_converge():
    # 2 mm end play: the shaft slides until one bearing takes all of the thrust.
    response = pair_response(symmetric_pair(), np.array([0.0, 10e3, 0.0]),
                             np.array([20e3, 5e3, 0.0]), 0.0, 0.0, 0.0, 2e-3)
    assert response.converged.all()
    outboard, inboard = response.bearings
    # Back-to-back: the outboard bearing takes inboard push (side force > 0).
    assert outboard.axial_n[0] == pytest.approx(20e3, rel=1e-9) and inboard.axial_n[0] == 0.0
    assert np.degrees(outboard.load_zone_rad[0]) == pytest.approx(360.0)
    assert outboard.axial_n[2] == 0.0 and inboard.axial_n[2] == 0.0


def test_preload_without_external_load_loads_the_whole_ring_of_both_bearings():
    response = pair_response(symmetric_pair(), 0.0, 0.0, 0.0, 0.0, 0.4, -30e-6)
    for bearing in response.bearings:
        assert np.degrees(bearing.load_zone_rad) == pytest.approx(360.0)
        assert bearing.axial_n > 0
    assert response.bearings[0].axial_n == pytest.approx(response.bearings[1].axial_n)


def test_batch_axes_broadcast_with_cases_last():
    settings_m = np.array([[-20e-6], [0.0], [80e-6]])
    response = pair_response(symmetric_pair(), np.array([10e3, 20e3]), 0.0, 0.0, 0.1, 0.4,
                             settings_m)
    assert response.bearings[0].life_mrev.shape == (3, 2)
    single = pair_response(symmetric_pair(), 20e3, 0.0, 0.0, 0.1, 0.4, 80e-6)
    assert response.bearings[0].life_mrev[2, 1] == pytest.approx(float(single.bearings[0].life_mrev))
