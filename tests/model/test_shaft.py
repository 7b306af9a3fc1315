"""Shaft check model against Shigley's worked examples, sympy's beam solver and invariants.

Book: R. G. Budynas, J. K. Nisbett, Shigley's Mechanical Engineering Design (10th ed.
followed by the code; the 9th ed. has the same numbers for the examples quoted here).
Values marked "from memory" were recalled from the book, not re-read.
"""

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from beam_reference import sympy_two_support_beam
from hubload.model.iso281 import damage_rate_per_hour
from hubload.model.shaft import fatigue, strength, stress

KPSI = 6.894757e6
MPA = 1e6
INCH = 0.0254
LBF_IN = 4.4482216 * 0.0254


def rotating_stresses(ma_nm, ta_nm, mm_nm, tm_nm, d_m, kf, kfs):
    """Von Mises amplitude and mean of a shaft with alternating and mean bending and torque
    (Shigley 10th ed. eqs. 7-5, 7-6), built from the model's one-sided parts."""
    alternating = stress.von_mises_stresses(
        stress.SectionLoads(np.array(ma_nm), np.array(ta_nm), np.array(0.0), np.array(0.0)),
        d_m, kf, kfs)
    mean = stress.von_mises_stresses(
        stress.SectionLoads(np.array(mm_nm), np.array(tm_nm), np.array(0.0), np.array(0.0)),
        d_m, kf, kfs)
    return alternating.peak_pa, mean.peak_pa


# --- endurance limit and Marin factors -----------------------------------------------------

def test_surface_factor_machined_520_mpa_shigley_9th_example_6_3():
    # Shigley 9th ed., example 6-3: machined, Sut = 520 MPa -> ka = 4.51 (520)^-0.265 = 0.860.
    assert strength.surface_factor(520 * MPA, "machined") == pytest.approx(0.860, abs=5e-4)


def test_size_factor_rotating_32_mm_shigley_example_6_4():
    # Shigley 9th/10th ed., example 6-4 (from memory): rotating 32 mm shaft -> kb = 0.858.
    assert strength.size_factor_rotating(0.032) == pytest.approx(0.858, abs=5e-4)


def test_size_factor_large_range_continues_near_51_mm():
    # Shigley 10th ed. eq. 6-20 (from memory): the two fits meet within 0.2 % at 51 mm.
    below, above = strength.size_factor_rotating(np.array([0.051, 0.05101]))
    assert above == pytest.approx(below, rel=2e-3)
    assert strength.size_factor_rotating(0.100) == pytest.approx(1.51 * 100 ** -0.157)


def test_temperature_factor_450_f_shigley_example_6_5():
    # Shigley 9th/10th ed., example 6-5 (from memory): 450 F -> kd = 1.007; 70 F -> 1.000.
    assert strength.temperature_factor((450 - 32) / 1.8) == pytest.approx(1.007, abs=5e-4)
    assert strength.temperature_factor(21.1) == pytest.approx(1.000, abs=5e-4)
    assert strength.temperature_factor(-30.0) == 1.0 * strength.temperature_factor(21.1)


@pytest.mark.parametrize("reliability, ke", [
    (50, 1.000), (90, 0.897), (95, 0.868), (99, 0.814), (99.9, 0.753),
    (99.99, 0.702), (99.999, 0.659), (99.9999, 0.620)])
def test_reliability_factor_shigley_table_6_5(reliability, ke):
    # Shigley 9th/10th ed., table 6-5 (from memory).
    assert strength.reliability_factor(reliability) == pytest.approx(ke, abs=6e-4)


def test_endurance_limit_caps_at_700_mpa_shigley_eq_6_8():
    # Shigley 10th ed. eq. 6-8: S'e = 0.5 Sut up to 1400 MPa, 700 MPa above.
    limits = strength.rotating_beam_endurance_limit_pa(np.array([600, 1400, 1800]) * MPA)
    assert limits / MPA == pytest.approx([300, 700, 700])


