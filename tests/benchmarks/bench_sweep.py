"""Prints how long a 200-point sweep of a 10-case file takes (compute only, plots aside),
against the single-file path (read + validate + evaluate) called 200 times.

A script, not a test: run `python tests/benchmarks/bench_sweep.py`. The 10-case file is
the bundled yard loader (with its lubrication block, so L10m is computed) with its
spectrum stretched to 10 cases.
"""

import copy
import tempfile
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


if __name__ == "__main__":
    main()
