"""ISO 281:2007 modified-life factors checked against the standard's tables and hand values.

Sources are named beside each check. Constants of ISO 281 annexes A and B and
the aISO equations are recalled from memory (so are the tests built on them).
"""

import math

import numpy as np
import pytest
from hypothesis import given
from hypothesis import strategies as st
from scipy.stats import weibull_min

from hubload.model import lubrication as lub

CST = 1e-6
MM = 1e-3


# --- a1: ISO 281:2007, 9.2, table 12 -------------------------------------------------

@pytest.mark.parametrize("reliability, a1_table", [
    (90, 1.0), (95, 0.64), (99, 0.25),        # ISO 281:2007 table 12 (values quoted in the issue)
])
def test_a1_reproduces_iso281_2007_table_12(reliability, a1_table):
    assert lub.reliability_factor(reliability) == pytest.approx(a1_table, abs=0.005)


def test_a1_reproduces_iso281_2007_table_12_at_99_9_percent():
    assert lub.reliability_factor(99.9) == pytest.approx(0.093, abs=0.0005)


@pytest.mark.parametrize("reliability, a1_table", [
    # ISO 281:2007 table 12, remaining rows (from memory)
    (96, 0.55), (97, 0.47), (98, 0.37), (99.2, 0.22), (99.4, 0.19), (99.6, 0.16),
    (99.8, 0.12), (99.92, 0.087), (99.94, 0.080), (99.95, 0.077),
])
def test_a1_reproduces_iso281_2007_table_12_remaining_rows(reliability, a1_table):
    digits = 3 if a1_table < 0.1 else 2
    assert lub.reliability_factor(reliability) == pytest.approx(a1_table, abs=0.5 * 10 ** -digits)


@given(st.floats(90.0, 99.95))
def test_a1_is_the_quantile_of_a_three_parameter_weibull_from_scipy(reliability):
    """Slope 1.5, minimum life 0.05 L10, scaled so that the 90 % life is L10 (ISO 281:2007, 9.2)."""
    scale = 0.95 / (-math.log(0.9)) ** (1 / 1.5)
    life = weibull_min(c=1.5, loc=0.05, scale=scale)
    assert lub.reliability_factor(reliability) == pytest.approx(
        life.isf(reliability / 100.0), rel=1e-9)


@given(st.floats(90.0, 99.95), st.floats(90.0, 99.95))
def test_higher_reliability_never_gives_a_longer_life(r_low, r_high):
    r_low, r_high = sorted((r_low, r_high))
    assert lub.reliability_factor(r_high) <= lub.reliability_factor(r_low)


def test_life_symbols_follow_iso281_naming():
    assert [lub.life_symbol(r) for r in (90, 95, 99, 99.95)] == ["L10m", "L5m", "L1m", "L0.05m"]


# --- Reference viscosity nu1: ISO 281:2007, 9.3.3 ------------------------------------

def test_reference_viscosity_hand_computed_below_1000_rpm():
    # 45000 * 100^-0.83 * 100^-0.5 = 4500 * 10^-1.66 = 98.449 mm^2/s (hand computed)
    nu1 = lub.reference_viscosity_m2_s(100.0, 100 * MM) / CST
    assert nu1 == pytest.approx(98.449, abs=0.001)


def test_reference_viscosity_hand_computed_above_1000_rpm():
    # 4500 * 1600^-0.5 * 64^-0.5 = 4500 / 40 / 8 = 14.0625 mm^2/s (hand computed)
    assert lub.reference_viscosity_m2_s(1600.0, 64 * MM) / CST == pytest.approx(14.0625)


def test_reference_viscosity_is_infinite_at_standstill():
    assert np.isinf(lub.reference_viscosity_m2_s(0.0, 60 * MM))


# --- Walther / ASTM D341 --------------------------------------------------------------

@pytest.mark.parametrize("nu40, nu100, vg_range", [
    (46.0, 6.8, (41.4, 50.6)),   # ISO 3448: VG 46 is 41.4..50.6 mm^2/s at 40 C
    (68.0, 8.7, (61.2, 74.8)),   # ISO 3448: VG 68 is 61.2..74.8 mm^2/s at 40 C
])
def test_walther_fit_reproduces_data_sheet_points_and_iso_vg_range(nu40, nu100, vg_range):
    at_40, at_100 = lub.oil_viscosity_m2_s(
        np.array([lub.TEMPERATURE_40C_K, lub.TEMPERATURE_100C_K]), nu40 * CST, nu100 * CST) / CST
    assert at_40 == pytest.approx(nu40, rel=1e-9)
    assert at_100 == pytest.approx(nu100, rel=1e-9)
    assert vg_range[0] <= at_40 <= vg_range[1]


