"""One verdict over every check of a study: bearing life, shaft safety and life, supplier's curve.

Each item compares a value with its limit and passes when it reaches it. To rank
items of different kinds, each gets a load margin: the factor by which the loads
could grow before the item reaches its limit. Safety factors are that factor
already; a utilisation u gives 1 / u; a life ratio L / L_target gives
(L / L_target)^(1/k) with the life-load exponent k of the item (10/3 for roller
bearings, ISO 281; -1/b of the S-N line for the shaft, Shigley 10th ed. eq. 6-14,
approximate where mean stresses act). The worst item has the smallest load
margin; an item that could not be assessed (wheel offset off the supplier's
curve) fails and ranks first. For single studies (no parameter arrays), like
:func:`hubload.engine.verdict`.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from hubload.engine import Result, verdict
from hubload.model.iso281 import LIFE_EXPONENT_ROLLER


@dataclass(frozen=True)
class CheckItem:
    name: str
    value: float | None
    limit: float
    unit: str = ""
    at_most: bool = False
    life_exponent: float = 1.0

    @property
    def margin(self) -> float | None:
        """Load margin: factor on the loads until the limit is reached (None: not assessed)."""
        if self.value is None:
            return None
        if self.at_most:
            return math.inf if self.value == 0 else self.limit / self.value
        return (self.value / self.limit) ** (1.0 / self.life_exponent)

    @property
    def passed(self) -> bool:
        return self.margin is not None and self.margin >= 1.0


@dataclass(frozen=True)
class OverallVerdict:
    items: tuple[CheckItem, ...]

    @property
    def passed(self) -> bool:
        return all(item.passed for item in self.items)

    @property
    def worst(self) -> CheckItem:
        return min(self.items, key=lambda item: -math.inf if item.margin is None else item.margin)


def shaft_items(result: Result) -> list[CheckItem]:
    shaft, target = result.shaft, result.study.target_life_h
    required = float(shaft.required_safety)
    items = []
    for section in shaft.sections:
        name = section.name
        items.append(CheckItem(f"shaft '{name}' fatigue safety ({shaft.criterion})",
                               float(section.min_safety), required))
        items.append(CheckItem(f"shaft '{name}' yield safety", float(section.yield_safety),
                               required))
        if target is not None:
            items.append(CheckItem(f"shaft '{name}' fatigue life", float(section.fatigue_life_h),
                                   target, "h", life_exponent=float(section.sn_exponent)))
    permissible = shaft.permissible
    if permissible is not None:
        worst = float(np.max(permissible.utilisation)) if bool(permissible.inside) else None
        items.append(CheckItem("radial wheel force / supplier's permissible load", worst, 1.0,
                               at_most=True))
    return items


def overall_verdict(result: Result) -> OverallVerdict | None:
    """Every check with a limit, or None when there is none (no target, no shaft)."""
    items = []
    bearing = verdict(result)
    if bearing is not None:
        items.append(CheckItem(f"bearing pair {bearing.life_name} life", bearing.life_h,
                               bearing.target_h, "h", life_exponent=LIFE_EXPONENT_ROLLER))
    if result.shaft is not None:
        items += shaft_items(result)
    return OverallVerdict(tuple(items)) if items else None
