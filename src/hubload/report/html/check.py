"""The HTML report of a check: verdict, warnings, lives, charts, cases, shaft, inputs, cautions.

Built from the typed result and the same table specs as the terminal (report.specs), so
a label, a number format and the governing basis are the same on both.
"""

from __future__ import annotations

from hubload.engine import Result
from hubload.engine.governing import METHOD_NAMES
from hubload.report.columns import CASE_ROWS_SHOWN
from hubload.report.html.page import escape, figure_html, page, section, spec_table
from hubload.report.messages import summary_lines, warning_texts
from hubload.report.numbers import hours, hours_with_unit, share
from hubload.report.plots.spectrum import damage_share_figure, loads_figure
from hubload.report.specs import check as specs
from hubload.report.specs.assembly import setting_table
from hubload.report.specs.operating import operating_table
from hubload.report.specs.refined import displacement_table, distribution_table
from hubload.report.specs.shaft import cases_table, checks_table, sections_table


def verdict_section(result: Result) -> str:
    found, governing = result.verdict, result.governing
    if found is None:
        line = '<p class="verdict none">No target life given: no verdict.</p>'
    else:
        word, css = ("PASS", "pass") if found.passed else ("FAIL", "fail")
        relation = ">=" if found.passed else "<"
        life = float(found.life_h)
        unit = " h" if life != float("inf") else ""
        line = (f'<p class="verdict {css}"><strong>{word}</strong>: system '
                f'{escape(found.life_name)} = <span data-key="verdict.life_h">{hours(life)}'
                f'</span>{unit} {relation} target {hours_with_unit(found.target_h)}</p>')
    line += (f"<p>Governing life: <strong>{escape(governing.symbol)}</strong>, "
             f"{escape(governing.basis)}; method: {escape(METHOD_NAMES[result.method])}.</p>")
    other = governing.other()
    if other is not None:
        line += (f"<p>Beside it: {escape(other.symbol)} = {hours_with_unit(other.system_life_h)}"
                 f" ({escape(other.basis)}); verdict basis '{escape(governing.rule)}'.</p>")
    dominant = result.dominant_case
    if dominant is not None:
        shares = governing.system_damage_share
        line += (f"<p>Dominant case: <strong>{escape(result.study.cases.names[dominant])}"
                 f"</strong> ({share(shares[dominant])} of the pair's {escape(governing.symbol)} "
                 f"damage).</p>")
    overall = result.overall
    if overall is not None:
        word, css = ("PASS", "pass") if overall.passed else ("FAIL", "fail")
        line += (f'<p class="verdict {css}" data-key="overall_verdict.passed"><strong>{word}'
                 f"</strong> overall: every item below against its limit</p>"
                 + spec_table(checks_table(result)))
    return section("verdict", "Verdict", line)


def flags_section(result: Result) -> str:
    names = result.study.cases.names
    short = summary_lines(result.findings, names)
    full = warning_texts(result.findings, names)
    if not full:
        return section("flags", "Warnings and flags", "<p>No warnings or flags.</p>")
    body = "<ul>" + "".join(f"<li>{escape(line)}</li>" for line in short) + "</ul>"
    if short != full:
        body += ("<details><summary>every warning, case by case</summary><ul>"
                 + "".join(f"<li>{escape(line)}</li>" for line in full) + "</ul></details>")
    return section("flags", "Warnings and flags", body)


def results_section(result: Result) -> str:
    parts = [spec_table(specs.summary_table(result))]
    ratings = specs.ratings_table(result)
    if ratings is not None:
        parts.append(spec_table(ratings))
    study = result.study
    items = [("mean speed", f"{float(result.mean_speed_rpm):.1f} r/min", "mean_speed_rpm"),
             ("reliability", f"{float(study.reliability_percent):g} %", "reliability_percent"),
             ("a1", f"{float(result.a1):.3g}", "a1")]
    parts.append("<dl>" + "".join(f'<dt>{escape(name)}</dt><dd data-key="{key}">{escape(value)}'
                                  f"</dd>" for name, value, key in items) + "</dl>")
    return section("results", "Results", "".join(parts))


