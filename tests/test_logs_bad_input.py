"""Bad logs exit with status 2 and one line naming the file, row and column; repairs are counted."""

import json

import pytest
from click.testing import CliRunner
from logsupport import YARD_LOADER, spectrum_log, write_csv_text, write_log

from hubload.cli import main

HEADER = "time_s,wheel_load_kN,side_force_kN,tractive_force_kN,speed_rpm\n"
GOOD_ROWS = ["0,10,0,1,40", "1,11,0.5,1,40", "2,12,0,2,40", "3,12,0,2,40", "4,11,0,1,40",
             "5,10,0,1,40"]


def rows_with(changes: dict[int, str]) -> str:
    rows = list(GOOD_ROWS)
    for index, row in changes.items():
        rows[index] = row
    return HEADER + "\n".join(rows) + "\n"


def failed(path, *options):
    result = CliRunner().invoke(main, ["spectrum", str(path), "--case-file", str(YARD_LOADER),
                                       *options])
    assert result.exit_code == 2, result.output
    assert result.exception is None or isinstance(result.exception, SystemExit)
    assert "Traceback" not in result.output
    message = result.output.strip()
    assert message.count("\n") == 0, message
    return message


def passed(path, *options):
    result = CliRunner().invoke(main, ["spectrum", str(path), "--case-file", str(YARD_LOADER),
                                       "--json", *options])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


@pytest.mark.parametrize("changes, where, expected", [
    ({2: "2,,0,2,40"}, "row 3, column 'wheel_load_kN'", "empty, NaN or infinite sample"),
    ({3: "3,12,nan,2,40"}, "row 4, column 'side_force_kN'", "NaN or infinite sample"),
    ({3: "3,12,0,inf,40"}, "row 4, column 'tractive_force_kN'", "NaN or infinite sample"),
    ({2: "1,12,0,2,40"}, "row 3, column 'time_s'", "repeats 1 s"),
    ({3: "1.5,12,0,2,40"}, "row 4, column 'time_s'", "goes back from 2 s"),
    ({4: "40,11,0,1,40", 5: "41,10,0,1,40"}, "row 4, column 'time_s'", "gap of 37 s"),
    ({1: "1,eleven,0.5,1,40"}, "row 2, column 'wheel_load_kN'", "expected a number"),
    ({2: "2,12,0"}, "row 3", "expected 5 fields, got 3"),
    ({1: "1,-4,0.5,1,40"}, "row 2, column 'wheel_load_kN'", "expected a value >= 0"),
])
def test_bad_rows_name_file_row_and_column(tmp_path, changes, where, expected):
    log = write_csv_text(tmp_path / "log.csv", rows_with(changes))
    message = failed(log)
    assert message.startswith(f"error: {log}: {where}: "), message
    assert expected in message


def test_bytes_that_are_not_utf8_deep_in_a_log_name_their_row(tmp_path):
    # past the first read buffer, so the header reads fine and pyarrow meets them first
    good = "".join(f"{i},10,0,1,40\n" for i in range(20_000))
    log = tmp_path / "log.csv"
    log.write_bytes((HEADER + good).encode() + b"20000,1\xe9,0,1,40\n20001,10,0,1,40\n")
    message = failed(log)
    assert message.startswith(f"error: {log}: row 20001, column 'wheel_load_kN': ")
    assert "expected a number" in message


@pytest.mark.parametrize("text, expected", [
    ("time_s,speed_rpm\n0,1\n1,1\n", "missing column 'wheel_load_kN'"),
    ("time_s,wheel_load_kN\n0,1\n1,1\n", "no speed column"),
    ("t,wheel_load_kN,speed_rpm\n0,1,1\n1,1,1\n", "missing column 'time_s'"),
    (HEADER + "0,10,0,1,40\n", "no duration"),
])
def test_missing_columns_and_too_short_logs(tmp_path, text, expected):
    log = write_csv_text(tmp_path / "log.csv", text)
    message = failed(log)
    assert message.startswith(f"error: {log}: ")
    assert expected in message


def test_missing_column_suggests_the_closest_header(tmp_path):
    log = write_csv_text(tmp_path / "log.csv", "time_s,wheel_load_kn,speed_rpm\n0,1,1\n1,1,1\n")
    message = failed(log)
    assert "'wheel_load_kn'" in message and "--column wheel_load_kN=HEADER" in message


