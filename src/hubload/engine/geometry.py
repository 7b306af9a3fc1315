"""The ratings C and C0 that a bearing's internal geometry gives (ISO 281, ISO 76), beside the
typed ones: both methods report them, so they stand apart from the refined solver (which a
check by the ISO 281 rule never loads)."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.domain.study import Study
from hubload.engine.modified_life import per_study
from hubload.model.refined import ratings


@dataclass(frozen=True)
class GeometryRatings:
    """C [N] (ISO 281) and C0 [N] (ISO 76) from a bearing's internal geometry."""

    dynamic_n: np.ndarray
    static_n: np.ndarray



def geometry_ratings(study: Study) -> dict[str, GeometryRatings]:
    """C and C0 from the geometry of each bearing that gives its geometry."""
    found = {}
    for label, bearing in study.pair.bearings().items():
        g = bearing.geometry
        if g is None:
            continue
        args = (g.rollers, g.roller_diameter_m, g.roller_length_m, g.contact_angle_rad,
                g.pitch_diameter_m)
        found[label] = GeometryRatings(
            per_study(ratings.dynamic_rating_n(*args) * bearing.geometry_rating_factor),
            per_study(ratings.static_rating_n(*args)))
    return found
