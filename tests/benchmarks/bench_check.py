"""Prints how long `hubload check` takes: whole command per bundled scenario, and the engine
on spectra of 1 to 10,000 cases. A script, not a test: run `python tests/benchmarks/bench_check.py`."""

import subprocess
import sys
from pathlib import Path

import numpy as np

from hubload.casefile import study_from_document
from hubload.engine import evaluate
from timing import best_of

ROOT = Path(__file__).resolve().parents[2]


def spectrum_document(case_count):
    rng = np.random.default_rng(1)
    wheel_kn = rng.uniform(5, 30, case_count)
    # forces within adhesion (mu 0.6), as in a real spectrum: few cases carry a slip flag
    cases = [{"name": f"case {i}", "time_percent": 100 / case_count,
              "wheel_load_kN": float(wheel), "side_force_kN": float(rng.uniform(-0.3, 0.3) * wheel),
              "tractive_force_kN": float(rng.uniform(-0.5, 0.5) * wheel),
              "speed_rpm": float(rng.uniform(0, 120))}
             for i, wheel in enumerate(wheel_kn)]
    return {"wheel": {"offset_mm": 100, "loaded_radius_mm": 400},
            "pair": {"arrangement": "back-to-back",
                     "outboard": {"position_mm": 30, "C_kN": 120, "C0_kN": 160, "contact_angle_deg": 15},
                     "inboard": {"position_mm": -50, "C_kN": 100, "C0_kN": 130, "contact_angle_deg": 15}},
            "case": cases}


def main():
    print("whole command (python start-up included), best of 3:")
    for scenario in sorted((ROOT / "load_cases").glob("*.toml")):
        seconds = best_of(3, lambda: subprocess.run(
            [sys.executable, "-m", "hubload", "check", str(scenario)], check=True,
            capture_output=True))
        print(f"  {scenario.name:28s} {seconds * 1e3:7.0f} ms")
    print("engine only (validated document -> study -> results), best of 5:")
    for count in (1, 10, 100, 1000, 10000):
        document = spectrum_document(count)
        study = study_from_document(document)
        engine_s = best_of(5, lambda: evaluate(study))
        parse_s = best_of(5, lambda: study_from_document(document))
        print(f"  {count:6d} cases: evaluate {engine_s * 1e3:8.2f} ms, "
              f"validate+convert {parse_s * 1e3:8.2f} ms")


if __name__ == "__main__":
    main()
