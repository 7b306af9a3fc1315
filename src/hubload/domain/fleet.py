"""What a reliability forecast computes on: the life distribution's kind and a fleet."""

from __future__ import annotations

import math
from dataclasses import dataclass

from hubload.model.reliability import ISO281_SLOPE


@dataclass(frozen=True)
class LifeModel:
    """The distribution every predicted life is spread by: kind "iso281" (slope 1.5, minimum
    life 0.05 L10) or "weibull" (two-parameter, ``slope``) -- model/reliability.py."""

    kind: str = "iso281"
    slope: float = ISO281_SLOPE


@dataclass(frozen=True)
class Fleet:
    """A fleet of identical machines put into service together.

    Usage: median [h/year] and sigma of ln(hours per year) [-]; warranty in years,
    ended earlier by ``warranty_cap_h`` operating hours (inf: no cap); ``calibration``
    [-] multiplies every predicted life.
    """

    machines: int
    usage_median_h_per_year: float
    warranty_years: float
    years: int
    usage_sigma_ln: float = 0.0
    wheel_ends_per_machine: int = 1
    warranty_cap_h: float = math.inf
    calibration: float = 1.0
