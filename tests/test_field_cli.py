"""`hubload field`: Weibull fits of field data files, the prediction beside them, bad input.

References: lifelines' WeibullFitter (an independent implementation of censored maximum
likelihood), Lieblein & Zelen's (1956) bearing data as fitted by Lawless (2003), the check's
own JSON for the predicted lives, Nelson (1985) for the zero-failure Weibayes bound.
"""

import math
import warnings
from pathlib import Path

import numpy as np
import pytest

from clisupport import run, run_json

ROOT = Path(__file__).resolve().parents[1]
FIELD_RETURNS = ROOT / "load_cases" / "field_returns.csv"
SITE_DUMPER = ROOT / "load_cases" / "site_dumper.toml"
LIEBLEIN_ZELEN = ROOT / "tests" / "data" / "lieblein_zelen_1956.csv"
LN_090 = math.log(1 / 0.9)


def write_rows(path, rows, header="hours,status"):
    path.write_text(header + "\n" + "\n".join(",".join(str(c) for c in row) for row in rows) + "\n")
    return path


def lieblein_zelen_hours():
    lines = [line for line in LIEBLEIN_ZELEN.read_text().splitlines()
             if line and not line.startswith("#")]
    return [float(value) for value in lines[1:]]


def test_lieblein_zelen_through_the_command_matches_lawless(tmp_path):
    # Lawless, Statistical Models and Methods for Lifetime Data (2nd ed. 2003), example 5.2.2
    # (from memory): maximum likelihood beta 2.102, eta 81.88 (million revolutions).
    data = write_rows(tmp_path / "lz.csv", [(t, "failed") for t in lieblein_zelen_hours()])
    fit = run_json("field", data)["weibull"]
    assert fit["method"] == "maximum-likelihood"
    assert round(fit["beta"], 3) == 2.102 and round(fit["eta_h"], 2) == 81.88
    assert fit["failures"] == 23 and fit["suspensions"] == 0


def test_censored_fit_matches_lifelines_weibull_fitter():
    # lifelines' WeibullFitter maximises the same censored likelihood independently.
    from lifelines import WeibullFitter

    lines = [line.split(",") for line in FIELD_RETURNS.read_text().splitlines()
             if line and not line.startswith("#")][1:]
    hours = np.array([float(line[0]) for line in lines])
    failed = np.array([line[1] == "failed" for line in lines])
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        reference = WeibullFitter().fit(hours, failed)
    fit = run_json("field", FIELD_RETURNS)["weibull"]
    assert fit["beta"] == pytest.approx(reference.rho_, rel=1e-4)
    assert fit["eta_h"] == pytest.approx(reference.lambda_, rel=1e-4)
    assert fit["b10_h"] == pytest.approx(reference.lambda_ * LN_090 ** (1 / reference.rho_),
                                         rel=1e-4)
    assert fit["b10_low_h"] < fit["b10_h"] < fit["b10_high_h"]


def test_json_contract_and_ratio_to_the_prediction():
    output = run_json("field", FIELD_RETURNS, "--against", SITE_DUMPER)
    weibull = output["weibull"]
    assert {"method", "beta", "eta_h", "b10_h", "b10_low_h", "b10_high_h", "failures",
            "suspensions"} <= set(weibull)
    assert weibull["failures"] == 16 and weibull["suspensions"] == 104
    against = output["against"]
    assert {"predicted_b10_h", "ratio"} <= set(against)
    assert against["ratio"] == pytest.approx(weibull["b10_h"] / against["predicted_b10_h"])
    forecast = run_json("forecast", SITE_DUMPER)
    wheel_end = next(u for u in forecast["units"] if u["name"] == "wheel end")
    assert against["predicted_b10_h"] == pytest.approx(wheel_end["b10_h"], rel=1e-12)
    assert output["cautions"]


def test_calibration_factor_from_the_field_scales_the_forecast(tmp_path):
    # The ratio carried into forecast multiplies every life: the wheel end's B10 becomes the
    # field's B10 (its definition, ISO 281's distribution scales with L10).
    ratio = run_json("field", FIELD_RETURNS, "--against", SITE_DUMPER)["against"]
    forecast = run_json("forecast", SITE_DUMPER, "--calibration-factor", ratio["ratio"])
    wheel_end = next(u for u in forecast["units"] if u["name"] == "wheel end")
    assert wheel_end["b10_h"] == pytest.approx(ratio["ratio"] * ratio["predicted_b10_h"],
                                               rel=1e-9)


