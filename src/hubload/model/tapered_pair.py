"""Axial loads of a pair of single-row tapered roller bearings.

References
----------
[1] ISO 281:2007, Rolling bearings -- Dynamic load ratings and rating life,
    clause 7.3.2 and table 8 (X, Y of single-row tapered roller bearings; the
    induced axial force Fr / (2 Y) of a radially loaded tapered bearing).
[2] T. A. Harris, M. N. Kotzalas, Essential Concepts of Bearing Technology,
    5th ed., CRC 2007, ch. 7 (axial load distribution of paired angular-contact
    and tapered bearings mounted without clearance or preload).
"""

from __future__ import annotations

import numpy as np

BACK_TO_BACK = "back-to-back"
FACE_TO_FACE = "face-to-face"
ARRANGEMENTS = (BACK_TO_BACK, FACE_TO_FACE)


def induced_axial_force_n(radial_load_n, y_factor):
    """Axial force [N] a tapered bearing induces under radial load: 0.5 Fr / Y [1].

    This is the ISO-style form that goes with ISO 281 Y factors; the inch-series
    form 0.47 Fr / K belongs to another rating convention and is not used.
    """
    return 0.5 * radial_load_n / y_factor


def pair_axial_loads(radial_a_n, y_a, radial_b_n, y_b, external_axial_n):
    """Axial loads [N] of bearings A and B of a pair, zero clearance, no preload [2].

    ``external_axial_n`` >= 0 [N] is the external axial force, directed so that
    bearing A carries it. Each bearing carries at least its own induced force:

    - if Fi_A <= Fi_B + Ka:  Fa_A = Fi_B + Ka,  Fa_B = Fi_B
    - otherwise:             Fa_A = Fi_A,       Fa_B = Fi_A - Ka
    """
    induced_a = induced_axial_force_n(radial_a_n, y_a)
    induced_b = induced_axial_force_n(radial_b_n, y_b)
    b_pushes_a = induced_a <= induced_b + external_axial_n
    fa_a = np.where(b_pushes_a, induced_b + external_axial_n, induced_a)
    fa_b = np.where(b_pushes_a, induced_b, induced_a - external_axial_n)
    return fa_a, fa_b


def outboard_carries_inboard_push(arrangement):
    """True when the outboard bearing carries an axial force that pushes the shaft inboard.

    Back-to-back: the outboard bearing takes inboard thrust, the inboard bearing
    outboard thrust; face-to-face: the other way round (common practice for
    the two mountings, as defined in docs/conventions.md).
    """
    return arrangement == BACK_TO_BACK


def axial_loads(radial_outboard_n, y_outboard, radial_inboard_n, y_inboard,
                shaft_axial_n, arrangement):
    """Axial loads [N] of the outboard and inboard bearing.

    ``shaft_axial_n`` [N] is the external axial force on the shaft, positive
    outboard. The bearing that carries it is chosen by direction and
    ``arrangement``; then :func:`pair_axial_loads` applies.
    """
    pushes_inboard = shaft_axial_n < 0
    outboard_is_a = pushes_inboard == outboard_carries_inboard_push(arrangement)
    thrust_n = np.abs(shaft_axial_n)
    fa_o_if_a, fa_i_if_b = pair_axial_loads(
        radial_outboard_n, y_outboard, radial_inboard_n, y_inboard, thrust_n)
    fa_i_if_a, fa_o_if_b = pair_axial_loads(
        radial_inboard_n, y_inboard, radial_outboard_n, y_outboard, thrust_n)
    fa_outboard = np.where(outboard_is_a, fa_o_if_a, fa_o_if_b)
    fa_inboard = np.where(outboard_is_a, fa_i_if_b, fa_i_if_a)
    return fa_outboard, fa_inboard
