"""A machine's wheel ends evaluated, and the machine's life as a series system of them.

Every wheel end is an ordinary study (its derived spectrum as cases), evaluated by
:func:`hubload.engine.evaluate` -- the two wheels of an axle that share a wheel end
file in one batched call. The machine fails when any bearing of any wheel end
fails: its life is that of all those bearings in series, with the Weibull slope of
the pair's own system life (Lundberg-Palmgren, ``iso281.system_life``; each
wheel end's system term is the sum of its two bearings' terms, so the series of
the wheel ends' system lives is the series of every bearing). The governing life
is the series of each wheel end's governing life (engine.governing decides that
per wheel end); the verdict judges it against the machine file's target.
"""

from __future__ import annotations

from dataclasses import dataclass, replace
from fractions import Fraction
from functools import cached_property

import numpy as np

from hubload.domain.batch import StackError
from hubload.domain.machine import MachineStudy, WheelEnd
from hubload.engine import Result, evaluate, evaluate_many
from hubload.engine.verdict import CheckItem, OverallVerdict, Verdict, life_exponent
from hubload.model import iso281

SERIES_BASIS = ("series system of every bearing of every wheel end (Weibull slope {slope}, "
                "as the pair's system life)")


@dataclass(frozen=True)
class WheelEndResult:
    wheel_end: WheelEnd
    result: Result

    @property
    def name(self) -> str:
        return self.wheel_end.name

    @property
    def governing_life_h(self) -> float:
        return float(self.result.governing.life_h)


@dataclass(frozen=True)
class MachineLife:
    """The machine's governing life: the series of the wheel ends' governing lives."""

    symbol: str
    basis: str
    life_h: float
    life_km: float
    wheel_end_life_h: tuple[float, ...]
    case_damage_share: np.ndarray      # per case: share of the machine's damage
    weakest: int                       # index of the wheel end with the shortest life

    @property
    def dominant_case(self) -> int | None:
        shares = self.case_damage_share
        return int(np.argmax(shares)) if np.any(shares > 0) else None


@dataclass(frozen=True)
class MachineResult:
    study: MachineStudy
    wheel_ends: tuple[WheelEndResult, ...]
    l10_h: float
    l10m_h: float | None             # None unless every wheel end has [lubrication]
    governing: MachineLife

    @cached_property
    def verdict(self) -> Verdict | None:
        """The machine's governing life against the target (None without a target)."""
        if self.study.target_life_h is None:
            return None
        governing = self.governing
        return Verdict(life_name=governing.symbol, life_h=np.asarray(governing.life_h),
                       target_h=float(self.study.target_life_h), basis=governing.basis)

    @cached_property
    def overall(self) -> OverallVerdict | None:
        """The machine's bearing life and every wheel end's shaft checks."""
        items = []
        found = self.verdict
        if found is not None:
            items.append(CheckItem(
                "bearing_life", f"machine bearings {found.life_name} life", found.life_h,
                found.target_h, "h",
                life_exponent=life_exponent(self.wheel_ends[0].result.governing)))
        for wheel in self.wheel_ends:
            overall = wheel.result.overall
            for item in () if overall is None else overall.items:
                if item.kind != "bearing_life":
                    items.append(replace(item, name=f"{wheel.name}: {item.name}"))
        return OverallVerdict(tuple(items)) if items else None

    @property
    def weakest(self) -> WheelEndResult:
        return self.wheel_ends[self.governing.weakest]


def evaluate_machine(study: MachineStudy) -> MachineResult:
    """Every wheel end's result, the machine's L10 and L10m and its governing life."""
    results = evaluate_wheel_ends(study.wheel_ends)
    wheel_ends = tuple(WheelEndResult(w, r) for w, r in zip(study.wheel_ends, results))
    l10_h = series([b.life_h for r in results for b in r.bearings.values()])
    modified = [r.modified for r in results]
    l10m_h = None if any(m is None for m in modified) else series(
        [b.life_h for m in modified for b in m.bearings.values()])
    return MachineResult(study=study, wheel_ends=wheel_ends, l10_h=l10_h, l10m_h=l10m_h,
                         governing=machine_life(study, results))


def evaluate_wheel_ends(wheel_ends: tuple[WheelEnd, ...]) -> list[Result]:
    """Results in the wheel ends' order; the wheels of one wheel end file in one batch."""
    groups: dict[str, list[int]] = {}
    for index, wheel in enumerate(wheel_ends):
        groups.setdefault(wheel.wheel_end_file, []).append(index)
    results: list[Result | None] = [None] * len(wheel_ends)
    for indices in groups.values():
        studies = [wheel_ends[i].study for i in indices]
        try:
            found = evaluate_many(studies) if len(studies) > 1 else [evaluate(studies[0])]
        except StackError:   # the wheels differ in structure: one by one
            found = [evaluate(s) for s in studies]
        for index, result in zip(indices, found):
            results[index] = result
    return results


def series(lives) -> float:
    """Life of components in series (Lundberg-Palmgren, iso281.system_life); inf lives drop out."""
    return float(iso281.system_life(*lives))


def machine_life(study: MachineStudy, results: list[Result]) -> MachineLife:
    governing = [r.governing for r in results]
    lives = [float(g.life_h) for g in governing]
    life_h = series(lives)
    mean_kmh = float(np.sum(study.time_fraction * study.speed_kmh))
    symbols = sorted({g.symbol for g in governing})
    bases = sorted({g.basis for g in governing})
    slope = Fraction(iso281.WEIBULL_SLOPE_ROLLER).limit_denominator(100)
    basis = SERIES_BASIS.format(slope=slope) + "; each wheel end: " + " / ".join(bases)
    shares = iso281.system_damage_shares(lives, [g.system_damage_share for g in governing])
    return MachineLife(
        symbol="/".join(symbols), basis=basis, life_h=life_h,
        life_km=life_h * mean_kmh if np.isfinite(life_h) else np.inf,
        wheel_end_life_h=tuple(lives), case_damage_share=np.asarray(shares),
        weakest=weakest_index(lives))


def weakest_index(lives: list[float]) -> int:
    """The first wheel end with the shortest life: mirror-image wheels whose lives differ
    in the last digit only (summation order) count as equal, so the left one is named."""
    shortest = min(lives)
    return next(i for i, life in enumerate(lives) if life <= shortest * (1 + 1e-9))
