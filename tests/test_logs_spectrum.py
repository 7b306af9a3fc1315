"""hubload spectrum on single logs: direct damage, classed spectrum, round trip through check."""

import json
import tomllib

import numpy as np
import pytest
from click.testing import CliRunner
from logsupport import YARD_LOADER, realistic_log, spectrum_log, write_log

from hubload.casefile import load_study
from hubload.casefile.machine import load_machine
from hubload.cli import main
from hubload.logs.pipeline import LogOptions, process_log
from hubload.logs.spectrum import spectrum_result

WORKED_EXAMPLE = {"wheel": {"offset_mm": 100, "loaded_radius_mm": 400},
                  "pair": {"arrangement": "back-to-back",
                           "outboard": {"position_mm": 30, "C_kN": 120, "C0_kN": 160,
                                        "e": 0.4, "Y": 1.5, "Y0": 0.8},
                           "inboard": {"position_mm": -50, "C_kN": 100, "C0_kN": 130,
                                       "e": 0.4, "Y": 1.5, "Y0": 0.8}}}
WORKED_CASE = {"time_percent": 100, "wheel_load_kN": 20, "side_force_kN": 4,
               "tractive_force_kN": 6, "speed_rpm": 50}


def spectrum_json(*args):
    result = CliRunner().invoke(main, ["spectrum", *map(str, args), "--json"])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


def yard_cases():
    """The bundled yard loader's spectrum in log channels (km/h converted to r/min)."""
    cases = load_study(YARD_LOADER).cases
    return [{"time_percent": 100 * cases.time_fraction[i],
             "wheel_load_kN": cases.wheel_load_n[i] / 1e3,
             "side_force_kN": cases.side_force_n[i] / 1e3,
             "tractive_force_kN": cases.tractive_force_n[i] / 1e3,
             "speed_rpm": cases.speed_rpm[i]} for i in range(len(cases))]


def test_constant_log_gives_the_hand_worked_example_lives(tmp_path, write_case_file):
    # docs/worked-example.md, hand calculation: L10h 114,700 / 2,691,000 h, system 111,900 h
    case_file = write_case_file(WORKED_EXAMPLE)
    log = write_log(tmp_path / "constant.csv", spectrum_log([WORKED_CASE], seconds=600))
    document = spectrum_json(log, "--case-file", case_file)
    direct = document["direct"]
    assert direct["bearings"]["outboard"]["l10_h"] == pytest.approx(114_700, rel=5e-4)
    assert direct["bearings"]["inboard"]["l10_h"] == pytest.approx(2_691_000, rel=5e-4)
    assert direct["system"]["l10_h"] == pytest.approx(111_900, rel=5e-4)
    assert document["duration_h"] == pytest.approx(1800 / 3600)
    assert document["rows"] == 1801


def test_constant_log_direct_life_equals_the_single_case_check(tmp_path, write_case_file):
    case_file = write_case_file({**WORKED_EXAMPLE, "case": [{"name": "only", **WORKED_CASE}]})
    checked = json.loads(CliRunner().invoke(main, ["check", case_file, "--json"]).output)
    log = write_log(tmp_path / "constant.parquet", spectrum_log([WORKED_CASE]))
    document = spectrum_json(log, "--case-file", case_file)
    for label in ("outboard", "inboard"):
        assert document["direct"]["bearings"][label]["l10_h"] == pytest.approx(
            checked["bearings"][label]["l10_h"], rel=1e-12)
        assert document["direct"]["bearings"][label]["s0"] == pytest.approx(
            checked["bearings"][label]["s0"], rel=1e-12)
    assert document["direct"]["system"]["l10_h"] == pytest.approx(
        checked["system"]["l10_h"], rel=1e-12)
    assert len(document["classed"]["cases"]) == 1
    assert document["classing_error"] == pytest.approx(0.0, abs=1e-12)


def test_log_built_from_a_known_spectrum_gives_that_spectrum_and_life_back(tmp_path):
    known = yard_cases()
    log = write_log(tmp_path / "spectrum.csv", spectrum_log(known, seconds=2000))
    spectrum_file = tmp_path / "back.toml"
    document = spectrum_json(log, "--case-file", YARD_LOADER, "--out", spectrum_file)
    checked = json.loads(CliRunner().invoke(main, ["check", str(YARD_LOADER), "--json"]).output)
    assert document["direct"]["system"]["l10_h"] == pytest.approx(checked["system"]["l10_h"],
                                                                    rel=1e-9)
    assert document["classed"]["system"]["l10_h"] == pytest.approx(checked["system"]["l10_h"],
                                                                    rel=1e-9)
    got = sorted((c["wheel_load_kN"], c["side_force_kN"], c["tractive_force_kN"],
                  c["speed_rpm"], c["time_fraction"]) for c in document["classed"]["cases"])
    want = sorted((c["wheel_load_kN"], c["side_force_kN"], c["tractive_force_kN"],
                   c["speed_rpm"], c["time_percent"] / 100) for c in known)
    np.testing.assert_allclose(got, want, rtol=1e-9, atol=1e-9)
    # the demo has a [lubrication] block: the modified life comes back too
    assert document["direct"]["system"]["l10m_h"] == pytest.approx(
        checked["system"]["l10m_h"], rel=1e-9)
    for label in ("outboard", "inboard"):
        assert document["direct"]["bearings"][label]["l10m_h"] == pytest.approx(
            checked["bearings"][label]["l10m_h"], rel=1e-9)
    assert document["classing_error_l10m"] == pytest.approx(0.0, abs=1e-9)
    rechecked = CliRunner().invoke(main, ["check", str(spectrum_file), "--json"])
    assert rechecked.exit_code == 0, rechecked.output
    assert json.loads(rechecked.output)["system"]["l10_h"] == pytest.approx(
        checked["system"]["l10_h"], rel=1e-8)


