"""Lives of the pair against its axial setting (refined method), in one batched solve.

The setting becomes a leading axis of the study (shape (S, 1) against the
cases), so every setting and case of the sweep is solved in one call of the
refined model.
"""

from __future__ import annotations

from dataclasses import dataclass, replace

import numpy as np

from hubload.casefile.geometry import with_method
from hubload.domain.study import Study
from hubload.engine import Result, evaluate
from hubload.errors import InputError
from hubload.units import UM

MAX_POINTS = 2001
SETTING_LIMITS_UM = (-500.0, 2000.0)   # the file format's limits of axial_setting_um
BEST_RANGE_SHARE = 0.9                 # settings within 10 % of the best life found
BEST_RANGE_TEXT = f"within {100 * (1 - BEST_RANGE_SHARE):.0f} % of the best"


@dataclass(frozen=True)
class BestRange:
    """The best setting found, and the range whose life is within 10 % of it."""

    setting_m: float
    life_h: float
    low_m: float
    high_m: float


@dataclass(frozen=True)
class SettingSweep:
    study: Study
    settings_m: np.ndarray
    result: Result                 # batched: per-setting arrays on the leading axis
    life_name: str                 # the life the best range is judged on (L10 or L10m)
    governing_life_h: np.ndarray   # that system life per setting
    best: BestRange | None         # None when no setting gives a finite, positive life

    @property
    def unsolved(self) -> np.ndarray:
        """Per setting: True when some case has no equilibrium."""
        return ~np.all(self.result.refined.converged, axis=-1)


def setting_values_um(start_um: float, stop_um: float, step_um: float) -> np.ndarray:
    """Settings from ``start_um`` to ``stop_um`` (inclusive) by ``step_um``; InputError if bad."""
    low, high = SETTING_LIMITS_UM
    if not (np.isfinite(step_um) and step_um > 0):
        raise InputError(f"--step expects a positive number of um, got {step_um:g}")
    for option, value in (("--from", start_um), ("--to", stop_um)):
        if not np.isfinite(value):
            raise InputError(f"{option} expects a finite number of um, got {value:g}")
    if stop_um < start_um:
        raise InputError(f"--to ({stop_um:g}) must not be below --from ({start_um:g})")
    if start_um < low or stop_um > high:
        raise InputError(f"settings must lie within {low:g} to {high:g} um, "
                         f"got {start_um:g} to {stop_um:g}")
    count = int(np.floor((stop_um - start_um) / step_um + 1e-9)) + 1
    if count > MAX_POINTS:
        raise InputError(f"{count} settings requested; at most {MAX_POINTS} (raise --step)")
    return start_um + step_um * np.arange(count)


def best_range(settings_m: np.ndarray, life_h: np.ndarray) -> BestRange | None:
    """Best setting and the contiguous range around it within 10 % of its life."""
    usable = np.where(np.isfinite(life_h) | (life_h == np.inf), life_h, -1.0)
    if not np.any(usable > 0):
        return None
    best = int(np.argmax(usable))
    good = usable >= BEST_RANGE_SHARE * usable[best]
    low = high = best
    while low > 0 and good[low - 1]:
        low -= 1
    while high < len(good) - 1 and good[high + 1]:
        high += 1
    return BestRange(float(settings_m[best]), float(usable[best]), float(settings_m[low]),
                     float(settings_m[high]))


def run_setting_sweep(study: Study, settings_um: np.ndarray) -> SettingSweep:
    """The study evaluated by the refined method at every setting [um]."""
    refined = with_method(study, "refined")
    settings_m = np.asarray(settings_um, dtype=float) * UM
    batched = replace(refined, pair=replace(refined.pair, axial_setting_m=settings_m[:, None]))
    result = evaluate(batched, with_warnings=False)
    modified = result.modified
    name, governing = (("L10", result.system_life_h) if modified is None
                       else (modified.symbol, modified.system_life_h))
    governing = np.where(result.refined.converged.all(axis=-1), governing, 0.0)
    return SettingSweep(study=refined, settings_m=settings_m, result=result, life_name=name,
                        governing_life_h=governing, best=best_range(settings_m, governing))
