"""Shaft check through the file format, engine, JSON and terminal output.

Hand calculations use Shigley's Mechanical Engineering Design, 10th ed. (from memory for the
equation numbers): DE-Goodman eq. 7-7, first-cycle yield eqs. 7-15/7-16, S-N line eqs. 6-13 to
6-16, surface factor table 6-2, size factor eq. 6-20, reliability factor table 6-5.
"""

import dataclasses
import json
import math

import numpy as np
import pytest
from click.testing import CliRunner
from hypothesis import given, settings
from hypothesis import strategies as st

from hubload.casefile import study_from_document
from hubload.cli import main
from hubload.engine import evaluate
from hubload.report.messages import warning_texts
from hubload.model.shaft.strength import fatigue_strength_fraction

SHAFT = {
    "ultimate_strength_MPa": 800, "yield_strength_MPa": 600, "surface": "machined",
    "reliability_percent": 90,
    "section": [{"name": "flange fillet", "position_mm": 60, "diameter_mm": 50,
                 "kt_bending": 2.0, "kt_torsion": 1.5, "notch_sensitivity": 0.8}],
    "permissible": {"load_position_mm": [0, 100, 200], "radial_load_kN": [50, 30, 20]},
}
ONE_CASE = [{"name": "drive", "time_percent": 100, "wheel_load_kN": 20,
             "tractive_force_kN": 5, "speed_rpm": 50}]


@pytest.fixture
def shaft_document(document):
    document["shaft"] = json.loads(json.dumps(SHAFT))
    return document


def hand_section(wheel_kn, tractive_kn, lever_m=0.040, rolling_m=0.400, d=0.050,
                 kf=1.8, kfs=1.4, sut=800e6, sy=600e6):
    """Shigley 10th ed. by hand for a section outboard of both bearings (no side force)."""
    moment = math.hypot(wheel_kn, tractive_kn) * 1e3 * lever_m
    torque = tractive_kn * 1e3 * rolling_m
    ka = 4.51 * 800 ** -0.265                       # table 6-2, machined
    kb = (d * 1e3 / 7.62) ** -0.107                 # eq. 6-20
    se = ka * kb * 0.897 * 0.5 * sut                # table 6-5 at 90 %; eq. 6-8
    alternating = 32 * kf * moment / (math.pi * d ** 3)
    mean = math.sqrt(3) * 16 * kfs * torque / (math.pi * d ** 3)
    goodman = 1 / (alternating / se + mean / sut)   # eq. 7-7
    peak = math.sqrt(alternating ** 2 + mean ** 2)  # eq. 7-15 (no axial force here)
    return {"se": se, "n": goodman, "ny": sy / peak, "alternating": alternating, "mean": mean}


def single_case_study(document, **case):
    document["case"] = [{**ONE_CASE[0], **case}]
    return study_from_document(document)


def test_section_safety_matches_shigley_de_goodman_by_hand(shaft_document):
    result = evaluate(single_case_study(shaft_document))
    section = result.shaft.sections[0]
    hand = hand_section(20, 5)
    assert float(section.endurance_pa) == pytest.approx(hand["se"], rel=1e-3)
    assert float(section.min_safety) == pytest.approx(hand["n"], rel=1e-3)
    assert float(section.yield_safety) == pytest.approx(hand["ny"], rel=1e-9)
    assert math.isinf(float(section.fatigue_life_h)) == (hand["n"] >= 1)


def test_finite_life_from_the_sn_line_by_hand(shaft_document):
    # Heavy case: sigma_rev = sigma_a / (1 - sigma_m / Sut) above Se; N = (sigma_rev / a)^(1/b).
    result = evaluate(single_case_study(shaft_document, wheel_load_kN=60))
    hand = hand_section(60, 5)
    assert hand["n"] < 1
    reversed_pa = hand["alternating"] / (1 - hand["mean"] / 800e6)
    f = float(fatigue_strength_fraction(800e6))
    a = (f * 800e6) ** 2 / hand["se"]
    b = -math.log10(f * 800e6 / hand["se"]) / 3
    hours = (reversed_pa / a) ** (1 / b) / (60 * 50)
    assert float(result.shaft.sections[0].fatigue_life_h) == pytest.approx(hours, rel=5e-3)


def test_permissible_utilisation_interpolates_the_supplier_curve(shaft_document):
    # Offset 100 mm sits on a point of the curve (30 kN); at 150 mm the curve reads 25 kN.
    result = evaluate(single_case_study(shaft_document))
    assert float(result.shaft.permissible.utilisation[0]) == pytest.approx(
        math.hypot(20, 5) / 30)
    shaft_document["wheel"]["offset_mm"] = 150
    result = evaluate(single_case_study(shaft_document))
    assert float(result.shaft.permissible.permissible_n) == pytest.approx(25e3)


