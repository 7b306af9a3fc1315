"""Results into spreadsheets (--table): the sheets, their headers and cautions, numbers as
numbers, and no file overwritten without --force.

The sheets are read back with openpyxl and the csv module; the values are compared with the
load-case file itself (its time shares) and with the --json document, which is written by
another path (report/json) from the same typed results.
"""

from __future__ import annotations

import csv
import json
from pathlib import Path

import pytest
from click.testing import CliRunner

from hubload.cli import main
from hubload.report.cautions import CAUTIONS

LOAD_CASES = Path(__file__).resolve().parents[1] / "load_cases"
YARD_LOADER = str(LOAD_CASES / "yard_loader.toml")
CHECK_SHEETS = ["cases", "bearings", "shaft", "shaft_cases", "checks"]


def invoke(*arguments: str):
    return CliRunner().invoke(main, list(arguments))


def sheet_rows(path: Path, name: str) -> tuple[list[str], list, list[tuple]]:
    """(note rows, header, data rows) of one sheet of a workbook."""
    from openpyxl import load_workbook

    workbook = load_workbook(path, read_only=True)
    rows = [row for row in workbook[name].iter_rows(values_only=True)]
    workbook.close()
    notes = [row[0] for row in rows if isinstance(row[0], str) and row[0].startswith("# ")]
    header = rows[len(notes)] if len(rows) > len(notes) else ()
    return notes, list(header), rows[len(notes) + 1:]


def column(header: list, rows: list[tuple], heading: str) -> list:
    return [row[header.index(heading)] for row in rows]


def test_check_table_has_a_sheet_each_with_cautions_and_units(tmp_path):
    out = tmp_path / "out.xlsx"
    result = invoke("check", YARD_LOADER, "--table", str(out))
    assert result.exit_code == 0, result.output
    from openpyxl import load_workbook

    assert load_workbook(out, read_only=True).sheetnames == CHECK_SHEETS
    for name in CHECK_SHEETS:
        notes, _, _ = sheet_rows(out, name)
        assert f"# Caution: {CAUTIONS}" in notes, name
    notes, header, rows = sheet_rows(out, "cases")
    for heading in ("case", "time [%]", "n [r/min]", "Fr out [kN]", "Fa in [kN]",
                    "L10 out [h]", "L10m in [h]", "damage [%]"):
        assert heading in header, heading
    # the file's own time shares (yard_loader.toml: 35, 25, 10, 12, 12, 3, 3 %)
    assert column(header, rows, "time [%]") == pytest.approx([35, 25, 10, 12, 12, 3, 3])
    assert all(isinstance(value, float) for value in column(header, rows, "Fr out [kN]"))
    assert sum(column(header, rows, "damage [%]")) == pytest.approx(100)


def test_check_table_agrees_with_the_json_document(tmp_path):
    out = tmp_path / "out.xlsx"
    assert invoke("check", YARD_LOADER, "--table", str(out)).exit_code == 0
    document = json.loads(invoke("check", YARD_LOADER, "--json").output)
    _, header, rows = sheet_rows(out, "bearings")
    pair = rows[column(header, rows, "bearing").index("pair (system)")]
    assert pair[header.index("L10 [h]")] == pytest.approx(document["system"]["l10_h"])
    assert pair[header.index("L10m [h]")] == pytest.approx(document["system"]["l10m_h"])
    assert pair[header.index("s0")] is None       # the pair has no static safety of its own


def test_infinite_lives_are_written_as_inf(tmp_path):
    # yard_loader.toml: both shaft sections stay below the endurance limit in every case
    out = tmp_path / "out.xlsx"
    assert invoke("check", YARD_LOADER, "--table", str(out)).exit_code == 0
    _, header, rows = sheet_rows(out, "shaft")
    assert column(header, rows, "life [h]") == ["inf", "inf"]
    _, header, rows = sheet_rows(out, "checks")
    assert "FAIL" in column(header, rows, "result")
    assert all(isinstance(value, (int, float)) for value in column(header, rows, "limit"))


def test_a_file_without_shaft_says_so_on_its_shaft_sheets(tmp_path, document, write_case_file):
    out = tmp_path / "out.xlsx"
    assert invoke("check", write_case_file(document), "--table", str(out)).exit_code == 0
    notes, header, rows = sheet_rows(out, "shaft")
    assert notes[0].startswith("# No shaft check") and rows == []


def test_check_table_as_csv_files(tmp_path):
    out = tmp_path / "out.csv"
    result = invoke("check", YARD_LOADER, "--table", str(out))
    assert result.exit_code == 0, result.output
    for name in CHECK_SHEETS:
        lines = (tmp_path / f"out-{name}.csv").read_text().splitlines()
        assert f"# Caution: {CAUTIONS}" in lines
    lines = (tmp_path / "out-cases.csv").read_text().splitlines()
    body = [line for line in lines if not line.startswith("#")]
    records = list(csv.reader(body))
    assert "Fr out [kN]" in records[0] and len(records) == 1 + 7
    assert not out.exists()


@pytest.mark.parametrize("existing", ["out.xlsx", "out-checks.csv"])
def test_table_never_overwrites_without_force(tmp_path, existing):
    target = tmp_path / existing
    target.write_text("mine\n")
    out = tmp_path / ("out.xlsx" if existing.endswith(".xlsx") else "out.csv")
    result = invoke("check", YARD_LOADER, "--table", str(out))
    assert result.exit_code == 2 and "exists already" in result.output
    assert result.output.count("\n") == 1
    assert target.read_text() == "mine\n"
    assert sorted(p.name for p in tmp_path.iterdir()) == [existing]   # refused before the work
    assert invoke("check", YARD_LOADER, "--table", str(out), "--force").exit_code == 0
    assert target.read_bytes() != b"mine\n"


