"""Helpers of the machine tests: a machine document around the bundled wheel end, written
to a folder and run through the command line."""

import json
import shutil
from pathlib import Path

import tomli_w

from clisupport import run

ROOT = Path(__file__).parent.parent
MACHINES = ROOT / "load_cases" / "machines"
WHEEL_END = MACHINES / "yard_loader_wheel_end.toml"
G = 9.80665  # standard gravity, 3rd CGPM 1901


def machine_document(operations, **machine):
    document = {
        "project": {"title": "test machine", "target_life_h": 5000},
        "machine": {"mass_kg": 4000.0, "cog_from_front_axle_mm": 1100.0, "cog_height_mm": 900.0,
                    "wheelbase_mm": 2400.0, "rolling_resistance": 0.0},
        "payload": {"cog_from_front_axle_mm": -800.0, "cog_height_mm": 1000.0},
        "axle": [{"name": "front axle", "position": "front", "track_mm": 1500.0, "driven": True,
                  "wheel_end": "wheel_end.toml"},
                 {"name": "rear axle", "position": "rear", "track_mm": 1500.0, "driven": True,
                  "wheel_end": "wheel_end.toml"}],
        "operation": operations,
    }
    for key, value in machine.items():
        table, name = key.split("__")
        if table == "axle":
            document["axle"][int(name[-1])][name[:-1]] = value
        else:
            document[table][name] = value
    return document


def write_machine(folder: Path, document) -> Path:
    shutil.copy(WHEEL_END, folder / "wheel_end.toml")
    path = folder / "machine.toml"
    path.write_text(tomli_w.dumps(document))
    return path


def machine_json(folder: Path, document) -> dict:
    result = run("machine", write_machine(folder, document), "--json")
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


def wheel(document: dict, name: str) -> dict:
    return next(w for w in document["wheel_ends"] if w["name"] == name)


def operation(name="op", time_percent=100.0, speed_kmh=6.0, **keys):
    return {"name": name, "time_percent": time_percent, "speed_kmh": speed_kmh, **keys}
