"""Invented tapered roller sets for the refined-method tests (test data, not a product)."""

import math

from hubload.model.refined import RollerSet, pair_bearings

ALPHA = math.radians(15.0)


def roller_set(rollers=20, diameter_mm=12.0, length_mm=20.0, angle_deg=15.0, pitch_mm=85.0,
               crown_um=0.0):
    return RollerSet(rollers, diameter_mm * 1e-3, length_mm * 1e-3, math.radians(angle_deg),
                     pitch_mm * 1e-3, crown_um * 1e-6)


def symmetric_pair(half_spread_mm=40.0, arrangement="back-to-back", **geometry):
    """Two identical bearings mirrored about x = 0."""
    rollers = roller_set(**geometry)
    return pair_bearings(arrangement, rollers, half_spread_mm * 1e-3, rollers,
                         -half_spread_mm * 1e-3)
