"""Load cases from a spreadsheet ([cases] table): the same study as the same cases written as
[[case]] blocks, and every bad cell named by file, row and column, exit 2, one line.

The reference is the [[case]] route of the same file (the format's own rule that a row is a
block); the tables are written here with the csv module and openpyxl directly, not by hubload.
"""

from __future__ import annotations

import csv
import json
import tomllib
from pathlib import Path

import pytest
import tomli_w
from click.testing import CliRunner

from hubload.cli import main

LOAD_CASES = Path(__file__).resolve().parents[1] / "load_cases"
SCENARIOS = ("yard_loader.toml", "site_dumper.toml", "road_sweeper.toml")


def case_keys(blocks: list[dict]) -> list[str]:
    keys: list[str] = []
    for block in blocks:
        keys += [key for key in block if key not in keys]
    return keys


def write_csv(path: Path, blocks: list[dict], delimiter: str = ",") -> None:
    keys = case_keys(blocks)
    with path.open("w", newline="", encoding="utf-8") as stream:
        writer = csv.writer(stream, delimiter=delimiter)
        writer.writerow(keys)
        writer.writerows([block.get(key, "") for key in keys] for block in blocks)


def write_xlsx(path: Path, blocks: list[dict], sheet: str = "duty") -> None:
    from openpyxl import Workbook

    workbook = Workbook()
    workbook.active.title = "first"
    worksheet = workbook.create_sheet(sheet)
    keys = case_keys(blocks)
    worksheet.append(keys)
    for block in blocks:
        worksheet.append([block.get(key) for key in keys])
    workbook.save(path)


def tabled(scenario: str, folder: Path, suffix: str) -> tuple[Path, Path]:
    """The scenario as written (a copy in ``folder``) and as a file with a [cases] table."""
    document = tomllib.loads((LOAD_CASES / scenario).read_text())
    blocks = document.pop("case")
    table = folder / f"duty{suffix}"
    if suffix == ".csv":
        write_csv(table, blocks)
        document["cases"] = {"table": table.name}
    else:
        write_xlsx(table, blocks)
        document["cases"] = {"table": table.name, "sheet": "duty"}
    with_table = folder / "with_table.toml"
    with_table.write_text(tomli_w.dumps(document))
    as_blocks = folder / "as_blocks.toml"
    as_blocks.write_text((LOAD_CASES / scenario).read_text())
    return with_table, as_blocks


def check_json(path: Path, *options: str) -> dict:
    result = CliRunner().invoke(main, ["check", str(path), "--json", *options])
    assert result.exit_code == 0, result.output
    document = json.loads(result.output)
    document.pop("source", None)
    return document


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
@pytest.mark.parametrize("scenario", SCENARIOS)
def test_a_table_gives_exactly_the_results_of_the_blocks(tmp_path, scenario, suffix):
    with_table, as_blocks = tabled(scenario, tmp_path, suffix)
    assert check_json(with_table) == check_json(as_blocks)


def test_the_refined_method_reads_a_table_the_same(tmp_path):
    with_table, as_blocks = tabled("yard_loader.toml", tmp_path, ".xlsx")
    assert check_json(with_table, "--method", "refined") == \
        check_json(as_blocks, "--method", "refined")


def test_a_sweep_varies_a_case_of_a_table(tmp_path):
    with_table, as_blocks = tabled("yard_loader.toml", tmp_path, ".csv")
    vary = "case[2].wheel_load_kN=10:30:3"
    outputs = [CliRunner().invoke(main, ["sweep", str(path), "--vary", vary, "--json"])
               for path in (with_table, as_blocks)]
    documents = [json.loads(output.output) for output in outputs]
    for document in documents:
        document.pop("source", None)
    assert documents[0] == documents[1]


def test_a_semicolon_csv_with_decimal_commas_reads_as_numbers(tmp_path, document,
                                                               write_case_file):
    # the "CSV (semicolon)" export of spreadsheets in locales with a decimal comma
    blocks = document.pop("case")
    blocks[0]["side_force_kN"] = 4.5
    expected = check_json(Path(write_case_file({**document, "case": blocks}, "blocks.toml")))
    lines = ["name;time_percent;wheel_load_kN;side_force_kN;tractive_force_kN;speed_rpm;speed_kmh",
             "travel;70;20;4,5;6;50;", "turn;30;15;-3;2;;5"]
    (tmp_path / "duty.csv").write_text("\n".join(lines) + "\n", encoding="utf-8-sig")
    path = write_case_file({**document, "cases": {"table": "duty.csv"}})
    assert check_json(Path(path)) == expected


