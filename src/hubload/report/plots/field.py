"""Weibull probability plot of field data: points, fits, bounds and the prediction.

Axes of Weibull probability paper: ln t across, ln ln(1 / (1 - F)) up, labelled in
per cent failed; a two-parameter Weibull is a straight line. Readable in grey print:
the fits differ by line style, the points by marker, the band is hatched.
"""

from __future__ import annotations

import math

import numpy as np
from matplotlib.figure import Figure
from matplotlib.ticker import FixedLocator, FuncFormatter, NullFormatter, NullLocator

from hubload.model.weibull_fit import benard_median_rank, johnson_adjusted_ranks
from hubload.report.plots import SYSTEM_COLOUR, TARGET_COLOUR, add_caution, new_figure, styled
from hubload.studies.field import FieldStudy

PERCENT_TICKS = (0.1, 0.2, 0.5, 1, 2, 5, 10, 20, 30, 50, 63.2, 80, 90, 95, 99, 99.9)
CURVE_POINTS = 100
MAX_RUG = 500      # rug marks of suspensions: enough to show their spread, bounded in size



def prediction_name(name: str) -> str:
    """A load-case file's "wheel end"; a machine's "wheel end rear left" or "wheel end
    (mixture of the machine's wheel ends)"."""
    if name == "wheel end":
        return name
    return "wheel end (mixture of the machine's)" if name.startswith("mixture") else \
        f"wheel end {name}"

def weibull_y(probability):
    """ln ln(1 / (1 - F)) of probability paper."""
    return np.log(-np.log1p(-np.asarray(probability, dtype=float)))


def probability_range(study: FieldStudy, plotted) -> tuple[float, float]:
    lowest = min([0.01, *plotted]) / 2.0
    return max(lowest, 1e-4), 0.99


def draw_probability_paper(axes, low: float, high: float) -> None:
    ticks = [p for p in PERCENT_TICKS if low * 100 <= p <= high * 100]
    axes.set_yscale("linear")
    axes.set_ylim(weibull_y(low), weibull_y(high))
    axes.yaxis.set_major_locator(FixedLocator(weibull_y(np.array(ticks) / 100.0)))
    axes.yaxis.set_minor_locator(NullLocator())
    labels = {round(float(weibull_y(p / 100.0)), 9): p for p in ticks}
    axes.yaxis.set_major_formatter(FuncFormatter(
        lambda v, _: f"{labels.get(round(v, 9), math.nan):g}"))
    axes.set_xscale("log")
    axes.xaxis.set_major_formatter(FuncFormatter(lambda v, _: f"{v:,.0f}"))
    axes.xaxis.set_minor_formatter(NullFormatter())


def shown_suspensions(hours) -> np.ndarray:
    """The suspensions' hours as a rug: distinct values, at most MAX_RUG (their quantiles)."""
    distinct = np.unique(hours)
    if len(distinct) <= MAX_RUG:
        return distinct
    return np.quantile(distinct, np.linspace(0.0, 1.0, MAX_RUG))


