"""Orchestrates the ISO 281 modified rating life: oil -> kappa -> eC, aISO -> L10m -> damage.

Part of the engine layer (computes with hubload.model, no I/O). Per-case arrays
end in the case axis; study parameters may carry leading batch axes.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.domain.study import Bearing, Lubrication, Study
from hubload.model import iso281
from hubload.model import lubrication as lub


@dataclass(frozen=True)
class ModifiedBearing:
    """One bearing's modified life; per-case arrays end in the case axis.

    Standstill cases have no kappa, eC or aISO (NaN) and an infinite life.
    """

    reference_viscosity_m2_s: np.ndarray
    kappa: np.ndarray
    kappa_outside_scope: np.ndarray
    e_c: np.ndarray
    a_iso: np.ndarray
    case_life_h: np.ndarray          # L10m (Lnm for R other than 90 %) per case
    damage_share: np.ndarray
    life_h: np.ndarray
    life_km: np.ndarray
    fatigue_limit_n: np.ndarray
    fatigue_limit_estimated: bool


@dataclass(frozen=True)
class ModifiedLife:
    reliability_percent: np.ndarray  # per study (batched studies: leading axes)
    a1: np.ndarray
    viscosity_m2_s: np.ndarray       # per case, at the case's temperature
    contamination: lub.ContaminationLevel
    contamination_note: str
    bearings: dict[str, ModifiedBearing]
    system_life_h: np.ndarray
    system_life_km: np.ndarray
    system_damage_share: np.ndarray

    @property
    def symbol(self) -> str:
        """Life symbol, e.g. L10m or L1m (single studies)."""
        return lub.life_symbol(float(self.reliability_percent))


def contamination_level(lubrication: Lubrication) -> tuple[lub.ContaminationLevel, str]:
    """The ISO 281 annex A row for the lubrication, and a note saying which one."""
    levels = lub.CONTAMINATION_LEVELS[lubrication.method]
    if lubrication.method == "grease":
        level = next(level for level in levels if level.label == lubrication.cleanliness)
        return level, f"grease, {level.label} cleanliness (ISO 281 annex A)"
    match = lub.iso4406_level(lubrication.method, lubrication.code_6um, lubrication.code_14um)
    return match.level, f"ISO 4406 {lubrication.cleanliness}: {match.note}"


def fatigue_limit(bearing: Bearing) -> tuple[np.ndarray, bool]:
    """Cu [N] as given, or estimated from C0 by ISO 281 annex B; and whether estimated."""
    if bearing.fatigue_limit_n is not None:
        return np.asarray(bearing.fatigue_limit_n, dtype=float), False
    return lub.fatigue_load_limit_n(bearing.static_rating_n, bearing.mean_diameter_m), True


def per_study(value) -> np.ndarray:
    """A per-study value from one that broadcasts over cases: (..., 1) -> (...)."""
    value = np.asarray(value, dtype=float)
    return value[..., 0] if value.ndim else value


@dataclass(frozen=True)
class ModifiedCases:
    """Per-case factors and L10m of one bearing (what a measured log's samples need)."""

    reference_viscosity_m2_s: np.ndarray
    kappa: np.ndarray
    e_c: np.ndarray
    a_iso: np.ndarray
    case_life_h: np.ndarray


def modified_cases(bearing: Bearing, equivalent_n, basic_case_life_h, viscosity_m2_s,
                   level: lub.ContaminationLevel, a1, speed_rpm) -> ModifiedCases:
    """nu1, kappa, eC, aISO and L10m = a1 aISO L10 [h] per case (ISO 281:2007, 9.1);
    NaN factors and an infinite life at standstill."""
    moving = speed_rpm > 0
    nu1 = lub.reference_viscosity_m2_s(speed_rpm, bearing.mean_diameter_m)
    kappa = np.where(moving, lub.viscosity_ratio(viscosity_m2_s, nu1), np.nan)
    e_c = np.where(moving, lub.contamination_factor(kappa, bearing.mean_diameter_m, level), np.nan)
    cu_n, _ = fatigue_limit(bearing)
    a_iso = np.where(moving, lub.life_modification_factor(kappa, e_c, cu_n, equivalent_n), np.nan)
    case_life_h = np.where(np.isfinite(basic_case_life_h), a1 * a_iso * basic_case_life_h, np.inf)
    return ModifiedCases(nu1, kappa, e_c, a_iso, case_life_h)


def modified_bearing(bearing: Bearing, equivalent_n, basic_case_life_h, viscosity_m2_s,
                     level: lub.ContaminationLevel, a1, study: Study, to_km) -> ModifiedBearing:
    found = modified_cases(bearing, equivalent_n, basic_case_life_h, viscosity_m2_s, level, a1,
                           study.cases.speed_rpm)
    cu_n, estimated = fatigue_limit(bearing)
    damage = iso281.damage_rate_per_hour(study.cases.time_fraction, found.case_life_h)
    life_h = iso281.spectrum_life_h(damage)
    return ModifiedBearing(
        reference_viscosity_m2_s=found.reference_viscosity_m2_s, kappa=found.kappa,
        kappa_outside_scope=lub.kappa_outside_scope(found.kappa),
        e_c=found.e_c, a_iso=found.a_iso, case_life_h=found.case_life_h,
        damage_share=iso281.damage_shares(damage), life_h=life_h,
        life_km=to_km(life_h), fatigue_limit_n=per_study(cu_n),
        fatigue_limit_estimated=estimated)


def evaluate_modified(study: Study, equivalent_n: dict, basic_case_life_h: dict,
                      to_km) -> ModifiedLife | None:
    """The modified life of each bearing and of the pair, or None without lubrication.

    ``equivalent_n`` and ``basic_case_life_h`` map bearing labels to per-case P [N]
    and basic L10 [h] (ISO 281:2007, 9.1: Lnm = a1 aISO L10); ``to_km`` turns a
    per-study life [h] into a distance [km].
    """
    lubrication = study.lubrication
    if lubrication is None:
        return None
    viscosity = lub.oil_viscosity_m2_s(lubrication.temperature_k, lubrication.viscosity_40c_m2_s,
                                       lubrication.viscosity_100c_m2_s)
    level, note = contamination_level(lubrication)
    a1 = reliability_life_factor(study)
    bearings = {label: modified_bearing(bearing, equivalent_n[label], basic_case_life_h[label],
                                        viscosity, level, a1, study, to_km)
                for label, bearing in study.pair.bearings().items()}
    system_h = iso281.system_life(*(b.life_h for b in bearings.values()))
    return ModifiedLife(
        reliability_percent=per_study(study.reliability_percent), a1=per_study(a1),
        viscosity_m2_s=viscosity,
        contamination=level, contamination_note=note, bearings=bearings,
        system_life_h=system_h, system_life_km=to_km(system_h),
        system_damage_share=iso281.system_damage_shares(
            [b.life_h for b in bearings.values()], [b.damage_share for b in bearings.values()]))


def reliability_life_factor(study: Study) -> np.ndarray:
    """a1 of the study's reliability (ISO 281:2007, 9.2); broadcasts like the study."""
    return lub.reliability_factor(study.reliability_percent)
