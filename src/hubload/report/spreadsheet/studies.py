"""``sweep --table`` (one row per point) and ``compare --table`` (one row per file)."""

from __future__ import annotations

from hubload.report.keywords import key_words
from hubload.report.specs.compare import files_table
from hubload.report.specs.sweep import point_table
from hubload.report.spreadsheet.specsheet import merged, spec_sheet
from hubload.report.spreadsheet.workbook import Sheet
from hubload.studies.compare import Comparison
from hubload.studies.sweep import Sweep

SWEEP_SHEETS = ("points",)
COMPARE_SHEETS = ("files",)


def axis_notes(sweep: Sweep) -> list[str]:
    """What each varied key moves, in the file format's words."""
    study = sweep.first.study
    sections = [s.name for s in study.shaft.sections] if study.shaft is not None else []
    return [f"{path.text}: {key_words(path, study.cases.names, sections)}"
            for axis in sweep.axes for path, _ in axis.moving()]


def sweep_sheets(sweep: Sweep) -> list[Sheet]:
    points = merged("points", f"Sweep of {sweep.title} ({sweep.source}): "
                              f"{len(sweep.values):,} points",
                    [point_table(sweep, "life"), point_table(sweep, "safety")])
    return [spec_sheet("points", points, notes=axis_notes(sweep))]


def compare_sheets(comparison: Comparison) -> list[Sheet]:
    return [spec_sheet("files", files_table(comparison))]
