"""Elastic and thermal constants of shaft and housing materials (and of the bearing rings).

Values are room-temperature handbook values, SI: linear expansion coefficient
[1/K] (mean over 0..100 C), Young's modulus [Pa], Poisson's ratio [-]. They are
nominal: grades differ by several per cent (cast aluminium alloys expand less
than wrought ones, grey cast iron's modulus depends on its grade).

References
----------
[1] R. G. Budynas, J. K. Nisbett, Shigley's Mechanical Engineering Design,
    10th ed., McGraw-Hill 2015, table A-5 (physical constants of materials):
    carbon steel E = 207.0 GPa, nu = 0.292; grey cast iron E = 100.0 GPa,
    nu = 0.211; aluminium (all alloys) E = 71.7 GPa, nu = 0.333 (from memory).
[2] Same book, table 3-3 (coefficients of thermal expansion, linear mean
    coefficients for 0..100 C): carbon steel 10.8e-6, cast iron 10.6e-6,
    aluminium 23.9e-6 1/K (from memory; the table's number may differ between
    editions). Cast aluminium housing alloys expand somewhat less (about
    21..23e-6, from memory).
[3] Through-hardened bearing steel (100Cr6 / AISI 52100): E about 208 GPa,
    nu 0.3, expansion 11.5..12.5e-6 1/K as quoted in bearing makers' general
    catalogues (from memory, common practice). The "steel" entry stands for
    the rings too: a difference of two handbook values (about 1e-6 1/K) would
    show as a change of a steel shaft's cone fit with temperature that is
    noise, not physics.
[4] Steel's expansion is taken as 11.7e-6 1/K (about 6.5e-6 1/F, the value
    general engineering handbooks give for carbon steel near room
    temperature; from memory, common practice) rather than [2]'s 10.8e-6: the
    entry also stands for the bearing rings [3], whose expansion drives the
    radial term of a thermal setting change, and 11.7e-6 lies inside both the
    shaft steels' and the bearing steel's ranges.
"""

from __future__ import annotations

from dataclasses import dataclass
from types import MappingProxyType


@dataclass(frozen=True)
class Material:
    """Isotropic linear-elastic material with its thermal expansion [SI]."""

    name: str
    expansion_per_k: float
    youngs_modulus_pa: float
    poissons_ratio: float
    source: str


STEEL = Material("steel", 11.7e-6, 207.0e9, 0.292,
                 "Shigley 10th ed. table A-5 (E, nu, carbon steel), from memory; expansion "
                 "11.7e-6 1/K common practice for carbon and bearing steels, from memory")
CAST_IRON = Material("cast-iron", 10.6e-6, 100.0e9, 0.211,
                     "Shigley 10th ed. table A-5 (E, nu, grey cast iron) and table 3-3 "
                     "(expansion), from memory")
ALUMINIUM = Material("aluminium", 23.9e-6, 71.7e9, 0.333,
                     "Shigley 10th ed. table A-5 (E, nu, all alloys) and table 3-3 "
                     "(expansion), from memory")
BEARING_RING = STEEL   # [3]: bearing steel's constants lie within the steel entry's scatter

MATERIALS = MappingProxyType({m.name: m for m in (STEEL, CAST_IRON, ALUMINIUM)})


def material(name: str) -> Material:
    """The tabulated material called ``name`` (one of MATERIALS' keys) [1-4].

    Raises KeyError for an unknown name; the case file validates names first.
    """
    return MATERIALS[name]
