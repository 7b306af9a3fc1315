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
    notes = [f"Each bearing's L10 is its {basis.symbol}, the basis of the governing life "
             f"{basis.governing_symbol} ({basis.governing_basis}); spread by "
             f"{distribution_text(forecast.model.kind, forecast.model.slope)}.",
             "A wheel end is its two bearings in series (R = R_outboard x R_inboard) on that "
             "distribution; the check's system life of the pair stands on the "
             "Lundberg-Palmgren slope 9/8 and differs from its B10."]
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
