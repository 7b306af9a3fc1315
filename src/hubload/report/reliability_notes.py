"""The words that say what a forecast or a field fit stands on, for every output."""

from __future__ import annotations

import math

from hubload.report.numbers import hours_with_unit
from hubload.studies.forecast import Forecast

DISTRIBUTION_WORDS = {
    "iso281": "ISO 281's distribution (three-parameter Weibull, slope 1.5, minimum life "
              "0.05 L10, behind a1)",
    "weibull": "two-parameter Weibull, slope {slope:g}",
}


def distribution_text(kind: str, slope: float) -> str:
    return DISTRIBUTION_WORDS[kind].format(slope=slope)


def forecast_notes(forecast: Forecast) -> list[str]:
    """What the numbers of a forecast stand on, each note one sentence or two."""
    basis = forecast.basis
    source = f"its governing life {basis.symbol} ({basis.governing_basis})" \
        if basis.symbol == basis.governing_symbol else \
        (f"its {basis.symbol}: the governing life {basis.governing_symbol} "
         f"({basis.governing_basis}) taken back to 90 % (divided by a1)")
    notes = [f"Each bearing's L10 is {source}; spread by "
             f"{distribution_text(forecast.model.kind, forecast.model.slope)}.",
             "A wheel end is its two bearings in series (R = R_outboard x R_inboard) on that "
             "distribution; the check's system life of the pair stands on the "
             "Lundberg-Palmgren slope 9/8 and differs from the wheel end's B10 (the check's "
             "verdict stays on the standard's system life)."]
    if forecast.wheel_ends_per_machine > 1:
        notes.append(f"The machine is every bearing of its {forecast.wheel_ends_per_machine} "
                     "wheel ends in series (R = product of every bearing's R).")
    if forecast.calibration != 1.0:
        notes.append(f"Every life is multiplied by the calibration factor "
                     f"{forecast.calibration:g} (field B10 / predicted B10).")
    fleet = forecast.fleet
    if fleet is not None:
        cap = "" if math.isinf(fleet.warranty_cap_h) else \
            f", or {hours_with_unit(fleet.warranty_cap_h)} if reached earlier"
        notes += [f"Failures count bearings; all machines enter service together; each runs "
                  f"the same hours every year, lognormally spread over the fleet (median "
                  f"{fleet.usage_median_h_per_year:g} h, sigma {fleet.usage_sigma_ln:g}); "
                  f"warranty {fleet.warranty_years:g} years{cap}.",
                  "Per year: failures with every failed bearing replaced by a new one "
                  "(renewals); in the warranty: first failures, with the 90 % band of their "
                  "count (Poisson-binomial, 5 % and 95 % quantiles)."]
    return notes


def field_notes(study) -> list[str]:
    """What a field fit stands on (``study``: studies.field.FieldStudy)."""
    fit = study.fit
    level = f"{100 * fit.confidence:g} %"
    if not study.is_fit:
        notes = [f"Fewer than two failures: no Weibull fit. Weibayes with the assumed slope "
                 f"{fit.beta:g}; B10 >= {fit.b10_low_h:,.0f} h is a one-sided {level} lower "
                 f"bound (chi-square on 2 r + 2 degrees of freedom)."]
    else:
        notes = [f"Maximum likelihood with right censoring (suspensions count as units still "
                 f"running); {level} two-sided bounds by the likelihood ratio (profile "
                 f"likelihood). Rank regression: Johnson's adjusted ranks, Benard's median "
                 f"ranks, least squares of Y on X; no bounds."]
        if fit.failures < 10:
            notes.append(f"{fit.failures} failures: the maximum-likelihood slope is biased "
                         "high with few failures; read the bounds, not only the estimates.")
    notes.append("Each row is taken as one wheel end: hours to its first bearing failure, or "
                 "run so far (suspended).")
    found = study.prediction
    if found is not None:
        unit = "the wheel end" if found.wheel_end.name == "wheel end" else \
            f"the machine's wheel end ({found.wheel_end.name}, " + \
            ("by the rows' positions)" if study.data.position is not None else
             "no position column: its wheel ends alike)")
        notes.append(f"Predicted: {unit} of {found.source} ({found.basis.symbol} of "
                     f"each bearing, {distribution_text(found.model.kind, found.model.slope)}; "
                     f"uncalibrated). The ratio field B10 / predicted B10 may be carried into "
                     f"`hubload forecast` as [fleet] calibration_factor.")
    return notes
