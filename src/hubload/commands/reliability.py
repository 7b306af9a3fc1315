"""The reliability commands: forecast and field."""

from __future__ import annotations

from hubload import api
from hubload.commands import PLOT_SUFFIXES, Outputs, checked, json_text, printed


def forecast(file: str, as_json: bool = False, plot: str | None = None, force: bool = False,
             method: str | None = None, distribution: str | None = None,
             weibull_slope: float | None = None, **fleet_options) -> api.ForecastResult:
    from hubload.report.progress import LateProgress

    checked(plot, force, PLOT_SUFFIXES, (file,))
    with LateProgress("forecasting the fleet") as progress:
        outputs = Outputs(progress, force, (file,))
        found = api.forecast(file, method=method, distribution=distribution,
                             weibull_slope=weibull_slope, **fleet_options)
        outputs.plot(plot, "hubload.report.plots.forecast:forecast_figure", found.value)
        document = json_text(found, progress) if as_json else None
    outputs.name_all(as_json)
    printed(found, document, "hubload.report.terminal.forecast:render_forecast")
    return found


def field(data: str, against: str | None = None, as_json: bool = False,
          plot: str | None = None, force: bool = False, weibayes_slope: float | None = None,
          method: str | None = None) -> api.FieldResult:
    from hubload.report.progress import LateProgress

    inputs = (data,) + ((against,) if against else ())
    checked(plot, force, PLOT_SUFFIXES, inputs)
    with LateProgress("fitting the field data") as progress:
        outputs = Outputs(progress, force, inputs)
        found = api.field(data, against=against, weibayes_slope=weibayes_slope, method=method,
                          band=plot is not None)
        outputs.plot(plot, "hubload.report.plots.field:field_figure", found.value)
        document = json_text(found, progress) if as_json else None
    outputs.name_all(as_json)
    printed(found, document, "hubload.report.terminal.field:render_field")
    return found