def test_table_refuses_the_files_own_case_table(tmp_path):
    toml = tmp_path / "yard.toml"
    toml.write_text((LOAD_CASES / "yard_loader.toml").read_text())
    assert invoke("cases", str(toml), "--to", str(tmp_path / "duty.xlsx")).exit_code == 0
    text = toml.read_text()
    toml.write_text(text[:text.index("[[case]]")] + '[cases]\ntable = "duty.xlsx"\n'
                    + text[text.index("# Shaft check"):])
    result = invoke("check", str(toml), "--table", str(tmp_path / "duty.xlsx"), "--force")
    assert result.exit_code == 2 and "is an input of this run" in result.output


def test_table_refuses_other_suffixes(tmp_path):
    result = invoke("check", YARD_LOADER, "--table", str(tmp_path / "out.ods"))
    assert result.exit_code == 2 and "ending in .xlsx or .csv" in result.output


def test_sweep_table_has_a_row_per_point(tmp_path):
    out = tmp_path / "sweep.xlsx"
    result = invoke("sweep", YARD_LOADER, "--vary", "wheel.offset_mm=60:160:5",
                    "--vary", "case[2].wheel_load_kN=10:20:2", "--table", str(out), "--json")
    assert result.exit_code == 0, result.output
    document = json.loads(result.stdout)
    notes, header, rows = sheet_rows(out, "points")
    assert f"# Caution: {CAUTIONS}" in notes
    assert len(rows) == 10
    assert column(header, rows, "offset_mm") == [v for v in (60, 85, 110, 135, 160)
                                                 for _ in range(2)]
    assert "system L10m [h]" in header and "outboard s0" in header
    lives = [point["system"]["l10m_h"] for point in document["points"]]
    assert column(header, rows, "system L10m [h]") == pytest.approx(lives)


def test_compare_table_has_a_row_per_file(tmp_path):
    files = [str(LOAD_CASES / name) for name in ("yard_loader.toml", "site_dumper.toml")]
    out = tmp_path / "compare.csv"
    result = invoke("compare", *files, "--table", str(out))
    assert result.exit_code == 0, result.output
    lines = out.read_text().splitlines()
    assert f"# Caution: {CAUTIONS}" in lines
    records = list(csv.reader(line for line in lines if not line.startswith("#")))
    header, rows = records[0], records[1:]
    assert [row[header.index("file")] for row in rows] == files
    assert float(rows[0][header.index("system L10 / #1")]) == 1.0


def test_spectrum_table_has_lives_and_classed_cases(tmp_path):
    from logsupport import spectrum_log, write_log

    cases = [{"time_percent": 60, "wheel_load_kN": 12, "tractive_force_kN": 2, "speed_rpm": 40},
             {"time_percent": 40, "wheel_load_kN": 18, "side_force_kN": 3, "speed_rpm": 20}]
    log = write_log(tmp_path / "log.csv", spectrum_log(cases))
    out = tmp_path / "spectrum.xlsx"
    result = invoke("spectrum", log, "--case-file", YARD_LOADER, "--table", str(out), "--json")
    assert result.exit_code == 0, result.output
    notes, header, rows = sheet_rows(out, "lives")
    assert f"# Caution: {CAUTIONS}" in notes
    assert column(header, rows, "bearing") == ["outboard", "inboard", "pair (system)"]
    assert "direct L10 [h]" in header and "classed L10 [h]" in header
    notes, header, rows = sheet_rows(out, "classed")
    assert f"# Caution: {CAUTIONS}" in notes
    # the log holds each case's level for its share of the time (common practice: a
    # time-at-level spectrum keeps the time shares)
    assert sum(column(header, rows, "time [%]")) == pytest.approx(100)
    assert "Fr out [kN]" in header


def test_spectrum_table_of_a_folder_starts_with_the_fleet(tmp_path):
    from logsupport import spectrum_log, write_log

    folder = tmp_path / "logs"
    folder.mkdir()
    for index, load in enumerate((12, 16)):
        write_log(folder / f"log{index}.csv",
                  spectrum_log([{"time_percent": 100, "wheel_load_kN": load, "speed_rpm": 30}]))
    out = tmp_path / "fleet.csv"
    result = invoke("spectrum", str(folder), "--case-file", YARD_LOADER, "--table", str(out),
                    "--jobs", "1")
    assert result.exit_code == 0, result.output
    lines = (tmp_path / "fleet-fleet.csv").read_text().splitlines()
    records = list(csv.reader(line for line in lines if not line.startswith("#")))
    assert [row[0] for row in records[1:]] == ["log1.csv", "log0.csv"]   # harshest first
    assert (tmp_path / "fleet-lives.csv").exists() and (tmp_path / "fleet-classed.csv").exists()


def test_refined_check_table_has_both_methods_lives(tmp_path):
    out = tmp_path / "refined.xlsx"
    result = invoke("check", YARD_LOADER, "--method", "refined", "--table", str(out))
    assert result.exit_code == 0, result.output
    document = json.loads(invoke("check", YARD_LOADER, "--method", "refined", "--json").output)
    _, header, rows = sheet_rows(out, "bearings")
    pair = rows[column(header, rows, "bearing").index("pair (system)")]
    assert pair[header.index("L10 [h]")] == pytest.approx(document["iso281"]["system"]["l10_h"])
    _, header, rows = sheet_rows(out, "cases")
    assert "Qmax out [kN]" in header and len(rows) == 7
