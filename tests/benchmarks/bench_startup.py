"""Prints the start-up of `hubload check` as a ratio to `python -c "import numpy"`, measured side
by side (A B A B ...) in the same run, so a shared machine's drift cancels out.

Two conditions: without bytecode caching (PYTHONDONTWRITEBYTECODE=1 and no cached files: every
hubload module is compiled from source on each run, as in an editable install where writing is
not allowed; installed libraries keep their own cached files) and with caching
(PYTHONPYCACHEPREFIX in a temporary folder, warmed once). Goals:
`check --json` within 1.5x, the terminal tables within 1.8x. It also prints the libraries every
command loads (numpy, click and the standard modules the file reader and JSON need) alone,
the part of the ratio that hubload's own modules cannot lower. A script, not a test:
`python tests/benchmarks/bench_startup.py [RUNS]`.
"""

import os
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
SCENARIO = str(ROOT / "load_cases" / "yard_loader.toml")
FLOOR = [sys.executable, "-c", "import numpy"]
# The libraries every command loads before any of hubload's own code runs: what the goals
# leave for the package's modules is the goal minus this ratio.
LIBRARIES = [sys.executable, "-c", "import numpy, click, tomllib, json, dataclasses, pathlib"]
COMMANDS = {"check --json": [sys.executable, "-m", "hubload", "check", SCENARIO, "--json"],
            "check (tables)": [sys.executable, "-m", "hubload", "check", SCENARIO],
            "libraries alone": LIBRARIES}
GOALS = {"check --json": 1.5, "check (tables)": 1.8, "libraries alone": None}


def wall_s(command, environment):
    start = time.perf_counter()
    subprocess.run(command, env=environment, check=True, stdout=subprocess.DEVNULL,
                   stderr=subprocess.DEVNULL)
    return time.perf_counter() - start


def paired_ratio(command, environment, runs):
    """Median of the ratios of alternating runs, and the median times [s]."""
    wall_s(command, environment)
    wall_s(FLOOR, environment)
    pairs = [(wall_s(command, environment), wall_s(FLOOR, environment)) for _ in range(runs)]
    ratio = statistics.median(a / b for a, b in pairs)
    return ratio, statistics.median(a for a, _ in pairs), statistics.median(b for _, b in pairs)


def environments(cache_folder):
    base = {key: value for key, value in os.environ.items()
            if key not in ("PYTHONDONTWRITEBYTECODE", "PYTHONPYCACHEPREFIX")}
    base["COLUMNS"] = "80"
    return {"no bytecode cache": {**base, "PYTHONDONTWRITEBYTECODE": "1"},
            "bytecode cached": {**base, "PYTHONPYCACHEPREFIX": cache_folder + "/cache"}}


def without_cached_sources():
    """Remove the package's cached bytecode, so the first condition compiles every module."""
    for folder in (ROOT / "src").rglob("__pycache__"):
        for cached in folder.glob("*.pyc"):
            cached.unlink()


def main():
    runs = int(sys.argv[1]) if len(sys.argv) > 1 else 15
    print(f"start-up against `python -c \"import numpy\"`, median of {runs} paired runs")
    with tempfile.TemporaryDirectory() as folder:
        for condition, environment in environments(folder).items():
            print(f"  {condition}:")
            without_cached_sources()
            for name, command in COMMANDS.items():
                ratio, seconds, floor_s = paired_ratio(command, environment, runs)
                goal = "" if GOALS[name] is None else f"(goal {GOALS[name]}x)"
                print(f"    {name:16s} {ratio:4.2f}x {goal:12s}  "
                      f"{seconds * 1e3:5.0f} ms vs {floor_s * 1e3:4.0f} ms")


if __name__ == "__main__":
    main()
