"""Studies under the refined method (--method refined): each sweep point is the separate
`check --method refined` of a written file, comparisons carry the refined lives, and the
brief solves the rating needed on the geometry rating that the refined lives use."""

from __future__ import annotations

import copy
import json
import re

import pytest
from click.testing import CliRunner

from hubload.casefile.variation import parse_key_path
from hubload.cli import main
from studies_helpers import SCENARIOS, YARD_LOADER, assert_close, read_toml, set_key, write_toml

FILE_LEVEL_KEYS = ("title", "source", "method", "cases", "cautions")


def check(path, *options) -> dict:
    result = CliRunner().invoke(main, ["check", str(path), "--json", *options])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


@pytest.mark.parametrize("key,start,stop", [
    ("wheel.offset_mm", 60.0, 140.0),
    ("pair.axial_setting_um", -30.0, 90.0),
    ("case[3].side_force_kN", 0.0, 8.0),
])
def test_refined_sweep_point_equals_a_refined_check_of_a_written_file(key, start, stop,
                                                                      tmp_path):
    document = read_toml(YARD_LOADER)
    swept = CliRunner().invoke(main, ["sweep", str(YARD_LOADER), "--method", "refined",
                                      "--vary", f"{key}={start}:{stop}:3", "--json"])
    assert swept.exit_code == 0, swept.output
    points = json.loads(swept.output)["points"]
    path = parse_key_path(key, document)
    for index, value in enumerate((start, (start + stop) / 2, stop)):
        variant = copy.deepcopy(document)
        set_key(variant, path.segments, value)
        expected = check(write_toml(variant, tmp_path / f"p{index}.toml"), "--method", "refined")
        for name, entry in expected.items():
            if name not in FILE_LEVEL_KEYS:
                assert_close(points[index][name], entry, f"{key}={value}: {name}", rel=1e-9)


def test_refined_compare_carries_the_refined_lives():
    compared = json.loads(CliRunner().invoke(main, [
        "compare", *map(str, SCENARIOS), "--method", "refined", "--json"]).output)
    for entry, scenario in zip(compared["files"], SCENARIOS):
        assert entry["method"] == "refined"
        assert_close(entry["system"], check(scenario, "--method", "refined")["system"], "system",
                     rel=1e-9)


def test_refined_brief_solves_on_the_geometry_rating():
    # ISO/TS 16281 lamina capacities all scale with the bearing's rating, so a bearing's
    # reference life goes with C^(10/3) (ISO 281:2007, 7.1): C_needed = C_geometry (T/L)^0.3.
    markdown = CliRunner().invoke(main, ["brief", str(YARD_LOADER), "--method",
                                         "refined"]).output
    result = check(YARD_LOADER, "--method", "refined")
    target, life_key = result["verdict"]["target_h"], f"{result['verdict']['life'].lower()}_h"
    line = next(l for l in markdown.splitlines() if l.startswith("| C for this bearing's own"))
    cells = [c.strip() for c in line.strip("|").split("|")][1:]
    for label, cell in zip(result["bearings"], cells):
        bearing = result["bearings"][label]
        expected = bearing["c_from_geometry_kN"] * (target / bearing[life_key]) ** 0.3
        assert float(re.match(r"([\d,.]+) kN", cell).group(1).replace(",", "")) == \
            pytest.approx(expected, abs=0.006)
        assert "geometry" in cell
