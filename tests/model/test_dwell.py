"""Time-at-level classing on nested power-of-two grids (hubload.model.dwell)."""

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy import stats

from hubload.model import dwell

MIN_EXPONENTS = np.array([-6, -6])


def classed(values, weights, classes=(8, 8), splits=()):
    table = dwell.empty_table(len(values), len(weights), MIN_EXPONENTS)
    for part in np.split(np.arange(values.shape[1]), list(splits)):
        table = dwell.add_samples(table, values[:, part], weights[:, part], classes,
                                  MIN_EXPONENTS)
    return table


def as_dict(table):
    order = np.lexsort(table.keys[::-1])
    return table.exponents.tolist(), table.keys[:, order].tolist(), table.sums[:, order]


def test_time_at_level_of_a_sine_follows_the_arcsine_distribution():
    # scipy.stats.arcsine: the level of a sine at a uniformly random time is
    # arcsine-distributed; (x + 1) / 2 maps the sine's [-1, 1] onto [0, 1].
    time = np.linspace(0.0, 1000.0, 2_000_001)[:-1]
    level = np.sin(2 * np.pi * np.sqrt(2) * time)  # incommensurate: no sample repeats
    values = np.stack([level, np.zeros_like(level)])
    table = classed(values, np.ones((1, level.size)), classes=(9, 2))
    keys, sums = dwell.marginal(table, 0)
    width = table.widths[0]
    expected = stats.arcsine.cdf(((keys + 1) * width + 1) / 2) - stats.arcsine.cdf(
        (keys * width + 1) / 2)
    np.testing.assert_allclose(sums[0] / level.size, expected, atol=2e-4)


def test_class_width_is_the_smallest_power_of_two_that_covers_the_span():
    exponents = dwell.width_exponents(np.array([30.0, 16.0, 0.0, 1e-9]), 16,
                                      np.array([-6, -6, -6, -6]))
    # 30/15 = 2 -> 2^1; 16/15 -> 2^1 (2^0 = 1 is too narrow); zero and tiny spans: the floor
    assert exponents.tolist() == [1, 1, -6, -6]


@settings(max_examples=60, deadline=None)
@given(st.lists(st.tuples(st.floats(-50, 50), st.floats(0, 200), st.floats(0, 3)),
                min_size=1, max_size=200),
       st.lists(st.integers(1, 199), max_size=4), st.integers(2, 20))
def test_streaming_in_any_chunks_equals_classing_at_once(rows, cuts, classes):
    data = np.array(rows).T
    values, weights = data[:2], np.vstack([data[2:], data[2:] * data[:1]])
    splits = sorted({c for c in cuts if c < values.shape[1]})
    once = as_dict(classed(values, weights, (classes, classes)))
    streamed = as_dict(classed(values, weights, (classes, classes), splits))
    assert once[:2] == streamed[:2]
    np.testing.assert_allclose(once[2], streamed[2], rtol=1e-12, atol=1e-9)


@settings(max_examples=60, deadline=None)
@given(st.lists(st.tuples(st.floats(-50, 50), st.floats(-5, 500), st.floats(0, 3)),
                min_size=2, max_size=200), st.integers(1, 199), st.integers(2, 20))
def test_merged_tables_equal_the_table_of_the_concatenation(rows, cut, classes):
    data = np.array(rows).T
    cut = min(cut, data.shape[1] - 1)
    values, weights = data[:2], data[2:]
    first = classed(values[:, :cut], weights[:, :cut], (classes, classes))
    second = classed(values[:, cut:], weights[:, cut:], (classes, classes))
    merged = as_dict(dwell.merged([first, second], (classes, classes), MIN_EXPONENTS))
    whole = as_dict(classed(values, weights, (classes, classes)))
    assert merged[:2] == whole[:2]
    np.testing.assert_allclose(merged[2], whole[2], rtol=1e-12, atol=1e-9)


@settings(max_examples=60, deadline=None)
@given(st.lists(st.tuples(st.floats(-1e4, 1e4), st.floats(0, 1e3)), min_size=1, max_size=300),
       st.integers(2, 40))
def test_classes_keep_every_sample_and_never_exceed_the_class_count(rows, classes):
    data = np.array(rows).T
    values = np.vstack([data[:1], np.zeros_like(data[:1])])
    table = classed(values, data[1:], (classes, 2))
    assert np.sum(table.sums) == pytest.approx(np.sum(data[1]), rel=1e-12, abs=1e-9)
    assert len(set(table.keys[0].tolist())) <= classes
    low, high = table.class_bounds()
    assert np.all(low[0] <= table.high[0] + table.widths[0])
    for value in data[0]:
        assert np.any((low[0] <= value) & (value < high[0]))


def test_classes_never_straddle_zero():
    values = np.array([[-0.1, 0.1, -3.0, 2.9], [0.0, 0.0, 0.0, 0.0]])
    table = classed(values, np.ones((1, 4)), (2, 2))
    low, high = table.class_bounds()
    assert np.all((low[0] >= 0) | (high[0] <= 0))


def test_a_tiny_value_below_zero_beside_a_class_bound_keeps_the_class_count():
    # Property above, example it found: the span 1 + 2e-311 rounds to 1, which a two-class
    # grid of width 1 seems to cover, yet -2e-311, 0 and 1 fall in three zero-anchored classes.
    values = np.array([[0.0, 1.0, -2.225073858507e-311], [0.0, 0.0, 0.0]])
    table = classed(values, np.ones((1, 3)), (2, 2))
    assert len(set(table.keys[0].tolist())) <= 2
    low, high = table.class_bounds()
    for value in values[0]:
        assert np.any((low[0] <= value) & (value < high[0]))
