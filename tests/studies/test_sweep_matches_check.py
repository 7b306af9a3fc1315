"""A sweep point is the same calculation as a separate ``check`` of a file written with
that value: every numeric key present in every bundled scenario is swept over three
values and compared with three real files checked one by one (independent path: TOML
written by tomli-w, parsed and evaluated by ``check``)."""

from __future__ import annotations

import copy
import json

import pytest
from click.testing import CliRunner

from hubload.casefile.variation import parse_key_path
from hubload.cli import main
from hubload.schema import FORMAT
from hubload.schema.fleetformat import FORECAST_TABLES
from studies_helpers import SCENARIOS, assert_close, read_toml, set_key, write_toml

# Keys of the check's point documents that a sweep point repeats.
COMPARED = ("bearings", "system", "verdict")
FILE_LEVEL_KEYS = ("title", "source", "method", "cases", "cautions")


def numeric_paths(document: dict, table=FORMAT, prefix: str = "") -> list[str]:
    """Every numeric key written in ``document``, as a sweep key path."""
    paths = []
    for field in table.fields:
        if field.key in document and field.kind in ("number", "integer"):
            paths.append(f"{prefix}{field.key}")
        elif field.key in document and field.kind == "number-list":
            paths += [f"{prefix}{field.key}[{i}]" for i in range(len(document[field.key]))]
    for sub in table.tables:
        if sub.name not in document or (table is FORMAT and sub.name in FORECAST_TABLES):
            continue   # only the forecast reads these (a sweep refuses them)
        if sub.array:
            for index, block in enumerate(document[sub.name]):
                paths += numeric_paths(block, sub, f"{prefix}{sub.name}[{index}].")
        else:
            paths += numeric_paths(document[sub.name], sub, f"{prefix}{sub.name}.")
    return paths


def sweep_values(key: str, value: float, integer: bool) -> tuple[float, float]:
    # time shares must keep adding to 100 % within 0.5 %: vary them by 0.1 %-points
    step = 0.1 if key.endswith("time_percent") else max(abs(value) * 0.05, 0.5)
    if integer:
        step = max(1, round(step))
    return value, value + 2 * step


CASES = [(scenario, path) for scenario in SCENARIOS for path in numeric_paths(read_toml(scenario))]


@pytest.mark.parametrize("scenario,key", CASES, ids=[f"{s.stem}:{k}" for s, k in CASES])
def test_sweep_point_equals_separate_check_of_a_written_file(scenario, key, tmp_path):
    document = read_toml(scenario)
    path = parse_key_path(key, document)
    start, stop = sweep_values(key, float(_current(document, path.segments)), path.integer)
    swept = CliRunner().invoke(main, ["sweep", str(scenario), "--vary",
                                      f"{key}={start}:{stop}:3", "--json"])
    outcomes = []
    for index, value in enumerate((start, (start + stop) / 2, stop)):
        variant = copy.deepcopy(document)
        set_key(variant, path.segments, int(value) if path.integer else value)
        written = write_toml(variant, tmp_path / f"point{index}.toml")
        outcomes.append(CliRunner().invoke(main, ["check", str(written), "--json"]))
    if any(outcome.exit_code != 0 for outcome in outcomes):
        # A point the file format refuses (e.g. time shares off 100 %): the sweep refuses too.
        assert swept.exit_code == 2 and swept.output.startswith("error:")
        return
    assert swept.exit_code == 0, swept.output
    points = json.loads(swept.output)["points"]
    for point, outcome in zip(points, outcomes):
        expected = json.loads(outcome.output)
        assert all(name in point for name in COMPARED)
        for name, value in expected.items():  # every per-point key, also those added later
            if name not in FILE_LEVEL_KEYS:
                assert_close(point[name], value, f"{key}: {name}")


def _current(document: dict, segments):
    node = document
    for name, index in segments:
        node = node[name] if index is None else node[name][index]
    return node
