"""Weibull fits of field data against Lawless's published fit, lifelines, scipy and exact bounds."""

import math
import warnings
from pathlib import Path

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy import optimize, stats

from hubload.model import weibull_fit as wf

DATA = Path(__file__).parent.parent / "data" / "lieblein_zelen_1956.csv"
LN_090 = math.log(1 / 0.9)


def lieblein_zelen():
    lines = [line for line in DATA.read_text().splitlines() if line and not line.startswith("#")]
    return np.array([float(value) for value in lines[1:]])


def censored_sets():
    """Lieblein & Zelen complete, type-I censored at 75, and censored at random (seeded)."""
    t = lieblein_zelen()
    rng = np.random.default_rng(1956)
    removal = rng.uniform(20.0, 180.0, size=len(t))
    return [("complete", t, np.ones(len(t), dtype=bool)),
            ("censored at 75", np.minimum(t, 75.0), t <= 75.0),
            ("random removals", np.minimum(t, removal), t <= removal)]


def lifelines_fit(time, failed):
    from lifelines import WeibullFitter
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return WeibullFitter(alpha=0.10).fit(time, failed)


def test_lieblein_zelen_maximum_likelihood_matches_lawless():
    # Lawless, Statistical Models and Methods for Lifetime Data (P, from memory): beta 2.102,
    # eta 81.88 million revolutions; B10 = eta ln(1/0.9)^(1/beta) = 28.1 (notes, S).
    fit = wf.fit_maximum_likelihood(lieblein_zelen(), np.ones(23, dtype=bool))
    assert round(fit.beta, 3) == 2.102
    assert round(fit.eta_h, 2) == 81.88
    assert round(fit.b10_h, 1) == 28.1
    assert (fit.failures, fit.suspensions, fit.method) == (23, 0, "maximum-likelihood")
    assert fit.bounds_method == "likelihood-ratio" and fit.confidence == 0.90


@pytest.mark.parametrize("name, time, failed", censored_sets())
def test_maximum_likelihood_matches_lifelines_and_scipy(name, time, failed):
    # lifelines WeibullFitter (lambda_ = eta, rho_ = beta) and scipy.stats.weibull_min.fit on
    # CensoredData with floc=0: two independent implementations of the censored likelihood.
    fit = wf.fit_maximum_likelihood(time, failed)
    reference = lifelines_fit(time, failed)
    assert fit.beta == pytest.approx(reference.rho_, rel=1e-5), name
    assert fit.eta_h == pytest.approx(reference.lambda_, rel=1e-5), name
    data = stats.CensoredData(uncensored=time[failed], right=time[~failed])
    beta, _, eta = stats.weibull_min.fit(data, floc=0)
    assert fit.beta == pytest.approx(beta, rel=1e-4), name
    assert fit.eta_h == pytest.approx(eta, rel=1e-4), name


@pytest.mark.parametrize("name, time, failed", censored_sets())
def test_fisher_bounds_use_lifelines_standard_errors_on_the_log_scale(name, time, failed):
    # lifelines' standard errors from its Hessian; Fisher bounds on ln beta and ln eta
    # (Meeker & Escobar 1998, 8.4): exp(ln x -/+ z se(x) / x).
    fit = wf.fit_maximum_likelihood(time, failed, bounds="fisher")
    reference = lifelines_fit(time, failed)
    se = reference.summary["se(coef)"]
    z = stats.norm.ppf(0.95)
    for low, high, value, key in ((fit.beta_low, fit.beta_high, reference.rho_, "rho_"),
                                  (fit.eta_low_h, fit.eta_high_h, reference.lambda_, "lambda_")):
        spread = z * se[key] / value
        assert low == pytest.approx(value * math.exp(-spread), rel=1e-4), (name, key)
        assert high == pytest.approx(value * math.exp(spread), rel=1e-4), (name, key)
    assert fit.bounds_method == "fisher"


def scipy_log_likelihood(time, failed, eta, beta):
    unit = stats.weibull_min(beta, scale=eta)
    return unit.logpdf(time[failed]).sum() + unit.logsf(time[~failed]).sum()


