"""The supplier brief as Markdown: requirement summary and open questions, each tied to a number."""

from __future__ import annotations

import numpy as np

from hubload.report import numbers
from hubload.report.cautions import CAUTIONS
from hubload.report.messages import warning_texts
from hubload.studies.requirements import BearingNeeds, Requirements, Solve
from hubload.report.specs.assembly import band_line
from hubload.units import KN, MM, UM



def kn(newtons: float) -> str:
    return f"{newtons / KN:,.2f} kN"


def life_label(needs: Requirements) -> str:
    return needs.result.governing.symbol


def rating(solve: Solve, bearing: BearingNeeds) -> str:
    if solve.factor is None:
        return f"- ({solve.note})"
    base = bearing.geometry_rating_n if solve.on_geometry else bearing.dynamic_rating_n
    basis = ", on the geometry rating" if solve.on_geometry else ""
    return f"{kn(solve.factor * base)} (x{solve.factor:.3f}, {solve.method}{basis})"


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


def speed_text(needs: Requirements, rpm: float) -> str:
    return f"{rpm:.1f} r/min ({needs.rpm_to_kmh(rpm):.1f} km/h)"


def duty_section(needs: Requirements) -> list[str]:
    study, pair = needs.study, needs.study.pair
    spread_mm = (pair.outboard.position_m - pair.inboard.position_m) / MM
    target = ("not given ([project] target_life_h)" if needs.target_h is None else
              f"{numbers.hours_with_unit(needs.target_h)} ({life_label(needs)} of the pair, system life)")
    rows = [("target life", target),
            ("arrangement", f"{pair.arrangement}, bearing spread {spread_mm:g} mm (load centres "
                            f"at {pair.outboard.position_m / MM:g} mm and "
                            f"{pair.inboard.position_m / MM:g} mm from the mounting face)"),
            ("wheel", f"offset {study.wheel.offset_m / MM:g} mm from the mounting face, loaded "
                      f"radius {study.wheel.loaded_radius_m / MM:g} mm, rolling radius "
                      f"{study.wheel.rolling_radius_m / MM:g} mm"),
            ("load cases", f"{len(study.cases)}: " + "; ".join(
                f"'{name}' {100 * share:.3g} %" for name, share in
                zip(study.cases.names, study.cases.time_fraction)))]
    if needs.speed_max is not None:
        rows.append(("speed range", f"{speed_text(needs, needs.speed_min.value)} to "
                                    f"{speed_text(needs, needs.speed_max.value)}"))
    mean = float(needs.result.mean_speed_rpm)
    rows.append(("mean speed (time-weighted)", speed_text(needs, mean)))
    rows.append(("standstill", f"{100 * needs.standstill_share:.1f} % of the time "
                               "(static loads only)"))
    return ["## 1. Duty", "", "| item | value |", "| --- | --- |",
            *(f"| {name} | {value} |" for name, value in rows), ""]


def bearing_rows(needs: Requirements) -> list[tuple[str, list[str]]]:
    def each(text) -> list[str]:
        return [text(b) for b in needs.bearings]

    life = life_label(needs)
    mean = float(needs.result.mean_speed_rpm)
    s0 = f"{needs.required_s0:g}"
    return [
        ("bearing", each(lambda b: b.name)),
        ("max radial load Fr", each(lambda b: f"{kn(b.max_radial.value)} ({b.max_radial.case})")),
        ("max axial load Fa", each(lambda b: f"{kn(b.max_axial.value)} ({b.max_axial.case})")),
        (f"equivalent load of the spectrum Pm at the mean speed {mean:.1f} r/min",
         each(lambda b: kn(b.equivalent_load_n))),
        (f"{life} now", each(lambda b: numbers.hours_with_unit(b.life_h))),
        *iso281_rows(needs),
        ("dynamic rating C given", each(lambda b: kn(b.dynamic_rating_n))),
        *((("C from the internal geometry", each(lambda b: kn(b.geometry_rating_n))),)
          if all(b.geometry_rating_n is not None for b in needs.bearings) else ()),
        (f"C for the pair's {life} = target (both C scaled by one factor)",
         each(lambda b: rating(b.both, b))),
        (f"C for the pair's {life} = target (the other bearing as given)",
         each(lambda b: rating(b.this_only, b))),
        (f"C for this bearing's own {life} = target",
         each(lambda b: rating(b.alone, b))),
        ("max static equivalent load P0", each(lambda b: f"{kn(b.max_static.value)} "
                                                          f"({b.max_static.case})")),
        ("static rating C0 given (s0 now)",
         each(lambda b: f"{kn(b.static_rating_n)} (s0 = {numbers.safety(b.static_safety)})")),
        (f"C0 for s0 >= {s0}", each(lambda b: kn(b.required_static_rating_n))),
    ]


def bearing_section(needs: Requirements) -> list[str]:
    labels = [b.label for b in needs.bearings]
    lines = ["## 2. Loads and required ratings per bearing", "",
             "| | " + " | ".join(labels) + " |", "| --- |" + " --- |" * len(labels)]
    lines += [f"| {name} | " + " | ".join(cells) + " |" for name, cells in bearing_rows(needs)]
    lines += ["", "Pm is the constant load that does the spectrum's damage at the mean speed "
              "(revolution-weighted 10/3-mean of P; standstill cases turn no revolutions). "
              "Required C values are solved on the same calculation as `hubload check`: "
              "closed form C (L_target / L)^(1/p) when the engine confirms it (p = 10/3 for "
              "ISO 281 lives; p = 4 for the refined method's ISO/TS 16281 lives, on the "
              "rating from the geometry), else a root search (brentq).", ""]
    shaft = needs.result.lowest_shaft_safety
    if shaft is not None:
        lines += [f"Shaft: lowest fatigue safety factor over its sections "
                  f"{numbers.safety(shaft)} (see `hubload check`).", ""]
    return lines


