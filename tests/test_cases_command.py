"""``hubload cases FILE --to TABLE`` and back through ``[cases] table``: the same study.

The reference is the file's own [[case]] blocks (a row is a block, the format's rule);
the table is read back by hubload's reader, and the results compared as JSON documents.
"""

from __future__ import annotations

import json
import tomllib
from pathlib import Path

import pytest
import tomli_w
from click.testing import CliRunner
from hypothesis import given, strategies as st

from hubload.casefile.casetable import cell_value
from hubload.cli import main
from hubload.report.spreadsheet.workbook import csv_cell

LOAD_CASES = Path(__file__).resolve().parents[1] / "load_cases"
SCENARIOS = ("yard_loader.toml", "site_dumper.toml", "road_sweeper.toml")


def invoke(*arguments: str):
    return CliRunner().invoke(main, list(arguments))


def check_json(path: Path) -> dict:
    result = invoke("check", str(path), "--json")
    assert result.exit_code == 0, result.output
    document = json.loads(result.output)
    document.pop("source")
    return document


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
@pytest.mark.parametrize("scenario", SCENARIOS)
def test_cases_to_a_table_and_back_gives_the_same_results(tmp_path, scenario, suffix):
    original = tmp_path / scenario
    original.write_text((LOAD_CASES / scenario).read_text())
    table = tmp_path / f"duty{suffix}"
    result = invoke("cases", str(original), "--to", str(table))
    assert result.exit_code == 0, result.output
    document = tomllib.loads(original.read_text())
    document.pop("case")
    document["cases"] = {"table": table.name}
    read_back = tmp_path / "read_back.toml"
    read_back.write_text(tomli_w.dumps(document))
    assert check_json(read_back) == check_json(original)
    # and a table's cases written again are the same table
    again = tmp_path / f"again{suffix}"
    assert invoke("cases", str(read_back), "--to", str(again)).exit_code == 0
    if suffix == ".csv":
        assert again.read_text().splitlines()[1:] == table.read_text().splitlines()[1:]


@given(st.floats(allow_nan=False, allow_infinity=False))
def test_a_number_written_to_csv_reads_back_exactly(value):
    # Python's float repr is the shortest text that reads back to the same double
    # (Python docs, "Floating Point Arithmetic: Issues and Limitations")
    assert cell_value(csv_cell(value), "number", decimal_comma=False) == value


def test_cases_never_overwrite_without_force(tmp_path):
    table = tmp_path / "duty.csv"
    table.write_text("mine\n")
    result = invoke("cases", str(LOAD_CASES / "yard_loader.toml"), "--to", str(table))
    assert result.exit_code == 2 and "exists already" in result.output
    assert table.read_text() == "mine\n"
    result = invoke("cases", str(LOAD_CASES / "yard_loader.toml"), "--to", str(table),
                    "--force")
    assert result.exit_code == 0 and table.read_text().startswith("# Load cases")


def test_cases_refuse_their_own_table(tmp_path):
    original = tmp_path / "yard.toml"
    original.write_text((LOAD_CASES / "yard_loader.toml").read_text())
    assert invoke("cases", str(original), "--to", str(tmp_path / "duty.csv")).exit_code == 0
    document = tomllib.loads(original.read_text())
    document.pop("case")
    document["cases"] = {"table": "duty.csv"}
    original.write_text(tomli_w.dumps(document))
    result = invoke("cases", str(original), "--to", str(tmp_path / "duty.csv"), "--force")
    assert result.exit_code == 2 and "is an input of this run" in result.output


def test_cases_refuse_other_suffixes(tmp_path):
    result = invoke("cases", str(LOAD_CASES / "yard_loader.toml"), "--to",
                    str(tmp_path / "duty.ods"))
    assert result.exit_code == 2 and "expected a file name ending in .xlsx or .csv" \
        in result.output
