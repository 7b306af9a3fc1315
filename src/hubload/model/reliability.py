"""Reliability over time: life distributions, series systems and renewals.

Times are operating hours [h]. Every life distribution here is a Weibull
distribution with a minimum life t0 (zero for the two-parameter form):

    F(t) = 1 - exp(-((t - t0) / theta)^beta)  for t > t0, else 0,

described by its L10 (the life that 90 % reach, F(L10) = 0.1) and slope beta:

- kind "iso281": the relation behind the reliability factor a1 of ISO 281:2007 [1]:
  slope 1.5 and minimum life t0 = 0.05 L10, i.e.
  F(t) = 1 - exp(-ln(1/0.9) ((t / L10 - 0.05) / 0.95)^1.5);
- kind "weibull": two-parameter Weibull [2] (t0 = 0), eta = L10 / ln(1/0.9)^(1/beta).

A forecast uses the slope of the distribution it is given. The Lundberg-Palmgren
slope 9/8 behind the system life of a bearing pair [3] is another quantity; the
caller chooses one and says which.

References
----------
[1] ISO 281:2007, Rolling bearings -- Dynamic load ratings and rating life, 9.2
    (life modification factor for reliability a1), table 12.
[2] W. Weibull, A statistical distribution function of wide applicability,
    J. Appl. Mech. 18 (1951) 293-297.
[3] G. Lundberg, A. Palmgren, Dynamic capacity of roller bearings, Acta Polytech.
    Mech. Eng. Ser. 2 (1952) -- from memory.
[4] R. E. Barlow, F. Proschan, Mathematical Theory of Reliability, Wiley 1965,
    ch. 2 (series system: R = product of the units' R; minimum of k identical
    Weibull lives is Weibull with eta k^(-1/beta)) -- from memory.
[5] D. R. Cox, Renewal Theory, Methuen 1962, ch. 3 and 4.5 (renewal equation
    M(t) = F(t) + int_0^t M(t - x) dF(x); asymptote M(t) ~ t/mu + (CV^2 - 1)/2)
    -- from memory.
[6] M. Xie, On the solution of renewal-type integral equations, Commun. Statist.
    Simul. Comput. 18 (1989) 281-293 (Riemann-Stieltjes discretisation of the
    renewal equation with mid-point values) -- from memory.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

import numpy as np

# F(L10) = 0.1 by the definition of the basic rating life L10 [1]: the cumulative hazard at L10.
HAZARD_AT_L10 = math.log(1.0 / 0.9)
# ISO 281:2007, 9.2 [1]: slope and minimum life (fraction of L10) behind table 12.
ISO281_SLOPE = 1.5
MINIMUM_LIFE_RATIO = {"iso281": 0.05, "weibull": 0.0}

# Bisection on ln t: the bracket spans at most a factor k^(1/beta), so 64 halvings
# leave far less than one ulp of relative error.
BISECTION_STEPS = 64
# Renewal grid: steps, and the longest span in mean lives; beyond it the renewal
# function follows its asymptote [5]: within 2e-5 at 10 mean lives for slopes 1 to 3
# (measured against a grid twice as fine), 3e-4 for slope 0.8.
RENEWAL_GRID_STEPS = 4000
RENEWAL_GRID_MEANS = 20.0


@dataclass(frozen=True)
class LifeDistribution:
    """Life distribution of one unit (bearing or wheel end), see the module docstring.

    kind "iso281" or "weibull"; l10_h [h] its L10; slope the Weibull slope beta [-].
    """

    kind: str
    l10_h: float
    slope: float = ISO281_SLOPE

    @property
    def location_h(self) -> float:
        """Minimum life t0 [h] (0.05 L10 for "iso281" [1, 9.2], 0 for "weibull")."""
        return MINIMUM_LIFE_RATIO[self.kind] * self.l10_h

    @property
    def scale_h(self) -> float:
        """Weibull scale theta [h] such that F(L10) = 0.1 (eta for "weibull")."""
        return (self.l10_h - self.location_h) / HAZARD_AT_L10 ** (1.0 / self.slope)

    @property
    def mean_h(self) -> float:
        """Mean life [h] = t0 + theta Gamma(1 + 1/beta) [2]."""
        return self.location_h + self.scale_h * math.gamma(1.0 + 1.0 / self.slope)

    @property
    def variance_h2(self) -> float:
        """Variance of the life [h^2] = theta^2 (Gamma(1 + 2/beta) - Gamma(1 + 1/beta)^2) [2]."""
        g1 = math.gamma(1.0 + 1.0 / self.slope)
        return self.scale_h**2 * (math.gamma(1.0 + 2.0 / self.slope) - g1 * g1)

    def cumulative_hazard(self, time_h):
        """H(t) = ((t - t0) / theta)^beta for t > t0, else 0 [-]; R = exp(-H)."""
        excess = np.maximum(np.asarray(time_h, dtype=float) - self.location_h, 0.0)
        return (excess / self.scale_h) ** self.slope

    def failure_probability(self, time_h):
        """F(t) [-] at operating time t [h]."""
        return -np.expm1(-self.cumulative_hazard(time_h))

    def reliability(self, time_h):
        """R(t) = 1 - F(t) [-] at operating time t [h]."""
        return np.exp(-self.cumulative_hazard(time_h))

    def life_at_hazard_h(self, hazard):
        """Time [h] at which the cumulative hazard reaches ``hazard`` [-]."""
        return self.location_h + self.scale_h * np.asarray(hazard, dtype=float) ** (1.0 / self.slope)

    def life_h(self, reliability):
        """Life [h] that the fraction ``reliability`` [-] of units reaches (B100(1-R))."""
        return self.life_at_hazard_h(-np.log(reliability))

    def scaled(self, factor: float) -> LifeDistribution:
        """The same distribution with every life multiplied by ``factor`` [-]."""
        return replace(self, l10_h=self.l10_h * factor)


def iso281_failure_probability(time_h, l10_h):
    """F(t) [-] of ISO 281:2007's distribution (slope 1.5, minimum life 0.05 L10) [1, 9.2]."""
    return LifeDistribution("iso281", 1.0).failure_probability(np.asarray(time_h) / np.asarray(l10_h))