def test_offset_outside_the_curve_is_not_extrapolated(shaft_document, write_case_file):
    shaft_document["shaft"]["permissible"]["load_position_mm"] = [0, 50, 80]
    output = json.loads(CliRunner().invoke(main, ["check", write_case_file(shaft_document),
                                                  "--json"]).output)
    assert all(case["permissible_utilisation"] is None for case in output["cases"])
    assert output["shaft"]["permissible"]["inside_curve"] is False
    assert any("not extrapolated" in warning for warning in output["warnings"])
    assert output["overall_verdict"]["passed"] is False
    assert output["overall_verdict"]["worst"]["value"] is None


def test_json_contract_of_the_shaft_check(shaft_document, write_case_file):
    shaft_document["case"].append({"name": "parked", "time_percent": 0, "wheel_load_kN": 60,
                                   "speed_rpm": 0})
    result = CliRunner().invoke(main, ["check", write_case_file(shaft_document), "--json"])
    assert result.exit_code == 0, result.output
    output = json.loads(result.output)
    section = output["shaft"]["sections"][0]
    assert {"name", "min_safety", "min_safety_case", "yield_safety", "fatigue_life_h"} <= set(
        section)
    assert section["name"] == "flange fillet"
    assert section["min_safety_case"] in ("travel", "turn")     # standstill: no stress cycles
    assert section["yield_safety_case"] == "parked"              # the heaviest load
    for case in output["cases"]:
        assert case["permissible_utilisation"] > 0
    assert output["cases"][2]["shaft"]["flange fillet"]["safety"] is None
    assert {"passed", "worst", "items"} <= set(output["overall_verdict"])


def test_without_shaft_table_the_contract_keys_are_null(document, write_case_file):
    output = json.loads(CliRunner().invoke(main, ["check", write_case_file(document),
                                                  "--json"]).output)
    assert output["shaft"] is None
    assert all(case["permissible_utilisation"] is None for case in output["cases"])


def test_check_shows_shaft_table_utilisation_and_one_overall_verdict(shaft_document,
                                                                     write_case_file):
    shaft_document["shaft"]["permissible"]["radial_load_kN"] = [20, 15, 10]
    result = CliRunner(env={"COLUMNS": "160"}).invoke(main, ["check",
                                                             write_case_file(shaft_document)])
    assert result.exit_code == 0, result.output
    assert "Shaft sections" in result.output and "flange fillet" in result.output
    assert "utilisation" in result.output
    assert result.output.count("Overall verdict") == 1
    # Case 'travel': hypot(20, 6) kN against 15 kN read at 100 mm on the curve -> 139 %.
    assert "139 %" in result.output
    assert "Overall verdict (bearings and shaft): FAIL" in result.output
    assert "Caution" in result.output


def test_worst_item_is_the_shaft_when_only_the_shaft_fails(shaft_document):
    # The bearings pass with a large life margin, the 20 mm shaft cannot.
    shaft_document["project"]["target_life_h"] = 1
    shaft_document["shaft"]["section"][0]["diameter_mm"] = 20
    found = evaluate(study_from_document(shaft_document)).overall
    assert found.items[0].passed                     # the bearings
    assert not found.passed
    assert found.worst.name.startswith("shaft 'flange fillet'")


def test_below_endurance_limit_life_is_infinite_and_said(shaft_document, write_case_file):
    shaft_document["shaft"]["section"][0]["diameter_mm"] = 90
    result = CliRunner(env={"COLUMNS": "160"}).invoke(main, ["check",
                                                             write_case_file(shaft_document)])
    assert "every case stays below the endurance limit" in " ".join(result.output.split())


@settings(max_examples=40, deadline=None)
@given(split=st.integers(0, 2), wheel=st.floats(20, 70))
def test_splitting_a_case_leaves_the_shaft_life_unchanged(split, wheel):
    # Palmgren-Miner is linear in the time shares (property).
    document = {"wheel": {"offset_mm": 100, "loaded_radius_mm": 400},
                "pair": {"arrangement": "back-to-back",
                         "outboard": {"position_mm": 30, "C_kN": 120, "C0_kN": 160,
                                      "contact_angle_deg": 15},
                         "inboard": {"position_mm": -50, "C_kN": 100, "C0_kN": 130,
                                     "contact_angle_deg": 15}},
                "case": [{"name": f"c{i}", "time_percent": share, "wheel_load_kN": load,
                          "tractive_force_kN": 5, "speed_rpm": 40}
                         for i, (share, load) in enumerate(((50, wheel), (30, 40), (20, 25)))],
                "shaft": json.loads(json.dumps(SHAFT))}
    whole = evaluate(study_from_document(document)).shaft.sections[0].fatigue_life_h
    half = dict(document["case"][split], time_percent=document["case"][split]["time_percent"] / 2)
    document["case"][split] = half
    document["case"].append(dict(half, name="other half"))
    parts = evaluate(study_from_document(document)).shaft.sections[0].fatigue_life_h
    assert float(parts) == pytest.approx(float(whole), rel=1e-9)


