"""Where every lamina of every roller of the pair sits, and how it is compressed.

The shaft and the housing are rigid; the shaft (with the inner rings) moves
relative to the housing (with the outer rings) by five small displacements:
axial ux, radial uy, uz at the pair's mid-point x_m, and tilts thy, thz about
the y and z axes. A roller at azimuth psi (from +y towards +z) of a bearing
with outer-raceway contact angle a presses along the unit normal

    n = (s sin a, cos a cos psi, cos a sin psi),

s = +1 when the bearing takes shaft motion outboard (+x), -1 inboard. The line
of action of a lamina at distance l from the roller's mid-length meets the axis
at x = x_c + l / cos a, x_c being the bearing's load centre; a rigid body's
displacement projected on a line is the same at every point of the line, so
the lamina's approach is

    delta = s sin a ux + cos a [cos psi (uy + thz (x - x_m)) + sin psi (uz - thy (x - x_m))]
            - (setting / 2) sin a - profile drop(l),

half the axial setting (end play > 0, preload < 0) going to each bearing. The
tilts are scaled by the half spread h of the pair (phi = th h) so that all five
unknowns are lengths and all five generalised forces (Fx, Fy, Fz, My/h, Mz/h)
are forces. Coordinates and signs as in docs/conventions.md.

References
----------
[1] T. A. Harris, M. N. Kotzalas, Advanced Concepts of Bearing Technology,
    5th ed., CRC 2007, ch. 1 (distribution of internal loading in bearings under
    combined radial, axial and moment loading; rigid rings).
[2] ISO/TS 16281:2008, clause on internal load distribution (five degrees of
    freedom, laminae, clearance along the contact normal).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.model import statics
from hubload.model.refined import contact
from hubload.model.tapered_pair import outboard_carries_inboard_push


@dataclass(frozen=True)
class RollerSet:
    """Internal geometry of one single-row tapered roller bearing [SI]."""

    rollers: int
    roller_diameter_m: float
    roller_length_m: float
    contact_angle_rad: float
    pitch_diameter_m: float
    crown_drop_m: float = 0.0


@dataclass(frozen=True)
class MountedBearing:
    """A roller set at its load centre [m], taking shaft motion towards ``thrust_sign``."""

    rollers: RollerSet
    load_centre_m: float
    thrust_sign: int


def pair_bearings(arrangement: str, outboard: RollerSet, outboard_x_m: float,
                  inboard: RollerSet, inboard_x_m: float) -> tuple[MountedBearing, MountedBearing]:
    """(outboard, inboard) mounted bearings of a pair.

    Back-to-back, the outboard bearing carries force that pushes the shaft
    inboard, so it is compressed by inboard shaft motion (s = -1); face-to-face
    the other way round (docs/conventions.md).
    """
    outboard_sign = -1 if outboard_carries_inboard_push(arrangement) else 1
    return (MountedBearing(outboard, float(outboard_x_m), outboard_sign),
            MountedBearing(inboard, float(inboard_x_m), -outboard_sign))


@dataclass(frozen=True)
class Laminae:
    """All laminae of the pair as flat arrays (L rows), bearing by bearing.

    ``influence`` (L, 5): d(delta)/d(ux, uy, uz, phiy, phiz); ``stiffness`` (L,)
    [N/m^n]; ``profile_gap_m`` (L,); ``setting_gap`` (L,): gap per metre of
    axial setting; ``slices``: per bearing (start, rollers, laminae).
    """

    influence: np.ndarray
    stiffness: np.ndarray
    profile_gap_m: np.ndarray
    setting_gap: np.ndarray
    slices: tuple[tuple[int, int, int], ...]
    mid_x_m: float
    half_spread_m: float
    exponent: float

    def gaps_m(self, setting_m):
        """Gap of every lamina [m], shape (L, M), for settings of shape (M,)."""
        return self.profile_gap_m[:, None] + self.setting_gap[:, None] * setting_m[None, :]

    def per_bearing(self, lamina_values):
        """Split (L, ...) values into one (Z, laminae, ...) array per bearing."""
        return [lamina_values[start:start + rollers * laminae].reshape(
            (rollers, laminae) + lamina_values.shape[1:])
            for start, rollers, laminae in self.slices]

    def merged(self, per_roller: int) -> Laminae:
        """The same rollers cut into ``per_roller`` wider laminae (neighbours merged).

        A merged lamina sits at its members' mean lever (the approach is affine in the
        lever, so its influence row is the mean row), has their mean gap and the sum of
        their stiffnesses: a coarse model of the pair for a first equilibrium estimate.
        """
        parts = []
        for bearing_rows in zip(*(self.per_bearing(values) for values in (
                self.influence, self.stiffness, self.profile_gap_m, self.setting_gap))):
            laminae = bearing_rows[1].shape[1]
            starts = np.linspace(0, laminae, min(per_roller, laminae) + 1).astype(int)[:-1]
            counts = np.diff(np.append(starts, laminae))
            sums = [np.add.reduceat(values, starts, axis=1) for values in bearing_rows]
            parts.append((sums[0] / counts[None, :, None], sums[1],
                          sums[2] / counts, sums[3] / counts))
        slices = tuple((int(sum(p[1].size for p in parts[:index])), rows.shape[0],
                        rows.shape[1]) for index, (rows, *_) in enumerate(parts))
        return Laminae(*(np.concatenate([p[k].reshape((-1,) + p[k].shape[2:]) for p in parts])
                         for k in range(4)), slices=slices, mid_x_m=self.mid_x_m,
                       half_spread_m=self.half_spread_m, exponent=self.exponent)


def roller_azimuths_rad(rollers: int):
    """Azimuth of each roller [rad], roller 0 at the top (+y)."""
    return 2.0 * np.pi * np.arange(rollers) / rollers


def bearing_rows(bearing: MountedBearing, mid_x_m, half_spread_m, laminae, exponent):
    """Influence rows, stiffness, profile gap and setting gap of one bearing's laminae."""
    geometry = bearing.rollers
    alpha = geometry.contact_angle_rad
    psi = roller_azimuths_rad(geometry.rollers)
    offsets = contact.lamina_offsets_m(geometry.roller_length_m, laminae)
    lever = (bearing.load_centre_m + offsets / np.cos(alpha) - mid_x_m) / half_spread_m
    lever, psi = np.meshgrid(lever, psi)
    influence = np.stack([
        np.full_like(lever, bearing.thrust_sign * np.sin(alpha)),
        np.cos(alpha) * np.cos(psi), np.cos(alpha) * np.sin(psi),
        -np.cos(alpha) * np.sin(psi) * lever, np.cos(alpha) * np.cos(psi) * lever], axis=-1)
    count = geometry.rollers * laminae
    profile = np.broadcast_to(contact.profile_drop_m(
        offsets, geometry.roller_length_m, geometry.crown_drop_m), lever.shape)
    return (influence.reshape(count, 5),
            np.full(count, contact.lamina_stiffness_n_per_m(
                geometry.roller_length_m, laminae, exponent)),
            profile.reshape(count), np.full(count, 0.5 * np.sin(alpha)))


