"""Reliability over time of a checked wheel end, and the failure forecast of its fleet.

The check's governing life (engine/governing.py decides which) gives each bearing's
L10 on that life's basis: with lubrication the modified life L10m = Lnm / a1, else the
basic L10 (the refined method's reference lives likewise). A life model
(:class:`~hubload.domain.fleet.LifeModel`) spreads each L10 into a distribution
F(t) (model/reliability.py). The units of a machine are a list of named
:class:`Unit` s, each a series system of its bearings (R = product of R): a wheel
end's file builds one unit per wheel end (:func:`wheel_end_units`); a machine file
builds its wheel ends the same way from its own results, and every builder hands its
units to :func:`forecast_of_units`. The fleet forecast
(model/fleet_forecast.py) counts bearing failures: a failed bearing is a claim.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from hubload.domain.fleet import Fleet, LifeModel
from hubload.engine import Result
from hubload.engine.governing import symbol_of
from hubload.errors import InputError
from hubload.model.fleet_forecast import FleetForecast, fleet_forecast
from hubload.model.reliability import LifeDistribution, series_b_life_h, series_reliability

B_LIFE_PROBABILITIES = {"b1_h": 0.01, "b10_h": 0.10, "b50_h": 0.50}


@dataclass(frozen=True)
class Unit:
    """One unit of a machine (a wheel end): its bearings' names and life distributions."""

    name: str
    bearings: tuple[tuple[str, LifeDistribution], ...]

    @property
    def distributions(self) -> tuple[LifeDistribution, ...]:
        return tuple(distribution for _, distribution in self.bearings)


@dataclass(frozen=True)
class ItemLives:
    """B-lives [h] of a bearing, a unit or a machine (a series system of distributions)."""

    name: str
    kind: str                          # "bearing", "wheel end" or "machine"
    distributions: tuple[LifeDistribution, ...]
    b1_h: float
    b10_h: float
    b50_h: float
    reliability_at_target: float | None

    def failure_probability(self, time_h) -> np.ndarray:
        """F(t) [-] of the item at operating times t [h]."""
        return 1.0 - series_reliability(failing(self.distributions), time_h)


@dataclass(frozen=True)
class LifeBasis:
    """Which life feeds the distributions: its symbol at 90 % and the governing life's."""

    symbol: str                        # e.g. L10m: the L10 of each distribution
    governing_symbol: str              # e.g. L1m when the file asks for 99 %
    governing_basis: str               # the governing life in words (engine/governing.py)


@dataclass(frozen=True)
class Forecast:
    """Distributions of the units and, with a fleet, its expected failures."""

    title: str
    source: str
    model: LifeModel
    basis: LifeBasis
    target_life_h: float | None
    calibration: float
    units: tuple[Unit, ...]
    items: tuple[ItemLives, ...]
    fleet: Fleet | None
    outcome: FleetForecast | None

    @property
    def bearings_per_machine(self) -> int:
        return sum(len(unit.bearings) for unit in self.units)

    @property
    def wheel_ends_per_machine(self) -> int:
        return len(self.units)


def failing(distributions) -> tuple[LifeDistribution, ...]:
    """The distributions that can fail: a bearing that carries no load has an infinite life."""
    return tuple(d for d in distributions if math.isfinite(d.l10_h))


def life_basis(result: Result) -> LifeBasis:
    chosen = result.governing.choice
    return LifeBasis(symbol=symbol_of(chosen.method, 90.0, chosen.modified),
                     governing_symbol=chosen.symbol, governing_basis=chosen.basis)


def bearing_distributions(result: Result, model: LifeModel,
                          calibration: float = 1.0) -> tuple[tuple[str, LifeDistribution], ...]:
    """Each bearing's distribution from the governing life, taken back to 90 % (/ a1, ISO 281
    9.2: a1 scales the life and nothing else), times ``calibration``."""
    a1 = float(np.asarray(result.a1).flat[0])
    found = []
    for label in result.bearings:
        l10_h = float(np.asarray(result.governing.bearing_life_h(label)).flat[0]) / a1
        if not l10_h > 0.0:
            raise InputError(f"the governing life of the {label} bearing is zero: no life "
                             "distribution follows from it", key_path=f"pair.{label}")
        found.append((label, LifeDistribution(model.kind, l10_h * calibration, model.slope)))
    return tuple(found)


