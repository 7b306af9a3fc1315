"""Chart of the pair's lives against its axial setting (refined method)."""

from __future__ import annotations

import numpy as np
from matplotlib.figure import Figure

from hubload.report.plots import (BEARING_COLOURS, SYSTEM_COLOUR, TARGET_COLOUR, add_caution,
                                  drawable, new_figure, styled)
from hubload.studies.setting import BEST_RANGE_TEXT, SettingSweep
from hubload.units import UM



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
    axes.set_xlabel("axial setting [um]   (< 0 preload, > 0 end play)")
    axes.set_ylabel("life [h]")
    axes.set_title(f"{sweep.study.title}\nlives against the bearing setting (refined method)",
                   loc="left")
    axes.legend(fontsize=7, loc="best")
    add_caution(figure)
    return figure
