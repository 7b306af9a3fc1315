"""The HTML report of a machine: verdict, wheel ends, the weakest one's chart, each wheel end's
derived spectrum and lives, warnings, the machine file as written, cautions.

Built from the typed result and the table specs the terminal renders (report.specs), so a
label, a number format and the governing basis are the same on both.
"""

from __future__ import annotations

from hubload.engine.governing import symbol_of
from hubload.engine.machine import MachineResult
from hubload.report.columns import CASE_ROWS_SHOWN
from hubload.report.html.check import inputs_section
from hubload.report.html.page import escape, figure_html, page, section, spec_table
from hubload.report.messages import summary_lines
from hubload.report.numbers import hours_with_unit, share
from hubload.report.plots.spectrum import damage_share_figure
from hubload.report.specs import check as check_specs
from hubload.report.specs.machine import cases_table, wheel_end_table
from hubload.report.specs.shaft import item_limit, item_value


def verdict_section(machine: MachineResult) -> str:
    found, governing = machine.verdict, machine.governing
    if found is None:
        body = '<p class="verdict none">No target life given: no verdict.</p>'
    else:
        word, css, relation = ("PASS", "pass", ">=") if found.passed else ("FAIL", "fail", "<")
        body = (f'<p class="verdict {css}"><strong>{word}</strong>: machine '
                f'{escape(found.life_name)} = <span data-key="verdict.life_h">'
                f"{hours_with_unit(found.life_h)}</span> {relation} target "
                f"{hours_with_unit(found.target_h)}</p>")
    body += (f"<p>Governing life: <strong>{escape(governing.symbol)}</strong> = "
             f"{hours_with_unit(governing.life_h)}, {escape(governing.basis)}.</p>")
    weakest = machine.weakest
    body += (f"<p>Weakest wheel end: <strong>{escape(weakest.name)}</strong> "
             f"({escape(governing.symbol)} = {hours_with_unit(weakest.governing_life_h)}).</p>")
    dominant = governing.dominant_case
    if dominant is not None:
        body += (f"<p>Dominant case of the machine: <strong>"
                 f"{escape(machine.study.case_names[dominant])}</strong> "
                 f"({share(governing.case_damage_share[dominant])} of its damage).</p>")
    overall = machine.overall
    if overall is not None and len(overall.items) > 1:
        word, css = ("PASS", "pass") if overall.passed else ("FAIL", "fail")
        worst = overall.worst
        body += (f'<p class="verdict {css}" data-key="overall_verdict.passed"><strong>{word}'
                 f"</strong> overall (bearings and shafts); worst item: {escape(worst.name)} = "
                 f"{escape(item_value(worst))} (limit {escape(item_limit(worst))}).</p>")
    return section("verdict", "Verdict", body)


def wheel_ends_section(machine: MachineResult) -> str:
    method = machine.wheel_ends[0].result.method
    basic = symbol_of(method, 90.0, False)
    modified = symbol_of(method, float(machine.study.reliability_percent), True)
    lives = (f"<dl><dt>machine {basic} (every bearing in series)</dt>"
             f"<dd data-key=\"machine.l10_h\">{hours_with_unit(machine.l10_h)}</dd>")
    if machine.l10m_h is not None:
        lives += (f"<dt>machine {modified}</dt><dd data-key=\"machine.l10m_h\">"
                  f"{hours_with_unit(machine.l10m_h)}</dd>")
    lives += "</dl>"
    chart = figure_html(damage_share_figure(machine.weakest.result), "weakest")
    return section("wheel-ends", "Wheel ends", spec_table(wheel_end_table(machine)) + lives
                   + f"<p>The weakest wheel end's damage by case ({escape(machine.weakest.name)}):"
                     f"</p>" + chart)


def wheel_end_sections(machine: MachineResult) -> list[str]:
    sections = []
    for index, wheel in enumerate(machine.wheel_ends):
        result = wheel.result
        lines = summary_lines(result.findings, result.study.cases.names)
        warnings = ("<ul>" + "".join(f"<li>{escape(line)}</li>" for line in lines) + "</ul>"
                    ) if lines else "<p>No warnings or flags.</p>"
        body = (f"<p>Wheel end file: {escape(wheel.wheel_end.wheel_end_file)}; axle: "
                f"{escape(wheel.wheel_end.axle)}.</p>" + spec_table(cases_table(wheel, CASE_ROWS_SHOWN))
                + spec_table(check_specs.summary_table(result)) + warnings)
        sections.append(section(f"wheel-end-{index}", f"The {wheel.name} wheel", body))
    return sections


def machine_html(machine: MachineResult, inputs: dict) -> str:
    """The whole page of a machine result; ``inputs`` is the machine file's parsed TOML."""
    study = machine.study
    return page(study.title, f"{study.source} · machine", [
        verdict_section(machine), wheel_ends_section(machine), *wheel_end_sections(machine),
        inputs_section(inputs)])
