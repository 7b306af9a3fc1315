"""Two-parameter Weibull fits of field data: failures and suspensions (right censoring).

Data are operating times t_i [h] (any time unit works; results are in the same
unit) with a flag per unit: failed, or suspended (still running, or removed
unfailed). Three methods:

- maximum likelihood with right censoring [1, 2], 90 % two-sided bounds on beta,
  eta and B10 by the likelihood-ratio (profile likelihood) method [2] (reported by
  default) or by the Fisher matrix with log-transformed parameters [2, 3];
- median-rank regression [4]: Benard's approximation F = (i - 0.3) / (n + 0.4) at
  Johnson's adjusted ranks i (which account for suspensions) [5]; least squares of
  Y = ln ln (1 / (1 - F)) on X = ln t ("rank regression on Y"). No bounds;
- Weibayes [6, 7] for zero or one failure: the slope beta is assumed, eta has a
  point estimate (for at least one failure) and a one-sided lower bound.

The fits need at least two failures (``TooFewFailuresError`` otherwise); with
fewer the caller turns to ``weibayes``. With few failures the likelihood slope is
biased high [2, 3]: read the bounds, not only the point estimate.

Maximum likelihood is solved here rather than by scipy.stats.weibull_min.fit on
CensoredData: with eta eliminated the score equation in beta,
1/beta + mean over failures of ln t - sum t^beta ln t / sum t^beta = 0, is strictly
decreasing in beta [1, 5.2], so a bracketed root (brentq) always finds the unique
estimate to machine precision, while the generic fit minimises numerically from a
heuristic start with loose tolerances. Sums are taken on t / max(t) as
log-sum-exp, so large slopes or times do not overflow.

References
----------
[1] J. F. Lawless, Statistical Models and Methods for Lifetime Data, 2nd ed.,
    Wiley 2003, 5.2 (Weibull maximum likelihood with censoring; example: the
    ball bearing data of Lieblein & Zelen) -- from memory.
[2] W. Q. Meeker, L. A. Escobar, Statistical Methods for Reliability Data,
    Wiley 1998, 8.2-8.4 (likelihood-ratio and Wald bounds, log transformation)
    -- from memory.
[3] W. Nelson, Applied Life Data Analysis, Wiley 1982, ch. 8 (ML fits, Fisher
    matrix bounds) -- from memory.
[4] A. Benard, E. C. Bos-Levenbach, Het uitzetten van waarnemingen op
    waarschijnlijkheidspapier, Statistica Neerlandica 7 (1953) 163-173.
[5] L. G. Johnson, The Statistical Treatment of Fatigue Experiments, Elsevier
    1964 (adjusted ranks with suspensions) -- from memory.
[6] W. Nelson, Weibull analysis of reliability data with few or no failures,
    J. Quality Technology 17 (1985) 140-146 (lower bound with chi-square on
    2 r + 2 degrees of freedom) -- from memory.
[7] R. B. Abernethy, The New Weibull Handbook, 5th ed., 2006, ch. 6 (Weibayes)
    -- from memory.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np
from scipy import optimize, special, stats

# Cumulative hazard at B10: -ln(1 - 0.1); at eta it is 1 (63.2 % failed).
HAZARD_B10 = math.log(1.0 / 0.9)
HAZARD_ETA = 1.0
MINIMUM_FAILURES = 2
# Widest bracket searched for ln beta (beta from e^-64 to e^64): wider means no slope.
LOG_BETA_SPAN = 128.0
# A profile bound more than e^40 away from the estimate is reported as unbounded.
LOG_BOUND_SPAN = 40.0


class WeibullFitError(ValueError):
    """Field data from which no Weibull fit can be made."""


class TooFewFailuresError(WeibullFitError):
    """Fewer than two failures: only a Weibayes estimate with an assumed slope is possible."""

    def __init__(self, failures: int):
        super().__init__(f"{failures} failure(s): a Weibull fit needs at least {MINIMUM_FAILURES}; "
                         "assume a slope and use a Weibayes estimate")
        self.failures = failures


@dataclass(frozen=True)
class WeibullFit:
    """Result of a fit; times in the unit of the data [h]; bounds nan where none apply."""

    method: str
    beta: float
    eta_h: float
    b10_h: float
    b10_low_h: float
    b10_high_h: float
    beta_low: float
    beta_high: float
    eta_low_h: float
    eta_high_h: float
    failures: int
    suspensions: int
    bounds_method: str
    confidence: float


class _Sample:
    """Times scaled by their maximum (x = ln(t / t_ref)) and the failure flags."""

    def __init__(self, time_h, failed):
        time = np.asarray(time_h, dtype=float)
        self.failed = np.asarray(failed, dtype=bool)
        self.failures = int(self.failed.sum())
        self.log_ref = math.log(float(time.max()))
        self.x = np.log(time) - self.log_ref
        self.failed_x_sum = float(self.x[self.failed].sum())

    def log_likelihood(self, log_quantile: float, beta: float, hazard: float) -> float:
        """ln L at the time whose cumulative hazard is ``hazard`` (ln of it scaled) and beta [1].

        ln L = r ln beta - r beta a + (beta - 1) sum_f x - sum exp(beta (x - a)), a = ln eta.
        """
        a = log_quantile - math.log(hazard) / beta
        return (self.failures * math.log(beta) - self.failures * beta * a
                + (beta - 1.0) * self.failed_x_sum - float(np.exp(beta * (self.x - a)).sum()))

    def log_eta_given_beta(self, beta: float) -> float:
        """ln eta (scaled) maximising the likelihood at a given beta: (sum t^beta / r)^(1/beta) [1]."""
        return (special.logsumexp(beta * self.x) - math.log(self.failures)) / beta

    def beta_score(self, beta: float) -> float:
        """d ln L / d beta with eta eliminated; strictly decreasing in beta [1, 5.2]."""
        weights = special.softmax(beta * self.x)
        return 1.0 / beta + self.failed_x_sum / self.failures - float(weights @ self.x)

    def best_beta_at_quantile(self, log_quantile: float, hazard: float) -> float:
        """beta maximising ln L with the quantile held fixed (ln L is concave in beta there)."""
        def score(log_beta):
            beta = math.exp(log_beta)
            shifted = self.x - log_quantile
            return (self.failures / beta - self.failures * log_quantile + self.failed_x_sum
                    - hazard * float((shifted * np.exp(beta * shifted)).sum()))
        return math.exp(_decreasing_root(score, 0.0))


def _decreasing_root(function, start: float) -> float:
    """Root of a decreasing function of ln beta, bracketed by doubling steps from ``start``."""
    low, high = start - 1.0, start + 1.0
    while function(low) <= 0.0 or function(high) >= 0.0:
        if high - low > LOG_BETA_SPAN:
            raise WeibullFitError("the failure times do not spread: no slope can be fitted")
        width = high - low
        low, high = (low - width, high) if function(low) <= 0.0 else (low, high + width)
    return optimize.brentq(function, low, high, xtol=1e-14, rtol=4 * np.finfo(float).eps)


def _require_failures(sample: _Sample) -> None:
    if sample.failures < MINIMUM_FAILURES:
        raise TooFewFailuresError(sample.failures)


def fit_maximum_likelihood(time_h, failed, confidence: float = 0.90,
                           bounds: str = "likelihood-ratio") -> WeibullFit:
    """Weibull fit by maximum likelihood with right censoring [1].

    time_h (n,) [h]; failed (n,) bool (False: suspended); confidence [-] of the
    two-sided bounds; bounds "likelihood-ratio" [2, 8.2] or "fisher" (Wald bounds on
    ln beta, ln eta, ln B10 from the observed information [2, 8.4; 3]).
    """
    sample = _Sample(time_h, failed)
    _require_failures(sample)
    beta = math.exp(_decreasing_root(lambda log_beta: sample.beta_score(math.exp(log_beta)), 0.0))
    log_eta = sample.log_eta_given_beta(beta)
    estimate = (log_eta, beta)
    bounds_of = {"likelihood-ratio": _likelihood_ratio_bounds, "fisher": _fisher_bounds}[bounds]
    # Far out on a profile t^beta may overflow: the likelihood there is 0, as inf gives.
    with np.errstate(over="ignore"):
        limits = bounds_of(sample, estimate, confidence)
    return _result("maximum-likelihood", sample, beta, log_eta, limits, bounds, confidence)


def _likelihood_ratio_bounds(sample: _Sample, estimate, confidence: float):
    """(beta, eta, B10) bounds where the profile deviance reaches chi2_1(confidence) [2, 8.2]."""
    log_eta, beta = estimate
    best = sample.log_likelihood(log_eta, beta, HAZARD_ETA)
    critical = 0.5 * stats.chi2.ppf(confidence, 1)

    def beta_drop(log_beta):
        b = math.exp(log_beta)
        return best - sample.log_likelihood(sample.log_eta_given_beta(b), b, HAZARD_ETA) - critical

    return (_bounds_of_drop(beta_drop, math.log(beta)),
            _quantile_bounds(sample, estimate, HAZARD_ETA, confidence),
            _quantile_bounds(sample, estimate, HAZARD_B10, confidence))


def _quantile_bounds(sample: _Sample, estimate, hazard: float, confidence: float):
    """ln-scale bounds of the quantile at cumulative hazard ``hazard`` by its profile [2, 8.2]."""
    log_eta, beta = estimate
    best = sample.log_likelihood(log_eta, beta, HAZARD_ETA)
    critical = 0.5 * stats.chi2.ppf(confidence, 1)

    def drop(log_quantile):
        b = sample.best_beta_at_quantile(log_quantile, hazard)
        return best - sample.log_likelihood(log_quantile, b, hazard) - critical

    return _bounds_of_drop(drop, log_eta + math.log(hazard) / beta)


def likelihood_ratio_quantile_bounds(time_h, failed, failure_probability, confidence: float = 0.90):
    """Two-sided likelihood-ratio bounds [h] of the B-lives at failure probabilities p [-] [2, 8.2].

    The same profile-likelihood bounds as the B10 bounds of ``fit_maximum_likelihood``, at
    each p (0 < p < 1) of ``failure_probability``: arrays (low, high), inf where unbounded.
    """
    sample = _Sample(time_h, failed)
    _require_failures(sample)
    beta = math.exp(_decreasing_root(lambda log_beta: sample.beta_score(math.exp(log_beta)), 0.0))
    estimate = (sample.log_eta_given_beta(beta), beta)
    with np.errstate(over="ignore"):
        limits = np.array([_quantile_bounds(sample, estimate, -math.log1p(-p), confidence)
                           for p in np.atleast_1d(np.asarray(failure_probability, dtype=float))])
    times = np.exp(limits + sample.log_ref)
    return times[:, 0], times[:, 1]


def _bounds_of_drop(drop, centre: float):
    """ln-scale (low, high) roots of ``drop`` (negative at ``centre``) on both sides of it.

    A side on which the profile never falls to the critical level within
    LOG_BOUND_SPAN is unbounded (-inf or inf).
    """
    limits = []
    for direction in (-1.0, 1.0):
        step = 0.1
        while step <= LOG_BOUND_SPAN and drop(centre + direction * step) < 0.0:
            step *= 2.0
        if step > LOG_BOUND_SPAN:
            limits.append(math.inf)
            continue
        limits.append(optimize.brentq(lambda v: drop(centre + direction * v), 0.0, step, xtol=1e-13))
    return centre - limits[0], centre + limits[1]


def _fisher_bounds(sample: _Sample, estimate, confidence: float):
    """(beta, eta, B10) Wald bounds on the log scale from the observed information [2, 8.4].

    With y = x - a, w = exp(beta y) (a = ln eta), the observed information in
    (a, beta) at the estimate (sum w = r) is
    [[beta^2 sum w, -beta sum y w], [-beta sum y w, r / beta^2 + sum y^2 w]].
    """
    log_eta, beta = estimate
    covariance = fisher_covariance_log_eta_beta(sample.x - log_eta, beta, sample.failures)
    z = stats.norm.ppf(0.5 + 0.5 * confidence)
    log_b10 = log_eta + math.log(HAZARD_B10) / beta
    gradient_b10 = np.array([1.0, -math.log(HAZARD_B10) / beta**2])
    spreads = (math.sqrt(covariance[1, 1]) / beta, math.sqrt(covariance[0, 0]),
               math.sqrt(gradient_b10 @ covariance @ gradient_b10))
    centres = (math.log(beta), log_eta, log_b10)
    return tuple((c - z * s, c + z * s) for c, s in zip(centres, spreads))


def fisher_covariance_log_eta_beta(log_time_over_eta, beta: float, failures: int):
    """Covariance of (ln eta, beta) [-] at the ML estimate: inverse observed information [2, 8.4].

    log_time_over_eta (n,): ln(t / eta) of all units at the estimate; failures r.
    """
    y = np.asarray(log_time_over_eta, dtype=float)
    w = np.exp(beta * y)
    cross = -beta * float((y * w).sum())
    information = np.array([[beta**2 * float(w.sum()), cross],
                            [cross, failures / beta**2 + float((y * y * w).sum())]])
    return np.linalg.inv(information)


def johnson_adjusted_ranks(time_h, failed):
    """Sorted failure times [h] and their Johnson adjusted ranks [-] [5].

    Units are ordered by time (a failure before a suspension at the same time, common
    practice); at each failure the rank grows by (n + 1 - previous rank) / (1 + number
    of units from this one on).
    """
    time = np.asarray(time_h, dtype=float)
    flags = np.asarray(failed, dtype=bool)
    order = np.lexsort((~flags, time))
    count = len(time)
    from_here_on = count - np.arange(count)
    ranks, previous = [], 0.0
    for position in np.flatnonzero(flags[order]):
        previous += (count + 1 - previous) / (1 + from_here_on[position])
        ranks.append(previous)
    return time[order][flags[order]], np.array(ranks)


def benard_median_rank(adjusted_rank, units: int):
    """Median rank F = (i - 0.3) / (n + 0.4) [-] (Benard's approximation) [4]."""
    return (np.asarray(adjusted_rank, dtype=float) - 0.3) / (units + 0.4)


def fit_rank_regression(time_h, failed) -> WeibullFit:
    """Median-rank regression, Y on X: least squares of ln ln(1/(1-F)) on ln t [4, 5]."""
    sample = _Sample(time_h, failed)
    _require_failures(sample)
    times, ranks = johnson_adjusted_ranks(time_h, failed)
    y = np.log(-np.log1p(-benard_median_rank(ranks, len(sample.x))))
    x = np.log(times) - sample.log_ref
    if np.ptp(x) == 0.0:
        raise WeibullFitError("the failure times do not spread: no slope can be fitted")
    beta, intercept = np.polyfit(x, y, 1)
    nan = (math.nan, math.nan)
    return _result("rank-regression-on-y", sample, float(beta), -float(intercept) / beta,
                   (nan, nan, nan), "none", math.nan)


def weibayes(time_h, failed, beta: float, confidence: float = 0.90) -> WeibullFit:
    """Weibayes: eta for an assumed slope beta [-], with a one-sided lower bound [6, 7].

    eta = (sum t^beta / r)^(1/beta) for r >= 1 failures (nan for none); lower bound at
    ``confidence``: eta_low = (2 sum t^beta / chi2_confidence(2 r + 2))^(1/beta) [6].
    Upper bounds are inf.
    """
    sample = _Sample(time_h, failed)
    log_sum = special.logsumexp(beta * sample.x)
    log_eta = (log_sum - math.log(sample.failures)) / beta if sample.failures else math.nan
    log_low = (log_sum + math.log(2.0) - math.log(stats.chi2.ppf(confidence, 2 * sample.failures + 2))) / beta
    log_beta = math.log(beta)
    limits = ((log_beta, log_beta), (log_low, math.inf), (log_low + math.log(HAZARD_B10) / beta, math.inf))
    return _result("weibayes", sample, beta, log_eta, limits, "weibayes chi-square, one-sided lower",
                   confidence)


def _result(method, sample, beta, log_eta, limits, bounds_method, confidence) -> WeibullFit:
    """Assemble a WeibullFit from scaled ln-values (ln of time / t_ref)."""
    (beta_low, beta_high), eta_limits, b10_limits = limits

    def time(log_scaled):
        return math.exp(log_scaled + sample.log_ref)

    log_b10 = log_eta + math.log(HAZARD_B10) / beta
    return WeibullFit(
        method=method, beta=beta, eta_h=time(log_eta), b10_h=time(log_b10),
        b10_low_h=time(b10_limits[0]), b10_high_h=time(b10_limits[1]),
        beta_low=math.exp(beta_low), beta_high=math.exp(beta_high),
        eta_low_h=time(eta_limits[0]), eta_high_h=time(eta_limits[1]),
        failures=sample.failures, suspensions=len(sample.x) - sample.failures,
        bounds_method=bounds_method, confidence=confidence)
