"""Sweep charts: lives and safeties against one key, or a life map over two keys."""

from __future__ import annotations

import math

import numpy as np
from matplotlib.colors import LogNorm
from matplotlib.figure import Figure

from hubload.report.plots import (BEARING_COLOURS, SYSTEM_COLOUR, TARGET_COLOUR, add_caution,
                                  drawable, new_figure, styled)
from hubload.report.keywords import key_words
from hubload.report.numbers import hours
from hubload.report.quantities import all_quantities
from hubload.studies.sweep import Sweep

SAFETY_GUIDE = 2.0  # s0 >= 2: common practice for roller bearings with shock loads


def line_style(series, bearing_index: dict[str, int]) -> dict:
    style = {"linestyle": "--" if series.modified else "-"}
    if series.system:
        return {**style, "color": SYSTEM_COLOUR, "linewidth": 2.4}
    label = series.label.split()[0]
    colour = BEARING_COLOURS[bearing_index.setdefault(label, len(bearing_index))
                             % len(BEARING_COLOURS)]
    return {**style, "color": colour, "linewidth": 1.4}


@styled
def sweep_line_figure(sweep: Sweep) -> Figure:
    """Lives (log scale) and safeties against the one varied key, target and crossings drawn."""
    axis = sweep.axes[0]
    series = all_quantities(sweep.first)
    safety = [s for s in series if s.kind == "safety"]
    figure = new_figure(8.0, 7.0 if safety else 5.0)
    axes = figure.subplots(2 if safety else 1, 1, sharex=True, squeeze=False,
                           height_ratios=[2, 1] if safety else [1])[:, 0]
    lives_axes = axes[0]
    x = axis.values
    colours: dict[str, int] = {}
    lives = [(item, drawable(sweep.column(item.of), log_scale=True))
             for item in series if item.kind == "life"]
    lives = [(item, values) for item, values in lives if not np.all(np.isnan(values))]
    for item, values in lives:
        lives_axes.plot(x, values, label=item.label + " h", **line_style(item, colours))
    if not lives:
        lives_axes.text(0.5, 0.5, "every life infinite (or zero) over the sweep",
                        transform=lives_axes.transAxes, ha="center", va="center")
    targets = sweep.targets_h
    if targets is not None:
        lives_axes.plot(x, targets, color=TARGET_COLOUR, linestyle=":", linewidth=2,
                        label=f"target ({sweep.first.governing.symbol})")
        mark_crossings(lives_axes, sweep, targets)
    mark_file_value(axes, sweep)
    lives_axes.set_yscale("log")
    lives_axes.set_ylabel("life [h]")
    lives_axes.set_title(f"{sweep.title}\nlives against {axis_words(sweep, axis, short=True)}",
                         loc="left")
    lives_axes.legend(fontsize=7, loc="best")
    if safety:
        plot_safeties(axes[1], x, sweep, safety, colours)
    axes[-1].set_xlabel(axis_words(sweep, axis))
    add_caution(figure)
    return figure


def mark_crossings(axes, sweep: Sweep, targets: np.ndarray) -> None:
    x = sweep.axes[0].values
    for _, crossings in sweep.crossings():
        for crossing in crossings:
            level = float(np.interp(crossing.value, x, targets))
            axes.plot([crossing.value], [level], marker="o", color=TARGET_COLOUR, zorder=5)
            word = "falls below" if crossing.falls_below else "reaches"
            axes.annotate(f"{word} target\nat {crossing.value:.4g}", (crossing.value, level),
                          textcoords="offset points", xytext=(6, 8), fontsize=7,
                          color=TARGET_COLOUR)


def mark_file_value(axes, sweep: Sweep) -> None:
    value = sweep.file_values.get(sweep.axes[0].key)
    if value is None:
        return
    for each in axes:
        each.axvline(value, color="#777777", linestyle="-.", linewidth=1)
    axes[0].annotate("file", (value, 1), xycoords=("data", "axes fraction"), fontsize=7,
                     color="#555555", xytext=(3, -10), textcoords="offset points")


def plot_safeties(axes, x, sweep: Sweep, safety, colours) -> None:
    for item in safety:
        values = drawable(sweep.column(item.of))
        style = {"color": SYSTEM_COLOUR, "linewidth": 2} if item.label.startswith("shaft") \
            else line_style(item, colours)
        axes.plot(x, values, label=item.label, **{**style, "linestyle": "-"})
    shaft = sweep.first.shaft
    if shaft is not None:
        required = float(shaft.required_safety)
        axes.axhline(required, color=SYSTEM_COLOUR, linewidth=1, linestyle=":",
                     label=f"shaft required safety {required:g}")
    axes.axhline(1.0, color=TARGET_COLOUR, linewidth=1.2, label="1 (limit)")
    axes.axhline(SAFETY_GUIDE, color=TARGET_COLOUR, linewidth=1, linestyle=":",
                 label=f"s0 = {SAFETY_GUIDE:g} (common practice)")
    for _, crossings in sweep.shaft_crossings():
        for crossing in crossings:
            axes.plot([crossing.value], [required], marker="o", color=SYSTEM_COLOUR, zorder=5)
            word = "falls below" if crossing.falls_below else "reaches"
            axes.annotate(f"shaft {word}\nrequired at {crossing.value:.4g}",
                          (crossing.value, required), textcoords="offset points",
                          xytext=(6, 8), fontsize=7)
    axes.set_ylabel("safety factor [-]")
    axes.set_ylim(bottom=0)
    axes.legend(fontsize=7, loc="best")


