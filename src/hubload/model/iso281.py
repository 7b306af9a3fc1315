"""ISO 281 basic rating life, ISO 76 static safety, Palmgren-Miner and system life.

References
----------
[1] ISO 281:2007, Rolling bearings -- Dynamic load ratings and rating life:
    6.2 (equivalent load P = X Fr + Y Fa for tapered roller bearings,
    X = 0.4 and Y when Fa/Fr > e, else X = 1, Y = 0; table 8),
    7.1 (basic rating life L10 = (C/P)^p with p = 10/3 for roller bearings).
[2] ISO 76:2006, Rolling bearings -- Static load ratings, 6.2 (P0 = X0 Fr + Y0 Fa,
    X0 = 0.5 for single-row tapered bearings, P0 not less than Fr).
[3] A. Palmgren, Die Lebensdauer von Kugellagern, VDI-Z 68 (1924); M. A. Miner,
    Cumulative damage in fatigue, J. Appl. Mech. 12 (1945): linear damage sum.
[4] G. Lundberg, A. Palmgren, Dynamic capacity of roller bearings, Acta Polytech.
    Mech. Eng. Ser. 2 (1952); system life of bearings in series with Weibull
    slope e = 9/8 for roller bearings, as given in T. A. Harris, M. N. Kotzalas,
    Essential Concepts of Bearing Technology, 5th ed., 2007 (from memory).
[5] ISO 281:2007, table 8 note: for tapered roller bearings with contact angle
    alpha, e = 1.5 tan(alpha), Y = 0.4 cot(alpha); ISO 76:2006 table 1:
    Y0 = 0.22 cot(alpha).
"""

from __future__ import annotations

import numpy as np

LIFE_EXPONENT_ROLLER = 10.0 / 3.0
WEIBULL_SLOPE_ROLLER = 9.0 / 8.0
X_TAPERED_AXIAL = 0.4
X0_TAPERED = 0.5


def factors_from_contact_angle(contact_angle_rad):
    """(e, Y, Y0) of a single-row tapered roller bearing from its contact angle [5]."""
    tan_a = np.tan(contact_angle_rad)
    return 1.5 * tan_a, 0.4 / tan_a, 0.22 / tan_a


def equivalent_dynamic_load_n(radial_n, axial_n, e, y_factor):
    """Dynamic equivalent radial load P [N] [1, 6.2].

    P = Fr when Fa/Fr <= e, else 0.4 Fr + Y Fa (compared as Fa <= e Fr so that a
    pure axial load is handled).
    """
    return np.where(axial_n <= e * radial_n, radial_n,
                    X_TAPERED_AXIAL * radial_n + y_factor * axial_n)


def equivalent_static_load_n(radial_n, axial_n, y0_factor):
    """Static equivalent radial load P0 [N] = max(Fr, 0.5 Fr + Y0 Fa) [2, 6.2]."""
    return np.maximum(radial_n, X0_TAPERED * radial_n + y0_factor * axial_n)


def basic_rating_life_mrev(dynamic_rating_n, equivalent_load_n):
    """Basic rating life L10 [10^6 revolutions] = (C/P)^(10/3) [1, 7.1].

    Infinite for P = 0, and where the power leaves the float range (a vanishing load).
    """
    load = np.asarray(equivalent_load_n, dtype=float)
    with np.errstate(divide="ignore", over="ignore"):
        return np.where(load > 0, (dynamic_rating_n / np.where(load > 0, load, 1.0))
                        ** LIFE_EXPONENT_ROLLER, np.inf)


def life_hours(life_mrev, speed_rpm):
    """Life [h] = 10^6 L / (60 n) from life [10^6 rev] at speed [r/min] [1, 7.1]; inf at standstill.

    Infinite too where the quotient leaves the float range: a vanishing speed (a logged
    1e-320 r/min) is standstill for fatigue, not an error.
    """
    speed = np.asarray(speed_rpm, dtype=float)
    with np.errstate(divide="ignore", invalid="ignore", over="ignore"):
        hours = life_mrev * 1e6 / (60.0 * speed)
    return np.where(speed > 0, hours, np.inf)


def damage_rate_per_hour(time_fraction, case_life_h):
    """Palmgren-Miner damage per hour of operation of each case [3]: t_j / L_j.

    An infinite life, or no time in the case, adds nothing; a zero life (a case the
    refined model finds no equilibrium for) with time in it adds an infinite rate.
    """
    with np.errstate(divide="ignore", invalid="ignore"):
        rate = np.asarray(time_fraction, dtype=float) / case_life_h
    return np.where(np.isnan(rate), 0.0, rate)   # 0 / 0: no time in a zero-life case


def spectrum_life_h(damage_rate):
    """Spectrum life [h] = 1 / sum of damage rates over the case axis (last) [3]."""
    total = np.sum(damage_rate, axis=-1)
    with np.errstate(divide="ignore"):
        return np.where(total > 0, 1.0 / np.where(total > 0, total, 1.0), np.inf)


def shares(values, axis=-1):
    """Each value's share of their sum along ``axis`` (0 where the sum is 0).

    Infinite values (the damage of a zero life) take the whole sum between them.
    """
    values = np.asarray(values, dtype=float)
    total = np.sum(values, axis=axis, keepdims=True)
    infinite_total = np.isinf(total)
    if np.any(infinite_total):
        values = np.where(infinite_total, np.isinf(values), values)
        total = np.sum(values, axis=axis, keepdims=True)
    return np.where(total > 0, values / np.where(total > 0, total, 1.0), 0.0)


def damage_shares(damage_rate):
    """Each case's share of the Palmgren-Miner damage sum [3] (sums to 1 over the case axis;
    0 when no damage)."""
    return shares(damage_rate, axis=-1)


def series_terms(lives, weibull_slope=WEIBULL_SLOPE_ROLLER):
    """The terms L_k^-e of the system-life sum [4], stacked on a new first axis.

    An infinite life gives 0 (it drops out), a zero life an infinite term.
    """
    with np.errstate(divide="ignore"):
        return np.stack(np.broadcast_arrays(
            *(np.power(np.asarray(life, dtype=float), -weibull_slope) for life in lives)))


def system_life(*lives, weibull_slope=WEIBULL_SLOPE_ROLLER):
    """Life of bearings in series [4]: L = (sum L_k^-e)^(-1/e); inf lives drop out."""
    inverse_sum = np.sum(series_terms(lives, weibull_slope), axis=0)
    with np.errstate(divide="ignore"):
        return np.power(inverse_sum, -1.0 / weibull_slope)


def system_damage_shares(lives_h, damage_shares_, weibull_slope=WEIBULL_SLOPE_ROLLER):
    """Each case's share of the damage of bearings in series [4].

    The bearings' per-case shares (case axis last) are weighted by their term
    L^-e of the system-life sum, i.e. their part of the system's failure probability.
    """
    weights = shares(series_terms(lives_h, weibull_slope), axis=0)
    return sum(weight[..., None] * share for weight, share in zip(weights, damage_shares_))


def static_safety(static_rating_n, max_static_load_n):
    """Static safety factor s0 = C0 / P0,max [2]; inf when unloaded."""
    with np.errstate(divide="ignore"):
        return np.where(max_static_load_n > 0, static_rating_n / np.where(
            max_static_load_n > 0, max_static_load_n, 1.0), np.inf)
