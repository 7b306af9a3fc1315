"""Sweep output: rich tables (per point, or a life map for two keys) and the JSON document."""

from __future__ import annotations

import json
import math

import numpy as np

from rich import box
from rich.console import Console
from rich.table import Table
from rich.markup import escape

from hubload.report.cautions import CAUTIONS
from hubload.report.numbers import hours, json_number, life_h, safety
from hubload.report.series import all_series, governing_life
from hubload.studies.sweep import Sweep

MAP_MAX_COLUMNS = 7
NO_TARGET = "No target life given ([project] target_life_h): no target crossing."


def sweep_document(sweep: Sweep) -> dict:
    """``points[]`` with ``values`` and the check's per-point objects (bearings, system, ...)."""
    return {
        "title": sweep.title,
        "source": sweep.source,
        "parameters": [{"key": axis.key, "start": json_number(axis.values[0]),
                        "stop": json_number(axis.values[-1]), "count": len(axis.values),
                        "file_value": sweep.file_values.get(axis.key)}
                       for axis in sweep.axes],
        "target_life_h": sweep.target_life_h,
        "governing_life": sweep.governing_life_name,
        "points": [{"values": point.values, **point.document} for point in sweep.points],
        "crossings": crossing_entries(sweep.crossings(), sweep),
        "shaft_crossings": crossing_entries(sweep.shaft_crossings(), sweep),
        "cautions": CAUTIONS,
    }


def crossing_entries(found, sweep: Sweep) -> list[dict]:
    return [{"at": where, "key": sweep.axes[-1].key, "value": c.value,
             "falls_below": c.falls_below, "interpolated": c.interpolated}
            for where, crossings in found for c in crossings]


def to_json(sweep: Sweep) -> str:
    return json.dumps(sweep_document(sweep), indent=2)


def quantity(value: float, kind: str) -> str:
    return hours(value) if kind == "life" else safety(value)


def table_series(sweep: Sweep) -> list:
    """System lives of every kind, bearing lives of the kind the verdict uses, safeties."""
    document = sweep.points[0].document
    modified = governing_life(document).key == "l10m_h"
    return [s for s in all_series(document)
            if s.kind != "life" or s.system or s.modified == modified]


def pass_text(passed: bool) -> str:
    return "[green]pass[/]" if passed else "[red]FAIL[/]"


def point_table(sweep: Sweep, kind: str) -> Table:
    documents = [p.document for p in sweep.points]
    series = [s for s in table_series(sweep) if s.kind == kind]
    unit = " (h)" if kind == "life" else ""
    table = Table(title=("Lives" if kind == "life" else "Safety factors") + unit,
                  title_justify="left", box=box.SIMPLE_HEAD, pad_edge=False,
                  collapse_padding=True)
    for axis in sweep.axes:
        table.add_column(axis.key, justify="right", min_width=min(len(axis.key), 24))
    for item in series:
        table.add_column(item.label.replace(" ", "\n", 1), justify="right")
    with_verdict = kind == "life" and documents[0].get("verdict") is not None
    with_overall = kind == "life" and isinstance(documents[0].get("overall_verdict"), dict)
    if with_verdict:
        table.add_column("target")
    if with_overall:
        table.add_column("overall")
    columns = [item.values(documents) for item in series]
    for row, point in enumerate(sweep.points):
        cells = [f"{point.values[a.key]:g}" for a in sweep.axes]
        cells += [quantity(column[row], item.kind) for item, column in zip(series, columns)]
        if with_verdict:
            cells.append(pass_text(point.document["verdict"]["passed"]))
        if with_overall:
            cells.append(pass_text(point.document["overall_verdict"]["passed"]))
        table.add_row(*cells)
    return table


def compact_hours(value: float) -> str:
    """Hours in at most 5 characters: 908, 7,605, 45.8k, 1.2M."""
    if math.isinf(value):
        return "inf"
    if value < 1e4:
        return f"{value:,.0f}" if value >= 10 else f"{value:.2g}"
    return f"{value / 1e3:.3g}k" if value < 1e6 else f"{value / 1e6:.3g}M"


