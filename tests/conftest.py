"""Shared test helpers: a minimal valid load-case document and a writer for it."""

import copy
import os

import pytest
import tomli_w
from hypothesis import settings

# CI must give the same verdict for the same code, on a loaded machine too: there the
# examples are derived from each test rather than drawn at random, and no deadline applies.
# Local runs keep exploring new examples.
settings.register_profile("ci", derandomize=True, deadline=None)
if os.environ.get("CI"):
    settings.load_profile("ci")

BASE_DOCUMENT = {
    "project": {"title": "test wheel", "target_life_h": 5000},
    "wheel": {"offset_mm": 100, "loaded_radius_mm": 400},
    "pair": {
        "arrangement": "back-to-back",
        "outboard": {"position_mm": 30, "C_kN": 120, "C0_kN": 160, "e": 0.4, "Y": 1.5, "Y0": 0.8},
        "inboard": {"position_mm": -50, "C_kN": 100, "C0_kN": 130, "e": 0.4, "Y": 1.5, "Y0": 0.8},
    },
    "case": [
        {"name": "travel", "time_percent": 70, "wheel_load_kN": 20, "side_force_kN": 4,
         "tractive_force_kN": 6, "speed_rpm": 50},
        {"name": "turn", "time_percent": 30, "wheel_load_kN": 15, "side_force_kN": -3,
         "tractive_force_kN": 2, "speed_kmh": 5},
    ],
}


@pytest.fixture
def document():
    """A fresh copy of a valid two-case document (plain dict, editable per test)."""
    return copy.deepcopy(BASE_DOCUMENT)


@pytest.fixture
def write_case_file(tmp_path):
    """Write a document (dict) or raw TOML text to a file and return its path."""
    def write(content, name="case.toml"):
        path = tmp_path / name
        path.write_text(content if isinstance(content, str) else tomli_w.dumps(content))
        return str(path)
    return write
