"""``hubload check`` on the terminal: the tables of report.specs, the verdicts, the warnings.

Large spectra (a log classes into a thousand cases) show the most damaging cases only,
on the governing basis; ``show_all`` lists every case and every warning in full.
"""

from __future__ import annotations

from rich.console import Console
from rich.text import Text

from hubload.engine import Result
from hubload.engine.governing import METHOD_NAMES
from hubload.report.cautions import CAUTIONS
from hubload.report.columns import CASE_ROWS_SHOWN
from hubload.report.messages import summary_lines, warning_texts
from hubload.report.numbers import hours_with_unit, share
from hubload.report.specs import check as specs
from hubload.report.specs.assembly import friction_line, setting_table
from hubload.report.specs.operating import operating_table
from hubload.report.specs.refined import displacement_table, distribution_table
from hubload.report.specs.shaft import cases_table, checks_table, item_limit, item_value, \
    sections_table
from hubload.report.terminal.tables import render
from hubload.report.usertext import plain

SECONDARY_ROWS = 10     # rows of the further case tables of a large spectrum


def governing_line(result: Result) -> Text:
    governing = result.governing
    text = (f"Method: {METHOD_NAMES[result.method]}. Governing life: {governing.symbol} "
            f"({governing.basis})")
    other = governing.other()
    if other is not None:
        text += (f"; verdict basis '{governing.rule}', beside it {other.symbol} = "
                 f"{hours_with_unit(other.system_life_h)}")
    return Text(text + ".")


def verdict_line(result: Result) -> Text:
    found = result.verdict
    if found is None:
        return Text("No target life given ([project] target_life_h): no verdict.")
    word, style, relation = ("PASS", "bold green", ">=") if found.passed else \
        ("FAIL", "bold red", "<")
    return Text.assemble((word, style), f": system {found.life_name} = "
                         f"{hours_with_unit(found.life_h)} {relation} target "
                         f"{hours_with_unit(found.target_h)} (the governing life above)")


def dominant_line(result: Result) -> Text:
    index = result.dominant_case
    if index is None:
        return Text("No case adds fatigue damage.")
    shares = result.governing.system_damage_share
    return Text(f"Dominant case: '{plain(result.study.cases.names[index])}' "
                f"({share(shares[index])} of the pair's {result.governing.symbol} damage).")


def overall_line(result: Result) -> Text | None:
    found = result.overall
    if found is None or result.shaft is None:
        return None
    worst = found.worst
    verdict = ("PASS", "bold green") if found.passed else ("FAIL", "bold red")
    return Text.assemble("Overall verdict (bearings and shaft): ", verdict,
                         f"; worst item: {worst.name} = {item_value(worst)} "
                         f"(limit {item_limit(worst)}).")


def lubrication_notes(result: Result) -> list[str]:
    modified = result.modified
    if modified is None:
        return []
    lines = [f"Lubrication: {result.study.lubrication.method}; {modified.contamination_note}."]
    estimated = [label for label, b in modified.bearings.items() if b.fatigue_limit_estimated]
    if estimated:
        lines.append(f"Cu of the {' and '.join(estimated)} bearing{'s' * (len(estimated) > 1)} "
                     f"estimated from C0 (ISO 281 annex B): give Cu_kN from the bearing data "
                     f"when known.")
    return lines


def large(result: Result, show_all: bool) -> bool:
    """A spectrum too large for every per-case table on a terminal (a classed log)."""
    return not show_all and len(result.study.cases) > CASE_ROWS_SHOWN


def case_tables(result: Result, show_all: bool):
    """The per-case tables in order. A large spectrum shows its most damaging cases in the
    spectrum table and the lives table only; the other tables are one --all away."""
    if large(result, show_all):
        return [specs.spectrum_table(result, CASE_ROWS_SHOWN),
                specs.lives_table(result, SECONDARY_ROWS)]
    tables = [specs.spectrum_table(result, None), operating_table(result, None),
              specs.loads_table(result, None), specs.lives_table(result, None),
              specs.lubrication_table(result, None)]
    if result.refined is not None:
        tables += [distribution_table(result, None), displacement_table(result, None)]
    tables.append(setting_table(result, None, friction=show_all or result.refined is not None))
    return [table for table in tables if table is not None]


LARGE_NOTE = ("Per-case loads, operating points, lubrication, setting, friction and shaft "
              "tables of a spectrum this large: --all lists them, --report or --json has them.")


def render_check(result: Result, console: Console, show_all: bool = False) -> None:
    """Print the full check report."""
    study = result.study
    console.print(Text.assemble((plain(study.title), "bold"), f"  ({plain(study.source)})"))
    console.print(governing_line(result))
    for table in case_tables(result, show_all):
        render(table, console)
    if large(result, show_all):
        console.print(Text(LARGE_NOTE))
    ratings = specs.ratings_table(result, always=show_all)
    if ratings is not None:
        render(ratings, console)
    render(specs.summary_table(result), console)
    for line in lubrication_notes(result):
        console.print(Text(f"Note: {plain(line)}"))
    if result.friction is not None and not (show_all or result.refined is not None):
        console.print(Text(friction_line(result)))
    console.print(dominant_line(result))
    if result.shaft is not None:
        render(sections_table(result), console)
        if not large(result, show_all):
            render(cases_table(result, None), console)
    console.print(verdict_line(result))
    if result.shaft is not None and result.overall is not None:  # else the verdict line says all
        render(checks_table(result), console)
        console.print(overall_line(result))
    names = study.cases.names
    lines = warning_texts(result.findings, names) if show_all else \
        summary_lines(result.findings, names)
    for line in lines:
        console.print(Text.assemble(("Warning:", "yellow"), f" {plain(line)}"))
    console.print(Text(f"Caution: {CAUTIONS}", style="dim"))
