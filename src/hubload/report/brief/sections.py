"""The brief's sections of facts: duty, every load case, motor demands, bearings, moment, oil."""

from __future__ import annotations

import numpy as np

from hubload.report import numbers
from hubload.report.document import Paragraph, Table
from hubload.studies.requirements import BearingNeeds, Requirements, Solve
from hubload.units import BAR, CELSIUS_ZERO_K, KN, LPM, MM


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


def speed_text(needs: Requirements, rpm: float) -> str:
    return f"{rpm:.1f} r/min ({needs.rpm_to_kmh(rpm):.1f} km/h)"


def duty_blocks(needs: Requirements) -> list:
    study, pair = needs.study, needs.study.pair
    spread_mm = (pair.outboard.position_m - pair.inboard.position_m) / MM
    target = ("not given ([project] target_life_h)" if needs.target_h is None else
              f"{numbers.hours_with_unit(needs.target_h)} ({life_label(needs)} of the pair, "
              f"system life; {needs.result.governing.basis})")
    rows = [("target life", target),
            ("arrangement", f"{pair.arrangement}, bearing spread {spread_mm:g} mm (load centres "
                            f"at {pair.outboard.position_m / MM:g} mm and "
                            f"{pair.inboard.position_m / MM:g} mm from the mounting face)"),
            ("wheel", f"offset {study.wheel.offset_m / MM:g} mm from the mounting face, loaded "
                      f"radius {study.wheel.loaded_radius_m / MM:g} mm, rolling radius "
                      f"{study.wheel.rolling_radius_m / MM:g} mm"),
            ("load cases", f"{len(study.cases)} (table below)")]
    if needs.speed_max is not None:
        rows.append(("speed range", f"{speed_text(needs, needs.speed_min.value)} to "
                                    f"{speed_text(needs, needs.speed_max.value)}"))
    rows.append(("mean speed (time-weighted)", speed_text(needs, float(needs.result.mean_speed_rpm))))
    rows.append(("standstill", f"{100 * needs.standstill_share:.1f} % of the time "
                               "(static loads only)"))
    return [Table(("item", "value"), tuple(rows))]


def case_blocks(needs: Requirements) -> list:
    """Every case as the calculation used it (after the adhesion cap), for the supplier to redo."""
    study = needs.study
    cases, points = study.cases, study.cases.operating
    headers = ["case", "time %", "n r/min", "v km/h", "wheel load kN", "side force kN (+ inboard)",
               "tractive force kN"]
    columns = [[f"{100 * t:.3g}" for t in cases.time_fraction],
               [f"{n:.1f}" for n in cases.speed_rpm],
               [f"{needs.rpm_to_kmh(n):.1f}" for n in cases.speed_rpm],
               [f"{w / KN:.2f}" for w in cases.wheel_load_n],
               [f"{s / KN:.2f}" for s in cases.side_force_n],
               [f"{f / KN:.2f}" for f in cases.tractive_force_n]]
    if study.lubrication is not None:
        headers.append("bearing temperature C")
        columns.append([f"{t - CELSIUS_ZERO_K:.0f}" for t in study.lubrication.temperature_k])
    if points is not None and np.any(np.isfinite(points.pressure_pa)):
        headers += ["pressure bar", "flow l/min"]
        columns += [[numbers.fixed(0)(p / BAR) for p in points.pressure_pa],
                    [numbers.fixed(1)(q / LPM) for q in points.flow_m3s]]
    rows = tuple((name, *(column[i] for column in columns))
                 for i, name in enumerate(cases.names))
    return [Table(tuple(headers), rows)]


def motor_blocks(needs: Requirements) -> list:
    """The highest pressure, flow, torque and speed the spectrum asks of the motor."""
    study = needs.study
    points, names = study.cases.operating, study.cases.names
    if points is None:
        return []
    rows = []
    for what, values, text in (
            ("pressure difference", np.abs(points.pressure_pa), lambda v: f"{v / BAR:.0f} bar"),
            ("flow", points.flow_m3s, lambda v: f"{v / LPM:.1f} l/min"),
            ("torque at the wheel", np.abs(points.torque_nm), lambda v: f"{v / KN:,.2f} kN m"),
            ("speed", study.cases.speed_rpm, lambda v: speed_text(needs, v))):
        values = np.asarray(values, dtype=float)
        if np.any(np.isfinite(values) & (values > 0)):
            index = int(np.nanargmax(values))
            rows.append((f"highest {what}", text(values[index]), names[index]))
    if study.motor is not None:
        rated = [f"{label} {value}" for label, value in (
            ("max_pressure_bar =", None if study.motor.max_pressure_pa is None
             else f"{study.motor.max_pressure_pa / BAR:g}"),
            ("max_speed_rpm =", None if study.motor.max_speed_rpm is None
             else f"{study.motor.max_speed_rpm:g}")) if value is not None]
        if rated:
            rows.append(("ratings in the file", ", ".join(rated), ""))
    return [Table(("demand", "value", "case"), tuple(rows))] if rows else []


