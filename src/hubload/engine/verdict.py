"""The verdicts of a study: the governing life against the target, and every check with a limit.

Each item compares a value with its limit and passes when it reaches it. To rank
items of different kinds, each gets a load margin: the factor by which the loads
could grow before the item reaches its limit. Safety factors are that factor
already; a utilisation u gives 1 / u; a life ratio L / L_target gives
(L / L_target)^(1/k) with the life-load exponent k of the item (10/3 for roller
bearings, ISO 281:2007 eq. 2; 4 for the ISO/TS 16281 reference life; -1/b of the
S-N line for the shaft, Shigley 10th ed. eq. 6-14, approximate where mean
stresses act). The worst item has the smallest load margin; an item that could
not be assessed (wheel offset off the supplier's curve, value NaN) fails and
ranks first.

Values broadcast: a batched study gives every item's value, margin and pass per point.
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property

import numpy as np

from hubload.domain.study import Study
from hubload.engine.governing import GoverningLife
from hubload.engine.modified_life import per_study
from hubload.model.iso281 import LIFE_EXPONENT_ROLLER


@dataclass(frozen=True)
class Verdict:
    """The governing system life against the project's target life."""

    life_name: str
    life_h: np.ndarray
    target_h: np.ndarray | float
    basis: str

    @property
    def passed(self) -> np.ndarray:
        return np.asarray(self.life_h) >= self.target_h


@dataclass(frozen=True)
class CheckItem:
    """One check against its limit. ``value`` is NaN where it could not be assessed."""

    kind: str           # bearing_life | shaft_fatigue_safety | shaft_yield_safety |
    name: str           # shaft_fatigue_life | permissible_load
    value: np.ndarray
    limit: np.ndarray | float
    unit: str = ""
    at_most: bool = False
    life_exponent: np.ndarray | float = 1.0
    subject: str | None = None      # shaft section name

    @cached_property
    def margin(self) -> np.ndarray:
        """Load margin: factor on the loads until the limit is reached (NaN: not assessed)."""
        value = np.asarray(self.value, dtype=float)
        with np.errstate(divide="ignore"):
            if self.at_most:
                return np.where(value == 0, np.inf, self.limit / np.where(value == 0, 1, value))
            return (value / self.limit) ** (1.0 / np.asarray(self.life_exponent))

    @cached_property
    def passed(self) -> np.ndarray:
        margin = self.margin
        return ~np.isnan(margin) & (margin >= 1.0)


@dataclass(frozen=True)
class OverallVerdict:
    items: tuple[CheckItem, ...]

    @property
    def passed(self) -> np.ndarray:
        return np.logical_and.reduce([item.passed for item in self.items])

    @cached_property
    def worst_index(self) -> np.ndarray:
        margins = np.stack(np.broadcast_arrays(*(item.margin for item in self.items)))
        return np.argmin(np.where(np.isnan(margins), -np.inf, margins), axis=0)

    @property
    def worst(self) -> CheckItem:
        """The item with the smallest load margin (single study)."""
        return self.items[int(self.worst_index)]

    def point(self, index: int, count: int) -> "OverallVerdict":
        """Point ``index`` of a verdict batched over ``count`` points: every value, margin and
        pass taken from the batch's arrays, computed once for all points."""
        def take(value):
            array = np.asarray(value)
            return array[index] if array.ndim >= 1 and array.shape[0] == count else value

        items = []
        for item in self.items:
            picked = CheckItem(item.kind, item.name, take(item.value), take(item.limit),
                               item.unit, item.at_most, take(item.life_exponent), item.subject)
            picked.__dict__.update(margin=take(item.margin), passed=take(item.passed))
            items.append(picked)
        found = OverallVerdict(tuple(items))
        found.__dict__["worst_index"] = take(self.worst_index)
        return found


def life_exponent(governing: GoverningLife) -> float:
    """Life-load exponent of the governing life: 10/3 (ISO 281) or 4 (ISO/TS 16281)."""
    if governing.method != "refined":
        return LIFE_EXPONENT_ROLLER
    from hubload.model.refined.life import RATING_LIFE_EXPONENT

    return RATING_LIFE_EXPONENT


def bearing_verdict(study: Study, governing: GoverningLife) -> Verdict | None:
    """The governing system life against the target, or None without a target (single study)."""
    if study.target_life_h is None:
        return None
    target = per_study(study.target_life_h)
    return Verdict(life_name=governing.symbol, life_h=governing.life_h,
                   target_h=float(target) if target.ndim == 0 else target, basis=governing.basis)


def shaft_items(study: Study, shaft) -> list[CheckItem]:
    target = None if study.target_life_h is None else per_study(study.target_life_h)
    required = shaft.required_safety
    items = []
    for section in shaft.sections:
        name = section.name
        items.append(CheckItem("shaft_fatigue_safety", f"shaft '{name}' fatigue safety",
                               section.min_safety, required, subject=name))
        items.append(CheckItem("shaft_yield_safety", f"shaft '{name}' yield safety",
                               section.yield_safety, required, subject=name))
        if target is not None:
            items.append(CheckItem("shaft_fatigue_life", f"shaft '{name}' fatigue life",
                                   section.fatigue_life_h, target, "h",
                                   life_exponent=section.sn_exponent, subject=name))
    permissible = shaft.permissible
    if permissible is not None:
        worst = np.where(permissible.inside, np.max(permissible.utilisation, axis=-1), np.nan)
        items.append(CheckItem("permissible_load",
                               "radial wheel force / supplier's permissible load", worst, 1.0,
                               at_most=True))
    return items


def overall_verdict(study: Study, governing: GoverningLife, shaft) -> OverallVerdict | None:
    """Every check with a limit, or None when there is none (no target, no shaft)."""
    items = []
    found = bearing_verdict(study, governing)
    if found is not None:
        items.append(CheckItem("bearing_life", f"bearing pair {found.life_name} life",
                               found.life_h, found.target_h, "h",
                               life_exponent=life_exponent(governing)))
    if shaft is not None:
        items += shaft_items(study, shaft)
    return OverallVerdict(tuple(items)) if items else None