def test_fatigue_strength_fraction_shigley_figure_6_18():
    # Shigley 9th ed. fig. 6-18 / example 6-2 (from memory): Sut = 90 kpsi -> f = 0.86;
    # the curve reads 0.9 at 70 kpsi and about 0.77 at 200 kpsi; f = 0.9 below 70 kpsi.
    f = strength.fatigue_strength_fraction(np.array([90, 70, 200, 60]) * KPSI)
    assert f == pytest.approx([0.86, 0.90, 0.77, 0.90], abs=5e-3)


def test_notch_factor_from_fillet_radius_shigley_example_6_6():
    # Shigley 9th ed., example 6-6 (from memory): Sut = 690 MPa, fillet r = 3 mm, Kt = 1.65
    # -> sqrt(a) = 0.0622 sqrt(in), Kf = 1.55.
    assert strength.neuber_constant_sqrt_m(690 * MPA) / np.sqrt(INCH) == pytest.approx(
        0.0622, abs=3e-4)
    q = strength.notch_sensitivity(0.003, 690 * MPA)
    assert strength.fatigue_notch_factor(1.65, q) == pytest.approx(1.55, abs=5e-3)


def test_notch_sensitivity_torsion_below_bending_shigley_figure_6_21():
    # Shigley fig. 6-20/6-21 (common reading): for the same steel and radius the torsional
    # notch sensitivity is higher than the bending one, i.e. sqrt(a) is smaller.
    assert strength.neuber_constant_sqrt_m(690 * MPA, torsion=True) < \
        strength.neuber_constant_sqrt_m(690 * MPA)


# --- S-N line and life --------------------------------------------------------------------

def test_sn_line_shigley_problem_6_15():
    # Shigley problem 6-15: Sut = 551 MPa, Se = 276 MPa, sigma_a = 358.5 MPa, f = 0.9
    # -> about 45,800 cycles.
    cycles = fatigue.cycles_to_failure(358.5 * MPA, 551 * MPA, 276 * MPA, 0.9)
    assert cycles == pytest.approx(45_800, rel=5e-3)


def test_sn_line_shigley_example_6_2():
    # Shigley 9th ed., example 6-2 (from memory): Sut = 90 kpsi, Se = 45 kpsi, f = 0.86
    # -> a = 133.1 kpsi, b = -0.0785, N = 77,500 cycles at 55 kpsi.
    a, b = fatigue.basquin_constants(90 * KPSI, 45 * KPSI, 0.86)
    assert a / KPSI == pytest.approx(133.1, abs=0.1)
    assert b == pytest.approx(-0.0785, abs=1e-4)
    cycles = fatigue.cycles_to_failure(55 * KPSI, 90 * KPSI, 45 * KPSI, 0.86)
    assert cycles == pytest.approx(77_500, rel=1e-2)


def test_sn_line_ends_and_endurance_limit():
    # Shigley 10th ed. fig. 6-10: f Sut at 10^3 cycles, Se at 10^6, Sut at 1 cycle (eq. 6-17),
    # no failure at or below Se; at or above Sut the first cycle breaks the part.
    sut, se, f = 700 * MPA, 260 * MPA, 0.85
    cycles = fatigue.cycles_to_failure(np.array([f * sut, se * 1.000001, sut, 2 * sut, np.inf,
                                                 se, 0.0]), sut, se, f)
    assert cycles[:5] == pytest.approx([1e3, 1e6, 1.0, 1.0, 1.0], rel=1e-4)
    assert np.all(np.isinf(cycles[5:]))


def test_goodman_equivalent_reversed_stress_shigley_section_6_12():
    # Shigley 10th ed. (from memory): sigma_rev = sigma_a / (1 - sigma_m / Sut); by hand,
    # 150 / (1 - 50 / 200) = 200.
    assert fatigue.equivalent_reversed_stress_pa(150.0, 50.0, 200.0) == pytest.approx(200.0)
    assert np.isinf(fatigue.equivalent_reversed_stress_pa(100.0, 200.0, 200.0))


