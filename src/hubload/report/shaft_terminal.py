"""Rich tables of the shaft check and the overall verdict for ``hubload check``."""

from __future__ import annotations

import math

import numpy as np
from rich.console import Console
from rich.table import Table
from rich.text import Text

from hubload.engine import Result
from hubload.engine.overall import CheckItem, overall_verdict
from hubload.report.numbers import hours, hours_with_unit, safety
from hubload.units import KN, MM, MPA



def factor(value, required: float | None = None) -> str:
    """A safety factor, red when below ``required``; 'infinite' when unloaded, '-' when NaN."""
    text = safety(value)
    return f"[red]{text}[/]" if required is not None and float(value) < required else text


CRITERION_NAMES = {"goodman": "DE-Goodman", "asme-elliptic": "DE-ASME elliptic"}


def case_index(value, index) -> str:
    return str(int(index)) if np.isfinite(value) else ""


def sections_table(result: Result) -> Table:
    shaft = result.shaft
    table = Table(title=f"Shaft sections: {CRITERION_NAMES[shaft.criterion]} fatigue safety n "
                        f"(lowest, in case #), first-cycle yield safety, S-N life; required "
                        f"n >= {shaft.required_safety:g}", title_justify="left")
    table.add_column("section")
    for heading in ("x mm", "d mm", "Kf", "Kfs", "Se MPa", "n", "#", "n yield"):
        table.add_column(heading, justify="right")
    table.add_column("life h", justify="right", no_wrap=True, min_width=8)
    for given, section in zip(result.study.shaft.sections, shaft.sections):
        table.add_row(
            Text(section.name), f"{float(given.position_m) / MM:g}",
            f"{float(given.diameter_m) / MM:g}", f"{float(section.kf_bending):.2f}",
            f"{float(section.kf_torsion):.2f}", f"{float(section.endurance_pa) / MPA:.0f}",
            factor(section.min_safety, shaft.required_safety),
            case_index(section.min_safety, section.min_safety_case),
            factor(section.yield_safety, shaft.required_safety),
            hours(section.fatigue_life_h))
    return table


def utilisation(value) -> str:
    value = float(value)
    if math.isnan(value):
        return "-"
    text = f"{100 * value:.0f} %"
    return f"[red]{text}[/]" if value > 1.0 else text


def cases_table(result: Result) -> Table:
    """Per case: fatigue safety of each section and the utilisation of the supplier's curve."""
    shaft, cases = result.shaft, result.study.cases
    permissible = shaft.permissible
    title = "Shaft per case: fatigue safety ('-': standstill)"
    if permissible is not None and bool(permissible.inside):
        title += (f"; supplier's permissible radial load {float(permissible.permissible_n) / KN:.1f}"
                  f" kN at {float(permissible.position_m) / MM:g} mm")
    table = Table(title=title, title_justify="left")
    table.add_column("#", justify="right")
    for section in shaft.sections:
        table.add_column(Text(section.name), justify="right")
    if permissible is not None:
        table.add_column("radial kN", justify="right")
        table.add_column("utilisation", justify="right")
    for index in range(len(cases)):
        row = [str(index)] + [factor(section.safety[index], shaft.required_safety)
                              for section in shaft.sections]
        if permissible is not None:
            row += [f"{permissible.radial_wheel_force_n[index] / KN:.2f}",
                    utilisation(permissible.utilisation[index])]
        table.add_row(*row)
    return table


def infinite_life_lines(result: Result) -> list[str]:
    if not np.any(result.study.cases.speed_rpm > 0):
        return []
    lines = []
    for section in result.shaft.sections:
        if np.isinf(section.fatigue_life_h):
            lines.append(f"Section '{section.name}': every case stays below the "
                         f"endurance limit (Se = {float(section.endurance_pa) / MPA:.0f} MPa, "
                         f"Goodman): infinite fatigue life.")
    return lines


def render_shaft(result: Result, console: Console) -> None:
    """The shaft tables, when the study has a [shaft] table."""
    if result.shaft is None:
        return
    console.print(sections_table(result))
    console.print(cases_table(result))
    for line in infinite_life_lines(result):
        console.print(Text(line))


def item_value(item: CheckItem) -> str:
    if item.value is None:
        return "not assessed"
    if item.at_most:
        return utilisation(item.value)
    return hours_with_unit(item.value) if item.unit == "h" else factor(item.value)


def item_limit(item: CheckItem) -> str:
    if item.at_most:
        return f"<= {100 * item.limit:.0f} %"
    return f">= {hours_with_unit(item.limit)}" if item.unit == "h" else f">= {item.limit:g}"


def render_overall(result: Result, console: Console) -> None:
    """Every check with its limit and one overall verdict (only with a [shaft] table: without
    it the bearing verdict above is the only item)."""
    found = overall_verdict(result)
    if found is None or result.shaft is None:
        return
    table = Table(title="Checks", title_justify="left")
    for heading, justify in (("item", "left"), ("value", "right"), ("limit", "right"),
                             ("result", "left")):
        table.add_column(heading, justify=justify)
    for item in found.items:
        table.add_row(Text(item.name), item_value(item), item_limit(item),
                      "[green]pass[/]" if item.passed else "[red]FAIL[/]")
    console.print(table)
    worst = found.worst
    verdict = ("PASS", "green") if found.passed else ("FAIL", "red")
    console.print(Text.assemble("Overall verdict (bearings and shaft): ", verdict,
                                f"; worst item: {worst.name} = ",
                                Text.from_markup(item_value(worst)),
                                f" (limit {item_limit(worst)})."))
