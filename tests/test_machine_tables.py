"""`hubload machine --table`, and --table of machine sweeps and comparisons.

The sheets are read back with openpyxl and the csv module and compared with the machine
file itself (its time shares), with `hubload machine --json` (written by another path,
report/json, from the same typed results) and with the series formula of the machine's
life: L = (sum L_i^-e)^(-1/e), e = 9/8 for roller bearings (Lundberg-Palmgren system life;
Harris & Kotzalas, Rolling Bearing Analysis, 5th ed., vol. 2, ch. 8, "life of a bearing
system").
"""

from __future__ import annotations

import csv
import json

import pytest

from machinesupport import MACHINES, run
from test_result_tables import column, sheet_rows

from hubload.report.cautions import CAUTIONS

BUNDLED = MACHINES / "yard_loader_machine.toml"
SHEETS = ["wheel_ends", "cases", "machine"]
# the bundled machine's time shares [%] (yard_loader_machine.toml), mirrored halves split
TIME_PERCENT = [35, 22, 10, 6, 6, 4, 4, 4, 9]


def machine_json(path=BUNDLED) -> dict:
    result = run("machine", path, "--json")
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


@pytest.fixture(scope="module")
def workbook(tmp_path_factory):
    out = tmp_path_factory.mktemp("tables") / "machine.xlsx"
    result = run("machine", BUNDLED, "--table", out)
    assert result.exit_code == 0, result.output
    return out


def test_every_sheet_carries_the_cautions_and_units_in_its_headers(workbook):
    from openpyxl import load_workbook

    assert load_workbook(workbook, read_only=True).sheetnames == SHEETS
    for name in SHEETS:
        notes, header, _ = sheet_rows(workbook, name)
        assert f"# Caution: {CAUTIONS}" in notes, name
        assert any(heading.endswith(("[h]", "[kN]")) for heading in header), name


def test_the_wheel_ends_sheet_holds_the_lives_of_the_json(workbook):
    _, header, rows = sheet_rows(workbook, "wheel_ends")
    document = machine_json()
    assert column(header, rows, "wheel end") == [w["name"] for w in document["wheel_ends"]]
    for row, wheel in zip(rows, document["wheel_ends"]):
        values = dict(zip(header, row))
        assert values["L10m [h]"] == pytest.approx(wheel["governing_life"]["life_h"], rel=1e-12)
        assert values["L10 pair [h]"] == pytest.approx(wheel["system"]["l10_h"], rel=1e-12)
        assert values["L10m pair [h]"] == pytest.approx(wheel["system"]["l10m_h"], rel=1e-12)
        for label in ("outboard", "inboard"):
            bearing = wheel["bearings"][label]
            assert values[f"L10 {label} [h]"] == pytest.approx(bearing["l10_h"], rel=1e-12)
            assert values[f"L10m {label} [h]"] == pytest.approx(bearing["l10m_h"], rel=1e-12)
            assert values[f"s0 {label}"] == pytest.approx(bearing["s0"], rel=1e-12)
        assert values["shaft"] == pytest.approx(wheel["lowest_shaft_safety"], rel=1e-12)


def test_the_machine_sheet_is_the_series_system_of_the_bearings_on_the_other_sheet(workbook):
    _, header, rows = sheet_rows(workbook, "wheel_ends")
    for basis in ("L10", "L10m"):
        lives = [life for label in ("outboard", "inboard")
                 for life in column(header, rows, f"{basis} {label} [h]")]
        series = sum(life ** (-9 / 8) for life in lives) ** (-8 / 9)
        _, machine_header, machine_rows = sheet_rows(workbook, "machine")
        assert column(machine_header, machine_rows, f"{basis} [h]")[0] == pytest.approx(
            series, rel=1e-9)
    values = dict(zip(machine_header, machine_rows[0]))
    assert values["weakest wheel end"] == "front left"
    assert values["target [h]"] == 10000 and values["verdict"] == "FAIL"   # 603 h < 10,000 h


def test_the_cases_sheet_lists_every_wheel_ends_cases_with_the_files_time_shares(workbook):
    _, header, rows = sheet_rows(workbook, "cases")
    document = machine_json()
    for wheel in document["wheel_ends"]:
        mine = [row for row in rows if row[header.index("wheel end")] == wheel["name"]]
        assert column(header, mine, "time [%]") == pytest.approx(TIME_PERCENT)
        assert column(header, mine, "W [kN]") == pytest.approx(
            [case["wheel_load_kN"] for case in wheel["cases"]], rel=1e-12)
        assert column(header, mine, "n [r/min]") == pytest.approx(
            [case["speed_rpm"] for case in wheel["cases"]], rel=1e-12)


def test_csv_files_per_sheet_and_no_overwrite_without_force(tmp_path):
    out = tmp_path / "machine.csv"
    assert run("machine", BUNDLED, "--table", out).exit_code == 0
    files = [tmp_path / f"machine-{name}.csv" for name in SHEETS]
    assert all(file.is_file() for file in files)
    with files[0].open() as stream:
        lines = [line for line in stream if not line.startswith("# ")]
    assert len(list(csv.reader(lines))) == 1 + 4      # the header and four wheel ends
    result = run("machine", BUNDLED, "--table", out)
    assert result.exit_code == 2 and "--force" in result.output
    assert run("machine", BUNDLED, "--table", out, "--force").exit_code == 0


def test_a_machine_sweep_table_has_a_row_per_point_as_the_machine_of_each_point(tmp_path):
    out = tmp_path / "sweep.xlsx"
    result = run("sweep", BUNDLED, "--vary", "machine.cog_height_mm=700:1300:3", "--table", out)
    assert result.exit_code == 0, result.output
    notes, header, rows = sheet_rows(out, "points")
    assert f"# Caution: {CAUTIONS}" in notes
    assert column(header, rows, "cog_height_mm") == [700, 1000, 1300]
    edited = tmp_path / "machine.toml"
    text = BUNDLED.read_text().replace("cog_height_mm = 950", "cog_height_mm = 1300", 1)
    edited.write_text(text.replace('"yard_loader_wheel_end.toml"',
                                   json.dumps(str(MACHINES / "yard_loader_wheel_end.toml"))))
    assert column(header, rows, "machine L10m [h]")[-1] == pytest.approx(
        machine_json(edited)["governing_life"]["life_h"], rel=1e-12)


def test_a_machine_comparison_table_has_a_row_per_machine(tmp_path):
    out = tmp_path / "compare.csv"
    other = tmp_path / "taller.toml"
    text = BUNDLED.read_text().replace("cog_height_mm = 950", "cog_height_mm = 1200", 1)
    other.write_text(text.replace('"yard_loader_wheel_end.toml"',
                                  json.dumps(str(MACHINES / "yard_loader_wheel_end.toml"))))
    result = run("compare", BUNDLED, other, "--table", out)
    assert result.exit_code == 0, result.output
    with out.open() as stream:
        rows = list(csv.DictReader(line for line in stream if not line.startswith("# ")))
    assert [row["machine"] for row in rows] == ["1", "2"]
    lives = [machine_json(path)["governing_life"]["life_h"] for path in (BUNDLED, other)]
    assert [float(row["machine L10m [h]"]) for row in rows] == pytest.approx(lives, rel=1e-12)
    assert float(rows[1]["ratio"]) == pytest.approx(lives[1] / lives[0], rel=1e-12)
    assert run("compare", BUNDLED, other, "--plot", tmp_path / "x.png").exit_code == 2
