"""Orchestrates a study: cases -> bearing loads -> lives -> damage -> verdict.

This package module holds the pair's loads and ISO 281 lives; its siblings add the
modified life (``modified_life``), the refined load distribution (``refined_method``),
the shaft check (``shaftcheck``) and the one verdict over bearings and shaft (``overall``).

Everything is numpy-vectorised over the case axis (the last one). Study
parameters may be arrays that broadcast against it, which is how parameter
studies evaluate many variants in one call.
"""

from __future__ import annotations

from dataclasses import dataclass, field, replace

import numpy as np

from hubload.engine import modified_life, refined_method, shaftcheck
from hubload.domain.batch import picker, stack_studies
from hubload.domain.study import Bearing, Study
from hubload.model import iso281, statics, tapered_pair
from hubload.model.kinematics import distance_km

STATIC_SAFETY_WARNING = 2.0


@dataclass(frozen=True)
class BearingResult:
    """One bearing over the spectrum; per-case arrays end in the case axis."""

    radial_n: np.ndarray
    axial_n: np.ndarray
    equivalent_n: np.ndarray
    static_equivalent_n: np.ndarray
    case_life_h: np.ndarray
    damage_share: np.ndarray
    life_h: np.ndarray
    life_km: np.ndarray
    static_safety: np.ndarray


@dataclass(frozen=True)
class Result:
    study: Study
    bearings: dict[str, BearingResult]
    system_life_h: np.ndarray
    system_life_km: np.ndarray
    system_damage_share: np.ndarray
    mean_speed_rpm: np.ndarray
    warnings: list[str] = field(default_factory=list)
    a1: np.ndarray | float = 1.0                       # ISO 281 a1, per study
    modified: modified_life.ModifiedLife | None = None  # with [lubrication] only
    shaft: shaftcheck.ShaftResult | None = None
    refined: refined_method.RefinedPair | None = None   # method = "refined" only
    geometry_ratings: dict = field(default_factory=dict)  # label -> C, C0 from the geometry

    @property
    def dominant_case(self) -> int:
        """Index of the case with the largest share of the pair's damage."""
        return int(np.argmax(self.system_damage_share, axis=-1))


def bearing_forces(study: Study) -> dict[str, tuple[np.ndarray, np.ndarray]]:
    """Radial and axial load [N] of each bearing per case (ISO 281 rule for the pair)."""
    cases, wheel, pair = study.cases, study.wheel, study.pair
    radial_o, radial_i = statics.radial_loads(
        cases.wheel_load_n, cases.side_force_n, cases.tractive_force_n, wheel.offset_m,
        wheel.loaded_radius_m, pair.outboard.position_m, pair.inboard.position_m)
    axial_o, axial_i = tapered_pair.axial_loads(
        radial_o, pair.outboard.y, radial_i, pair.inboard.y,
        statics.external_axial_force_n(cases.side_force_n), pair.arrangement)
    return {"outboard": (radial_o, axial_o), "inboard": (radial_i, axial_i)}


def mean_speed_rpm(study: Study) -> np.ndarray:
    """Time-weighted mean wheel speed [r/min] of the spectrum."""
    return np.sum(study.cases.time_fraction * study.cases.speed_rpm, axis=-1)


def bearing_result(bearing: Bearing, radial_n, axial_n, study: Study,
                   mean_rpm, refined: refined_method.RefinedBearing | None = None) -> BearingResult:
    """ISO 281 lives from the loads, or the refined method's lives and Pref when given."""
    cases = study.cases
    static_equivalent = iso281.equivalent_static_load_n(radial_n, axial_n, bearing.y0)
    if refined is None:
        equivalent = iso281.equivalent_dynamic_load_n(radial_n, axial_n, bearing.e, bearing.y)
        case_life_h = iso281.life_hours(
            iso281.basic_rating_life_mrev(bearing.dynamic_rating_n, equivalent), cases.speed_rpm)
    else:
        equivalent, case_life_h = refined.reference_load_n, refined.case_life_h
    damage = iso281.damage_rate_per_hour(cases.time_fraction, case_life_h)
    life_h = iso281.spectrum_life_h(damage)
    return BearingResult(
        radial_n=radial_n, axial_n=axial_n, equivalent_n=equivalent,
        static_equivalent_n=static_equivalent, case_life_h=case_life_h,
        damage_share=iso281.damage_shares(damage), life_h=life_h,
        life_km=per_study_km(life_h, mean_rpm, study),
        static_safety=iso281.static_safety(
            bearing.static_rating_n, np.max(static_equivalent, axis=-1, keepdims=True))[..., 0])


def per_study_km(life_h, mean_rpm, study: Study) -> np.ndarray:
    """Distance [km] of per-study lives; the rolling radius of a batched study is (..., 1)."""
    return distance_km(np.expand_dims(life_h, -1), np.expand_dims(mean_rpm, -1),
                       study.wheel.rolling_radius_m)[..., 0]


