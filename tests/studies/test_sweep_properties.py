"""Sweeps follow the physics where it is monotone, and target crossings are placed exactly."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from hubload.casefile import load_study
from hubload.report.json.sweep import sweep_document
from hubload.studies.crossing import target_crossings
from hubload.studies.sweep import run_sweep
from studies_helpers import YARD_LOADER, read_toml, write_toml

LIFE_EXPONENT = 10 / 3  # ISO 281:2007, 7.1: L10 = (C/P)^p, p = 10/3 for roller bearings


def lives(sweep, dotted: str) -> np.ndarray:
    """A life of every point, read from the sweep's JSON points (null: infinite)."""
    values = []
    for point in sweep_document(sweep)["points"]:
        node = point
        for key in dotted.split("."):
            node = node[key]
        values.append(math.inf if node is None else node)
    return np.array(values)


def test_outboard_life_scales_with_c_to_the_ten_thirds_iso281_7_1():
    sweep = run_sweep(str(YARD_LOADER), ["pair.outboard.C_kN=100:200:6"])
    c_kn = sweep.axes[0].values
    outboard = lives(sweep, "bearings.outboard.l10_h")
    np.testing.assert_allclose(outboard / outboard[0], (c_kn / c_kn[0]) ** LIFE_EXPONENT,
                               rtol=1e-12)
    inboard = lives(sweep, "bearings.inboard.l10_h")
    np.testing.assert_allclose(inboard, inboard[0], rtol=1e-12)


@settings(max_examples=15, deadline=None)
@given(c_low=st.floats(20, 150), span=st.floats(1, 300), which=st.sampled_from(["outboard",
                                                                                 "inboard"]))
def test_system_life_never_falls_as_a_rating_grows(c_low, span, which):
    sweep = run_sweep(str(YARD_LOADER), [f"pair.{which}.C_kN={c_low}:{c_low + span}:7"])
    for dotted in ("system.l10_h", f"bearings.{which}.l10_h"):
        assert np.all(np.diff(lives(sweep, dotted)) >= 0), dotted


@settings(max_examples=15, deadline=None)
@given(case=st.integers(0, 6), low=st.floats(0, 20), span=st.floats(0.5, 40))
def test_no_life_rises_as_a_wheel_load_grows_without_side_force(tmp_path_factory, case, low,
                                                                  span):
    # With no side force in the varied case, both radial loads and the induced axial
    # loads grow with the wheel load (rigid-shaft statics), so no life may rise.
    document = read_toml(YARD_LOADER)
    document["case"][case]["side_force_kN"] = 0.0
    file = write_toml(document, tmp_path_factory.mktemp("w") / "no_side.toml")
    sweep = run_sweep(str(file), [f"case[{case}].wheel_load_kN={low}:{low + span}:6"])
    for dotted in ("system.l10_h", "bearings.outboard.l10_h", "bearings.inboard.l10_h"):
        assert np.all(np.diff(lives(sweep, dotted)) <= 1e-9 * lives(sweep, dotted)[:-1]), dotted


def test_two_keys_make_a_grid_with_the_first_key_slowest():
    sweep = run_sweep(str(YARD_LOADER), ["wheel.offset_mm=60:120:3",
                                         "pair.outboard.C_kN=150:190:5"])
    assert sweep.shape == (3, 5)
    assert [v["wheel.offset_mm"] for v in sweep.values[:5]] == [60.0] * 5
    assert [v["pair.outboard.C_kN"] for v in sweep.values[:5]] == [150, 160, 170, 180, 190]


@given(a=st.floats(5, 15), b=st.floats(0.01, 0.2), target=st.floats(100, 5000))
def test_crossing_of_an_exponential_life_curve_is_exact(a, b, target):
    # life = exp(a - b x) is linear in log(life), so the log interpolation is exact:
    # the target is reached at x* = (a - ln T) / b (analytic solution).
    x = np.linspace(0, 100, 11)
    found = target_crossings(x, np.exp(a - b * x), target)
    exact = (a - math.log(target)) / b
    if 0 < exact < 100 and not np.any(np.isclose(x, exact)):
        assert len(found) == 1 and found[0].falls_below
        assert found[0].value == pytest.approx(exact, rel=1e-9)
    elif exact < 0 or exact > 100:
        assert found == []


def test_crossing_next_to_an_infinite_life_is_marked_not_interpolated():
    found = target_crossings([0, 1, 2], [None, 500.0, 100.0], 1000.0)
    assert len(found) == 1 and not found[0].interpolated and found[0].value == 1.0


def test_crossing_next_to_a_zero_life_is_marked_not_interpolated():
    # A zero life (a case without equilibrium in the refined model) has no logarithm:
    # the crossing sits at the usable point instead of failing.
    found = target_crossings([0, 1, 2], [5000.0, 2000.0, 0.0], 1000.0)
    assert len(found) == 1 and not found[0].interpolated and found[0].value == 1.0


def test_a_whole_number_key_is_written_back_as_a_whole_number(tmp_path):
    # points[].values must be valid file values: rollers is an integer key of the format.
    document = read_toml(YARD_LOADER)
    sweep = run_sweep(str(YARD_LOADER), ["pair.inboard.rollers=18:20:3"])
    for values, rollers in zip(sweep.values, (18, 19, 20)):
        value = values["pair.inboard.rollers"]
        assert isinstance(value, int) and value == rollers
        document["pair"]["inboard"]["rollers"] = value
        assert load_study(write_toml(document, tmp_path / f"r{value}.toml")).pair.inboard \
            .geometry.rollers == rollers