def scipy_profile(time, failed, fixed, hazard=None):
    """Maximum of the scipy log-likelihood over the free parameter, for beta, eta or B10 fixed
    (or the quantile at cumulative hazard ``hazard``)."""
    name, value = fixed
    if name == "beta":
        return -optimize.minimize_scalar(lambda a: -scipy_log_likelihood(time, failed, math.exp(a), value),
                                         bounds=(0.0, 10.0), method="bounded",
                                         options={"xatol": 1e-10}).fun
    hazard = hazard if hazard is not None else 1.0 if name == "eta" else LN_090

    def negative(log_beta):
        beta = math.exp(log_beta)
        return -scipy_log_likelihood(time, failed, value / hazard ** (1 / beta), beta)
    return -optimize.minimize_scalar(negative, bounds=(-3.0, 3.0), method="bounded",
                                     options={"xatol": 1e-10}).fun


@pytest.mark.parametrize("name, time, failed", censored_sets())
def test_likelihood_ratio_bounds_sit_where_scipys_profile_deviance_is_chi2(name, time, failed):
    # Meeker & Escobar (1998), 8.2: the 90 % likelihood-ratio interval is where
    # 2 (max ln L - profile ln L) = chi2_1(0.90) = 2.706; profiles evaluated independently
    # with scipy.stats log-densities and scipy.optimize.
    fit = wf.fit_maximum_likelihood(time, failed)
    best = scipy_log_likelihood(time, failed, fit.eta_h, fit.beta)
    critical = stats.chi2.ppf(0.90, 1)
    for parameter, bounds in (("beta", (fit.beta_low, fit.beta_high)),
                              ("eta", (fit.eta_low_h, fit.eta_high_h)),
                              ("b10", (fit.b10_low_h, fit.b10_high_h))):
        for bound in bounds:
            deviance = 2 * (best - scipy_profile(time, failed, (parameter, bound)))
            assert deviance == pytest.approx(critical, abs=1e-5), (name, parameter, bound)
    assert fit.beta_low < fit.beta < fit.beta_high
    assert fit.b10_low_h < fit.b10_h < fit.b10_high_h


@pytest.mark.parametrize("name, time, failed", censored_sets()[:2])
def test_quantile_bounds_sit_where_scipys_profile_deviance_is_chi2(name, time, failed):
    # Meeker & Escobar (1998), 8.2, for B-lives from B1 to B90 (the band of a probability plot).
    fit = wf.fit_maximum_likelihood(time, failed)
    best = scipy_log_likelihood(time, failed, fit.eta_h, fit.beta)
    critical = stats.chi2.ppf(0.90, 1)
    probabilities = np.array([0.01, 0.1, 0.5, 0.9])
    low, high = wf.likelihood_ratio_quantile_bounds(time, failed, probabilities)
    for p, bounds in zip(probabilities, zip(low, high)):
        for bound in bounds:
            profile = scipy_profile(time, failed, ("quantile", bound), -math.log1p(-p))
            assert 2 * (best - profile) == pytest.approx(critical, abs=1e-5), (name, p, bound)


@settings(max_examples=25)
@given(st.floats(1e-3, 1e6))
def test_fit_does_not_depend_on_the_time_unit(scale):
    # Invariance of the Weibull likelihood to the time scale: eta scales, beta does not.
    name, time, failed = censored_sets()[2]
    base = wf.fit_maximum_likelihood(time, failed)
    scaled = wf.fit_maximum_likelihood(time * scale, failed)
    assert scaled.beta == pytest.approx(base.beta, rel=1e-9)
    assert scaled.eta_h == pytest.approx(base.eta_h * scale, rel=1e-9)
    assert scaled.b10_low_h == pytest.approx(base.b10_low_h * scale, rel=1e-7)


def test_rank_regression_on_y_reproduces_the_notes_for_lieblein_zelen():
    # Notes (S): "rank regression on Y: beta 2.181, eta 81.58". Reference: scipy.stats.linregress
    # of Y = ln ln(1/(1 - F)) on X = ln t at Benard's ranks (i - 0.3)/(n + 0.4) (Benard 1953).
    # X on Y would give beta 2.248, eta 80.97: the notes' numbers are Y on X.
    t = np.sort(lieblein_zelen())
    fit = wf.fit_rank_regression(t, np.ones(23, dtype=bool))
    y = np.log(-np.log(1 - (np.arange(1, 24) - 0.3) / 23.4))
    line = stats.linregress(np.log(t), y)
    assert fit.beta == pytest.approx(line.slope, rel=1e-12)
    assert fit.eta_h == pytest.approx(math.exp(-line.intercept / line.slope), rel=1e-12)
    assert (round(fit.beta, 3), round(fit.eta_h, 2)) == (2.181, 81.58)
    assert fit.method == "rank-regression-on-y" and fit.bounds_method == "none"
    assert math.isnan(fit.b10_low_h)


