"""Fleet forecasts against scipy.integrate.quad, seeded simulations and exact count distributions."""

import itertools
import math

import numpy as np
import pytest
from scipy import integrate, stats

from hubload.model import fleet_forecast as fleet
from hubload.model.reliability import LifeDistribution
from reliability_reference import scipy_life

FOUR_WHEEL_ENDS = [LifeDistribution("weibull", 10_000.0, 1.5)] * 4


def quad_expectation(function, median, sigma, kinks_h_per_year=()):
    """int function(u) g(u) du over a lognormal usage by scipy.integrate.quad on z = ln(u/median)/sigma,
    told where the integrand has kinks."""
    kinks = [math.log(k / median) / sigma for k in kinks_h_per_year if 0 < k < math.inf]
    edges = [-12.0] + sorted(z for z in kinks if -12 < z < 12) + [12.0]
    return sum(integrate.quad(lambda z: function(median * math.exp(sigma * z)) * stats.norm.pdf(z),
                              a, b, epsabs=1e-15, epsrel=1e-12, limit=200)[0]
               for a, b in zip(edges[:-1], edges[1:]))


def test_check_values_of_the_notes_for_two_parameter_units():
    # Notes (S): L10 = 10,000 h, slope 1.5, k = 4, N = 1,000, W = 2 years, median 1,000 h/year,
    # sigma_ln 0.5: 1.235 % per wheel end, 49.4 failures, 47.9 machines with a claim, 0.938 %
    # without the spread. These come out for the two-parameter Weibull of slope 1.5 (not for
    # ISO 281's distribution, see the next test); reference: scipy.integrate.quad.
    result = fleet.fleet_forecast(FOUR_WHEEL_ENDS, machines=1000, usage_median_h_per_year=1000.0,
                                  usage_sigma_ln=0.5, years=2, warranty_years=2.0)
    unit = scipy_life("weibull", 10_000.0, 1.5)
    per_unit = quad_expectation(lambda u: unit.cdf(2 * u), 1000.0, 0.5)
    any_claim = quad_expectation(lambda u: 1 - unit.sf(2 * u) ** 4, 1000.0, 0.5)
    assert result.warranty_unit_failure_percent == pytest.approx(100 * per_unit, rel=1e-9)
    assert result.warranty_first_failures == pytest.approx(4000 * per_unit, rel=1e-9)
    assert result.machines_with_claim == pytest.approx(1000 * any_claim, rel=1e-9)
    assert round(result.warranty_unit_failure_percent, 3) == 1.235
    assert round(result.warranty_first_failures, 1) == 49.4
    assert round(result.machines_with_claim, 1) == 47.9
    assert result.first_failures_cumulative[-1] == pytest.approx(result.warranty_first_failures)
    no_spread = fleet.fleet_forecast(FOUR_WHEEL_ENDS, machines=1000, usage_median_h_per_year=1000.0,
                                     usage_sigma_ln=0.0, years=2, warranty_years=2.0)
    assert no_spread.warranty_unit_failure_percent == pytest.approx(100 * unit.cdf(2000.0), rel=1e-12)
    assert round(no_spread.warranty_unit_failure_percent, 3) == 0.938


def test_iso281_units_of_the_same_l10_fail_less_in_a_short_warranty():
    # ISO 281:2007, 9.2 distribution (minimum life 0.05 L10); reference: scipy.integrate.quad
    # (0.970 % per wheel end, 38.8 failures, 37.6 machines for the case above).
    units = [LifeDistribution("iso281", 10_000.0)] * 4
    result = fleet.fleet_forecast(units, machines=1000, usage_median_h_per_year=1000.0,
                                  usage_sigma_ln=0.5, years=2, warranty_years=2.0)
    unit = scipy_life("iso281", 10_000.0, 1.5)
    per_unit = quad_expectation(lambda u: unit.cdf(2 * u), 1000.0, 0.5, [250.0])
    assert result.warranty_unit_failure_percent == pytest.approx(100 * per_unit, rel=1e-9)
    assert round(result.warranty_first_failures, 1) == 38.8
    assert round(result.machines_with_claim, 1) == 37.6


MIXED_MACHINE = [("iso281", 8_000.0, 1.5), ("iso281", 8_000.0, 1.5),
                 ("weibull", 15_000.0, 1.125), ("weibull", 40_000.0, 2.5)]


@pytest.mark.parametrize("sigma, cap, calibration", [(0.5, math.inf, 1.0), (0.8, 2_500.0, 1.0),
                                                     (0.3, 1_800.0, 0.7), (1.2, math.inf, 1.6)])
