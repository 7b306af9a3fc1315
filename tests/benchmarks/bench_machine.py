"""Prints how long `hubload machine` takes: the whole command on the bundled machine (python
start-up included), the machine file -> wheel-end studies conversion, the evaluation of the
wheel ends, and a sweep of a machine key per point. A script, not a test:
run `python tests/benchmarks/bench_machine.py`."""

import subprocess
import sys
from pathlib import Path

from hubload.casefile.machinefile import load_machine_study
from hubload.engine.machine import evaluate_machine
from hubload.studies.machine_sweep import run_machine_sweep
from timing import best_of

ROOT = Path(__file__).resolve().parents[2]
MACHINE = ROOT / "load_cases" / "machines" / "yard_loader_machine.toml"


def main():
    for args in ((), ("--json",), ("--cases",)):
        seconds = best_of(3, lambda: subprocess.run(
            [sys.executable, "-m", "hubload", "machine", str(MACHINE), *args], check=True,
            capture_output=True))
        print(f"whole command {' '.join(args) or '(table)':10s} best of 3: {seconds * 1e3:6.0f} ms")
    study = load_machine_study(MACHINE)
    print(f"machine file -> {len(study.wheel_ends)} wheel-end studies, best of 10: "
          f"{best_of(10, lambda: load_machine_study(MACHINE)) * 1e3:6.1f} ms")
    print(f"evaluate the wheel ends and the machine, best of 10: "
          f"{best_of(10, lambda: evaluate_machine(study)) * 1e3:6.1f} ms")
    points = 50
    seconds = best_of(3, lambda: run_machine_sweep(
        str(MACHINE), [f"machine.cog_height_mm=600:1400:{points}"]))
    print(f"sweep of machine.cog_height_mm, {points} points: {seconds * 1e3:6.0f} ms "
          f"({seconds / points * 1e3:.1f} ms per point)")


if __name__ == "__main__":
    main()
