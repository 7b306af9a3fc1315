"""The numbers of a supplier brief, from one file's check results.

Required dynamic ratings are solved inversely on the engine itself, for whichever
life the verdict uses (L10, or L10m when lubrication is given): the closed form
C (L_target / L)^(1/p) is tried first -- p = 10/3 for ISO 281 lives, p = 4 for the
refined method's ISO/TS 16281 lives, whose factor applies to the rating from the
geometry -- and kept when the engine confirms it hits the target; otherwise (a
life that is not a pure power of C, e.g. L10m) scipy's brentq finds the rating
factor on the engine's life.
"""

from __future__ import annotations

import dataclasses
import math
from dataclasses import dataclass

import numpy as np

from hubload.domain.study import Study
from hubload.engine import Result, evaluate
from hubload.engine.verdict import life_exponent
from hubload.model import requirements
from hubload.model.kinematics import kmh_to_rpm

CLOSED_FORM_RTOL = 1e-9
BRACKET_STEPS = 40


@dataclass(frozen=True)
class Solve:
    """A rating factor k on C and how it was found; None when the target is out of reach.

    ``on_geometry``: the factor applies to the rating from the internal geometry (the
    refined method rates the bearing from it), not to the C typed in the file.
    """

    factor: float | None
    method: str
    note: str = ""
    on_geometry: bool = False


def scaled(study: Study, factors: dict[str, float]) -> Study:
    """The study with each named bearing's dynamic rating C multiplied by its factor.

    The rating from the internal geometry is scaled too: the refined method's lamina
    capacities follow it, so its lives respond to the factor as the ISO 281 ones do.
    """
    bearings = {label: dataclasses.replace(
        bearing, dynamic_rating_n=bearing.dynamic_rating_n * factors.get(label, 1.0),
        geometry_rating_factor=bearing.geometry_rating_factor * factors.get(label, 1.0))
        for label, bearing in study.pair.bearings().items()}
    return dataclasses.replace(study, pair=dataclasses.replace(study.pair, **bearings))


def life_at(study: Study, factors: dict[str, float], whose: str) -> float:
    """The governing life [h] of ``whose`` ("system" or a bearing label), ratings scaled."""
    governing = evaluate(scaled(study, factors), with_findings=False).governing
    return float(governing.life_h if whose == "system" else governing.bearing_life_h(whose))


def solve_factor(study: Study, labels: tuple[str, ...], whose: str, target_h: float) -> Solve:
    """Factor k on the C of ``labels`` so that the life of ``whose`` equals ``target_h``.

    Under the refined method the factor applies to the rating from the geometry.
    """
    on_geometry = study.method == "refined"

    def scaled_life(k: float) -> float:
        return life_at(study, {label: k for label in labels}, whose)

    now = scaled_life(1.0)
    if math.isinf(now) or now <= 0:
        return Solve(None, "none", "no fatigue damage: every rating meets the target")
    exponent = life_exponent(evaluate(study, with_findings=False).governing)
    guess = (target_h / now) ** (1.0 / exponent)
    if math.isclose(scaled_life(guess), target_h, rel_tol=CLOSED_FORM_RTOL):
        return Solve(guess, "closed form", on_geometry=on_geometry)

    def excess(k: float) -> float:
        value = scaled_life(k)
        return math.inf if math.isinf(value) else math.log(value / target_h)

    if math.isclose(scaled_life(2.0), now, rel_tol=1e-12):
        return Solve(None, "none", "the life does not depend on the rating C")

    low, high = guess, guess
    for _ in range(BRACKET_STEPS):
        if excess(low) < 0 < excess(high):
            from scipy.optimize import brentq  # here only: importing it takes 0.4 s

            return Solve(brentq(excess, low, high, xtol=1e-14, rtol=4 * np.finfo(float).eps),
                         "brentq", on_geometry=on_geometry)
        low, high = low / 2, high * 2
    return Solve(None, "none", "the target is out of reach by this rating alone")


@dataclass(frozen=True)
class Extreme:
    value: float
    case: str


def extreme(values, names) -> Extreme:
    """The largest value and the name of its case."""
    index = int(np.argmax(values))
    return Extreme(float(values[index]), names[index])


