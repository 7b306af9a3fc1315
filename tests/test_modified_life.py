"""The ISO 281 modified life through the file format, the engine, the JSON and the terminal."""

import copy
import dataclasses
import json
import math

import numpy as np
import pytest
from click.testing import CliRunner
from conftest import BASE_DOCUMENT
from hypothesis import given, settings
from hypothesis import strategies as st

from hubload.casefile import study_from_document
from hubload.cli import main
from hubload.engine import evaluate

LUBRICATION = {"viscosity_40C_cSt": 46.0, "viscosity_100C_cSt": 7.8, "temperature_C": 40.0,
               "method": "oil-filtered", "iso4406": "18/16/13"}


@pytest.fixture
def lubricated():
    return lubricated_copy()


def check_json(path):
    result = CliRunner().invoke(main, ["check", path, "--json"])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


def test_json_contract_keys_of_the_modified_life(lubricated, write_case_file):
    output = check_json(write_case_file(lubricated))
    for case in output["cases"]:
        for label in ("outboard", "inboard"):
            assert {"kappa", "kappa_outside_scope", "e_c", "a_iso", "l10m_h"} <= set(
                case["bearings"][label])
    for label in ("outboard", "inboard"):
        assert output["bearings"][label]["l10m_h"] > 0
    assert output["system"]["l10m_h"] > 0
    assert output["a1"] == 1.0


def test_kappa_from_a_data_sheet_point_and_a_hand_computed_nu1(lubricated, write_case_file):
    # At 40 C the oil has its data-sheet 46 mm2/s; nu1 = 45000 * 100^-0.83 * 100^-0.5
    # = 98.449 mm2/s (ISO 281:2007, 9.3.3, hand computed) -> kappa = 0.46725.
    lubricated["case"][0]["speed_rpm"] = 100
    output = check_json(write_case_file(lubricated))
    bearing = output["cases"][0]["bearings"]["outboard"]
    assert output["cases"][0]["viscosity_cSt"] == pytest.approx(46.0)
    assert bearing["kappa"] == pytest.approx(46.0 / 98.449, rel=1e-4)
    assert bearing["kappa_outside_scope"] is False


def test_case_lives_are_a1_aiso_l10_and_spectrum_follows_miner_and_the_9_8_rule(
        lubricated, write_case_file):
    """ISO 281:2007, 9.1 (Lnm = a1 aISO L10); Palmgren-Miner; system life with e = 9/8."""
    lubricated["project"]["reliability_percent"] = 99
    output = check_json(write_case_file(lubricated))
    assert output["a1"] == pytest.approx(0.25, abs=0.005)       # ISO 281:2007 table 12
    fractions = [case["time_fraction"] for case in output["cases"]]
    lives = {}
    for label in ("outboard", "inboard"):
        per_case = [case["bearings"][label] for case in output["cases"]]
        for entry in per_case:
            assert entry["l10m_h"] == pytest.approx(output["a1"] * entry["a_iso"] * entry["l10_h"])
        lives[label] = 1 / sum(t / entry["l10m_h"] for t, entry in zip(fractions, per_case))
        assert output["bearings"][label]["l10m_h"] == pytest.approx(lives[label])
    system = (lives["outboard"] ** -1.125 + lives["inboard"] ** -1.125) ** (-1 / 1.125)
    assert output["system"]["l10m_h"] == pytest.approx(system)
    assert output["verdict"]["life"] == "L1m"
    assert output["verdict"]["life_h"] == pytest.approx(output["system"]["l10m_h"])


def test_crawling_case_is_flagged_and_bounded_at_kappa_0_1(lubricated, write_case_file):
    """ISO 281:2007 figure 4 (from memory): aISO = 0.1 at kappa = 0.1 for every load."""
    lubricated["case"][0]["speed_rpm"] = 2
    path = write_case_file(lubricated)
    entry = check_json(path)["cases"][0]["bearings"]["outboard"]
    assert entry["kappa"] < 0.1 and entry["kappa_outside_scope"] is True
    assert entry["a_iso"] == pytest.approx(0.1, rel=1e-3)
    assert entry["l10m_h"] == pytest.approx(0.1 * entry["l10_h"], rel=1e-3)
    text = " ".join(CliRunner().invoke(main, ["check", path]).output.split())
    assert "no separating oil film" in text and "surface distress and wear" in text
    assert "Ask the bearing and motor supplier about operation at these low speeds" in text
    assert f"{entry['kappa']:.3g} !" in text