def build_laminae(bearings, laminae=contact.LAMINAE,
                  exponent=contact.LOAD_EXPONENT) -> Laminae:
    """Flatten the pair into laminae (see the module docstring for the kinematics)."""
    centres = [b.load_centre_m for b in bearings]
    mid_x_m = 0.5 * (max(centres) + min(centres))
    half_spread_m = max(0.5 * (max(centres) - min(centres)), 1e-3)
    rows = [bearing_rows(b, mid_x_m, half_spread_m, laminae, exponent) for b in bearings]
    starts = np.cumsum([0] + [len(r[1]) for r in rows])
    return Laminae(
        influence=np.concatenate([r[0] for r in rows]),
        stiffness=np.concatenate([r[1] for r in rows]),
        profile_gap_m=np.concatenate([r[2] for r in rows]),
        setting_gap=np.concatenate([r[3] for r in rows]),
        slices=tuple((int(start), b.rollers.rollers, laminae)
                     for start, b in zip(starts, bearings)),
        mid_x_m=mid_x_m, half_spread_m=half_spread_m, exponent=exponent)


def external_load_vector(wheel_load_n, side_force_n, tractive_force_n, offset_m,
                         loaded_radius_m, mid_x_m, half_spread_m):
    """Generalised external load (Fx, Fy, Fz, My/h, Mz/h) [N] on the shaft, about x_m.

    The ground forces (-S, W, T) act at the contact patch (offset, -R, 0); their
    moments My, Mz about (x_m, 0, 0) are those of hubload.model.statics.tyre_moments_nm.
    The moment about the axis (drive torque) is carried by the motor.
    """
    moment_y_nm, moment_z_nm = statics.tyre_moments_nm(
        mid_x_m, wheel_load_n, side_force_n, tractive_force_n, offset_m, loaded_radius_m)
    forces = np.broadcast_arrays(-np.asarray(side_force_n, dtype=float),
                                 np.asarray(wheel_load_n, dtype=float),
                                 np.asarray(tractive_force_n, dtype=float),
                                 moment_y_nm / half_spread_m, moment_z_nm / half_spread_m)
    return np.stack(forces)
