"""The JSON document of ``hubload forecast --json`` (docs/json-output.md)."""

from __future__ import annotations

import math

from hubload.report.cautions import CAUTIONS
from hubload.report.reliability_notes import forecast_notes
from hubload.report.numbers import json_number, json_numbers
from hubload.studies.forecast import Forecast, ItemLives


def unit_entry(item: ItemLives) -> dict:
    entry = {"name": item.name, "kind": item.kind, "b1_h": json_number(item.b1_h),
             "b10_h": json_number(item.b10_h), "b50_h": json_number(item.b50_h),
             "reliability_at_target": item.reliability_at_target}
    if item.kind == "bearing":
        entry["l10_h"] = json_number(item.distributions[0].l10_h)
    return entry


def fleet_entry(forecast: Forecast) -> dict | None:
    fleet, outcome = forecast.fleet, forecast.outcome
    if fleet is None:
        return None
    per_year = [{"year": int(year), "expected_failures": failures, "cumulative": cumulative,
                 "first_failures": first, "first_failures_cumulative": first_cumulative}
                for year, failures, cumulative, first, first_cumulative in zip(
                    outcome.year, json_numbers(outcome.failures_per_year),
                    json_numbers(outcome.failures_cumulative),
                    json_numbers(outcome.first_failures_per_year),
                    json_numbers(outcome.first_failures_cumulative))]
    return {
        "machines": fleet.machines,
        "wheel_ends_per_machine": forecast.wheel_ends_per_machine,
        "bearings_per_machine": forecast.bearings_per_machine,
        "hours_per_year_median": fleet.usage_median_h_per_year,
        "hours_per_year_spread": fleet.usage_sigma_ln,
        "years": fleet.years,
        "warranty_years": fleet.warranty_years,
        "warranty_hours": None if math.isinf(fleet.warranty_cap_h) else fleet.warranty_cap_h,
        "calibration_factor": fleet.calibration,
        "counted": "bearing failures",
        "expected_failures_in_warranty": json_number(outcome.warranty_first_failures),
        "expected_failures_in_warranty_with_replacements": json_number(
            outcome.warranty_failures),
        "bearing_failure_percent_in_warranty": json_number(
            outcome.warranty_unit_failure_percent),
        "machines_with_claim_in_warranty": json_number(outcome.machines_with_claim),
        "machines_with_claim_in_warranty_percent": json_number(
            outcome.machines_with_claim_percent),
        "band_90": {"low": outcome.warranty_first_failures_low,
                    "high": outcome.warranty_first_failures_high,
                    "of": "failures in the warranty (5 % and 95 % quantiles, Poisson-binomial)"},
        "per_year": per_year,
    }


def forecast_document(forecast: Forecast) -> dict:
    basis = forecast.basis
    return {
        "title": forecast.title, "source": forecast.source,
        "distribution": forecast.model.kind, "weibull_slope": forecast.model.slope,
        "basis": {"symbol": basis.symbol, "governing_symbol": basis.governing_symbol,
                  "governing_basis": basis.governing_basis},
        "target_life_h": forecast.target_life_h,
        "calibration_factor": forecast.calibration,
        "units": [unit_entry(item) for item in forecast.items],
        "fleet": fleet_entry(forecast),
        "notes": forecast_notes(forecast),
        "cautions": CAUTIONS,
    }
