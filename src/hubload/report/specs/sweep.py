"""The point tables of ``hubload sweep`` (terminal and spreadsheet): per point, the varied
keys' values, then the lives or the safeties."""

from __future__ import annotations

from hubload.report.columns import Column, TableSpec
from hubload.report.numbers import hours, safety
from hubload.report.quantities import Quantity, all_quantities, governing_key, \
    governing_quantity
from hubload.studies.sweep import Sweep


def table_quantities(sweep: Sweep) -> list[Quantity]:
    """The governing life, the system lives of every kind, the bearing lives of the kind the
    verdict uses, the safeties."""
    first = sweep.first
    modified = first.governing.choice.modified
    found = [q for q in all_quantities(first)
             if q.kind != "life" or q.system or q.modified == modified]
    if governing_key(first) is None or first.iso281 is not None:
        found.insert(0, governing_quantity(first))
    return found


def pass_text(passed) -> str:
    return "pass" if passed else "FAIL"


def point_table(sweep: Sweep, kind: str) -> TableSpec:
    """Per point: the varied keys' values, then the lives (or the safeties)."""
    quantities = [q for q in table_quantities(sweep) if q.kind == kind]
    moving = [path for axis in sweep.axes for path, _ in axis.moving()]
    columns = [Column(path.text, path.segments[-1][0], [v[path.text] for v in sweep.values],
                      text=lambda v: f"{v:g}") for path in moving]
    text = hours if kind == "life" else safety
    columns += [Column(item.key, item.label, list(sweep.column(item.of)),
                       "h" if kind == "life" else "", text) for item in quantities]
    if kind == "life" and sweep.targets_h is not None:
        passed = sweep.governing_life_h >= sweep.targets_h
        columns.append(Column("target", "target", [pass_text(p) for p in passed],
                              alert=lambda t: t == "FAIL"))
    first = sweep.first
    if kind == "life" and first.overall is not None and first.shaft is not None:
        overall = sweep.column(lambda r: r.overall.passed)
        columns.append(Column("overall", "overall", [pass_text(p) for p in overall],
                              alert=lambda t: t == "FAIL"))
    return TableSpec(f"sweep_{kind}", "Lives" if kind == "life" else "Safety factors",
                     tuple(columns), keep_first=len(moving))