@pytest.mark.parametrize("options, expected", [
    (["--column", "wheel=Fz"], "unknown channel 'wheel'"),
    (["--column", "wheel_load_kN"], "expected KEY=HEADER"),
    (["--column", "wheel_load_kN=Fz"], "column 'Fz' (mapped to wheel_load_kN) is not in the log"),
    (["--classes", "1"], "from 2 to 1024"),
    (["--classes", "wheel_kN=8"], "unknown channel"),
    (["--max-gap-s", "0"], "expected a positive, finite time"),
    (["--max-gap-s", "inf"], "expected a positive, finite time"),
])
def test_bad_options(tmp_path, options, expected):
    log = write_csv_text(tmp_path / "log.csv", rows_with({}))
    assert expected in failed(log, *options)


def test_unknown_log_type_and_missing_log(tmp_path):
    assert "unknown log type '.xlsx'" in failed(write_csv_text(tmp_path / "log.xlsx", "x"))
    assert "log file not found" in failed(tmp_path / "absent.csv")
    empty = tmp_path / "empty"
    empty.mkdir()
    assert "no logs in the folder" in failed(empty)


def test_output_files_are_checked_before_the_log_is_read(tmp_path):
    # An existing --out file (or a missing folder) is refused first: the user learns it
    # before a long log is read, here a log that would fail on its row 3.
    log = write_csv_text(tmp_path / "log.csv", rows_with({2: "2,,0,2,40"}))
    existing = write_csv_text(tmp_path / "spectrum.toml", "# keep\n")
    assert "--force" in failed(log, "--out", existing)
    assert "does not exist" in failed(log, "--out", tmp_path / "no" / "spectrum.toml")


def test_bad_case_file_is_reported_with_its_key_path(tmp_path, write_case_file, document):
    document["wheel"]["offset_mm"] = "far"
    case_file = write_case_file(document)
    log = write_csv_text(tmp_path / "log.csv", rows_with({}))
    result = CliRunner().invoke(main, ["spectrum", log, "--case-file", case_file])
    assert result.exit_code == 2
    assert f"{case_file}: wheel.offset_mm: expected a number" in result.output


def test_case_file_without_cases_is_accepted(tmp_path, write_case_file, document):
    document.pop("case")
    log = write_csv_text(tmp_path / "log.csv", rows_with({}))
    result = CliRunner().invoke(main, ["spectrum", log, "--case-file", write_case_file(document)])
    assert result.exit_code == 0, result.output


def test_drop_removes_empty_rows_and_cuts_gaps_with_counts(tmp_path):
    text = rows_with({2: "2,,0,2,40", 4: "40,11,0,1,40", 5: "41,10,0,1,40"})
    document = passed(write_csv_text(tmp_path / "log.csv", text), "--gaps", "drop")
    cleaning = document["cleaning"]
    assert cleaning["dropped_rows"] == 1
    assert cleaning["gaps"] == 1
    # rows 1, 2, 4 (row 3 dropped: row 2 holds 2 s) then the 37 s gap cut to the median 1 s
    assert cleaning["gap_time_s"] == pytest.approx(36.0)
    assert document["duration_h"] == pytest.approx((41 - 36) / 3600)


def test_interpolate_fills_empty_samples_and_gaps_linearly(tmp_path):
    text = rows_with({2: "2,,0,2,40", 4: "8,11,0,1,40", 5: "9,10,0,1,40"})
    log = write_csv_text(tmp_path / "log.csv", text)
    document = passed(log, "--gaps", "interpolate", "--max-gap-s", "2")
    cleaning = document["cleaning"]
    assert cleaning["filled_values"] == 1
    assert cleaning["gaps"] == 1 and cleaning["filled_samples"] == 4
    assert document["duration_h"] == pytest.approx(9 / 3600)
    levels = sorted(c["wheel_load_kN"] for c in document["classed"]["cases"])
    assert min(levels) >= 10 and max(levels) <= 12


def test_interpolated_log_matches_the_densely_sampled_one(tmp_path):
    # a ramp sampled every second, then with every other row emptied: linear
    # interpolation restores it exactly
    dense = spectrum_log([{"time_percent": 100, "wheel_load_kN": 15, "speed_rpm": 30}],
                         seconds=40)
    dense["wheel_load_kN"] = 10 + 0.25 * dense["time_s"]
    sparse = {**dense, "wheel_load_kN": dense["wheel_load_kN"].copy()}
    sparse["wheel_load_kN"][1:-1:2] = float("nan")
    full = passed(write_log(tmp_path / "dense.csv", dense))
    repaired = passed(write_log(tmp_path / "sparse.csv", sparse), "--gaps", "interpolate")
    assert repaired["direct"]["system"]["l10_h"] == pytest.approx(
        full["direct"]["system"]["l10_h"], rel=1e-12)