def test_comment_lines_before_the_header_are_skipped(tmp_path, document, write_case_file):
    blocks = document.pop("case")
    expected = check_json(Path(write_case_file({**document, "case": blocks}, "blocks.toml")))
    write_csv(tmp_path / "duty.csv", blocks)
    text = (tmp_path / "duty.csv").read_text()
    (tmp_path / "duty.csv").write_text("# written by hand\n# Caution: estimates only\n\n" + text)
    assert check_json(Path(write_case_file({**document, "cases": {"table": "duty.csv"}}))) \
        == expected


def bad_table_message(tmp_path, document, write_case_file, edit, suffix=".csv") -> str:
    blocks = document.pop("case")
    table = tmp_path / f"duty{suffix}"
    (write_csv if suffix == ".csv" else write_xlsx)(table, blocks)
    if suffix == ".csv":
        lines = table.read_text().splitlines()
        table.write_text("\n".join(edit(lines)) + "\n")
        cases = {"table": table.name}
    else:
        from openpyxl import load_workbook

        workbook = load_workbook(table)
        edit(workbook["duty"])
        workbook.save(table)
        cases = {"table": table.name, "sheet": "duty"}
    path = write_case_file({**document, "cases": cases})
    result = CliRunner().invoke(main, ["check", path])
    assert result.exit_code == 2, result.output
    assert "Traceback" not in result.output
    message = result.output.strip()
    assert message.count("\n") == 0, message
    assert message.startswith(f"error: {table}: "), message
    return message


def replace_cell(row: int, column: int, text: str):
    def edit(lines: list[str]) -> list[str]:
        cells = lines[row - 1].split(",")
        cells[column] = text
        return lines[:row - 1] + [",".join(cells)] + lines[row:]
    return edit


# conftest's two cases; columns: name, time_percent, wheel_load_kN, side_force_kN,
# tractive_force_kN, speed_rpm, speed_kmh
@pytest.mark.parametrize("edit, place, expected", [
    (replace_cell(3, 2, "heavy"), "row 3, column wheel_load_kN",
     "expected a number, got a string ('heavy')"),
    (replace_cell(2, 1, "-5"), "row 2, column time_percent", "expected a value >= 0"),
    (replace_cell(1, 3, "side_forse_kN"), "row 1, column side_forse_kN",
     "unknown column; did you mean 'side_force_kN'?"),
    (replace_cell(2, 5, "nan"), "row 2, column speed_rpm", "expected a finite number"),
    (replace_cell(2, 1, "50"), "column time_percent", "time shares add to 80 %"),
    (replace_cell(3, 6, ""), "row 3", "missing speed"),
    (replace_cell(2, 6, "5"), "row 2, column speed_kmh", "give only one of"),
    (replace_cell(3, 0, ""), "row 3, column name", "missing required key"),
    (lambda lines: [",".join(lines[0].split(",")[1:])]
     + [",".join(line.split(",")[1:]) for line in lines[1:]],
     "row 1", "missing required column name"),
    (lambda lines: [lines[0].replace("wheel_load_kN", "side_force_kN")] + lines[1:],
     "row 1, column D", "column side_force_kN appears twice"),
    (lambda lines: [lines[0]] + [lines[1] + ",7"] + lines[2:], "row 2, column H",
     "a value in a column without a header"),
    (lambda lines: lines[:1], "", "expected at least 1 row of cases"),
])
def test_a_bad_cell_names_file_row_and_column(tmp_path, document, write_case_file, edit, place,
                                              expected):
    message = bad_table_message(tmp_path, document, write_case_file, edit)
    assert f": {place}: " in message or not place, message
    assert expected in message, message


def test_a_bad_xlsx_cell_names_file_row_and_column(tmp_path, document, write_case_file):
    def edit(sheet):
        sheet["C3"] = "heavy"
    message = bad_table_message(tmp_path, document, write_case_file, edit, ".xlsx")
    assert message.endswith("row 3, column wheel_load_kN: expected a number, got a string "
                            "('heavy')"), message


