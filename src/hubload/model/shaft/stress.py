"""Loads, stresses and safety factors at a section of the rotating wheel shaft.

The shaft turns under loads fixed in space, so the bending stress at a point of
the section is fully reversed once per revolution, with the resultant moment of
both planes as amplitude. Within a load case, the torque and the axial force are
steady: they are mean stresses. The section is a solid round bar.

References
----------
[1] R. G. Budynas, J. K. Nisbett, Shigley's Mechanical Engineering Design,
    10th ed., McGraw-Hill 2015, section 7-4: DE-Goodman (eq. 7-7) and DE-ASME
    elliptic (eq. 7-11) fatigue criteria of shafts; first-cycle yield by von
    Mises on the maximum stresses (eqs. 7-15, 7-16), notch factors included.
[2] Shigley 10th ed., section 6-14, eqs. (6-66), (6-67): von Mises alternating
    and mean stresses of combined bending, axial and torsional loading, each
    component multiplied by its fatigue notch factor; the Se for it has kc = 1.
[3] J. M. Gere, B. J. Goodno, Mechanics of Materials, 8th ed., Cengage 2013:
    bending stress 32 M / (pi d^3), torsional shear 16 T / (pi d^3) and axial
    stress 4 F / (pi d^2) of a solid round section; method of sections.
[4] hubload.model.statics: bending moments at a section, both planes.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.model import statics, tapered_pair

GOODMAN = "goodman"
ASME_ELLIPTIC = "asme-elliptic"
CRITERIA = (GOODMAN, ASME_ELLIPTIC)
SMALLEST_RECIPROCABLE = 1.0 / np.finfo(float).max   # 1 / x is finite for every x above it


@dataclass(frozen=True)
class SectionLoads:
    """Internal forces at a section per case [N m, N]; arrays of one shape, case axis last."""

    bending_nm: np.ndarray
    torque_nm: np.ndarray
    axial_n: np.ndarray
    shear_n: np.ndarray


def section_axial_force_n(section_x_m, side_force_n, outboard_x_m, inboard_x_m, arrangement):
    """Axial force [N] in the shaft at a section, tension positive [3].

    The wheel's axial force enters the shaft at its flange, outboard of every
    section; the bearing of the pair that takes thrust in that direction reacts
    it (back-to-back: the outboard bearing takes inboard push). Method of
    sections: the force is the sum of the axial forces outboard of the section.
    Clamping forces inside the pair (induced forces, nut preload) depend on the
    mounting and are not included.
    """
    external_n = statics.external_axial_force_n(side_force_n)
    outboard_takes_it = (external_n < 0) == tapered_pair.outboard_carries_inboard_push(arrangement)
    thrust_x_m = np.where(outboard_takes_it, outboard_x_m, inboard_x_m)
    bearing_beyond = np.asarray(thrust_x_m > section_x_m, dtype=float)
    return external_n * (1.0 - bearing_beyond)


def section_loads(section_x_m, carries_torque, wheel_load_n, side_force_n, tractive_force_n,
                  offset_m, loaded_radius_m, rolling_radius_m, outboard_x_m, inboard_x_m,
                  arrangement) -> SectionLoads:
    """Resultant bending moment, torque, axial and shear force at a section [1, 4].

    The wheel is bolted to a flange at the shaft's outboard end, so the tyre
    forces load every section, whichever side of it the wheel centre plane lies
    (a dished wheel). The bending moments of both planes come from the
    rigid-shaft statics and are added as vectors. Torque = tractive force x
    rolling radius where the section carries the drive torque
    (``carries_torque``), else 0. Positions [m], forces [N].
    """
    vertical_nm, horizontal_nm, shear_n = statics.section_moments(
        section_x_m, wheel_load_n, side_force_n, tractive_force_n, offset_m,
        loaded_radius_m, outboard_x_m, inboard_x_m, wheel_beyond=True)
    torque_nm = np.asarray(carries_torque, dtype=float) * tractive_force_n * rolling_radius_m
    axial_n = section_axial_force_n(section_x_m, side_force_n, outboard_x_m, inboard_x_m,
                                    arrangement)
    return SectionLoads(*np.broadcast_arrays(statics.resultant(vertical_nm, horizontal_nm),
                                             np.abs(torque_nm), axial_n, shear_n))


@dataclass(frozen=True)
class SectionStresses:
    """Von Mises stresses [Pa] at the notch root, notch factors included [1, 2]."""

    alternating_pa: np.ndarray
    mean_pa: np.ndarray
    peak_pa: np.ndarray


def von_mises_stresses(loads: SectionLoads, diameter_m, kf_bending, kf_torsion) -> SectionStresses:
    """Alternating, mean and peak von Mises stress [Pa] of a solid round section [1, 2, 3].

    sigma'a = Kf 32 M / (pi d^3) (rotating bending, fully reversed);
    sigma'm = sqrt((Kf 4 F / (pi d^2))^2 + 3 (Kfs 16 T / (pi d^3))^2);
    sigma'max = sqrt((sigma_a + |sigma_axial|)^2 + 3 tau_m^2) for first-cycle yield.
    The axial stress takes the bending notch factor (common practice: the contract
    has no separate axial Kt). Von Mises drops the sign of the mean stress, so a
    compressive axial stress is treated like a tensile one (conservative).
    """
    d = np.asarray(diameter_m, dtype=float)
    bending_pa = kf_bending * 32.0 * loads.bending_nm / (np.pi * d ** 3)
    axial_pa = kf_bending * 4.0 * np.abs(loads.axial_n) / (np.pi * d ** 2)
    shear_pa = kf_torsion * 16.0 * loads.torque_nm / (np.pi * d ** 3)
    return SectionStresses(
        alternating_pa=bending_pa,
        mean_pa=np.sqrt(axial_pa ** 2 + 3.0 * shear_pa ** 2),
        peak_pa=np.sqrt((bending_pa + axial_pa) ** 2 + 3.0 * shear_pa ** 2))


def reciprocal(value):
    """1 / value with 1 / 0 = inf (an unstressed section is infinitely safe).

    Values too small for a finite reciprocal (below 1 / the largest float, subnormal
    numbers) count as 0, so that no overflow can occur: by construction, not by silencing.
    """
    value = np.asarray(value, dtype=float)
    finite = value >= SMALLEST_RECIPROCABLE
    return np.where(finite, 1.0 / np.where(finite, value, 1.0), np.inf)


def goodman_safety(alternating_pa, mean_pa, endurance_pa, ultimate_pa):
    """DE-Goodman fatigue safety factor: 1/n = sigma'a / Se + sigma'm / Sut [1, eq. 7-7]."""
    return reciprocal(alternating_pa / endurance_pa + mean_pa / ultimate_pa)


def asme_elliptic_safety(alternating_pa, mean_pa, endurance_pa, yield_pa):
    """DE-ASME elliptic fatigue safety factor [1, eq. 7-11]:
    1/n = sqrt((sigma'a / Se)^2 + (sigma'm / Sy)^2)."""
    return reciprocal(statics.resultant(alternating_pa / endurance_pa, mean_pa / yield_pa))


def fatigue_safety(stresses: SectionStresses, endurance_pa, ultimate_pa, yield_pa,
                   criterion: str = GOODMAN):
    """Fatigue safety factor by the chosen criterion ("goodman" or "asme-elliptic") [1]."""
    if criterion == GOODMAN:
        return goodman_safety(stresses.alternating_pa, stresses.mean_pa, endurance_pa,
                              ultimate_pa)
    if criterion == ASME_ELLIPTIC:
        return asme_elliptic_safety(stresses.alternating_pa, stresses.mean_pa,
                                    endurance_pa, yield_pa)
    raise ValueError(f"unknown fatigue criterion {criterion!r}; expected one of {CRITERIA}")


def yield_safety(stresses: SectionStresses, yield_pa):
    """First-cycle yield safety ny = Sy / sigma'max [1, eqs. 7-15, 7-16]."""
    return yield_pa * reciprocal(stresses.peak_pa)