# --- safety criteria ------------------------------------------------------------------------

def test_de_goodman_shigley_problem_7_1():
    # Shigley problem 7-1: Ma 600, Ta 400, Mm 500, Tm 300 lbf in, Kf 2.2, Kfs 1.8, Se 30 kpsi,
    # Sut 100 kpsi -> d = 1.073 in for n = 2 (DE-Goodman).
    alternating, mean = rotating_stresses(600 * LBF_IN, 400 * LBF_IN, 500 * LBF_IN,
                                          300 * LBF_IN, 1.073 * INCH, 2.2, 1.8)
    n = stress.goodman_safety(alternating, mean, 30 * KPSI, 100 * KPSI)
    assert n == pytest.approx(2.0, abs=3e-3)


def test_de_asme_elliptic_shigley_problem_7_1():
    # Shigley problem 7-1(b) (from memory: Sy = 80 kpsi, answer d = 1.012 in for n = 2).
    alternating, mean = rotating_stresses(600 * LBF_IN, 400 * LBF_IN, 500 * LBF_IN,
                                          300 * LBF_IN, 1.012 * INCH, 2.2, 1.8)
    n = stress.asme_elliptic_safety(alternating, mean, 30 * KPSI, 80 * KPSI)
    assert n == pytest.approx(2.0, abs=4e-3)


def test_shaft_shoulder_shigley_example_7_1():
    # Shigley 9th/10th ed., example 7-1 (from memory): machined shoulder, d = 1.100 in,
    # M = 1260 lbf in reversed, T = 1100 lbf in steady, Sut = 105 kpsi, Sy = 82 kpsi,
    # reliability 99 %, Kf = 1.58, Kfs = 1.39 -> ka = 0.787, kb = 0.870, Se = 29.3 kpsi,
    # DE-Goodman n = 1.63, DE-ASME elliptic n = 1.88, first-cycle yield ny = 4.48.
    sut, sy, d = 105 * KPSI, 82 * KPSI, 1.100 * INCH
    factors = strength.marin_factors(sut, "machined", d, 20.0, 99.0)
    assert factors.surface == pytest.approx(0.787, abs=2e-3)
    assert factors.size == pytest.approx(0.870, abs=1e-3)
    se = strength.endurance_limit_pa(sut, factors)
    assert se / KPSI == pytest.approx(29.3, abs=0.1)
    loads = stress.SectionLoads(np.array(1260 * LBF_IN), np.array(1100 * LBF_IN),
                                np.array(0.0), np.array(0.0))
    stresses = stress.von_mises_stresses(loads, d, 1.58, 1.39)
    assert stress.fatigue_safety(stresses, se, sut, sy, "goodman") == pytest.approx(1.63, abs=0.01)
    assert stress.fatigue_safety(stresses, se, sut, sy, "asme-elliptic") == pytest.approx(
        1.88, abs=0.01)
    assert stress.yield_safety(stresses, sy) == pytest.approx(4.48, abs=0.02)


def test_unknown_criterion_is_refused():
    zero = stress.SectionStresses(np.array(1.0), np.array(1.0), np.array(1.0))
    with pytest.raises(ValueError):
        stress.fatigue_safety(zero, 1.0, 1.0, 1.0, "soderberg")


# --- section loads against sympy's beam solver -------------------------------------------

@pytest.mark.parametrize("section_x_m", [0.085, 0.060, 0.010, -0.030])
def test_section_moment_both_planes_match_sympy_beam_solver(section_x_m):
    # Reference: sympy's beam solver, one beam per plane, resultant = vector sum.
    wheel, side, tractive, offset, loaded_r = 20e3, 6e3, -9e3, 0.095, 0.385
    outboard, inboard = 0.028, -0.052
    vertical, shear_v = sympy_two_support_beam(wheel, -loaded_r * side, offset, outboard,
                                               inboard, section_x_m)[2:]
    horizontal, shear_h = sympy_two_support_beam(tractive, 0.0, offset, outboard, inboard,
                                                 section_x_m)[2:]
    loads = stress.section_loads(section_x_m, True, wheel, side, tractive, offset, loaded_r,
                                 0.395, outboard, inboard, "back-to-back")
    assert loads.bending_nm == pytest.approx(np.hypot(vertical, horizontal), rel=1e-9)
    assert loads.shear_n == pytest.approx(np.hypot(shear_v, shear_h), rel=1e-9)
    assert loads.torque_nm == pytest.approx(9e3 * 0.395)


