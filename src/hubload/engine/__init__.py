"""Orchestrates a study: cases -> bearing loads -> lives -> governing life -> verdict.

Siblings: ``pair`` (loads and lives by one method), ``modified_life``, ``refined_method``,
``shaftcheck``, ``governing`` (which life the verdict judges, decided once), ``verdict``
(the bearing verdict and the overall one) and ``findings`` (structured warnings).

Everything is numpy-vectorised over the case axis (the last one). Study parameters may
be arrays that broadcast against it, which is how parameter studies evaluate many
variants in one call; :func:`evaluate_many` picks the points back out.
"""

from __future__ import annotations

from dataclasses import dataclass, field, replace
from functools import cached_property
from typing import TYPE_CHECKING

import numpy as np

from hubload.domain.batch import picker, stack_studies
from hubload.domain.study import Study
from hubload.engine import findings, finite, modified_life, verdict
from hubload.engine.findings import STATIC_SAFETY_WARNING
from hubload.engine.governing import GoverningLife, govern
from hubload.engine.pair import BearingResult, MethodLives, mean_speed_rpm, method_lives, \
    per_study_km
from hubload.engine.setting import OperatingSetting, band_ends, operating_setting
from hubload.progress import in_parts

if TYPE_CHECKING:  # the shaft, refined and friction modules load only when a study uses them
    from hubload.engine import refined_method, shaftcheck
    from hubload.engine.friction import Friction

__all__ = ["STATIC_SAFETY_WARNING", "BearingResult", "MethodLives", "Result", "evaluate",
           "evaluate_many"]


@dataclass(frozen=True)
class Result:
    """A study's results. ``bearings`` and the system lives are those of the study's method
    (ISO 281 rule, or the refined load distribution); with the refined method ``iso281``
    holds the ISO 281 rule's lives beside them. ``governing`` is the life every output
    judges; ``findings`` the structured warnings (single studies)."""

    study: Study
    bearings: dict[str, BearingResult]
    system_life_h: np.ndarray
    system_life_km: np.ndarray
    system_damage_share: np.ndarray
    mean_speed_rpm: np.ndarray
    governing: GoverningLife
    a1: np.ndarray | float = 1.0                       # ISO 281 a1, per study
    modified: modified_life.ModifiedLife | None = None  # with [lubrication] only
    shaft: shaftcheck.ShaftResult | None = None
    refined: refined_method.RefinedPair | None = None   # method = "refined" only
    iso281: MethodLives | None = None                   # the ISO 281 rule beside the refined
    geometry_ratings: dict = field(default_factory=dict)  # label -> C, C0 from the geometry
    findings: tuple[findings.Finding, ...] = ()
    setting: OperatingSetting | None = None              # each case's axial setting
    band: tuple[MethodLives, MethodLives] | None = None  # refined lives at the band's ends
    friction: Friction | None = None                     # with [lubrication] only

    @property
    def method(self) -> str:
        return "iso281" if self.refined is None else "refined"

    @property
    def dominant_case(self) -> int | None:
        """The case with the largest damage share on the governing basis (single study)."""
        return self.governing.dominant_case

    @cached_property
    def verdict(self) -> verdict.Verdict | None:
        """The governing system life against the target (single study)."""
        return verdict.bearing_verdict(self.study, self.governing)

    @cached_property
    def overall(self) -> verdict.OverallVerdict | None:
        """Every check with a limit: bearings, shaft, supplier's curve (single study)."""
        return verdict.overall_verdict(self.study, self.governing, self.shaft)

    @property
    def lowest_static_safety(self) -> float:
        """The lower s0 of the two bearings (single study)."""
        return min(float(b.static_safety) for b in self.bearings.values())

    @property
    def lowest_shaft_safety(self) -> np.ndarray | None:
        """The lowest fatigue safety over the shaft's sections, per study; None without."""
        if self.shaft is None or not self.shaft.sections:
            return None
        sections = np.broadcast_arrays(*(np.asarray(s.min_safety, dtype=float)
                                         for s in self.shaft.sections))
        return np.min(np.stack(sections), axis=0)