def bearing_rows(needs: Requirements) -> list[tuple[str, ...]]:
    def each(text) -> list[str]:
        return [text(b) for b in needs.bearings]

    life = life_label(needs)
    mean = float(needs.result.mean_speed_rpm)
    s0 = f"{needs.required_s0:g}"
    rows = [
        ("bearing", each(lambda b: b.name)),
        ("max radial load Fr", each(lambda b: f"{kn(b.max_radial.value)} ({b.max_radial.case})")),
        ("max axial load Fa", each(lambda b: f"{kn(b.max_axial.value)} ({b.max_axial.case})")),
        (f"equivalent load of the spectrum Pm at the mean speed {mean:.1f} r/min",
         each(lambda b: kn(b.equivalent_load_n))),
        (f"{life} now", each(lambda b: numbers.hours_with_unit(b.life_h))),
        *other_method_rows(needs),
        ("dynamic rating C given", each(lambda b: kn(b.dynamic_rating_n))),
        *((("C from the internal geometry", each(lambda b: kn(b.geometry_rating_n))),)
          if all(b.geometry_rating_n is not None for b in needs.bearings) else ()),
        (f"C for the pair's {life} = target (both C scaled by one factor)",
         each(lambda b: rating(b.both, b))),
        (f"C for the pair's {life} = target (the other bearing as given)",
         each(lambda b: rating(b.this_only, b))),
        (f"C for this bearing's own {life} = target", each(lambda b: rating(b.alone, b))),
        ("max static equivalent load P0", each(lambda b: f"{kn(b.max_static.value)} "
                                                          f"({b.max_static.case})")),
        ("static rating C0 given (s0 now)",
         each(lambda b: f"{kn(b.static_rating_n)} (s0 = {numbers.safety(b.static_safety)})")),
        (f"C0 for s0 >= {s0}", each(lambda b: kn(b.required_static_rating_n))),
    ]
    return [(name, *cells) for name, cells in rows]


def other_method_rows(needs: Requirements) -> list[tuple[str, list[str]]]:
    """With the refined method: the other method's lives beside the governing ones."""
    other = needs.result.governing.other()
    if other is None:
        return []
    return [(f"{other.symbol} ({'ISO 281 rule' if other.method == 'iso281' else 'refined'}, "
             f"beside)", [numbers.hours_with_unit(other.bearing_life_h[b.label])
                          for b in needs.bearings])]


def bearing_blocks(needs: Requirements) -> list:
    return [Table(("", *(b.label for b in needs.bearings)), tuple(bearing_rows(needs))),
            Paragraph("Pm is the constant load that does the spectrum's damage at the mean speed "
                      "(revolution-weighted 10/3-mean of P; standstill cases turn no "
                      "revolutions). Required C values are solved on the same calculation as "
                      "`hubload check`: closed form C (L_target / L)^(1/p) when the engine "
                      "confirms it (p = 10/3 for ISO 281 lives; p = 4 for the refined method's "
                      "ISO/TS 16281 lives, on the rating from the geometry), else a root search "
                      "(brentq).")]


def moment_blocks(needs: Requirements) -> list:
    wheel = needs.study.wheel
    return [Paragraph(f"Largest bending moment of the tyre forces about the mounting face "
                      f"(x = 0): **{needs.moment.value / KN:,.2f} kN m** in case "
                      f"'{needs.moment.case}' (wheel offset {wheel.offset_m / MM:g} mm, loaded "
                      f"radius {wheel.loaded_radius_m / MM:g} mm; wheel load, side force and "
                      f"tractive force combined; the drive torque about the axis is not "
                      f"included).")]


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


def lubrication_blocks(needs: Requirements, inputs: dict) -> list:
    given = inputs.get("lubrication")
    if not isinstance(given, dict):
        return [Paragraph("No [lubrication] table: lives are basic ratings L10, as if the oil "
                          "film separated the surfaces and the oil were of normal cleanliness "
                          "(aISO = 1). At the low speeds of a wheel drive this is not assured.")]
    lines = ["As given in the file's [lubrication] table: " + ", ".join(
        f"{key} = {value}" for key, value in given.items()) + "."]
    kappa = lowest_kappa(needs)
    if kappa is not None:
        value, case, label, outside = kappa
        lines.append(f"Lowest viscosity ratio: kappa = {value:.3g} ({label} bearing, case "
                     f"'{case}')" + (", outside ISO 281's scope (kappa < 0.1)." if outside
                                     else "."))
    friction = needs.result.friction
    if friction is not None:
        lines.append(f"Friction (Palmgren, f0 = {friction.f0:g}): mean power loss of the pair "
                     f"{float(friction.mean_power_w):.1f} W over the spectrum.")
    return [Paragraph(" ".join(lines))]