@pytest.mark.parametrize("section_x_m", [0.030, 0.000, -0.030])
def test_dished_wheel_loads_the_shaft_through_its_flange_like_sympy_beam_solver(section_x_m):
    # A dished wheel (centre plane at -18 mm, inboard of the outboard bearing) bolted to a
    # flange at +35 mm: sympy's beam gets the tyre forces moved to the flange with their
    # transfer couples (rigid wheel), so every section inboard of the flange is loaded.
    wheel, side, tractive, offset, loaded_r, flange = 10e3, 3e3, 4e3, -0.018, 0.290, 0.035
    outboard, inboard = 0.022, -0.041
    vertical, _ = sympy_two_support_beam(wheel, (offset - flange) * wheel - loaded_r * side,
                                         flange, outboard, inboard, section_x_m)[2:]
    horizontal, _ = sympy_two_support_beam(tractive, (offset - flange) * tractive, flange,
                                           outboard, inboard, section_x_m)[2:]
    loads = stress.section_loads(section_x_m, False, wheel, side, tractive, offset, loaded_r,
                                 0.298, outboard, inboard, "face-to-face")
    assert loads.bending_nm == pytest.approx(np.hypot(vertical, horizontal), rel=1e-9)
    assert loads.torque_nm == 0.0


def test_axial_force_runs_from_wheel_to_the_thrust_bearing():
    # Method of sections (Gere & Goodno ch. 1): a side force pushing the shaft inboard is
    # taken by the outboard bearing back-to-back, by the inboard bearing face-to-face.
    sections = np.array([0.06, 0.00, -0.06])
    b2b = stress.section_axial_force_n(sections, 5e3, 0.028, -0.052, "back-to-back")
    f2f = stress.section_axial_force_n(sections, 5e3, 0.028, -0.052, "face-to-face")
    assert b2b == pytest.approx([-5e3, 0.0, 0.0])
    assert f2f == pytest.approx([-5e3, -5e3, 0.0])
    pull = stress.section_axial_force_n(sections, -5e3, 0.028, -0.052, "back-to-back")
    assert pull == pytest.approx([5e3, 5e3, 0.0])


# --- properties -------------------------------------------------------------------------------

def section_safety(offset_m=0.095, scale=1.0, section_x_m=0.06, side_n=-3e3, wheel_n=18e3,
                   tractive_n=6e3, criterion="goodman"):
    loads = stress.section_loads(section_x_m, True, scale * wheel_n, scale * side_n,
                                 scale * tractive_n, offset_m, 0.385, 0.395, 0.028, -0.052,
                                 "back-to-back")
    stresses = stress.von_mises_stresses(loads, 0.055, 1.8, 1.5)
    return (stress.fatigue_safety(stresses, 250 * MPA, 800 * MPA, 600 * MPA, criterion),
            stress.yield_safety(stresses, 600 * MPA))


@settings(max_examples=100, deadline=None)
@given(offset=st.floats(0.03, 0.3), grow=st.floats(0.0, 0.1), side=st.floats(-20e3, 0),
       section=st.floats(-0.05, 0.03), criterion=st.sampled_from(stress.CRITERIA))
def test_safety_falls_as_the_wheel_offset_grows(offset, grow, side, section, criterion):
    # Property (statics: lever arms grow with the offset); wheel centre plane outboard of the
    # bearings and of the section, side force outboard or zero so that its couple adds to the
    # wheel load's moment.
    before = section_safety(offset, section_x_m=section, side_n=side, criterion=criterion)
    after = section_safety(offset + grow, section_x_m=section, side_n=side, criterion=criterion)
    assert after[0] <= before[0] * (1 + 1e-12)
    assert after[1] <= before[1] * (1 + 1e-12)


