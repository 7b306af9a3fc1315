"""Life distributions, series systems and renewals against ISO 281, closed forms and scipy."""

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy import optimize, stats

from hubload.model import reliability as rel
from reliability_reference import scipy_life, simulated_renewal_counts

LN_090 = math.log(1 / 0.9)


def significant(value, digits=2):
    return float(f"{value:.{digits - 1}e}")


# ISO 281:2007, 9.2, table 12: reliability [%] -> a1 (table values from memory; the
# formula of 9.2 decides, and every row agrees with it at the table's two significant digits).
ISO281_TABLE_12 = [(90, 1.0), (95, 0.64), (96, 0.55), (97, 0.47), (98, 0.37), (99, 0.25),
                   (99.2, 0.22), (99.4, 0.19), (99.6, 0.16), (99.8, 0.12), (99.9, 0.093),
                   (99.92, 0.087), (99.94, 0.080), (99.95, 0.077)]


@pytest.mark.parametrize("reliability_percent, a1", ISO281_TABLE_12)
def test_life_at_reliability_reproduces_iso281_table12(reliability_percent, a1):
    # ISO 281:2007, 9.2, table 12.
    ratio = rel.iso281_life_h(10_000.0, reliability_percent / 100) / 10_000.0
    assert significant(ratio) == pytest.approx(a1, abs=1e-12), f"a1({reliability_percent} %) = {ratio}"


def test_iso281_distribution_matches_scipy_three_parameter_weibull():
    # ISO 281:2007, 9.2: F(t) = 1 - exp(-ln(1/0.9) ((t/L10 - 0.05)/0.95)^1.5), zero below 0.05 L10;
    # scipy.stats.weibull_min with loc and scale from that formula is the reference.
    t = np.array([0.0, 400.0, 500.0, 501.0, 2_000.0, 10_000.0, 50_000.0])
    assert rel.iso281_failure_probability(t, 10_000.0) == pytest.approx(
        scipy_life("iso281", 10_000.0, 1.5).cdf(t), rel=1e-12, abs=1e-300)
    assert rel.iso281_failure_probability(10_000.0, 10_000.0) == pytest.approx(0.1)  # L10: 90 % survive


@given(st.floats(100.0, 1e6), st.floats(0.5, 5.0), st.floats(0.0, 5.0))
def test_two_parameter_weibull_matches_scipy(l10, beta, time_over_l10):
    # Weibull (1951): F = 1 - exp(-(t/eta)^beta); scipy.stats.weibull_min is the reference.
    eta = rel.weibull_eta_h(l10, beta)
    reference = stats.weibull_min(beta, scale=eta)
    assert rel.weibull_failure_probability(time_over_l10 * l10, eta, beta) == pytest.approx(
        reference.cdf(time_over_l10 * l10), rel=1e-10, abs=1e-300)
    assert reference.cdf(l10) == pytest.approx(0.1, rel=1e-10)  # eta from B10 puts 10 % at L10
    unit = rel.LifeDistribution("weibull", l10, beta)
    assert unit.mean_h == pytest.approx(reference.mean(), rel=1e-10)
    assert unit.variance_h2 == pytest.approx(reference.var(), rel=1e-8)


@given(st.integers(1, 12), st.floats(0.7, 4.0), st.floats(1e-4, 0.9))
def test_b_life_of_identical_units_in_series_is_eta_k_to_minus_one_over_beta(count, beta, p):
    # Barlow & Proschan (1965), ch. 2: k identical Weibull units in series are Weibull with
    # eta_sys = eta k^(-1/beta); B_p of the system = eta_sys (-ln(1 - p))^(1/beta).
    unit = rel.LifeDistribution("weibull", 5_000.0, beta)
    eta_sys = rel.weibull_eta_h(5_000.0, beta) * count ** (-1 / beta)
    expected = eta_sys * (-math.log1p(-p)) ** (1 / beta)
    assert rel.series_b_life_h([unit] * count, p) == pytest.approx(expected, rel=1e-12)