def test_thick_oil_light_load_reaches_the_cap_of_50(lubricated, write_case_file):
    """ISO 281:2007, 9.3.5: kappa > 4 counts as 4 and aISO is at most 50."""
    lubricated["lubrication"].update(viscosity_40C_cSt=1000, viscosity_100C_cSt=50,
                                     iso4406="-/13/10")
    lubricated["pair"]["outboard"]["Cu_kN"] = 100
    lubricated["case"][0].update(wheel_load_kN=1, side_force_kN=0, tractive_force_kN=0)
    entry = check_json(write_case_file(lubricated))["cases"][0]["bearings"]["outboard"]
    assert entry["kappa"] > 4 and entry["a_iso"] == 50.0
    assert entry["l10m_h"] == pytest.approx(50 * entry["l10_h"])


def test_standstill_case_has_no_kappa_and_an_infinite_life(lubricated, write_case_file):
    lubricated["case"].append({"name": "parked", "time_percent": 0, "wheel_load_kN": 30,
                               "speed_rpm": 0})
    entry = check_json(write_case_file(lubricated))["cases"][2]["bearings"]["inboard"]
    assert entry["kappa"] is None and entry["a_iso"] is None and entry["l10m_h"] is None
    assert entry["kappa_outside_scope"] is False


def test_code_between_rows_says_it_uses_the_dirtier_row(lubricated, write_case_file):
    output = check_json(write_case_file(lubricated))
    assert output["lubrication"]["contamination_row"] == "-/17/14"
    assert "dirtier row -/17/14" in output["lubrication"]["contamination_note"]


def test_case_temperature_overrides_the_lubrication_temperature(lubricated, write_case_file):
    lubricated["case"][1]["temperature_C"] = 100
    output = check_json(write_case_file(lubricated))
    assert output["cases"][0]["temperature_C"] == 40
    assert output["cases"][1]["viscosity_cSt"] == pytest.approx(7.8)


def test_grease_lubrication(lubricated, write_case_file):
    lubricated["lubrication"].pop("iso4406")
    lubricated["lubrication"].update(method="grease", grease_cleanliness="normal")
    output = check_json(write_case_file(lubricated))
    assert output["lubrication"]["contamination_row"] == "normal"


def test_without_lubrication_the_verdict_uses_a1_l10_and_says_so(document, write_case_file):
    document["project"]["reliability_percent"] = 95
    output = check_json(write_case_file(document))
    assert output["lubrication"] is None and "l10m_h" not in output["system"]
    assert output["a1"] == pytest.approx(0.64, abs=0.005)   # ISO 281:2007 table 12
    assert output["verdict"]["life"] == "L5"
    assert output["verdict"]["life_h"] == pytest.approx(output["a1"] * output["system"]["l10_h"])
    assert "aISO not applied" in output["verdict"]["basis"]


def test_verdict_names_the_modified_life(lubricated, write_case_file):
    text = " ".join(CliRunner().invoke(main, ["check", write_case_file(lubricated)]).output.split())
    assert "system L10m" in text and "modified rating life" in text


def lubricated_copy():
    document = copy.deepcopy(BASE_DOCUMENT)
    document["lubrication"] = dict(LUBRICATION)
    document["pair"]["outboard"]["mean_diameter_mm"] = 100
    document["pair"]["inboard"]["mean_diameter_mm"] = 90
    return document


@settings(max_examples=25, deadline=None)
@given(st.floats(-40, 150), st.floats(-40, 150))
def test_hotter_oil_never_lengthens_the_modified_life(cooler, hotter):
    cooler, hotter = sorted((cooler, hotter))
    document = lubricated_copy()
    lives = []
    for temperature in (cooler, hotter):
        document["lubrication"]["temperature_C"] = temperature
        lives.append(float(evaluate(study_from_document(document)).modified.system_life_h))
    assert lives[1] <= lives[0] * (1 + 1e-4)   # 1e-4: rounding of the standard's constants