@settings(max_examples=100, deadline=None)
@given(scale=st.floats(1.0, 10.0), side=st.floats(-20e3, 20e3),
       section=st.floats(-0.05, 0.09), criterion=st.sampled_from(stress.CRITERIA))
def test_safety_falls_in_proportion_as_the_load_grows(scale, side, section, criterion):
    # Property: stresses are linear in the loads and both criteria are homogeneous.
    base = section_safety(section_x_m=section, side_n=side, criterion=criterion)
    grown = section_safety(scale=scale, section_x_m=section, side_n=side, criterion=criterion)
    assert grown[0] == pytest.approx(base[0] / scale, rel=1e-9)
    assert grown[1] == pytest.approx(base[1] / scale, rel=1e-9)


SUT, SE, F = 800 * MPA, 260 * MPA, 0.84
stresses_mpa = st.lists(st.floats(0, 700), min_size=1, max_size=6)


@settings(max_examples=100, deadline=None)
@given(alternating=stresses_mpa, below=st.floats(0, 0.999), mean=st.floats(0, 500),
       speed=st.floats(1, 500))
def test_case_below_the_endurance_limit_adds_no_damage(alternating, below, mean, speed):
    # Property (Shigley fig. 6-10: no failure below Se): appending such a case leaves the
    # Palmgren-Miner life of the others unchanged.
    quiet = below * SE * (1 - mean * MPA / SUT)
    cycles = fatigue.cycles_to_failure(
        fatigue.equivalent_reversed_stress_pa(np.array(alternating) * MPA, 0.0, SUT), SUT, SE, F)
    quiet_cycles = fatigue.cycles_to_failure(
        fatigue.equivalent_reversed_stress_pa(quiet, mean * MPA, SUT), SUT, SE, F)
    share = np.full(len(alternating), 1.0 / (len(alternating) + 1))
    assert damage_rate_per_hour(0.5, fatigue.case_life_h(quiet_cycles, speed)) == 0.0
    with_quiet = fatigue.spectrum_life_h(np.append(share, share[0]),
                                         np.append(cycles, quiet_cycles), speed)
    assert with_quiet == pytest.approx(fatigue.spectrum_life_h(share, cycles, speed), rel=1e-12)


@settings(max_examples=100, deadline=None)
@given(alternating=stresses_mpa, split=st.integers(0, 5),
       speeds=st.one_of(st.just(0.0), st.floats(0.01, 500)))
def test_splitting_a_case_in_two_halves_leaves_the_life_unchanged(alternating, split, speeds):
    # Property of the linear damage sum (Palmgren-Miner).
    split = split % len(alternating)
    share = np.full(len(alternating), 1.0 / len(alternating))
    cycles = fatigue.cycles_to_failure(np.array(alternating) * MPA, SUT, SE, F)
    halves = np.concatenate([share, [share[split] / 2]])
    halves[split] /= 2
    both = fatigue.spectrum_life_h(halves, np.append(cycles, cycles[split]), speeds)
    assert both == pytest.approx(fatigue.spectrum_life_h(share, cycles, speeds), rel=1e-12)


def test_section_loads_broadcast_over_batch_axes():
    wheel = np.array([10e3, 20e3, 30e3])
    offsets = np.array([[0.05], [0.10]])
    loads = stress.section_loads(0.04, True, wheel, 0.0, 2e3, offsets, 0.385, 0.395, 0.028,
                                 -0.052, "back-to-back")
    stresses = stress.von_mises_stresses(loads, np.array([[0.05], [0.06]]), 1.5, 1.3)
    assert stresses.alternating_pa.shape == (2, 3)
    assert np.all(np.diff(loads.bending_nm, axis=-1) > 0)
