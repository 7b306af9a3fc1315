"""The reliability commands: forecast and field."""

from __future__ import annotations

import click

from hubload import api
from hubload.commands import PLOT_SUFFIXES, checked, console, written
from hubload.report.json.text import document_text


def forecast(file: str, as_json: bool = False, plot: str | None = None, force: bool = False,
             method: str | None = None, distribution: str | None = None,
             weibull_slope: float | None = None, **fleet_options) -> api.ForecastResult:
    checked(plot, force, PLOT_SUFFIXES, (file,))
    found = api.forecast(file, method=method, distribution=distribution,
                         weibull_slope=weibull_slope, **fleet_options)
    if plot is not None:
        from hubload.report.plots import save
        from hubload.report.plots.forecast import forecast_figure

        save(forecast_figure(found.value), plot, force, (file,))
        written("Plot", plot, as_json)
    if as_json:
        click.echo(document_text(found.to_dict()))
    else:
        from hubload.report.terminal.forecast import render_forecast

        render_forecast(found.value, console())
    return found


def field(data: str, against: str | None = None, as_json: bool = False,
          plot: str | None = None, force: bool = False, weibayes_slope: float | None = None,
          method: str | None = None) -> api.FieldResult:
    inputs = (data,) + ((against,) if against else ())
    checked(plot, force, PLOT_SUFFIXES, inputs)
    found = api.field(data, against=against, weibayes_slope=weibayes_slope, method=method,
                      band=plot is not None)
    if plot is not None:
        from hubload.report.plots import save
        from hubload.report.plots.field import field_figure

        save(field_figure(found.value), plot, force, inputs)
        written("Plot", plot, as_json)
    if as_json:
        click.echo(document_text(found.to_dict()))
    else:
        from hubload.report.terminal.field import render_field

        render_field(found.value, console())
    return found
