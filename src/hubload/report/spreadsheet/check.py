"""``hubload check FILE --table out.xlsx``: the check's results as sheets, built from the
same specs as the terminal and the HTML report (every case, nothing cut).

Sheets: ``cases`` (the spectrum, operating points, loads, lives, lubrication and, with the
refined method, the load distribution and setting per case), ``bearings`` (each bearing's
and the pair's spectrum lives and static safety), ``shaft`` (the sections),
``shaft_cases`` (each section's fatigue safety per case) and ``checks`` (every verdict
item with its limit). The set is the same for every file, so that the names of the files
can be checked before the run; a sheet without content says why in its title.
"""

from __future__ import annotations

from hubload.engine import Result
from hubload.report.specs import check as specs
from hubload.report.specs.assembly import setting_table
from hubload.report.specs.operating import operating_table
from hubload.report.specs.refined import displacement_table, distribution_table
from hubload.report.specs.shaft import cases_table, check_items_table, sections_table
from hubload.report.spreadsheet.specsheet import merged, spec_sheet
from hubload.report.spreadsheet.workbook import Sheet

SHEETS = ("cases", "bearings", "shaft", "shaft_cases", "checks")
NO_SHAFT = "No shaft check: the file has no [shaft] table."


def case_specs(result: Result) -> list:
    tables = [specs.spectrum_table(result, None), operating_table(result, None),
              specs.loads_table(result, None), specs.lives_table(result, None),
              specs.lubrication_table(result, None)]
    if result.refined is not None:
        tables += [distribution_table(result, None), displacement_table(result, None)]
    return tables + [setting_table(result, None)]


def check_sheets(result: Result) -> list[Sheet]:
    study = result.study
    about = f"{study.title} ({study.source})"
    cases = merged("cases", f"Load cases of {about}: {len(study.cases):,} cases",
                   case_specs(result))
    shaft = result.shaft is not None
    summary = specs.summary_table(result)
    return [
        spec_sheet("cases", cases),
        spec_sheet("bearings", summary, notes=(f"Bearings of {about}.",)),
        spec_sheet("shaft", sections_table(result) if shaft else None, NO_SHAFT),
        spec_sheet("shaft_cases", cases_table(result, None) if shaft else None, NO_SHAFT),
        spec_sheet("checks", check_items_table(result),
                   "No verdict: no target life ([project] target_life_h) and no shaft."),
    ]
