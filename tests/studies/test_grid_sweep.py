"""A grid sweep built as one batched study (domain.grid) gives every point exactly what the
point-by-point path gives (each point a study of its own, stacked): property over pairs of
keys from different tables of the bundled scenarios."""

from __future__ import annotations

import json

import pytest

from hubload.report.json.sweep import sweep_document
from hubload.studies import sweep as sweep_module
from studies_helpers import LOAD_CASES, YARD_LOADER

PAIRS = [
    (YARD_LOADER, "wheel.offset_mm=40:200:4", "pair.outboard.C_kN=60:200:3"),
    (YARD_LOADER, "lubrication.temperature_C=40:90:3", "shaft.section[0].diameter_mm=55:75:3"),
    (YARD_LOADER, "wheel.loaded_radius_mm=340:420:3", "case[3].side_force_kN=0:8:3"),
    (LOAD_CASES / "site_dumper.toml", "motor.displacement_cc=600:900:3",
     "pair.inboard.C_kN=60:90:3"),
    (LOAD_CASES / "road_sweeper.toml", "project.target_life_h=4000:9000:3",
     "pair.setting.assembly_um=20:90:3"),
]


@pytest.mark.parametrize("file, first, second", PAIRS, ids=lambda v: str(v)[:24])
def test_batched_grid_equals_the_point_by_point_grid(monkeypatch, file, first, second):
    fast = sweep_document(sweep_module.run_sweep(str(file), [first, second]))
    monkeypatch.setattr(sweep_module, "grid_study", lambda *args: None)
    slow = sweep_document(sweep_module.run_sweep(str(file), [first, second]))
    assert json.dumps(fast, sort_keys=True) == json.dumps(slow, sort_keys=True)


SAME_TABLE = [
    (YARD_LOADER, "wheel.offset_mm=40:200:4", "wheel.loaded_radius_mm=300:500:3"),
    (YARD_LOADER, "pair.outboard.position_mm=20:40:3", "pair.inboard.position_mm=-60:-40:3"),
    (YARD_LOADER, "shaft.section[0].diameter_mm=55:75:3", "shaft.section[1].position_mm=0:20:3"),
]


@pytest.mark.parametrize("file, first, second", SAME_TABLE, ids=lambda v: str(v)[:24])
def test_keys_of_one_table_give_what_the_point_by_point_grid_gives(monkeypatch, file, first,
                                                                   second):
    test_batched_grid_equals_the_point_by_point_grid(monkeypatch, file, first, second)


def test_a_corner_that_breaks_a_cross_key_rule_is_refused_naming_the_point():
    # The bearings must stay in order along the shaft. Each axis alone keeps them in order
    # (the file's outboard bearing is at 28 mm, its inboard one at -52 mm); the corner of
    # the outboard bearing at 20 mm and the inboard one at 25 mm does not.
    from hubload.errors import InputError

    with pytest.raises(InputError) as refused:
        sweep_module.run_sweep(str(YARD_LOADER), ["pair.outboard.position_mm=20:40:3",
                                                  "pair.inboard.position_mm=-60:25:3"])
    assert "at pair.outboard.position_mm = 20, pair.inboard.position_mm = 25" in \
        str(refused.value)