def test_b_lives_of_a_mixed_series_system_match_scipy_root_finding():
    # Series system R = product of R_i (Barlow & Proschan 1965); reference: scipy's brentq on
    # the product of scipy.stats survival functions.
    units = [("iso281", 8_000.0, 1.5), ("weibull", 12_000.0, 1.125), ("weibull", 30_000.0, 3.0)]
    ours = [rel.LifeDistribution(*u) for u in units]
    theirs = [scipy_life(*u) for u in units]
    p = np.array([0.001, 0.01, 0.1, 0.5, 0.9])
    b_lives = rel.series_b_life_h(ours, p)
    for target, b_life in zip(p, b_lives):
        def system_failure(t, target=target):
            return 1 - np.prod([d.sf(t) for d in theirs]) - target
        assert b_life == pytest.approx(optimize.brentq(system_failure, 1.0, 1e6, xtol=1e-9), rel=1e-9)
    assert rel.series_reliability(ours, b_lives) == pytest.approx(1 - p, rel=1e-12)


def test_renewal_function_of_exponential_lives_is_t_over_eta():
    # Cox (1962), 3.2: a Poisson process renews at rate 1/eta, M(t) = t/eta (slope 1 Weibull).
    eta = 1_000.0
    grid = np.linspace(0.0, 10 * eta, 2001)
    renewals = rel.renewal_function_on_grid(stats.expon(scale=eta).cdf(grid))
    assert renewals == pytest.approx(grid / eta, rel=1e-4, abs=1e-9)
    unit = rel.LifeDistribution("weibull", eta * LN_090, 1.0)  # eta from its B10
    times = np.array([10.0, 500.0, 3_000.0, 50_000.0])  # the last one beyond the grid
    assert rel.expected_renewals(unit, times) == pytest.approx(times / eta, rel=1e-4)


def test_renewal_function_of_erlang2_lives_matches_closed_form():
    # Cox (1962), 3.3 (from memory): gamma lives of shape 2, rate lam:
    # M(t) = lam t / 2 - 1/4 + exp(-2 lam t) / 4.
    lam = 1e-3
    grid = np.linspace(0.0, 8_000.0, 3201)
    renewals = rel.renewal_function_on_grid(stats.gamma(2, scale=1 / lam).cdf(grid))
    expected = lam * grid / 2 - 0.25 + np.exp(-2 * lam * grid) / 4
    assert renewals == pytest.approx(expected, abs=2e-6)


@pytest.mark.parametrize("kind, slope", [("weibull", 1.5), ("iso281", 1.5), ("weibull", 3.0),
                                         ("weibull", 0.8)])
def test_expected_renewals_match_a_seeded_simulation(kind, slope):
    # Reference: Monte Carlo renewal histories drawn by scipy.stats; tolerance 4 standard errors.
    unit = rel.LifeDistribution(kind, 10_000.0, slope)
    times = unit.mean_h * np.array([0.05, 0.5, 1.0, 2.0, 5.0, 30.0])  # 30 means: past the grid
    counts = simulated_renewal_counts(scipy_life(kind, 10_000.0, slope), times, 40_000,
                                      np.random.default_rng(20240601))
    error = counts.std(axis=0) / math.sqrt(len(counts))
    assert np.all(np.abs(rel.expected_renewals(unit, times) - counts.mean(axis=0)) <= 4 * error + 1e-12)


@settings(max_examples=30)
@given(st.sampled_from(["iso281", "weibull"]), st.floats(100.0, 1e5), st.floats(0.8, 4.0))
def test_renewal_function_is_monotone_and_not_below_the_first_failures(kind, l10, slope):
    # Renewal theory: M is non-decreasing and M >= F (first failures are among the renewals);
    # M = sum of F^(*n) <= sum of F^n = F / (1 - F) (Barlow & Proschan 1965, ch. 3).
    unit = rel.LifeDistribution(kind, l10, slope)
    times = np.linspace(0.0, 3 * unit.mean_h, 400)
    renewals = rel.expected_renewals(unit, times)
    first = unit.failure_probability(times)
    assert np.all(np.diff(renewals) >= -1e-12)
    assert np.all(renewals >= first - 1e-12)
    below_one = first < 1
    assert np.all(renewals[below_one] <= first[below_one] / (1 - first[below_one]) + 1e-9)


def test_scaled_distribution_multiplies_every_life():
    # A calibration factor c (field / predicted life) stretches the time axis: F_c(c t) = F(t).
    unit = rel.LifeDistribution("iso281", 10_000.0)
    t = np.array([600.0, 2_000.0, 20_000.0])
    assert unit.scaled(0.6).failure_probability(0.6 * t) == pytest.approx(unit.failure_probability(t))
