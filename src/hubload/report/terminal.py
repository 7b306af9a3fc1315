"""Rich tables for ``hubload check``.

Text from the file (titles, names) and messages quoting it go out as rich Text, never as
markup: a case named "[wet]" must print as written.
"""

from __future__ import annotations

import numpy as np
from rich.console import Console
from rich.table import Table
from rich.text import Text

from hubload.engine import Result, verdict
from hubload.report import shaft_terminal
from hubload.report.cautions import CAUTIONS
from hubload.report.modified_terminal import (modified_bearing_table, modified_summary_cells,
                                              modified_summary_headings, notes, oil_cells,
                                              oil_headings)
from hubload.report.numbers import hours, hours_with_unit, safety, share
from hubload.report.operating import operating_table
from hubload.report.refined_view import life_basis, refined_tables
from hubload.units import KN



def cases_table(result: Result) -> Table:
    cases = result.study.cases
    table = Table(title="Duty spectrum", title_justify="left")
    table.add_column("#", justify="right")
    table.add_column("case")
    table.add_column("time", justify="right")
    table.add_column("n r/min", justify="right")
    table.add_column("pair damage", justify="right")
    for heading in oil_headings(result):
        table.add_column(heading, justify="right")
    for index, name in enumerate(cases.names):
        table.add_row(str(index), Text(name), share(cases.time_fraction[index]),
                      f"{cases.speed_rpm[index]:.1f}", share(result.system_damage_share[index]),
                      *oil_cells(result, index))
    return table


def bearing_table(result: Result, label: str) -> Table:
    bearing = result.bearings[label]
    name = result.study.pair.bearings()[label].label
    title = f"{label.capitalize()} bearing" + (f" ({name})" if name != label else "")
    table = Table(title=Text(f"{title}: loads and {life_basis(result)} per case"),
                  title_justify="left")
    table.add_column("#", justify="right")
    for heading in ("Fr kN", "Fa kN", "P kN", "P0 kN", "L10 h", "damage"):
        table.add_column(heading, justify="right")
    for index in range(len(result.study.cases)):
        table.add_row(str(index), f"{bearing.radial_n[index] / KN:.2f}",
                      f"{bearing.axial_n[index] / KN:.2f}", f"{bearing.equivalent_n[index] / KN:.2f}",
                      f"{bearing.static_equivalent_n[index] / KN:.2f}",
                      hours(bearing.case_life_h[index]), share(bearing.damage_share[index]))
    return table


def summary_table(result: Result) -> Table:
    pair = result.study.pair.bearings()
    table = Table(title="Spectrum lives (Palmgren-Miner)", title_justify="left")
    for heading, justify in (("bearing", "left"), ("name", "left"), ("L10 h", "right"),
                             ("L10 km", "right"), ("s0", "right")):
        table.add_column(heading, justify=justify)
    for heading in modified_summary_headings(result):
        table.add_column(heading, justify="right")
    for label, bearing in result.bearings.items():
        name = pair[label].label if pair[label].label != label else ""
        table.add_row(label, Text(name), hours(bearing.life_h), hours(bearing.life_km),
                      safety(bearing.static_safety), *modified_summary_cells(result, label))
    table.add_row("pair (system)", "", hours(result.system_life_h),
                  hours(result.system_life_km), "", *modified_summary_cells(result, None),
                  style="bold")
    return table


def verdict_line(result: Result) -> str | Text:
    found = verdict(result)
    if found is None:
        return Text("No target life given ([project] target_life_h): no verdict.")
    basis = f" ({found.basis})" if found.basis else ""
    if found.passed:
        return (f"[green]PASS[/]: system {found.life_name} = {hours_with_unit(found.life_h)} "
                f">= target {hours_with_unit(found.target_h)}{basis}")
    return (f"[red]FAIL[/]: system {found.life_name} = {hours_with_unit(found.life_h)} "
            f"< target {hours_with_unit(found.target_h)}{basis}")


def dominant_line(result: Result) -> Text:
    if not np.any(result.system_damage_share > 0):
        return Text("No case adds fatigue damage.")
    index = result.dominant_case
    return Text(f"Dominant case: '{result.study.cases.names[index]}' "
                f"({share(result.system_damage_share[index])} of the pair's damage).")


def render(result: Result, console: Console) -> None:
    """Print the full check report."""
    console.print(Text.assemble((result.study.title, "bold"), f"  ({result.study.source})"))
    console.print(cases_table(result))
    if (operating := operating_table(result.study)) is not None:
        console.print(operating)
    for label in result.bearings:
        console.print(bearing_table(result, label))
        if result.modified is not None:
            console.print(modified_bearing_table(result, label))
    for table in refined_tables(result):
        console.print(table)
    console.print(summary_table(result))
    for line in notes(result):
        console.print(Text(f"Note: {line}"))
    console.print(dominant_line(result))
    shaft_terminal.render_shaft(result, console)
    console.print(verdict_line(result))
    shaft_terminal.render_overall(result, console)
    for warning in result.warnings:
        console.print(Text.assemble(("Warning:", "yellow"), f" {warning}"))
    console.print(f"[dim]Caution: {CAUTIONS}[/]")
