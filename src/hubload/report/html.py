"""One self-contained HTML report of a check: inputs, results, charts, flags and cautions.

Everything is inline (CSS, SVG charts with text drawn as paths); a content security
policy forbids every outside resource, so the page renders the same offline and in
print. Tables are built from the check's JSON document, so results that later
features add (modified life, shaft sections, operating points) appear without
changes here.
"""

from __future__ import annotations

import html
import math
import re
from importlib.metadata import PackageNotFoundError, version

from hubload.engine import Result
from hubload.report.cautions import CAUTIONS
from hubload.report.html_style import STYLE
from hubload.report.jsonout import result_document
from hubload.report.numbers import hours, hours_with_unit, safety, share
from hubload.report.plots import svg_text
from hubload.report.plots.spectrum import damage_share_figure, loads_figure
from hubload.report.series import damage_shares_of

POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:"
LABELS = {
    "l10_h": "L10 h", "l10m_h": "L10m h", "l10_km": "L10 km", "l10m_km": "L10m km",
    "s0": "s0", "fr_kN": "Fr kN", "fa_kN": "Fa kN", "p_kN": "P kN", "p0_kN": "P0 kN",
    "damage_share": "damage", "system_damage_share": "pair damage",
    "time_fraction": "time", "speed_rpm": "n r/min", "name": "name", "kappa": "kappa",
    "e_c": "eC", "a_iso": "aISO", "min_safety": "min safety", "min_safety_case": "its case",
    "yield_safety": "yield safety", "fatigue_life_h": "fatigue life h",
    "mean_speed_rpm": "mean speed r/min", "method": "method",
}
LIFE_SUFFIXES = ("_h", "_km")
# safety factors whose null is an infinite one (no load); a per-case "safety" may be null at
# standstill instead, where it is undefined
SAFETY_KEYS = ("s0", "min_safety", "yield_safety")


def label(key: str) -> str:
    return LABELS.get(key, key.replace("_", " "))


def cell(key: str, value) -> str:
    """A value as table text; null lives are infinite, other nulls a dash."""
    if value is None:
        return "infinite" if key.endswith(LIFE_SUFFIXES) or key in SAFETY_KEYS else "–"
    if isinstance(value, bool):
        return "yes" if value else "no"
    if isinstance(value, (int, float)):
        return number_text(key, float(value))
    if isinstance(value, list):
        return "; ".join(cell(key, item) for item in value) or "–"
    if isinstance(value, dict):
        return "; ".join(f"{label(k)} {cell(k, v)}" for k, v in value.items())
    return str(value)


def number_text(key: str, value: float) -> str:
    if not math.isfinite(value):
        return "infinite"
    if "share" in key or key == "time_fraction" or key.endswith("utilisation"):
        return share(value)
    if key.endswith(LIFE_SUFFIXES):
        return hours(value)
    if key in ("index", "count") or (value.is_integer() and abs(value) >= 1000):
        return f"{value:,.0f}"
    return f"{value:.2f}" if abs(value) >= 0.1 else f"{value:.3g}"


def escape(text) -> str:
    return html.escape(str(text), quote=True)


def table(headings: list[str], rows: list[list[str]], caption: str = "",
          keys: list[list[str]] | None = None) -> str:
    """An HTML table; ``keys`` gives data-key attributes per cell (for tests and scripts)."""
    head = "".join(f"<th>{escape(h)}</th>" for h in headings)
    body = []
    for r, row in enumerate(rows):
        cells = []
        for c, text in enumerate(row):
            key = keys[r][c] if keys and keys[r][c] else ""
            attribute = f' data-key="{escape(key)}"' if key else ""
            tag = "th" if c == 0 else "td"
            cells.append(f"<{tag}{attribute}>{escape(text)}</{tag}>")
        body.append("<tr>" + "".join(cells) + "</tr>")
    title = f"<caption>{escape(caption)}</caption>" if caption else ""
    return (f'<div class="scroll"><table>{title}<thead><tr>{head}</tr></thead>'
            f"<tbody>{''.join(body)}</tbody></table></div>")


def summary_section(document: dict) -> str:
    bearings = document["bearings"]
    keys = [k for k in next(iter(bearings.values())) if k != "name"]
    rows, data_keys = [], []
    for name, entry in bearings.items():
        rows.append([name, entry.get("name", ""), *(cell(k, entry.get(k)) for k in keys)])
        data_keys.append(["", "", *(f"bearings.{name}.{k}" for k in keys)])
    system = document["system"]
    rows.append(["pair (system)", "", *(cell(k, system.get(k)) if k in system else ""
                                        for k in keys)])
    data_keys.append(["", "", *(f"system.{k}" if k in system else "" for k in keys)])
    extra = [k for k in system if k not in keys]
    parts = [table(["", "bearing", *map(label, keys)], rows, "Spectrum lives and static safety",
                   data_keys)]
    if extra:
        parts.append(table(["system", *map(label, extra)],
                           [["pair", *(cell(k, system[k]) for k in extra)]],
                           keys=[["", *(f"system.{k}" for k in extra)]]))
    return section("results", "Results", "".join(parts) + scalars(document))


