"""Stacking variants of a study into one batched engine call gives each variant's own result."""

from __future__ import annotations

import dataclasses

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from hubload.casefile import load_study
from hubload.domain.batch import StackError, pick, stack_studies
from hubload.engine import evaluate, evaluate_many
from hubload.studies.compare import evaluate_all
from studies_helpers import YARD_LOADER


def variant(study, offset_mm, c_outboard_kn, wheel_load_scale):
    cases = dataclasses.replace(study.cases,
                                wheel_load_n=study.cases.wheel_load_n * wheel_load_scale)
    outboard = dataclasses.replace(study.pair.outboard, dynamic_rating_n=c_outboard_kn * 1e3)
    return dataclasses.replace(
        study, wheel=dataclasses.replace(study.wheel, offset_m=offset_mm * 1e-3),
        pair=dataclasses.replace(study.pair, outboard=outboard), cases=cases)


def assert_same(batched, single) -> None:
    """Every array of a result, with shapes, equal (recursively over dataclasses and dicts)."""
    if dataclasses.is_dataclass(single):
        for field in dataclasses.fields(single):
            if field.name != "study":
                assert_same(getattr(batched, field.name), getattr(single, field.name))
    elif isinstance(single, dict):
        assert batched.keys() == single.keys()
        for key in single:
            assert_same(batched[key], single[key])
    elif isinstance(single, (list, tuple)):
        assert len(batched) == len(single)
        for batched_item, single_item in zip(batched, single):
            assert_same(batched_item, single_item)
    elif isinstance(single, (np.ndarray, float)):
        assert np.shape(batched) == np.shape(single)
        np.testing.assert_allclose(batched, single, rtol=1e-13)
    else:
        assert batched == single


@settings(max_examples=20, deadline=None)
@given(st.lists(st.tuples(st.floats(-40, 250), st.floats(40, 400), st.floats(0.2, 3)),
                min_size=1, max_size=6))
def test_batched_evaluation_equals_one_by_one(parameters):
    base = load_study(YARD_LOADER)
    studies = [variant(base, *p) for p in parameters]
    for study, result in zip(studies, evaluate_many(studies)):
        assert result.study is study
        assert_same(result, evaluate(study))


def test_a_differing_arrangement_cannot_be_stacked_but_compare_still_evaluates_it():
    base = load_study(YARD_LOADER)
    other = dataclasses.replace(base, pair=dataclasses.replace(base.pair,
                                                                 arrangement="face-to-face"))
    with pytest.raises(StackError):
        stack_studies([base, other])
    for result, study in zip(evaluate_all([base, other]), (base, other)):
        assert_same(result, evaluate(study))


@dataclasses.dataclass(frozen=True)
class Section:
    name: str
    diameter_m: float
    carries_torque: bool


@dataclasses.dataclass(frozen=True)
class Shaft:
    sections: tuple[Section, ...]
    curve_m: np.ndarray


def test_fields_added_later_stack_generically_and_pick_back():
    # A block of the kind later features add: tuples of dataclasses, shared arrays, flags.
    shafts = [Shaft((Section("fillet", d, True), Section("groove", 0.05, False)),
                    np.array([0.0, 0.1])) for d in (0.04, 0.045, 0.05)]
    stacked = stack_values_of(shafts)
    assert stacked.sections[0].diameter_m.shape == (3, 1)
    assert stacked.sections[0].carries_torque is True
    assert stacked.curve_m is shafts[0].curve_m  # equal in every point: shared, not stacked
    picked = pick(stacked, 1, 3, [])
    assert float(picked.sections[0].diameter_m[0]) == 0.045


def stack_values_of(values):
    from hubload.domain.batch import stack_values

    return stack_values(values, "shaft")
