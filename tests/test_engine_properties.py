"""Invariants of the engine on random inputs (hypothesis)."""

import copy
import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from hubload.casefile import study_from_document
from hubload.engine import evaluate
from conftest import BASE_DOCUMENT

load_kn = st.floats(0.5, 60)
signed_kn = st.floats(-30, 30)


def case(name, percent, wheel, side, tractive, rpm):
    return {"name": name, "time_percent": percent, "wheel_load_kN": wheel,
            "side_force_kN": side, "tractive_force_kN": tractive, "speed_rpm": rpm}


def study_with(cases, **wheel):
    document = copy.deepcopy(BASE_DOCUMENT)
    document["case"] = cases
    document["wheel"].update(wheel)
    return study_from_document(document)


def lives(result):
    return [result.bearings[k].life_h for k in ("outboard", "inboard")] + [result.system_life_h]


@settings(max_examples=60, deadline=None)
@given(wheel=load_kn, side=signed_kn, tractive=signed_kn, rpm=st.floats(1, 300),
       share=st.floats(5, 95), other_wheel=load_kn)
def test_splitting_a_case_into_two_halves_leaves_every_life_unchanged(
        wheel, side, tractive, rpm, share, other_wheel):
    # Palmgren-Miner is linear in time: a case and two half-time copies do equal damage.
    whole = evaluate(study_with([case("a", share, wheel, side, tractive, rpm),
                                 case("b", 100 - share, other_wheel, 0, 0, 40)]))
    split = evaluate(study_with([case("a1", share / 2, wheel, side, tractive, rpm),
                                 case("a2", share / 2, wheel, side, tractive, rpm),
                                 case("b", 100 - share, other_wheel, 0, 0, 40)]))
    for before, after in zip(lives(whole), lives(split)):
        assert after == pytest.approx(before, rel=1e-9)


@settings(max_examples=60, deadline=None)
@given(wheel=load_kn, side=signed_kn, tractive=signed_kn, k=st.floats(0.2, 5))
def test_scaling_all_loads_by_k_scales_l10_by_k_to_the_minus_10_over_3(wheel, side, tractive, k):
    # ISO 281:2007 7.1: L10 = (C/P)^(10/3) and P is linear in the loads (X, Y fixed by Fa/Fr,
    # which scaling leaves unchanged).
    base = evaluate(study_with([case("a", 100, wheel, side, tractive, 60)]))
    scaled = evaluate(study_with([case("a", 100, wheel * k, side * k, tractive * k, 60)]))
    for before, after in zip(lives(base), lives(scaled)):
        assert after == pytest.approx(before * k ** (-10 / 3), rel=1e-9)


@settings(max_examples=60, deadline=None)
@given(wheel=load_kn, side=st.floats(0.5, 30), tractive=signed_kn)
def test_mirroring_the_side_force_swaps_which_bearing_carries_the_thrust(wheel, side, tractive):
    # Axial equilibrium of the shaft: the bearing carrying the external thrust Ka has
    # Fa_A - Fa_B = Ka. Back-to-back, inboard push (positive side force) goes to the
    # outboard bearing, outboard push to the inboard one (issue's definition).
    def axial(side_kn):
        result = evaluate(study_with([case("a", 100, wheel, side_kn, tractive, 60)]))
        return (float(result.bearings["outboard"].axial_n[0]),
                float(result.bearings["inboard"].axial_n[0]))
    outboard_fa, inboard_fa = axial(side)
    assert outboard_fa - inboard_fa == pytest.approx(side * 1e3, rel=1e-9)
    outboard_fa, inboard_fa = axial(-side)
    assert inboard_fa - outboard_fa == pytest.approx(side * 1e3, rel=1e-9)


@settings(max_examples=60, deadline=None)
@given(wheel=load_kn, offset=st.floats(-49, 300), extra=st.floats(0.1, 200))
def test_more_offset_never_lowers_outboard_radial_load_under_vertical_load(wheel, offset, extra):
    # Rigid-shaft statics: |R_out| = W (a - x_in) / span grows with the offset a for a > x_in.
    near = evaluate(study_with([case("a", 100, wheel, 0, 0, 60)], offset_mm=offset))
    far = evaluate(study_with([case("a", 100, wheel, 0, 0, 60)], offset_mm=offset + extra))
    assert far.bearings["outboard"].radial_n[0] >= near.bearings["outboard"].radial_n[0]


@settings(max_examples=60, deadline=None)
@given(wheel=load_kn, offset=st.floats(30, 300), extra=st.floats(0.1, 200))
def test_more_offset_never_raises_outboard_life_with_the_wheel_overhung(wheel, offset, extra):
    # Wheel outboard of both bearings (x_out = 30 mm): both radial loads grow with the
    # offset, so P of the outboard bearing grows and its ISO 281 life falls.
    near = evaluate(study_with([case("a", 100, wheel, 0, 0, 60)], offset_mm=offset))
    far = evaluate(study_with([case("a", 100, wheel, 0, 0, 60)], offset_mm=offset + extra))
    assert far.bearings["outboard"].life_h <= near.bearings["outboard"].life_h * (1 + 1e-12)


def test_wheel_between_the_bearings_can_trade_thrust_for_radial_load():
    # Why the life property above is limited to an overhung wheel: between the bearings,
    # moving the wheel outboard shifts radial load from the inboard to the outboard bearing,
    # and under the ISO 281 pair rule the inboard bearing's induced thrust 0.5 Fr_in / Y on
    # the outboard bearing falls with it. With equal Y, P_out = 0.4 Fr_out + 0.5 Fr_in while
    # Fa/Fr > e (ISO 281:2007 6.2), i.e. P_out = 0.5 W - 0.1 Fr_out: it falls as Fr_out rises.
    near = evaluate(study_with([case("a", 100, 10, 0, 0, 60)], offset_mm=-30))
    far = evaluate(study_with([case("a", 100, 10, 0, 0, 60)], offset_mm=-20))
    for result in (near, far):
        out, inb = result.bearings["outboard"], result.bearings["inboard"]
        expected = 0.4 * out.radial_n[0] + 0.5 * inb.radial_n[0]
        assert out.equivalent_n[0] == pytest.approx(expected, rel=1e-12)
    assert far.bearings["outboard"].equivalent_n[0] < near.bearings["outboard"].equivalent_n[0]


def test_standstill_case_adds_no_damage_but_sets_static_safety():
    # No revolutions, no fatigue damage (ISO 281:2007 7.1 counts life in revolutions); the
    # static safety s0 = C0 / P0 (ISO 76:2006) takes the heaviest case, the parked one.
    result = evaluate(study_with([case("move", 90, 10, 0, 0, 60), case("park", 10, 50, 0, 0, 0)]))
    outboard = result.bearings["outboard"]
    assert outboard.damage_share[1] == 0.0
    assert math.isinf(outboard.case_life_h[1])
    assert outboard.static_safety == pytest.approx(160e3 / outboard.static_equivalent_n[1])


def test_time_fractions_sum_to_one_and_system_shares_sum_to_one():
    # Property: shares of a whole (time, and the pair's Palmgren-Miner damage).
    result = evaluate(study_with([case("a", 60, 10, 2, 1, 60), case("b", 40, 20, -2, 3, 30)]))
    assert np.sum(result.study.cases.time_fraction) == pytest.approx(1.0)
    assert np.sum(result.system_damage_share) == pytest.approx(1.0)
