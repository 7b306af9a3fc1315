"""Odd names and numbers a user's files may carry, through every kind of output: nothing
breaks a workbook, a plot or a pipe, and numbers of no sensible size are refused in one line
(the robustness promise: docs/file-format.md, errors)."""

from __future__ import annotations

import csv
import subprocess
import sys
import xml.dom.minidom
from pathlib import Path

import pytest

from clisupport import run

LOAD_CASES = Path(__file__).resolve().parents[1] / "load_cases"
YARD = LOAD_CASES / "yard_loader.toml"
BELL_NAME = "travel \x07\x1b[31mred\x1b[0m"     # BEL and an ECMA-48 colour sequence


def refused(*arguments) -> str:
    result = run(*arguments)
    assert result.exit_code == 2, result.output
    assert len(result.output.strip().splitlines()) == 1, result.output
    return result.output


def with_case_name(document, write_case_file, name=BELL_NAME):
    document["case"][0]["name"] = name
    return write_case_file(document)


def test_a_workbook_takes_names_with_control_characters(document, write_case_file, tmp_path):
    # Office Open XML holds XML 1.0 characters only (ECMA-376): the controls are left out
    from openpyxl import load_workbook

    table = tmp_path / "out.xlsx"
    result = run("check", with_case_name(document, write_case_file), "--table", table)
    assert result.exit_code == 0, result.output
    texts = [str(cell.value) for sheet in load_workbook(table) for row in sheet.iter_rows()
             for cell in row if cell.value is not None]
    assert any("travel red" in text for text in texts)
    assert not any("\x07" in text or "\x1b" in text for text in texts)


@pytest.mark.parametrize("name", [BELL_NAME, "Fahrt \u6c34\u5e73 \U0001f69c"])
def test_plots_of_odd_names_are_valid_and_silent(document, write_case_file, tmp_path, name):
    # an SVG is XML (W3C SVG 1.1): no control characters; a glyph the font lacks gives no
    # warning on stderr (the run's output stays one clean stream)
    svg = tmp_path / "chart.svg"
    completed = subprocess.run(
        [sys.executable, "-m", "hubload", "check", with_case_name(document, write_case_file, name),
         "--plot", str(svg)], capture_output=True, text=True, encoding="utf-8")
    assert completed.returncode == 0, completed.stderr
    assert completed.stderr == ""
    xml.dom.minidom.parse(str(svg))


@pytest.mark.parametrize("cell", ["1_1", "1__0"])
def test_a_table_cell_with_underscores_is_no_number(tmp_path, cell):
    # Python reads 1_1 as 11; no spreadsheet writes it (common practice)
    text = (LOAD_CASES / "yard_loader_duty.csv").read_text(encoding="utf-8")
    rows = list(csv.reader(line for line in text.splitlines() if not line.startswith("#")))
    rows[1][rows[0].index("wheel_load_kN")] = cell
    with open(tmp_path / "yard_loader_duty.csv", "w", newline="", encoding="utf-8") as out:
        csv.writer(out).writerows(rows)
    case_file = tmp_path / "from_table.toml"
    case_file.write_text((LOAD_CASES / "yard_loader_from_table.toml").read_text(encoding="utf-8"),
                         encoding="utf-8")
    assert "wheel_load_kN" in refused("check", case_file)


def test_field_hours_below_a_minute_are_refused(tmp_path):
    data = tmp_path / "returns.csv"
    data.write_text("hours,status\n1e-320,failed\n800,failed\n1200,suspended\n",
                    encoding="utf-8")
    assert "row 2, column hours" in refused("field", data)


@pytest.mark.parametrize("option, value", [("--calibration-factor", "1e-200"),
                                           ("--hours-per-year-median", "1e-310")])
def test_forecast_numbers_of_no_sensible_size_are_refused(option, value):
    assert option in refused("forecast", LOAD_CASES / "site_dumper.toml", option, value)


def test_weights_need_a_folder_of_logs(tmp_path):
    log = tmp_path / "log.csv"
    log.write_text("time_s,wheel_load_kN,speed_rpm\n0,10,50\n1,10,50\n", encoding="utf-8")
    weights = tmp_path / "mix.csv"
    weights.write_text("log,share\nlog.csv,nan\n", encoding="utf-8")
    assert "--weights" in refused("spectrum", log, "--case-file", YARD, "--weights", weights)


def test_a_reader_closing_the_pipe_early_ends_the_run_quietly():
    # `hubload check FILE --all | head -1`: POSIX pipes; nothing went wrong for the user
    process = subprocess.Popen([sys.executable, "-m", "hubload", "check", str(YARD), "--all"],
                               stdout=subprocess.PIPE, stderr=subprocess.PIPE)
    process.stdout.read(20)
    process.stdout.close()
    assert process.wait() == 0
    assert process.stderr.read() == b""


def test_a_terminal_without_the_table_characters_still_gets_the_tables():
    completed = subprocess.run([sys.executable, "-m", "hubload", "check", str(YARD)],
                               capture_output=True, env={**__import__("os").environ,
                                                         "PYTHONIOENCODING": "cp1252"})
    assert completed.returncode == 0, completed.stderr
    assert b"L10" in completed.stdout


def test_a_key_path_through_a_value_says_so():
    message = refused("sweep", YARD, "--vary", "pair.outboard.C_kN.x=1:2:2")
    assert "'C_kN' is a value" in message and "did you mean" not in message


def test_a_case_table_with_a_csv_syntax_error_names_the_row(tmp_path):
    (tmp_path / "duty.csv").write_text('name,time_percent\n"travel" x,100\n', encoding="utf-8")
    case_file = tmp_path / "table.toml"
    text = (LOAD_CASES / "yard_loader_from_table.toml").read_text(encoding="utf-8")
    case_file.write_text(text.replace('"yard_loader_duty.csv"', '"duty.csv"'), encoding="utf-8")
    assert "row 2: CSV syntax error" in refused("check", case_file)


def test_an_empty_file_name_is_named_as_such():
    assert "got an empty one" in refused("check", "")


def test_a_name_with_a_line_break_stays_on_its_table_row(document, write_case_file):
    path = with_case_name(document, write_case_file, "travel\nloaded")
    result = run("check", path)
    assert result.exit_code == 0, result.output
    assert "travel loaded" in result.output


def test_a_brief_in_markdown_keeps_names_on_one_line_and_tags_inert(document, write_case_file,
                                                                   tmp_path):
    # CommonMark 0.31, 4.6 (HTML blocks) and 6.6 (raw HTML): a tag in text passes through
    brief = tmp_path / "brief.md"
    path = with_case_name(document, write_case_file, "travel\n# heading <script>x</script>")
    result = run("brief", path, "--out", brief)
    assert result.exit_code == 0, result.output
    text = brief.read_text(encoding="utf-8")
    assert "<script>" not in text and "\n# heading" not in text
    assert "travel # heading &lt;script>" in text


def test_a_spectrum_file_is_a_toml_file(tmp_path):
    log = tmp_path / "log.csv"
    log.write_text("time_s,wheel_load_kN,speed_rpm\n0,10,50\n1,10,50\n", encoding="utf-8")
    assert ".toml" in refused("spectrum", log, "--case-file", YARD, "--out", tmp_path / "s.csv")
