"""Refined method for the tapered pair: internal load distribution and ISO/TS 16281 life.

Modules, from the bottom up:

- ``ratings``: C (ISO 281) and C0 (ISO 76) from the internal geometry;
- ``contact``: line-contact stiffness of a lamina, Hertz pressure, roller profile;
- ``layout``: where each lamina of each roller sits and how the shaft compresses it;
- ``solver``: equilibrium of the rigid shaft, many cases at once;
- ``kernel``: its compiled Newton iteration (numba, loaded only when solving);
- ``life``: ISO/TS 16281 reference rating life from the lamina loads;
- ``integrals``: Sjovall's Jr, Ja (for checks and documentation);
- ``pair``: the whole response of the pair to the wheel forces.

The method, constants, sources and assumptions are described in docs/refined-method.md.
"""

from hubload.model.refined.layout import MountedBearing, RollerSet, pair_bearings
from hubload.model.refined.pair import BearingResponse, PairResponse, pair_response

__all__ = ["BearingResponse", "MountedBearing", "PairResponse", "RollerSet", "pair_bearings",
           "pair_response"]
