"""Output of ``hubload setting``: a table of lives against the axial setting, and JSON."""

from __future__ import annotations

import json

import numpy as np
from rich.console import Console
from rich.table import Table
from rich.markup import escape

from hubload.report.cautions import CAUTIONS
from hubload.report.numbers import hours, hours_with_unit, json_number
from hubload.studies.setting import BEST_RANGE_SHARE, BEST_RANGE_TEXT, SettingSweep
from hubload.units import MPA, UM



def microns(metres) -> float | None:
    """A setting [m] in um, rounded to 1e-6 um: the m -> um round trip leaves last-digit noise."""
    return json_number(round(float(metres) / UM, 6))


def point_entry(sweep: SettingSweep, index: int) -> dict:
    result = sweep.result
    modified = result.modified
    bearings = {}
    for label, bearing in result.bearings.items():
        found = result.refined.bearings[label]
        bearings[label] = {
            "l10_h": json_number(bearing.life_h[index]),
            "min_load_zone_deg": json_number(np.degrees(np.min(found.load_zone_rad[index]))),
            "max_contact_pressure_MPa": json_number(
                np.max(found.max_contact_pressure_pa[index]) / MPA),
        }
        if modified is not None:
            bearings[label]["l10m_h"] = json_number(modified.bearings[label].life_h[index])
    system = {"l10_h": json_number(result.system_life_h[index])}
    if modified is not None:
        system["l10m_h"] = json_number(modified.system_life_h[index])
    return {"setting_um": microns(sweep.settings_m[index]), "system": system,
            "bearings": bearings, "equilibrium": not bool(sweep.unsolved[index])}


def sweep_document(sweep: SettingSweep) -> dict:
    best = sweep.best
    return {
        "title": sweep.study.title, "source": sweep.study.source, "method": "refined",
        "life": sweep.life_name, "target_life_h": sweep.study.target_life_h,
        "points": [point_entry(sweep, i) for i in range(len(sweep.settings_m))],
        "best": None if best is None else {
            "setting_um": microns(best.setting_m), "life_h": json_number(best.life_h),
            "range_um": [microns(best.low_m), microns(best.high_m)],
            "criterion": f"system {sweep.life_name} within {1 - BEST_RANGE_SHARE:.0%} of the "
                         f"best found"},
        "warnings": warnings(sweep),
        "cautions": CAUTIONS,
    }


def warnings(sweep: SettingSweep) -> list[str]:
    unsolved = sweep.settings_m[sweep.unsolved] / UM
    if unsolved.size == 0:
        return []
    return [f"No equilibrium for some cases at settings {', '.join(f'{v:g}' for v in unsolved)} "
            f"um: their lives count as zero."]


def to_json(sweep: SettingSweep) -> str:
    return json.dumps(sweep_document(sweep), indent=2)


def render(sweep: SettingSweep, console: Console) -> None:
    document = sweep_document(sweep)
    modified = sweep.result.modified is not None
    table = Table(title=f"{escape(sweep.study.title)}: lives against the axial setting (refined method; "
                        f"> 0 end play, < 0 preload)", title_justify="left")
    table.add_column("setting um", justify="right")
    labels = list(sweep.result.bearings)
    for label in labels:
        table.add_column(f"{label} L10 h", justify="right")
        table.add_column(f"{label} zone deg", justify="right")
    table.add_column("system L10 h", justify="right")
    if modified:
        table.add_column(f"system {sweep.life_name} h", justify="right")
    best = sweep.best
    for point in document["points"]:
        cells = [f"{point['setting_um']:g}"]
        for label in labels:
            entry = point["bearings"][label]
            cells += [hours(entry["l10_h"]), f"{entry['min_load_zone_deg']:.0f}"]
        cells.append(hours(point["system"]["l10_h"]))
        if modified:
            cells.append(hours(point["system"]["l10m_h"]))
        inside = best is not None and best.low_m / UM - 1e-9 <= point["setting_um"] \
            <= best.high_m / UM + 1e-9
        table.add_row(*cells, style="bold green" if inside else None)
    console.print(table)
    console.print("zone deg: the smallest load zone over the cases.")
    if best is None:
        console.print("No setting gives a positive life.")
    else:
        console.print(f"Best setting found: {best.setting_m / UM:g} um (system {sweep.life_name} "
                      f"{hours_with_unit(best.life_h)}); {BEST_RANGE_TEXT} from {best.low_m / UM:g} to "
                      f"{best.high_m / UM:g} um (highlighted).")
    for warning in document["warnings"]:
        console.print(f"[yellow]Warning:[/] {escape(warning)}")
    console.print(f"[dim]Caution: {CAUTIONS}[/]")
