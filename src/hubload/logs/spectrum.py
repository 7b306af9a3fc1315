"""From a log summary to lives: the direct life and the classed spectrum's life.

Direct: the log's Palmgren-Miner damage D of each bearing (summed per sample)
gives the life L = duration / D [h] of a machine that keeps working like the log;
the pair's system life follows as for a load-case file.

Classed: each occupied dwell class becomes a load case with the class's share
of time, its mean speed (revolutions preserved) and the revolution-weighted power mean
of each force (time-weighted at standstill) [2]. The engine evaluates that spectrum
like any load-case file; the classing error compares its system life with the
direct one.

References
----------
[1] ISO 281:2007 and the engine's references (hubload.model.iso281).
[2] Mean load of a bearing under variable load and speed, weighted by
    revolutions with the life exponent: F_m = (sum F_i^p n_i / sum n_i)^(1/p);
    common practice of bearing manufacturers' catalogues (no standard clause).
"""

from __future__ import annotations

import dataclasses
import math
from dataclasses import dataclass

import numpy as np

from hubload.domain.study import Cases, Study
from hubload.engine import Result, evaluate
from hubload.engine.findings import STATIC_SAFETY_WARNING, Finding
from hubload.engine.governing import GoverningLife, LifeCandidate
from hubload.engine.modified_life import per_study, reliability_life_factor
from hubload.logs import shaft
from hubload.logs.pipeline import CLASS_CHANNELS, FORCES, KN, LABELS, LEVEL_EXPONENT, LogSummary
from hubload.logs.samples import with_cases
from hubload.model import dwell, iso281

SHORT_NAMES = {"wheel_load_kN": ("W", "kN"), "side_force_kN": ("S", "kN"),
               "tractive_force_kN": ("T", "kN"), "speed_rpm": ("n", "r/min")}


@dataclass(frozen=True)
class ClassShare:
    """One class of a channel: bounds, share of time, share of the pair's direct damage."""

    low: float
    high: float
    time_fraction: float
    damage_share: float


@dataclass(frozen=True)
class SpectrumResult:
    summary: LogSummary
    damage: dict[str, float]
    life_h: dict[str, float]
    system_life_h: float
    static_safety: dict[str, float]
    classed: Result
    classing_error: float | None
    shares: dict[str, list[ClassShare]]
    findings: tuple[Finding, ...]
    direct_governing: GoverningLife | None = None      # the direct life the verdict would judge
    modified_life_h: dict[str, float] | None = None   # L10m (Lnm), with [lubrication]
    modified_system_life_h: float | None = None
    modified_classing_error: float | None = None
    shaft_life_h: list[float] | None = None          # fatigue life per section, with [shaft]

    @property
    def governing_life_h(self) -> float:
        """The direct system life of the kind the verdict judges (the fleet ranks on it)."""
        return float(self.direct_governing.life_h)

    @property
    def governing_classing_error(self) -> float | None:
        """The classing error of the governing life (modified with lubrication)."""
        return self.classing_error if self.modified_life_h is None \
            else self.modified_classing_error


def sums(summary: LogSummary) -> dict[str, np.ndarray]:
    return dict(zip(summary.weights, summary.table.sums))


def class_order(summary: LogSummary) -> np.ndarray:
    """Occupied classes (with time) sorted by class index: the order of the cases."""
    occupied = sums(summary)["time_s"] > 0
    order = np.lexsort(summary.table.keys[::-1])
    return order[occupied[order]]


def classed_temperature_c(summary: LogSummary) -> np.ndarray | None:
    """Revolution-weighted mean temperature [C] of each class (time-weighted at
    standstill), or None when no log had a temperature channel."""
    if not summary.logged_temperature:
        return None
    cell, order = sums(summary), class_order(summary)
    return dwell.weighted_means(cell["revolutions_x_temperature_C"][order],
                                cell["revolutions"][order],
                                cell["time_x_temperature_C"][order], cell["time_s"][order])


def classed_cases(summary: LogSummary) -> Cases:
    """The dwell classes with time as load cases (file order: by class index)."""
    table = summary.table
    cell = sums(summary)
    order = class_order(summary)
    time_s, revolutions = cell["time_s"][order], cell["revolutions"][order]
    forces_kn = {key: class_level(cell, key, order, table) for key in FORCES}
    return Cases(
        names=class_names(table, order),
        time_fraction=time_s / np.sum(time_s),
        wheel_load_n=forces_kn["wheel_load_kN"] * KN,
        side_force_n=forces_kn["side_force_kN"] * KN,
        tractive_force_n=forces_kn["tractive_force_kN"] * KN,
        speed_rpm=revolutions * 60.0 / time_s,
    )


