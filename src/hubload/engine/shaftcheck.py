"""Engine of the shaft check: sections -> loads -> stresses -> safety and life; supplier curve.

The same rigid-shaft statics as the bearings feed it. Per-case arrays end in the
case axis; study fields may carry leading batch axes (parameter studies), which
broadcast through every step. Method: docs/shaft.md.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.domain.study import PermissibleCurve, Shaft, ShaftSection, Study
from hubload.model.iso281 import damage_rate_per_hour, damage_shares, spectrum_life_h
from hubload.model import statics
from hubload.model.requirements import wheel_moment_nm
from hubload.model.shaft import fatigue, strength, stress
from hubload.engine.modified_life import per_study



@dataclass(frozen=True)
class SectionResult:
    """One section over the duty spectrum. Fatigue safety is NaN for standstill cases
    (no stress cycles); their stresses count for first-cycle yield only. Per-case
    arrays end in the case axis; the rest is per study (batch axes only)."""

    name: str
    kf_bending: np.ndarray
    kf_torsion: np.ndarray
    marin: strength.MarinFactors
    endurance_pa: np.ndarray
    loads: stress.SectionLoads
    stresses: stress.SectionStresses
    safety: np.ndarray
    case_yield_safety: np.ndarray
    case_life_h: np.ndarray
    damage_share: np.ndarray
    min_safety: np.ndarray
    min_safety_case: np.ndarray
    yield_safety: np.ndarray
    yield_case: np.ndarray
    fatigue_life_h: np.ndarray
    fatigue_life_km: np.ndarray
    sn_exponent: np.ndarray          # -1/b of the S-N line: life ~ stress^-k


@dataclass(frozen=True)
class PermissibleResult:
    """The supplier's curve read at the wheel offset; NaN where the offset is off the curve.

    Per case two readings: the radial wheel force itself, and the radial force at the wheel
    offset that bends the mounting face as much as all tyre forces together (the side force's
    couple included); ``utilisation`` is the larger, ``moment_governs`` says where it is the
    second.
    """

    position_m: np.ndarray           # the wheel offset, per study
    inside: np.ndarray
    permissible_n: np.ndarray
    radial_wheel_force_n: np.ndarray
    moment_equivalent_force_n: np.ndarray     # NaN for a wheel offset at or inboard of x = 0
    utilisation_radial: np.ndarray
    utilisation_moment: np.ndarray
    utilisation: np.ndarray
    moment_governs: np.ndarray


@dataclass(frozen=True)
class ShaftResult:
    criterion: str
    required_safety: float
    fatigue_strength_fraction: np.ndarray
    sections: tuple[SectionResult, ...]
    permissible: PermissibleResult | None


MIN_MOMENT_LEVER_M = 1e-4


def notch_factors(shaft: Shaft, section: ShaftSection):
    """(Kf, Kfs): q as given, from the notch radius (Neuber), or 1 (Kf = Kt, conservative)."""
    def sensitivity(torsion: bool):
        if section.notch_sensitivity is not None:
            return section.notch_sensitivity
        if section.notch_radius_m is not None:
            return strength.notch_sensitivity(section.notch_radius_m, shaft.ultimate_pa, torsion)
        return 1.0
    return (strength.fatigue_notch_factor(section.kt_bending, sensitivity(False)),
            strength.fatigue_notch_factor(section.kt_torsion, sensitivity(True)))


def lowest(values, rotating):
    """Smallest value over the case axis among the rotating cases, and its case index."""
    masked = np.where(rotating, values, np.inf)
    return np.min(masked, axis=-1), np.argmin(masked, axis=-1)


@dataclass(frozen=True)
class SectionCases:
    """Per-case values of one section (what a measured log's samples need), and the
    per-study constants they came from."""

    kf_bending: np.ndarray
    kf_torsion: np.ndarray
    marin: strength.MarinFactors
    endurance_pa: np.ndarray
    sn_slope: np.ndarray
    loads: stress.SectionLoads
    stresses: stress.SectionStresses
    rotating: np.ndarray
    safety: np.ndarray               # NaN at standstill
    case_yield_safety: np.ndarray
    case_life_h: np.ndarray


def section_cases(study: Study, section: ShaftSection, fraction) -> SectionCases:
    """Loads, stresses, fatigue and yield safety and fatigue life [h] of a section per case."""
    shaft, cases, wheel, pair = study.shaft, study.cases, study.wheel, study.pair
    kf, kfs = notch_factors(shaft, section)
    marin = strength.marin_factors(shaft.ultimate_pa, shaft.surface, section.diameter_m,
                                   shaft.temperature_c, shaft.reliability_percent)
    endurance_pa = strength.endurance_limit_pa(shaft.ultimate_pa, marin)
    loads = stress.section_loads(
        section.position_m, section.carries_torque, cases.wheel_load_n, cases.side_force_n,
        cases.tractive_force_n, wheel.offset_m, wheel.loaded_radius_m, wheel.rolling_radius_m,
        pair.outboard.position_m, pair.inboard.position_m, pair.arrangement)
    stresses = stress.von_mises_stresses(loads, section.diameter_m, kf, kfs)
    rotating = cases.speed_rpm > 0
    safety = np.where(rotating, stress.fatigue_safety(
        stresses, endurance_pa, shaft.ultimate_pa, shaft.yield_pa, shaft.criterion), np.nan)
    _, sn_slope = fatigue.basquin_constants(shaft.ultimate_pa, endurance_pa, fraction)
    cycles = fatigue.cycles_to_failure(
        fatigue.equivalent_reversed_stress_pa(stresses.alternating_pa, stresses.mean_pa,
                                              shaft.ultimate_pa),
        shaft.ultimate_pa, endurance_pa, fraction)
    return SectionCases(
        kf_bending=kf, kf_torsion=kfs, marin=marin, endurance_pa=endurance_pa,
        sn_slope=sn_slope, loads=loads, stresses=stresses, rotating=rotating, safety=safety,
        case_yield_safety=stress.yield_safety(stresses, shaft.yield_pa),
        case_life_h=fatigue.case_life_h(cycles, cases.speed_rpm))


def section_result(study: Study, section: ShaftSection, fraction, to_km) -> SectionResult:
    found = section_cases(study, section, fraction)
    damage = damage_rate_per_hour(study.cases.time_fraction, found.case_life_h)
    life_h = spectrum_life_h(damage)
    min_safety, min_case = lowest(found.safety, found.rotating)
    yield_safety, yield_case = lowest(found.case_yield_safety, True)
    return SectionResult(
        name=section.name, kf_bending=per_study(found.kf_bending),
        kf_torsion=per_study(found.kf_torsion),
        marin=strength.MarinFactors(**{key: per_study(value)
                                       for key, value in vars(found.marin).items()}),
        endurance_pa=per_study(found.endurance_pa),
        loads=found.loads, stresses=found.stresses, safety=found.safety,
        case_yield_safety=found.case_yield_safety,
        case_life_h=found.case_life_h, damage_share=damage_shares(damage),
        min_safety=min_safety, min_safety_case=min_case, yield_safety=yield_safety,
        yield_case=yield_case, fatigue_life_h=life_h, fatigue_life_km=to_km(life_h),
        sn_exponent=per_study(-1.0 / found.sn_slope))


def read_curve(position_m, curve: PermissibleCurve):
    """Permissible load [N] at ``position_m`` (per study), linear between the curve's
    points, NaN outside the curve (no extrapolation). Curves may carry batch axes."""
    x = np.asarray(position_m, dtype=float)[..., None]
    xp, fp = curve.load_position_m, curve.radial_load_n
    load = np.full(np.broadcast_shapes(x.shape[:-1], xp.shape[:-1]), np.nan)
    for k in range(xp.shape[-1] - 1):
        x0, x1 = xp[..., k:k + 1], xp[..., k + 1:k + 2]
        f0, f1 = fp[..., k:k + 1], fp[..., k + 1:k + 2]
        on_segment = ((x >= x0) & (x <= x1))[..., 0]
        load = np.where(on_segment, (f0 + (f1 - f0) * (x - x0) / (x1 - x0))[..., 0], load)
    return load


def permissible_result(study: Study) -> PermissibleResult | None:
    """Utilisation of the supplier's curve per case, the larger of two readings at the wheel
    offset (linear interpolation inside the curve; outside it nothing is assessed, NaN):

    - the resultant radial wheel force (wheel load and tractive force);
    - the radial force at the offset with the same bending moment at the mounting face
      (x = 0) as all tyre forces together, M / offset with M = |r x F| of the ground forces
      (requirements.wheel_moment_nm, side force times loaded radius included): a curve of
      permissible radial load against load position is a curve of permissible moment, so a
      side force that adds to the moment uses it up too (common practice of reading such
      curves). Undefined (NaN) for an offset at or inboard of the mounting face.
    """
    curve = study.shaft.permissible
    if curve is None:
        return None
    cases, wheel = study.cases, study.wheel
    offset = per_study(wheel.offset_m)
    permissible = read_curve(offset, curve)[..., None]
    radial = statics.resultant(cases.wheel_load_n, cases.tractive_force_n)
    moment = wheel_moment_nm(0.0, cases.wheel_load_n, cases.side_force_n,
                             cases.tractive_force_n, wheel.offset_m, wheel.loaded_radius_m)
    lever = np.asarray(wheel.offset_m, dtype=float)
    # Within a tenth of a millimetre of the mounting face the curve is read on the radial
    # load alone: moment / lever has no meaning there (and would overflow).
    reads_moment = lever > MIN_MOMENT_LEVER_M
    equivalent = np.where(reads_moment, moment / np.where(reads_moment, lever, 1.0), np.nan)
    by_radial, by_moment = radial / permissible, equivalent / permissible
    utilisation = np.fmax(by_radial, by_moment)
    shape = utilisation.shape
    return PermissibleResult(
        position_m=offset, inside=np.isfinite(permissible[..., 0]),
        permissible_n=permissible[..., 0], radial_wheel_force_n=np.broadcast_to(radial, shape),
        moment_equivalent_force_n=np.broadcast_to(equivalent, shape),
        utilisation_radial=np.broadcast_to(by_radial, shape),
        utilisation_moment=np.broadcast_to(by_moment, shape), utilisation=utilisation,
        moment_governs=np.nan_to_num(by_moment, nan=-np.inf) > by_radial)


def evaluate_shaft(study: Study, to_km) -> ShaftResult | None:
    """The shaft check of a study, or None when the file has no [shaft] table.

    ``to_km`` turns per-study lives [h] into distances [km] (the engine's rule).
    """
    if study.shaft is None:
        return None
    fraction = strength.fatigue_strength_fraction(study.shaft.ultimate_pa)
    return ShaftResult(
        criterion=study.shaft.criterion, required_safety=per_study(study.shaft.required_safety),
        fatigue_strength_fraction=per_study(fraction),
        sections=tuple(section_result(study, section, fraction, to_km)
                       for section in study.shaft.sections),
        permissible=permissible_result(study))
