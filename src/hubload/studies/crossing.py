"""Where a life curve crosses the target life, by interpolation between sweep points."""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np



@dataclass(frozen=True)
class Crossing:
    """The parameter value at which the life reaches the target, and which way it goes."""

    value: float
    falls_below: bool
    interpolated: bool = True


def target_crossings(values, lives_h, target_h: float) -> list[Crossing]:
    """Crossings of ``target_h`` by ``lives_h`` [h] along ``values`` (sorted either way).

    Between two points on either side of the target the crossing is interpolated
    linearly in log(life): rating lives follow powers of the loads, so log(life)
    is nearly linear in most parameters (common practice for life curves). An
    infinite life (None, inf) counts as above the target and a zero life (a case
    without equilibrium) below it; a crossing next to either is placed at the
    other point and marked as not interpolated. Missing lives (NaN) break the curve.
    """
    x = np.asarray(values, dtype=float)
    life = np.array([math.inf if v is None else v for v in lives_h], dtype=float)
    crossings = []
    for i in range(len(x) - 1):
        a, b = life[i], life[i + 1]
        if np.isnan(a) or np.isnan(b):
            continue
        if (a >= target_h) == (b >= target_h):
            continue
        falls = bool(b < target_h)
        if not all(0 < life < math.inf for life in (a, b)):
            usable = 0 < a < math.inf
            crossings.append(Crossing(float(x[i] if usable else x[i + 1]), falls,
                                      interpolated=False))
            continue
        fraction = (math.log(target_h) - math.log(a)) / (math.log(b) - math.log(a))
        crossings.append(Crossing(float(x[i] + fraction * (x[i + 1] - x[i])), falls))
    return crossings