def system_damage_share(bearings: dict[str, BearingResult]) -> np.ndarray:
    """Each case's share of the pair's damage (iso281.system_damage_shares)."""
    return iso281.system_damage_shares([b.life_h for b in bearings.values()],
                                       [b.damage_share for b in bearings.values()])


def evaluate(study: Study, with_warnings: bool = True) -> Result:
    """Loads, ISO 281 lives, damage shares and static safety of the pair.

    ``with_warnings=False`` skips the per-case warning texts (measured logs
    evaluate millions of samples as cases and report their flags as shares).
    """
    mean_rpm = mean_speed_rpm(study)
    refined = refined_method.solve(study) if study.method == "refined" else None
    forces = bearing_forces(study) if refined is None else {
        label: (found.radial_n, found.axial_n) for label, found in refined.bearings.items()}
    bearings = {
        label: bearing_result(study.pair.bearings()[label], radial, axial, study, mean_rpm,
                              None if refined is None else refined.bearings[label])
        for label, (radial, axial) in forces.items()}
    system_h = iso281.system_life(*(b.life_h for b in bearings.values()))
    modified = modified_life.evaluate_modified(
        study, {label: b.equivalent_n for label, b in bearings.items()},
        {label: b.case_life_h for label, b in bearings.items()},
        lambda life_h: per_study_km(life_h, mean_rpm, study))
    single = np.ndim(system_h) == 0 and (modified is None or np.ndim(modified.system_life_h) == 0)
    shaft = shaftcheck.evaluate_shaft(study, lambda life_h: per_study_km(life_h, mean_rpm, study))
    return Result(
        study=study, bearings=bearings, system_life_h=system_h,
        system_life_km=per_study_km(system_h, mean_rpm, study),
        system_damage_share=system_damage_share(bearings), mean_speed_rpm=mean_rpm,
        warnings=collect_warnings(study, bearings, modified, refined, shaft)
        if single and with_warnings else [],
        a1=modified_life.per_study(modified_life.reliability_life_factor(study)),
        modified=modified, shaft=shaft, refined=refined,
        geometry_ratings=refined_method.geometry_ratings(study))


def evaluate_many(studies: list[Study]) -> list[Result]:
    """Evaluate variants of a study in one batched call (domain.batch stacks them).

    The variants must share their structure (case count, choices); each returned
    Result is the point's own, with its study and warnings, as from evaluate().
    """
    batched = evaluate(stack_studies(studies))
    take = picker(batched, len(studies), studies)
    results = []
    for index, study in enumerate(studies):
        point = take(index)
        results.append(replace(point, warnings=collect_warnings(
            study, point.bearings, point.modified, point.refined, point.shaft)))
    return results


def collect_warnings(study: Study, bearings: dict[str, BearingResult],
                     modified: modified_life.ModifiedLife | None = None,
                     refined: refined_method.RefinedPair | None = None,
                     shaft: shaftcheck.ShaftResult | None = None) -> list[str]:
    """Plain-language warnings for a single study (no parameter arrays)."""
    warnings = []
    if study.cases.operating is not None:
        warnings.extend(study.cases.operating.warnings(study.cases.names))
    if not np.any(study.cases.speed_rpm > 0):
        warnings.append("Every case is at standstill: no fatigue life can be computed; "
                        "only the static safety applies.")
    for label, result in bearings.items():
        s0 = float(result.static_safety)
        if s0 < STATIC_SAFETY_WARNING:
            worst = study.cases.names[int(np.argmax(result.static_equivalent_n))]
            warnings.append(
                f"Static safety s0 = {s0:.2f} of the {label} bearing under case '{worst}' is "
                f"below {STATIC_SAFETY_WARNING:g} (common practice minimum for roller bearings "
                f"with shock loads{'; below 1 the raceways deform permanently' if s0 < 1 else ''}).")
    warnings.extend(modified_life.warnings(modified, study.cases.names))
    warnings.extend(refined_method.warnings(study, refined))
    warnings.extend(shaftcheck.shaft_warnings(study, shaft))
    return warnings


@dataclass(frozen=True)
class Verdict:
    life_name: str
    life_h: float
    target_h: float
    passed: bool
    basis: str = ""


def verdict(result: Result) -> Verdict | None:
    """System life against the project's target life, or None without a target.

    The modified life when lubrication is given, else a1 L10 (L10 at 90 %).
    """
    target = result.study.target_life_h
    if target is None:
        return None
    name, life, basis = modified_life.verdict_life(result.study, result.modified,
                                                   result.a1 * result.system_life_h)
    return Verdict(life_name=name, life_h=float(life), target_h=target,
                   passed=float(life) >= target, basis=basis)
