"""Basic load ratings of a tapered roller bearing from its internal geometry.

References
----------
[1] ISO 281:2007, Rolling bearings -- Dynamic load ratings and rating life,
    7.1.1: Cr = bm fc (i Lwe cos a)^(7/9) Z^(3/4) Dwe^(29/27) [N, mm];
    table 1: bm = 1.1 for tapered roller bearings; table 7: fc for radial roller
    bearings against Dwe cos(a) / Dpw, linear interpolation between rows
    (table values from memory; checked in the tests against [3]).
[2] ISO 76:2006, Rolling bearings -- Static load ratings, 6.1.1:
    C0r = 44 (1 - Dwe cos(a) / Dpw) i Z Lwe Dwe cos(a) [N, mm], the load that
    gives a calculated contact stress of 4000 MPa at the most heavily loaded
    roller/raceway contact.
[3] G. Lundberg, A. Palmgren, Dynamic capacity of roller bearings, Acta
    Polytech. Mech. Eng. Ser. 2 (1952); the closed form behind table 7 as given
    in T. A. Harris, M. N. Kotzalas, Essential Concepts of Bearing Technology,
    5th ed., CRC 2007, ch. 11: fc = 207.9 lambda nu gamma^(2/9) (1 - gamma)^(29/27)
    (1 + gamma)^(-1/4) [1 + (1.04 ((1 - gamma)/(1 + gamma))^(143/108))^(9/2)]^(-2/9),
    with the reduction factor lambda nu = 0.83 for roller bearings (from memory).
"""

from __future__ import annotations

import numpy as np

from hubload.units import MM

RATING_FACTOR_TAPERED = 1.1          # bm, ISO 281:2007 table 1
REDUCTION_FACTOR_ROLLER = 0.83       # lambda nu of [3]
STATIC_RATING_CONSTANT = 44.0        # ISO 76:2006 6.1.1 [N/mm^2]
FC_TABLE_GAMMA = np.round(np.arange(1, 51) * 0.01, 2)
FC_TABLE = np.array([
    52.1, 60.8, 66.5, 70.7, 74.1, 76.9, 79.2, 81.2, 82.8, 84.2,
    85.4, 86.4, 87.1, 87.7, 88.2, 88.5, 88.7, 88.8, 88.8, 88.7,
    88.5, 88.2, 87.9, 87.5, 87.0, 86.4, 85.8, 85.2, 84.5, 83.8,
    83.0, 82.2, 81.3, 80.4, 79.5, 78.6, 77.6, 76.6, 75.5, 74.5,
    73.4, 72.3, 71.1, 70.0, 68.8, 67.6, 66.4, 65.1, 63.9, 62.6,
])
GAMMA_MIN = float(FC_TABLE_GAMMA[0])
GAMMA_MAX = float(FC_TABLE_GAMMA[-1])


def geometry_ratio(roller_diameter_m, contact_angle_rad, pitch_diameter_m):
    """gamma = Dwe cos(a) / Dpw [-], the argument of the fc table [1]."""
    return roller_diameter_m * np.cos(contact_angle_rad) / pitch_diameter_m


def fc_factor(gamma):
    """fc of ISO 281:2007 table 7 at ``gamma`` by linear interpolation [1].

    ``gamma`` must lie inside the table (0.01 to 0.5); the case file checks it.
    """
    return np.interp(gamma, FC_TABLE_GAMMA, FC_TABLE)


def fc_lundberg_palmgren(gamma):
    """fc from the Lundberg-Palmgren closed form [3] (the theory behind table 7)."""
    ratio = (1.0 - gamma) / (1.0 + gamma)
    raceways = (1.0 + (1.04 * ratio ** (143.0 / 108.0)) ** 4.5) ** (-2.0 / 9.0)
    return (207.9 * REDUCTION_FACTOR_ROLLER * gamma ** (2.0 / 9.0)
            * (1.0 - gamma) ** (29.0 / 27.0) * (1.0 + gamma) ** -0.25 * raceways)


def dynamic_rating_n(rollers, roller_diameter_m, roller_length_m, contact_angle_rad,
                     pitch_diameter_m, rows=1):
    """Basic dynamic radial load rating Cr [N] of a tapered roller bearing [1, 7.1.1]."""
    gamma = geometry_ratio(roller_diameter_m, contact_angle_rad, pitch_diameter_m)
    length_mm = rows * roller_length_m / MM * np.cos(contact_angle_rad)
    return (RATING_FACTOR_TAPERED * fc_factor(gamma) * length_mm ** (7.0 / 9.0)
            * np.power(rollers, 0.75) * (roller_diameter_m / MM) ** (29.0 / 27.0))


def static_rating_n(rollers, roller_diameter_m, roller_length_m, contact_angle_rad,
                    pitch_diameter_m, rows=1):
    """Basic static radial load rating C0r [N] of a tapered roller bearing [2, 6.1.1]."""
    gamma = geometry_ratio(roller_diameter_m, contact_angle_rad, pitch_diameter_m)
    return (STATIC_RATING_CONSTANT * (1.0 - gamma) * rows * rollers
            * (roller_length_m / MM) * (roller_diameter_m / MM) * np.cos(contact_angle_rad))
