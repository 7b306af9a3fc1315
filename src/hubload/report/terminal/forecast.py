"""``hubload forecast`` on the terminal: B-lives of the units, the fleet's failures."""

from __future__ import annotations

from rich.console import Console
from rich.text import Text

from hubload.report.cautions import CAUTIONS
from hubload.report.numbers import hours_with_unit
from hubload.report.reliability_notes import forecast_notes
from hubload.report.specs.forecast import per_year_table, units_table
from hubload.report.terminal.tables import render
from hubload.report.usertext import plain
from hubload.studies.forecast import Forecast


def warranty_lines(forecast: Forecast) -> list[str]:
    fleet, outcome = forecast.fleet, forecast.outcome
    bearings, wheel_ends = forecast.bearings_per_machine, forecast.wheel_ends_per_machine
    return [
        f"Fleet: {fleet.machines:,} machines x {bearings} bearings "
        f"({wheel_ends} wheel end{'s' if wheel_ends > 1 else ''}), "
        f"{fleet.years} years.",
        f"In the warranty: {outcome.warranty_first_failures:,.1f} bearing failures expected "
        f"(90 % band {outcome.warranty_first_failures_low:,} to "
        f"{outcome.warranty_first_failures_high:,}; "
        f"{outcome.warranty_unit_failure_percent:.3g} % of the bearings).",
        f"Machines with at least one claim: {outcome.machines_with_claim:,.1f} "
        f"({outcome.machines_with_claim_percent:.3g} % of the fleet).",
    ]


def render_forecast(forecast: Forecast, console: Console) -> None:
    console.print(Text.assemble((plain(forecast.title), "bold"), f"  ({plain(forecast.source)})"))
    basis, *notes = forecast_notes(forecast)
    console.print(Text(plain(basis)))
    render(units_table(forecast), console)
    if forecast.outcome is None:
        console.print(Text("No [fleet] given (nor --machines ...): no fleet forecast."))
    else:
        render(per_year_table(forecast), console)
        for line in warranty_lines(forecast):
            console.print(Text(line))
    if forecast.target_life_h is not None:
        console.print(Text(f"Target life: {hours_with_unit(forecast.target_life_h)}."))
    for note in notes:
        console.print(Text(f"Note: {plain(note)}", style="dim"))
    console.print(Text(f"Caution: {CAUTIONS}", style="dim"))
