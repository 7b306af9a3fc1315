"""Logs in pressures, flows, modes and lateral accelerations: per-sample operating points
follow the same rules as the [[case]] blocks of a load-case file."""

import json
import tomllib

import numpy as np
import pyarrow as pa
import pyarrow.csv as pacsv
import pytest
from click.testing import CliRunner
from logsupport import ROOT

from hubload.cli import main

SITE_DUMPER = ROOT / "load_cases" / "site_dumper.toml"
HYDRAULIC_KEYS = ("pressure_bar", "flow_lpm", "lateral_accel_g")


def hydraulic_document():
    """The site dumper with its cases that derive every force (pressure, flow, manoeuvre)."""
    document = tomllib.loads(SITE_DUMPER.read_text())
    cases = [c for c in document["case"] if "pressure_bar" in c and "wheel_load_kN" not in c]
    cases.append({"name": "half mode on the road", "time_percent": 20.0, "mode": "half",
                  "pressure_bar": 110.0, "flow_lpm": 64.0})
    # whole seconds per case at 1 Hz over 3000 s, so the log holds the exact shares
    total = sum(c["time_percent"] for c in cases)
    seconds = [round(3000 * c["time_percent"] / total) for c in cases]
    document["case"] = [{**c, "time_percent": 100 * s / 3000}
                        for c, s in zip(cases, seconds)]
    return document


def log_of(cases, seconds=3000, extra=None):
    """Hold each case for its time share (1 Hz), one end row; string mode column."""
    counts = [round(c["time_percent"] / 100 * seconds) for c in cases]
    assert sum(counts) == seconds
    columns = {key: np.append(np.repeat([c.get(key, 0.0) for c in cases], counts), 0.0)
               for key in HYDRAULIC_KEYS}
    columns.update({key: np.append(np.repeat(values, counts), 0.0)
                    for key, values in (extra or {}).items()})
    modes = np.append(np.repeat([c.get("mode", "full") for c in cases], counts), "full")
    return {"time_s": np.arange(modes.size, dtype=float), **columns, "mode": modes}


def write(path, columns):
    pacsv.write_csv(pa.table(columns), path)
    return str(path)


def run(*args):
    result = CliRunner().invoke(main, [*map(str, args), "--json"])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


@pytest.fixture
def dumper(tmp_path, write_case_file):
    document = hydraulic_document()
    case_file = write_case_file(document)
    return document, case_file, run("check", case_file)


def test_hydraulic_log_has_the_life_of_the_same_hydraulic_cases(tmp_path, dumper):
    document, case_file, checked = dumper
    found = run("spectrum", write(tmp_path / "log.csv", log_of(document["case"])),
                "--case-file", case_file)
    for label in ("outboard", "inboard"):
        assert found["direct"]["bearings"][label]["l10_h"] == pytest.approx(
            checked["bearings"][label]["l10_h"], rel=1e-9)
    assert found["direct"]["system"]["l10_h"] == pytest.approx(checked["system"]["l10_h"],
                                                                rel=1e-9)
    # two cases may share a class here (their levels then merge): close, not exact
    assert found["classed"]["system"]["l10_h"] == pytest.approx(checked["system"]["l10_h"],
                                                                 rel=1e-3)
    assert any("capped" in warning for warning in found["warnings"])  # the relief-pressure start
    assert found["flags_time_fraction"]["pressure_above_rating"] > 0


def test_logged_wheel_speed_replaces_the_flow_without_changing_the_life(tmp_path, dumper):
    document, case_file, checked = dumper
    speeds = [case["speed_rpm"] for case in checked["cases"]]
    columns = log_of(document["case"], extra={"speed_rpm": speeds})
    columns.pop("flow_lpm")
    found = run("spectrum", write(tmp_path / "log.csv", columns), "--case-file", case_file)
    assert found["direct"]["system"]["l10_h"] == pytest.approx(checked["system"]["l10_h"],
                                                                rel=1e-9)


def test_measured_forces_take_precedence_over_the_hydraulics(tmp_path, dumper):
    document, case_file, checked = dumper
    forces = {"wheel_load_kN": [c["wheel_load_kN"] for c in checked["cases"]],
              "side_force_kN": [c["side_force_kN"] for c in checked["cases"]],
              "tractive_force_kN": [c["tractive_force_kN"] for c in checked["cases"]],
              "speed_rpm": [c["speed_rpm"] for c in checked["cases"]]}
    columns = log_of(document["case"], extra=forces)
    found = run("spectrum", write(tmp_path / "log.csv", columns), "--case-file", case_file)
    assert found["direct"]["system"]["l10_h"] == pytest.approx(checked["system"]["l10_h"],
                                                                rel=1e-9)
    assert any("pressure_bar" in note and "ignored" in note for note in found["notes"])


