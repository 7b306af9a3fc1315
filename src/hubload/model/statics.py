"""Rigid-shaft statics of a wheel carried on two bearings.

Coordinates (see docs/conventions.md): x along the shaft axis from the motor's
mounting face, positive outboard (towards the wheel); y vertical, positive up;
z longitudinal, positive forward (direction of travel). The ground acts on the
tyre at the contact patch, at x = wheel offset and y = -loaded radius:

- wheel load W   [N] along +y (ground pushes the tyre up),
- side force S   [N] along -x when positive (towards the vehicle centreline),
- tractive force T [N] along +z when positive (driving), negative when braking.

Each bearing is a simple support at its effective load centre. All functions
broadcast over numpy arrays; the case axis is the last one.

References
----------
[1] J. M. Gere, B. J. Goodno, Mechanics of Materials, 8th ed., Cengage 2013,
    ch. 4 (reactions, shear force and bending moment of beams; statics of a
    simply supported beam with an overhang).
"""

from __future__ import annotations

import numpy as np


def resultant(first, second):
    """Magnitude of the vector sum of two perpendicular components, sqrt(a^2 + b^2) [1].

    Written out rather than ``np.hypot``, which is several times slower: hypot's guard
    against squares beyond the float range is not needed for the forces [N] and moments
    [N m] of a wheel end (inputs are limited far below 1e150).
    """
    first = np.asarray(first, dtype=float)
    second = np.asarray(second, dtype=float)
    return np.sqrt(first * first + second * second)


def plane_reactions(force_n, moment_nm, load_x_m, outboard_x_m, inboard_x_m):
    """Support reactions of a two-support shaft loaded in one plane.

    A transverse force ``force_n`` [N] acts at ``load_x_m`` [m] together with a
    couple ``moment_nm`` [N m] (about the axis normal to the plane, positive
    counter-clockwise in the x-force plane). Returns the reactions [N] of the
    outboard and inboard support on the shaft, from sum F = 0 and sum M = 0 [1].
    """
    span_m = outboard_x_m - inboard_x_m
    outboard_n = (force_n * (inboard_x_m - load_x_m) - moment_nm) / span_m
    inboard_n = -force_n - outboard_n
    return outboard_n, inboard_n


def tyre_couple_vertical_nm(side_force_n, loaded_radius_m):
    """Couple [N m] in the vertical (x-y) plane from the side force at the contact patch.

    The side force acts a loaded radius below the axis: r x F with r = (0, -R, 0)
    and F = (-S, 0, 0) gives M_z = -R S [1].
    """
    return -loaded_radius_m * side_force_n


def tyre_moments_nm(point_x_m, wheel_load_n, side_force_n, tractive_force_n, offset_m,
                    loaded_radius_m):
    """Moments (M_y, M_z) [N m] of the ground forces about the point (x, 0, 0) on the axis.

    The forces F = (-S, W, T) act at the contact patch, r = (offset - x, -R, 0) from
    the point: M = r x F gives M_y = -(offset - x) T and M_z = (offset - x) W - R S [1].
    The moment about the axis itself (-R T) is the drive torque, carried by the motor.
    """
    lever_m = np.asarray(offset_m) - point_x_m
    return (-lever_m * np.asarray(tractive_force_n, dtype=float),
            lever_m * wheel_load_n + tyre_couple_vertical_nm(side_force_n, loaded_radius_m))


def bearing_reactions(wheel_load_n, side_force_n, tractive_force_n, offset_m,
                      loaded_radius_m, outboard_x_m, inboard_x_m):
    """Forces [N] of the outboard and inboard bearing on the shaft, both planes.

    Returns ``(vertical_outboard, vertical_inboard, horizontal_outboard,
    horizontal_inboard)``; vertical along +y, horizontal along +z [1].
    The side force enters the vertical plane through its couple; the tractive
    force acts in the horizontal plane (its torque about the axis is carried by
    the motor, not by the bearings).
    """
    couple_nm = tyre_couple_vertical_nm(side_force_n, loaded_radius_m)
    vertical_o, vertical_i = plane_reactions(
        wheel_load_n, couple_nm, offset_m, outboard_x_m, inboard_x_m)
    horizontal_o, horizontal_i = plane_reactions(
        tractive_force_n, 0.0, offset_m, outboard_x_m, inboard_x_m)
    return vertical_o, vertical_i, horizontal_o, horizontal_i


def radial_loads(wheel_load_n, side_force_n, tractive_force_n, offset_m,
                 loaded_radius_m, outboard_x_m, inboard_x_m):
    """Radial load [N] on the outboard and inboard bearing: vector sum of both planes [1]."""
    v_o, v_i, h_o, h_i = bearing_reactions(
        wheel_load_n, side_force_n, tractive_force_n, offset_m,
        loaded_radius_m, outboard_x_m, inboard_x_m)
    return resultant(v_o, h_o), resultant(v_i, h_i)


def external_axial_force_n(side_force_n):
    """Axial force [N] of the wheel on the shaft, positive outboard (+x).

    A positive side force pushes the tyre, and so the shaft, inboard (sign
    convention of this module, docs/conventions.md; axial force balance [1]).
    """
    return -np.asarray(side_force_n, dtype=float)


def section_moments(section_x_m, wheel_load_n, side_force_n, tractive_force_n,
                    offset_m, loaded_radius_m, outboard_x_m, inboard_x_m, wheel_beyond=None):
    """Bending moments [N m] in the shaft at ``section_x_m`` [m], both planes.

    Method of sections [1]: the moment is that of every force outboard of the
    section (x > section) about the section. Returns ``(vertical_nm,
    horizontal_nm, shear_n)`` with the shear force magnitude [N]; the resultant
    bending moment is ``resultant(vertical_nm, horizontal_nm)``.

    ``wheel_beyond`` says whether the tyre forces act on the outboard part; by
    default when the wheel centre plane is outboard of the section. A wheel
    bolted to a flange at the shaft's outboard end loads every section of the
    shaft (``wheel_beyond=True``), also where a dished wheel puts its centre
    plane inboard of the section.
    """
    v_o, v_i, h_o, h_i = bearing_reactions(
        wheel_load_n, side_force_n, tractive_force_n, offset_m,
        loaded_radius_m, outboard_x_m, inboard_x_m)
    couple_nm = tyre_couple_vertical_nm(side_force_n, loaded_radius_m)
    vertical_nm = 0.0
    horizontal_nm = 0.0
    shear_v = 0.0
    shear_h = 0.0
    if wheel_beyond is None:
        wheel_beyond = offset_m > section_x_m
    for x_m, f_vertical, f_horizontal, extra_nm, acts_beyond in (
            (offset_m, wheel_load_n, tractive_force_n, couple_nm, wheel_beyond),
            (outboard_x_m, v_o, h_o, 0.0, outboard_x_m > section_x_m),
            (inboard_x_m, v_i, h_i, 0.0, inboard_x_m > section_x_m)):
        if np.ndim(acts_beyond) == 0 and not acts_beyond:
            continue    # a force inboard of the section adds nothing (skipped: no 0 x inf)
        beyond = np.asarray(acts_beyond, dtype=float)
        lever_m = x_m - section_x_m
        vertical_nm = vertical_nm + beyond * (lever_m * f_vertical + extra_nm)
        horizontal_nm = horizontal_nm + beyond * (lever_m * f_horizontal)
        shear_v = shear_v + beyond * f_vertical
        shear_h = shear_h + beyond * f_horizontal
    return vertical_nm, horizontal_nm, resultant(shear_v, shear_h)