def charts_section(result: Result) -> str:
    return section("charts", "Charts", figure_html(damage_share_figure(result), "damage")
                   + figure_html(loads_figure(result), "loads"))


def cases_section(result: Result) -> str:
    """The case tables, each cut to the most damaging cases; the whole spectrum folded."""
    tables = [specs.spectrum_table(result, CASE_ROWS_SHOWN), operating_table(result, CASE_ROWS_SHOWN),
              specs.loads_table(result, CASE_ROWS_SHOWN), specs.lives_table(result, CASE_ROWS_SHOWN),
              specs.lubrication_table(result, CASE_ROWS_SHOWN)]
    if result.refined is not None:
        tables += [distribution_table(result, CASE_ROWS_SHOWN),
                   displacement_table(result, CASE_ROWS_SHOWN)]
    tables.append(setting_table(result, CASE_ROWS_SHOWN))
    parts = [spec_table(table) for table in tables if table is not None]
    if len(result.study.cases) > CASE_ROWS_SHOWN:
        parts.append("<details><summary>the whole spectrum, every case</summary>"
                     + spec_table(specs.spectrum_table(result, None)) + "</details>")
    return section("cases", "Load cases", "".join(parts))


def shaft_section(result: Result) -> str:
    if result.shaft is None:
        return ""
    return section("shaft", "Shaft", spec_table(sections_table(result))
                   + spec_table(cases_table(result, CASE_ROWS_SHOWN)))


def inputs_section(inputs: dict) -> str:
    return section("inputs", "Inputs (as written in the file)",
                   "".join(input_table(name, value) for name, value in inputs.items()))


def input_table(name: str, value) -> str:
    if isinstance(value, list) and value and all(isinstance(v, dict) for v in value):
        columns = list(dict.fromkeys(k for item in value for k in item))
        return raw_table(f"[[{name}]]", columns,
                         [[escape_input(item.get(c, "")) for c in columns] for item in value])
    if isinstance(value, dict):
        flat = {k: v for k, v in value.items() if not isinstance(v, (dict, list))
                or (isinstance(v, list) and not any(isinstance(i, dict) for i in v))}
        parts = [raw_table(f"[{name}]", ["key", "value"],
                           [[k, escape_input(v)] for k, v in flat.items()])] if flat else []
        parts += [input_table(f"{name}.{k}", v) for k, v in value.items() if k not in flat]
        return "".join(parts)
    return raw_table(name, ["key", "value"], [[name, escape_input(value)]])


def raw_table(caption: str, headings: list[str], rows: list[list[str]]) -> str:
    head = "".join(f"<th>{escape(h)}</th>" for h in headings)
    body = "".join("<tr>" + "".join(f"<td>{escape(cell)}</td>" for cell in row) + "</tr>"
                   for row in rows)
    return (f'<div class="scroll"><table><caption>{escape(caption)}</caption><thead><tr>{head}'
            f"</tr></thead><tbody>{body}</tbody></table></div>")


def escape_input(value) -> str:
    return ", ".join(map(str, value)) if isinstance(value, list) else str(value)


def report_html(result: Result, inputs: dict, on_progress=None) -> str:
    """The whole page of a check result; ``inputs`` is the file's parsed TOML.

    ``on_progress(done, total)`` after each section (the charts and the cases of a large
    spectrum take seconds)."""
    study = result.study
    builders = [verdict_section, flags_section, results_section, charts_section,
                cases_section, shaft_section, lambda _result: inputs_section(inputs)]
    sections = []
    for build in builders:
        sections.append(build(result))
        if on_progress is not None:
            on_progress(len(sections), len(builders))
    return page(study.title, f"{study.source} · method {result.method}", sections)
