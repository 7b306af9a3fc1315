"""The supplier brief as a printable HTML page: the same content as the Markdown sheet."""

from __future__ import annotations

from hubload.report.brief import brief_blocks
from hubload.report.brief import SHEET_ROLE
from hubload.report.document import Caution, Heading, Paragraph, to_html_sections
from hubload.report.html.page import page
from hubload.studies.requirements import Requirements


def brief_html(needs: Requirements, inputs: dict) -> str:
    blocks = brief_blocks(needs, inputs)
    title = blocks[0].text if isinstance(blocks[0], Heading) else needs.study.title
    # the page carries the cautions at its top and foot; the sheet's own remark stays
    kept = [Paragraph(f"**{SHEET_ROLE}**") if isinstance(b, Caution) else b for b in blocks[1:]]
    body = "".join(to_html_sections(kept))
    return page(title, f"{needs.study.source} · supplier brief", [body])
