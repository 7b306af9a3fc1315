"""Axial setting of a tapered pair in operation: ring fits and temperatures.

Sign convention (docs/conventions.md, hubload.model.refined): the axial setting
s > 0 is end play, s < 0 preload, in metres. Every term below is a LOSS of end
play [m]: positive makes the setting smaller (towards preload).

Geometry of one bearing. The cup raceway is a cone of half-angle alpha (the
contact angle of ISO 281) about the shaft axis; D_o is its diameter at a
reference point of the raceway (take the roller mid-length) and x_k that
point's axial position. The cup raceway cone's apex lies on the axis at
A_k = x_k + s_k (D_o / 2) cot(alpha), s_k = +1 when the shaft closes bearing k
by moving outboard (+x), -1 inboard. The inner body (cone and rollers) seated
against the cup has an envelope of the same cone. The bearing's axial gap is
s_k (A_cup - A_inner); the pair's end play is the sum of both gaps [1].

- A radial closing dr [m, a RADIUS change] between the rings of one bearing
  takes up dr cot(alpha) of end play: on a cone of half-angle alpha the
  radius changes by tan(alpha) per unit of axial travel.
- Heating the inner body (shaft, cones, rollers: temperature T_s) and the outer
  body (housing, cups: T_h) from the assembly temperature T_0 moves each apex;
  to first order the loss of end play is

      a_b (dT_s - dT_h) sum_k (D_ok / 2) cot(alpha_k)
        + s_out (a_s dT_s - a_h dT_h) L,      dT = T - T_0,

  L = x_out - x_in > 0 the axial distance between the two cup raceway
  reference points (NOT between the load centres), a_b the rings' and rollers'
  expansion coefficient, a_s the shaft's, a_h the housing's; s_out = -1
  back-to-back, +1 face-to-face. One material throughout and T_s = T_h change
  nothing; back-to-back with L = sum (D_ok / 2) cot(alpha_k) (both cup raceway
  apexes at one point) is thermally neutral. The rollers are taken at the
  cones' temperature. Where the expansion coefficients of shaft or housing
  differ from the rings', the ring fits change with temperature; that change
  is a term of its own (``fit_thermal_m``).
- Fits: thick-walled cylinders (Lame), plane stress, the ring taken as a
  cylinder whose free surface is its raceway (diameter at the reference point;
  ribs ignored, so the ring is a little too compliant) [2, 3].

References
----------
[1] Cone geometry of a tapered roller bearing (raceway, roller and envelope
    cones share an apex on the axis): T. A. Harris, M. N. Kotzalas, Essential
    Concepts of Bearing Technology, 5th ed., CRC 2007, ch. 2 (from memory);
    the loss formula is derived above and checked against a construction in
    tests/model/test_setting.py.
[2] R. G. Budynas, J. K. Nisbett, Shigley's Mechanical Engineering Design,
    10th ed., McGraw-Hill 2015, sect. 3-16 "Press and shrink fits", eq. 3-56
    (pressure of two cylinders of different materials, radial interference
    delta = total radial interference) and eq. 3-57 (same material) -- the
    equation numbers from memory, the equations checked by sympy in the tests.
[3] S. P. Timoshenko, J. N. Goodier, Theory of Elasticity, 3rd ed., 1970,
    sect. 28 (thick cylinder: u = A r + B / r, plane stress).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.model.materials import BEARING_RING, Material
from hubload.model.tapered_pair import outboard_carries_inboard_push

MOUNTED = "mounted"
UNMOUNTED = "unmounted"
SETTING_BASES = (MOUNTED, UNMOUNTED)


def _diameter_ratio(small_m, large_m):
    """small / large, 0 for a solid member (small = 0) or an unbounded one (large = inf)."""
    return np.asarray(small_m, dtype=float) / np.asarray(large_m, dtype=float)


def cone_raceway_growth_same_material_m(interference_m, bore_m, raceway_diameter_m,
                                        shaft_bore_m=0.0):
    """Diameter growth dD_i [m] of a cone raceway from a shaft fit, one modulus [2, 3].

    dD_i = delta_s k (1 - k0^2) / (1 - k^2 k0^2), k = d / d_i, k0 = d0 / d, with
    ``interference_m`` delta_s the DIAMETRAL interference [m] (<= 0: clearance,
    no growth), ``bore_m`` d the cone bore = shaft seat, ``raceway_diameter_m``
    d_i, ``shaft_bore_m`` d0 (0 for a solid shaft: dD_i = delta_s d / d_i).
    Independent of E and nu while shaft and ring share them.
    """
    k = _diameter_ratio(bore_m, raceway_diameter_m)
    k0 = _diameter_ratio(shaft_bore_m, bore_m)
    return np.maximum(interference_m, 0.0) * k * (1.0 - k0**2) / (1.0 - k**2 * k0**2)


def cup_raceway_contraction_same_material_m(interference_m, outside_diameter_m,
                                            raceway_diameter_m,
                                            housing_outside_diameter_m=np.inf):
    """Diameter contraction dD_e [m] of a cup raceway from a housing fit, one modulus [2, 3].

    dD_e = delta_H h (1 - h0^2) / (1 - h^2 h0^2), h = D_e / D, h0 = D / D_H, with
    ``interference_m`` delta_H the DIAMETRAL interference [m] (<= 0: none),
    ``outside_diameter_m`` D the cup outside = housing seat, ``raceway_diameter_m``
    D_e, ``housing_outside_diameter_m`` D_H (inf: a housing of unbounded wall).
    """
    h = _diameter_ratio(raceway_diameter_m, outside_diameter_m)
    h0 = _diameter_ratio(outside_diameter_m, housing_outside_diameter_m)
    return np.maximum(interference_m, 0.0) * h * (1.0 - h0**2) / (1.0 - h**2 * h0**2)


def fit_pressure_pa(interference_m, fit_diameter_m, inner_bore_m, outer_outside_m,
                    inner: Material, outer: Material):
    """Contact pressure p [Pa] of a press fit, cylinders of different materials [2, eq. 3-56].

    p = delta / (R/E_o [(r_o^2 + R^2)/(r_o^2 - R^2) + nu_o]
                 + R/E_i [(R^2 + r_i^2)/(R^2 - r_i^2) - nu_i]),
    delta = the RADIAL interference, here half of ``interference_m`` (DIAMETRAL
    [m], <= 0 gives 0). ``fit_diameter_m`` 2R [m]; ``inner_bore_m`` 2 r_i of the
    inner member (0: solid); ``outer_outside_m`` 2 r_o of the outer (inf: unbounded).
    """
    radius = 0.5 * np.asarray(fit_diameter_m, dtype=float)
    q_out = _diameter_ratio(fit_diameter_m, outer_outside_m)
    q_in = _diameter_ratio(inner_bore_m, fit_diameter_m)
    outer_term = ((1.0 + q_out**2) / (1.0 - q_out**2) + outer.poissons_ratio) / (
        outer.youngs_modulus_pa)
    inner_term = ((1.0 + q_in**2) / (1.0 - q_in**2) - inner.poissons_ratio) / (
        inner.youngs_modulus_pa)
    return 0.5 * np.maximum(interference_m, 0.0) / (radius * (outer_term + inner_term))


def outer_member_outside_growth_m(pressure_pa, bore_m, outside_diameter_m, material: Material):
    """Outside-diameter growth [m] of a free cylinder under bore pressure ``pressure_pa`` [3].

    Lame, plane stress: u(r_o) = 2 p r_i^2 r_o / (E (r_o^2 - r_i^2)), i.e. a
    diameter growth of 2 p D k^2 / (E (1 - k^2)), k = bore / outside; nu drops out.
    """
    k = _diameter_ratio(bore_m, outside_diameter_m)
    return (2.0 * pressure_pa * outside_diameter_m * k**2
            / (material.youngs_modulus_pa * (1.0 - k**2)))


def inner_member_bore_contraction_m(pressure_pa, bore_m, outside_diameter_m, material: Material):
    """Bore-diameter contraction [m] of a free cylinder under outside pressure ``pressure_pa`` [3].

    Lame, plane stress: u(r_i) = -2 p r_o^2 r_i / (E (r_o^2 - r_i^2)), i.e. a
    diameter contraction of 2 p d / (E (1 - h^2)), h = bore / outside.
    """
    h = _diameter_ratio(bore_m, outside_diameter_m)
    return 2.0 * pressure_pa * bore_m / (material.youngs_modulus_pa * (1.0 - h**2))


def cone_raceway_growth_m(interference_m, bore_m, raceway_diameter_m, shaft_bore_m,
                          shaft: Material, ring: Material = BEARING_RING):
    """Diameter growth [m] of a cone raceway on a shaft of another material [2, 3].

    Shaft fit pressure by eq. 3-56 (shaft inner, cone outer member, the cone's
    outside taken at its raceway), then the cone's raceway growth. Diameters as
    in :func:`cone_raceway_growth_same_material_m`; DIAMETRAL interference [m].
    """
    pressure = fit_pressure_pa(interference_m, bore_m, shaft_bore_m, raceway_diameter_m,
                               inner=shaft, outer=ring)
    return outer_member_outside_growth_m(pressure, bore_m, raceway_diameter_m, ring)


def cup_raceway_contraction_m(interference_m, outside_diameter_m, raceway_diameter_m,
                              housing_outside_diameter_m, housing: Material,
                              ring: Material = BEARING_RING):
    """Diameter contraction [m] of a cup raceway in a housing of another material [2, 3].

    Housing fit pressure by eq. 3-56 (cup inner, housing outer member, the cup's
    bore taken at its raceway), then the cup's raceway contraction. Diameters as
    in :func:`cup_raceway_contraction_same_material_m`; DIAMETRAL interference [m].
    """
    pressure = fit_pressure_pa(interference_m, outside_diameter_m, raceway_diameter_m,
                               housing_outside_diameter_m, inner=ring, outer=housing)
    return inner_member_bore_contraction_m(pressure, raceway_diameter_m, outside_diameter_m, ring)


def axial_from_radial_closing_m(radial_closing_m, contact_angle_rad):
    """Loss of end play [m] from a RADIAL closing dr [m] (a radius, half a diameter change) [1].

    dr cot(alpha), alpha the cup raceway half-angle [rad]. For a diameter
    change dD pass dD / 2.
    """
    return radial_closing_m / np.tan(contact_angle_rad)


@dataclass(frozen=True)
class SeatedBearing:
    """One tapered roller bearing with its fits [m, rad]; interferences DIAMETRAL at T_0.

    ``cup_raceway_diameter_m`` D_o and ``cone_raceway_diameter_m`` d_i at the
    raceway reference point (roller mid-length); ``bore_m`` d = shaft seat;
    ``outside_diameter_m`` D = housing seat; ``shaft_bore_m`` d0 of a hollow
    shaft under the cone (0: solid); ``housing_outside_diameter_m`` the housing
    wall's outside around the cup (inf: unbounded). Interference <= 0: a
    clearance fit (the ring is not held).
    """

    contact_angle_rad: float
    cup_raceway_diameter_m: float
    cone_raceway_diameter_m: float
    bore_m: float
    outside_diameter_m: float
    shaft_interference_m: float = 0.0
    housing_interference_m: float = 0.0
    shaft_bore_m: float = 0.0
    housing_outside_diameter_m: float = np.inf


@dataclass(frozen=True)
class PairMounting:
    """The pair on its shaft and in its housing.

    ``spread_m`` L > 0 [m]: axial distance between the two cup raceway reference
    points (where D_o is taken), see :func:`raceway_spread_m` for the spread
    from the load centres. ``arrangement``: hubload.model.tapered_pair's names.
    """

    outboard: SeatedBearing
    inboard: SeatedBearing
    spread_m: float
    arrangement: str
    shaft: Material
    housing: Material
    ring: Material = BEARING_RING

    @property
    def outboard_sign(self) -> int:
        return outboard_closing_sign(self.arrangement)


def outboard_closing_sign(arrangement: str) -> int:
    """s_out: +1 when outboard shaft motion closes the outboard bearing (face-to-face), else -1.

    Back-to-back the outboard bearing carries the push that moves the shaft
    inboard (hubload.model.tapered_pair), so inboard motion closes it.
    """
    return -1 if outboard_carries_inboard_push(arrangement) else 1


def raceway_spread_m(load_centre_spread_m, outboard: SeatedBearing, inboard: SeatedBearing,
                     arrangement: str):
    """Spread L [m] between the cup raceway reference points from that of the load centres [1].

    The load centre is where the cup raceway's normal at the reference point
    meets the axis, (D_o / 2) tan(alpha) from it on the side away from the
    apex: L = L_lc + s_out sum_k (D_ok / 2) tan(alpha_k) (back-to-back the
    load centres lie outside the raceways, so L < L_lc).
    """
    offsets = sum(0.5 * b.cup_raceway_diameter_m * np.tan(b.contact_angle_rad)
                  for b in (outboard, inboard))
    return load_centre_spread_m + outboard_closing_sign(arrangement) * offsets


def fit_take_up_m(mounting: PairMounting):
    """Loss of end play [m] from pressing both bearings' rings on at T_0 [1, 2, 3].

    Per bearing (cone raceway growth + cup raceway contraction) / 2 cot(alpha);
    needed only when the assembly setting is known on an unmounted basis.
    """
    return sum(_fit_closing_m(mounting, bearing, bearing.shaft_interference_m,
                              bearing.housing_interference_m)
               for bearing in (mounting.outboard, mounting.inboard))


def _fit_closing_m(mounting: PairMounting, bearing: SeatedBearing, shaft_interference_m,
                   housing_interference_m):
    """Axial take-up [m] of one bearing's two fits at the given DIAMETRAL interferences [m]."""
    growth = cone_raceway_growth_m(shaft_interference_m, bearing.bore_m,
                                   bearing.cone_raceway_diameter_m, bearing.shaft_bore_m,
                                   mounting.shaft, mounting.ring)
    contraction = cup_raceway_contraction_m(housing_interference_m, bearing.outside_diameter_m,
                                            bearing.cup_raceway_diameter_m,
                                            bearing.housing_outside_diameter_m,
                                            mounting.housing, mounting.ring)
    return axial_from_radial_closing_m(0.5 * (growth + contraction), bearing.contact_angle_rad)


