"""The bearing setting in operation through the command line: [pair.setting] -> each case's
operating setting, its tolerance band, friction, and bad input."""

from __future__ import annotations

import json
import math

import pytest
from click.testing import CliRunner

from hubload.cli import main
from studies_helpers import YARD_LOADER, read_toml, write_toml


def run(*args):
    return CliRunner().invoke(main, [*map(str, args)])


def check(path, *options) -> dict:
    found = run("check", path, "--json", *options)
    assert found.exit_code == 0, found.output
    return json.loads(found.output)


def with_setting(tmp_path, name="setting.toml", **setting) -> tuple[dict, str]:
    document = read_toml(YARD_LOADER)
    document["pair"].pop("axial_setting_um")
    document["pair"]["setting"] = {"assembly_um": 40.0, **setting}
    return document, str(write_toml(document, tmp_path / name))


def test_one_material_at_the_assembly_temperature_keeps_the_assembly_setting(tmp_path):
    # Equal temperatures and one material change nothing (the thermal terms are differences
    # of expansion); the mounted basis already includes the fits.
    _, path = with_setting(tmp_path, shaft_temperature_C=20, housing_temperature_C=20)
    found = check(path, "--method", "refined")
    assert [c["operating_setting_um"] for c in found["cases"]] == pytest.approx([40.0] * 7)
    assert found["setting"] == {"assembly_um": 40.0, "tolerance_um": 0.0, "basis": "mounted"}


def test_unmounted_cone_fits_take_up_the_thick_cylinder_closing(tmp_path):
    # Solid steel shaft, steel cone (Lame, same material): the cone raceway grows by
    # delta d / d_i (Timoshenko & Goodier, thick cylinder; Shigley 10th ed. 3-16); a radius
    # change dr closes the bearing by dr cot(alpha) (cone geometry), per bearing.
    delta_um = 30.0
    document, path = with_setting(tmp_path, basis="unmounted", cone_interference_um=delta_um,
                                  shaft_temperature_C=20, housing_temperature_C=20)
    document["pair"]["outboard"]["bore_mm"] = 60
    document["pair"]["inboard"]["bore_mm"] = 55
    path = write_toml(document, tmp_path / "unmounted.toml")
    take_up = 0.0
    for label in ("outboard", "inboard"):
        given = document["pair"][label]
        alpha = math.radians(given["contact_angle_deg"])
        cone = given["pitch_diameter_mm"] - given["roller_diameter_mm"] * math.cos(alpha)
        growth_um = delta_um * given["bore_mm"] / cone
        take_up += growth_um / 2 / math.tan(alpha)
    found = check(path, "--method", "refined")
    for case in found["cases"]:
        assert case["operating_setting_um"] == pytest.approx(40.0 - take_up, rel=1e-9)
        assert case["setting_loss_um"]["fit_take_up"] == pytest.approx(take_up, rel=1e-9)


def test_seat_diameters_change_nothing_where_no_fit_can_act(tmp_path):
    # Steel shaft and housing (expanding as the rings do) without interference: the fits stay
    # line-to-line at every temperature, so the seat diameters cannot matter (thick-cylinder
    # pressure is zero without interference; Shigley 10th ed. 3-16).
    document, plain = with_setting(tmp_path, shaft_temperature_C=75, housing_temperature_C=50)
    for label, (bore, outside) in {"outboard": (60, 120), "inboard": (55, 110)}.items():
        document["pair"][label].update(bore_mm=bore, outside_diameter_mm=outside)
    seated = write_toml(document, tmp_path / "seated.toml")
    settings = [[c["operating_setting_um"] for c in check(path)["cases"]]
                for path in (plain, seated)]
    assert settings[0] == settings[1]
    assert settings[0] != pytest.approx([40.0] * 7)      # the temperatures did change them


def test_a_preload_that_turns_into_end_play_is_warned_of(tmp_path):
    # Steel throughout, housing 70 K warmer than the shaft: the cup raceways grow about
    # 11.7e-6 x 70 x 47 mm = 39 um more in radius than the cones, some 130 um of end play per
    # bearing through cot(16 deg) (cone geometry), far more than the housing's axial growth
    # over the spread (about 65 um) can take back: the 40 um preload becomes end play.
    _, path = with_setting(tmp_path, assembly_um=-40.0, shaft_temperature_C=20,
                           housing_temperature_C=90)
    found = check(path)
    assert all(case["operating_setting_um"] > 0 for case in found["cases"])
    kinds = [record["kind"] for record in found["warning_records"]]
    assert kinds.count("setting_loses_preload") == len(found["cases"])
    assert "setting_becomes_preload" not in kinds


