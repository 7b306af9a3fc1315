"""End-to-end: the refined method and the setting sweep through the CLI."""

import json
import math
from pathlib import Path

import pytest
from click.testing import CliRunner

from hubload.cli import main
from hubload.model.refined import ratings
from hubload.model.refined.integrals import sjovall_integrals

SCENARIOS = sorted(Path(__file__).parent.parent.joinpath("load_cases").glob("*.toml"))
GEOMETRY = {"rollers": 20, "roller_diameter_mm": 12.0, "roller_length_mm": 20.0,
            "pitch_diameter_mm": 85.0, "contact_angle_deg": 15.0}
C_GEOMETRY_KN = ratings.dynamic_rating_n(20, 12e-3, 20e-3, math.radians(15), 85e-3) / 1e3
C0_GEOMETRY_KN = ratings.static_rating_n(20, 12e-3, 20e-3, math.radians(15), 85e-3) / 1e3


def run(*args):
    return CliRunner().invoke(main, [str(a) for a in args])


def with_geometry(document, **changes):
    for label in ("outboard", "inboard"):
        document["pair"][label].update(GEOMETRY, C_kN=round(C_GEOMETRY_KN, 3),
                                       C0_kN=round(C0_GEOMETRY_KN, 3))
    document["pair"].update(changes)
    return document


def symmetric_radial(document, wheel_load_kn=30.0):
    """Identical bearings at +-40 mm, the wheel at mid-span, one radial case, no lubrication."""
    with_geometry(document)
    document["pair"]["outboard"]["position_mm"] = 40
    document["pair"]["inboard"]["position_mm"] = -40
    document["wheel"]["offset_mm"] = 0
    document["case"] = [{"name": "radial", "time_percent": 100, "wheel_load_kN": wheel_load_kn,
                         "speed_rpm": 100}]
    return document


@pytest.mark.parametrize("scenario", SCENARIOS, ids=lambda p: p.name)
def test_bundled_scenarios_run_the_refined_method_with_the_json_contract(scenario):
    text = run("check", scenario, "--method", "refined")
    assert text.exit_code == 0, text.output
    assert "Load distribution per case" in text.output and "Caution" in text.output
    document = json.loads(run("check", scenario, "--method", "refined", "--json").output)
    assert document["method"] == "refined"
    for case in document["cases"]:
        assert {"tilt_mrad", "axial_displacement_um"} <= case.keys() and case["equilibrium"]
        for bearing in case["bearings"].values():
            assert {"load_zone_deg", "max_roller_load_kN", "max_contact_pressure_MPa",
                    "l10_h"} <= bearing.keys()
    for bearing in document["bearings"].values():
        assert bearing["c_from_geometry_kN"] > 0 and bearing["c0_from_geometry_kN"] > 0
    assert not any("differs by" in warning for warning in document["warnings"])


def test_stribeck_peak_and_half_load_zone_through_the_cli(document, write_case_file):
    # Harris & Kotzalas, Essential Concepts, 5th ed., ch. 7: zero setting, radial load, each
    # bearing of a symmetric pair at epsilon = 0.5: Qmax = Fr / (Z Jr cos a), Jr(0.5) = 0.2448
    # for the law's exponent 10/9 (0.2453 in the book's table for 1.1); 20 discrete rollers.
    path = write_case_file(symmetric_radial(document))
    found = json.loads(run("check", path, "--method", "refined", "--json").output)
    outboard = found["cases"][0]["bearings"]["outboard"]
    jr = sjovall_integrals(0.5, 10 / 9)[0]
    assert outboard["load_zone_deg"] == pytest.approx(180.0, abs=1e-6)
    assert outboard["max_roller_load_kN"] == pytest.approx(
        15.0 / (20 * jr * math.cos(math.radians(15))), rel=2e-3)
    assert found["cases"][0]["tilt_mrad"] == pytest.approx(0.0, abs=1e-9)


def test_refined_life_against_iso281_under_nominal_conditions(document, write_case_file):
    # Lundberg-Palmgren line contact: L10r = (C/P)^4 cos(a)^(8/9) against ISO 281's (C/P)^(10/3);
    # ratio cos(a)^(8/9) (C/P)^(2/3) = 0.97 x 1.92 = 1.86 at C/P = 2.62 (docs/refined-method.md).
    path = write_case_file(symmetric_radial(document, wheel_load_kn=100.0))
    refined = json.loads(run("check", path, "--method", "refined", "--json").output)
    iso = json.loads(run("check", path, "--json").output)
    ratio = (refined["cases"][0]["bearings"]["outboard"]["l10_h"]
             / iso["cases"][0]["bearings"]["outboard"]["l10_h"])
    c_over_p = C_GEOMETRY_KN / 50.0
    assert ratio == pytest.approx(math.cos(math.radians(15)) ** (8 / 9) * c_over_p ** (2 / 3),
                                  rel=0.01)


