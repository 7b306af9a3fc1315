"""Reference lives built in scipy.stats straight from the stated formulas, and renewal simulations."""

import math

import numpy as np
from scipy import stats

LN_090 = math.log(1 / 0.9)


def scipy_life(kind, l10_h, slope):
    """The same distribution built in scipy straight from the formula stated in ISO 281:2007, 9.2
    (kind iso281) or from F(L10) = 0.1 of a two-parameter Weibull (kind weibull)."""
    if kind == "iso281":
        return stats.weibull_min(slope, loc=0.05 * l10_h, scale=0.95 * l10_h / LN_090 ** (1 / slope))
    return stats.weibull_min(slope, scale=l10_h / LN_090 ** (1 / slope))


def simulated_renewal_counts(distribution, times, samples, rng):
    """Renewals up to each time in ``samples`` simulated histories (a fresh life at each failure)."""
    elapsed = np.zeros(samples)
    counts = np.zeros((samples, len(times)))
    while np.any(elapsed <= times[-1]):
        elapsed += distribution.rvs(size=samples, random_state=rng)
        counts += elapsed[:, None] <= times[None, :]
    return counts