def test_a_hotter_shaft_takes_more_end_play_face_to_face_than_back_to_back(tmp_path):
    # The shaft's axial growth over the spread adds to the radial growth face-to-face and
    # opposes it back-to-back (cone geometry of a tapered pair, property).
    settings = {}
    for arrangement in ("back-to-back", "face-to-face"):
        document, _ = with_setting(tmp_path, shaft_temperature_C=70, housing_temperature_C=60)
        document["pair"]["arrangement"] = arrangement
        path = write_toml(document, tmp_path / f"{arrangement}.toml")
        settings[arrangement] = check(path, "--method", "refined")["cases"][0][
            "operating_setting_um"]
    assert settings["face-to-face"] < settings["back-to-back"] < 40.0


def test_the_verdict_takes_the_worse_end_of_the_tolerance_band(tmp_path):
    # Cross-command check: the band's lives are those of ``setting`` at its ends and middle,
    # and with verdict_basis = refined the governing life is the shortest of them.
    document, _ = with_setting(tmp_path, tolerance_um=15, shaft_temperature_C=65,
                               housing_temperature_C=58)
    document["project"]["verdict_basis"] = "refined"
    path = write_toml(document, tmp_path / "band.toml")
    found = check(path, "--method", "refined")
    band = found["setting_band"]
    assert (band["low_um"], band["high_um"]) == (25.0, 55.0)
    swept = json.loads(run("setting", path, "--from", 25, "--to", 55, "--step", 15,
                           "--json").output)
    lives = [p["system"]["l10m_h"] for p in swept["points"]]
    assert [band["system_low_h"], band["system_mid_h"], band["system_high_h"]] == \
        pytest.approx(lives, rel=1e-9)
    assert found["governing_life"]["life_h"] == pytest.approx(min(lives), rel=1e-12)
    assert found["verdict"]["life_h"] == pytest.approx(min(lives), rel=1e-12)


def test_power_loss_is_friction_torque_times_angular_speed(tmp_path):
    # Mechanics: N = M omega, omega = 2 pi n / 60; zero at standstill.
    found = check(YARD_LOADER)
    for case in found["cases"]:
        for bearing in case["bearings"].values():
            omega = 2 * math.pi * case["speed_rpm"] / 60
            assert bearing["power_W"] == pytest.approx(bearing["friction_torque_Nm"] * omega)
    mean = sum(c["time_fraction"] * c["bearings"]["outboard"]["power_W"] for c in found["cases"])
    assert found["friction"]["bearings"]["outboard"]["mean_power_W"] == pytest.approx(mean)


@pytest.mark.parametrize("change, key_path, words", [
    (lambda d: d["pair"].update(axial_setting_um=20), "pair", "not both"),
    (lambda d: d["pair"]["setting"].update(tolerance_um=-5), "pair.setting.tolerance_um",
     ">= 0"),
    (lambda d: d["pair"]["setting"].update(basis="unmounted", cone_interference_um=20),
     "pair.outboard.bore_mm", "bore"),
    # a seat whose fit changes with temperature needs its own diameter (the thermal change
    # of the fit is (a - a_ring) dT d; Shigley 10th ed. 3-16 for the fit it makes)
    (lambda d: d["pair"]["setting"].update(shaft_material="aluminium"),
     "pair.outboard.bore_mm", "expands"),
    (lambda d: d["pair"]["setting"].update(housing_material="cast-iron"),
     "pair.outboard.outside_diameter_mm", "expands"),
    (lambda d: d["pair"]["setting"].update(housing_outside_diameter_mm=90),
     "pair.outboard.outside_diameter_mm", "measured against"),
    (lambda d: d["pair"]["outboard"].pop("rollers"), "pair.outboard.rollers",
     "internal geometry"),
    (lambda d: d["pair"]["setting"].update(housing_material="brass"),
     "pair.setting.housing_material", "one of"),
])
def test_bad_setting_input_names_the_key(tmp_path, change, key_path, words):
    document, _ = with_setting(tmp_path)
    change(document)
    path = write_toml(document, tmp_path / "bad.toml")
    found = run("check", path)
    assert found.exit_code == 2 and key_path in found.output and words in found.output
    assert len(found.output.strip().splitlines()) == 1


def test_case_temperatures_of_shaft_and_housing_need_a_setting_table(tmp_path):
    document = read_toml(YARD_LOADER)
    document["case"][0]["shaft_temperature_C"] = 70
    found = run("check", write_toml(document, tmp_path / "stray.toml"))
    assert found.exit_code == 2 and "case[0].shaft_temperature_C" in found.output


def test_lives_by_the_iso_rule_say_the_setting_does_not_enter_them(tmp_path):
    # ISO 281 (the rule for a pair) takes the bearings at zero clearance: a [pair.setting]
    # given with that method changes nothing in the lives, which the user must be told
    _, path = with_setting(tmp_path, shaft_temperature_C=60, housing_temperature_C=50)
    kinds = {method: [r["kind"] for r in check(path, "--method", method)["warning_records"]]
             for method in ("iso281", "refined")}
    assert kinds["iso281"].count("setting_outside_the_rule") == 1
    assert "setting_outside_the_rule" not in kinds["refined"]
