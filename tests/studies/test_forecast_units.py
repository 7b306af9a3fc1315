"""Units of a forecast: series systems of bearings, wheel ends and machines (properties).

Sources: a series system fails at its first unit's failure, so it is never more reliable than
any of its units and k identical two-parameter Weibull units have eta k^(-1/beta) (Barlow &
Proschan, Mathematical Theory of Reliability, 1965, ch. 2 -- from memory).
"""

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from hubload.model.reliability import LifeDistribution
from hubload.studies.forecast import Unit, items_of

lives = st.floats(100.0, 1e6)
slopes = st.floats(0.5, 4.0)


@settings(max_examples=60)
@given(lives, lives, st.sampled_from(["iso281", "weibull"]), slopes, st.integers(1, 6))
def test_series_items_are_never_longer_lived_than_their_parts(outboard, inboard, kind, slope,
                                                              count):
    slope = 1.5 if kind == "iso281" else slope
    bearings = (("outboard", LifeDistribution(kind, outboard, slope)),
                ("inboard", LifeDistribution(kind, inboard, slope)))
    units = tuple(Unit(f"wheel end {i}", bearings) for i in range(count))
    items = {item.kind: item for item in items_of(units, 5000.0)}
    for key, failed in (("b1_h", 0.01), ("b10_h", 0.10), ("b50_h", 0.50)):
        own = min(float(b.life_h(1.0 - failed)) for _, b in bearings)
        assert getattr(items["wheel end"], key) <= own * (1 + 1e-12)
        if count > 1:
            assert getattr(items["machine"], key) <= getattr(items["wheel end"], key) * (1 + 1e-12)
    assert items["wheel end"].reliability_at_target <= min(
        b.reliability(5000.0) for _, b in bearings) + 1e-12


@settings(max_examples=40)
@given(lives, slopes, st.integers(2, 16))
def test_k_identical_weibull_wheel_ends_have_eta_k_to_minus_one_over_beta(l10, beta, count):
    bearing = LifeDistribution("weibull", l10, beta)
    units = tuple(Unit(f"wheel end {i}", (("outboard", bearing),)) for i in range(count))
    machine = next(item for item in items_of(units, None) if item.kind == "machine")
    assert machine.b10_h == pytest.approx(l10 * count ** (-1.0 / beta), rel=1e-9)
    assert machine.b50_h == pytest.approx(
        l10 * (math.log(2) / math.log(1 / 0.9)) ** (1 / beta) * count ** (-1.0 / beta), rel=1e-9)


def test_an_unloaded_bearing_never_fails():
    bearings = (("outboard", LifeDistribution("iso281", math.inf)),
                ("inboard", LifeDistribution("iso281", 2000.0)))
    items = items_of((Unit("wheel end", bearings),), 1000.0)
    assert math.isinf(items[0].b10_h) and items[0].reliability_at_target == 1.0
    assert items[2].b10_h == pytest.approx(2000.0, rel=1e-12)
