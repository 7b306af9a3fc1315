"""Per-sample operating points of a log, as a batch of engine load cases.

Every sample becomes one case (wheel forces [N], wheel speed [r/min]) with its
hold time as weight, so the engine that evaluates a load-case file evaluates the
log too: one life model, not two.
"""

from __future__ import annotations

import dataclasses

import numpy as np

from hubload.casefile.study import Cases, Study
from hubload.logs.clean import Samples
from hubload.logs.columns import ColumnPlan
from hubload.model.kinematics import kmh_to_rpm

KN = 1e3


def sample_cases(samples: Samples, plan: ColumnPlan, study: Study) -> Cases:
    """One case per sample; ``time_fraction`` is the sample's share of the chunk."""
    channels = samples.channels
    zero = np.zeros(len(samples))

    def force_n(key: str) -> np.ndarray:
        return zero if key in plan.zero_channels else channels[key] * KN

    if plan.speed_channel == "speed_kmh":
        speed_rpm = kmh_to_rpm(channels["speed_kmh"], study.wheel.rolling_radius_m)
    else:
        speed_rpm = channels["speed_rpm"]
    total_s = float(np.sum(samples.hold_s))
    return Cases(
        names=("",) * len(samples),
        time_fraction=samples.hold_s / total_s if total_s > 0 else zero,
        wheel_load_n=force_n("wheel_load_kN"),
        side_force_n=force_n("side_force_kN"),
        tractive_force_n=force_n("tractive_force_kN"),
        # reverse travel turns the bearings as fast as forward travel
        speed_rpm=np.abs(np.asarray(speed_rpm, dtype=float)),
    )


def with_cases(study: Study, cases: Cases) -> Study:
    return dataclasses.replace(study, cases=cases)
