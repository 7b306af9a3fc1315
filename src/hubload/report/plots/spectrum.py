"""Damage-share bars of one file, and the comparison chart of several files."""

from __future__ import annotations

import numpy as np
from matplotlib.figure import Figure

from hubload.report.plots import (BEARING_COLOURS, SYSTEM_COLOUR, TARGET_COLOUR, add_caution,
                                  new_figure, styled)
from hubload.engine import Result
from hubload.report.columns import most_damaging
from hubload.report.quantities import ratios_to_first, shared_life_quantities
from hubload.studies.compare import Comparison
from hubload.units import KN

DOMINANT_COLOUR = "#c0392b"
SHARE_COLOUR = "#4c78a8"


CHART_CASES = 15      # cases drawn per chart; the rest share one "other cases" bar
SHARE_PANELS = 4      # files whose damage shares a comparison chart draws
MAX_HEIGHT_IN = 26.0  # 2,860 px at 110 dpi: no chart grows beyond 3,000 px, whatever the files


def shown_cases(result: Result, limit: int = CHART_CASES) -> tuple[list[int], np.ndarray]:
    """The most damaging cases on the governing basis, in file order, and a mask of the rest."""
    shares = np.asarray(result.governing.system_damage_share)
    kept = most_damaging(shares, limit) or list(range(len(shares)))
    rest = np.ones(len(shares), dtype=bool)
    rest[kept] = False
    return kept, rest


def largest_bar(result: Result) -> float:
    """The longest bar [%] of a result's damage-share chart (a case, or the other cases)."""
    kept, rest = shown_cases(result)
    shares = 100 * np.asarray(result.governing.system_damage_share)
    return max(float(np.max(shares[kept], initial=0.0)), float(np.sum(shares[rest])))


def draw_shares(axes, result: Result, with_bearings: bool, largest: float | None = None) -> None:
    """Horizontal bars: each case's share of the pair's damage on the governing basis
    (dominant case dark and hatched, readable in grey), the rest in one bar."""
    governing = result.governing
    kept, rest = shown_cases(result)
    names = [result.study.cases.names[i] for i in kept]
    system = np.asarray(governing.system_damage_share) * 100
    bearing_shares = {label: np.asarray(governing.bearing_damage_share(label)) * 100
                      for label in result.bearings} if with_bearings else {}
    values = {"pair (system)": list(system[kept])}
    values.update({label: list(shares[kept]) for label, shares in bearing_shares.items()})
    if rest.any():
        names.append(f"other {int(rest.sum()):,} cases")
        for label, shares in [("pair (system)", system), *bearing_shares.items()]:
            values[label].append(float(np.sum(shares[rest])))
    positions = np.arange(len(names))
    dominant = governing.dominant_case
    height = 0.8 / (3 if with_bearings else 1)
    bars = axes.barh(positions, values["pair (system)"], height=height, color=SHARE_COLOUR,
                     label="pair (system)")
    if dominant is not None and dominant in kept:
        bars[kept.index(dominant)].set(color=DOMINANT_COLOUR, hatch="//", edgecolor="white")
    for k, label in enumerate(bearing_shares):
        axes.barh(positions + (k + 1) * height, values[label], height=height, alpha=0.55,
                  color=BEARING_COLOURS[k % len(BEARING_COLOURS)], label=label)
    for y, value in zip(positions, values["pair (system)"]):
        axes.annotate(f"{value:.1f} %", (value, y), xytext=(3, -3), textcoords="offset points",
                      fontsize=7)
    axes.set_yticks(positions + (height if with_bearings else 0), names)
    axes.invert_yaxis()
    drawn = [v for series in values.values() for v in series]
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
    figure = new_figure(8.0, min(MAX_HEIGHT_IN, 1.6 + 0.45 * (len(shown_cases(result)[0]) + 1)))
    axes = figure.subplots()
    draw_shares(axes, result, with_bearings=True)
    return finished(figure, axes, f"{result.study.title}\ndamage shares by case")


@styled
def loads_figure(result: Result) -> Figure:
    """Radial and axial load of each bearing per case (grouped bars, check results): the most
    damaging cases of a large spectrum."""
    kept, rest = shown_cases(result)
    names = [result.study.cases.names[i] for i in kept]
    figure = new_figure(8.0, 1.8 + 0.5 * len(names))
    axes = figure.subplots()
    positions = np.arange(len(names))
    height = 0.8 / (2 * len(result.bearings))
    for k, (label, bearing) in enumerate(result.bearings.items()):
        colour = BEARING_COLOURS[k % len(BEARING_COLOURS)]
        for j, (values, name, alpha, hatch) in enumerate(((bearing.radial_n, "Fr", 0.95, ""),
                                                          (bearing.axial_n, "Fa", 0.5, "//"))):
            axes.barh(positions + (2 * k + j) * height, np.asarray(values)[kept] / KN,
                      height=height, color=colour, alpha=alpha, hatch=hatch, edgecolor="white",
                      label=f"{label} {name}")
    if rest.any():
        axes.set_title(f"the {len(kept)} most damaging of {len(rest):,} cases", loc="right",
                       fontsize=7)
    axes.set_yticks(positions + 0.4 - height / 2, names)
    axes.invert_yaxis()
    axes.set_xlabel("bearing load [kN]")
    axes.grid(axis="y", visible=False)
    return finished(figure, axes, f"{result.study.title}\nbearing loads by case")


@styled
def compare_figure(comparison: Comparison) -> Figure:
    """Lives of each file (grouped bars, log scale, target) over damage-share bars per file."""
    results = comparison.results
    panels = results[:SHARE_PANELS]
    case_rows = [len(shown_cases(r)[0]) + 1 for r in panels]
    figure = new_figure(8.5, min(MAX_HEIGHT_IN, 3.2 + sum(0.32 * n + 0.5 for n in case_rows)))
    grid = figure.add_gridspec(1 + len(panels), 1,
                               height_ratios=[max(case_rows) * 0.9, *case_rows])
    lives = figure.add_subplot(grid[0])
    draw_lives(lives, comparison)
    if len(results) > len(panels):
        lives.set_xlabel(f"damage shares below for #1 to #{len(panels)}; all files: the "
                         f"terminal table or --json")
    largest = max(largest_bar(r) for r in panels)
    for row, result in enumerate(panels, start=1):
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