def life_map(sweep: Sweep) -> Table:
    """Governing system life over two keys: rows = first key, columns = second key."""
    rows, columns = sweep.axes[0], sweep.axes[1]
    count = len(columns.values)
    shown = sorted({round(i) for i in np.linspace(0, count - 1, min(count, MAP_MAX_COLUMNS))})
    table = Table(title=f"System {sweep.governing_life_name} (h); rows: {rows.key}, "
                        f"columns: {columns.key}", title_justify="left", box=box.SIMPLE_HEAD,
                  pad_edge=False, collapse_padding=True)
    table.add_column(rows.key, justify="right", min_width=min(len(rows.key), 24))
    for j in shown:
        table.add_column(f"{columns.values[j]:.4g}", justify="right")
    for i, row_value in enumerate(rows.values):
        cells = [f"{row_value:g}"]
        for j in shown:
            point = sweep.points[i * len(columns.values) + j]
            life = point.governing_life_h
            text = compact_hours(life_h(life))
            verdict = point.document.get("verdict")
            cells.append(text if verdict is None else
                         (f"[green]{text}[/]" if verdict["passed"] else f"[red]{text}[/]"))
        table.add_row(*cells)
    if len(shown) < count:
        table.caption = f"{len(shown)} of {count} columns shown; --json has all"
    return table


def direction(crossing) -> str:
    return "falls below" if crossing.falls_below else "rises above"


def crossing_lines(sweep: Sweep) -> list[str]:
    """One key: where the governing life crosses the target and the shaft's lowest safety
    its required value (each reported on its own: a file may give one without the other)."""
    name, key = sweep.governing_life_name, sweep.axes[-1].key
    verdict = sweep.points[0].document.get("verdict")
    lines = [NO_TARGET] if verdict is None else [
        f"System {name} {direction(crossing)} the target at {key} = {crossing.value:.4g} "
        f"({'interpolated' if crossing.interpolated else 'next to an infinite or zero life'})."
        for _, found in sweep.crossings() for crossing in found]
    if not lines:
        lines = [f"System {name} stays {'above' if verdict['passed'] else 'below'} the target "
                 "over the whole sweep."]
    return lines + [f"Shaft's lowest safety {direction(crossing)} its required safety at "
                    f"{key} = {crossing.value:.4g}."
                    for _, found in sweep.shaft_crossings() for crossing in found]


def render(sweep: Sweep, console: Console) -> None:
    console.print(f"[bold]{escape(sweep.title)}[/]  ({escape(sweep.source)})")
    if len(sweep.axes) == 2:
        console.print(life_map(sweep))
    else:
        console.print(point_table(sweep, "life"))
        console.print(point_table(sweep, "safety"))
    if len(sweep.axes) >= 2:
        for table in crossing_tables(sweep):
            console.print(table)
    else:
        for line in crossing_lines(sweep):
            console.print(line)
    console.print(f"[dim]Caution: {CAUTIONS}[/]")


def crossing_tables(sweep: Sweep) -> list:
    """Grid sweeps: one table row per crossing (values of the other keys, where, which way),
    for the governing life and for the shaft's lowest safety, each on its own."""
    name = sweep.governing_life_name
    life = crossing_table(sweep, f"Where the system {name} crosses the target",
                          sweep.crossings())
    shaft = crossing_table(sweep, "Where the shaft's lowest safety crosses its required safety",
                           sweep.shaft_crossings())
    if sweep.points[0].document.get("verdict") is None:
        note = [NO_TARGET]
    else:
        note = [] if life else [f"System {name} does not cross the target on the grid."]
    return note + [table for table in (life, shaft) if table is not None]


def crossing_table(sweep: Sweep, title: str, found) -> Table | None:
    rows = [(where, crossing) for where, crossings in found for crossing in crossings]
    if not rows:
        return None
    table = Table(title=title, title_justify="left", box=box.SIMPLE_HEAD)
    for axis in sweep.axes:
        table.add_column(axis.key, justify="right")
    table.add_column("")
    for where, crossing in rows:
        table.add_row(*(f"{v:g}" for v in where.values()), f"{crossing.value:.4g}",
                      direction(crossing))
    return table
