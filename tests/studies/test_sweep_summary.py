"""A large sweep's summary points give the same answer as the full per-point documents
(one answer across outputs), and say which kind they are."""

from __future__ import annotations

from pathlib import Path

import pytest

from hubload import api
from hubload.report.json import sweep as sweep_json

ROOT = Path(__file__).resolve().parents[2]
SCENARIOS = sorted((ROOT / "load_cases").glob("*.toml"))
GRID = ("wheel.offset_mm=40:160:4", "pair.outboard.C_kN=90:150:3")


@pytest.mark.parametrize("scenario", SCENARIOS, ids=lambda path: path.stem)
@pytest.mark.parametrize("method", ["iso281", "refined"])
def test_summary_points_equal_the_full_points(scenario, method, monkeypatch):
    found = api.sweep(scenario, GRID, method=method)
    full = found.to_dict()
    monkeypatch.setattr(sweep_json, "SUMMARY_ABOVE_POINTS", 0)
    summary = found.to_dict()
    assert (full["points_detail"], summary["points_detail"]) == ("full", "summary")
    for whole, short in zip(full["points"], summary["points"], strict=True):
        assert short["values"] == whole["values"]
        for key in ("symbol", "life_h", "life_km", "method", "basis", "reliability_percent"):
            assert short["governing_life"][key] == pytest.approx(whole["governing_life"][key])
        for label, bearing in short["bearings"].items():
            for key, value in bearing.items():
                assert value == pytest.approx(whole["bearings"][label][key]), (label, key)
        for key, value in short["system"].items():
            assert value == pytest.approx(whole["system"][key]), key
        if whole["verdict"] is not None:
            assert short["verdict"]["passed"] == whole["verdict"]["passed"]
            assert short["verdict"]["life_h"] == pytest.approx(whole["verdict"]["life_h"])
        shaft = whole.get("shaft")
        if shaft and shaft.get("sections"):
            lowest = min(section["min_safety"] for section in shaft["sections"])
            assert short["lowest_shaft_safety"] == pytest.approx(lowest)