def test_file_method_and_cli_override(document, write_case_file):
    with_geometry(document)
    document["project"]["method"] = "refined"
    path = write_case_file(document)
    assert json.loads(run("check", path, "--json").output)["method"] == "refined"
    assert json.loads(run("check", path, "--method", "iso281", "--json").output)["method"] \
        == "iso281"


def test_angle_and_load_factors_together_serve_each_their_method(document, write_case_file):
    with_geometry(document)   # keeps e = 0.4, Y = 1.5, Y0 = 0.8 beside contact_angle_deg
    found = json.loads(run("check", write_case_file(document), "--json").output)
    case = found["cases"][0]["bearings"]
    # ISO 281 rule with the typed Y = 1.5 (not 0.4 cot 15 deg = 1.49): induced force 0.5 Fr / Y.
    induced = [0.5 * case[label]["fr_kN"] / 1.5 for label in ("outboard", "inboard")]
    assert max(case["outboard"]["fa_kN"], case["inboard"]["fa_kN"]) >= max(induced) - 1e-9
    # The pair rule (ISO 281:2007 7.3.2) leaves one bearing with exactly its own induced force,
    # which tells Y = 1.5 from the angle's 1.49 (0.5 % apart).
    assert any(case[label]["fa_kN"] == pytest.approx(force, rel=1e-9)
               for label, force in zip(("outboard", "inboard"), induced))
    assert found["bearings"]["outboard"]["c_from_geometry_kN"] == pytest.approx(C_GEOMETRY_KN)
    # ISO 281:2007 7.1.1 by hand (N, mm): Cr = bm fc (Lwe cos a)^(7/9) Z^(3/4) Dwe^(29/27),
    # bm = 1.1, fc interpolated in table 7 between 0.13 (87.1) and 0.14 (87.7), from memory.
    alpha = math.radians(15)
    gamma = 12 * math.cos(alpha) / 85
    fc = 87.1 + (gamma - 0.13) / 0.01 * (87.7 - 87.1)
    by_hand_kn = 1.1 * fc * (20 * math.cos(alpha)) ** (7 / 9) * 20 ** 0.75 * 12 ** (29 / 27) / 1e3
    assert found["bearings"]["outboard"]["c_from_geometry_kN"] == pytest.approx(by_hand_kn,
                                                                                 rel=1e-9)


def test_geometry_far_from_the_typed_rating_warns(document, write_case_file):
    with_geometry(document)
    document["pair"]["inboard"]["C_kN"] = round(1.3 * C_GEOMETRY_KN, 1)
    warnings = json.loads(run("check", write_case_file(document), "--json").output)["warnings"]
    assert any("C of the inboard bearing" in w and "differs by" in w for w in warnings)


@pytest.mark.parametrize("change, key_path, words", [
    (lambda d: d, "pair.outboard.rollers", "needs the internal geometry"),
    (lambda d: with_geometry(d)["pair"]["outboard"].pop("contact_angle_deg"),
     "pair.outboard.contact_angle_deg", "contact angle"),
    (lambda d: with_geometry(d)["pair"]["inboard"].update(roller_profile="logarithmic"),
     "pair.inboard.crown_drop_um", "crown_drop_um"),
    (lambda d: with_geometry(d)["pair"]["inboard"].update(crown_drop_um=8),
     "pair.inboard.crown_drop_um", "logarithmic"),
    (lambda d: with_geometry(d)["pair"]["outboard"].update(pitch_diameter_mm=20),
     "pair.outboard.pitch_diameter_mm", "table of fc"),
    (lambda d: with_geometry(d)["pair"]["outboard"].update(rollers=40),
     "pair.outboard.rollers", "do not fit"),
    (lambda d: with_geometry(d)["pair"].update(axial_setting_um=5000),
     "pair.axial_setting_um", "<= 2000"),
])
def test_bad_refined_input_exits_2_naming_the_key(document, write_case_file, change, key_path,
                                                  words):
    change(document)
    path = write_case_file(document)
    found = run("check", path, "--method", "refined")
    assert found.exit_code == 2
    assert key_path in found.output and words in found.output and "Traceback" not in found.output


def test_setting_sweep_json_points_and_best_range(document, write_case_file):
    path = write_case_file(symmetric_radial(document))
    found = run("setting", path, "--json")
    assert found.exit_code == 0, found.output
    sweep = json.loads(found.output)
    settings = [p["setting_um"] for p in sweep["points"]]
    assert settings == pytest.approx([-60 + 5 * i for i in range(37)])
    for point in sweep["points"]:
        assert point["system"]["l10_h"] > 0
        assert set(point["bearings"]) == {"outboard", "inboard"}
        assert point["bearings"]["outboard"]["l10_h"] > 0
    low, high = sweep["best"]["range_um"]
    assert low <= sweep["best"]["setting_um"] <= high
    # Pure radial load: more end play shrinks both load zones, so no life grows with it.
    lives = [p["system"]["l10_h"] for p in sweep["points"] if p["setting_um"] >= 0]
    assert all(b <= a * (1 + 1e-9) for a, b in zip(lives, lives[1:]))