def scalars(document: dict) -> str:
    """Top-level single values of the check (mean speed, reliability factor a1, ...)."""
    skip = {"title", "source", "cautions", "warnings"}
    items = [(k, v) for k, v in document.items() if k not in skip
             and not isinstance(v, (dict, list))]
    if not items:
        return ""
    return "<dl>" + "".join(f'<dt>{escape(label(k))}</dt><dd data-key="{escape(k)}">'
                            f"{escape(cell(k, v))}</dd>" for k, v in items) + "</dl>"


def case_sections(document: dict) -> str:
    cases = document["cases"]
    blocks = [k for k in cases[0] if k != "bearings" and isinstance(cases[0][k], dict)]
    simple = [k for k in cases[0] if k not in ("name", "bearings", *blocks)
              and any(case.get(k) not in (None, [], "") for case in cases)]
    inputs = table(["case", *map(label, simple)],
                   [[case["name"], *(cell(k, case.get(k)) for k in simple)] for case in cases],
                   "Cases as evaluated (given and derived quantities)")
    parts = [inputs, per_case_table(cases, "bearings", "bearing",
                                    "Bearing loads and lives per case")]
    parts += [per_case_table(cases, key, "item", f"Per case: {label(key)}") for key in blocks]
    return section("cases", "Load cases", "".join(parts))


def per_case_table(cases: list[dict], key: str, item: str, caption: str) -> str:
    """Rows case x item for a per-case block of named entries (bearings, shaft sections)."""
    first = cases[0][key]
    if not all(isinstance(v, dict) for v in first.values()):
        columns = list(first)
        return table(["case", *map(label, columns)],
                     [[case["name"], *(cell(c, case[key].get(c)) for c in columns)]
                      for case in cases], caption)
    names = list(first)
    columns = list(dict.fromkeys(c for entry in first.values() for c in entry))
    rows = [[case["name"] if i == 0 else "", name,
             *(cell(c, case[key].get(name, {}).get(c)) for c in columns)]
            for case in cases for i, name in enumerate(names)]
    return table(["case", item, *map(label, columns)], rows, caption)


def nested_sections(document: dict) -> str:
    """Tables for any further result block (e.g. the shaft's sections)."""
    parts = []
    for key, value in document.items():
        if key in ("bearings", "system", "cases", "verdict", "dominant_case", "overall_verdict") \
                or not isinstance(value, dict):
            continue
        for sub, items in value.items():
            if isinstance(items, list) and items and all(isinstance(i, dict) for i in items):
                columns = list(items[0])
                parts.append(table([label(c) for c in columns],
                                   [[cell(c, item.get(c)) for c in columns] for item in items],
                                   f"{key}: {sub}",
                                   [[f"{key}.{sub}[{n}].{c}" for c in columns]
                                    for n, item in enumerate(items)]))
        flat = {k: v for k, v in value.items() if not isinstance(v, (list, dict))}
        if flat:
            parts.append(table(list(map(label, flat)), [[cell(k, v) for k, v in flat.items()]],
                               key))
    return section("more", "Further results", "".join(parts)) if parts else ""


def verdict_section(document: dict) -> str:
    verdict = document.get("verdict")
    if verdict is None:
        line = '<p class="verdict none">No target life given: no verdict.</p>'
    else:
        word, css = ("PASS", "pass") if verdict["passed"] else ("FAIL", "fail")
        relation = ">=" if verdict["passed"] else "<"
        unit = "" if verdict["life_h"] is None else " h"
        line = (f'<p class="verdict {css}"><strong>{word}</strong>: system '
                f'{escape(verdict["life"])}'
                f' = <span data-key="verdict.life_h">{cell("life_h", verdict["life_h"])}</span>'
                f'{unit} {relation} target {hours_with_unit(verdict["target_h"])}</p>')
    shares = damage_shares_of(document)
    dominant = shares.dominant(document)
    if dominant is not None:
        _, name, share = dominant
        line += (f"<p>Dominant case: <strong>{escape(name)}</strong> ({cell('share', share)} "
                 f"of the pair's damage, {shares.life}).</p>")
    return section("verdict", "Verdict", line + overall_verdict(document.get("overall_verdict")))


