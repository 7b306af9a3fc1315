"""The Python API of the reliability commands: failure forecasts and field data fits."""

from __future__ import annotations

from pathlib import Path

from hubload.api import Wrapped, check, load
from hubload.errors import InputError


class ForecastResult(Wrapped):
    """``value``: hubload.studies.forecast.Forecast."""

    def to_dict(self) -> dict:
        """The document of ``hubload forecast --json``."""
        from hubload.report.json.forecast import forecast_document

        return forecast_document(self.value)


FLEET_OPTIONS = ("machines", "wheel_ends_per_machine", "hours_per_year_median",
                 "hours_per_year_spread", "years", "warranty_years", "warranty_hours",
                 "calibration_factor")


def forecast(path: str | Path, method: str | None = None, distribution: str | None = None,
             weibull_slope: float | None = None, **fleet_options) -> ForecastResult:
    """Life distributions (B1, B10, B50) of the wheel end of ``path`` and, with a fleet, its
    expected failures per year and in the warranty. ``distribution``, ``weibull_slope`` and
    the keys of [fleet] (``machines=400``, ``warranty_years=2``, ...) override the file's."""
    from hubload.engine import evaluate
    from hubload.studies.forecast import run_forecast

    unknown = sorted(set(fleet_options) - set(FLEET_OPTIONS))
    if unknown:
        raise TypeError(f"forecast() got unknown fleet options {', '.join(unknown)}; "
                        f"expected some of {', '.join(FLEET_OPTIONS)}")
    model, fleet = forecast_inputs(path, {"distribution": distribution,
                                          "weibull_slope": weibull_slope}, fleet_options)
    return ForecastResult(run_forecast(evaluate(load(path, method)), model, fleet))


def forecast_inputs(path: str | Path, model_options: dict, fleet_options: dict):
    """The life model and the fleet of a file's [reliability] and [fleet], with overrides."""
    from hubload.casefile.fleet import read_fleet, read_life_model
    from hubload.casefile.load import read_document
    from hubload.casefile.validate import validate_document
    from hubload.schema import FORMAT

    try:
        data = validate_document(read_document(path), FORMAT)
        return (read_life_model(data.get("reliability"), model_options),
                read_fleet(data.get("fleet"), fleet_options))
    except InputError as error:
        if (error.key_path or "").startswith("--"):   # an option's error names the option
            raise
        raise error.located(str(path)) from None


class FieldResult(Wrapped):
    """``value``: hubload.studies.field.FieldStudy."""

    def to_dict(self) -> dict:
        """The document of ``hubload field --json``."""
        from hubload.report.json.field import field_document

        return field_document(self.value)


def field(data: str | Path, against: str | Path | None = None,
          weibayes_slope: float | None = None, method: str | None = None,
          band: bool = False) -> FieldResult:
    """Weibull fits of the field data file ``data`` (CSV or XLSX); with ``against`` (a
    load-case file) its predicted wheel end and the ratio of the field B10 to it. With fewer
    than two failures only a Weibayes estimate exists: give ``weibayes_slope``. ``band``
    adds the likelihood-ratio band of the B-lives that the probability plot draws."""
    from hubload.casefile.field_data import read_field_data
    from hubload.schema.fleetformat import MAX_WEIBULL_SLOPE, MIN_WEIBULL_SLOPE
    from hubload.studies.field import FieldStudy, fit_field, prediction_of

    if weibayes_slope is not None and not MIN_WEIBULL_SLOPE <= weibayes_slope <= MAX_WEIBULL_SLOPE:
        raise InputError(f"expected a Weibull slope from {MIN_WEIBULL_SLOPE:g} to "
                         f"{MAX_WEIBULL_SLOPE:g}, got {weibayes_slope:g}",
                         key_path="--weibayes-slope")
    found = read_field_data(data)
    model, checked = (None, None) if against is None else (
        forecast_inputs(against, {}, {})[0], check(against, method).value)
    try:
        fit, regression, bounds = fit_field(found, weibayes_slope,
                                            1.5 if model is None else model.slope, band)
    except InputError as error:
        raise error.located(str(data)) from None
    prediction = None
    if checked is not None:
        from hubload.studies.forecast import life_basis, predicted_wheel_end

        prediction = prediction_of(fit, predicted_wheel_end(checked, model), str(against),
                                   checked.study.title, model, life_basis(checked))
    return FieldResult(FieldStudy(data=found, fit=fit, rank_regression=regression, band=bounds,
                                  prediction=prediction))
