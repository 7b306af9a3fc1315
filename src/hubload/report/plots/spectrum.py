"""Damage-share bars of one file, and the comparison chart of several files."""

from __future__ import annotations

import numpy as np
from matplotlib.figure import Figure

from hubload.report.plots import (BEARING_COLOURS, SYSTEM_COLOUR, TARGET_COLOUR, add_caution,
                                  new_figure, styled)
from hubload.engine import Result
from hubload.report.quantities import ratios_to_first, shared_life_quantities
from hubload.studies.compare import Comparison
from hubload.units import KN

DOMINANT_COLOUR = "#c0392b"
SHARE_COLOUR = "#4c78a8"


def draw_shares(axes, result: Result, with_bearings: bool, largest: float | None = None) -> None:
    """Horizontal bars: each case's share of the pair's damage on the governing basis
    (dominant case in red)."""
    governing = result.governing
    names = list(result.study.cases.names)
    positions = np.arange(len(names))
    system = np.asarray(governing.system_damage_share) * 100
    dominant = governing.dominant_case
    colours = [DOMINANT_COLOUR if i == dominant else SHARE_COLOUR for i in positions]
    height = 0.8 / (3 if with_bearings else 1)
    axes.barh(positions, system, height=height, color=colours, label="pair (system)")
    bearing_shares = {label: np.asarray(governing.bearing_damage_share(label)) * 100
                      for label in result.bearings} if with_bearings else {}
    for k, (label, values) in enumerate(bearing_shares.items()):
        axes.barh(positions + (k + 1) * height, values, height=height, alpha=0.55,
                  color=BEARING_COLOURS[k % len(BEARING_COLOURS)], label=label)
    for y, value in zip(positions, system):
        axes.annotate(f"{value:.1f} %", (value, y), xytext=(3, -3), textcoords="offset points",
                      fontsize=7)
    axes.set_yticks(positions + (height if with_bearings else 0), names)
    axes.invert_yaxis()
    drawn = [*system, *(v for values in bearing_shares.values() for v in values)]
    largest = max(drawn, default=0.0) if largest is None else largest
    axes.set_xlim(0, min(100.0, largest * 1.2 + 5))
    axes.set_xlabel(f"share of fatigue damage ({governing.symbol}) [%]")
    axes.grid(axis="y", visible=False)


def finished(figure: Figure, axes, title: str) -> Figure:
    """Title, a legend beside the bars and the cautions: the end of every per-case chart."""
    axes.set_title(title, loc="left")
    axes.legend(fontsize=7, loc="upper left", bbox_to_anchor=(1.0, 1.0))
    add_caution(figure)
    return figure


@styled
def damage_share_figure(result: Result) -> Figure:
    """Each case's share of the damage, for the pair and each bearing (check results)."""
    figure = new_figure(8.0, 1.6 + 0.45 * len(result.study.cases))
    axes = figure.subplots()
    draw_shares(axes, result, with_bearings=True)
    return finished(figure, axes, f"{result.study.title}\ndamage shares by case")


@styled
def loads_figure(result: Result) -> Figure:
    """Radial and axial load of each bearing per case (grouped bars, check results)."""
    names = list(result.study.cases.names)
    figure = new_figure(8.0, 1.8 + 0.5 * len(names))
    axes = figure.subplots()
    positions = np.arange(len(names))
    height = 0.8 / (2 * len(result.bearings))
    for k, (label, bearing) in enumerate(result.bearings.items()):
        colour = BEARING_COLOURS[k % len(BEARING_COLOURS)]
        for j, (values, name, alpha) in enumerate(((bearing.radial_n, "Fr", 0.95),
                                                   (bearing.axial_n, "Fa", 0.5))):
            axes.barh(positions + (2 * k + j) * height, np.asarray(values) / KN, height=height,
                      color=colour, alpha=alpha, label=f"{label} {name}")
    axes.set_yticks(positions + 0.4 - height / 2, names)
    axes.invert_yaxis()
    axes.set_xlabel("bearing load [kN]")
    axes.grid(axis="y", visible=False)
    return finished(figure, axes, f"{result.study.title}\nbearing loads by case")


@styled
def compare_figure(comparison: Comparison) -> Figure:
    """Lives of each file (grouped bars, log scale, target) over damage-share bars per file."""
    results = comparison.results
    case_rows = [len(r.study.cases) for r in results]
    figure = new_figure(8.5, 3.2 + sum(0.32 * n + 0.5 for n in case_rows))
    grid = figure.add_gridspec(1 + len(results), 1,
                               height_ratios=[max(case_rows) * 0.9, *case_rows])
    draw_lives(figure.add_subplot(grid[0]), comparison)
    largest = max((100 * float(np.max(r.governing.system_damage_share)) for r in results),
                  default=0.0)
    for row, result in enumerate(results, start=1):
        axes = figure.add_subplot(grid[row])
        draw_shares(axes, result, with_bearings=False, largest=largest)
        axes.set_title(f"#{row} {result.study.title}: damage shares of the pair", loc="left",
                       fontsize=9)
    add_caution(figure)
    return figure


def draw_lives(axes, comparison: Comparison) -> None:
    results = comparison.results
    series = shared_life_quantities(results, repeat_governing=False)
    width = 0.8 / max(len(series), 1)
    positions = np.arange(len(results))
    bearing_index: dict[str, int] = {}
    lowest = []
    for k, item in enumerate(series):
        values = np.array([float(item.of(r)) for r in results])
        shown = np.where(np.isfinite(values), values, np.nan)
        lowest += [v for v in shown if np.isfinite(v)]
        colour = SYSTEM_COLOUR if item.system else BEARING_COLOURS[
            bearing_index.setdefault(item.bearing, len(bearing_index)) % len(BEARING_COLOURS)]
        bars = axes.bar(positions + k * width, shown, width=width, label=item.label + " h",
                        color=colour, alpha=0.5 if item.modified else 0.9)
        if item.system:
            axes.bar_label(bars, labels=["" if r is None else f"x{r:.2f}"
                                         for r in ratios_to_first(results, item)], fontsize=7)
    for index, result in enumerate(results):
        target = result.study.target_life_h
        if target is not None:
            axes.hlines(target, index - width / 2, index + 0.8 - width / 2,
                        color=TARGET_COLOUR, linestyle=":", linewidth=2,
                        label="target" if index == 0 else None)
            lowest.append(target)
    axes.set_yscale("log")
    if lowest:
        axes.set_ylim(bottom=min(lowest) / 3)
    axes.set_ylabel("life [h]")
    axes.set_xticks(positions + 0.4 - width / 2, [f"#{i}" for i in range(1, len(results) + 1)])
    axes.set_title("Lives (labels: system life against #1)", loc="left")
    axes.legend(fontsize=7, loc="upper left", bbox_to_anchor=(1.0, 1.0))
