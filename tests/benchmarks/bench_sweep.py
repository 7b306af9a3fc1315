"""Prints how long a 200-point sweep of a 10-case file takes (compute only, plots aside),
against the single-file path (read + validate + evaluate) called 200 times; then, as whole
commands, the 200-point sweep against one `check` (paired runs, goal 1.5x) and a 200 x 200
grid's time and peak memory (goals 3 s and 500 MB).

A script, not a test: run `python tests/benchmarks/bench_sweep.py`. The 10-case file is
the bundled yard loader (with its lubrication block, so L10m is computed) with its
spectrum stretched to 10 cases.
"""

import copy
import statistics
import subprocess
import sys
import tempfile
import time
import tomllib
from pathlib import Path

import numpy as np
import tomli_w

from hubload.casefile import load_study
from hubload.casefile.variation import parse_key_path, variant_studies
from hubload.engine import evaluate, evaluate_many
from hubload.report.json.check import result_document
from hubload.report.json.sweep import sweep_document
from hubload.studies.sweep import run_sweep
from timing import best_of

ROOT = Path(__file__).resolve().parents[2]
POINTS = 200
OFFSETS_MM = np.linspace(40.0, 200.0, POINTS)


def ten_case_document() -> dict:
    document = tomllib.loads((ROOT / "load_cases" / "yard_loader.toml").read_text())
    cases = document["case"]
    while len(cases) < 10:
        extra = copy.deepcopy(cases[len(cases) % 3])
        extra["name"] += f" (variant {len(cases)})"
        cases.append(extra)
    for case in cases:
        case["time_percent"] = 10.0
    return document


def main():
    folder = Path(tempfile.mkdtemp())
    document = ten_case_document()
    file = folder / "ten_cases.toml"
    file.write_text(tomli_w.dumps(document))
    variants = []
    for index, offset in enumerate(OFFSETS_MM):
        variant = copy.deepcopy(document)
        variant["wheel"]["offset_mm"] = float(offset)
        variants.append(folder / f"point_{index:03d}.toml")
        variants[-1].write_text(tomli_w.dumps(variant))
    spec = [f"wheel.offset_mm={OFFSETS_MM[0]}:{OFFSETS_MM[-1]}:{POINTS}"]

    raw = tomllib.loads(file.read_text())
    key = parse_key_path("wheel.offset_mm", raw)
    points = [{key: float(v)} for v in OFFSETS_MM]
    batched_s = best_of(5, lambda: evaluate_many(variant_studies(raw, points, str(file))))
    sweep_s = best_of(5, lambda: sweep_document(run_sweep(str(file), spec)))
    single_s = best_of(3, lambda: [evaluate(load_study(v)) for v in variants])
    single_json_s = best_of(3, lambda: [result_document(evaluate(load_study(v)))
                                        for v in variants])
    points = sweep_document(run_sweep(str(file), spec))["points"]
    check = result_document(evaluate(load_study(variants[-1])))
    assert points[-1]["system"] == check["system"]

    cases = len(document["case"])
    print(f"{POINTS}-point sweep of a {cases}-case file (best of 3-5 runs):")
    print(f"  compute: variants + one batched engine call  {batched_s * 1e3:8.1f} ms  "
          f"vs single-file path x{POINTS} (load + evaluate) {single_s * 1e3:8.1f} ms "
          f"-> {single_s / batched_s:.1f}x")
    print(f"  whole sweep incl. check's JSON per point     {sweep_s * 1e3:8.1f} ms  "
          f"vs single-file path + JSON x{POINTS}          {single_json_s * 1e3:8.1f} ms "
          f"-> {single_json_s / sweep_s:.1f}x")
    print(f"  target (< 1000 ms for the whole sweep): {'met' if sweep_s < 1.0 else 'NOT met'}")
    whole_commands(file)


def wall_s(command) -> float:
    start = time.perf_counter()
    subprocess.run(command, check=True, stdout=subprocess.DEVNULL)
    return time.perf_counter() - start


GRID_CHILD = """
import contextlib, io, sys, time
from pathlib import Path
from hubload.cli import main
start = time.perf_counter()
with contextlib.redirect_stdout(io.StringIO()):
    try:
        main(sys.argv[1:])
    except SystemExit:
        pass
elapsed = time.perf_counter() - start
peak = next(int(line.split()[1]) for line in Path("/proc/self/status").read_text().splitlines()
            if line.startswith("VmHWM:")) / 1024
print(f"{elapsed:.2f} {peak:.0f}")
"""


def whole_commands(file: Path, runs: int = 7) -> None:
    """The sweep command against one check of the same file, A B A B ..., and a big grid."""
    hubload = [sys.executable, "-m", "hubload"]
    sweep = hubload + ["sweep", str(file), "--vary",
                       f"wheel.offset_mm={OFFSETS_MM[0]}:{OFFSETS_MM[-1]}:{POINTS}", "--json"]
    check = hubload + ["check", str(file), "--json"]
    pairs = [(wall_s(sweep), wall_s(check)) for _ in range(runs)]
    ratio = statistics.median(a / b for a, b in pairs)
    print(f"whole commands, median of {runs} paired runs:")
    print(f"  sweep of {POINTS} points --json / check --json   {ratio:4.2f}x (goal 1.5x)  "
          f"{statistics.median(a for a, _ in pairs) * 1e3:5.0f} ms vs "
          f"{statistics.median(b for _, b in pairs) * 1e3:4.0f} ms")
    grid = ["sweep", str(file), "--vary", "wheel.offset_mm=40:200:200",
            "--vary", "wheel.loaded_radius_mm=300:500:200", "--json"]
    seconds, peak_mb = subprocess.run([sys.executable, "-c", GRID_CHILD, *grid], check=True,
                                      capture_output=True, text=True).stdout.split()
    print(f"  200 x 200 grid --json (in-process)          {float(seconds):5.2f} s (goal 3 s), "
          f"peak {float(peak_mb):4.0f} MB (goal 500 MB)")


if __name__ == "__main__":
    main()