def wheel_end_units(result: Result, model: LifeModel, count: int = 1,
                    calibration: float = 1.0) -> tuple[Unit, ...]:
    """``count`` wheel ends like the checked one (a load-case file describes one)."""
    bearings = bearing_distributions(result, model, calibration)
    names = ["wheel end"] if count == 1 else [f"wheel end {i + 1}" for i in range(count)]
    return tuple(Unit(name, bearings) for name in names)


def item_lives(name: str, kind: str, distributions, target_life_h: float | None) -> ItemLives:
    """B1, B10, B50 and R(target) of distributions in series (model/reliability.py)."""
    able = failing(distributions)
    lives = {key: float(series_b_life_h(able, p)) if able else math.inf
             for key, p in B_LIFE_PROBABILITIES.items()}
    at_target = None if target_life_h is None else \
        float(series_reliability(able, target_life_h)) if able else 1.0
    return ItemLives(name=name, kind=kind, distributions=tuple(distributions),
                     reliability_at_target=at_target, **lives)


def items_of(units: tuple[Unit, ...], target_life_h: float | None,
             each_unit: bool = False) -> tuple[ItemLives, ...]:
    """The first unit's bearings, each distinct unit, and the machine when it has several;
    ``each_unit`` (a machine file's wheel ends, each with its own duty): every unit by its
    name, then the machine."""
    if each_unit:
        return tuple(item_lives(unit.name, "wheel end", unit.distributions, target_life_h)
                     for unit in units) + machine_items(units, target_life_h)
    first = units[0]
    items = [item_lives(f"{label} bearing", "bearing", (d,), target_life_h)
             for label, d in first.bearings]
    distinct = {unit.bearings: unit for unit in units}
    kind = "wheel end"
    items += [item_lives(unit.name if len(distinct) > 1 else kind, kind, unit.distributions,
                         target_life_h) for unit in distinct.values()]
    return tuple(items) + machine_items(units, target_life_h)


def machine_items(units: tuple[Unit, ...], target_life_h: float | None) -> tuple[ItemLives, ...]:
    """The machine, every bearing of every unit in series (none for a single unit)."""
    if len(units) < 2:
        return ()
    every = tuple(d for unit in units for d in unit.distributions)
    return (item_lives(f"machine ({len(units)} wheel ends)", "machine", every, target_life_h),)


def fleet_outcome(units: tuple[Unit, ...], fleet: Fleet | None) -> FleetForecast | None:
    """The fleet's expected failures of the units' bearings (each a unit of the model)."""
    if fleet is None:
        return None
    able = failing(d for unit in units for d in unit.distributions)
    if not able:
        raise InputError("no bearing carries load: every life is infinite, nothing fails",
                         key_path="case")
    return fleet_forecast(able, machines=fleet.machines,
                          usage_median_h_per_year=fleet.usage_median_h_per_year,
                          usage_sigma_ln=fleet.usage_sigma_ln, years=fleet.years,
                          warranty_years=fleet.warranty_years,
                          warranty_cap_h=fleet.warranty_cap_h)


def forecast_of_units(units: tuple[Unit, ...], *, title: str, source: str, model: LifeModel,
                      basis: LifeBasis, target_life_h: float | None, calibration: float,
                      fleet: Fleet | None, each_unit: bool = False) -> Forecast:
    """The forecast of one machine's units (already calibrated): every builder ends here.
    ``each_unit``: list every unit (see :func:`items_of`)."""
    return Forecast(title=title, source=source, model=model, basis=basis,
                    target_life_h=target_life_h, calibration=calibration, units=units,
                    items=items_of(units, target_life_h, each_unit), fleet=fleet,
                    outcome=fleet_outcome(units, fleet))


def run_forecast(result: Result, model: LifeModel, fleet: Fleet | None) -> Forecast:
    """Distributions and fleet forecast of a checked wheel end (one load-case file)."""
    calibration = 1.0 if fleet is None else fleet.calibration
    count = 1 if fleet is None else fleet.wheel_ends_per_machine
    study = result.study
    return forecast_of_units(wheel_end_units(result, model, count, calibration),
                             title=study.title, source=study.source, model=model,
                             basis=life_basis(result), target_life_h=study.target_life_h,
                             calibration=calibration, fleet=fleet)


def predicted_wheel_end(result: Result, model: LifeModel) -> ItemLives:
    """The uncalibrated wheel end of a checked file (what field data are compared with)."""
    unit = wheel_end_units(result, model)[0]
    return item_lives("wheel end", "wheel end", unit.distributions, result.study.target_life_h)
