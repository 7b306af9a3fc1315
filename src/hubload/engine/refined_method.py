"""Orchestrates the refined method: study -> load distribution of the pair -> loads and lives.

Part of the engine layer (computes with hubload.model.refined, no I/O). The
pair is solved for every case (and every point of a batched study) at once;
the engine then treats the refined loads and lives like the ISO 281 ones
(Palmgren-Miner, system life, modified life with aISO from the reference
equivalent load Pref of ISO/TS 16281).
"""

from __future__ import annotations

import dataclasses
import math
from dataclasses import dataclass

import numpy as np

from hubload.domain.study import Bearing, Study
from hubload.engine.geometry import geometry_ratings
from hubload.model import iso281
from hubload.model.refined.life import life_factor_of_rating_factor, reference_equivalent_load_n
from hubload.progress import in_parts

LABELS = ("outboard", "inboard")


@dataclass(frozen=True)
class RefinedBearing:
    """One bearing's refined results; per-case arrays end in the case axis."""

    radial_n: np.ndarray
    axial_n: np.ndarray
    load_zone_rad: np.ndarray
    max_roller_load_n: np.ndarray
    max_contact_pressure_pa: np.ndarray
    reference_load_n: np.ndarray     # Pref = C_geometry / L10r^(3/10)
    case_life_h: np.ndarray          # L10r [h]; 0 where no equilibrium was found


@dataclass(frozen=True)
class RefinedPair:
    bearings: dict[str, RefinedBearing]
    axial_displacement_m: np.ndarray
    tilt_rad: np.ndarray
    radial_displacement_at_wheel_m: np.ndarray
    converged: np.ndarray
    setting_m: np.ndarray

    def unsolved_cases(self) -> list[int]:
        """Indices of the cases without equilibrium (single studies)."""
        return [int(i) for i in np.flatnonzero(~self.converged)]


def uniform(value) -> bool:
    array = np.asarray(value)
    return array.size <= 1 or bool(np.all(array == array.flat[0]))


def scalar(value) -> float:
    return float(np.asarray(value, dtype=float).flat[0])


def point_parameters(study: Study):
    """The values that shape the laminae: they must be scalars for one batched solve."""
    values = []
    for bearing in study.pair.bearings().values():
        values.append(bearing.position_m)
        values.extend(getattr(bearing.geometry, f.name)
                      for f in dataclasses.fields(bearing.geometry))
    return values


def mounted_pair(study: Study, at=lambda value: value):
    """The pair's two mounted bearings (hubload.model.refined.layout) of one point."""
    from hubload.model.refined.layout import RollerSet, pair_bearings

    def roller_set(bearing: Bearing) -> RollerSet:
        g = bearing.geometry
        return RollerSet(int(scalar(at(g.rollers))), scalar(at(g.roller_diameter_m)),
                         scalar(at(g.roller_length_m)), scalar(at(g.contact_angle_rad)),
                         scalar(at(g.pitch_diameter_m)), scalar(at(g.crown_drop_m)))

    pair = study.pair
    return pair_bearings(pair.arrangement, roller_set(pair.outboard),
                         scalar(at(pair.outboard.position_m)), roller_set(pair.inboard),
                         scalar(at(pair.inboard.position_m)))


def respond(study: Study, bearings, setting_m, at=lambda value: value, on_progress=None):
    from hubload.model.refined.pair import pair_response

    cases, wheel = study.cases, study.wheel
    return pair_response(bearings, at(cases.wheel_load_n), at(cases.side_force_n),
                         at(cases.tractive_force_n), at(wheel.offset_m),
                         at(wheel.loaded_radius_m), at(setting_m),
                         rotating_ring=study.pair.rotating_ring, on_progress=on_progress)


def pair_responses(study: Study, setting_m, on_progress=None):
    """The model's response for every point and case; one solve when the geometry is shared.

    A batched study whose bearing geometry or positions differ between points is
    solved point by point (each point's cases still in one call).
    """
    parameters = point_parameters(study)
    if all(uniform(value) for value in parameters):
        return respond(study, mounted_pair(study), setting_m, on_progress=on_progress)
    lead = np.broadcast_shapes(*(np.shape(v)[:-1] for v in parameters if np.ndim(v) > 1))
    points = []
    for index, report in zip(np.ndindex(lead), in_parts(on_progress, math.prod(lead))):
        def at(value, index=index):
            array = np.asarray(value)
            return array[index] if array.ndim > 1 else array
        points.append(respond(study, mounted_pair(study, at), setting_m, at, report))
    return stack_points(points, lead)


def stack_points(points: list, lead: tuple[int, ...]):
    first = points[0]
    if dataclasses.is_dataclass(first):
        return type(first)(**{f.name: stack_points([getattr(p, f.name) for p in points], lead)
                              for f in dataclasses.fields(first)})
    if isinstance(first, tuple):
        return tuple(stack_points([p[i] for p in points], lead) for i in range(len(first)))
    stacked = np.stack([np.asarray(p) for p in points])
    return stacked.reshape(lead + stacked.shape[1:])


def solve(study: Study, setting_m, on_progress=None) -> RefinedPair:
    """Refined loads, lives [h] and shaft displacements of the pair, per case, at the axial
    setting ``setting_m`` [m] of each case (engine.setting); ``on_progress(done, total)``
    after each block of cases solved (hubload.progress)."""
    response = pair_responses(study, setting_m, on_progress)
    geometry = geometry_ratings(study)
    converged = np.asarray(response.converged)
    bearings = {}
    for label, found in zip(LABELS, response.bearings):
        life_mrev = found.life_mrev * life_factor_of_rating_factor(
            study.pair.bearings()[label].geometry_rating_factor)
        life_h = iso281.life_hours(life_mrev, study.cases.speed_rpm)
        bearings[label] = RefinedBearing(
            radial_n=found.radial_n, axial_n=found.axial_n, load_zone_rad=found.load_zone_rad,
            max_roller_load_n=found.max_roller_load_n,
            max_contact_pressure_pa=found.max_contact_pressure_pa,
            reference_load_n=reference_equivalent_load_n(
                np.expand_dims(geometry[label].dynamic_n, -1), life_mrev),
            case_life_h=np.where(converged, life_h, 0.0))
    return RefinedPair(
        bearings=bearings, axial_displacement_m=response.axial_displacement_m,
        tilt_rad=response.tilt_rad,
        radial_displacement_at_wheel_m=response.radial_displacement_at_wheel_m,
        converged=converged, setting_m=np.asarray(setting_m, dtype=float))
