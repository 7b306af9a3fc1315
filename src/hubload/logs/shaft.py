"""The shaft check over a log: per-sample fatigue damage of each section and extremes.

The engine's shaft check (hubload.engine.shaftcheck) runs on every chunk of samples
like on a spectrum; each sample's damage is its hold time over its case life
(Palmgren-Miner, as for the bearings), and the lowest safeties and the highest
use of the supplier's curve are kept over the whole log.
"""

from __future__ import annotations

import numpy as np

from hubload.domain.study import Study
from hubload.model import iso281

WORST = {"min_safety": np.fmin, "yield_safety": np.fmin, "max_utilisation": np.fmax}


def damage_names(study: Study) -> tuple[str, ...]:
    """Dwell-table weight names of the shaft sections' damage (none without [shaft])."""
    if study.shaft is None:
        return ()
    return tuple(f"damage_shaft_{index}" for index in range(len(study.shaft.sections)))


def sample_damages(result, hold_h: np.ndarray) -> list[np.ndarray]:
    """Per-sample fatigue damage of each section (none without [shaft])."""
    if result.shaft is None:
        return []
    return [iso281.damage_rate_per_hour(hold_h, section.case_life_h)
            for section in result.shaft.sections]


def chunk_extremes(result) -> dict[str, np.ndarray] | None:
    """Lowest fatigue and yield safety per section, highest curve use, in one chunk."""
    if result.shaft is None:
        return None
    permissible = result.shaft.permissible
    utilisation = (np.nan if permissible is None or not bool(permissible.inside)
                   else float(np.max(permissible.utilisation)))
    return {"min_safety": np.array([float(s.min_safety) for s in result.shaft.sections]),
            "yield_safety": np.array([float(s.yield_safety) for s in result.shaft.sections]),
            "max_utilisation": np.array([utilisation])}


def worst(first: dict | None, second: dict | None) -> dict | None:
    """The worse of two sets of extremes (either may be None)."""
    if first is None or second is None:
        return first if second is None else second
    return {key: WORST[key](first[key], second[key]) for key in WORST}
