"""Finite fatigue life of a shaft section: Goodman equivalent stress and the S-N line.

References
----------
[1] R. G. Budynas, J. K. Nisbett, Shigley's Mechanical Engineering Design,
    10th ed., McGraw-Hill 2015, section 6-12: equivalent completely reversed
    stress of a fluctuating stress by the modified Goodman line,
    sigma_rev = sigma_a / (1 - sigma_m / Sut).
[2] Shigley 10th ed., eqs. (6-13)-(6-16): S-N line (Basquin) of steel through
    f Sut at 10^3 and Se at 10^6 cycles, Sf = a N^b with a = (f Sut)^2 / Se,
    b = -log10(f Sut / Se) / 3, so N = (sigma_rev / a)^(1/b); below Se the life
    is infinite (endurance limit).
[3] Shigley 10th ed., eq. (6-17): low-cycle line Sf = Sut N^(log10(f) / 3),
    1 <= N <= 10^3.
[4] hubload.model.iso281: Palmgren-Miner damage sum over the duty spectrum.
"""

from __future__ import annotations

import numpy as np

from hubload.model import iso281


def equivalent_reversed_stress_pa(alternating_pa, mean_pa, ultimate_pa):
    """Fully reversed stress [Pa] with the same Goodman damage as (sigma_a, sigma_m) [1].

    Infinite when the mean stress reaches the ultimate strength.
    """
    remaining = 1.0 - np.asarray(mean_pa, dtype=float) / ultimate_pa
    with np.errstate(divide="ignore", invalid="ignore"):
        return np.where(remaining > 0, alternating_pa / np.where(remaining > 0, remaining, 1.0),
                        np.inf)


def basquin_constants(ultimate_pa, endurance_pa, fraction):
    """(a [Pa], b) of the S-N line Sf = a N^b through (10^3, f Sut) and (10^6, Se) [2]."""
    knee_pa = fraction * np.asarray(ultimate_pa, dtype=float)
    return knee_pa ** 2 / endurance_pa, -np.log10(knee_pa / endurance_pa) / 3.0


def cycles_to_failure(reversed_pa, ultimate_pa, endurance_pa, fraction):
    """Cycles to failure N at a fully reversed stress [Pa] [2, 3].

    Infinite at or below Se; the Basquin line down to 10^3 cycles (f Sut); the
    low-cycle line [3] above f Sut; one cycle at or above Sut (the first cycle breaks it).
    """
    stress = np.asarray(reversed_pa, dtype=float)
    a, b = basquin_constants(ultimate_pa, endurance_pa, fraction)
    knee_pa = fraction * np.asarray(ultimate_pa, dtype=float)
    positive = np.where(stress > 0, stress, 1.0)
    with np.errstate(over="ignore", divide="ignore"):
        high_cycle = np.power(positive / a, 1.0 / b)
        low_cycle = np.power(positive / ultimate_pa, 3.0 / np.log10(fraction))
    finite = np.where(stress > knee_pa, np.maximum(low_cycle, 1.0), high_cycle)
    return np.where(stress <= endurance_pa, np.inf, finite)


def case_life_h(cycles, speed_rpm):
    """Hours [h] to reach ``cycles`` at one stress cycle per revolution [r/min]; inf at standstill."""
    return iso281.life_hours(np.asarray(cycles, dtype=float) / 1e6, speed_rpm)


def spectrum_life_h(time_fraction, cycles, speed_rpm):
    """Fatigue life [h] over the duty spectrum by Palmgren-Miner [4] (case axis last)."""
    return iso281.spectrum_life_h(
        iso281.damage_rate_per_hour(time_fraction, case_life_h(cycles, speed_rpm)))