def test_a_negative_time_share_in_xlsx(tmp_path, document, write_case_file):
    def edit(sheet):
        sheet["B2"] = -30
    message = bad_table_message(tmp_path, document, write_case_file, edit, ".xlsx")
    assert "row 2, column time_percent: expected a value >= 0" in message


def test_a_formula_without_a_saved_value_is_refused(tmp_path, document, write_case_file):
    # openpyxl writes formulas without computing them; only a spreadsheet program saves the
    # value, so hubload must not read such a cell as empty
    def edit(sheet):
        sheet["D2"] = "=C2*0.2"
    message = bad_table_message(tmp_path, document, write_case_file, edit, ".xlsx")
    assert "row 2, column D: a formula without a saved value" in message


@pytest.mark.parametrize("cases, key_path, expected", [
    ({"table": "nowhere.csv"}, "nowhere.csv", "file not found"),
    ({"table": "duty.txt"}, "cases.table", "expected a table file ending in .csv or .xlsx"),
    ({"table": "duty.csv", "sheet": "x"}, "cases.sheet", "a CSV file has no sheets"),
    ({"tabel": "duty.csv"}, "cases.tabel", "did you mean 'table'?"),
    ({"table": 3}, "cases.table", "expected a string"),
])
def test_a_bad_cases_table_names_the_key(tmp_path, document, write_case_file, cases, key_path,
                                         expected):
    write_csv(tmp_path / "duty.csv", document.pop("case"))
    path = write_case_file({**document, "cases": cases})
    result = CliRunner().invoke(main, ["check", path])
    assert result.exit_code == 2
    assert key_path in result.output and expected in result.output, result.output


def test_blocks_and_a_table_together_are_refused(tmp_path, document, write_case_file):
    write_csv(tmp_path / "duty.csv", document["case"])
    path = write_case_file({**document, "cases": {"table": "duty.csv"}})
    result = CliRunner().invoke(main, ["check", path])
    assert result.exit_code == 2
    assert "cases.table: give the cases as [[case]] blocks or as a [cases] table, not both" \
        in result.output


def test_a_missing_sheet_lists_the_sheets(tmp_path, document, write_case_file):
    write_xlsx(tmp_path / "duty.xlsx", document.pop("case"))
    path = write_case_file({**document, "cases": {"table": "duty.xlsx", "sheet": "dutty"}})
    result = CliRunner().invoke(main, ["check", path])
    assert result.exit_code == 2
    assert "no sheet named 'dutty'; the workbook has 'first', 'duty'" in result.output


def test_a_file_that_is_no_workbook_is_one_line(tmp_path, document, write_case_file):
    (tmp_path / "duty.xlsx").write_text("name,time_percent\n")
    document.pop("case")
    path = write_case_file({**document, "cases": {"table": "duty.xlsx"}})
    result = CliRunner().invoke(main, ["check", path])
    assert result.exit_code == 2
    assert "cannot read the workbook" in result.output and result.output.count("\n") == 1


@pytest.mark.parametrize("content", [b"\x89PNG\r\n\x1a\n\x00\x00", b"name,time_percent\nx\x00,100\n",
                                     b'name,time_percent\n"unclosed,100\n'])
def test_a_table_that_is_no_csv_is_one_line(tmp_path, document, write_case_file, content):
    (tmp_path / "duty.csv").write_bytes(content)
    document.pop("case")
    path = write_case_file({**document, "cases": {"table": "duty.csv"}})
    result = CliRunner().invoke(main, ["check", path])
    assert result.exit_code == 2 and result.output.count("\n") == 1, result.output
    assert result.output.startswith(f"error: {tmp_path / 'duty.csv'}: ")


def test_a_logs_case_file_ignores_its_case_table(tmp_path, document, write_case_file):
    # a log brings its own operating points: the table is not read (here: not even there)
    from logsupport import spectrum_log, write_log

    document.pop("case")
    path = write_case_file({**document, "cases": {"table": "nowhere.csv"}})
    log = write_log(tmp_path / "log.csv", spectrum_log(
        [{"time_percent": 100, "wheel_load_kN": 15, "speed_rpm": 30}]))
    result = CliRunner().invoke(main, ["spectrum", log, "--case-file", path, "--json"])
    assert result.exit_code == 0, result.output
