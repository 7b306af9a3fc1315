"""Prints how long spreadsheets take: a 1,000-case spectrum read as [[case]] blocks, a CSV
table and an XLSX table (load_study, in process), and `check --table` written as XLSX and
CSV. A script, not a test: run `python tests/benchmarks/bench_tables.py`."""

import tempfile
from pathlib import Path

import tomli_w

from bench_check import spectrum_document
from hubload.casefile import load_study
from hubload.casefile.casetable import written_cases
from hubload.engine import evaluate
from hubload.report.spreadsheet.cases import cases_sheet
from hubload.report.spreadsheet.check import check_sheets
from hubload.report.spreadsheet.workbook import write_sheets
from timing import best_of

CASES = 1000


def main():
    with tempfile.TemporaryDirectory() as folder:
        folder = Path(folder)
        document = spectrum_document(CASES)
        blocks = folder / "blocks.toml"
        blocks.write_text(tomli_w.dumps(document))
        machine = {key: value for key, value in document.items() if key != "case"}
        files = {"[[case]] blocks": blocks}
        for suffix in (".csv", ".xlsx"):
            write_sheets(str(folder / f"duty{suffix}"), [cases_sheet(written_cases(blocks))],
                         force=True)
            files[f"{suffix} table"] = folder / f"table{suffix}.toml"
            files[f"{suffix} table"].write_text(
                tomli_w.dumps({**machine, "cases": {"table": f"duty{suffix}"}}))
        print(f"reading {CASES:,} cases (file -> study), best of 3:")
        for label, path in files.items():
            seconds = best_of(3, lambda path=path: load_study(path))
            print(f"  {label:18s} {seconds * 1e3:7.0f} ms")
        result = evaluate(load_study(blocks))
        print(f"check --table of {CASES:,} cases (sheets built and written), best of 3:")
        for suffix in (".xlsx", ".csv"):
            seconds = best_of(3, lambda suffix=suffix: write_sheets(
                str(folder / f"out{suffix}"), check_sheets(result), force=True))
            print(f"  {suffix:18s} {seconds * 1e3:7.0f} ms")


if __name__ == "__main__":
    main()