def test_walther_line_is_straight_in_astm_d341_coordinates():
    """ASTM D341: log log (nu + 0.7) is linear in log T, so a third point lies on the line."""
    temperatures = np.array([313.15, 343.15, 373.15])
    nu = lub.oil_viscosity_m2_s(temperatures, 46 * CST, 6.8 * CST) / CST
    z = np.log10(np.log10(nu + 0.7))
    slope_1 = (z[1] - z[0]) / (np.log10(temperatures[1]) - np.log10(temperatures[0]))
    slope_2 = (z[2] - z[1]) / (np.log10(temperatures[2]) - np.log10(temperatures[1]))
    assert slope_1 == pytest.approx(slope_2, rel=1e-9)


@given(st.floats(-40.0, 150.0), st.floats(-40.0, 150.0))
def test_oil_thins_as_it_warms(t_a, t_b):
    cold, warm = sorted((t_a, t_b))
    nu = lub.oil_viscosity_m2_s(np.array([cold, warm]) + 273.15, 46 * CST, 6.8 * CST)
    assert nu[1] <= nu[0]


# --- aISO for roller bearings: ISO 281:2007, 9.3.5 -------------------------------------

@pytest.mark.parametrize("boundary", [0.4, 1.0])
@pytest.mark.parametrize("load_ratio", [0.05, 0.2, 0.5, 1.0])
def test_a_iso_branches_meet_at_kappa_boundaries(boundary, load_ratio):
    """The three kappa ranges of the ISO 281 roller equations join (continuity)."""
    below = lub.life_modification_factor(boundary * (1 - 1e-12), 1.0, load_ratio, 1.0)
    at = lub.life_modification_factor(boundary, 1.0, load_ratio, 1.0)
    assert below == pytest.approx(at, rel=1e-4)


def test_a_iso_is_capped_at_50():
    """ISO 281:2007, 9.3.5: aISO shall not exceed 50."""
    assert lub.life_modification_factor(4.0, 1.0, 10.0, 1.0) == 50.0
    assert lub.life_modification_factor(4.0, 1.0, 1.0, 0.0) == 50.0


def test_a_iso_is_0_1_at_kappa_0_1_for_any_load():
    """ISO 281:2007 figure 4 (from memory): every eC Cu / P curve starts at aISO = 0.1."""
    ratios = np.array([0.005, 0.1, 1.0, 5.0])
    assert np.allclose(lub.life_modification_factor(0.1, 1.0, ratios, 1.0), 0.1, rtol=1e-3)


def test_kappa_above_4_is_taken_as_4():
    """ISO 281:2007, 9.3.5: for kappa > 4 use kappa = 4."""
    assert lub.life_modification_factor(9.0, 1.0, 0.3, 1.0) == lub.life_modification_factor(
        4.0, 1.0, 0.3, 1.0)


def test_kappa_below_0_1_is_flagged_and_bounded_by_the_value_at_0_1():
    assert lub.kappa_outside_scope(np.array([0.05, 0.1, 2.0])).tolist() == [True, False, False]
    assert lub.life_modification_factor(0.02, 0.5, 0.5, 1.0) == lub.life_modification_factor(
        0.1, 0.5, 0.5, 1.0)


@given(st.floats(0.01, 10.0), st.floats(0.0, 1.0), st.floats(0.0, 20.0))
def test_a_iso_stays_between_0_1_and_50(kappa, e_c, load_ratio):
    a_iso = lub.life_modification_factor(kappa, e_c, load_ratio, 1.0)
    assert 0.1 * (1 - 1e-3) <= a_iso <= 50.0


# --- Contamination factor eC: ISO 281:2007 annex A (constants from memory) --------------

@pytest.mark.parametrize("method", list(lub.CONTAMINATION_LEVELS))
@given(kappa=st.floats(0.1, 4.0), dm_mm=st.floats(15.0, 500.0), factor=st.floats(1.0, 3.0))
def test_e_c_never_falls_with_size_or_film(method, kappa, dm_mm, factor):
    # Property of ISO 281:2007 annex A (from memory): a larger bearing tolerates the same
    # particles better, and a thicker film (higher kappa, up to 4) separates more of them.
    for level in lub.CONTAMINATION_LEVELS[method]:
        base = lub.contamination_factor(kappa, dm_mm * MM, level)
        assert lub.contamination_factor(kappa, dm_mm * factor * MM, level) >= base - 1e-12
        assert lub.contamination_factor(min(kappa * factor, 4.0), dm_mm * MM, level) \
            >= base - 1e-12