def test_xlsx_reads_like_csv(tmp_path):
    from openpyxl import Workbook

    workbook = Workbook()
    sheet = workbook.active
    sheet.append(["Hours", "Status", "Unit", "Position"])
    rows = [(120.0, "failed", "A1", "front left"), (340, "suspended", "A2", "front right"),
            (410.5, "failed", "A3", "rear left"), (800, "Suspended", "A4", "rear right")]
    for row in rows:
        sheet.append(list(row))
    workbook.save(tmp_path / "returns.xlsx")
    from_xlsx = run_json("field", tmp_path / "returns.xlsx")
    csv_path = write_rows(tmp_path / "returns.csv", [r[:2] for r in rows])
    from_csv = run_json("field", csv_path)
    assert from_xlsx["weibull"]["beta"] == from_csv["weibull"]["beta"]
    assert from_xlsx["positions"]["front left"] == {"failures": 1, "suspensions": 0}


def test_no_failures_is_a_clear_message_with_the_weibayes_bound(tmp_path):
    # Nelson (1985): with no failure, eta >= (2 sum t^beta / chi2_0.90(2))^(1/beta);
    # chi2_0.90(2) = -2 ln 0.10 (the chi-square of 2 degrees of freedom is exponential).
    hours = [500.0, 800.0, 1200.0, 1500.0]
    data = write_rows(tmp_path / "none.csv", [(t, "suspended") for t in hours])
    result = run("field", data)
    assert result.exit_code == 2
    line = result.output.strip()
    assert len(line.splitlines()) == 1 and str(data) in line and "needs at least 2" in line
    eta_low = (2 * sum(t ** 1.5 for t in hours) / (-2 * math.log(0.10))) ** (1 / 1.5)
    assert f"B10 >= {eta_low * LN_090 ** (1 / 1.5):,.0f} h" in line
    estimate = run_json("field", data, "--weibayes-slope", 1.5)["weibull"]
    assert estimate["method"] == "weibayes" and estimate["b10_h"] is None
    assert estimate["b10_low_h"] == pytest.approx(eta_low * LN_090 ** (1 / 1.5), rel=1e-9)


def test_plot_is_written(tmp_path):
    out = tmp_path / "weibull.png"
    result = run("field", FIELD_RETURNS, "--against", SITE_DUMPER, "--plot", out)
    assert result.exit_code == 0, result.output
    assert "Caution" in result.output and out.stat().st_size > 10_000


@pytest.mark.parametrize("rows,header,where", [
    ([(100, "failed"), (-5, "failed"), (300, "failed")], "hours,status", "row 3, column hours"),
    ([(100, "failed"), (200, "broken")], "hours,status", "row 3, column status"),
    ([(100, "failed"), ("nan", "failed")], "hours,status", "row 3, column hours"),
    ([(100, "failed"), ("", "failed")], "hours,status", "row 3, column hours"),
    ([(100, "failed")], "hours,state", "row 1, column 2"),
    ([(100, "failed")], "hours", "row 1"),
    ([(100, "failed"), (200, "suspended")], "hours,status", "column status"),
])
def test_bad_input_is_one_line_naming_file_row_and_column(tmp_path, rows, header, where):
    data = write_rows(tmp_path / "bad.csv", rows, header)
    result = run("field", data)
    assert result.exit_code == 2, result.output
    lines = result.output.strip().splitlines()
    assert len(lines) == 1 and str(data) in lines[0] and where in lines[0]


@pytest.mark.parametrize("name", ["missing.csv", "returns.txt"])
def test_missing_or_unknown_files_are_one_line(tmp_path, name):
    result = run("field", tmp_path / name)
    assert result.exit_code == 2 and len(result.output.strip().splitlines()) == 1


@pytest.mark.parametrize("content,where", [
    ('hours,status\n"100,failed\n', "row 2"),
    ("hours,status,hours\n100,failed\n", "row 1, column 3"),
    ("hours,status\n100,failed\n100,failed\n300,suspended\n", "column hours"),
    ("hours,status\n1e300,failed\n200,failed\n", "row 2, column hours"),
    ("", "empty file"),
    ("hours,status\n", "no data rows"),
])
def test_hostile_csv_is_one_line(tmp_path, content, where):
    data = tmp_path / "hostile.csv"
    data.write_text(content)
    result = run("field", data)
    assert result.exit_code == 2, result.output
    lines = result.output.strip().splitlines()
    assert len(lines) == 1 and str(data) in lines[0] and where in lines[0]


def test_a_damaged_workbook_is_one_line(tmp_path):
    data = tmp_path / "returns.xlsx"
    data.write_bytes(bytes(range(256)) * 8)
    result = run("field", data)
    assert result.exit_code == 2 and len(result.output.strip().splitlines()) == 1
