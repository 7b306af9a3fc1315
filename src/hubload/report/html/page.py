"""The frame every HTML page of hubload shares: escaping, tables from specs, sections, cautions.

Everything is inline (CSS, SVG charts with text drawn as paths); a content security
policy forbids every outside resource, so the page renders the same offline and in print.
"""

from __future__ import annotations

import html
import re
from importlib.metadata import PackageNotFoundError, version

from hubload.report.cautions import CAUTIONS
from hubload.report.columns import TableSpec
from hubload.report.html.style import STYLE
from hubload.report.plots import svg_text
from hubload.report.usertext import plain

POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:"


def escape(text) -> str:
    """User text for HTML: control characters and escape sequences out (HTML 5 does not
    allow them in text), markup characters escaped."""
    return html.escape(plain(text), quote=True)


def spec_table(spec: TableSpec, caption: str | None = None) -> str:
    """A table spec as an HTML table: first column as row headers, data keys on the cells."""
    head = "".join(f"<th>{escape(c.heading)}</th>" for c in spec.columns)
    body = []
    for row in range(spec.row_count):
        cells = []
        for index, column in enumerate(spec.columns):
            key = spec.data_key(row, column)
            attributes = (f' data-key="{escape(key)}"' if key else "") + \
                (' class="alert"' if column.alerted(row) else "")
            tag = "th" if index == 0 else "td"
            cells.append(f"<{tag}{attributes}>{escape(column.cell(row))}</{tag}>")
        body.append("<tr>" + "".join(cells) + "</tr>")
    title = caption if caption is not None else spec.title
    notes = [spec.omitted_note] if spec.omitted_note else []
    notes += ["; ".join(spec.legend()) + "."] if spec.legend() else []
    notes += list(spec.notes)
    after = "".join(f'<p class="note">{escape(line)}</p>' for line in notes)
    return (f'<div class="scroll"><table><caption>{escape(title)}</caption><thead><tr>{head}'
            f"</tr></thead><tbody>{''.join(body)}</tbody></table></div>{after}")


def section(anchor: str, heading: str, body: str) -> str:
    return f'<section id="{anchor}"><h2>{escape(heading)}</h2>{body}</section>'


def figure_html(figure, prefix: str) -> str:
    return f'<figure class="chart">{namespaced(svg_text(figure), prefix)}</figure>'


def namespaced(svg: str, prefix: str) -> str:
    """Prefix every id of an inline SVG so that several charts on one page never collide."""
    svg = re.sub(r'id="([^"]+)"', rf'id="{prefix}-\1"', svg)
    return re.sub(r'(href="|url\()#([^")]+)', rf"\1#{prefix}-\2", svg)


def tool_name() -> str:
    try:
        return f"hubload {version('hubload')}"
    except PackageNotFoundError:
        return "hubload"


def page(title: str, subtitle: str, sections: list[str]) -> str:
    """A whole page: header, cautions at the top and at the foot, the sections between."""
    caution = f'<aside class="caution"><strong>Caution.</strong> {escape(CAUTIONS)}</aside>'
    body = "".join([f"<header><h1>{escape(title)}</h1><p class=\"source\">{escape(subtitle)} · "
                    f"{escape(tool_name())}</p></header>", caution, *sections,
                    f"<footer>{caution}</footer>"])
    return (f'<!DOCTYPE html><html lang="en"><head><meta charset="utf-8">'
            f'<meta http-equiv="Content-Security-Policy" content="{POLICY}">'
            f'<meta name="viewport" content="width=device-width, initial-scale=1">'
            f"<title>hubload report: {escape(title)}</title>"
            f"<style>{STYLE}</style></head><body><main>{body}</main></body></html>\n")
