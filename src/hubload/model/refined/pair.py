"""Response of the tapered pair to the wheel forces: equilibrium, loads, lives.

``pair_response`` takes the same ground forces as the ISO 281 rule
(hubload.model.statics) and any batch shape broadcast with the setting (cases
on the last axis); it returns per-bearing arrays of that shape.

References
----------
[1] ISO/TS 16281:2008 (internal load distribution, reference rating life).
[2] T. A. Harris, M. N. Kotzalas, Essential Concepts of Bearing Technology,
    5th ed., CRC 2007, ch. 7: load zone from the load distribution factor
    epsilon, psi_l = arccos(-A / R) for an approach A + R cos(psi - psi0).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.model.refined import contact, layout, life, solver
from hubload.model.refined.layout import Laminae, MountedBearing

# Cases solved and reduced together: their lamina loads (1,200 x 256 x 8 bytes = 2.5 MB for
# 2 x 20 rollers x 30 laminae) stay in cache between the solver and the life sums, and
# the cost per case stays flat however many cases come.
BLOCK_CASES = 256


@dataclass(frozen=True)
class BearingResponse:
    """One bearing's results [SI], each array of the batch shape."""

    radial_n: np.ndarray
    axial_n: np.ndarray
    max_roller_load_n: np.ndarray
    load_zone_rad: np.ndarray
    max_contact_pressure_pa: np.ndarray
    life_mrev: np.ndarray


@dataclass(frozen=True)
class PairResponse:
    """Both bearings (outboard, inboard) and the shaft's displacement."""

    bearings: tuple[BearingResponse, BearingResponse]
    axial_displacement_m: np.ndarray
    tilt_rad: np.ndarray
    radial_displacement_at_wheel_m: np.ndarray
    converged: np.ndarray


def pair_response(bearings: tuple[MountedBearing, MountedBearing], wheel_load_n, side_force_n,
                  tractive_force_n, offset_m, loaded_radius_m, setting_m=0.0,
                  rotating_ring="inner", laminae=contact.LAMINAE,
                  exponent=contact.LOAD_EXPONENT, on_progress=None) -> PairResponse:
    """Equilibrium, lamina loads and ISO/TS 16281 reference lives of the pair [1].

    Forces [N] as in hubload.model.statics (ground on tyre: wheel load +y, side
    force + inboard, tractive force + forward) at the contact patch (offset [m],
    loaded radius [m] below the axis); ``setting_m`` [m] axial setting (> 0
    end play, < 0 preload). Geometry must be scalar; loads and setting broadcast.
    ``on_progress(done, total)`` is called after each block of cases (hubload.progress).
    """
    lamina_set = layout.build_laminae(bearings, laminae, exponent)
    arrays = np.broadcast_arrays(*(np.asarray(v, dtype=float) for v in (
        wheel_load_n, side_force_n, tractive_force_n, offset_m, loaded_radius_m, setting_m)))
    shape = arrays[0].shape
    wheel, side, tractive, offset, radius, setting = (a.reshape(-1) for a in arrays)
    external = layout.external_load_vector(wheel, side, tractive, offset, radius,
                                           lamina_set.mid_x_m, lamina_set.half_spread_m)
    slices = case_blocks(setting.size)
    blocks = []
    for cases in slices:
        blocks.append(block_response(bearings, lamina_set, external[:, cases], setting[cases],
                                     rotating_ring))
        if on_progress is not None:
            on_progress(len(blocks), len(slices))
    z = np.concatenate([block[0] for block in blocks], axis=1)
    per_bearing = tuple(BearingResponse(**{
        name: np.concatenate([getattr(block[1][index], name) for block in blocks]).reshape(shape)
        for name in vars(blocks[0][1][index])}) for index in range(len(bearings)))
    tilt_y, tilt_z = z[3] / lamina_set.half_spread_m, z[4] / lamina_set.half_spread_m
    arm = offset - lamina_set.mid_x_m
    at_wheel = np.hypot(z[1] + tilt_z * arm, z[2] - tilt_y * arm)
    return PairResponse(
        bearings=per_bearing, axial_displacement_m=z[0].reshape(shape),
        tilt_rad=np.hypot(tilt_y, tilt_z).reshape(shape),
        radial_displacement_at_wheel_m=at_wheel.reshape(shape),
        converged=np.concatenate([block[2] for block in blocks]).reshape(shape))


