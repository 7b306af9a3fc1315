"""The JSON contract of `hubload check --json` (keys may be added, never renamed)."""

import json
import math

from click.testing import CliRunner

from hubload.cli import main

CASE_BEARING_KEYS = {"fr_kN", "fa_kN", "p_kN", "p0_kN", "l10_h", "damage_share"}


def check_json(path):
    result = CliRunner().invoke(main, ["check", path, "--json"])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


def test_contract_keys_in_file_order_with_null_for_infinite_lives(document, write_case_file):
    document["case"].append({"name": "parked", "time_percent": 0, "wheel_load_kN": 30,
                             "speed_rpm": 0})
    output = check_json(write_case_file(document))
    assert [case["name"] for case in output["cases"]] == ["travel", "turn", "parked"]
    for case in output["cases"]:
        assert {"name", "time_fraction", "speed_rpm", "bearings"} <= set(case)
        for label in ("outboard", "inboard"):
            assert CASE_BEARING_KEYS <= set(case["bearings"][label])
    assert output["cases"][2]["bearings"]["outboard"]["l10_h"] is None
    for label in ("outboard", "inboard"):
        assert {"l10_h", "l10_km", "s0"} <= set(output["bearings"][label])
    assert {"l10_h", "l10_km"} <= set(output["system"])


def test_speed_in_kmh_is_reported_in_rpm(document, write_case_file):
    # Rolling without slip: n = v / (2 pi r); 5 km/h on a 0.4 m radius.
    output = check_json(write_case_file(document))
    expected = 5 / 3.6 * 60 / (2 * math.pi * 0.4)
    assert abs(output["cases"][1]["speed_rpm"] - expected) < 1e-9


def test_json_mode_prints_json_only(document, write_case_file):
    result = CliRunner().invoke(main, ["check", write_case_file(document), "--json"])
    json.loads(result.output)
    assert result.output.lstrip().startswith("{")


def test_a_single_case_within_the_time_tolerance_is_accepted(document, write_case_file):
    # The core issue's rule: time shares add to 100 % within 0.5 %; one case of 100.4 % meets
    # it like two cases of 60 % and 40.4 % do, and its share of the spectrum is then all of it.
    document["case"] = document["case"][:1]
    document["case"][0]["time_percent"] = 100.4
    output = check_json(write_case_file(document))
    assert output["cases"][0]["time_fraction"] == 1.0
