"""No non-finite number past the bearing loads: an infinite or undefined load is an error.

An infinite life is a result (no load, or standstill); an infinite or undefined load
is not, and its life would come out infinite, its damage zero, and a failing spectrum
would pass. Files are checked before (limits, casefile.finite); this guards every
other way into the engine (Python API studies, log samples) and names the case.
"""

from __future__ import annotations

import numpy as np

from hubload.domain.study import Study
from hubload.errors import InputError

LOADS = ("radial_n", "axial_n", "equivalent_n", "static_equivalent_n")


def check_lives(study: Study, lives) -> None:
    """InputError naming the first case whose bearing loads are not finite, or whose
    life is undefined (NaN), in ``lives`` (engine.pair.MethodLives)."""
    for label, bearing in lives.bearings.items():
        for name in LOADS:
            refuse_at(study, ~np.isfinite(getattr(bearing, name)), f"the {label} bearing's "
                      f"{name.removesuffix('_n').replace('_', ' ')} load")
        refuse_at(study, np.isnan(bearing.case_life_h), f"the {label} bearing's life")


def refuse_at(study: Study, bad: np.ndarray, what: str) -> None:
    if not np.any(bad):
        return
    case = int(np.argwhere(np.atleast_1d(bad))[0][-1])
    names = study.cases.names
    name = f" '{names[case]}'" if case < len(names) else ""
    raise InputError(f"{what} is not finite in case[{case}]{name} ({lives_method(study)}); "
                     "expected finite inputs of a plausible size", file=study.source,
                     key_path=f"case[{case}]")


def lives_method(study: Study) -> str:
    return "refined method" if study.method == "refined" else "ISO 281 rule"
