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

from importlib import import_module

# Loaded on first use: the ratings from the geometry need none of the solver, and a check by
# the ISO 281 rule should not pay for importing it.
EXPORTS = {"MountedBearing": "layout", "RollerSet": "layout", "pair_bearings": "layout",
           "BearingResponse": "pair", "PairResponse": "pair", "pair_response": "pair"}
__all__ = sorted(EXPORTS)


def __getattr__(name: str):
    if name in EXPORTS:
        return getattr(import_module(f"hubload.model.refined.{EXPORTS[name]}"), name)
    raise AttributeError(f"module 'hubload.model.refined' has no attribute {name!r}")
