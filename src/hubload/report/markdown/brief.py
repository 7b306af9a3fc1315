"""The supplier brief as Markdown (its content: hubload.report.brief)."""

from __future__ import annotations

from hubload.report.brief import brief_blocks
from hubload.report.document import to_markdown
from hubload.studies.requirements import Requirements


def brief_markdown(needs: Requirements, inputs: dict) -> str:
    """The whole sheet; ``inputs`` is the file's parsed TOML (for the tables it quotes)."""
    return to_markdown(brief_blocks(needs, inputs))
