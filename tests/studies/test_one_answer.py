"""One question, one answer: the governing life and the verdict of a file are the same in
every output that reports them (property over random files, both methods, several
reliabilities, with and without lubrication).

Outputs compared with ``check --json``: a one-point sweep at the file's own value, ``setting``
at the file's own setting (refined method), ``compare`` of the file with itself, the brief's
"now" numbers and the HTML report's verdict.
"""

from __future__ import annotations

import json
import re

import pytest
from click.testing import CliRunner
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from hubload.cli import main
from hubload.report.numbers import hours
from studies_helpers import YARD_LOADER, read_toml, write_toml

REL = 1e-9


def run_json(*args) -> dict:
    result = CliRunner().invoke(main, [*map(str, args), "--json"])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


@st.composite
def files(draw):
    """The bundled yard loader (it has the internal geometry) with random changes."""
    document = read_toml(YARD_LOADER)
    project = document["project"]
    project["reliability_percent"] = draw(st.sampled_from([90.0, 95.0, 99.0]))
    project["target_life_h"] = draw(st.sampled_from([500.0, 3000.0, 10000.0, 40000.0]))
    project["method"] = draw(st.sampled_from(["iso281", "refined"]))
    project["verdict_basis"] = draw(st.sampled_from(["shorter", "iso281", "refined"]))
    document["wheel"]["offset_mm"] = draw(st.floats(40.0, 160.0))
    document["pair"]["axial_setting_um"] = draw(st.sampled_from([-20.0, 0.0, 20.0, 60.0]))
    if draw(st.booleans()):
        del document["lubrication"]
        for case in document["case"]:
            case.pop("temperature_C", None)
    scale = draw(st.floats(0.5, 1.6))
    for case in document["case"]:
        for key in ("wheel_load_kN", "side_force_kN"):
            if key in case:
                case[key] = case[key] * scale
    return document


def governing_of(entry: dict) -> tuple:
    return entry["symbol"], entry["life_h"], entry["method"], entry["reliability_percent"]


def assert_same_life(found: dict, expected: dict, where: str) -> None:
    assert found["symbol"] == expected["symbol"], where
    assert found["method"] == expected["method"], where
    assert found["reliability_percent"] == expected["reliability_percent"], where
    if expected["life_h"] is None:
        assert found["life_h"] is None, where
    else:
        assert found["life_h"] == pytest.approx(expected["life_h"], rel=REL), where


@settings(max_examples=12, deadline=None,
          suppress_health_check=[HealthCheck.function_scoped_fixture, HealthCheck.too_slow])
@given(document=files())
def test_every_output_reports_the_checks_governing_life_and_verdict(tmp_path, document):
    path = write_toml(document, tmp_path / "machine.toml")
    check = run_json("check", path)
    governing, verdict = check["governing_life"], check["verdict"]
    assert verdict["life"] == governing["symbol"]
    assert verdict["life_h"] == governing["life_h"] or \
        verdict["life_h"] == pytest.approx(governing["life_h"], rel=REL)

    offset = document["wheel"]["offset_mm"]
    point = run_json("sweep", path, "--vary", f"wheel.offset_mm={offset}:{offset}:1")["points"][0]
    assert_same_life(point["governing_life"], governing, "sweep")
    assert point["verdict"]["passed"] == verdict["passed"]

    compared = run_json("compare", path, path)["files"]
    for entry in compared:
        assert_same_life(entry["governing_life"], governing, "compare")
        assert entry["damage_life"] == governing["symbol"]
        assert entry["verdict"]["passed"] == verdict["passed"]

    brief = CliRunner().invoke(main, ["brief", str(path)]).output
    assert f"| {governing['symbol']} now |" in brief
    for label, bearing in governing["bearings"].items():
        life = bearing["life_h"]
        assert (hours(life) + (" h" if life is not None else "")) in brief, label

    report = tmp_path / "report.html"
    assert CliRunner().invoke(main, ["check", str(path), "--report", str(report),
                                     "--force"]).exit_code == 0
    page = report.read_text(encoding="utf-8")
    shown = re.search(r'data-key="verdict.life_h">([^<]*)<', page).group(1)
    assert shown == hours(governing["life_h"])
    assert ("PASS" if verdict["passed"] else "FAIL") in page

    if document["project"]["method"] == "refined":
        setting = document["pair"]["axial_setting_um"]
        swept = run_json("setting", path, "--from", setting, "--to", setting, "--step", 1)
        assert_same_life(swept["points"][0]["governing_life"], governing, "setting")
