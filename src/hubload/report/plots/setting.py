"""Chart of the pair's lives against its axial setting (refined method)."""

from __future__ import annotations

import numpy as np
from matplotlib.figure import Figure

from hubload.report.plots import (BEARING_COLOURS, SYSTEM_COLOUR, TARGET_COLOUR, add_caution,
                                  drawable, new_figure, styled)
from hubload.studies.setting import BEST_RANGE_TEXT, SettingSweep
from hubload.units import UM



def mark_assembly(axes, sweep: SettingSweep) -> None:
    """The file's assembly band (hatched, readable in grey) and, by an arrow, where the
    dominant case's operating setting lies from it (fits and temperatures)."""
    given = sweep.study.pair.setting
    if given is None:   # the file's own (operating) setting
        value = float(np.asarray(sweep.study.pair.axial_setting_m).flat[0]) / UM
        axes.axvline(value, color="#555555", linewidth=1.0, linestyle="-.",
                     label=f"file: {value:g} um")
        return
    assembly, tolerance = float(given.assembly_m) / UM, float(given.tolerance_m) / UM
    axes.axvspan(assembly - tolerance, assembly + tolerance, facecolor="none",
                 edgecolor="#555555", hatch="///", linewidth=0.0,
                 label=f"assembly band {assembly:g} +/- {tolerance:g} um")
    axes.axvline(assembly, color="#555555", linewidth=1.0, linestyle="-.")
    nearest = int(np.argmin(np.abs(sweep.settings_m / UM - assembly)))
    shares = np.asarray(sweep.result.governing.system_damage_share)[nearest]
    if not np.any(shares > 0):
        return
    dominant = int(np.argmax(shares))
    operating = np.asarray(sweep.result.setting.operating_m)
    shift = float(operating[nearest, dominant] - sweep.settings_m[nearest]) / UM
    low, high = axes.get_ylim()
    level = low * (high / low) ** 0.1   # near the foot, clear of the curves and the target
    axes.annotate("", xy=(assembly + shift, level), xytext=(assembly, level),
                  arrowprops={"arrowstyle": "->", "color": "#111111", "linewidth": 1.4})
    axes.annotate(f"in operation ({shift:+.0f} um,\n'{sweep.study.cases.names[dominant]}')",
                  (assembly + shift, level), textcoords="offset points", xytext=(4, 6),
                  fontsize=7)


@styled
def setting_figure(sweep: SettingSweep) -> Figure:
    """Each bearing's and the system's life (log scale) against the setting, best range shaded."""
    figure = new_figure(8.0, 5.0)
    axes = figure.subplots()
    x = sweep.settings_m / UM
    refined = sweep.refined
    for label, colour in zip(sweep.result.bearings, BEARING_COLOURS):
        axes.plot(x, drawable(refined.bearing_life_h[label], log_scale=True), color=colour,
                  linewidth=1.4, label=f"{label} {refined.symbol}")
    axes.plot(x, drawable(sweep.refined_life_h, log_scale=True), color=SYSTEM_COLOUR,
              linewidth=2.4, label=f"pair {refined.symbol}")
    iso = sweep.result.governing.candidates[0]
    axes.axhline(float(np.asarray(iso.system_life_h).flat[0]), color=SYSTEM_COLOUR,
                 linewidth=1.2, linestyle="--",
                 label=f"pair {iso.symbol}, ISO 281 rule (line-to-line)")
    if sweep.best is not None:
        axes.axvspan(sweep.best.low_m / UM, sweep.best.high_m / UM, color="#2ca02c", alpha=0.12,
                     label=BEST_RANGE_TEXT)
    if sweep.study.target_life_h is not None:
        axes.axhline(sweep.study.target_life_h, color=TARGET_COLOUR, linewidth=1.0,
                     linestyle=":", label="target")
    axes.axvline(0.0, color="#777777", linewidth=0.8)
    axes.set_yscale("log")
    mark_assembly(axes, sweep)
    which = "assembly setting" if sweep.study.pair.setting is not None else "axial setting"
    axes.set_xlabel(f"{which} [um]   (< 0 preload, > 0 end play)")
    axes.set_ylabel("life [h]")
    axes.set_title(f"{sweep.study.title}\nlives against the bearing setting (refined method)",
                   loc="left")
    axes.legend(fontsize=7, loc="best")
    add_caution(figure)
    return figure
