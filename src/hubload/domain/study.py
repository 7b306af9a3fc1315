"""Typed, SI-unit view of a load-case file (what the engine computes on).

Scalars may be replaced by numpy arrays that broadcast against the case axis
(the last one); parameter studies use that to evaluate many variants at once.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.domain.operating import Motor, OperatingPoints, Vehicle
from hubload.model.operating import DEFAULT_ADHESION_MU
from hubload.model.setting import PairMounting

ArrayLike = float | np.ndarray


@dataclass(frozen=True)
class Wheel:
    offset_m: ArrayLike
    loaded_radius_m: ArrayLike
    rolling_radius_m: ArrayLike
    adhesion_mu: ArrayLike = DEFAULT_ADHESION_MU


@dataclass(frozen=True)
class RollerGeometry:
    """Internal geometry of a tapered roller bearing (refined method, ratings from geometry)."""

    rollers: int
    roller_diameter_m: ArrayLike
    roller_length_m: ArrayLike
    contact_angle_rad: ArrayLike     # outer raceway (cup)
    pitch_diameter_m: ArrayLike
    crown_drop_m: ArrayLike = 0.0    # 0: straight rollers


@dataclass(frozen=True)
class Bearing:
    label: str
    position_m: ArrayLike
    dynamic_rating_n: ArrayLike
    static_rating_n: ArrayLike
    e: ArrayLike
    y: ArrayLike
    y0: ArrayLike
    mean_diameter_m: ArrayLike | None = None
    fatigue_limit_n: ArrayLike | None = None     # Cu; None: estimate from C0 (ISO 281 annex B)
    geometry: RollerGeometry | None = None
    # Factor on the ratings from the geometry (1 for a file): the brief's inverse solve
    # scales the lamina capacities of the refined method with it.
    geometry_rating_factor: ArrayLike = 1.0


@dataclass(frozen=True)
class AssemblySetting:
    """The setting made at assembly and what changes it in operation ([pair.setting]).

    Temperatures per case (case axis last); ``mounting`` holds the fits, materials and
    raceway geometry the operating setting follows from (hubload.model.setting).
    """

    assembly_m: ArrayLike              # > 0 end play, < 0 preload
    tolerance_m: ArrayLike             # half-width of the band
    basis: str                         # mounted | unmounted
    assembly_temperature_k: ArrayLike
    shaft_temperature_k: np.ndarray
    housing_temperature_k: np.ndarray
    mounting: PairMounting
    cone_interference_m: ArrayLike = 0.0
    cup_interference_m: ArrayLike = 0.0


@dataclass(frozen=True)
class Pair:
    arrangement: str
    outboard: Bearing
    inboard: Bearing
    axial_setting_m: ArrayLike = 0.0   # > 0 end play, < 0 preload (refined method)
    rotating_ring: str = "inner"
    setting: AssemblySetting | None = None   # given: each case's setting follows from it

    def bearings(self) -> dict[str, Bearing]:
        return {"outboard": self.outboard, "inboard": self.inboard}


@dataclass(frozen=True)
class Cases:
    """The duty spectrum, one array element per case, in file order."""

    names: tuple[str, ...]
    time_fraction: np.ndarray
    wheel_load_n: np.ndarray
    side_force_n: np.ndarray
    tractive_force_n: np.ndarray
    speed_rpm: np.ndarray
    operating: OperatingPoints | None = None  # how each case was built, with its flags

    def __len__(self) -> int:
        return len(self.names)


@dataclass(frozen=True)
class Lubrication:
    """Oil or grease of the bearings (ISO 281 modified life).

    ``cleanliness`` is the ISO 4406 code as given (oil) or the grease level;
    ``code_6um``/``code_14um`` are the code's last two scale numbers (oil only).
    """

    viscosity_40c_m2_s: ArrayLike
    viscosity_100c_m2_s: ArrayLike
    temperature_k: np.ndarray        # per case (case axis last)
    method: str
    cleanliness: str
    code_6um: int | None = None
    code_14um: int | None = None


@dataclass(frozen=True)
class ShaftSection:
    """A checked section of the wheel shaft (solid, round)."""

    name: str
    position_m: ArrayLike
    diameter_m: ArrayLike
    kt_bending: ArrayLike
    kt_torsion: ArrayLike
    notch_sensitivity: ArrayLike | None
    notch_radius_m: ArrayLike | None
    carries_torque: bool


@dataclass(frozen=True)
class PermissibleCurve:
    """Supplier's permissible radial wheel load [N] against load position [m] (increasing)."""

    load_position_m: np.ndarray
    radial_load_n: np.ndarray


@dataclass(frozen=True)
class Shaft:
    """Material, surface and checked sections of the wheel shaft (steel)."""

    ultimate_pa: ArrayLike
    yield_pa: ArrayLike
    surface: str
    temperature_c: ArrayLike
    reliability_percent: ArrayLike
    criterion: str
    required_safety: float
    sections: tuple[ShaftSection, ...]
    permissible: PermissibleCurve | None


@dataclass(frozen=True)
class Study:
    source: str
    title: str
    target_life_h: float | None
    wheel: Wheel
    pair: Pair
    cases: Cases
    motor: Motor | None = None
    vehicle: Vehicle | None = None
    lubrication: Lubrication | None = None
    reliability_percent: float = 90.0
    shaft: Shaft | None = None
    method: str = "iso281"             # or "refined"
    verdict_basis: str = "shorter"     # refined method: shorter | iso281 | refined
