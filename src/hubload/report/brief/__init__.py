"""The supplier brief: what a motor supplier needs to redo the calculation and answer.

Built once as document blocks (report.document) and written as Markdown or as a printable
HTML page with the same content: the duty, every load case, the motor's demands, the loads
and required ratings, the shaft's results, the setting, the lubrication, and the open
questions, each tied to the number that raised it.
"""

from __future__ import annotations

from hubload.report.brief.questions import questions_blocks
from hubload.report.brief.sections import (bearing_blocks, case_blocks, duty_blocks,
                                           lubrication_blocks, moment_blocks, motor_blocks)
from hubload.report.brief.shaft import shaft_blocks
from hubload.report.cautions import CAUTIONS
from hubload.report.document import Caution, Heading, Items, Paragraph
from hubload.report.messages import warning_texts
from hubload.studies.requirements import Requirements


SHEET_ROLE = "This sheet is an input to the supplier's own calculation, not a replacement for it."


def brief_blocks(needs: Requirements, inputs: dict) -> list:
    """The whole sheet; ``inputs`` is the file's parsed TOML (for the tables it quotes)."""
    study = needs.study
    numbered = [("Duty", duty_blocks(needs)), ("Load cases", case_blocks(needs)),
                ("Motor demands", motor_blocks(needs)),
                ("Loads and required ratings per bearing", bearing_blocks(needs)),
                ("Wheel moment at the mounting face", moment_blocks(needs)),
                ("Shaft", shaft_blocks(needs)),
                ("Lubrication assumptions", lubrication_blocks(needs, inputs)),
                ("Open questions for the supplier", questions_blocks(needs))]
    blocks = [Heading(1, f"Supplier brief: {study.title}"),
              Paragraph(f"From `{study.source}` by hubload ({needs.result.method} method). Loads "
                        f"are those of the ground on the tyre on this wheel; signs as in "
                        f"hubload's docs/conventions.md."),
              Caution(f"{CAUTIONS} {SHEET_ROLE}")]
    number = 0
    for title, section in numbered:
        if section:
            number += 1
            blocks += [Heading(2, f"{number}. {title}"), *section]
    warnings = warning_texts(needs.result.findings, study.cases.names)
    if warnings:
        blocks += [Heading(2, f"{number + 1}. Warnings from the check"), Items(tuple(warnings))]
    return blocks + [Heading(2, "Cautions"), Paragraph(CAUTIONS)]
