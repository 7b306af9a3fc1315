"""The Python API of the reliability commands: failure forecasts and field data fits."""

from __future__ import annotations

from pathlib import Path

from hubload.api import Wrapped, check, evaluated_machine, is_machine_file, load
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
    """Life distributions (B1, B10, B50) of the wheel end of ``path`` (a load-case file) or
    of every wheel end and the machine (a machine file) and, with a fleet, its expected
    failures per year and in the warranty. ``distribution``, ``weibull_slope`` and the keys
    of [fleet] (``machines=400``, ``warranty_years=2``, ...) override the file's."""
    unknown = sorted(set(fleet_options) - set(FLEET_OPTIONS))
    if unknown:
        raise TypeError(f"forecast() got unknown fleet options {', '.join(unknown)}; "
                        f"expected some of {', '.join(FLEET_OPTIONS)}")
    machine_file = is_machine_file(path)
    model, fleet = forecast_inputs(path, {"distribution": distribution,
                                          "weibull_slope": weibull_slope}, fleet_options,
                                   machine_file)
    if machine_file:
        from hubload.studies.machine_forecast import run_machine_forecast

        return ForecastResult(run_machine_forecast(evaluated_machine(path, method), model,
                                                   fleet))
    from hubload.engine import evaluate
    from hubload.studies.forecast import run_forecast

    return ForecastResult(run_forecast(evaluate(load(path, method)), model, fleet))


def forecast_inputs(path: str | Path, model_options: dict, fleet_options: dict,
                    machine_file: bool = False):
    """The life model and the fleet of a file's [reliability] and [fleet], with overrides."""
    from hubload.casefile.fleet import read_fleet, read_life_model, refuse_wheel_ends_per_machine
    from hubload.casefile.load import read_document
    from hubload.casefile.validate import validate_document
    from hubload.schema import FORMAT
    from hubload.schema.machineformat import MACHINE_FORMAT

    try:
        document = read_document(path)
        if machine_file:
            refuse_wheel_ends_per_machine(document.get("fleet"), fleet_options)
        data = validate_document(document, MACHINE_FORMAT if machine_file else FORMAT)
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
    load-case file) its predicted wheel end and the ratio of the field B10 to it; with a
    machine file the wheel end the rows come from (its wheel ends mixed by the rows'
    positions, equal shares without a position column). With fewer
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
    machine_file = against is not None and is_machine_file(against)
    model = None if against is None else forecast_inputs(against, {}, {}, machine_file)[0]
    try:
        fit, regression, bounds = fit_field(found, weibayes_slope,
                                            1.5 if model is None else model.slope, band)
    except InputError as error:
        raise error.located(str(data)) from None
    prediction = None
    if machine_file:
        from hubload.studies.machine_forecast import machine_basis, predicted_wheel_end_population

        machine = evaluated_machine(against, method)
        prediction = prediction_of(fit, predicted_wheel_end_population(machine, model, found),
                                   str(against), machine.study.title, model,
                                   machine_basis(machine))
    elif against is not None:
        from hubload.studies.forecast import life_basis, predicted_wheel_end

        checked = check(against, method).value
        prediction = prediction_of(fit, predicted_wheel_end(checked, model), str(against),
                                   checked.study.title, model, life_basis(checked))
    return FieldResult(FieldStudy(data=found, fit=fit, rank_regression=regression, band=bounds,
                                  prediction=prediction))