def test_shaft_results_broadcast_over_batch_axes(shaft_document):
    study = study_from_document(shaft_document)
    offsets = np.array([[0.08], [0.10], [0.12]])
    result = evaluate(dataclasses.replace(study, wheel=dataclasses.replace(
        study.wheel, offset_m=offsets)))
    section = result.shaft.sections[0]
    assert section.safety.shape == (3, 2)
    assert section.min_safety.shape == (3,)
    assert np.all(np.diff(section.min_safety) < 0)          # more offset, less safety
    assert result.shaft.permissible.utilisation.shape == (3, 2)


BAD_SHAFT = [
    (lambda s: s.update(yield_strength_MPa=800), "shaft.yield_strength_MPa", "below the tensile"),
    (lambda s: s.update(surface="polished"), "shaft.surface", "one of"),
    (lambda s: s.update(reliability_percent=100), "shaft.reliability_percent", "< 100"),
    (lambda s: s.update(criterion="gerber"), "shaft.criterion", "one of"),
    (lambda s: s.update(ultimate_strenght_MPa=1), "shaft.ultimate_strenght_MPa", "did you mean"),
    (lambda s: s["section"][0].update(notch_sensitivity=1.2), "shaft.section[0].notch_sensitivity",
     "<= 1"),
    (lambda s: s["section"][0].update(notch_radius_mm=2), "shaft.section[0].notch_radius_mm",
     "not both"),
    (lambda s: s["section"][0].update(diameter_mm=300), "shaft.section[0].diameter_mm",
     "2.79-254 mm"),
    (lambda s: s["section"][0].update(position_mm=-80, carries_torque=False),
     "shaft.section[0].position_mm", "inboard of both bearings"),
    (lambda s: s["section"].append(dict(s["section"][0])), "shaft.section[1].name", "used twice"),
    (lambda s: (s["section"][0].pop("notch_sensitivity"), s["section"][0].update(
        notch_radius_mm=2), s.update(ultimate_strength_MPa=2000, yield_strength_MPa=1800)),
     "shaft.section[0].notch_radius_mm", "give notch_sensitivity instead"),
    (lambda s: s["permissible"].update(radial_load_kN=[50, 30]), "shaft.permissible.radial_load_kN",
     "one load per position"),
    (lambda s: s["permissible"].update(load_position_mm=[0, 100, 100]),
     "shaft.permissible.load_position_mm[2]", "strictly increasing"),
    (lambda s: s["permissible"].update(load_position_mm=[0], radial_load_kN=[30]),
     "shaft.permissible.load_position_mm", "at least 2 points"),
    (lambda s: s["permissible"].update(radial_load_kN=[50, 0, 20]),
     "shaft.permissible.radial_load_kN[1]", "> 0"),
    (lambda s: s.pop("section"), "shaft.section", "missing required table"),
]


@pytest.mark.parametrize("edit, key_path, expected", BAD_SHAFT)
def test_bad_shaft_input_exits_2_with_a_clear_line(shaft_document, write_case_file, edit,
                                                   key_path, expected):
    edit(shaft_document["shaft"])
    path = write_case_file(shaft_document)
    result = CliRunner().invoke(main, ["check", path])
    assert result.exit_code == 2, result.output
    message = result.output.strip()
    assert "\n" not in message and "Traceback" not in message
    assert message.startswith(f"error: {path}: {key_path}: "), message
    assert expected in message


def test_section_inboard_of_both_bearings_is_said_to_carry_no_bending(shaft_document):
    # Method of sections (Gere & Goodno, Mechanics of Materials, 8th ed., ch. 4): inboard of
    # the inboard bearing every force on the rigid shaft acts outboard of the section and
    # together they are in equilibrium, so no bending moment is left there, only the torque.
    shaft_document["shaft"]["section"][0].update(position_mm=-70, carries_torque=True)
    result = evaluate(single_case_study(shaft_document))
    assert float(result.shaft.sections[0].loads.bending_nm[0]) == pytest.approx(0.0, abs=1e-6)
    assert any("'flange fillet' lies inboard of both bearings" in warning
               for warning in warning_texts(result.findings, result.study.cases.names))


def test_section_between_bearings_outboard_of_the_mounting_face_is_not_flagged(shaft_document):
    # Both bearings outboard of the mounting face (x = 0): a section between them carries the
    # bending moment of the wheel (method of sections, Gere & Goodno, 8th ed., ch. 4) and must
    # not be called free of bending. Positions are compared in one unit.
    shaft_document["pair"]["outboard"]["position_mm"] = 90
    shaft_document["pair"]["inboard"]["position_mm"] = 20
    shaft_document["shaft"]["section"][0]["position_mm"] = 50
    result = evaluate(single_case_study(shaft_document))
    assert float(result.shaft.sections[0].loads.bending_nm[0]) > 0
    assert not any("inboard of both bearings" in warning
                   for warning in warning_texts(result.findings, result.study.cases.names))
