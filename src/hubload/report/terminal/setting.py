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
from hubload.report.terminal.tables import render
from hubload.report.usertext import plain
from hubload.studies.setting import BEST_RANGE_TEXT, SettingSweep
from hubload.units import UM


def setting_table(sweep: SettingSweep) -> TableSpec:
    result = sweep.result
    refined = sweep.refined
    best = sweep.best
    marked = [best is not None and best.low_m - 1e-12 <= s <= best.high_m + 1e-12
              for s in sweep.settings_m]
    columns = [Column("setting_um", "setting", [(v, m) for v, m in zip(sweep.settings_m / UM,
                                                                      marked)],
                      "um", lambda pair: f"{pair[0]:g}" + (" *" if pair[1] else "  "))]
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
    which = "assembly" if sweep.study.pair.setting is not None else "axial"
    return TableSpec("setting", f"Lives against the {which} setting (refined method)",
                     tuple(columns),
                     notes=("setting: > 0 end play, < 0 preload; * within the best range; "
                            "zone: the smallest load zone over the cases.",))


def render_setting(sweep: SettingSweep, console: Console) -> None:
    console.print(Text.assemble((plain(sweep.study.title), "bold"),
                                f"  ({plain(sweep.study.source)})"))
    if sweep.study.pair.setting is not None:
        console.print(Text("Each case runs at the operating setting that follows from the "
                           "assembly setting (fits, temperatures; docs/operating-setting.md)."))
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