def test_iso4406_code_between_rows_uses_the_dirtier_row():
    match = lub.iso4406_level("oil-filtered", 16, 13)
    assert match.level.label == "-/17/14" and not match.exact
    assert "dirtier row -/17/14" in match.note
    assert lub.iso4406_level("oil-unfiltered", 17, 14).exact


def test_iso4406_code_cleaner_than_the_table_uses_its_cleanest_row():
    match = lub.iso4406_level("oil-filtered", 11, 8)
    assert match.level.label == "-/13/10" and not match.exact
    assert "cleaner than the cleanest row" in match.note and "between" not in match.note
    assert "between rows" in lub.iso4406_level("oil-filtered", 13, 11).note


def test_e_c_above_kappa_4_is_evaluated_at_4_as_a_iso():
    """ISO 281:2007 bounds kappa at 4 in the life modification factor (9.3, from memory);
    eC only feeds aISO, so it takes the same bounded kappa (as kappa < 0.1 is evaluated at
    0.1 for both)."""
    level = lub.iso4406_level("oil-filtered", 19, 16).level
    assert lub.contamination_factor(9.0, 85 * MM, level) == lub.contamination_factor(
        4.0, 85 * MM, level)
    assert lub.contamination_factor(0.02, 85 * MM, level) == lub.contamination_factor(
        0.1, 85 * MM, level)


def test_iso4406_code_dirtier_than_the_table_gives_e_c_zero():
    match = lub.iso4406_level("oil-filtered", 22, 19)
    assert lub.contamination_factor(1.0, 80 * MM, match.level) == 0.0
    assert "dirtier than" in match.note


def test_very_severe_grease_contamination_gives_e_c_about_zero():
    """ISO 281:2007 guideline table for eC (from memory): very severe contamination, eC = 0."""
    level = lub.CONTAMINATION_LEVELS["grease"][-1]
    dm = np.array([20.0, 50.0, 66.0]) * MM
    assert np.all(lub.contamination_factor(1.0, dm, level) == 0.0)


@pytest.mark.parametrize("method", list(lub.CONTAMINATION_LEVELS))
@given(kappa=st.floats(0.01, 10.0), dm_mm=st.floats(15.0, 500.0))
def test_e_c_falls_from_row_to_dirtier_row(method, kappa, dm_mm):
    values = [lub.contamination_factor(kappa, dm_mm * MM, level)
              for level in lub.CONTAMINATION_LEVELS[method]]
    assert all(0.0 <= v <= 1.0 for v in values)
    assert all(dirty <= clean for clean, dirty in zip(values, values[1:]))


@given(kappa=st.floats(0.01, 10.0), dm_mm=st.floats(15.0, 500.0), row=st.integers(0, 4))
def test_online_filtration_never_does_worse_than_none(kappa, dm_mm, row):
    filtered = lub.CONTAMINATION_LEVELS["oil-filtered"][row]
    unfiltered = lub.CONTAMINATION_LEVELS["oil-unfiltered"][row]
    assert (lub.contamination_factor(kappa, dm_mm * MM, filtered)
            >= lub.contamination_factor(kappa, dm_mm * MM, unfiltered))


# --- Cu from C0: ISO 281:2007 annex B (from memory) ------------------------------------

def test_fatigue_load_limit_up_to_100_mm_is_c0_over_8_2():
    assert lub.fatigue_load_limit_n(245e3, 85 * MM) == pytest.approx(245e3 / 8.2)


def test_fatigue_load_limit_above_100_mm_carries_the_size_factor():
    # 300 kN / 8.2 * (100 / 200)^0.3 = 36 585.4 * 0.812252 = 29 716.5 N (hand computed)
    assert lub.fatigue_load_limit_n(300e3, 200 * MM) == pytest.approx(29716.5, abs=0.5)
    assert lub.fatigue_load_limit_n(300e3, 100 * MM) == pytest.approx(300e3 / 8.2)


# --- The whole chain: L10m = a1 aISO L10 -------------------------------------------------

