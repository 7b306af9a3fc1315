"""A grid sweep built as one batched study (domain.grid) gives every point exactly what the
point-by-point path gives (each point a study of its own, stacked): property over pairs of
keys from different tables of the bundled scenarios."""

from __future__ import annotations

import json

import pytest

from hubload.casefile.load import read_document
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


def test_keys_of_one_table_are_built_point_by_point():
    # Cross-key rules of one table hold only point by point (the bearings' order, the time
    # shares): such a grid is not assembled from the axes.
    document = read_document(YARD_LOADER)
    axes = tuple(sweep_module.parse_vary(spec, document, str(YARD_LOADER)) for spec in
                 ("pair.outboard.position_mm=20:40:3", "pair.inboard.position_mm=-60:-40:3"))
    base = sweep_module.study_from_document(document, str(YARD_LOADER))
    assert sweep_module.grid_study(document, axes, base, str(YARD_LOADER)) is None