def operating_interferences_m(mounting: PairMounting, bearing: SeatedBearing,
                              shaft_temperature_k, housing_temperature_k, assembly_temperature_k):
    """(shaft, housing) DIAMETRAL interferences [m] of one bearing at its operating temperatures.

    Shaft fit: delta_s + (a_shaft - a_ring)(T_s - T_0) d; housing fit:
    delta_H - (a_housing - a_ring)(T_h - T_0) D (free thermal growth of the
    mating diameters; a light-alloy housing loosens the cups). Not clipped:
    <= 0 means the ring has come loose.
    """
    ring = mounting.ring.expansion_per_k
    shaft_rise = np.asarray(shaft_temperature_k) - assembly_temperature_k
    housing_rise = np.asarray(housing_temperature_k) - assembly_temperature_k
    shaft = bearing.shaft_interference_m + (
        (mounting.shaft.expansion_per_k - ring) * shaft_rise * bearing.bore_m)
    housing = bearing.housing_interference_m - (
        (mounting.housing.expansion_per_k - ring) * housing_rise * bearing.outside_diameter_m)
    return shaft, housing


@dataclass(frozen=True)
class SettingTerms:
    """The terms of the operating setting, each a LOSS of end play [m] (> 0: setting smaller).

    Arrays broadcast over the temperatures (cases on the last axis).
    ``fit_take_up_m``: pressing the rings on at T_0. ``radial_thermal_m``: the
    rings' free thermal growth through cot(alpha). ``fit_thermal_m``: the change
    of the fits with temperature (< 0 where they loosen). ``axial_thermal_m``:
    shaft against housing over the spread. ``cone_loose``, ``cup_loose``:
    (outboard, inboard) True where that fit's operating interference is <= 0
    (also for a fit made with clearance); a loose cup can creep in its seat.
    """

    fit_take_up_m: np.ndarray
    radial_thermal_m: np.ndarray
    fit_thermal_m: np.ndarray
    axial_thermal_m: np.ndarray
    cone_loose: tuple[np.ndarray, np.ndarray]
    cup_loose: tuple[np.ndarray, np.ndarray]

    @property
    def thermal_loss_m(self):
        """All thermal terms [m]: radial + fit change + axial."""
        return self.radial_thermal_m + self.fit_thermal_m + self.axial_thermal_m


