"""Per-sample lives of a measured log: only what its damage sums and extremes need.

A log's samples are a spectrum of millions of one-sample cases. ``evaluate`` would build
a full Result for every chunk of them (damage shares, spectrum and system lives, friction,
the operating setting: hundreds of per-case arrays) where the log needs a few: each
bearing's L10 and L10m per sample, whether kappa is outside the aISO scope, the static
equivalent loads, and the shaft sections' lives and extremes. This path computes those
with the engine's own per-case functions (pair.rule_case_life, modified_life.modified_cases,
shaftcheck.section_cases), so the formulas have one home; the oil viscosity is computed
once per distinct temperature (a log's temperature is constant or few-valued).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.domain.study import Lubrication, Study
from hubload.engine import finite, modified_life
from hubload.engine.pair import bearing_forces, rule_case_life
from hubload.model import iso281
from hubload.model import lubrication as lub


@dataclass(frozen=True)
class SampleBearing:
    """One bearing per sample: loads [N], L10 and L10m [h] (inf without lubrication)."""

    radial_n: np.ndarray
    axial_n: np.ndarray
    equivalent_n: np.ndarray
    static_equivalent_n: np.ndarray
    case_life_h: np.ndarray
    modified_life_h: np.ndarray
    kappa_outside_scope: np.ndarray     # False without lubrication


@dataclass(frozen=True)
class SampleShaft:
    """Each section's fatigue life [h] per sample and the extremes over the samples."""

    case_life_h: tuple[np.ndarray, ...]
    min_safety: np.ndarray               # per section, over rotating samples (inf if none)
    yield_safety: np.ndarray             # per section, over all samples
    max_utilisation: float               # of the supplier's curve; NaN without one or off it


@dataclass(frozen=True)
class SampleLives:
    bearings: dict[str, SampleBearing]
    modified: bool                       # L10m computed (the study has lubrication)
    shaft: SampleShaft | None


def sample_lives(study: Study) -> SampleLives:
    """Per-sample lives of a single (unbatched) study whose cases are a log's samples, by
    the ISO 281 rule for the pair; non-finite loads are refused as by ``evaluate``."""
    speed = study.cases.speed_rpm
    forces = bearing_forces(study)
    given = study.pair.bearings()
    loads = {}
    for label, (radial, axial) in forces.items():
        equivalent, life_h = rule_case_life(given[label], radial, axial, speed)
        static = iso281.equivalent_static_load_n(radial, axial, given[label].y0)
        loads[label] = (radial, axial, equivalent, static, life_h)
    bearings = {label: SampleBearing(*found, *modified_lives(study, given[label], found[2],
                                                             found[4]))
                for label, found in loads.items()}
    finite.check_lives(study, SampleLives(bearings, False, None))
    return SampleLives(bearings, study.lubrication is not None, sample_shaft(study))


def modified_lives(study: Study, bearing, equivalent_n, life_h) -> tuple[np.ndarray, np.ndarray]:
    """L10m [h] and kappa-outside-scope per sample from P [N] and L10 [h] (inf and False
    without lubrication)."""
    if study.lubrication is None:
        return np.full_like(life_h, np.inf), np.zeros(life_h.shape, dtype=bool)
    level, _ = modified_life.contamination_level(study.lubrication)
    found = modified_life.modified_cases(
        bearing, equivalent_n, life_h, viscosity_per_sample(study.lubrication), level,
        modified_life.reliability_life_factor(study), study.cases.speed_rpm)
    return found.case_life_h, lub.kappa_outside_scope(found.kappa)


def viscosity_per_sample(lubrication: Lubrication) -> np.ndarray:
    """Oil viscosity [m^2/s] at each sample's temperature (one value when they are all
    alike), computed once per distinct temperature."""
    temperature_k = np.asarray(lubrication.temperature_k, dtype=float)

    def viscosity(kelvin):
        return lub.oil_viscosity_m2_s(kelvin, lubrication.viscosity_40c_m2_s,
                                      lubrication.viscosity_100c_m2_s)

    if temperature_k.ndim == 0 or temperature_k.size == 0:
        return viscosity(temperature_k)
    if np.all(temperature_k == temperature_k.flat[0]):
        return viscosity(temperature_k.flat[0])      # broadcasts over the samples
    distinct, inverse = np.unique(temperature_k, return_inverse=True)
    return viscosity(distinct)[inverse]


def sample_shaft(study: Study) -> SampleShaft | None:
    """Fatigue lives per sample and the extremes of every section (None without [shaft])."""
    if study.shaft is None:
        return None
    from hubload.engine import shaftcheck
    from hubload.model.shaft import strength

    fraction = strength.fatigue_strength_fraction(study.shaft.ultimate_pa)
    sections = [shaftcheck.section_cases(study, section, fraction)
                for section in study.shaft.sections]
    permissible = shaftcheck.permissible_result(study)
    utilisation = (np.nan if permissible is None or not bool(permissible.inside)
                   else float(np.max(permissible.utilisation)))
    return SampleShaft(
        case_life_h=tuple(found.case_life_h for found in sections),
        min_safety=np.array([float(np.min(np.where(found.rotating, found.safety, np.inf)))
                             for found in sections]),
        yield_safety=np.array([float(np.min(found.case_yield_safety)) for found in sections]),
        max_utilisation=utilisation)
