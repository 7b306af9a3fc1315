"""Failure forecast of a fleet of machines over calendar years and a warranty.

The fleet has N identical machines; each carries the same units (wheel ends or
bearings), each unit with its own life distribution F_j in operating hours
(``reliability.LifeDistribution``). A machine runs u [h/year], lognormally spread
over the fleet (median u_m, sigma_ln of ln u; sigma 0: every machine runs u_m);
all units of one machine share its u. After t years a unit has run u t hours.
A calibration factor c (field life / predicted life) multiplies every life.

Expectations over the usage spread are integrals over z = ln(u / u_m) / sigma
against the standard normal density phi(z). The integrands have kinks: where a
warranty cap starts to bind (u W = U) and where a unit with a minimum life t0
starts to fail (u t = t0). Gauss-Hermite quadrature [1] converges slowly across
such kinks (about 0.3 % scatter between 64 and 300 nodes for a capped warranty),
so z is cut at the kinks and at -6, -3, 0, 3, 6, and each piece of [-12, 12]
(outside it phi carries less than 1e-32) gets Gauss-Legendre nodes [1]:
int f(u) g(u) du = sum_q w_q f(u_q), w_q = (Legendre weight) phi(z_q); with 32
nodes a piece converged to about 1e-10 for sigma_ln up to 1.2
(tests/model/test_fleet_forecast.py).

- first failures up to t years: N sum_j int F_j(u t) g(u) du;
- failures with replacements (a failed unit is replaced at once by a new one of
  the same distribution): the same with the renewal function M_j in place of F_j
  [2] (``reliability.expected_renewals``);
- warranty of W years, ended earlier by an operating-hours cap U: a machine's
  warranty covers s(u) = min(u W, U) hours;
- machines with at least one claim in the warranty: N int [1 - prod_j (1 - F_j(s))] g du;
- 90 % band of the count of first failures in the warranty. Model: a machine's
  units fail independently given its usage, so its count given u is
  Poisson-binomial over its units [3]; over the fleet's usage spread a machine's
  count is the mixture sum_q w_q PB(k | u_q). Machines are independent, so the
  fleet count is the N-fold convolution of one machine's count distribution [4],
  taken as the N-th power of its discrete Fourier transform on the full support
  0..N k (exact up to rounding; memory grows with N k). The band is the 5 % and
  95 % quantiles (smallest count whose cumulative probability reaches them).

References
----------
[1] M. Abramowitz, I. A. Stegun, Handbook of Mathematical Functions, 1964,
    25.4.29 (Gauss-Legendre) and 25.4.46 (Gauss-Hermite quadrature).
[2] D. R. Cox, Renewal Theory, Methuen 1962, ch. 3 (renewal function) -- from memory.
[3] Y. H. Wang, On the number of successes in independent trials, Statistica
    Sinica 3 (1993) 295-312 (Poisson-binomial distribution) -- from memory.
[4] W. Feller, An Introduction to Probability Theory and Its Applications, vol. 1,
    3rd ed., Wiley 1968, XI.2 (sums of independent integer counts: convolution of
    their distributions; generating functions multiply) -- from memory.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np
from numpy.polynomial.legendre import leggauss
from scipy import fft

from hubload.model.reliability import expected_renewals, series_failure_probability

# Gauss-Legendre nodes on each piece of the z range (see the module docstring).
NODES_PER_PIECE = 32
# The standard normal density carries less than 1e-32 beyond |z| = 12.
Z_LIMIT = 12.0
# Fixed cuts keep pieces short where the integrand's growth and phi's fall meet.
FIXED_CUTS_Z = (-6.0, -3.0, 0.0, 3.0, 6.0)
BAND_QUANTILES = (0.05, 0.95)


@dataclass(frozen=True)
class FleetForecast:
    """Expected failures of a fleet; per-year arrays are indexed by ``year`` (1, 2, ...).

    Counts are units (wheel ends or bearings) unless the name says machines.
    """

    year: np.ndarray
    first_failures_per_year: np.ndarray
    first_failures_cumulative: np.ndarray
    failures_per_year: np.ndarray  # with replacements
    failures_cumulative: np.ndarray  # with replacements
    warranty_first_failures: float
    warranty_failures: float  # with replacements
    warranty_unit_failure_percent: float  # first failures per unit in the warranty [%]
    machines_with_claim: float
    machines_with_claim_percent: float
    warranty_first_failures_low: int  # 5 % quantile of the count
    warranty_first_failures_high: int  # 95 % quantile of the count


def lognormal_usage_nodes(median_h_per_year: float, sigma_ln: float, kinks_h_per_year,
                          nodes_per_piece: int = NODES_PER_PIECE):
    """Usage nodes u [h/year] and weights w [-] (summing to 1) of a lognormal usage spread.

    kinks_h_per_year (..., b): usages at which the integrand has a kink (any value,
    0 and inf allowed); each row gets Gauss-Legendre nodes on the pieces of z between
    them and FIXED_CUTS_Z [1]; results have shape (..., (b + 6) nodes_per_piece).
    sigma_ln 0 gives the single node (median, 1) per row.
    """
    kinks = np.asarray(kinks_h_per_year, dtype=float)
    if sigma_ln == 0.0:
        return np.full(kinks.shape[:-1] + (1,), float(median_h_per_year)), np.ones(kinks.shape[:-1] + (1,))
    with np.errstate(divide="ignore"):
        kink_z = np.clip(np.log(kinks / median_h_per_year) / sigma_ln, -Z_LIMIT, Z_LIMIT)
    fixed = np.broadcast_to(np.array((-Z_LIMIT,) + FIXED_CUTS_Z + (Z_LIMIT,)),
                            kinks.shape[:-1] + (len(FIXED_CUTS_Z) + 2,))
    edges = np.sort(np.concatenate([fixed, kink_z], axis=-1), axis=-1)
    start, stop = edges[..., :-1, None], edges[..., 1:, None]
    abscissa, legendre_weight = leggauss(nodes_per_piece)
    z = 0.5 * (start + stop) + 0.5 * (stop - start) * abscissa
    weight = 0.5 * (stop - start) * legendre_weight * np.exp(-0.5 * z * z) / math.sqrt(2.0 * math.pi)
    flat = kinks.shape[:-1] + (-1,)
    return (median_h_per_year * np.exp(sigma_ln * z)).reshape(flat), weight.reshape(flat)


def fleet_forecast(units, *, machines: int, usage_median_h_per_year: float, usage_sigma_ln: float,
                   years: int, warranty_years: float, warranty_cap_h: float = math.inf,
                   calibration: float = 1.0, nodes_per_piece: int = NODES_PER_PIECE) -> FleetForecast:
    """Expected failures of ``machines`` machines, each carrying ``units`` (see the module docstring).

    units: sequence of LifeDistribution (one machine's units); usage median [h/year] and
    sigma_ln [-] of ln u; years [year] of the forecast; warranty_years [year];
    warranty_cap_h [h] (inf: none); calibration [-] multiplies every life.
    """
    lives = [unit.scaled(calibration) for unit in units]
    # Rows: the end of each year, then the end of the warranty.
    calendar = np.append(np.arange(1.0, years + 1), warranty_years)
    cap = np.append(np.full(years, math.inf), warranty_cap_h)
    minimum_lives = np.array(sorted({life.location_h for life in lives}))
    kinks = np.column_stack([minimum_lives[None, :] / calendar[:, None], cap / calendar])
    usage, weight = lognormal_usage_nodes(usage_median_h_per_year, usage_sigma_ln, kinks, nodes_per_piece)
    hours = np.minimum(usage * calendar[:, None], cap[:, None])
    first = np.stack([life.failure_probability(hours) for life in lives])  # (units, rows, nodes)
    renewals = _renewals_per_unit(lives, hours)
    # the quadrature weights add to 1 within rounding: no more units fail than there are
    first_cumulative = np.minimum(machines * np.einsum("jrq,rq->r", first, weight),
                                  machines * len(lives))
    all_cumulative = machines * np.einsum("jrq,rq->r", renewals, weight)
    any_claim = min(1.0, float(weight[-1] @ series_failure_probability(lives, hours[-1])))
    low, high = fleet_count_quantiles(first[:, -1], weight[-1], machines, BAND_QUANTILES)
    return FleetForecast(
        year=np.arange(1, years + 1),
        first_failures_per_year=np.diff(first_cumulative[:-1], prepend=0.0),
        first_failures_cumulative=first_cumulative[:-1],
        failures_per_year=np.diff(all_cumulative[:-1], prepend=0.0),
        failures_cumulative=all_cumulative[:-1],
        warranty_first_failures=float(first_cumulative[-1]),
        warranty_failures=float(all_cumulative[-1]),
        warranty_unit_failure_percent=100.0 * float(first_cumulative[-1]) / (machines * len(lives)),
        machines_with_claim=machines * any_claim,
        machines_with_claim_percent=100.0 * any_claim,
        warranty_first_failures_low=int(low),
        warranty_first_failures_high=int(high),
    )


def _renewals_per_unit(lives, hours):
    """Renewal function of each unit at ``hours`` [h], computed once per distinct distribution."""
    distinct = {life: expected_renewals(life, hours) for life in set(lives)}
    return np.stack([distinct[life] for life in lives])


def machine_count_distribution(unit_probability, weight):
    """P(k failed units on one machine), k = 0..units [-].

    unit_probability (units, q): each unit's failure probability at usage node q;
    weight (q,): the nodes' weights. Poisson-binomial at each node [3], mixed over
    the nodes.
    """
    probability = np.asarray(unit_probability, dtype=float)
    count = np.zeros((probability.shape[1], probability.shape[0] + 1))
    count[:, 0] = 1.0
    for p in probability:
        survived = count * (1.0 - p)[:, None]
        survived[:, 1:] += count[:, :-1] * p[:, None]
        count = survived
    return weight @ count


def fleet_count_distribution(machine_distribution, machines: int):
    """P(K = k), k = 0..machines * units, of the sum of independent machines' counts [4]."""
    support = machines * (len(machine_distribution) - 1) + 1
    length = fft.next_fast_len(support, real=True)
    transform = fft.rfft(machine_distribution, n=length)
    return np.clip(fft.irfft(transform**machines, n=length)[:support], 0.0, None)


def fleet_count_quantiles(unit_probability, weight, machines: int, quantiles):
    """Quantiles of the fleet's count of failed units: smallest k with P(K <= k) >= q."""
    machine = machine_count_distribution(unit_probability, weight)
    cumulative = np.cumsum(fleet_count_distribution(machine, machines))
    return np.searchsorted(cumulative / cumulative[-1], quantiles, side="left")