def test_batch_axes_broadcast_like_single_studies(lubricated):
    """Parameter studies pass (variants, 1) arrays; each row equals the single study."""
    study = study_from_document(lubricated)
    nu40 = np.array([[32e-6], [46e-6], [68e-6]])
    batch = dataclasses.replace(study, lubrication=dataclasses.replace(
        study.lubrication, viscosity_40c_m2_s=nu40, viscosity_100c_m2_s=nu40 / 6))
    result = evaluate(batch)
    assert result.modified.system_life_h.shape == (3,)
    assert result.modified.bearings["outboard"].a_iso.shape == (3, 2)
    for row, value in enumerate(nu40[:, 0]):
        single = dataclasses.replace(study, lubrication=dataclasses.replace(
            study.lubrication, viscosity_40c_m2_s=value, viscosity_100c_m2_s=value / 6))
        assert result.modified.system_life_h[row] == pytest.approx(
            float(evaluate(single).modified.system_life_h))
    assert evaluate(study).verdict.life_name == "L10m"


# --- bad input: exit 2, one line naming file and key path --------------------------------

def run_bad(path):
    result = CliRunner().invoke(main, ["check", path])
    assert result.exit_code == 2, result.output
    assert "Traceback" not in result.output and result.output.count("\n") == 1
    return result.output


@pytest.mark.parametrize("edit, key_path, expected", [
    (lambda d: d["lubrication"].update(temperature_C=170), "lubrication.temperature_C", "<= 150"),
    (lambda d: d["lubrication"].update(temperature_C=-45), "lubrication.temperature_C", ">= -40"),
    (lambda d: d["case"][1].update(temperature_C=200), "case[1].temperature_C", "<= 150"),
    (lambda d: d["lubrication"].update(viscosity_100C_cSt=46), "lubrication.viscosity_100C_cSt",
     "below the one at 40 C"),
    (lambda d: d["lubrication"].update(method="oil-bath"), "lubrication.method",
     '"oil-filtered", "oil-unfiltered", "grease"'),
    (lambda d: d["lubrication"].update(method="grease"), "lubrication.iso4406",
     "grease_cleanliness instead"),
    (lambda d: d["lubrication"].update(iso4406="18-16-13"), "lubrication.iso4406",
     'expected an ISO 4406 code such as "18/16/13"'),
    (lambda d: d["lubrication"].update(iso4406="16/13"), "lubrication.iso4406", "ISO 4406 code"),
    (lambda d: d["lubrication"].update(iso4406="18/13/16"), "lubrication.iso4406", "cumulative"),
    (lambda d: d["lubrication"].update(iso4406="-/31/13"), "lubrication.iso4406", "0..28"),
    (lambda d: d["lubrication"].update(grease_cleanliness="normal"), "lubrication.grease_cleanliness",
     "only one of"),
    (lambda d: (d["lubrication"].pop("iso4406"), d["lubrication"].update(
        method="grease", grease_cleanliness="dirty")), "lubrication.grease_cleanliness",
     '"high", "normal"'),
    (lambda d: d["lubrication"].pop("iso4406"), "lubrication", "missing cleanliness"),
    (lambda d: d["project"].update(reliability_percent=99.99), "project.reliability_percent",
     "<= 99.95"),
    (lambda d: d["project"].update(reliability_percent=85), "project.reliability_percent", ">= 90"),
    (lambda d: d["pair"]["outboard"].pop("mean_diameter_mm"), "pair.outboard.mean_diameter_mm",
     "missing required key with [lubrication]"),
    (lambda d: d["pair"]["inboard"].update(Cu_kN=200), "pair.inboard.Cu_kN", "below C0"),
    (lambda d: (d.pop("lubrication"), d["case"][0].update(temperature_C=50)),
     "case[0].temperature_C", "needs a [lubrication] table"),
])
def test_bad_lubrication_input_exits_2_naming_the_key(lubricated, write_case_file, edit, key_path,
                                                     expected):
    edit(lubricated)
    path = write_case_file(lubricated)
    message = run_bad(path)
    assert message.startswith(f"error: {path}: {key_path}")
    assert expected in message


def test_no_nan_reaches_the_json(lubricated, write_case_file):
    text = CliRunner().invoke(main, ["check", write_case_file(lubricated), "--json"]).output
    assert "NaN" not in text and "Infinity" not in text
    assert all(math.isfinite(x) for x in (json.loads(text)["system"]["l10m_h"],))
