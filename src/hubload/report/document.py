"""A small document model for outputs written both as Markdown and as a printable HTML page.

Blocks: headings, paragraphs, tables, numbered or bulleted lists and a caution box. Inline
text may carry **bold** and `code` spans, the only markup the renderers understand; every
other character is the user's text (escaped for HTML, table pipes escaped for Markdown).
"""

from __future__ import annotations

import html
import re
from dataclasses import dataclass

from hubload.report.usertext import one_line, plain

HTML_TAG_START = re.compile(r"<(?=[A-Za-z/!?])")     # "kappa < 0.1" stays as written
INLINE = re.compile(r"\*\*(.+?)\*\*|`([^`]+)`")


@dataclass(frozen=True)
class Heading:
    level: int
    text: str


@dataclass(frozen=True)
class Paragraph:
    text: str


@dataclass(frozen=True)
class Table:
    headers: tuple[str, ...]
    rows: tuple[tuple[str, ...], ...]
    caption: str = ""


@dataclass(frozen=True)
class Items:
    items: tuple[str, ...]
    numbered: bool = False


@dataclass(frozen=True)
class Caution:
    text: str


Block = Heading | Paragraph | Table | Items | Caution


def markdown_text(text: str) -> str:
    """User text in Markdown: one line (a line break in a name would end a heading or start
    one), and no raw HTML (a renderer would pass a tag through)."""
    return HTML_TAG_START.sub("&lt;", one_line(text))


def markdown_cell(text: str) -> str:
    return markdown_text(text).replace("|", "\\|")


def to_markdown(blocks: list[Block]) -> str:
    lines: list[str] = []
    for block in blocks:
        if isinstance(block, Heading):
            lines += ["#" * block.level + " " + markdown_text(block.text), ""]
        elif isinstance(block, Paragraph):
            lines += [markdown_text(block.text), ""]
        elif isinstance(block, Caution):
            lines += [f"> **Caution.** {markdown_text(block.text)}", ""]
        elif isinstance(block, Items):
            lines += [f"{index}. {markdown_text(item)}" if block.numbered
                      else f"- {markdown_text(item)}"
                      for index, item in enumerate(block.items, start=1)] + [""]
        else:
            if block.caption:
                lines += [markdown_text(block.caption), ""]
            lines += ["| " + " | ".join(map(markdown_cell, block.headers)) + " |",
                      "|" + " --- |" * len(block.headers)]
            lines += ["| " + " | ".join(map(markdown_cell, row)) + " |" for row in block.rows]
            lines.append("")
    return "\n".join(lines)


def inline_html(text: str) -> str:
    """Escaped text with **bold** and `code` spans as HTML (control characters out)."""
    text, parts, last = plain(text), [], 0
    for match in INLINE.finditer(text):
        parts.append(html.escape(text[last:match.start()]))
        bold, code = match.groups()
        parts.append(f"<strong>{html.escape(bold)}</strong>" if bold is not None
                     else f"<code>{html.escape(code)}</code>")
        last = match.end()
    parts.append(html.escape(text[last:]))
    return "".join(parts)


def to_html_sections(blocks: list[Block]) -> list[str]:
    """The blocks as HTML fragments (the page frame adds header, cautions and style)."""
    out = []
    for block in blocks:
        if isinstance(block, Heading):
            out.append(f"<h{block.level}>{inline_html(block.text)}</h{block.level}>")
        elif isinstance(block, Paragraph):
            out.append(f"<p>{inline_html(block.text)}</p>")
        elif isinstance(block, Caution):
            out.append(f'<aside class="caution"><strong>Caution.</strong> '
                       f"{inline_html(block.text)}</aside>")
        elif isinstance(block, Items):
            tag = "ol" if block.numbered else "ul"
            out.append(f"<{tag}>" + "".join(f"<li>{inline_html(i)}</li>" for i in block.items)
                       + f"</{tag}>")
        else:
            head = "".join(f"<th>{inline_html(h)}</th>" for h in block.headers)
            body = "".join("<tr>" + "".join(f"<td>{inline_html(c)}</td>" for c in row) + "</tr>"
                           for row in block.rows)
            caption = f"<caption>{inline_html(block.caption)}</caption>" if block.caption else ""
            out.append(f'<div class="scroll"><table class="document">{caption}<thead><tr>{head}'
                       f"</tr></thead><tbody>{body}</tbody></table></div>")
    return out
