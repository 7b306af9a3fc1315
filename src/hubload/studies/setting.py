"""Lives of the pair against its axial setting (refined method), in one batched solve.

With a [pair.setting] the swept value is the assembly setting, and each case runs at the
operating setting that follows from it (engine.setting); else it is the operating setting.

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
from hubload.engine.setting import at_assembly
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
    """The refined method at every setting, batched: per-setting arrays on the leading axis.

    The best range is judged on the refined candidate life (the only one the setting
    changes); every point also carries the governing life of the study's verdict basis.
    """

    study: Study
    settings_m: np.ndarray
    result: Result
    best: BestRange | None         # None when no setting gives a finite, positive life

    @property
    def refined(self):
        """The refined method's candidate life (L10r or L10mr) of the governing life."""
        return self.result.governing.candidates[-1]

    @property
    def life_name(self) -> str:
        return self.refined.symbol

    @property
    def refined_life_h(self) -> np.ndarray:
        """The refined system life per setting (zero where a case has no equilibrium)."""
        return np.where(self.unsolved, 0.0, self.refined.system_life_h)

    @property
    def unsolved(self) -> np.ndarray:
        """Per setting: True when some case has no equilibrium."""
        return ~np.all(self.result.refined.converged, axis=-1)


def setting_values_um(start_um: float, stop_um: float, step_um: float) -> np.ndarray:
    """Settings from ``start_um`` to ``stop_um`` (inclusive) by ``step_um``; InputError if bad."""
    low, high = SETTING_LIMITS_UM
    if not (np.isfinite(step_um) and step_um > 0):
        raise InputError(f"expected a positive step in um, got {step_um:g}", key_path="step_um")
    for name, value in (("start_um", start_um), ("stop_um", stop_um)):
        if not np.isfinite(value):
            raise InputError(f"expected a finite setting in um, got {value:g}", key_path=name)
    if stop_um < start_um:
        raise InputError(f"the last setting ({stop_um:g} um) must not be below the first "
                         f"({start_um:g} um)", key_path="stop_um")
    if start_um < low or stop_um > high:
        raise InputError(f"settings must lie within {low:g} to {high:g} um, "
                         f"got {start_um:g} to {stop_um:g}", key_path="start_um")
    steps = (stop_um - start_um) / step_um
    if steps >= MAX_POINTS:
        raise InputError(f"{steps + 1:.3g} settings requested; at most {MAX_POINTS} (raise "
                         "the step)", key_path="step_um")
    count = int(np.floor(steps + 1e-9)) + 1
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


def run_setting_sweep(study: Study, settings_um: np.ndarray, on_progress=None) -> SettingSweep:
    """The study evaluated by the refined method at every setting [um]; ``on_progress(done,
    total)`` as its blocks of settings and cases are solved (hubload.progress)."""
    refined = with_method(study, "refined")
    settings_m = np.asarray(settings_um, dtype=float) * UM
    if refined.pair.setting is not None:   # the assembly setting varies; each case follows
        batched = at_assembly(refined, settings_m[:, None])
    else:
        batched = replace(refined, pair=replace(refined.pair, axial_setting_m=settings_m[:, None]))
    result = evaluate(batched, with_findings=False, on_progress=on_progress)
    found = SettingSweep(study=refined, settings_m=settings_m, result=result, best=None)
    return replace(found, best=best_range(settings_m, found.refined_life_h))