def test_setting_points_are_the_checks_of_files_with_that_setting(document, write_case_file):
    # Independent path: each point against `check --method refined` of a file whose
    # [pair] axial_setting_um is that value; the settings come out as typed (no m/um noise).
    path = write_case_file(symmetric_radial(document))
    sweep = json.loads(run("setting", path, "--from", "-60", "--to", "60", "--step", "7",
                           "--json").output)
    settings = [p["setting_um"] for p in sweep["points"]]
    assert settings == [-60 + 7 * i for i in range(18)]
    for point in sweep["points"][::6]:
        document["pair"]["axial_setting_um"] = point["setting_um"]
        single = json.loads(run("check", write_case_file(document, "single.toml"), "--method",
                                "refined", "--json").output)
        assert point["system"]["l10_h"] == pytest.approx(single["system"]["l10_h"], rel=1e-9)
        for label, bearing in point["bearings"].items():
            assert bearing["l10_h"] == pytest.approx(single["bearings"][label]["l10_h"],
                                                     rel=1e-9)


@pytest.mark.parametrize("suffix", [".png", ".svg"])
def test_setting_plot_is_written_and_never_overwritten_without_force(
        document, write_case_file, tmp_path, suffix):
    path = write_case_file(symmetric_radial(document))
    plot = tmp_path / f"setting{suffix}"
    found = run("setting", path, "--from", "-20", "--to", "40", "--step", "10", "--plot", plot)
    assert found.exit_code == 0, found.output
    assert plot.stat().st_size > 1000
    again = run("setting", path, "--plot", plot)
    assert again.exit_code == 2 and "--force" in again.output
    assert run("setting", path, "--plot", plot, "--force").exit_code == 0


@pytest.mark.parametrize("args, words", [
    (["--step", "0"], "--step"), (["--from", "50", "--to", "10"], "--to"),
    (["--from", "-900"], "within"), (["--from", "nan"], "--from: expected a finite setting"),
    (["--to", "inf"], "--to: expected a finite setting"),
])
def test_setting_bad_options_exit_2(document, write_case_file, args, words):
    found = run("setting", write_case_file(symmetric_radial(document)), *args)
    assert found.exit_code == 2 and words in found.output


def test_setting_needs_the_geometry(document, write_case_file):
    found = run("setting", write_case_file(document))
    assert found.exit_code == 2 and "pair.outboard.rollers" in found.output


def test_setting_table_prints_a_zero_life_as_zero_not_infinite(document, write_case_file):
    # A setting without equilibrium for some case gets lives of zero (its warning says so);
    # the table must show 0 h there: a zero life read as "infinite" would pass a bad setting.
    import dataclasses

    import numpy as np
    from rich.console import Console

    from hubload.casefile import load_study
    from hubload.report.terminal.setting import render_setting, setting_table
    from hubload.studies.setting import run_setting_sweep

    study = load_study(write_case_file(symmetric_radial(document)))
    sweep = run_setting_sweep(study, np.array([-20.0, 0.0, 20.0]))
    refined = sweep.result.refined
    unsolved = dataclasses.replace(refined, converged=refined.converged & np.array(
        [[True], [False], [True]]))
    zeroed = dataclasses.replace(sweep, result=dataclasses.replace(sweep.result, refined=unsolved))
    pair = next(c for c in setting_table(zeroed).columns if c.key == "system_h")
    assert [pair.cell(i) for i in range(3)][1] == "0"
    console = Console(record=True, width=200)
    render_setting(zeroed, console)
    row = next(line.split() for line in console.export_text().splitlines()
               if line.split()[:1] == ["0"])
    assert "0" in row[1:] and "infinite" not in row


def test_case_without_equilibrium_counts_as_zero_life_and_dominates(document, write_case_file,
                                                                    monkeypatch):
    # A case the solver cannot balance is counted with life 0 (docs/refined-method.md): by
    # Palmgren-Miner and the series-system rule (e = 9/8) the pair's life is then 0 and that
    # case carries all of its damage. Forced here by marking case 1 unconverged.
    from hubload.model.refined import solver

    solve = solver.solve_equilibrium

    def second_case_fails(laminae, external, setting):
        found = solve(laminae, external, setting)
        converged = found.converged.copy()
        converged[1] = False
        return solver.Equilibrium(found.displacement, found.lamina_loads_n, converged,
                                  found.iterations)

    monkeypatch.setattr(solver, "solve_equilibrium", second_case_fails)
    result = run("check", write_case_file(with_geometry(document)), "--method", "refined",
                 "--json")
    assert result.exit_code == 0 and "RuntimeWarning" not in result.output, result.output
    found = json.loads(result.output)
    assert found["system"]["l10_h"] == 0.0
    assert found["dominant_case"]["index"] == 1
    assert [case["system_damage_share"] for case in found["cases"]] == [0.0, 1.0]
    assert any("No equilibrium of the shaft was found for case 'turn'" in warning
               for warning in found["warnings"])
