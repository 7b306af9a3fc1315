"""Reliability over time of a machine file: its wheel ends and the machine.

Each wheel end of the machine (engine/machine.py evaluates them) is a unit of the
forecast, built from that wheel end's typed Result exactly as a load-case file's
wheel end is (:func:`~hubload.studies.forecast.bearing_distributions`: the governing
life of each bearing, taken back to 90 %); the machine is every bearing of every
wheel end in series. The fleet counts bearing failures over the machine's bearings
and machines with a claim over the whole machine (studies/forecast.py).

For field data compared with a machine (``hubload field --against MACHINE``), every
row is one wheel end: the prediction is the wheel end population the rows come from,
the mixture of the wheel ends' distributions weighted by the rows at each position
(``position`` column), or by equal weights without one (a fleet of whole machines
reports all its wheel ends alike).
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from hubload.domain.field import FieldData
from hubload.domain.fleet import Fleet, LifeModel
from hubload.engine.machine import MachineResult
from hubload.errors import InputError
from hubload.model.reliability import (LifeDistribution, series_b_life_h,
                                       series_failure_probability)
from hubload.studies.forecast import (B_LIFE_PROBABILITIES, Forecast, LifeBasis, Unit,
                                      bearing_distributions, failing, forecast_of_units,
                                      life_basis)

# Halving a bracket of a few units of ln t 100 times reaches double precision.
BISECTION_STEPS = 100


def machine_units(result: MachineResult, model: LifeModel,
                  calibration: float = 1.0) -> tuple[Unit, ...]:
    """One unit per wheel end of the machine (front left first), each its own bearings."""
    return tuple(Unit(wheel.name, bearing_distributions(wheel.result, model, calibration))
                 for wheel in result.wheel_ends)


def machine_basis(result: MachineResult) -> LifeBasis:
    """The life basis of the wheel ends: one when they agree, else each named."""
    bases = list(dict.fromkeys(life_basis(wheel.result) for wheel in result.wheel_ends))
    if len(bases) == 1:
        return bases[0]
    return LifeBasis(symbol="/".join(b.symbol for b in bases),
                     governing_symbol="/".join(b.governing_symbol for b in bases),
                     governing_basis=" / ".join(b.governing_basis for b in bases))


def run_machine_forecast(result: MachineResult, model: LifeModel,
                         fleet: Fleet | None) -> Forecast:
    """Distributions of every wheel end and of the machine; with a fleet, its failures."""
    calibration = 1.0 if fleet is None else fleet.calibration
    study = result.study
    return forecast_of_units(machine_units(result, model, calibration), title=study.title,
                             source=study.source, model=model, basis=machine_basis(result),
                             target_life_h=study.target_life_h, calibration=calibration,
                             fleet=fleet, each_unit=True)


@dataclass(frozen=True)
class MixtureLives:
    """B-lives [h] of a population of units: F(t) = sum of share_i F_i(t) (a row of field
    data is a unit drawn from it). Reads like studies.forecast.ItemLives."""

    name: str
    kind: str
    units: tuple[tuple[float, tuple[LifeDistribution, ...]], ...]   # share, series units
    b1_h: float
    b10_h: float
    b50_h: float

    def failure_probability(self, time_h) -> np.ndarray:
        """F(t) [-] of a unit drawn from the population at operating times t [h]."""
        time = np.asarray(time_h, dtype=float)
        return sum((share * series_failure_probability(failing(units), time)
                    for share, units in self.units), np.zeros_like(time))


def mixture_b_life_h(units, failure_probability: float) -> float:
    """Time [h] at which the mixture's F reaches p: bisection on ln t between the
    shortest and the longest of the units' own B_p (F of each unit is monotonic, so the
    mixture's B_p lies between them). Units that cannot fail keep F at zero."""
    able = [(share, failing(d)) for share, d in units if share > 0]
    possible = sum(share for share, d in able if d)
    if possible <= failure_probability:
        return math.inf
    lives = [float(series_b_life_h(d, failure_probability)) for _, d in able if d]
    low, high = math.log(min(lives)), math.log(max(lives))
    if high - low < 1e-12:
        return min(lives)
    # F may stay below p at the longest unit's B_p when some units cannot fail: widen.
    while sum(s * float(series_failure_probability(d, math.exp(high))) for s, d in able
              if d) < failure_probability:
        high += 1.0
    for _ in range(BISECTION_STEPS):
        middle = 0.5 * (low + high)
        found = sum(s * float(series_failure_probability(d, math.exp(middle)))
                    for s, d in able if d)
        low, high = (low, middle) if found >= failure_probability else (middle, high)
    return math.exp(0.5 * (low + high))


def position_shares(names: Sequence[str], data: FieldData) -> tuple[float, ...]:
    """Each wheel end's share of the field rows: by the position column when there is
    one (its values must name the machine's wheel ends), else equal."""
    positions = data.position
    if positions is None:
        return tuple(1.0 / len(names) for _ in names)
    known = {name.casefold(): index for index, name in enumerate(names)}
    counts = [0] * len(names)
    for row, position in enumerate(positions):
        index = known.get(position.strip().casefold())
        if index is None:
            raise InputError(f"expected a wheel end of the machine ({', '.join(names)}), got "
                             f"{position!r}", file=data.source,
                             key_path=f"row {data.row_number[row]}, column position")
        counts[index] += 1
    return tuple(count / len(positions) for count in counts)


def predicted_wheel_end_population(result: MachineResult, model: LifeModel,
                                   data: FieldData) -> MixtureLives:
    """The uncalibrated wheel end that field rows of this machine come from (a mixture of
    its wheel ends by the rows' positions)."""
    units = machine_units(result, model)
    shares = position_shares([u.name for u in units], data)
    mixed = tuple((share, unit.distributions) for share, unit in zip(shares, units))
    named = [(u.name, share) for share, u in zip(shares, units) if share > 0]
    name = named[0][0] if len(named) == 1 else "mixture of " + ", ".join(
        f"{unit} {100 * share:.3g} %" for unit, share in named)
    lives = {key: mixture_b_life_h(mixed, p) for key, p in B_LIFE_PROBABILITIES.items()}
    return MixtureLives(name=name, kind="wheel end", units=mixed, **lives)
