"""The brief's open questions for the supplier, each tied to the number that raised it."""

from __future__ import annotations

import numpy as np

from hubload.report import numbers
from hubload.report.brief.sections import kn, lowest_kappa, rating, speed_text
from hubload.report.brief.shaft import shaft_questions
from hubload.report.document import Items
from hubload.report.specs.assembly import band_line
from hubload.studies.requirements import BearingNeeds, Requirements
from hubload.units import KN, MM, UM


def setting_assumption(needs: Requirements) -> str:
    """What the lives assume about the bearing setting, by method."""
    result = needs.result
    setting = result.setting
    if setting.assembly_m is not None:
        assembly, tolerance = float(setting.assembly_m) / UM, float(setting.tolerance_m) / UM
        operating = np.asarray(setting.operating_m) / UM
        text = (f"The file gives an assembly setting of {assembly:g} +/- {tolerance:g} um "
                f"({numbers.setting_kind(assembly)}, {setting.basis}); with its fits and "
                f"temperatures the cases run at {operating.min():+.0f} to {operating.max():+.0f} "
                f"um in operation.")
        band = band_line(result)
        return f"{text} {band}" if band else text
    if needs.study.method != "refined":
        return "The pair rule used here assumes a line-to-line setting."
    setting_um = float(np.asarray(setting.operating_m).flat[0]) / UM
    return (f"The refined lives here assume an axial setting of {setting_um:g} um "
            f"({numbers.setting_kind(setting_um)}) in operation.")


def worst(bearings: tuple[BearingNeeds, ...], key) -> BearingNeeds:
    return max(bearings, key=key)


def questions_blocks(needs: Requirements) -> list:
    axial = worst(needs.bearings, lambda b: b.max_axial.value)
    items = []
    if needs.speed_min is not None:
        kappa = lowest_kappa(needs)
        film = "" if kappa is None else f"; kappa = {kappa[0]:.3g} ({kappa[2]}, '{kappa[1]}')"
        slow = needs.speed_min
        items.append(("Low-speed lubrication", f"lowest speed {speed_text(needs, slow.value)} "
                      f"in '{slow.case}'{film}",
                      "Which oil film and which life factor do you expect at this speed in the "
                      "motor's hydraulic oil? Is surface distress or wear, not fatigue, the "
                      "limit?"))
    items.append(("Bearing setting", f"max axial load {kn(axial.max_axial.value)} on the "
                  f"{axial.label} bearing in '{axial.max_axial.case}'",
                  f"{setting_assumption(needs)} Which end play or preload do you set at "
                  "assembly, with which tolerance, and how does the life change over that "
                  "range?"))
    items.append(curve_question(needs))
    if needs.speed_max is not None:
        items.append(("Seals", f"highest speed {speed_text(needs, needs.speed_max.value)} in "
                      f"'{needs.speed_max.case}'; {100 * needs.standstill_share:.1f} % standstill",
                      "Which shaft seal suits this speed, the motor's case pressure and a dirty, "
                      "wet site? What is its expected life, and does it need a dust lip?"))
    items += rating_questions(needs) + shaft_questions(needs)
    return [Items(tuple(f"**{topic}** (raised by: {number}). {question}"
                        for topic, number, question in items), numbered=True)]


def curve_question(needs: Requirements) -> tuple[str, str, str]:
    shaft = needs.result.shaft
    permissible = None if shaft is None else shaft.permissible
    utilisation = float(np.nanmax(permissible.utilisation)) \
        if permissible is not None and bool(permissible.inside) else None
    used = "" if utilisation is None else f"; {100 * utilisation:.0f} % of the curve in the file"
    return ("Permissible load curve", f"wheel moment {needs.moment.value / KN:,.2f} kN m at the "
            f"mounting face in '{needs.moment.case}', wheel offset "
            f"{needs.study.wheel.offset_m / MM:g} mm{used}",
            "Please send the motor's permissible radial load against load position and confirm "
            "that every case lies inside it.")


def rating_questions(needs: Requirements) -> list[tuple[str, str, str]]:
    items = []
    short = [b for b in needs.bearings if b.both.factor is not None and b.both.factor > 1]
    if short:
        items.append(("Dynamic rating", "; ".join(
            f"{b.label} C {rating(b.both, b).split(' (')[0]} needed, "
            f"{kn(b.geometry_rating_n if b.both.on_geometry else b.dynamic_rating_n)} "
            f"{'from the geometry' if b.both.on_geometry else 'given'}" for b in short),
            "Is a bearing with this rating available in the same envelope?"))
    static = worst(needs.bearings, lambda b: b.required_static_rating_n / b.static_rating_n)
    items.append(("Static capacity", f"P0 up to {kn(static.max_static.value)} on the "
                  f"{static.label} bearing in '{static.max_static.case}', s0 = "
                  f"{numbers.safety(static.static_safety)}",
                  f"Is s0 >= {needs.required_s0:g} enough for shocks on site, and do the ratings "
                  "C and C0 hold as mounted (housing, shaft hardness)?"))
    return items
