"""Prints how long the commands that can run for seconds take on large inputs: `check` of a
10,000-case file (terminal, --json, --method refined, --report), `setting` and `brief` of the
site dumper, and `spectrum` of a long log. Whole commands (python start-up included), best of
3, stdout and stderr to pipes (so no progress bar is drawn).

A script, not a test: run `python tests/benchmarks/bench_large.py [CASES]`. The 10,000-case
file is the yard loader's wheel end with an invented spectrum (bench_report.classed_spectrum).
"""

import subprocess
import sys
import tempfile
from pathlib import Path

from bench_report import classed_spectrum
from gen_log import synthetic_log, write_log
from timing import best_of

ROOT = Path(__file__).resolve().parents[2]
SITE = ROOT / "load_cases" / "site_dumper.toml"
YARD = ROOT / "load_cases" / "yard_loader.toml"
LOG_ROWS = 2_000_000     # 55 hours at 10 Hz


def command_s(*args) -> float:
    return best_of(3, lambda: subprocess.run([sys.executable, "-m", "hubload", *map(str, args)],
                                             check=True, capture_output=True))


def main():
    cases = int(sys.argv[1]) if len(sys.argv) > 1 else 10_000
    folder = Path(tempfile.mkdtemp())
    big = classed_spectrum(folder / "big.toml", cases)
    report = folder / "big.html"
    runs = {
        f"check ({cases:,} cases)": ("check", big),
        f"check --json ({cases:,} cases)": ("check", "--json", big),
        f"check --method refined ({cases:,} cases)": ("check", "--method", "refined", big),
        f"check --report ({cases:,} cases)": ("check", big, "--report", report, "--force"),
        "setting (site dumper, -60:120:5 um)": ("setting", SITE),
        "brief (site dumper)": ("brief", SITE),
    }
    log = folder / "long.parquet"
    write_log(str(log), synthetic_log(LOG_ROWS))
    runs[f"spectrum ({LOG_ROWS:,}-row log)"] = ("spectrum", log, "--case-file", YARD)
    for name, args in runs.items():
        print(f"  {name:42s} {command_s(*args):7.2f} s")


if __name__ == "__main__":
    main()