def test_mixed_machine_matches_quadrature_per_year_and_in_the_warranty(sigma, cap, calibration):
    # Reference: scipy.integrate.quad over the lognormal usage of the expectations of F_j(u t)
    # with the calibration factor stretching every life (scipy.stats distributions of the same lives).
    units = [LifeDistribution(*u) for u in MIXED_MACHINE]
    lives = [scipy_life(kind, calibration * l10, slope) for kind, l10, slope in MIXED_MACHINE]
    result = fleet.fleet_forecast(units, machines=500, usage_median_h_per_year=1200.0, usage_sigma_ln=sigma,
                                  years=5, warranty_years=2.5, warranty_cap_h=cap, calibration=calibration)
    minimum_lives = [0.05 * calibration * 8_000.0]
    for year, expected_total in zip(result.year, result.first_failures_cumulative):
        total = quad_expectation(lambda u: sum(d.cdf(u * year) for d in lives), 1200.0, sigma,
                                 [t / year for t in minimum_lives])
        assert expected_total == pytest.approx(500 * total, rel=1e-8)

    def warranty_hours(u):
        return min(2.5 * u, cap)
    kinks = [cap / 2.5] + [t / 2.5 for t in minimum_lives]
    total = quad_expectation(lambda u: sum(d.cdf(warranty_hours(u)) for d in lives), 1200.0, sigma, kinks)
    claims = quad_expectation(lambda u: 1 - np.prod([d.sf(warranty_hours(u)) for d in lives]),
                              1200.0, sigma, kinks)
    assert result.warranty_first_failures == pytest.approx(500 * total, rel=1e-8)
    assert result.machines_with_claim == pytest.approx(500 * claims, rel=1e-8)
    assert result.machines_with_claim_percent == pytest.approx(100 * claims, rel=1e-8)


@pytest.mark.parametrize("sigma, cap", [(0.5, math.inf), (0.9, 3_000.0), (1.2, math.inf)])
def test_quadrature_is_converged(sigma, cap):
    # Four times the nodes a piece change nothing beyond the stated precision (module docstring).
    units = [LifeDistribution(*u) for u in MIXED_MACHINE]
    common = dict(machines=1000, usage_median_h_per_year=1000.0, usage_sigma_ln=sigma, years=6,
                  warranty_years=2.0, warranty_cap_h=cap)
    coarse = fleet.fleet_forecast(units, **common)
    fine = fleet.fleet_forecast(units, nodes_per_piece=4 * fleet.NODES_PER_PIECE, **common)
    assert coarse.first_failures_cumulative == pytest.approx(fine.first_failures_cumulative, rel=1e-9)
    assert coarse.failures_cumulative == pytest.approx(fine.failures_cumulative, rel=1e-9)
    assert coarse.warranty_failures == pytest.approx(fine.warranty_failures, rel=1e-9)
    assert coarse.machines_with_claim == pytest.approx(fine.machines_with_claim, rel=1e-9)


def simulate_machines(spec, machines, median, sigma, years, warranty_years, cap, calibration, rng):
    """Per simulated machine: failed units and renewals at each year end and at the warranty end."""
    usage = median * np.exp(sigma * rng.standard_normal(machines))
    times = np.column_stack([usage[:, None] * np.arange(1, years + 1),
                             np.minimum(usage * warranty_years, cap)])
    first = np.zeros((machines, years + 1))
    renewals = np.zeros((machines, years + 1))
    any_claim = np.zeros(machines, dtype=bool)
    for kind, l10, slope in spec:
        life = scipy_life(kind, calibration * l10, slope)
        elapsed = np.zeros(machines)
        failed_once = np.zeros((machines, years + 1), dtype=bool)
        while np.any(elapsed[:, None] <= times):
            elapsed += life.rvs(size=machines, random_state=rng)
            within = elapsed[:, None] <= times
            renewals += within
            failed_once |= within
        first += failed_once
        any_claim |= failed_once[:, -1]
    return first, renewals, any_claim