def class_level(cell: dict[str, np.ndarray], key: str, order: np.ndarray,
                table: dwell.DwellTable) -> np.ndarray:
    """Revolution-weighted power mean of a force in each class, signed like the class [2].

    (sum n |F|^p / sum n)^(1/p) with p = 10/3 keeps the damage of a class whose
    bearing loads follow that force; at standstill the time-weighted mean is used.
    """
    sign = np.where(table.keys[CLASS_CHANNELS.index(key), order] < 0, -1.0, 1.0)
    revolutions = cell["revolutions"][order]
    power_mean = dwell.weighted_means(cell[f"revolutions_x_power_{key}"][order],
                                      revolutions) ** (1.0 / LEVEL_EXPONENT)
    time_mean = dwell.weighted_means(cell[f"time_x_{key}"][order], cell["time_s"][order])
    return np.where(revolutions > 0, sign * power_mean, time_mean)


def class_names(table: dwell.DwellTable, order: np.ndarray) -> tuple[str, ...]:
    low, high = table.class_bounds()
    parts = []
    for channel, key in enumerate(CLASS_CHANNELS):
        symbol, unit = SHORT_NAMES[key]
        parts.append([f"{symbol} {a:g}..{b:g} {unit}"
                      for a, b in zip(low[channel, order], high[channel, order])])
    return tuple(", ".join(fields) for fields in zip(*parts))


def class_shares(summary: LogSummary, channel: int, weights: dict[str, float]) -> list[ClassShare]:
    """Share of time and of the pair's direct damage in each class of one channel."""
    keys, marginal_sums = dwell.marginal(summary.table, channel)
    cell = dict(zip(summary.weights, marginal_sums))
    width = summary.table.widths[channel]
    total_time = np.sum(cell["time_s"])
    damage = sum(weights[label] * cell[f"damage_{label}"] for label in LABELS)
    total_damage = np.sum(damage)
    return [ClassShare(low=float(k * width), high=float((k + 1) * width),
                       time_fraction=float(t / total_time),
                       damage_share=float(d / total_damage) if total_damage > 0 else 0.0)
            for k, t, d in zip(keys, cell["time_s"], damage)]


def system_weights(life_h: dict[str, float]) -> dict[str, float]:
    """Damage of each bearing per unit of its own damage, scaled to the pair.

    The bearings' damage shares combine with weights L^-e / sum L^-e (as in the
    engine's system damage share) divided by the bearing's damage, so that the
    weighted per-class damages add up to 1.
    """
    zero = [label for label, life in life_h.items() if life <= 0]
    if zero:  # a bearing without life takes the whole damage (L^-e is infinite)
        return {label: (1.0 / len(zero) if label in zero else 0.0) for label in life_h}
    # L^-e in logarithms, scaled by the largest: no overflow for the shortest lives
    logs = {label: -iso281.WEIBULL_SLOPE_ROLLER * math.log(life)
            for label, life in life_h.items() if math.isfinite(life)}
    top = max(logs.values(), default=0.0)
    terms = {label: math.exp(logs[label] - top) if label in logs else 0.0 for label in life_h}
    total = sum(terms.values())
    return {label: (term / total if total > 0 else 0.0) for label, term in terms.items()}


def spectrum_result(summary: LogSummary, study: Study) -> SpectrumResult:
    """Direct lives, static safety, the classed spectrum's lives and the classing error."""
    duration_h = summary.duration_h
    damage = {label: summary.total(f"damage_{label}") for label in LABELS}
    life_h = {label: (duration_h / d if d > 0 else float("inf")) for label, d in damage.items()}
    system_h = float(iso281.system_life(*life_h.values()))
    bearings = study.pair.bearings()
    static_safety = {label: float(iso281.static_safety(bearings[label].static_rating_n,
                                                       summary.peak_static_load_n[label]))
                     for label in LABELS}
    classed = evaluate(with_cases(study, classed_cases(summary), classed_temperature_c(summary)),
                       with_findings=False)
    fraction = {label: (w / damage[label] if damage[label] > 0 else 0.0)
                for label, w in system_weights(life_h).items()}
    shares = {key: class_shares(summary, CLASS_CHANNELS.index(key), fraction)
              for key in ("speed_rpm", "wheel_load_kN")}
    result = SpectrumResult(
        summary=summary, damage=damage, life_h=life_h, system_life_h=system_h,
        static_safety=static_safety, classed=classed,
        classing_error=relative_error(float(iso281_lives(classed).system_life_h), system_h),
        shares=shares, shaft_life_h=shaft_lives(summary, study),
        findings=tuple(static_findings(static_safety) + flag_findings(summary)
                       + shaft_findings(summary, study)))
    result = with_modified_lives(result) if classed.modified is not None else result
    return dataclasses.replace(result, direct_governing=direct_governing(result, study))