def case_blocks(cases: int):
    """Slices of at most BLOCK_CASES cases covering ``cases`` (one, empty, for none)."""
    return [slice(start, start + BLOCK_CASES) for start in range(0, max(cases, 1), BLOCK_CASES)]


def block_response(bearings, lamina_set: Laminae, external, setting_m, rotating_ring):
    """(displacements z (5, m), per-bearing responses, converged (m,)) of a block of cases."""
    found = solver.solve_equilibrium(lamina_set, external, setting_m)
    z = found.displacement
    return z, tuple(bearing_response(bearing, loads, lamina_set, z, setting_m, rotating_ring)
                    for bearing, loads in zip(bearings,
                                              lamina_set.per_bearing(found.lamina_loads_n))), \
        found.converged


def bearing_response(bearing: MountedBearing, lamina_loads_n, lamina_set: Laminae, z,
                     setting_m, rotating_ring) -> BearingResponse:
    """Forces, peak roller load and pressure, load zone and life of one bearing."""
    geometry = bearing.rollers
    alpha = geometry.contact_angle_rad
    psi = layout.roller_azimuths_rad(geometry.rollers)
    roller_loads = np.sum(lamina_loads_n, axis=1)
    force_x = bearing.thrust_sign * np.sin(alpha) * np.sum(roller_loads, axis=0)
    force_y = np.cos(alpha) * (np.cos(psi) @ roller_loads)
    force_z = np.cos(alpha) * (np.sin(psi) @ roller_loads)
    width_m = geometry.roller_length_m / lamina_loads_n.shape[1]
    radius_m = contact.inner_contact_radius_m(geometry.roller_diameter_m, alpha,
                                              geometry.pitch_diameter_m)
    pressure = contact.line_contact_pressure_pa(
        np.max(lamina_loads_n, axis=(0, 1)) / width_m, radius_m)
    return BearingResponse(
        radial_n=np.hypot(force_y, force_z), axial_n=np.abs(force_x),
        max_roller_load_n=np.max(roller_loads, axis=0),
        load_zone_rad=load_zone_rad(bearing, lamina_set, z, setting_m),
        max_contact_pressure_pa=pressure,
        life_mrev=life.reference_life_mrev(geometry, lamina_loads_n, rotating_ring))


def load_zone_rad(bearing: MountedBearing, lamina_set: Laminae, z, setting_m):
    """Arc [rad] over which the rollers' mid-length line (through the load centre) is compressed.

    Along the ring its approach is A + R cos(psi - psi0), A the axial part less
    half the setting, R the radial displacement's part: the loaded arc is
    2 arccos(-A / R) [2]. Edge contact of tilted rollers outside this arc shows in
    the peak pressure, not here.
    """
    alpha = bearing.rollers.contact_angle_rad
    lever = (bearing.load_centre_m - lamina_set.mid_x_m) / lamina_set.half_spread_m
    radial = np.cos(alpha) * np.hypot(z[1] + z[4] * lever, z[2] - z[3] * lever)
    axial = np.sin(alpha) * (bearing.thrust_sign * z[0] - 0.5 * setting_m)
    with np.errstate(divide="ignore", invalid="ignore"):
        cosine = np.where(radial > 0, -axial / np.where(radial > 0, radial, 1.0),
                          np.where(axial > 0, -1.0, 1.0))
    return 2.0 * np.arccos(np.clip(cosine, -1.0, 1.0))