@pytest.mark.parametrize("spec, sigma, cap, calibration", [
    (MIXED_MACHINE, 0.6, math.inf, 1.0),
    (MIXED_MACHINE, 1.0, 3_000.0, 0.5),
    ([("weibull", 3_000.0, 1.5)] * 4, 0.4, 5_000.0, 1.0),  # renewals matter: F is not small
])
def test_fleet_forecast_matches_a_seeded_simulation(spec, sigma, cap, calibration):
    # Reference: Monte Carlo of the same fleet (scipy.stats lives, numpy lognormal usage);
    # tolerance 4 standard errors of the simulated mean.
    first, renewals, any_claim = simulate_machines(spec, 100_000, 1500.0, sigma, 4, 2.0, cap, calibration,
                                                   np.random.default_rng(7))
    result = fleet.fleet_forecast([LifeDistribution(*u) for u in spec], machines=1,
                                  usage_median_h_per_year=1500.0, usage_sigma_ln=sigma, years=4,
                                  warranty_years=2.0, warranty_cap_h=cap, calibration=calibration)
    forecast = {"first": np.append(result.first_failures_cumulative, result.warranty_first_failures),
                "renewals": np.append(result.failures_cumulative, result.warranty_failures),
                "claim": np.array([result.machines_with_claim])}
    for name, simulated in (("first", first), ("renewals", renewals), ("claim", any_claim[:, None])):
        error = simulated.std(axis=0) / math.sqrt(len(simulated))
        assert np.all(np.abs(forecast[name] - simulated.mean(axis=0)) <= 4 * error), name


def test_count_band_of_identical_units_without_spread_is_binomial():
    # sigma 0, identical units: the fleet count is binomial(N k, F); reference scipy.stats.binom.
    result = fleet.fleet_forecast(FOUR_WHEEL_ENDS, machines=1000, usage_median_h_per_year=1000.0,
                                  usage_sigma_ln=0.0, years=2, warranty_years=2.0)
    p = scipy_life("weibull", 10_000.0, 1.5).cdf(2000.0)
    assert result.warranty_first_failures_low == stats.binom.ppf(0.05, 4000, p)
    assert result.warranty_first_failures_high == stats.binom.ppf(0.95, 4000, p)


def test_machine_count_is_poisson_binomial_by_enumeration():
    # Definition of the Poisson-binomial distribution (Wang 1993): enumerate all 2^k outcomes.
    probability = np.array([[0.1, 0.3], [0.5, 0.02], [0.9, 0.2]])  # (units, nodes)
    weight = np.array([0.25, 0.75])
    expected = np.zeros(4)
    for outcome in itertools.product([0, 1], repeat=3):
        chance = np.prod([p if hit else 1 - p for p, hit in zip(probability, outcome)], axis=0)
        expected[sum(outcome)] += weight @ chance
    assert fleet.machine_count_distribution(probability, weight) == pytest.approx(expected, abs=1e-15)


def test_fleet_count_is_the_repeated_convolution_of_a_machine_count():
    # Feller vol. 1, XI.2: the count of independent machines is the convolution of their counts;
    # reference: numpy.convolve applied machine by machine.
    machine = np.array([0.90, 0.07, 0.02, 0.01])
    expected = np.array([1.0])
    for _ in range(60):
        expected = np.convolve(expected, machine)
    assert fleet.fleet_count_distribution(machine, 60) == pytest.approx(expected, abs=1e-14)


def test_count_band_with_usage_spread_matches_simulated_fleets():
    # Reference: 20,000 simulated fleets of 100 machines (each a lognormal usage and four
    # Bernoulli units given it); model CDF within 4 binomial standard errors of the simulated one.
    rng = np.random.default_rng(11)
    life = scipy_life("weibull", 10_000.0, 1.5)
    usage = 1000.0 * np.exp(0.8 * rng.standard_normal((20_000, 100, 1)))
    counts = (rng.random((20_000, 100, 4)) < life.cdf(2 * usage)).sum(axis=(1, 2))
    result = fleet.fleet_forecast(FOUR_WHEEL_ENDS, machines=100, usage_median_h_per_year=1000.0,
                                  usage_sigma_ln=0.8, years=2, warranty_years=2.0)
    usage_nodes, weight = fleet.lognormal_usage_nodes(1000.0, 0.8, np.zeros((1, 1)))
    machine = fleet.machine_count_distribution(np.repeat(life.cdf(2 * usage_nodes), 4, axis=0), weight[0])
    model_cdf = np.cumsum(fleet.fleet_count_distribution(machine, 100))
    for k in range(counts.min(), counts.max() + 1):
        simulated = np.mean(counts <= k)
        assert abs(model_cdf[k] - simulated) <= 4 * math.sqrt(max(simulated * (1 - simulated), 1e-4) / 20_000)
    low, high = np.quantile(counts, [0.05, 0.95], method="inverted_cdf")
    assert abs(result.warranty_first_failures_low - low) <= 1
    assert abs(result.warranty_first_failures_high - high) <= 1
