"""The JSON document of ``hubload field --json`` (docs/json-output.md)."""

from __future__ import annotations

from hubload.model.weibull_fit import WeibullFit
from hubload.report.cautions import CAUTIONS
from hubload.report.numbers import json_number
from hubload.report.reliability_notes import field_notes
from hubload.studies.field import FieldStudy


def fit_entry(fit: WeibullFit | None) -> dict | None:
    if fit is None:
        return None
    return {"method": fit.method, "beta": json_number(fit.beta), "eta_h": json_number(fit.eta_h),
            "b10_h": json_number(fit.b10_h), "b10_low_h": json_number(fit.b10_low_h),
            "b10_high_h": json_number(fit.b10_high_h), "failures": fit.failures,
            "suspensions": fit.suspensions, "beta_low": json_number(fit.beta_low),
            "beta_high": json_number(fit.beta_high), "eta_low_h": json_number(fit.eta_low_h),
            "eta_high_h": json_number(fit.eta_high_h), "bounds": fit.bounds_method,
            "confidence": json_number(fit.confidence)}


def against_entry(study: FieldStudy) -> dict | None:
    found = study.prediction
    if found is None:
        return None
    wheel_end = found.wheel_end
    return {"source": found.source, "title": found.title, "distribution": found.model.kind,
            "weibull_slope": found.model.slope, "basis": found.basis.symbol,
            "predicted_unit": wheel_end.name,
            "predicted_b10_h": json_number(wheel_end.b10_h),
            "predicted_b1_h": json_number(wheel_end.b1_h),
            "predicted_b50_h": json_number(wheel_end.b50_h),
            "ratio": json_number(found.ratio), "ratio_low": json_number(found.ratio_low),
            "ratio_high": json_number(found.ratio_high)}


def field_document(study: FieldStudy) -> dict:
    data = study.data
    return {
        "source": data.source,
        "units": len(data.hours), "failures": data.failures, "suspensions": data.suspensions,
        "positions": {name: {"failures": f, "suspensions": s}
                      for name, (f, s) in data.by_position().items()},
        "weibull": fit_entry(study.fit),
        "rank_regression": fit_entry(study.rank_regression),
        "against": against_entry(study),
        "notes": field_notes(study),
        "cautions": CAUTIONS,
    }
