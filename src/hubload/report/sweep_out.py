"""Sweep output: rich tables (per point, or a life map for two keys) and the JSON document."""

from __future__ import annotations

import json
import math

from rich.console import Console
from rich.table import Table

from hubload.report.cautions import CAUTIONS
from hubload.report.jsonout import number
from hubload.report.series import all_series
from hubload.report.terminal import hours
from hubload.studies.sweep import Sweep

MAP_MAX_COLUMNS = 12


def sweep_document(sweep: Sweep) -> dict:
    """``points[]`` with ``values`` and the check's per-point objects (bearings, system, ...)."""
    return {
        "title": sweep.title,
        "source": sweep.source,
        "parameters": [{"key": axis.key, "start": number(axis.values[0]),
                        "stop": number(axis.values[-1]), "count": len(axis.values),
                        "file_value": sweep.file_values.get(axis.key)}
                       for axis in sweep.axes],
        "target_life_h": sweep.target_life_h,
        "governing_life": sweep.governing_life_name,
        "points": [{"values": point.values, **point.document} for point in sweep.points],
        "crossings": [{"at": where, "key": sweep.axes[-1].key, "value": c.value,
                       "falls_below": c.falls_below, "interpolated": c.interpolated}
                      for where, found in sweep.crossings() for c in found],
        "cautions": CAUTIONS,
    }


def to_json(sweep: Sweep) -> str:
    return json.dumps(sweep_document(sweep), indent=2)


def quantity(value: float, kind: str) -> str:
    if math.isnan(value):
        return "-"
    return hours(value) if kind == "life" else ("infinite" if math.isinf(value) else f"{value:.2f}")


def point_table(sweep: Sweep) -> Table:
    documents = [p.document for p in sweep.points]
    series = all_series(documents[0])
    table = Table(title=f"Sweep of {', '.join(a.key for a in sweep.axes)}", title_justify="left")
    for axis in sweep.axes:
        table.add_column(axis.key, justify="right", min_width=min(len(axis.key), 24))
    for item in series:
        table.add_column(item.label + (" h" if item.kind == "life" else ""), justify="right")
    if documents[0].get("verdict") is not None:
        table.add_column("verdict")
    columns = [item.values(documents) for item in series]
    for row, point in enumerate(sweep.points):
        cells = [f"{point.values[a.key]:g}" for a in sweep.axes]
        cells += [quantity(column[row], item.kind) for item, column in zip(series, columns)]
        verdict = point.document.get("verdict")
        if verdict is not None:
            cells.append("[green]pass[/]" if verdict["passed"] else "[red]FAIL[/]")
        table.add_row(*cells)
    return table


def life_map(sweep: Sweep) -> Table:
    """Governing system life over two keys: rows = first key, columns = second key."""
    rows, columns = sweep.axes[0], sweep.axes[1]
    step = max(1, math.ceil(len(columns.values) / MAP_MAX_COLUMNS))
    shown = list(range(0, len(columns.values), step))
    table = Table(title=f"System {sweep.governing_life_name} h: {rows.key} (rows) x "
                        f"{columns.key} (columns)", title_justify="left")
    table.add_column(f"{rows.key} \\ {columns.key}", justify="right")
    for j in shown:
        table.add_column(f"{columns.values[j]:g}", justify="right")
    for i, row_value in enumerate(rows.values):
        cells = [f"{row_value:g}"]
        for j in shown:
            point = sweep.points[i * len(columns.values) + j]
            life = point.governing_life_h
            text = hours(math.inf if life is None else life)
            verdict = point.document.get("verdict")
            cells.append(text if verdict is None else
                         (f"[green]{text}[/]" if verdict["passed"] else f"[red]{text}[/]"))
        table.add_row(*cells)
    if step > 1:
        table.caption = f"every {step}th column shown; --json gives all points"
    return table


def crossing_lines(sweep: Sweep) -> list[str]:
    if sweep.points[0].document.get("verdict") is None:
        return ["No target life given ([project] target_life_h): no target crossing."]
    name, key = sweep.governing_life_name, sweep.axes[-1].key
    lines = []
    for where, found in sweep.crossings():
        at = "".join(f" at {k} = {v:g}" for k, v in where.items())
        for crossing in found:
            way = "falls below" if crossing.falls_below else "rises above"
            how = "interpolated" if crossing.interpolated else "next to an infinite life"
            lines.append(f"System {name} {way} the target at {key} = {crossing.value:.4g}"
                         f"{at} ({how}).")
    if not lines:
        lines.append(f"System {name} stays on one side of the target over the whole sweep.")
    return lines


def render(sweep: Sweep, console: Console) -> None:
    console.print(f"[bold]{sweep.title}[/]  ({sweep.source})")
    console.print(life_map(sweep) if len(sweep.axes) == 2 else point_table(sweep))
    for line in crossing_lines(sweep):
        console.print(line)
    console.print(f"[dim]Caution: {CAUTIONS}[/]")
