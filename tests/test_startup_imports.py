"""Start-up stays lean: a plain check imports none of the heavy libraries that only some
outputs need (plots, spreadsheets, logs, the refined kernel, scipy). Not a timing test: the
figures are printed by tests/benchmarks/bench_startup.py."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]
HEAVY = ("matplotlib", "openpyxl", "pyarrow", "numba", "scipy", "hubload.model.refined.kernel")
PROBE = """
import contextlib, io, json, sys
from hubload.cli import main
with contextlib.redirect_stdout(io.StringIO()):
    try:
        main(sys.argv[1:])
    except SystemExit:
        pass
print(json.dumps(sorted(name for name in {heavy} if name in sys.modules)))
"""


@pytest.mark.parametrize("options", [["--json"], []], ids=["json", "tables"])
def test_a_plain_check_imports_no_heavy_library(options):
    probe = PROBE.format(heavy=repr(HEAVY))
    found = subprocess.run([sys.executable, "-c", probe, "check",
                            str(ROOT / "load_cases" / "yard_loader.toml"), *options],
                           capture_output=True, text=True, check=True, cwd=ROOT)
    assert json.loads(found.stdout.strip().splitlines()[-1]) == []
