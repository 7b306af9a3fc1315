"""Prints how fast a big log turns into direct damage and a classed spectrum.

    python tests/benchmarks/bench_logs.py [--rows 10000000] [--format parquet|csv|both]

Writes a synthetic log (gen_log.py) to /tmp, then, each in its own process so
that peak memory is its own, best of two runs: the chosen reader alone (the floor), the full
pass (read, clean, per-sample operating points, direct Miner damage through the
engine's per-sample path, dwell classing) with a breakdown of where the time goes.
Prints the full pass's ratio to the reader alone against its goal (2 for CSV, 3 for
Parquet) and its peak memory against 1 GB. A script, not a
test: nothing is asserted and nothing large is committed.
"""

from __future__ import annotations

import argparse
import json
import resource
import subprocess
import sys
import time
from pathlib import Path

HERE = Path(__file__).resolve().parent
ROOT = HERE.parents[1]
CASE_FILE = ROOT / "load_cases" / "yard_loader.toml"


def peak_rss_mb() -> float:
    """This process's peak resident memory [MB] (VmHWM: unlike ru_maxrss, it does not
    carry over the parent's peak across fork and exec)."""
    for line in Path("/proc/self/status").read_text().splitlines():
        if line.startswith("VmHWM:"):
            return int(line.split()[1]) / 1024.0
    return resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024.0


def reader_only(path: Path) -> dict:
    from hubload.logs.columns import plan_columns
    from hubload.logs.reader import headers, read_chunks

    start = time.perf_counter()
    plan = plan_columns(headers(path), {}, str(path))
    rows = sum(len(chunk) for chunk in read_chunks(path, plan.headers))
    return {"rows": rows, "seconds": time.perf_counter() - start}


def timed(spent: dict, stage: str, function):
    """``function`` that adds its run time to ``spent[stage]``."""
    def wrapper(*args, **kwargs):
        start = time.perf_counter()
        try:
            return function(*args, **kwargs)
        finally:
            spent[stage] += time.perf_counter() - start
    return wrapper


def full_pass(path: Path) -> dict:
    """The real process_log, its stages timed by wrapping the functions it calls
    (the shaft check and L10m of the demo file included)."""
    from hubload.casefile.machine import load_machine
    from hubload.logs import pipeline
    from hubload.logs.spectrum import spectrum_result

    study, _ = load_machine(CASE_FILE)
    stages = {"operating points": ("operating_points", "sample_cases"),
              "direct damage (engine)": ("sample_lives", "case_lives"),
              "classing": ("class_inputs",)}
    spent = dict.fromkeys(["read and clean", *stages], 0.0)
    originals = {name: getattr(pipeline, name) for names in stages.values() for name in names}
    originals["add_samples"] = pipeline.dwell.add_samples
    for stage, names in stages.items():
        for name in names:
            setattr(pipeline, name, timed(spent, stage, originals[name]))
    pipeline.dwell.add_samples = timed(spent, "classing", originals["add_samples"])
    try:
        start = time.perf_counter()
        summary = pipeline.process_log(path, study, pipeline.LogOptions())
        total = time.perf_counter() - start
    finally:
        for name, function in originals.items():
            setattr(pipeline.dwell if name == "add_samples" else pipeline, name, function)
    spent["read and clean"] = total - sum(spent.values())
    start = time.perf_counter()
    result = spectrum_result(summary, study)
    spent["lives and classed spectrum"] = time.perf_counter() - start
    return {"rows": summary.cleaning.rows, "seconds": total, "spent": spent,
            "cases": len(result.classed.study.cases), "classing_error": result.classing_error,
            "direct_system_l10_h": result.system_life_h}


def child(phase: str, path: str) -> None:
    """Best of two runs (the first also warms the page cache and pyarrow's thread pool)."""
    run = reader_only if phase == "reader" else full_pass
    found = min((run(Path(path)) for _ in range(2)), key=lambda found: found["seconds"])
    found["peak_rss_mb"] = peak_rss_mb()
    print(json.dumps(found))


def measure(phase: str, path: Path) -> dict:
    output = subprocess.run([sys.executable, __file__, "--child", phase, str(path)],
                            check=True, capture_output=True, text=True).stdout
    return json.loads(output.strip().splitlines()[-1])


GOALS = {".csv": 2.0, ".parquet": 3.0}   # full pass / reader alone (issue 17)


def report(path: Path) -> None:
    size_mb = path.stat().st_size / 1e6
    floor = measure("reader", path)
    full = measure("full", path)
    rows = full["rows"]
    ratio, goal = full["seconds"] / floor["seconds"], GOALS[path.suffix]
    print(f"\n{path.name}: {rows:,} rows, {size_mb:,.0f} MB")
    print(f"  reader alone (floor)     {floor['seconds']:7.2f} s  {rows / floor['seconds']:>12,.0f}"
          f" rows/s  peak RSS {floor['peak_rss_mb']:,.0f} MB")
    print(f"  full pass                {full['seconds']:7.2f} s  {rows / full['seconds']:>12,.0f}"
          f" rows/s  peak RSS {full['peak_rss_mb']:,.0f} MB")
    print(f"  ratio to the reader alone {ratio:.2f} (goal {goal:g}: "
          f"{'met' if ratio <= goal else 'not met'}); peak RSS goal 1000 MB: "
          f"{'met' if full['peak_rss_mb'] < 1000 else 'not met'}")
    for stage, seconds in full["spent"].items():
        rate = f"{rows / seconds:>12,.0f} rows/s" if seconds > 0 else ""
        print(f"    {stage:<26} {seconds:7.2f} s  {rate}")
    print("    (read and clean: the rest of the pass, damage sums and extremes included)")
    print(f"  classed spectrum: {full['cases']} cases, classing error "
          f"{100 * full['classing_error']:+.2f} %, direct system L10 "
          f"{full['direct_system_l10_h']:,.0f} h")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--rows", type=int, default=10_000_000)
    parser.add_argument("--format", choices=("parquet", "csv", "both"), default="both")
    parser.add_argument("--folder", default="/tmp/hubload-bench-logs")
    parser.add_argument("--child", nargs=2, metavar=("PHASE", "PATH"), help=argparse.SUPPRESS)
    args = parser.parse_args()
    if args.child:
        child(*args.child)
        return
    sys.path.insert(0, str(HERE))
    import gen_log

    folder = Path(args.folder)
    folder.mkdir(parents=True, exist_ok=True)
    formats = ("parquet", "csv") if args.format == "both" else (args.format,)
    paths = [folder / f"log_{args.rows}.{suffix}" for suffix in formats]
    missing = [p for p in paths if not p.exists()]
    if missing:
        columns = gen_log.synthetic_log(args.rows)
        for path in missing:
            gen_log.write_log(str(path), columns)
        del columns
    for path in paths:
        report(path)


if __name__ == "__main__":
    main()
