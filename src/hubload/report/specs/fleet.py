"""The fleet table of ``hubload spectrum FOLDER``: one row per log, harshest first."""

from __future__ import annotations

from pathlib import Path

import numpy as np

from hubload.logs.analysis import LogRun, Ranked
from hubload.report.columns import Column, TableSpec
from hubload.report.numbers import fixed, hours, safety

FLAG_SHORT = {"slips": "slip", "tyre_slides": "slide", "pressure_above_rating": "p>max",
              "speed_above_rating": "n>max", "kappa_outside_scope": "kappa<0.1"}


def lowest_s0(row: Ranked) -> float:
    return min(row.result.static_safety.values())


def lowest_shaft(row: Ranked) -> float:
    extremes = row.result.summary.shaft
    return float(np.min(extremes["min_safety"])) if extremes is not None else float("nan")


def dominant_class(row: Ranked) -> str:
    classed = row.result.classed
    index = classed.dominant_case
    return "-" if index is None else classed.study.cases.names[index]


def flags(row: Ranked) -> str:
    """The flags raised in the log, with their share of its time."""
    summary = row.result.summary
    total = summary.total("time_s")
    return ", ".join(f"{FLAG_SHORT[flag]} {100 * seconds / total:.2g} %"
                     for flag, seconds in summary.flag_time_s.items()
                     if seconds > 0 and total > 0) or "-"


def fleet_table(run: LogRun) -> TableSpec:
    ranking = run.ranking()
    symbol = ranking[0].result.direct_governing.symbol
    columns = [
        Column("log", "log", [Path(r.result.summary.name).name for r in ranking], name=True),
        Column("duration_h", "logged", [r.result.summary.duration_h for r in ranking], "h",
               fixed(1)),
        Column("governing_life_h", f"system {symbol}", [r.result.governing_life_h
                                                        for r in ranking], "h", hours),
        Column("relative_to_fleet", "vs fleet", [r.relative_to_fleet for r in ranking], "x",
               lambda v: "-" if v is None else f"{v:.2f}",
               legend="the log's damage per hour over the fleet's"),
        Column("s0", "s0", [lowest_s0(r) for r in ranking], "", safety,
               legend="the lower static safety of the pair at the log's peak load")]
    if any(r.result.summary.shaft is not None for r in ranking):
        columns.append(Column("shaft_min_safety", "shaft n", [lowest_shaft(r) for r in ranking],
                              "", safety, legend="the shaft's lowest fatigue safety"))
    columns += [Column("dominant_class", "dominant class", [dominant_class(r) for r in ranking],
                       name=True),
                Column("flags", "flags", [flags(r) for r in ranking], name=True)]
    how = "by their logged hours" if run.mix is None else "by the fleet mix"
    return TableSpec("fleet", f"Logs from harshest to mildest (pair damage per hour, {symbol})",
                     tuple(columns), notes=(f"The fleet combines the logs {how}.",))
