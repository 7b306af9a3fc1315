"""What a study's results should make a user stop and look at, as structured records.

Each :class:`Finding` names its kind, the case (and bearing or shaft section) it
concerns and the values behind it; the words are written by the report layer
(``hubload.report.messages``), once per kind. The engine decides *whether*
something is worth a warning here, in one place, for single studies (batched
studies are picked point by point first).
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field

import numpy as np

from hubload.domain.study import Study
from hubload.model import lubrication as lub
from hubload.model.friction import load_torque_nm

STATIC_SAFETY_WARNING = 2.0          # common practice minimum s0 for roller bearings with shocks
RATING_DEVIATION_WARNING = 0.15      # ratings from the geometry this far from the typed ones
STATIC_RATING_PRESSURE_PA = 4000e6   # ISO 76:2006 basis of C0 for roller bearings
OPERATING_FLAGS = ("slip", "tyre_slides", "pressure_above_rating", "speed_above_rating")


@dataclass(frozen=True)
class Finding:
    """One warning: its kind, where it applies and the numbers behind it (SI units)."""

    kind: str
    case: int | None = None          # case index; None: the study as a whole
    subject: str | None = None       # bearing label, shaft section name, rating symbol ...
    values: Mapping[str, object] = field(default_factory=dict)


def operating_findings(study: Study) -> list[Finding]:
    """The per-case flags of how the cases were built (adhesion, friction circle, ratings)."""
    points = study.cases.operating
    if points is None:
        return []
    found = []
    masks = {"slip": points.slips, "tyre_slides": points.tyre_slides,
             "pressure_above_rating": points.pressure_above_rating,
             "speed_above_rating": points.speed_above_rating}
    flagged = np.flatnonzero(np.logical_or.reduce(list(masks.values())))
    for index in flagged:
        i = int(index)
        for kind, mask in masks.items():
            if mask[i]:
                found.append(Finding(kind, i, values=flag_values(study, kind, i)))
    return found


def flag_values(study: Study, kind: str, index: int) -> dict:
    points = study.cases.operating
    if kind == "slip":
        return {"force_n": float(points.tractive_force_n[index]),
                "demand_n": float(points.tractive_demand_n[index])}
    if kind == "tyre_slides":
        return {"combined_n": float(np.hypot(points.tractive_force_n[index],
                                             points.side_force_n[index])),
                "limit_n": float(points.adhesion_limit_n[index])}
    if kind == "pressure_above_rating":
        return {"pressure_pa": float(abs(points.pressure_pa[index])),
                "rating_pa": float(points.max_pressure_pa),
                "given": bool(points.hydraulic[index])}
    return {"speed_rpm": float(points.speed_rpm[index]),
            "rating_rpm": float(points.max_speed_rpm)}


def case_flags(study: Study) -> list[list[Finding]]:
    """The operating flags of each case, in case order (for per-case tables and JSON)."""
    flags: list[list[Finding]] = [[] for _ in range(len(study.cases))]
    for finding in operating_findings(study):
        flags[finding.case].append(finding)
    return flags


def static_findings(study: Study, bearings: Mapping) -> list[Finding]:
    found = []
    if not np.any(study.cases.speed_rpm > 0):
        found.append(Finding("all_standstill"))
    for label, result in bearings.items():
        s0 = float(result.static_safety)
        if s0 < STATIC_SAFETY_WARNING:
            worst = int(np.argmax(result.static_equivalent_n))
            found.append(Finding("static_safety_low", worst, label,
                                 {"s0": s0, "limit": STATIC_SAFETY_WARNING}))
    return found


def modified_findings(modified) -> list[Finding]:
    """kappa below ISO 281's scope per case; an oil too thin for the Walther form."""
    if modified is None:
        return []
    found = []
    outside = {label: b.kappa_outside_scope for label, b in modified.bearings.items()}
    for index in np.flatnonzero(np.logical_or.reduce(list(outside.values()))):
        i = int(index)
        found.append(Finding("kappa_outside_scope", i, values={
            label: float(modified.bearings[label].kappa[i])
            for label, mask in outside.items() if mask[i]}))
    thin = np.asarray(modified.viscosity_m2_s) < lub.WALTHER_LOWEST_VISCOSITY_M2_S
    if np.any(thin):
        found.append(Finding("thin_oil", values={
            "viscosity_m2_s": float(np.min(modified.viscosity_m2_s)),
            "limit_m2_s": lub.WALTHER_LOWEST_VISCOSITY_M2_S}))
    return found


def rating_findings(study: Study, geometry_ratings: Mapping) -> list[Finding]:
    """Ratings from the internal geometry more than 15 % away from the typed ones."""
    found = []
    for label, rated in geometry_ratings.items():
        bearing = study.pair.bearings()[label]
        for symbol, standard, geometric, typed in (
                ("C", "ISO 281", rated.dynamic_n, bearing.dynamic_rating_n),
                ("C0", "ISO 76", rated.static_n, bearing.static_rating_n)):
            deviation = float(geometric) / float(typed) - 1.0
            if abs(deviation) > RATING_DEVIATION_WARNING:
                found.append(Finding("rating_deviation", None, label, {
                    "symbol": symbol, "standard": standard, "geometry_n": float(geometric),
                    "typed_n": float(typed), "deviation": deviation}))
    return found


def refined_findings(refined) -> list[Finding]:
    """Cases without equilibrium; contact pressures above the level C0 is based on."""
    if refined is None:
        return []
    found = [Finding("no_equilibrium", index) for index in refined.unsolved_cases()]
    for label, bearing in refined.bearings.items():
        worst = int(np.argmax(bearing.max_contact_pressure_pa))
        peak = float(bearing.max_contact_pressure_pa[worst])
        if peak > STATIC_RATING_PRESSURE_PA:
            found.append(Finding("contact_pressure_high", worst, label,
                                 {"pressure_pa": peak, "limit_pa": STATIC_RATING_PRESSURE_PA}))
    return found