def test_pressure_log_without_a_motor_block_exits_2(tmp_path, dumper, write_case_file):
    document, _, _ = dumper
    machine = {k: v for k, v in document.items() if k not in ("motor", "case")}
    case_file = write_case_file(machine, name="no_motor.toml")
    log = write(tmp_path / "log.csv", log_of(document["case"]))
    result = CliRunner().invoke(main, ["spectrum", log, "--case-file", case_file])
    assert result.exit_code == 2
    assert "needs a [motor] block" in result.output and log in result.output


def test_half_mode_on_a_single_speed_motor_names_the_row(tmp_path, dumper, write_case_file):
    document, _, _ = dumper
    single_speed = {**document, "motor": {**document["motor"], "half_mode": False},
                    "case": [c for c in document["case"] if c.get("mode") != "half"]}
    total = sum(c["time_percent"] for c in single_speed["case"])
    single_speed["case"] = [{**c, "time_percent": 100 * c["time_percent"] / total}
                            for c in single_speed["case"]]
    case_file = write_case_file(single_speed, name="single.toml")
    columns = log_of(document["case"])
    first_half = int(np.argmax(columns["mode"] == "half")) + 1
    log = write(tmp_path / "log.csv", columns)
    result = CliRunner().invoke(main, ["spectrum", log, "--case-file", case_file])
    assert result.exit_code == 2
    assert f"{log}: row {first_half}, column 'mode': expected mode \"full\"" in result.output


def test_unknown_mode_value_names_the_row(tmp_path, dumper):
    document, case_file, _ = dumper
    columns = log_of(document["case"])
    columns["mode"] = columns["mode"].astype(object)
    columns["mode"][5] = "quarter"
    log = write(tmp_path / "log.csv", columns)
    result = CliRunner().invoke(main, ["spectrum", log, "--case-file", case_file])
    assert result.exit_code == 2
    assert f"{log}: row 6, column 'mode': expected one of 'full', 'half'" in result.output


YARD_LOADER = ROOT / "load_cases" / "yard_loader.toml"


def test_logged_temperature_gives_the_modified_life_of_cases_with_those_temperatures(
        tmp_path, write_case_file):
    # the same loads at two oil temperatures: a case file with temperature_C per case
    # (ISO 281 viscosity ratio at each temperature) is the reference
    document = tomllib.loads(YARD_LOADER.read_text())
    level = {"wheel_load_kN": 14.0, "tractive_force_kN": 2.0, "speed_rpm": 120.0}
    document["case"] = [{"name": "cool", "time_percent": 40.0, **level, "temperature_C": 40.0},
                        {"name": "hot", "time_percent": 60.0, **level, "temperature_C": 95.0}]
    case_file = write_case_file(document)
    checked = run("check", case_file)
    columns = {key: np.append(np.repeat(value, 1000), value) for key, value in level.items()}
    columns["temperature_C"] = np.append(np.repeat([40.0, 95.0], [400, 600]), 95.0)
    columns["time_s"] = np.arange(1001, dtype=float)
    out = tmp_path / "spectrum.toml"
    found = run("spectrum", write(tmp_path / "log.csv", columns), "--case-file", case_file,
                "--out", out)
    assert found["direct"]["system"]["l10m_h"] == pytest.approx(checked["system"]["l10m_h"],
                                                                 rel=1e-9)
    assert found["direct"]["system"]["l10_h"] == pytest.approx(checked["system"]["l10_h"],
                                                                rel=1e-9)
    # one load class, so the classed case has the revolution-weighted mean temperature; at
    # one speed that is the time-weighted mean (hand calculation: 0.4 x 40 + 0.6 x 95 = 73 C)
    assert [c["temperature_C"] for c in found["classed"]["cases"]] == pytest.approx([73.0])
    assert run("check", out)["system"]["l10m_h"] == pytest.approx(
        found["classed"]["system"]["l10m_h"], rel=1e-8)


def test_temperature_outside_the_oil_range_names_the_row(tmp_path):
    columns = {"time_s": np.arange(4.0), "wheel_load_kN": np.full(4, 10.0),
               "speed_rpm": np.full(4, 50.0), "temperature_C": np.array([50, 60, 170, 60.0])}
    log = write(tmp_path / "log.csv", columns)
    result = CliRunner().invoke(main, ["spectrum", log, "--case-file", str(YARD_LOADER)])
    assert result.exit_code == 2
    assert f"{log}: row 3, column 'temperature_C': expected a value from -40 to 150" in (
        result.output)