def overall_verdict(overall) -> str:
    """Every checked item against its limit (bearings, shaft, supplier curve), when given."""
    if not isinstance(overall, dict) or not isinstance(overall.get("items"), list):
        return ""
    word, css = ("PASS", "pass") if overall.get("passed") else ("FAIL", "fail")
    rows = []
    for item in overall["items"]:
        rows.append([str(item.get("item", "")), item_text(item, item.get("value")),
                     item_text(item, item.get("limit")),
                     margin_text(item), "pass" if item.get("passed") else "FAIL"])
    return (f'<p class="verdict {css}" data-key="overall_verdict.passed"><strong>{word}</strong>'
            f" overall: every item below against its limit</p>"
            + table(["item", "value", "limit", "load margin", ""], rows))


def item_text(item: dict, value) -> str:
    """A value or limit of the overall verdict as its kind reads: a life, a utilisation
    (null: not assessed, off the supplier's curve) or a safety factor (null: infinite)."""
    if item.get("unit") == "h":
        return hours_with_unit(value)
    if item.get("at_most"):
        return "not assessed" if value is None else share(value)
    return safety(value)


def margin_text(item: dict) -> str:
    """The load margin; null is infinite for an item that passed, else not assessed."""
    margin = item.get("load_margin")
    return "–" if margin is None and not item.get("passed") else safety(margin)


def flags_section(document: dict) -> str:
    # The warnings already carry every case's flags ("Case 'name': ..."), so they are not
    # listed a second time from cases[].flags.
    items = [escape(w) for w in document.get("warnings", [])]
    body = ("<ul>" + "".join(f"<li>{i}</li>" for i in items) + "</ul>") if items \
        else "<p>No warnings or flags.</p>"
    return section("flags", "Warnings and flags", body)


def inputs_section(inputs: dict) -> str:
    parts = []
    for name, value in inputs.items():
        parts.append(input_table(name, value))
    return section("inputs", "Inputs (as written in the file)", "".join(parts))


def input_table(name: str, value) -> str:
    if isinstance(value, list) and value and all(isinstance(v, dict) for v in value):
        columns = list(dict.fromkeys(k for item in value for k in item))
        return table(columns, [[escape_input(item.get(c, "")) for c in columns]
                               for item in value], f"[[{name}]]")
    if isinstance(value, dict):
        flat = {k: v for k, v in value.items() if not isinstance(v, (dict, list))
                or (isinstance(v, list) and not any(isinstance(i, dict) for i in v))}
        parts = [table(["key", "value"], [[k, escape_input(v)] for k, v in flat.items()],
                       f"[{name}]")] if flat else []
        parts += [input_table(f"{name}.{k}", v) for k, v in value.items() if k not in flat]
        return "".join(parts)
    return table(["key", "value"], [[name, escape_input(value)]])


def escape_input(value) -> str:
    return ", ".join(map(str, value)) if isinstance(value, list) else str(value)


def section(anchor: str, heading: str, body: str) -> str:
    return f'<section id="{anchor}"><h2>{escape(heading)}</h2>{body}</section>'


def charts_section(document: dict) -> str:
    figures = [("damage", damage_share_figure(document)), ("loads", loads_figure(document))]
    body = "".join(f'<figure class="chart">{namespaced(svg_text(figure), prefix)}</figure>'
                   for prefix, figure in figures)
    return section("charts", "Charts", body)


def namespaced(svg: str, prefix: str) -> str:
    """Prefix every id of an inline SVG so that several charts on one page never collide."""
    svg = re.sub(r'id="([^"]+)"', rf'id="{prefix}-\1"', svg)
    return re.sub(r'(href="|url\()#([^")]+)', rf"\1#{prefix}-\2", svg)


def report_html(result: Result, inputs: dict) -> str:
    """The whole page of a check result; ``inputs`` is the file's parsed TOML."""
    return report_page(result_document(result), inputs)


def report_page(document: dict, inputs: dict) -> str:
    """The whole page of a check's JSON document."""
    try:
        tool = f"hubload {version('hubload')}"
    except PackageNotFoundError:
        tool = "hubload"
    caution = f'<aside class="caution"><strong>Caution.</strong> {escape(CAUTIONS)}</aside>'
    body = "".join([
        f"<header><h1>{escape(document['title'])}</h1><p class=\"source\">"
        f"{escape(document['source'])} · method {escape(document.get('method', ''))} · "
        f"{escape(tool)}</p></header>", caution,
        verdict_section(document), flags_section(document), summary_section(document),
        charts_section(document), case_sections(document), nested_sections(document),
        inputs_section(inputs), f"<footer>{caution}</footer>"])
    return (f'<!DOCTYPE html><html lang="en"><head><meta charset="utf-8">'
            f'<meta http-equiv="Content-Security-Policy" content="{POLICY}">'
            f'<meta name="viewport" content="width=device-width, initial-scale=1">'
            f"<title>hubload report: {escape(document['title'])}</title>"
            f"<style>{STYLE}</style></head><body><main>{body}</main></body></html>\n")