def radial_thermal_loss_m(mounting: PairMounting, shaft_temperature_k, housing_temperature_k):
    """a_ring (T_s - T_h) sum_k (D_ok / 2) cot(alpha_k) [m] (module docstring) [1].

    Temperatures [K]: T_s of shaft, cones and rollers, T_h of housing and cups.
    """
    difference = np.asarray(shaft_temperature_k) - np.asarray(housing_temperature_k)
    radial_closing = sum(axial_from_radial_closing_m(0.5 * b.cup_raceway_diameter_m,
                                                     b.contact_angle_rad)
                         for b in (mounting.outboard, mounting.inboard))
    return mounting.ring.expansion_per_k * difference * radial_closing


def axial_thermal_loss_m(mounting: PairMounting, shaft_temperature_k, housing_temperature_k,
                         assembly_temperature_k):
    """s_out (a_s (T_s - T_0) - a_h (T_h - T_0)) L [m] (module docstring) [1].

    Shaft growth over the spread L gains end play back-to-back (s_out = -1) and
    takes it up face-to-face (s_out = +1).
    """
    shaft_growth = mounting.shaft.expansion_per_k * (
        np.asarray(shaft_temperature_k) - assembly_temperature_k)
    housing_growth = mounting.housing.expansion_per_k * (
        np.asarray(housing_temperature_k) - assembly_temperature_k)
    return mounting.outboard_sign * (shaft_growth - housing_growth) * mounting.spread_m


