"""Wheel speed and distance.

References
----------
[1] Rolling without slip: v = omega r = 2 pi n r (any mechanics text, e.g.
    J. L. Meriam, L. G. Kraige, Engineering Mechanics: Dynamics, ch. 5).
"""

from __future__ import annotations

import numpy as np


def kmh_to_rpm(speed_kmh, rolling_radius_m):
    """Wheel speed [r/min] from vehicle speed [km/h] and rolling radius [m] [1]."""
    return np.asarray(speed_kmh) / 3.6 * 60.0 / (2.0 * np.pi * rolling_radius_m)


def rpm_to_kmh(speed_rpm, rolling_radius_m):
    """Vehicle speed [km/h] from wheel speed [r/min] and rolling radius [m] [1]."""
    return np.asarray(speed_rpm) * 2.0 * np.pi * rolling_radius_m / 60.0 * 3.6


def distance_km(life_h, mean_speed_rpm, rolling_radius_m):
    """Distance [km] covered in ``life_h`` [h] at a mean wheel speed [r/min] [1].

    An infinite life is an infinite distance, even at a mean speed of zero.
    """
    # the speed's factor first: a creeping wheel's long life times its small speed stays
    # finite where the life times 60 would overflow
    km_per_hour = mean_speed_rpm * 60.0 * 2.0 * np.pi * rolling_radius_m / 1000.0
    with np.errstate(invalid="ignore"):
        km = km_per_hour * life_h
    return np.where(np.isinf(life_h), np.inf, km)