def shaft_findings(study: Study, shaft) -> list[Finding]:
    """Sections placed where no bending acts; the supplier's curve not reached or exceeded."""
    if shaft is None:
        return []
    found = []
    inboard_m = float(study.pair.inboard.position_m)
    for section in study.shaft.sections:
        if float(section.position_m) <= inboard_m:
            found.append(Finding("shaft_section_inboard", None, section.name,
                                 {"position_m": float(section.position_m)}))
    permissible = shaft.permissible
    if permissible is None:
        return found
    curve = study.shaft.permissible
    if not bool(permissible.inside):
        found.append(Finding("offset_outside_curve", values={
            "offset_m": float(permissible.position_m),
            "first_m": float(curve.load_position_m[0]),
            "last_m": float(curve.load_position_m[-1])}))
        return found
    for index in np.flatnonzero(permissible.utilisation > 1.0):
        found.append(Finding("permissible_exceeded", int(index), values={
            "utilisation": float(permissible.utilisation[index])}))
    return found


def methods_findings(study: Study, governing) -> list[Finding]:
    """The refined method and the ISO 281 rule disagree on pass or fail against the target."""
    target = study.target_life_h
    if target is None or len(governing.candidates) < 2:
        return []
    iso = governing.candidates[0]
    refined = min(governing.candidates[1:], key=lambda c: float(c.system_life_h))
    iso_h, refined_h = float(iso.system_life_h), float(refined.system_life_h)
    if (iso_h >= target) == (refined_h >= target):
        return []
    return [Finding("methods_disagree", values={
        "iso281_symbol": iso.symbol, "iso281_life_h": iso_h,
        "refined_symbol": refined.symbol, "refined_life_h": refined_h, "target_h": target,
        "governing_symbol": governing.symbol, "rule": governing.rule})]


PRELOAD_FRICTION_RATIO = 1.25   # load friction this much above the external load's


def setting_findings(result) -> list[Finding]:
    """An end play that turns into preload in operation, or a preload into end play; a tight
    cup that comes loose; a preload that drives the bearings' load friction well above the
    external load's."""
    setting = result.setting
    if setting is None or setting.assembly_m is None:
        return []
    found = []
    operating = np.asarray(setting.operating_m)
    assembly_m = float(setting.assembly_m)
    changed = operating < 0 if assembly_m > 0 else operating > 0 if assembly_m < 0 else None
    kind = "setting_becomes_preload" if assembly_m > 0 else "setting_loses_preload"
    for index in [] if changed is None else np.flatnonzero(changed):
        found.append(Finding(kind, int(index), values={
            "assembly_m": assembly_m, "operating_m": float(operating[index])}))
    for label, lost in setting.cup_fit_lost.items():
        cases = np.flatnonzero(np.broadcast_to(lost, operating.shape))
        if cases.size:
            found.append(Finding("cup_fit_lost", int(cases[0]), label,
                                 {"cases": float(cases.size)}))
    return found + rule_setting_findings(result, operating) + preload_friction_findings(result)


def rule_setting_findings(result, operating_m) -> list[Finding]:
    """Lives by the ISO 281 rule alone: it takes the pair at zero clearance, so the file's
    operating setting (the reason a [pair.setting] is given) does not enter them."""
    if result.refined is not None or operating_m.size == 0:
        return []
    worst = int(np.argmax(np.abs(operating_m)))
    return [Finding("setting_outside_the_rule", worst, values={
        "low_m": float(np.min(operating_m)), "high_m": float(np.max(operating_m))})]


def preload_friction_findings(result) -> list[Finding]:
    if result.friction is None or result.iso281 is None:
        return []
    found = []
    preloaded = np.asarray(result.setting.operating_m) < 0
    for label, friction in result.friction.bearings.items():
        external = result.iso281.bearings[label]
        given = result.study.pair.bearings()[label]
        external_nm = load_torque_nm(external.radial_n, external.axial_n, given.y,
                                     given.mean_diameter_m)
        with np.errstate(divide="ignore", invalid="ignore"):
            ratio = np.where(external_nm > 0, np.asarray(friction.load_nm) / external_nm, 1.0)
        steep = preloaded & (ratio > PRELOAD_FRICTION_RATIO)
        if np.any(steep):
            worst = int(np.argmax(np.where(steep, ratio, 0.0)))
            found.append(Finding("preload_raises_friction", worst, label,
                                 {"ratio": float(ratio[worst])}))
    return found


def one_sided_findings(study: Study) -> list[Finding]:
    """Every case with a side force has it on the same side: a wheel end sees both (turns
    both ways, slopes both ways), and the inside wheel of a turn can be the harder case."""
    side = np.asarray(study.cases.side_force_n, dtype=float)
    loaded = np.abs(side) > 0
    if not np.any(loaded) or (np.any(side[loaded] > 0) and np.any(side[loaded] < 0)):
        return []
    return [Finding("one_sided_side_force", values={
        "inboard": bool(np.all(side[loaded] > 0)), "cases": float(np.sum(loaded))})]


def collect(result) -> tuple[Finding, ...]:
    """Every finding of a single study's result, in the order the outputs list them."""
    study = result.study
    return tuple(
        operating_findings(study) + static_findings(study, result.bearings)
        + modified_findings(result.modified) + rating_findings(study, result.geometry_ratings)
        + refined_findings(result.refined) + setting_findings(result)
        + shaft_findings(study, result.shaft) + methods_findings(study, result.governing)
        + one_sided_findings(study))
