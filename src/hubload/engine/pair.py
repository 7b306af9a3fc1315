"""The pair's loads and lives by one method: the ISO 281 rule, or the refined load distribution.

Everything is numpy-vectorised over the case axis (the last one); study parameters may
carry leading batch axes (parameter studies).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from hubload.domain.study import Bearing, Study
from hubload.engine import modified_life
from hubload.model import iso281, statics, tapered_pair
from hubload.model.kinematics import distance_km

if TYPE_CHECKING:
    from hubload.engine import refined_method

LABELS = ("outboard", "inboard")


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
class MethodLives:
    """The pair's lives by one method: basic (L10 or the reference life L10r) and, with
    lubrication, modified; each bearing's loads, lives, damage shares and s0."""

    method: str                                   # "iso281" or "refined"
    bearings: dict[str, BearingResult]
    system_life_h: np.ndarray
    system_life_km: np.ndarray
    system_damage_share: np.ndarray
    modified: modified_life.ModifiedLife | None


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


def per_study_km(life_h, mean_rpm, study: Study) -> np.ndarray:
    """Distance [km] of per-study lives; the rolling radius of a batched study is (..., 1)."""
    return distance_km(np.expand_dims(life_h, -1), np.expand_dims(mean_rpm, -1),
                       study.wheel.rolling_radius_m)[..., 0]


def rule_case_life(bearing: Bearing, radial_n, axial_n, speed_rpm):
    """P [N] and L10 [h] per case by the ISO 281 rule from the bearing's loads [N]."""
    equivalent = iso281.equivalent_dynamic_load_n(radial_n, axial_n, bearing.e, bearing.y)
    return equivalent, iso281.life_hours(
        iso281.basic_rating_life_mrev(bearing.dynamic_rating_n, equivalent), speed_rpm)


def bearing_result(bearing: Bearing, radial_n, axial_n, study: Study, mean_rpm,
                   refined: refined_method.RefinedBearing | None = None) -> BearingResult:
    """ISO 281 lives from the loads, or the refined method's lives and Pref when given."""
    cases = study.cases
    static_equivalent = iso281.equivalent_static_load_n(radial_n, axial_n, bearing.y0)
    if refined is None:
        equivalent, case_life_h = rule_case_life(bearing, radial_n, axial_n, cases.speed_rpm)
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


def method_lives(study: Study, mean_rpm,
                 refined: refined_method.RefinedPair | None = None) -> MethodLives:
    """The pair's lives by the ISO 281 rule, or from the refined solution when given."""
    forces = bearing_forces(study) if refined is None else {
        label: (found.radial_n, found.axial_n) for label, found in refined.bearings.items()}
    given = study.pair.bearings()
    bearings = {label: bearing_result(given[label], radial, axial, study, mean_rpm,
                                      None if refined is None else refined.bearings[label])
                for label, (radial, axial) in forces.items()}
    system_h = iso281.system_life(*(b.life_h for b in bearings.values()))

    def to_km(life_h):
        return per_study_km(life_h, mean_rpm, study)

    modified = modified_life.evaluate_modified(
        study, {label: b.equivalent_n for label, b in bearings.items()},
        {label: b.case_life_h for label, b in bearings.items()}, to_km)
    return MethodLives(
        method="iso281" if refined is None else "refined", bearings=bearings,
        system_life_h=system_h, system_life_km=to_km(system_h),
        system_damage_share=iso281.system_damage_shares(
            [b.life_h for b in bearings.values()], [b.damage_share for b in bearings.values()]),
        modified=modified)
