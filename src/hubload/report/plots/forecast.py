"""Charts of ``hubload forecast``: F(t) of the units, the fleet's failures per year.

Readable in grey print: the units differ by line style and marker, the bars by hatching.
"""

from __future__ import annotations

import math

import numpy as np
from matplotlib.figure import Figure
from matplotlib.ticker import FuncFormatter

from hubload.report.plots import SYSTEM_COLOUR, TARGET_COLOUR, add_caution, new_figure, styled
from hubload.studies.forecast import Forecast

LINE_STYLES = (("#1f77b4", "--", "o"), ("#ff7f0e", ":", "s"), (SYSTEM_COLOUR, "-", None),
               ("#555555", "-.", "^"))
UNIT_STYLES = tuple(style for style in LINE_STYLES if style[0] != SYSTEM_COLOUR)
MACHINE_STYLE = (SYSTEM_COLOUR, "-", None)
CURVE_POINTS = 200
SHORT_DISTRIBUTION = {"iso281": "ISO 281: Weibull slope 1.5, minimum life 0.05 L10",
                      "weibull": "two-parameter Weibull, slope {slope:g}"}


def time_range_h(forecast: Forecast) -> tuple[float, float]:
    """From a fifth of the shortest B1 to twice the longest B50 (finite lives only)."""
    finite = [v for item in forecast.items for v in (item.b1_h, item.b50_h) if math.isfinite(v)]
    return (0.2 * min(finite), 2.0 * max(finite)) if finite else (1.0, 1e5)


def curves(forecast: Forecast) -> list[tuple[str, object]]:
    """One curve per distinct item: a machine's mirror-image wheel ends, whose B-lives agree
    but for rounding, share one curve named "front left = front right"."""
    found: list[tuple[list[str], object]] = []
    for item in forecast.items:
        same = next((names for names, other in found if other.kind == item.kind and all(
            math.isclose(getattr(item, key), getattr(other, key), rel_tol=1e-9)
            for key in ("b1_h", "b10_h", "b50_h"))), None)
        if same is None:
            found.append(([item.name], item))
        else:
            same.append(item.name)
    return [(" = ".join(names), item) for names, item in found]


def line_styles(forecast: Forecast):
    """The load-case file's styles in their order; a machine file's units cycle through the
    dashed styles and its machine is the solid system line."""
    if forecast.wheel_ends_per_machine == 1 or forecast.items[0].kind == "bearing":
        yield from LINE_STYLES * 3
        return
    for index, (_, item) in enumerate(curves(forecast)):
        yield MACHINE_STYLE if item.kind == "machine" else UNIT_STYLES[index % len(UNIT_STYLES)]


def draw_failure_probability(axes, forecast: Forecast) -> None:
    low, high = time_range_h(forecast)
    time = np.geomspace(low, high, CURVE_POINTS)
    for (label, item), (colour, style, marker) in zip(curves(forecast), line_styles(forecast)):
        axes.plot(time, 100.0 * item.failure_probability(time), color=colour, linestyle=style,
                  linewidth=2.2 if item.kind != "bearing" else 1.4, marker=marker,
                  markevery=25, markersize=4, label=label)
    if forecast.target_life_h is not None:
        axes.axvline(forecast.target_life_h, color=TARGET_COLOUR, linewidth=1.0,
                     linestyle=(0, (1, 1)), label=f"target {forecast.target_life_h:,.0f} h")
    fleet = forecast.fleet
    if fleet is not None:
        warranty_h = min(fleet.usage_median_h_per_year * fleet.warranty_years,
                         fleet.warranty_cap_h)
        axes.axvspan(low, warranty_h, facecolor="#e8e8e8", edgecolor="none", zorder=0,
                     label=f"warranty at median use ({warranty_h:,.0f} h)")
    axes.axhline(10.0, color="#777777", linewidth=0.8)
    axes.set_xscale("log")
    axes.set_xlim(low, high)
    axes.set_ylim(0.0, 100.0)
    axes.xaxis.set_major_formatter(FuncFormatter(lambda v, _: f"{v:,.0f}"))
    axes.set_xlabel("operating hours [h]")
    axes.set_ylabel("failed F(t) [%]")
    axes.set_title(f"Failure probability F(t) from each bearing's {forecast.basis.symbol}",
                   loc="left", fontsize=9)
    axes.legend(fontsize=7, loc="upper center", bbox_to_anchor=(0.5, -0.16), ncol=2, title=SHORT_DISTRIBUTION[forecast.model.kind]
                .format(slope=forecast.model.slope), title_fontsize=7)


def draw_failures_per_year(axes, forecast: Forecast) -> None:
    outcome = forecast.outcome
    years = np.asarray(outcome.year)
    axes.bar(years, outcome.failures_per_year, width=0.6, color="#bbbbbb", edgecolor="#111111",
             hatch="//", label="expected failures in the year (replaced)")
    twin = axes.twinx()
    twin.plot(years, outcome.failures_cumulative, color=SYSTEM_COLOUR, marker="o",
              linewidth=1.8, label="cumulative")
    twin.set_ylabel("cumulative failures")
    twin.set_ylim(bottom=0.0)
    twin.grid(False)
    warranty = forecast.fleet.warranty_years
    axes.axvline(0.5 + warranty, color=TARGET_COLOUR, linestyle=(0, (1, 1)), linewidth=1.2,
                 label=f"end of warranty ({warranty:g} years)")
    axes.set_xticks(years)
    axes.set_xlabel("year in service")
    axes.set_ylabel("expected bearing failures per year")
    axes.set_title(f"{forecast.fleet.machines:,} machines: {outcome.warranty_first_failures:,.1f} "
                   f"failures in the warranty (90 %: {outcome.warranty_first_failures_low:,} to "
                   f"{outcome.warranty_first_failures_high:,})", loc="left", fontsize=9)
    handles = axes.get_legend_handles_labels()
    more = twin.get_legend_handles_labels()
    axes.legend(handles[0] + more[0], handles[1] + more[1], fontsize=7, loc="upper left")


@styled
def forecast_figure(forecast: Forecast) -> Figure:
    """F(t) of every unit (left) and, with a fleet, the expected failures per year (right)."""
    with_fleet = forecast.outcome is not None
    figure = new_figure(11.0 if with_fleet else 7.0, 5.4)
    panels = figure.subplots(1, 2 if with_fleet else 1, squeeze=False)[0]
    draw_failure_probability(panels[0], forecast)
    if with_fleet:
        draw_failures_per_year(panels[1], forecast)
    figure.suptitle(forecast.title, x=0.01, ha="left", fontsize=10)
    add_caution(figure)
    return figure
