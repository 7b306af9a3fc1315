"""Line contact of a roller between two raceways: stiffness, pressure, profile.

The roller is cut into laminae (slices) of equal width; each lamina is a short
line contact whose load follows the approach of the rings at its place.

References
----------
[1] A. Palmgren, Ball and Roller Bearing Engineering, 3rd ed., Burbank 1959;
    as quoted in T. A. Harris, M. N. Kotzalas, Essential Concepts of Bearing
    Technology, 5th ed., CRC 2007, ch. 6 (deformations, line contact): the approach of
    one roller/raceway line contact delta = 3.84e-5 Q^0.9 / l^0.8
    [mm, N, mm] (constant from memory). Inverted: Q = 8.06e4 l^(8/9) delta^(10/9).
    The exponent used here is exactly 10/9 (the inverse of 0.9); some texts
    round it to 1.1, which changes the Stribeck integrals in the fourth digit.
[2] ISO/TS 16281:2008, Rolling bearings -- Methods for calculating the modified
    reference rating life for universally loaded bearings: slicing of the roller
    into at least 30 laminae, line-contact law per lamina, no tension.
[3] W. C. Young, R. G. Budynas, Roark's Formulas for Stress and Strain, 7th ed.,
    McGraw-Hill 2002, table 14.1 case 2 (two parallel cylinders): maximum
    pressure p = sqrt(q E* / (pi R)), 1/E* = sum (1 - nu^2)/E, 1/R = sum 1/R_i.
[4] G. Lundberg, Elastische Beruehrung zweier Halbraeume, Forsch. Ing.-Wes. 10
    (1939): logarithmic roller profile, drop growing as ln(1 / (1 - (2 x/L)^2)).
"""

from __future__ import annotations

import numpy as np

from hubload.units import MM

LOAD_EXPONENT = 10.0 / 9.0
PALMGREN_APPROACH_CONSTANT = 3.84e-5   # [mm N^-0.9 mm^0.8], one contact, [1]
STEEL_MODULUS_PA = 207e9               # bearing steel, Harris & Kotzalas (from memory)
STEEL_POISSON = 0.3                    # bearing steel (common practice)
LAMINAE = 30                           # ISO/TS 16281 asks for at least 30 [2]
LOG_PROFILE_SHAPE = 0.99               # 1 - (finite drop at the ends) of the log curve [4]


def roller_stiffness_n_per_m(roller_length_m, exponent=LOAD_EXPONENT):
    """K [N/m^n] of Q = K delta^n for one roller between inner and outer raceway [1].

    Both contacts follow delta = c Q^0.9 / l^0.8 with c = 3.84e-5 (N, mm), so
    the roller's total approach is 2 c Q^0.9 / l^0.8 and
    K = (l^0.8 / (2 c))^(1/0.9) in N and mm, converted to SI here.
    """
    length_mm = roller_length_m / MM
    stiffness_n_mm = (length_mm ** 0.8 / (2.0 * PALMGREN_APPROACH_CONSTANT)) ** (1.0 / 0.9)
    return stiffness_n_mm / MM ** exponent


def lamina_stiffness_n_per_m(roller_length_m, laminae=LAMINAE, exponent=LOAD_EXPONENT):
    """Stiffness of one lamina [N/m^n], a 1/laminae share of the roller's [1, 2].

    Palmgren's approach depends on the load per length q and, weakly, on the whole
    length (delta = c q^0.9 l^0.1); keeping the roller's length in that term makes
    a uniformly loaded roller carry the same load whatever the number of laminae.
    """
    return roller_stiffness_n_per_m(roller_length_m, exponent) / laminae


def lamina_offsets_m(roller_length_m, laminae=LAMINAE):
    """Centre of each lamina along the roller [m], from the roller's mid-length
    (equal widths, ISO/TS 16281 slicing [2])."""
    width = roller_length_m / laminae
    return (np.arange(laminae) + 0.5) * width - 0.5 * roller_length_m


def profile_drop_m(offset_m, roller_length_m, crown_drop_m):
    """Drop of the roller profile [m] at ``offset_m`` from mid-length.

    Straight rollers have ``crown_drop_m`` = 0. A logarithmic profile follows
    Lundberg's curve [4] d(x) ~ ln(1 / (1 - b (2x/L)^2)), with b = 0.99 so that
    it stays finite and reaches ``crown_drop_m`` at the ends of the effective
    length (common practice for specifying a crowned roller by its end drop).
    """
    u2 = (2.0 * np.asarray(offset_m) / roller_length_m) ** 2
    shape = np.log1p(-LOG_PROFILE_SHAPE * u2) / np.log1p(-LOG_PROFILE_SHAPE)
    return crown_drop_m * shape


def effective_modulus_pa(modulus_pa=STEEL_MODULUS_PA, poisson=STEEL_POISSON):
    """E* [Pa] of two bodies of the same material: 1/E* = 2 (1 - nu^2)/E [3]."""
    return modulus_pa / (2.0 * (1.0 - poisson ** 2))


def inner_contact_radius_m(roller_diameter_m, contact_angle_rad, pitch_diameter_m):
    """Equivalent radius R [m] of the roller/inner-raceway contact, normal to the line.

    1/R = 2/Dwe + 2 cos(a)/(Dpw - Dwe cos(a)), i.e. R = Dwe (1 - gamma)/2: the sum
    of the curvatures of the two bodies [3], with the raceway's radius normal to the
    contact line taken as in the curvature sums of T. A. Harris, M. N. Kotzalas,
    Essential Concepts of Bearing Technology, 5th ed., ch. 2 (from memory). The
    inner contact is the more curved one and so carries the higher pressure.
    """
    gamma = roller_diameter_m * np.cos(contact_angle_rad) / pitch_diameter_m
    return 0.5 * roller_diameter_m * (1.0 - gamma)


def line_contact_pressure_pa(load_per_length_n_m, radius_m, modulus_pa=None):
    """Maximum Hertz pressure [Pa] of a line contact: p = sqrt(q E* / (pi R)) [3]."""
    e_star = effective_modulus_pa() if modulus_pa is None else modulus_pa
    return np.sqrt(np.maximum(load_per_length_n_m, 0.0) * e_star / (np.pi * radius_m))