def least(values, names) -> Extreme:
    """The smallest value and the name of its case."""
    index = int(np.argmin(values))
    return Extreme(float(values[index]), names[index])


@dataclass(frozen=True)
class BearingNeeds:
    label: str
    name: str
    max_radial: Extreme
    max_axial: Extreme
    equivalent_load_n: float
    life_h: float                  # the governing life now (inf: no fatigue damage)
    dynamic_rating_n: float
    geometry_rating_n: float | None
    alone: Solve
    both: Solve
    this_only: Solve
    max_static: Extreme
    static_rating_n: float
    static_safety: float
    required_static_rating_n: float


@dataclass(frozen=True)
class Requirements:
    study: Study
    result: Result
    target_h: float | None
    required_s0: float
    bearings: tuple[BearingNeeds, ...]
    moment: Extreme
    speed_min: Extreme | None
    speed_max: Extreme | None
    standstill_share: float

    def rpm_to_kmh(self, rpm: float) -> float:
        return rpm / float(kmh_to_rpm(1.0, self.study.wheel.rolling_radius_m))


def geometry_rating_n(result: Result, label: str) -> float | None:
    rated = result.geometry_ratings.get(label)
    return None if rated is None else float(rated.dynamic_n)


SEARCHES_PER_BEARING = 3      # alone, both bearings, this one for the system


def bearing_needs(study: Study, result: Result, label: str, target_h: float | None,
                  required_s0: float, searched=lambda: None) -> BearingNeeds:
    """What the bearing ``label`` needs; ``searched()`` after each root search."""
    bearing, found, names = study.pair.bearings()[label], result.bearings[label], \
        study.cases.names
    others = tuple(other for other in result.bearings if other != label)
    unsolved = Solve(None, "none", "no target life given")

    def solve(labels, whose):
        solved = solve_factor(study, labels, whose, target_h) if target_h is not None \
            else unsolved
        searched()
        return solved

    max_static = extreme(found.static_equivalent_n, names)
    return BearingNeeds(
        label=label, name=bearing.label,
        max_radial=extreme(found.radial_n, names), max_axial=extreme(found.axial_n, names),
        equivalent_load_n=float(requirements.spectrum_equivalent_load_n(
            study.cases.time_fraction, study.cases.speed_rpm, found.equivalent_n)),
        life_h=float(result.governing.bearing_life_h(label)),
        dynamic_rating_n=float(bearing.dynamic_rating_n),
        geometry_rating_n=geometry_rating_n(result, label),
        alone=solve((label,), label), both=solve((label, *others), "system"),
        this_only=solve((label,), "system"),
        max_static=max_static, static_rating_n=float(bearing.static_rating_n),
        static_safety=float(found.static_safety),
        required_static_rating_n=float(requirements.required_static_rating_n(
            max_static.value, required_s0)))


def requirements_of(study: Study, required_s0: float, on_progress=None) -> Requirements:
    """The brief's numbers; ``on_progress(done, total)`` after each root search (each
    evaluates the study a dozen times or more)."""
    result = evaluate(study)
    searches = [0, SEARCHES_PER_BEARING * len(result.bearings)]

    def searched() -> None:
        searches[0] += 1
        if on_progress is not None:
            on_progress(*searches)

    target = study.target_life_h
    cases = study.cases
    moments = requirements.wheel_moment_nm(0.0, cases.wheel_load_n, cases.side_force_n,
                                           cases.tractive_force_n, study.wheel.offset_m,
                                           study.wheel.loaded_radius_m)
    turning = cases.speed_rpm > 0
    names_turning = [name for name, turns in zip(cases.names, turning) if turns]
    return Requirements(
        study=study, result=result, target_h=target, required_s0=required_s0,
        bearings=tuple(bearing_needs(study, result, label, target, required_s0, searched)
                       for label in result.bearings),
        moment=extreme(moments, cases.names),
        speed_min=least(cases.speed_rpm[turning], names_turning) if any(turning) else None,
        speed_max=extreme(cases.speed_rpm, cases.names) if any(turning) else None,
        standstill_share=float(np.sum(cases.time_fraction[~turning])))