def evaluate(study: Study, with_findings: bool = True, on_progress=None) -> Result:
    """Loads, lives, governing life, damage shares, static safety and shaft of a study.

    ``with_findings=False`` skips the warning records (batched studies, and measured
    logs that evaluate millions of samples as cases and report their flags as shares).
    ``on_progress(done, total)`` is called as the refined method's blocks of cases are
    solved (hubload.progress); the ISO 281 rule takes milliseconds per 10,000 cases.
    """
    mean_rpm = mean_speed_rpm(study)
    setting = operating_setting(study)
    solves = in_parts(on_progress, 3 if setting.band else 1)
    refined = solve_refined(study, setting.operating_m, solves[0]) \
        if study.method == "refined" else None
    lives = method_lives(study, mean_rpm, refined)
    beside = method_lives(study, mean_rpm) if refined is not None else None
    band = band_lives(study, mean_rpm, solves[1:]) if refined is not None and setting.band \
        else None
    for checked in filter(None, (lives, beside, *(band or ()))):
        finite.check_lives(study, checked)
    a1 = modified_life.per_study(modified_life.reliability_life_factor(study))
    governing = govern(study, lives, (), a1) if refined is None else \
        govern(study, beside, (lives, *(band or ())), a1, ("low", "high") if band else ())
    result = Result(
        study=study, bearings=lives.bearings, system_life_h=lives.system_life_h,
        system_life_km=lives.system_life_km, system_damage_share=lives.system_damage_share,
        mean_speed_rpm=mean_rpm, governing=governing, a1=a1, modified=lives.modified,
        shaft=shaft_result(study, mean_rpm), refined=refined, iso281=beside,
        geometry_ratings=geometry_ratings(study), setting=setting, band=band,
        friction=None if lives.modified is None else friction_of(study, lives))
    single = np.ndim(result.system_life_h) == 0
    return replace(result, findings=findings.collect(result)) if single and with_findings \
        else result


def solve_refined(study: Study, setting_m, on_progress=None):
    from hubload.engine import refined_method

    return refined_method.solve(study, setting_m, on_progress)


def shaft_result(study: Study, mean_rpm):
    if study.shaft is None:
        return None
    from hubload.engine import shaftcheck

    return shaftcheck.evaluate_shaft(study, lambda h: per_study_km(h, mean_rpm, study))


def geometry_ratings(study: Study) -> dict:
    if all(bearing.geometry is None for bearing in study.pair.bearings().values()):
        return {}
    from hubload.engine.geometry import geometry_ratings as from_geometry

    return from_geometry(study)


def friction_of(study: Study, lives: MethodLives):
    from hubload.engine.friction import evaluate_friction

    return evaluate_friction(study, lives.bearings, lives.modified.viscosity_m2_s)


def band_lives(study: Study, mean_rpm,
               on_progress=(None, None)) -> tuple[MethodLives, MethodLives]:
    """The refined lives at the low and the high end of the assembly setting's band
    (``on_progress``: one callback per end)."""
    found = []
    for end, report in zip(band_ends(study), on_progress):
        solved = solve_refined(end, operating_setting(end).operating_m, report)
        found.append(method_lives(end, mean_rpm, solved))
    return tuple(found)


def evaluate_many(studies: list[Study]) -> list[Result]:
    """Evaluate variants of a study in one batched call (domain.batch stacks them).

    The variants must share their structure (case count, choices); each returned
    Result is the point's own, with its study and findings, as from evaluate().
    """
    batched = evaluate(stack_studies(studies), with_findings=False)
    take = picker(batched, len(studies), studies)
    return [with_findings(take(index)) for index in range(len(studies))]


def with_findings(result: Result) -> Result:
    return replace(result, findings=findings.collect(result))