def iso281_rows(needs: Requirements) -> list[tuple[str, list[str]]]:
    """With the refined method: the ISO 281 rule's lives beside the refined ones."""
    lives = needs.result.iso281
    if lives is None:
        return []
    governing = needs.result.governing
    iso = governing.candidates[0]
    return [(f"{iso.symbol} by the ISO 281 rule (beside the refined {governing.candidates[1].symbol})",
             [numbers.hours_with_unit(iso.bearing_life_h[b.label]) for b in needs.bearings])]


def moment_section(needs: Requirements) -> list[str]:
    wheel = needs.study.wheel
    return ["## 3. Wheel moment at the mounting face", "",
            f"Largest bending moment of the tyre forces about the mounting face (x = 0): "
            f"**{needs.moment.value / KN:,.2f} kN m** in case '{needs.moment.case}' "
            f"(wheel offset {wheel.offset_m / MM:g} mm, loaded radius "
            f"{wheel.loaded_radius_m / MM:g} mm; wheel load, side force and tractive force "
            "combined; the drive torque about the axis is not included).", ""] + torque_lines(needs)


def torque_lines(needs: Requirements) -> list[str]:
    """The largest drive torque of the motor, where the check derives it (operating points)."""
    points = needs.study.cases.operating
    torque = np.abs(np.nan_to_num(points.torque_nm, nan=0.0)) if points is not None else None
    if torque is None or not np.any(torque > 0):
        return []
    index = int(np.argmax(torque))
    return [f"Largest drive torque at the wheel: {torque[index] / KN:,.2f} kN m in case "
            f"'{needs.study.cases.names[index]}'.", ""]


def lubrication_section(needs: Requirements, inputs: dict) -> list[str]:
    lines = ["## 4. Lubrication assumptions", ""]
    given = inputs.get("lubrication")
    if isinstance(given, dict):
        lines.append("As given in the file's [lubrication] table: " + ", ".join(
            f"{key} = {value}" for key, value in given.items()) + ".")
        kappa = lowest_kappa(needs)
        if kappa is not None:
            value, case, label, outside = kappa
            lines.append(f"Lowest viscosity ratio: kappa = {value:.3g} ({label} bearing, "
                         f"case '{case}')" + (", outside ISO 281's scope (kappa < 0.1)."
                                              if outside else "."))
    else:
        lines.append("No [lubrication] table: lives are basic ratings L10, as if the oil film "
                     "separated the surfaces and the oil were of normal cleanliness (aISO = 1). "
                     "At the low speeds of a wheel drive this is not assured.")
    return [*lines, ""]


def lowest_kappa(needs: Requirements):
    """(kappa, case name, bearing label, outside ISO 281's scope) of the lowest kappa."""
    modified = needs.result.modified
    if modified is None:
        return None
    names = needs.study.cases.names
    found = [(float(b.kappa[i]), names[i], label, bool(b.kappa_outside_scope[i]))
             for label, b in modified.bearings.items() for i in range(len(names))
             if np.isfinite(b.kappa[i])]
    return min(found) if found else None


def worst(bearings: tuple[BearingNeeds, ...], key) -> BearingNeeds:
    return max(bearings, key=key)


def questions(needs: Requirements) -> list[str]:
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
    shaft = needs.result.shaft
    permissible = None if shaft is None else shaft.permissible
    utilisation = float(np.nanmax(permissible.utilisation)) \
        if permissible is not None and bool(permissible.inside) else None
    used = "" if utilisation is None else f"; {100 * utilisation:.0f} % of the curve in the file"
    items.append(("Permissible load curve", f"wheel moment {needs.moment.value / KN:,.2f} kN m at "
                  f"the mounting face in '{needs.moment.case}', wheel offset "
                  f"{needs.study.wheel.offset_m / MM:g} mm{used}",
                  "Please send the motor's permissible radial load against load position and "
                  "confirm that every case lies inside it."))
    if needs.speed_max is not None:
        items.append(("Seals", f"highest speed {speed_text(needs, needs.speed_max.value)} in "
                      f"'{needs.speed_max.case}'; {100 * needs.standstill_share:.1f} % standstill",
                      "Which shaft seal suits this speed, the motor's case pressure and a dirty, "
                      "wet site? What is its expected life, and does it need a dust lip?"))
    items += rating_questions(needs)
    return [f"{n}. **{topic}** (raised by: {number}). {question}"
            for n, (topic, number, question) in enumerate(items, start=1)]


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


def brief_markdown(needs: Requirements, inputs: dict) -> str:
    """The whole sheet; ``inputs`` is the file's parsed TOML (for the tables it quotes)."""
    lines = [f"# Supplier brief: {needs.study.title}", "",
             f"From `{needs.study.source}` by hubload ({needs.result.method} "
             f"method). Loads are those of the ground on the tyre on this wheel; signs as in "
             "hubload's docs/conventions.md.", "",
             f"> **Caution.** {CAUTIONS} This sheet is an input to the supplier's own "
             "calculation, not a replacement for it.", ""]
    lines += duty_section(needs) + bearing_section(needs) + moment_section(needs)
    lines += lubrication_section(needs, inputs)
    lines += ["## 5. Open questions for the supplier", "", *questions(needs), ""]
    warnings = warning_texts(needs.result.findings, needs.study.cases.names)
    if warnings:
        lines += ["## 6. Warnings from the check", "", *(f"- {w}" for w in warnings), ""]
    lines += ["## Cautions", "", CAUTIONS, ""]
    return "\n".join(lines)