def setting_terms(mounting: PairMounting, shaft_temperature_k, housing_temperature_k,
                  assembly_temperature_k) -> SettingTerms:
    """Each term of the operating setting [m] for temperatures [K] broadcast over cases [1-3].

    T_s: shaft, cones and rollers; T_h: housing and cups; T_0: assembly (all
    parts at T_0 when the setting was made).
    """
    fit_thermal, cone_loose, cup_loose = 0.0, [], []
    for bearing in (mounting.outboard, mounting.inboard):
        shaft_fit, housing_fit = operating_interferences_m(
            mounting, bearing, shaft_temperature_k, housing_temperature_k, assembly_temperature_k)
        fit_thermal = fit_thermal + _fit_closing_m(mounting, bearing, shaft_fit, housing_fit) - (
            _fit_closing_m(mounting, bearing, bearing.shaft_interference_m,
                           bearing.housing_interference_m))
        cone_loose.append(np.asarray(shaft_fit) <= 0.0)
        cup_loose.append(np.asarray(housing_fit) <= 0.0)
    radial = radial_thermal_loss_m(mounting, shaft_temperature_k, housing_temperature_k)
    axial = axial_thermal_loss_m(mounting, shaft_temperature_k, housing_temperature_k,
                                 assembly_temperature_k)
    shape = np.broadcast(radial, axial, fit_thermal).shape
    return SettingTerms(
        fit_take_up_m=np.asarray(fit_take_up_m(mounting)),
        radial_thermal_m=np.broadcast_to(radial, shape),
        fit_thermal_m=np.broadcast_to(fit_thermal, shape),
        axial_thermal_m=np.broadcast_to(axial, shape),
        cone_loose=tuple(np.broadcast_to(flag, shape) for flag in cone_loose),
        cup_loose=tuple(np.broadcast_to(flag, shape) for flag in cup_loose))


def operating_setting_m(assembly_setting_m, mounting: PairMounting, shaft_temperature_k,
                        housing_temperature_k, assembly_temperature_k, basis=MOUNTED):
    """Axial setting in operation [m] (> 0 end play, < 0 preload) [1-3].

    assembly setting - fit take-up (``basis`` "unmounted" only: a setting
    measured or computed before the rings were pressed on) - thermal loss.
    ``assembly_setting_m`` [m] and the temperatures [K] (see
    :func:`setting_terms`) broadcast; cases on the last axis.
    """
    terms = setting_terms(mounting, shaft_temperature_k, housing_temperature_k,
                          assembly_temperature_k)
    take_up = terms.fit_take_up_m if basis == UNMOUNTED else 0.0
    return np.asarray(assembly_setting_m, dtype=float) - take_up - terms.thermal_loss_m
