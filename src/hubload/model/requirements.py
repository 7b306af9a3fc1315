"""What a bearing supplier needs: the spectrum's equivalent load, required static rating, flange moment.

References
----------
[1] ISO 281:2007, Rolling bearings -- Dynamic load ratings and rating life, 7.1:
    L10 = (C/P)^p million revolutions, p = 10/3 for roller bearings.
[2] R. G. Budynas, J. K. Nisbett, Shigley's Mechanical Engineering Design, 10th ed.,
    McGraw-Hill 2015, sec. 11-7 "Variable Loading" (section number from memory): the
    equivalent load of a load spectrum, F_eq = [sum f_i F_i^a]^(1/a) with f_i the
    fractions of revolutions, from linear damage accumulation; the same mean effective
    load is in T. A. Harris, M. N. Kotzalas, Essential Concepts of Bearing Technology,
    5th ed., 2007 (from memory).
[3] ISO 76:2006, Rolling bearings -- Static load ratings, 6.2 and annex: s0 = C0 / P0.
[4] J. L. Meriam, L. G. Kraige, Engineering Mechanics: Statics, ch. 2 (moment of a
    force about a point, M = r x F).
"""

from __future__ import annotations

import numpy as np

from hubload.model import statics
from hubload.model.iso281 import LIFE_EXPONENT_ROLLER


def spectrum_equivalent_load_n(time_fraction, speed_rpm, equivalent_load_n,
                               exponent=LIFE_EXPONENT_ROLLER):
    """Constant load [N] that gives the spectrum's damage at its mean speed [1, 2].

    Damage per hour of the spectrum, sum t_j n_j (P_j / C)^p, equals that of a
    constant load Pm at the time-weighted mean speed n_m = sum t_j n_j:
    Pm = (sum t_j n_j P_j^p / n_m)^(1/p) (the revolution-weighted p-mean of
    [2]); standstill cases turn no revolutions and drop out. 0 when nothing turns.
    Reduces over the case axis (last).
    """
    revolutions = np.asarray(time_fraction) * np.asarray(speed_rpm)
    total = np.sum(revolutions, axis=-1)
    weighted = np.sum(revolutions * np.power(equivalent_load_n, exponent), axis=-1)
    with np.errstate(divide="ignore", invalid="ignore"):
        mean = np.power(weighted / total, 1.0 / exponent)
    return np.where(total > 0, mean, 0.0)


def required_static_rating_n(max_static_load_n, required_safety):
    """Static rating C0 [N] for a static safety of at least ``required_safety``: s0 P0,max [3]."""
    return np.asarray(required_safety) * max_static_load_n


def wheel_moment_nm(section_x_m, wheel_load_n, side_force_n, tractive_force_n, offset_m,
                    loaded_radius_m):
    """Bending moment [N m] of the tyre forces about the shaft axis at ``section_x_m`` [m] [4].

    The resultant sqrt(M_y^2 + M_z^2) of the ground forces' moments about the section's
    centre (:func:`hubload.model.statics.tyre_moments_nm`, side force positive
    inboard): the bending moment the motor's mounting face must carry. The drive
    torque about the axis is carried by the motor and is not included.
    """
    return statics.resultant(*statics.tyre_moments_nm(section_x_m, wheel_load_n, side_force_n,
                                             tractive_force_n, offset_m, loaded_radius_m))
