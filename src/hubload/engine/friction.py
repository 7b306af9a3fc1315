"""Friction torque and power loss of each bearing per case (hubload.model.friction).

Palmgren's model needs the oil's viscosity, so it is evaluated with a [lubrication]
table only. The bearing forces are those of the study's method: under the refined
method they include what a preload adds to the external load.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.domain.study import Study
from hubload.model import friction as model

# The lubrication methods of the file format as Palmgren's f0 table names them: the wheel
# bearings of a hub motor run in the motor's case oil (an oil bath) or in grease.
F0_KEY = {"oil-filtered": "oil-bath", "oil-unfiltered": "oil-bath", "grease": "grease"}


@dataclass(frozen=True)
class BearingFriction:
    viscous_nm: np.ndarray           # per case: M0
    load_nm: np.ndarray              # per case: M1
    power_w: np.ndarray              # per case
    mean_power_w: np.ndarray         # time-weighted over the spectrum, per study

    @property
    def torque_nm(self) -> np.ndarray:
        return self.viscous_nm + self.load_nm


@dataclass(frozen=True)
class Friction:
    f0: float
    bearings: dict[str, BearingFriction]

    @property
    def mean_power_w(self) -> np.ndarray:
        """The pair's time-weighted mean power loss [W]."""
        return sum(b.mean_power_w for b in self.bearings.values())


def evaluate_friction(study: Study, bearings: dict, viscosity_m2_s) -> Friction | None:
    """Each bearing's friction per case from its forces ``bearings`` (engine BearingResult)."""
    if study.lubrication is None:
        return None
    f0 = model.F0_TAPERED[F0_KEY[study.lubrication.method]]
    given = study.pair.bearings()
    found = {}
    for label, result in bearings.items():
        bearing = given[label]
        torque = model.friction_torque(viscosity_m2_s, study.cases.speed_rpm,
                                       bearing.mean_diameter_m, result.radial_n, result.axial_n,
                                       bearing.y, f0)
        power = model.power_loss_w(torque.total_nm, study.cases.speed_rpm)
        found[label] = BearingFriction(
            viscous_nm=torque.viscous_nm, load_nm=torque.load_nm, power_w=power,
            mean_power_w=model.mean_power_w(power, study.cases.time_fraction))
    return Friction(f0=f0, bearings=found)
