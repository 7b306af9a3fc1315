"""``hubload spectrum LOG --table out.xlsx``: the lives and the classed spectrum as sheets.

One log: ``lives`` (direct and classed, per bearing and the pair) and ``classed`` (the
classed cases with their loads, lives and damage shares, the check's case columns). A
folder: ``fleet`` (one row per log, harshest first) before them, which then hold the
combined fleet.
"""

from __future__ import annotations

from hubload.logs.analysis import LogRun
from hubload.logs.spectrum import SpectrumResult
from hubload.report.specs.fleet import fleet_table
from hubload.report.specs.logs import lives_table
from hubload.report.spreadsheet.check import case_specs
from hubload.report.spreadsheet.specsheet import merged, spec_sheet
from hubload.report.spreadsheet.workbook import Sheet

LOG_SHEETS = ("lives", "classed")
FOLDER_SHEETS = ("fleet", *LOG_SHEETS)


def log_sheets(result: SpectrumResult, about: str) -> list[Sheet]:
    classed = result.classed
    cases = merged("classed", f"Classed spectrum of {about}: {len(classed.study.cases):,} "
                              f"cases", case_specs(classed))
    return [spec_sheet("lives", lives_table(result), notes=(f"Log: {about}.",)),
            spec_sheet("classed", cases)]


def spectrum_sheets(run: LogRun) -> list[Sheet]:
    if run.combined is None:
        return log_sheets(run.single, run.single.summary.name)
    combined = f"the fleet of {len(run.results)} logs"
    return [spec_sheet("fleet", fleet_table(run)), *log_sheets(run.combined, combined)]