def iso281_life_h(l10_h, reliability):
    """Life [h] at a reliability R [-] (e.g. 0.99) on ISO 281:2007's distribution [1, 9.2].

    life / L10 is the reliability factor a1 of ISO 281:2007, table 12.
    """
    return np.asarray(l10_h) * LifeDistribution("iso281", 1.0).life_h(reliability)


def weibull_failure_probability(time_h, eta_h, beta):
    """Two-parameter Weibull F(t) = 1 - exp(-(t/eta)^beta) [-] [2]."""
    return -np.expm1(-((np.maximum(np.asarray(time_h, dtype=float), 0.0) / eta_h) ** beta))


def weibull_eta_h(l10_h, beta):
    """Characteristic life eta [h] = B10 / ln(1/0.9)^(1/beta) of a two-parameter Weibull [2]."""
    return np.asarray(l10_h, dtype=float) / HAZARD_AT_L10 ** (1.0 / np.asarray(beta, dtype=float))


def series_cumulative_hazard(units, time_h):
    """Cumulative hazard [-] of units in series: the sum of the units' hazards [4]."""
    time = np.asarray(time_h, dtype=float)
    return sum((unit.cumulative_hazard(time) for unit in units), np.zeros_like(time))


def series_reliability(units, time_h):
    """R_sys(t) = product of R_i(t) [-] of units in series (any mix of distributions) [4]."""
    return np.exp(-series_cumulative_hazard(units, time_h))


def series_failure_probability(units, time_h):
    """F_sys(t) = 1 - product of R_i(t) [-] of units in series [4]."""
    return -np.expm1(-series_cumulative_hazard(units, time_h))