@styled
def field_figure(study: FieldStudy) -> Figure:
    data = study.data
    fit = study.fit
    figure = new_figure(8.0, 6.0)
    axes = figure.subplots()
    plotted = []
    lows, highs = [float(data.hours.min())], [float(data.hours.max())]
    if study.is_fit:
        times, ranks = johnson_adjusted_ranks(data.hours, data.failed)
        ranks_f = benard_median_rank(ranks, len(data.hours))
        plotted = list(ranks_f)
        axes.plot(times, weibull_y(ranks_f), linestyle="none", marker="o", markersize=5,
                  markerfacecolor="white", markeredgecolor=SYSTEM_COLOUR,
                  label=f"failures at median ranks ({data.failures} failed, "
                        f"{data.suspensions} suspended)")
    low_p, high_p = probability_range(study, plotted)
    span = np.array([low_p, high_p])
    fitted_times = fit.eta_h * (-np.log1p(-span)) ** (1.0 / fit.beta) if math.isfinite(fit.eta_h) \
        else np.array([])
    if study.band is not None:
        probability, band_low, band_high = study.band
        finite = np.isfinite(band_low) & np.isfinite(band_high)
        y = weibull_y(probability[finite])
        axes.fill_betweenx(y, band_low[finite], band_high[finite], facecolor="#dddddd",
                           edgecolor="none", zorder=0,
                           label=f"{100 * fit.confidence:g} % bounds ({fit.bounds_method})")
        for edge in (band_low[finite], band_high[finite]):
            axes.plot(edge, y, color="#777777", linewidth=0.8, linestyle=":")
        lows.append(float(np.min(band_low[finite], initial=lows[0])))
        highs.append(float(np.max(band_high[finite], initial=highs[0])))
    if len(fitted_times):
        lows.append(float(fitted_times[0]))
        highs.append(float(fitted_times[1]))
        axes.plot(fitted_times, weibull_y(span), color=SYSTEM_COLOUR, linewidth=2.0,
                  label=f"{fit.method.replace('-', ' ')}: beta {fit.beta:.2f}, "
                        f"eta {fit.eta_h:,.0f} h" + ("" if study.is_fit else " (slope assumed)"))
    regression = study.rank_regression
    if regression is not None:
        axes.plot(regression.eta_h * (-np.log1p(-span)) ** (1.0 / regression.beta),
                  weibull_y(span), color="#555555", linewidth=1.4, linestyle="--",
                  label=f"median-rank regression: beta {regression.beta:.2f}, "
                        f"eta {regression.eta_h:,.0f} h")
    found = study.prediction
    if found is not None:
        lows.append(float(found.wheel_end.b1_h) * 0.5)
        highs.append(float(found.wheel_end.b50_h) * 4)
        time = np.geomspace(min(lows), max(highs), CURVE_POINTS)
        probability = np.clip(found.wheel_end.failure_probability(time), 1e-12, 0.999999)
        shown = probability > low_p / 10
        axes.plot(time[shown], weibull_y(probability[shown]), color=TARGET_COLOUR,
                  linewidth=1.6, linestyle="-.",
                  label=f"predicted {prediction_name(found.wheel_end.name)} "
                        f"({found.basis.symbol}, {found.model.kind}): "
                        f"B10 {found.wheel_end.b10_h:,.0f} h")
    if not study.is_fit:
        bound_times = fit.eta_low_h * (-np.log1p(-span)) ** (1.0 / fit.beta)
        lows.append(float(bound_times[0]))
        highs.append(float(bound_times[1]))
        axes.plot(bound_times, weibull_y(span), color=SYSTEM_COLOUR, linestyle=":",
                  linewidth=1.8, label=f"Weibayes {100 * fit.confidence:g} % lower bound, slope "
                                       f"{fit.beta:g}: B10 >= {fit.b10_low_h:,.0f} h")
    suspended = shown_suspensions(data.hours[~data.failed])
    if len(suspended):
        axes.plot(suspended, np.full(len(suspended), float(weibull_y(low_p))), linestyle="none",
                  marker="|", markersize=12, color="#555555", clip_on=False,
                  label=f"suspended units ({data.suspensions:,}), at their hours")
    axes.axhline(float(weibull_y(0.1)), color="#777777", linewidth=0.8)
    draw_probability_paper(axes, low_p, high_p)
    axes.set_xlim(min(lows) * 0.7, max(highs) * 1.4)
    axes.set_xlabel("operating hours [h]")
    axes.set_ylabel("failed [%] (Weibull probability scale)")
    ratio = "" if found is None or found.ratio != found.ratio else \
        f"; field B10 / predicted = {found.ratio:.2f}"
    axes.set_title(f"Weibull probability plot of {data.source}{ratio}", loc="left", fontsize=9)
    axes.legend(fontsize=7, loc="upper left")
    add_caution(figure)
    return figure