def test_damage_by_wheel_load_class_matches_the_check_shares(tmp_path):
    known = yard_cases()
    log = write_log(tmp_path / "spectrum.csv", spectrum_log(known, seconds=2000))
    document = spectrum_json(log, "--case-file", YARD_LOADER)
    checked = json.loads(CliRunner().invoke(main, ["check", str(YARD_LOADER), "--json"]).output)
    by_class = document["direct"]["damage_by_class"]["wheel_load_kN"]
    expected = [0.0] * len(by_class)
    for case, level in zip(checked["cases"], known):  # both in file order
        index = next(i for i, b in enumerate(by_class)
                     if b["low"] <= level["wheel_load_kN"] < b["high"])
        expected[index] += case["system_damage_share"]
    assert [b["damage_share"] for b in by_class] == pytest.approx(expected, abs=1e-9)


def test_speed_in_kmh_and_mapped_headers_give_the_same_life(tmp_path):
    known = yard_cases()
    columns = spectrum_log(known, seconds=500)
    rolling_radius_m = 0.395  # the yard loader's rolling_radius_mm; v = 2 pi r n (no slip)
    renamed = {"t": columns["time_s"], "Fz": columns["wheel_load_kN"],
               "Fy": columns["side_force_kN"], "Fx": columns["tractive_force_kN"],
               "v": columns["speed_rpm"] * 2 * np.pi * rolling_radius_m * 60 / 1000}
    plain = spectrum_json(write_log(tmp_path / "plain.csv", columns), "--case-file", YARD_LOADER)
    mapped = spectrum_json(write_log(tmp_path / "mapped.csv", renamed), "--case-file",
                           YARD_LOADER, "--column", "time_s=t", "--column", "wheel_load_kN=Fz",
                           "--column", "side_force_kN=Fy", "--column", "tractive_force_kN=Fx",
                           "--column", "speed_kmh=v")
    assert mapped["direct"]["system"]["l10_h"] == pytest.approx(
        plain["direct"]["system"]["l10_h"], rel=1e-9)
    assert mapped["columns"]["speed_kmh"] == "v"


def test_csv_and_parquet_logs_give_identical_results(tmp_path):
    columns = realistic_log(20_000, seed=3)
    from_csv = spectrum_json(write_log(tmp_path / "a.csv", columns), "--case-file", YARD_LOADER)
    from_parquet = spectrum_json(write_log(tmp_path / "a.parquet", columns), "--case-file",
                                 YARD_LOADER)
    for label in ("outboard", "inboard"):
        assert from_csv["direct"]["bearings"][label]["l10_h"] == pytest.approx(
            from_parquet["direct"]["bearings"][label]["l10_h"], rel=1e-12)
    assert from_csv["classed"]["system"]["l10_h"] == pytest.approx(
        from_parquet["classed"]["system"]["l10_h"], rel=1e-12)


@pytest.fixture(scope="module")
def realistic(tmp_path_factory):
    path = tmp_path_factory.mktemp("logs") / "realistic.parquet"
    return write_log(path, realistic_log(150_000, seed=7))


def classing_error(log, classes):
    study, _ = load_machine(YARD_LOADER)
    options = LogOptions() if classes is None else LogOptions(classes=(classes,) * 4)
    return spectrum_result(process_log(log, study, options), study).classing_error


def test_classing_error_is_within_two_percent_with_the_default_classes(realistic):
    assert abs(classing_error(realistic, None)) < 0.02


def test_classing_error_shrinks_with_more_classes(realistic):
    # each step halves every class width (the grids nest); with fewer than about
    # 8 classes errors of both signs may cancel by chance, so the trend starts there
    errors = [abs(classing_error(realistic, n)) for n in (8, 16, 32, 64)]
    assert all(finer < coarser for coarser, finer in zip(errors, errors[1:])), errors
    assert errors[-1] < 0.005