def series_b_life_h(units, failure_probability):
    """B-life [h] of units in series: the time at which F_sys = p (p = 0.01 gives B1).

    Vectorised bisection on ln t. The bracket: at each unit's own B_p the system
    has failed with at least p; at the shortest of the units' B_(p/k) every unit has
    failed with at most p/k, so the system with at most 1 - (1 - p/k)^k <= p.
    """
    p = np.asarray(failure_probability, dtype=float)
    count = len(units)
    target = -np.log1p(-p)
    low = np.log(np.min([u.life_at_hazard_h(-np.log1p(-p / count)) for u in units], axis=0))
    high = np.log(np.min([u.life_at_hazard_h(target) for u in units], axis=0))
    for _ in range(BISECTION_STEPS):
        middle = 0.5 * (low + high)
        reached = series_cumulative_hazard(units, np.exp(middle)) >= target
        high = np.where(reached, middle, high)
        low = np.where(reached, low, middle)
    return np.exp(0.5 * (low + high))


def renewal_function_on_grid(cdf):
    """Renewal function M(t_k) [-] on a uniform grid t_k = k h from F(t_k) (last axis).

    M is the expected number of failures up to t when each failed unit is replaced
    at once by a new one of the same distribution; it solves the renewal equation
    M(t) = F(t) + int_0^t M(t - x) dF(x) [5]. Discretised as a Riemann-Stieltjes sum
    over the grid cells with M at the cell mid-points taken as the mean of its end
    values [6]:

        M_k (1 - dF_1/2) = F_k + M_(k-1) dF_1/2 + sum_(i=2..k) (M_(k-i) + M_(k-i+1))/2 dF_i,

    dF_i = F_i - F_(i-1). Leading axes are independent distributions; ``cdf[..., 0]``
    is F(0) = 0.
    """
    cdf = np.asarray(cdf, dtype=float)
    steps = np.diff(cdf, axis=-1)
    count = steps.shape[-1]
    reversed_steps = steps[..., ::-1]
    renewals = np.zeros_like(cdf)
    midpoints = np.zeros_like(steps)
    half_first = 0.5 * steps[..., 0]
    for k in range(1, count + 1):
        # sum_(j=0..k-2) midpoint_j dF_(k-j): dF_(k-j) = steps[k-1-j] = reversed_steps[count-k+j]
        older = np.einsum("...i,...i->...", midpoints[..., : k - 1],
                          reversed_steps[..., count - k: count - 1])
        renewals[..., k] = ((cdf[..., k] + renewals[..., k - 1] * half_first + older)
                            / (1.0 - half_first))
        midpoints[..., k - 1] = 0.5 * (renewals[..., k - 1] + renewals[..., k])
    return renewals


def expected_renewals(distribution: LifeDistribution, time_h):
    """Renewal function M(t) [-] of one distribution at operating times t [h].

    Computed on a uniform grid up to the longest time (at most RENEWAL_GRID_MEANS
    mean lives) by ``renewal_function_on_grid``; between grid points the exact F(t)
    plus a cubic spline of the renewals after the first (M - F, of order F^2), so that
    small probabilities keep their precision. Beyond the grid M(t) follows its
    asymptote t/mu + (CV^2 - 1)/2 [5].
    """
    from scipy.interpolate import CubicSpline   # here: the file format's reader imports this module

    time = np.asarray(time_h, dtype=float)
    mean = distribution.mean_h
    end = min(float(np.max(time, initial=0.0)), RENEWAL_GRID_MEANS * mean)
    first = distribution.failure_probability(time)
    if end <= 0.0:
        return first
    grid = np.linspace(0.0, end, RENEWAL_GRID_STEPS + 1)
    grid_cdf = distribution.failure_probability(grid)
    later = renewal_function_on_grid(grid_cdf) - grid_cdf
    asymptote = time / mean + 0.5 * (distribution.variance_h2 / mean**2 - 1.0)
    inside = np.minimum(time, end)
    return np.where(time <= end, first + CubicSpline(grid, later)(inside), asymptote)
