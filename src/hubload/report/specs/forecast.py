"""The tables of ``hubload forecast``: B-lives of the units, the fleet's failures per year."""

from __future__ import annotations

from hubload.report.columns import Column, TableSpec
from hubload.report.numbers import fixed, hours
from hubload.studies.forecast import Forecast


def reliability_text(value) -> str:
    return "-" if value is None else f"{100 * float(value):.2f}"


def units_table(forecast: Forecast) -> TableSpec:
    items = forecast.items
    columns = [Column("name", "unit", [item.name for item in items], name=True),
               Column("b1_h", "B1", [item.b1_h for item in items], "h", hours,
                      legend="1 % failed"),
               Column("b10_h", "B10", [item.b10_h for item in items], "h", hours,
                      legend="10 % failed"),
               Column("b50_h", "B50", [item.b50_h for item in items], "h", hours,
                      legend="half failed")]
    if forecast.target_life_h is not None:
        columns.append(Column("reliability_at_target", "R(target)",
                              [item.reliability_at_target for item in items], "%",
                              reliability_text,
                              legend=f"reliability at the target life "
                                     f"{forecast.target_life_h:,.0f} h"))
    return TableSpec("units", "Life distributions (operating hours)", tuple(columns))


def per_year_table(forecast: Forecast) -> TableSpec:
    outcome = forecast.outcome
    count = fixed(1)
    return TableSpec("per_year", "Expected bearing failures of the fleet", (
        Column("year", "year", [int(y) for y in outcome.year], "", str),
        Column("expected_failures", "failures", list(outcome.failures_per_year), "", count,
               legend="in the year, failed bearings replaced"),
        Column("cumulative", "cumulative", list(outcome.failures_cumulative), "", count),
        Column("first_failures_cumulative", "first failures",
               list(outcome.first_failures_cumulative), "", count,
               legend="cumulative, of the bearings fitted new"),
    ))