@styled
def sweep_contour_figure(sweep: Sweep) -> Figure:
    """Map of the governing system life over two keys, with the target contour."""
    rows, columns = sweep.axes[0], sweep.axes[1]
    lives = sweep.governing_life_h.reshape(sweep.shape)
    drawn = lives[np.isfinite(lives) & (lives > 0)]  # a log scale: zero lives below the lowest
    figure = new_figure(8.0, 6.0)
    axes = figure.subplots()
    name = sweep.first.governing.symbol
    if drawn.size:
        low, high = drawn.min(), drawn.max()
        shown = np.clip(np.where(np.isfinite(lives), lives, high), low, high)
        if high > low:
            levels = nice_levels(low, high)
            filled = axes.contourf(columns.values, rows.values, shown, levels=levels,
                                   norm=LogNorm(levels[0], levels[-1]), cmap="viridis")
            figure.colorbar(filled, ax=axes, label=f"system {name} [h]", ticks=levels,
                            format=hours_label)
            lines = axes.contour(columns.values, rows.values, shown, levels=levels,
                                 colors="white", linewidths=0.5, alpha=0.6)
            axes.clabel(lines, fontsize=7, colors="black", fmt=lambda v: hours_label(v) + " h")
        draw_target_contour(axes, sweep, shown)
    if not drawn.size or drawn.min() == drawn.max():  # nothing to shade: say so
        same = f"{hours(drawn.min())} h wherever finite" if drawn.size else "infinite"
        axes.text(0.5, 0.5, f"system {name}: {same} over the whole grid",
                  transform=axes.transAxes, ha="center", va="center")
    axes.update_datalim([(columns.values.min(), rows.values.min()),
                         (columns.values.max(), rows.values.max())])  # the grid, drawn or not
    axes.autoscale_view()
    axes.grid(False)
    mark_file_point(axes, sweep)
    axes.set_xlabel(axis_words(sweep, columns))
    axes.set_ylabel(axis_words(sweep, rows))
    axes.set_title(f"{sweep.title}\nsystem {name} over {axis_words(sweep, rows, short=True)} "
                   f"and {axis_words(sweep, columns, short=True)}", loc="left")
    add_caution(figure)
    return figure


MIN_LEVELS = 6     # a map with fewer colour levels cannot be read off


def nice_levels(low: float, high: float) -> list[float]:
    """Round steps per decade (1-2-5, or finer where the range spans little) that enclose
    [low, high] with at least MIN_LEVELS levels (for log-scaled life maps)."""
    for mantissas in ((1, 2, 5), (1, 1.5, 2, 3, 5, 7), (1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 7, 8, 9)):
        steps = [m * 10.0 ** k for k in range(math.floor(math.log10(low)) - 1,
                                              math.ceil(math.log10(high)) + 1)
                 for m in mantissas]
        below = max(v for v in steps if v <= low)
        above = min(v for v in steps if v >= high)
        levels = [v for v in steps if below <= v <= above]
        if len(levels) >= MIN_LEVELS:
            break
    return levels


def axis_words(sweep: Sweep, axis, short: bool = False) -> str:
    """What an axis moves, in words with units (the file format's descriptions)."""
    study = sweep.first.study
    sections = [s.name for s in study.shaft.sections] if study.shaft is not None else []
    words = [key_words(path, study.cases.names, sections) for path, _ in axis.moving()]
    if short:
        words = [w.split(" [")[0] for w in words]
    return " & ".join(words)


def hours_label(value: float, _position=None) -> str:
    """Tick and contour labels of the life map (a matplotlib formatter)."""
    return hours(value)


def draw_target_contour(axes, sweep: Sweep, lives: np.ndarray) -> None:
    targets = sweep.targets_h
    if targets is None:
        return
    ratio = lives / targets.reshape(sweep.shape)
    if np.nanmin(ratio) < 1 < np.nanmax(ratio):
        contour = axes.contour(sweep.axes[1].values, sweep.axes[0].values, np.log(ratio),
                               levels=[0.0], colors=TARGET_COLOUR, linewidths=2.2)
        axes.clabel(contour, fmt={0.0: f"target {sweep.first.governing.symbol}"}, fontsize=8)


def mark_file_point(axes, sweep: Sweep) -> None:
    row, column = (sweep.file_values.get(a.key) for a in sweep.axes[:2])
    if row is not None and column is not None:
        axes.plot([column], [row], marker="X", markersize=9, color="white",
                  markeredgecolor="black", label="file")
        axes.legend(fontsize=7, loc="best")
