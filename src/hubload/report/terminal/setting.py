"""``hubload setting`` on the terminal: the lives against the axial setting."""

from __future__ import annotations

import numpy as np
from rich.console import Console
from rich.text import Text

from hubload.report.cautions import CAUTIONS
from hubload.report.columns import Column, TableSpec
from hubload.report.messages import setting_warnings
from hubload.report.numbers import fixed, hours, hours_with_unit
from hubload.report.specs.check import SHORT
from hubload.report.terminal.tables import plain, render
from hubload.studies.setting import BEST_RANGE_TEXT, SettingSweep
from hubload.units import UM


def setting_table(sweep: SettingSweep) -> TableSpec:
    result = sweep.result
    refined = sweep.refined
    columns = [Column("setting_um", "setting", list(sweep.settings_m / UM), "um",
                      lambda v: f"{v:g}")]
    for label, bearing in result.bearings.items():
        found = result.refined.bearings[label]
        columns += [Column(f"{label}.life_h", f"{refined.symbol} {SHORT[label]}",
                           list(refined.bearing_life_h[label]), "h", hours),
                    Column(f"{label}.zone_deg", f"zone {SHORT[label]}",
                           list(np.degrees(found.load_zone_rad.min(axis=-1))), "deg",
                           fixed(0))]
    columns.append(Column("system_h", f"{refined.symbol} pair", list(sweep.refined_life_h), "h",
                          hours))
    governing = result.governing
    if len(governing.candidates) > 1:
        columns.append(Column("governing_h", "governing", list(governing.life_h), "h", hours,
                              legend=f"the verdict's life ({governing.rule} of "
                                     f"{governing.candidates[0].symbol} and "
                                     f"{refined.symbol})"))
    best = sweep.best
    if best is not None:
        inside = [best.low_m - 1e-12 <= s <= best.high_m + 1e-12 for s in sweep.settings_m]
        columns.append(Column("best", "best", ["*" if flag else "" for flag in inside]))
    return TableSpec("setting", f"{sweep.study.title}: lives against the axial setting "
                                f"(refined method; > 0 end play, < 0 preload)", tuple(columns),
                     notes=("zone: the smallest load zone over the cases.",))


def render_setting(sweep: SettingSweep, console: Console) -> None:
    render(setting_table(sweep), console)
    best = sweep.best
    if best is None:
        console.print("No setting gives a positive life.")
    else:
        console.print(Text(f"Best setting found: {best.setting_m / UM:g} um (system "
                           f"{sweep.life_name} {hours_with_unit(best.life_h)}); "
                           f"{BEST_RANGE_TEXT} from {best.low_m / UM:g} to "
                           f"{best.high_m / UM:g} um (marked *)."))
    for warning in setting_warnings(sweep.settings_m[sweep.unsolved] / UM):
        console.print(Text.assemble(("Warning:", "yellow"), f" {plain(warning)}"))
    console.print(Text(f"Caution: {CAUTIONS}", style="dim"))
