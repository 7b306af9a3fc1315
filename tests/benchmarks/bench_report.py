"""Prints how the outputs hold at real spectrum sizes: a 1,000-case classed spectrum (the size
a measured log classes into) through `check` (terminal lines), `check --report` (time and
size of the HTML page) and `compare --plot` of three such files (pixels), against the goals
(under 150 lines; under 2 MB in under 3 s; no side beyond 3,000 px) and against the same
outputs of the 7-case yard loader measured in the same run.

A script, not a test: run `python tests/benchmarks/bench_report.py`.
"""

import struct
import subprocess
import sys
import tempfile
import time
import tomllib
from pathlib import Path

import numpy as np
import tomli_w

ROOT = Path(__file__).resolve().parents[2]
YARD = ROOT / "load_cases" / "yard_loader.toml"


def classed_spectrum(path: Path, cases: int = 1000) -> Path:
    """The yard loader's wheel end with an invented classed spectrum of ``cases`` cases."""
    document = tomllib.loads(YARD.read_text())
    rng = np.random.default_rng(4)
    shares = rng.dirichlet(np.ones(cases)) * 100
    document["case"] = [{
        "name": f"W {w:.1f} kN, S {s:.1f} kN, T {t:.1f} kN, class {i}", "time_percent": float(p),
        "wheel_load_kN": float(w), "side_force_kN": float(s), "tractive_force_kN": float(t),
        "speed_kmh": float(v)} for i, (w, s, t, v, p) in enumerate(zip(
            rng.uniform(5, 25, cases), rng.uniform(-6, 6, cases), rng.uniform(-8, 10, cases),
            rng.uniform(0, 15, cases), shares))]
    path.write_text(tomli_w.dumps(document))
    return path


def run(*args) -> tuple[float, str]:
    start = time.perf_counter()
    found = subprocess.run([sys.executable, "-m", "hubload", *map(str, args)],
                           capture_output=True, text=True, env={"COLUMNS": "80", "PATH": ""})
    return time.perf_counter() - start, found.stdout


def png_size(path: Path) -> tuple[int, int]:
    with path.open("rb") as file:
        file.read(16)
        return struct.unpack(">II", file.read(8))


def main():
    folder = Path(tempfile.mkdtemp())
    big = classed_spectrum(folder / "classed.toml")
    for name, file in (("7-case yard loader", YARD), ("1,000-case spectrum", big)):
        _, text = run("check", file)
        report = folder / f"{file.stem}.html"
        seconds = min(run("check", file, "--report", report, "--force")[0] for _ in range(3))
        size_mb = report.stat().st_size / 1e6
        print(f"{name:22s} check: {len(text.splitlines()):4d} lines;  --report: "
              f"{seconds:5.2f} s, {size_mb:5.2f} MB (whole command, best of 3)")
    plot = folder / "compare.png"
    run("compare", big, big, big, "--plot", plot, "--force")
    width, height = png_size(plot)
    print(f"compare --plot of three 1,000-case files: {width} x {height} px")
    print("goals: under 150 lines, under 2 MB in under 3 s, no side above 3,000 px")


if __name__ == "__main__":
    main()