@pytest.mark.parametrize("name, time, failed", censored_sets()[1:])
def test_johnson_adjusted_ranks_equal_the_herd_johnson_product_form(name, time, failed):
    # Johnson (1964) / Herd (1960), from memory: 1 - i_adj/(n + 1) = product over failures so far
    # of m/(m + 1), m = number of units from that failure on (a product-limit form).
    times, ranks = wf.johnson_adjusted_ranks(time, failed)
    order = np.lexsort((~failed, time))
    from_here_on = len(time) - np.arange(len(time))
    factors = (from_here_on / (from_here_on + 1.0))[failed[order]]
    assert ranks == pytest.approx(len(time) + 1 - (len(time) + 1) * np.cumprod(factors), rel=1e-12)
    assert np.all(np.diff(times) >= 0) and len(ranks) == failed.sum()


def test_adjusted_ranks_without_suspensions_are_the_order_numbers():
    # With no suspension every increment is 1 (Johnson 1964): ranks 1..n.
    _, ranks = wf.johnson_adjusted_ranks(lieblein_zelen(), np.ones(23, dtype=bool))
    assert ranks == pytest.approx(np.arange(1, 24), rel=1e-12)


@pytest.mark.parametrize("units, beta, confidence", [(10, 1.5, 0.90), (30, 3.0, 0.95), (5, 1.1, 0.6)])
def test_weibayes_with_no_failure_equals_the_clopper_pearson_zero_failure_bound(units, beta, confidence):
    # n units all run to t without failure: the lower bound on R(t) is (1 - C)^(1/n), the exact
    # binomial (Clopper & Pearson 1934) one-sided bound, for any assumed slope (Nelson 1985).
    fit = wf.weibayes(np.full(units, 2_000.0), np.zeros(units, dtype=bool), beta, confidence)
    reliability_low = math.exp(-((2_000.0 / fit.eta_low_h) ** beta))
    assert 1 - reliability_low == pytest.approx(stats.beta.ppf(confidence, 1, units), rel=1e-10)
    assert math.isnan(fit.eta_h) and fit.eta_high_h == math.inf
    assert fit.b10_low_h == pytest.approx(fit.eta_low_h * LN_090 ** (1 / beta), rel=1e-12)


@pytest.mark.parametrize("failures", [1, 2, 5])
def test_weibayes_with_slope_one_gives_garwoods_exact_poisson_bound(failures):
    # beta = 1 (exponential, time-terminated test): the lower bound on eta = MTTF is total time /
    # the exact (Garwood 1936) upper bound on the Poisson mean with r failures at confidence C.
    time = np.array([300.0, 800.0, 1_000.0, 1_500.0, 2_200.0, 2_500.0, 4_000.0])
    failed = np.arange(len(time)) < failures
    fit = wf.weibayes(time, failed, 1.0, 0.90)
    mean_high = optimize.brentq(lambda m: stats.poisson.cdf(failures, m) - 0.10, 1e-6, 100.0, xtol=1e-13)
    assert fit.eta_low_h == pytest.approx(time.sum() / mean_high, rel=1e-9)
    assert fit.eta_h == pytest.approx(time.sum() / failures, rel=1e-12)  # ML estimate for slope 1


@pytest.mark.parametrize("fit", [wf.fit_maximum_likelihood, wf.fit_rank_regression])
@pytest.mark.parametrize("failures", [0, 1])
def test_fits_need_two_failures(fit, failures):
    time = np.array([100.0, 200.0, 300.0, 400.0])
    with pytest.raises(wf.TooFewFailuresError) as raised:
        fit(time, np.arange(4) < failures)
    assert raised.value.failures == failures
    assert isinstance(raised.value, ValueError)


@pytest.mark.parametrize("fit", [wf.fit_maximum_likelihood, wf.fit_rank_regression])
def test_failure_times_without_spread_give_no_slope(fit):
    # All failures at one time with no later unit: the likelihood grows without bound in beta.
    with pytest.raises(wf.WeibullFitError):
        fit(np.array([500.0, 500.0, 500.0, 200.0]), np.array([True, True, True, False]))
