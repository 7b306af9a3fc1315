"""The brief's shaft section: every check item with its limit and verdict, and the items the
supplier must answer (those that fail or could not be assessed)."""

from __future__ import annotations

import math

from hubload.report.document import Paragraph, Table
from hubload.report.specs.shaft import item_limit, item_value
from hubload.studies.requirements import Requirements


def shaft_items(needs: Requirements) -> list:
    """The overall verdict's items other than the bearing life."""
    overall = needs.result.overall
    if overall is None or needs.result.shaft is None:
        return []
    return [item for item in overall.items if item.kind != "bearing_life"]


def verdict_word(item) -> str:
    if math.isnan(float(item.value)):
        return "not assessed"
    return "pass" if item.passed else "FAIL"


def shaft_blocks(needs: Requirements) -> list:
    items = shaft_items(needs)
    if not items:
        return [Paragraph("No [shaft] table in the file: the shaft and the motor's permissible "
                          "load are not checked here (see the questions).")]
    rows = tuple((item.name, item_value(item), item_limit(item), verdict_word(item))
                 for item in items)
    shaft = needs.study.shaft
    return [Table(("item", "value", "limit", "result"), rows),
            Paragraph(f"Shaft check by Shigley's Mechanical Engineering Design, 10th ed. "
                      f"({needs.result.shaft.criterion} criterion, required safety "
                      f"{float(shaft.required_safety):g}; steel Sut {float(shaft.ultimate_pa) / 1e6:g} "
                      f"MPa, Sy {float(shaft.yield_pa) / 1e6:g} MPa, surface {shaft.surface}).")]


def shaft_questions(needs: Requirements) -> list[tuple[str, str, str]]:
    """A question for every shaft item that fails or was not assessed."""
    found = []
    for item in shaft_items(needs):
        word = verdict_word(item)
        if word == "pass":
            continue
        if item.kind == "permissible_load":
            question = ("Is the wheel position inside your released envelope? Please give the "
                        "permissible radial load at this offset." if word == "not assessed" else
                        "The case(s) lie above your permissible load curve: which measures "
                        "(bearing, shaft, offset) do you propose?")
        else:
            question = ("Please confirm the section's material, heat treatment, fillet and "
                        "surface, and your own safety for these loads; which stronger shaft "
                        "design do you offer?")
        found.append((f"Shaft: {item.name}", f"{item_value(item)} against {item_limit(item)}",
                      question))
    return found