def direct_governing(result: SpectrumResult, study: Study) -> GoverningLife:
    """The direct life of the kind the verdict judges, by the engine's rule (ISO 281:2007,
    9.1-9.2): the modified life with lubrication, else a1 L10."""
    modified = result.modified_life_h is not None
    a1 = 1.0 if modified else float(per_study(reliability_life_factor(study)))
    bearing_h = result.modified_life_h if modified else \
        {label: a1 * life for label, life in result.life_h.items()}
    system_h = result.modified_system_life_h if modified else a1 * result.system_life_h
    nothing = np.zeros(0)
    candidate = LifeCandidate(
        method="iso281", modified=modified, reliability_percent=np.asarray(
            float(study.reliability_percent)),
        system_life_h=np.asarray(system_h), system_life_km=np.asarray(np.nan),
        bearing_life_h={k: np.asarray(v) for k, v in bearing_h.items()},
        bearing_life_km={}, case_life_h={}, system_damage_share=nothing,
        bearing_damage_share={})
    return GoverningLife(rule="iso281", candidates=(candidate,), chosen=np.asarray(0))


def with_modified_lives(result: SpectrumResult) -> SpectrumResult:
    """The same result with the direct and classed modified lives (ISO 281:2007, 9.1)."""
    summary = result.summary
    modified_h = {}
    for label in LABELS:
        damage = summary.total(f"damage_modified_{label}")
        modified_h[label] = summary.duration_h / damage if damage > 0 else float("inf")
    system_h = float(iso281.system_life(*modified_h.values()))
    classed_h = float(iso281_lives(result.classed).modified.system_life_h)
    return dataclasses.replace(result, modified_life_h=modified_h, modified_system_life_h=system_h,
                               modified_classing_error=relative_error(classed_h, system_h))


def shaft_lives(summary: LogSummary, study: Study) -> list[float] | None:
    """Direct fatigue life [h] of each shaft section; inf when no sample reaches the
    endurance limit (Shigley: no damage below it)."""
    if study.shaft is None:
        return None
    duration_h = summary.duration_h
    return [duration_h / damage if damage > 0 else float("inf")
            for damage in (summary.total(name) for name in shaft.damage_names(study))]


def shaft_findings(summary: LogSummary, study: Study) -> list[Finding]:
    if summary.shaft is None:
        return []
    required = float(study.shaft.required_safety)
    found = [Finding("log_shaft_safety_low", None, section.name,
                     {"safety": float(safety), "required": required})
             for section, safety in zip(study.shaft.sections, summary.shaft["min_safety"])
             if safety < required]
    utilisation = float(summary.shaft["max_utilisation"][0])
    if utilisation > 1.0:
        found.append(Finding("log_permissible_exceeded", values={"utilisation": utilisation}))
    return found


def iso281_lives(classed: Result):
    """The classed spectrum's lives by the ISO 281 rule, the method of the direct lives: the
    classing error compares like with like, also when the classes are solved refined."""
    return classed if classed.iso281 is None else classed.iso281


def relative_error(classed_h: float, direct_h: float) -> float | None:
    """(classed - direct) / direct; 0 when both are infinite, None when undefined."""
    if np.isinf(direct_h) and np.isinf(classed_h):
        return 0.0
    if not np.isfinite(direct_h) or direct_h <= 0:
        return None
    return classed_h / direct_h - 1.0


def static_findings(static_safety: dict[str, float]) -> list[Finding]:
    return [Finding("log_static_safety_low", None, label,
                    {"s0": s0, "limit": STATIC_SAFETY_WARNING})
            for label, s0 in static_safety.items() if s0 < STATIC_SAFETY_WARNING]


def flag_findings(summary: LogSummary) -> list[Finding]:
    """Share of the log's time in which each flag was raised (where it was)."""
    total_s = summary.total("time_s")
    return [Finding("log_flag_time", None, flag, {"time_fraction": seconds / total_s})
            for flag, seconds in summary.flag_time_s.items() if seconds > 0 and total_s > 0]
