"""Reference rating life of a roller bearing from its lamina loads (ISO/TS 16281).

Each lamina k of the inner and of the outer raceway has a basic dynamic load
rating q_c,k; the loads it meets around the ring are reduced to an equivalent
load q_e,k, by a 4th-power mean on the ring that rotates relative to the load
and a 4.5th-power mean on the ring that stands still relative to it. Then

    L10r = [ sum_k (q_ci,k / q_ei,k)^(-9/2) + (q_co,k / q_eo,k)^(-9/2) ]^(-8/9)

in 10^6 revolutions [1, 2]. For a uniformly loaded roller the sum does not
depend on the number of laminae (the lamina rating scales with width^(7/9)),
and for a line contact this is Lundberg and Palmgren's life with exponent 4;
ISO 281 uses 10/3 for roller bearings as a compromise with edge-loaded,
partly point-like contacts, which is why the two lives differ away from C/P = 1
(docs/refined-method.md).

References
----------
[1] ISO/TS 16281:2008, Rolling bearings -- Methods for calculating the modified
    reference rating life for universally loaded bearings, clause on roller
    bearings: lamina ratings, equivalent lamina loads, reference rating life and
    the reference equivalent load Pref = C / L10r^(3/10) (constants from memory).
[2] G. Lundberg, A. Palmgren, Dynamic capacity of roller bearings, Acta
    Polytech. Mech. Eng. Ser. 2 (1952); raceway capacities
    Qc = 552 lambda nu gamma^(2/9) (1 -+ gamma)^(29/27) (1 +- gamma)^(-1/4)
    Dwe^(29/27) l^(7/9) Z^(-1/4) [N, mm], inner (upper signs) and outer raceway,
    as quoted in T. A. Harris, M. N. Kotzalas, Essential Concepts of Bearing
    Technology, 5th ed., CRC 2007, ch. 11. The factors bm = 1.1 and
    lambda nu = 0.83 of ISO 281:2007 are applied so that both methods share one
    rating basis.
"""

from __future__ import annotations

import numpy as np

from hubload.model.iso281 import LIFE_EXPONENT_ROLLER, WEIBULL_SLOPE_ROLLER
from hubload.model.refined.layout import RollerSet
from hubload.model.refined.ratings import (
    RATING_FACTOR_TAPERED, REDUCTION_FACTOR_ROLLER, geometry_ratio)
from hubload.units import MM

RACEWAY_CAPACITY_CONSTANT = 552.0
ROTATING_MEAN_EXPONENT = 4.0    # built by squaring in equivalent_lamina_loads_n
STANDING_MEAN_EXPONENT = 4.5    # 4 + 1/2: squaring and a square root
LAMINA_LIFE_EXPONENT = 4.5
# L10r goes with the lamina ratings to the power (9/2)(8/9) = 4: Lundberg and Palmgren's
# line-contact life exponent [2], not ISO 281's 10/3.
RATING_LIFE_EXPONENT = LAMINA_LIFE_EXPONENT / WEIBULL_SLOPE_ROLLER


def lamina_ratings_n(rollers: RollerSet, laminae: int):
    """(inner, outer) basic dynamic rating [N] of one lamina of each raceway [1, 2]."""
    gamma = geometry_ratio(rollers.roller_diameter_m, rollers.contact_angle_rad,
                           rollers.pitch_diameter_m)
    common = (RACEWAY_CAPACITY_CONSTANT * RATING_FACTOR_TAPERED * REDUCTION_FACTOR_ROLLER
              * gamma ** (2.0 / 9.0) * (rollers.roller_diameter_m / MM) ** (29.0 / 27.0)
              * (rollers.roller_length_m / MM / laminae) ** (7.0 / 9.0)
              * rollers.rollers ** -0.25)
    inner = common * (1.0 - gamma) ** (29.0 / 27.0) * (1.0 + gamma) ** -0.25
    outer = common * (1.0 + gamma) ** (29.0 / 27.0) * (1.0 - gamma) ** -0.25
    return inner, outer


def equivalent_lamina_loads_n(lamina_loads_n, rotating_ring="inner"):
    """(inner, outer) equivalent load [N] of each lamina of the raceways, (laminae, ...) [1].

    Rollers on axis 0 of (Z, laminae, ...). With ``rotating_ring`` = "inner" (shaft turns
    in a fixed housing) every point of the inner raceway passes through the load zone:
    the 4th-power mean over the rollers, (mean q^4)^(1/4); the outer raceway is loaded at
    fixed places: the 4.5th-power mean. "outer" swaps them.
    """
    # q^4 by two squarings and q^4.5 = q^4 sqrt(q): numpy's power takes its slow general
    # path for these exponents, and this runs over every lamina of every case.
    fourth_powers = np.square(np.square(lamina_loads_n))
    rotating = np.mean(fourth_powers, axis=0) ** (1.0 / ROTATING_MEAN_EXPONENT)
    standing = (np.mean(fourth_powers * np.sqrt(lamina_loads_n), axis=0)
                ** (1.0 / STANDING_MEAN_EXPONENT))
    return (rotating, standing) if rotating_ring == "inner" else (standing, rotating)


def reference_life_mrev(rollers: RollerSet, lamina_loads_n, rotating_ring="inner"):
    """Reference rating life L10r [10^6 rev] from lamina loads (Z, laminae, ...) [1]."""
    laminae = lamina_loads_n.shape[1]
    rating_inner, rating_outer = lamina_ratings_n(rollers, laminae)
    equivalent_inner, equivalent_outer = equivalent_lamina_loads_n(lamina_loads_n, rotating_ring)
    damage = np.sum((equivalent_inner / rating_inner) ** LAMINA_LIFE_EXPONENT
                    + (equivalent_outer / rating_outer) ** LAMINA_LIFE_EXPONENT, axis=0)
    with np.errstate(divide="ignore"):
        return np.where(damage > 0, np.power(np.where(damage > 0, damage, 1.0),
                                             -1.0 / WEIBULL_SLOPE_ROLLER), np.inf)


def life_factor_of_rating_factor(rating_factor):
    """Factor [-] on L10r when every lamina rating is multiplied by ``rating_factor`` [1].

    L10r = [sum (q_e / q_c)^(9/2)]^(-8/9) scales with the ratings to the power
    (9/2)(8/9) = 4, the line-contact life exponent of Lundberg and Palmgren [2].
    """
    return np.power(rating_factor, RATING_LIFE_EXPONENT)


def reference_equivalent_load_n(dynamic_rating_n, life_mrev):
    """Pref [N] = C / L10r^(3/10): the load whose ISO 281 life equals L10r [1]."""
    with np.errstate(divide="ignore"):
        return dynamic_rating_n * np.power(life_mrev, -1.0 / LIFE_EXPONENT_ROLLER)
