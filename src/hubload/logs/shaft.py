"""The shaft check over a log: per-sample fatigue damage of each section and extremes.

The engine's shaft check (hubload.engine.shaftcheck, through engine.samples) runs on
every chunk of samples like on a spectrum; each sample's damage is its hold time over
its case life (Palmgren-Miner, as for the bearings), and the lowest safeties and the
highest use of the supplier's curve are kept over the whole log.
"""

from __future__ import annotations

import numpy as np

from hubload.domain.study import Study
from hubload.engine.samples import SampleLives
from hubload.model import iso281

WORST = {"min_safety": np.fmin, "yield_safety": np.fmin, "max_utilisation": np.fmax}


def damage_names(study: Study) -> tuple[str, ...]:
    """Dwell-table weight names of the shaft sections' damage (none without [shaft])."""
    if study.shaft is None:
        return ()
    return tuple(f"damage_shaft_{index}" for index in range(len(study.shaft.sections)))


def sample_damages(lives: SampleLives, hold_h: np.ndarray) -> list[np.ndarray]:
    """Per-sample fatigue damage of each section (none without [shaft])."""
    if lives.shaft is None:
        return []
    return [iso281.damage_rate_per_hour(hold_h, life_h) for life_h in lives.shaft.case_life_h]


def chunk_extremes(lives: SampleLives) -> dict[str, np.ndarray] | None:
    """Lowest fatigue and yield safety per section, highest curve use, in one chunk."""
    if lives.shaft is None:
        return None
    return {"min_safety": lives.shaft.min_safety, "yield_safety": lives.shaft.yield_safety,
            "max_utilisation": np.array([lives.shaft.max_utilisation])}


def worst(first: dict | None, second: dict | None) -> dict | None:
    """The worse of two sets of extremes (either may be None)."""
    if first is None or second is None:
        return first if second is None else second
    return {key: WORST[key](first[key], second[key]) for key in WORST}
