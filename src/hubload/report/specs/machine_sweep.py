"""The table of ``hubload sweep`` on a machine file: per point the machine's life, each wheel
end's, the weakest wheel end and the verdict. Shared by the terminal and the spreadsheet."""

from __future__ import annotations

from hubload.report.columns import Column, TableSpec
from hubload.report.numbers import hours
from hubload.studies.machine_sweep import MachineSweep

SHORT_NAMES = {"front left": "FL", "front right": "FR", "rear left": "RL", "rear right": "RR"}


def point_table(sweep: MachineSweep) -> TableSpec:
    results = sweep.results
    symbol = results[0].governing.symbol
    moving = [path for axis in sweep.axes for path, _ in axis.moving()]
    columns = [Column(path.text, path.segments[-1][0], [v[path.text] for v in sweep.values],
                      text=lambda v: f"{v:g}") for path in moving]
    columns.append(Column("governing_life.life_h", f"machine {symbol}",
                          [r.governing.life_h for r in results], "h", hours,
                          legend="every bearing of every wheel end in series"))
    for index, wheel in enumerate(results[0].wheel_ends):
        short = SHORT_NAMES[wheel.name]
        columns.append(Column(f"wheel_ends[{index}].life_h", short,
                              [r.wheel_ends[index].governing_life_h for r in results], "h",
                              hours, legend=f"{wheel.name} wheel end's {symbol}"))
    columns.append(Column("weakest", "weakest", [SHORT_NAMES[r.weakest.name] for r in results]))
    if results[0].verdict is not None:
        columns.append(Column("target", "target",
                              ["pass" if r.verdict.passed else "FAIL" for r in results],
                              alert=lambda t: t == "FAIL"))
    keys = " x ".join(axis.text for axis in sweep.axes)
    return TableSpec("points", f"Machine over {keys}", tuple(columns),
                     keep_first=len(moving))
