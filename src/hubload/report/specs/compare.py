"""The files of ``hubload compare`` as rows (spreadsheets): lives, ratios, safeties, verdicts.

The terminal shows the same quantities transposed (files in columns); the quantities and
their labels come from report.quantities for both.
"""

from __future__ import annotations

from hubload.report.columns import Column, TableSpec
from hubload.report.numbers import hours, safety, share
from hubload.report.quantities import ratios_to_first, shared_life_quantities
from hubload.studies.compare import Comparison


def verdict_word(passed) -> str:
    return "pass" if passed else "FAIL"


def files_table(comparison: Comparison) -> TableSpec:
    """One row per file, the first the reference of the ratios."""
    results = comparison.results
    columns = [Column("file_index", "#", list(range(1, len(results) + 1))),
               Column("title", "title", [r.study.title for r in results], name=True),
               Column("source", "file", [r.study.source for r in results], name=True)]
    for item in shared_life_quantities(results, repeat_governing=False):
        columns += [Column(item.key, item.label, [float(item.of(r)) for r in results], "h",
                           hours),
                    Column(f"{item.key}.ratio", f"{item.label} / #1",
                           ratios_to_first(results, item), "",
                           lambda v: "-" if v is None else f"{v:.2f}")]
    columns.append(Column("worst_s0", "worst s0", [r.lowest_static_safety for r in results],
                          "", safety))
    if any(r.shaft is not None for r in results):
        columns.append(Column("shaft_min_safety", "shaft min safety",
                              [None if r.lowest_shaft_safety is None
                               else float(r.lowest_shaft_safety) for r in results], "", safety))
    columns += [
        Column("verdict", "verdict", ["no target" if r.verdict is None else
                                      verdict_word(r.verdict.passed) for r in results]),
        Column("overall", "overall verdict", ["-" if r.overall is None or r.shaft is None else
                                              verdict_word(r.overall.passed) for r in results]),
        Column("dominant_case", "dominant case", [
            None if r.dominant_case is None else r.study.cases.names[r.dominant_case]
            for r in results], name=True),
        Column("dominant_share", "its damage", [
            None if r.dominant_case is None else
            float(r.governing.system_damage_share[r.dominant_case]) for r in results], "%",
            lambda v: "-" if v is None else share(v),
            legend="the dominant case's share of the pair's damage on the governing basis")]
    return TableSpec("compare", "Files side by side (ratios against #1)", tuple(columns))