def modified_life_ratio(viscosity_cst, level, reliability=90.0, speed_rpm=40.0, dm_mm=85.0,
                        load_ratio_cu_p=0.4):
    """L10m / L10 = a1 aISO of one bearing running in oil of the given operating viscosity."""
    kappa = lub.viscosity_ratio(viscosity_cst * CST,
                                lub.reference_viscosity_m2_s(speed_rpm, dm_mm * MM))
    e_c = lub.contamination_factor(kappa, dm_mm * MM, level)
    return (lub.reliability_factor(reliability)
            * lub.life_modification_factor(kappa, e_c, load_ratio_cu_p, 1.0))


ALL_LEVELS = [level for levels in lub.CONTAMINATION_LEVELS.values() for level in levels]
ROUNDING = 1e-4  # the rounded constants of the standard make the branches meet to ~1e-5


@given(st.floats(1.0, 2000.0), st.floats(1.0, 2000.0), st.sampled_from(ALL_LEVELS),
       st.floats(0.01, 2.0), st.floats(0.5, 2000.0))
def test_modified_life_grows_with_viscosity(nu_a, nu_b, level, load_ratio, speed_rpm):
    thin, thick = sorted((nu_a, nu_b))
    assert (modified_life_ratio(thick, level, speed_rpm=speed_rpm, load_ratio_cu_p=load_ratio)
            >= modified_life_ratio(thin, level, speed_rpm=speed_rpm, load_ratio_cu_p=load_ratio)
            * (1 - ROUNDING))


@pytest.mark.parametrize("method", list(lub.CONTAMINATION_LEVELS))
@given(st.floats(1.0, 2000.0), st.floats(0.5, 2000.0), st.floats(0.01, 2.0))
def test_modified_life_grows_with_cleanliness(method, viscosity, speed_rpm, load_ratio):
    ratios = [modified_life_ratio(viscosity, level, speed_rpm=speed_rpm,
                                  load_ratio_cu_p=load_ratio)
              for level in lub.CONTAMINATION_LEVELS[method]]
    assert all(dirty <= clean for clean, dirty in zip(ratios, ratios[1:]))


@given(st.floats(1.0, 100.0), st.sampled_from(ALL_LEVELS), st.floats(0.01, 2.0))
def test_modified_life_gains_nothing_above_kappa_4(excess, level, load_ratio):
    """ISO 281:2007: kappa > 4 is taken as 4 (from memory), for eC and aISO alike."""
    at_4 = lub.life_modification_factor(4.0, lub.contamination_factor(4.0, 85 * MM, level),
                                        load_ratio, 1.0)
    kappa = 4.0 * excess
    above = lub.life_modification_factor(kappa, lub.contamination_factor(kappa, 85 * MM, level),
                                         load_ratio, 1.0)
    assert above == at_4


@given(st.floats(1.0, 2000.0), st.sampled_from(ALL_LEVELS), st.floats(90.0, 99.95),
       st.floats(0.0, 50.0))
def test_modified_life_never_exceeds_50_a1_l10(viscosity, level, reliability, load_ratio):
    ratio = modified_life_ratio(viscosity, level, reliability, load_ratio_cu_p=load_ratio)
    assert ratio <= 50.0 * lub.reliability_factor(reliability) * (1 + 1e-12)


@given(st.floats(1.0, 2000.0), st.sampled_from(ALL_LEVELS))
def test_99_percent_reliability_never_gives_a_longer_life_than_90(viscosity, level):
    assert modified_life_ratio(viscosity, level, 99.0) <= modified_life_ratio(viscosity, level, 90.0)


def test_functions_broadcast_over_leading_batch_axes():
    """Parameter studies pass (variants, 1) arrays against (cases,) arrays."""
    nu40 = np.array([[32.0], [46.0], [68.0]]) * CST
    temperatures = np.array([303.15, 333.15, 353.15, 363.15])
    nu = lub.oil_viscosity_m2_s(temperatures, nu40, nu40 / 6.8)
    kappa = lub.viscosity_ratio(nu, lub.reference_viscosity_m2_s(
        np.array([10.0, 40.0, 80.0, 0.0]), 85 * MM))
    e_c = lub.contamination_factor(kappa, 85 * MM, ALL_LEVELS[2])
    a_iso = lub.life_modification_factor(kappa, e_c, 30e3, np.array([20e3, 30e3, 40e3, 50e3]))
    assert a_iso.shape == (3, 4)
