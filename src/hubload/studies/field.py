"""Weibull fits of field data and, with a load-case file, the prediction beside them.

Two-parameter Weibull by maximum likelihood with right censoring (bounds by the
likelihood ratio) and by median-rank regression (Johnson's adjusted ranks, Benard's
approximation), both from model/weibull_fit.py. With fewer than two failures there is
no fit: a Weibayes estimate needs an assumed slope. The prediction is the wheel end of
the file (its two bearings in series on the file's life distribution, uncalibrated; of a
machine file the wheel end the rows come from, studies/machine_forecast.py);
the ratio of the field B10 to the predicted B10 is the calibration factor that
``hubload forecast`` takes as ``calibration_factor``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from hubload.domain.field import FieldData
from hubload.domain.fleet import LifeModel
from hubload.errors import InputError
from hubload.model import weibull_fit as wf
from hubload.studies.forecast import ItemLives, LifeBasis

CONFIDENCE = 0.90
# B-lives at which the probability plot draws the likelihood-ratio band (B0.5 to B99).
BAND_PROBABILITIES = np.concatenate([np.geomspace(0.005, 0.1, 9)[:-1], np.linspace(0.1, 0.99, 12)])


@dataclass(frozen=True)
class Prediction:
    """The predicted wheel end of a load-case file and the field's ratio to it."""

    source: str
    title: str
    model: LifeModel
    basis: LifeBasis
    wheel_end: ItemLives           # or a machine's MixtureLives (studies/machine_forecast.py)
    ratio: float                   # field B10 / predicted B10 (nan without a point estimate)
    ratio_low: float
    ratio_high: float


@dataclass(frozen=True)
class FieldStudy:
    data: FieldData
    fit: wf.WeibullFit                       # maximum likelihood, or Weibayes (< 2 failures)
    rank_regression: wf.WeibullFit | None
    band: tuple[np.ndarray, np.ndarray, np.ndarray] | None   # p, low [h], high [h]; plots only
    prediction: Prediction | None

    @property
    def is_fit(self) -> bool:
        return self.fit.method != "weibayes"


def too_few_failures(data: FieldData, assumed_slope: float) -> InputError:
    """The one-line refusal of a fit, with the Weibayes bound that the data do give."""
    bound = wf.weibayes(data.hours, data.failed, assumed_slope, CONFIDENCE)
    return InputError(
        f"{data.failures} failure(s) among {len(data.hours)} units: a Weibull fit needs at "
        f"least {wf.MINIMUM_FAILURES}; with an assumed slope {assumed_slope:g} (Weibayes) the "
        f"data give B10 >= {bound.b10_low_h:,.0f} h at {100 * CONFIDENCE:g} % confidence (one-sided); "
        f"give --weibayes-slope BETA to report that estimate", key_path="column status")


def fit_field(data: FieldData, weibayes_slope: float | None = None, default_slope: float = 1.5,
              band: bool = False) -> tuple[wf.WeibullFit, wf.WeibullFit | None, tuple | None]:
    """ML fit, rank regression and (``band``: for a plot) the likelihood-ratio band of the
    B-lives, which costs a profile per B-life; with < 2 failures Weibayes if a slope is given."""
    if data.failures < wf.MINIMUM_FAILURES:
        if weibayes_slope is None:
            raise too_few_failures(data, default_slope)
        return wf.weibayes(data.hours, data.failed, weibayes_slope, CONFIDENCE), None, None
    try:
        fit = wf.fit_maximum_likelihood(data.hours, data.failed, CONFIDENCE)
        regression = wf.fit_rank_regression(data.hours, data.failed)
    except wf.WeibullFitError as error:
        raise InputError(str(error), key_path="column hours") from None
    if not band:
        return fit, regression, None
    low, high = wf.likelihood_ratio_quantile_bounds(data.hours, data.failed, BAND_PROBABILITIES,
                                                    CONFIDENCE)
    return fit, regression, (BAND_PROBABILITIES, low, high)


def prediction_of(fit: wf.WeibullFit, wheel_end: ItemLives, source: str, title: str,
                  model: LifeModel, basis: LifeBasis) -> Prediction:
    predicted = wheel_end.b10_h

    def ratio(value: float) -> float:
        return value / predicted if math.isfinite(predicted) and predicted > 0 else math.nan

    return Prediction(source=source, title=title, model=model, basis=basis,
                      wheel_end=wheel_end, ratio=ratio(fit.b10_h),
                      ratio_low=ratio(fit.b10_low_h), ratio_high=ratio(fit.b10_high_h))
