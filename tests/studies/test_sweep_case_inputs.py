"""Sweeps over the keys a file's cases are derived from: every point equals `check` of the
variant written as a file of its own. The variants of a sweep share the cases they read
alike (casefile.load.memo_cases); these keys must each give the point its own cases."""

from __future__ import annotations

import json

import numpy as np
import pytest

from hubload.casefile import load_study
from hubload.casefile.variation import parse_key_path
from hubload.engine import evaluate
from hubload.report.json.check import result_document
from hubload.report.json.sweep import sweep_document
from hubload.studies.sweep import run_sweep
from studies_helpers import LOAD_CASES, read_toml, set_key, write_toml

SITE_DUMPER = LOAD_CASES / "site_dumper.toml"      # cases from pressure, flow, lateral g
ROAD_SWEEPER = LOAD_CASES / "road_sweeper.toml"    # cases given in km/h

SWEEPS = [
    (SITE_DUMPER, "wheel.rolling_radius_mm", (380.0, 520.0)),
    (SITE_DUMPER, "wheel.adhesion_mu", (0.2, 0.9)),
    (SITE_DUMPER, "motor.displacement_cc", (600.0, 950.0)),
    (SITE_DUMPER, "motor.efficiency_mechanical", (0.8, 0.97)),
    (SITE_DUMPER, "vehicle.axle_load_kN", (25.0, 40.0)),
    (SITE_DUMPER, "vehicle.cog_height_mm", (700.0, 1100.0)),
    (SITE_DUMPER, "case[1].lateral_accel_g", (0.05, 0.3)),
    (ROAD_SWEEPER, "wheel.rolling_radius_mm", (250.0, 340.0)),
    (SITE_DUMPER, "wheel.offset_mm", (40.0, 160.0)),    # the cases stay the same
]


KEYS = ("governing_life", "system", "bearings", "shaft", "warnings", "mean_speed_rpm")


def leaves(node, path=""):
    """(key path, value) of every leaf of a JSON document."""
    if isinstance(node, dict):
        for key, value in node.items():
            yield from leaves(value, f"{path}.{key}")
    elif isinstance(node, list):
        for index, value in enumerate(node):
            yield from leaves(value, f"{path}[{index}]")
    else:
        yield path, node


def assert_same(point: dict, check: dict) -> None:
    """Equal leaves; numbers to rtol 1e-12 (a rating from the geometry is summed over
    the batch's axis in one and alone in the other, so its last bit may differ)."""
    found = dict(leaves({key: point[key] for key in KEYS}))
    expected = dict(leaves({key: check[key] for key in KEYS}))
    assert found.keys() == expected.keys()
    for path, value in expected.items():
        if isinstance(value, float):
            assert found[path] == pytest.approx(value, rel=1e-12), path
        else:
            assert found[path] == value, path


@pytest.mark.parametrize("file, key, bounds", SWEEPS, ids=lambda v: str(v)[-24:])
def test_each_point_equals_check_of_its_written_variant(tmp_path, file, key, bounds):
    sweep = run_sweep(str(file), [f"{key}={bounds[0]}:{bounds[1]}:3"])
    points = sweep_document(sweep)["points"]
    path = parse_key_path(key, read_toml(file))
    loads = set()
    for value, point in zip(np.linspace(*bounds, 3), points):
        document = read_toml(file)
        set_key(document, path.segments, float(value))
        variant = write_toml(document, tmp_path / f"variant_{value:g}.toml")
        check = result_document(evaluate(load_study(variant)))
        assert_same(point, check)
        loads.add(json.dumps(check["cases"], sort_keys=True))
    if key != "wheel.offset_mm":
        assert len(loads) == 3, f"{key}: the variants' cases should differ"