def test_spectrum_file_is_refused_when_it_exists_and_written_with_force(tmp_path):
    log = write_log(tmp_path / "log.csv", spectrum_log(yard_cases(), seconds=200))
    out = tmp_path / "spectrum.toml"
    out.write_text("# someone's file\n")
    refused = CliRunner().invoke(main, ["spectrum", log, "--case-file", str(YARD_LOADER),
                                        "--out", str(out)])
    assert refused.exit_code == 2
    assert "--force" in refused.output and str(out) in refused.output
    assert out.read_text() == "# someone's file\n"
    forced = CliRunner().invoke(main, ["spectrum", log, "--case-file", str(YARD_LOADER),
                                       "--out", str(out), "--force"])
    assert forced.exit_code == 0, forced.output
    written = tomllib.loads(out.read_text())
    assert written["pair"] == tomllib.loads(YARD_LOADER.read_text())["pair"]
    assert sum(c["time_percent"] for c in written["case"]) == pytest.approx(100.0)


def test_text_report_shows_lives_error_shares_and_cautions(tmp_path):
    log = write_log(tmp_path / "log.csv", spectrum_log(yard_cases(), seconds=200))
    result = CliRunner().invoke(main, ["spectrum", log, "--case-file", str(YARD_LOADER)])
    assert result.exit_code == 0, result.output
    for text in ("Lives: direct (every sample) and classed spectrum", "Classing error",
                 "Direct damage by wheel load", "Caution"):
        assert text in result.output


def test_without_lubrication_there_is_no_modified_life(tmp_path, write_case_file):
    case_file = write_case_file(WORKED_EXAMPLE)
    log = write_log(tmp_path / "constant.csv", spectrum_log([WORKED_CASE], seconds=60))
    document = spectrum_json(log, "--case-file", case_file)
    assert "l10m_h" not in document["direct"]["system"]
    assert "classing_error_l10m" not in document


def test_slow_samples_below_kappa_0_1_are_reported_as_a_share_of_time(tmp_path):
    # ISO 281:2007 aISO covers kappa >= 0.1; a crawling wheel runs below it
    crawl = [{"time_percent": 25, "wheel_load_kN": 15, "speed_rpm": 0.5},
             {"time_percent": 75, "wheel_load_kN": 15, "speed_rpm": 80}]
    log = write_log(tmp_path / "crawl.csv", spectrum_log(crawl, seconds=400))
    document = spectrum_json(log, "--case-file", YARD_LOADER)
    assert document["flags_time_fraction"]["kappa_outside_scope"] == pytest.approx(0.25)
    assert any("kappa < 0.1" in warning for warning in document["warnings"])


def test_shaft_sections_over_a_log_match_the_shaft_check_of_the_same_cases(
        tmp_path, write_case_file):
    # the shaft check of `check` on the same two cases is the reference; the harsh
    # case (side force outboard, high traction) gives the sections a finite life
    document = tomllib.loads(YARD_LOADER.read_text())
    cases = [{"time_percent": 30, "wheel_load_kN": 30, "side_force_kN": -12,
              "tractive_force_kN": 15, "speed_rpm": 60},
             {"time_percent": 70, "wheel_load_kN": 12, "tractive_force_kN": 2, "speed_rpm": 90}]
    document["case"] = [{"name": f"case {i}", **case} for i, case in enumerate(cases)]
    case_file = write_case_file(document)
    checked = json.loads(CliRunner().invoke(main, ["check", case_file, "--json"]).output)
    log = write_log(tmp_path / "harsh.csv", spectrum_log(cases, seconds=100))
    found = spectrum_json(log, "--case-file", case_file)
    for want, got, classed in zip(checked["shaft"]["sections"],
                                  found["shaft"]["direct"]["sections"],
                                  found["shaft"]["classed"]["sections"]):
        assert got["name"] == want["name"]
        assert got["fatigue_life_h"] == pytest.approx(want["fatigue_life_h"], rel=1e-9)
        assert classed["fatigue_life_h"] == pytest.approx(want["fatigue_life_h"], rel=1e-9)
        assert got["min_safety"] == pytest.approx(want["min_safety"], rel=1e-12)
        assert got["yield_safety"] == pytest.approx(want["yield_safety"], rel=1e-12)
    assert any("lowest fatigue safety" in warning for warning in found["warnings"])


def test_refined_method_solves_the_classes_and_matches_a_check_of_the_spectrum(tmp_path):
    # The refined method runs on the log's classes, not on its rows: the classed governing life
    # is the one `check --method refined` gives for the written spectrum file (one answer).
    from logsupport import realistic_log, write_log

    log = write_log(tmp_path / "log.parquet", realistic_log(20000, seed=5))
    out = tmp_path / "spectrum.toml"
    found = CliRunner().invoke(main, ["spectrum", log, "--case-file", str(YARD_LOADER),
                                      "--method", "refined", "--out", str(out), "--json"])
    assert found.exit_code == 0, found.output
    document = json.loads(found.output)
    check = json.loads(CliRunner().invoke(main, ["check", str(out), "--method", "refined",
                                                 "--json"]).output)
    assert document["classed"]["governing_life"]["life_h"] == pytest.approx(
        check["governing_life"]["life_h"], rel=1e-6)
    # the classing error still compares like with like (ISO 281 rule, direct and classed)
    assert abs(document["classing_error"]) < 0.03
