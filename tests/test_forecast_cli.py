"""`hubload forecast`: distributions from the check's lives, the fleet, the JSON contract.

References are outside the program: the check's own JSON (the lives the forecast must
stand on), ISO 281:2007 table 12 (a1), the closed form of Weibull units in series
(Barlow & Proschan 1965, ch. 2 -- from memory), scipy.stats distributions, and seeded
Monte Carlo simulations of the same fleet (tolerance from their standard error).
"""

import math
from pathlib import Path

import numpy as np
import pytest
from scipy import stats

from clisupport import run, run_json

ROOT = Path(__file__).resolve().parents[1]
SITE_DUMPER = ROOT / "load_cases" / "site_dumper.toml"
LN_090 = math.log(1 / 0.9)
FLEET = {"machines": 300, "wheel_ends_per_machine": 2, "hours_per_year_median": 900,
         "hours_per_year_spread": 0.5, "years": 4, "warranty_years": 2}


def bearing_lives_of_check(path):
    """The governing basis's bearing lives as `check --json` reports them."""
    checked = run_json("check", path)
    return {label: checked["bearings"][label]["l10m_h"] if "l10m_h" in checked["bearings"][label]
            else checked["bearings"][label]["l10_h"] for label in ("outboard", "inboard")}


def test_json_contract_keys(document, write_case_file):
    document["fleet"] = FLEET
    output = run_json("forecast", write_case_file(document))
    assert output["distribution"] == "iso281"
    for unit in output["units"]:
        assert {"name", "b1_h", "b10_h", "b50_h"} <= set(unit)
    fleet = output["fleet"]
    assert {"machines", "expected_failures_in_warranty", "machines_with_claim_in_warranty",
            "band_90", "per_year"} <= set(fleet)
    assert {"low", "high"} <= set(fleet["band_90"])
    assert [row["year"] for row in fleet["per_year"]] == [1, 2, 3, 4]
    assert all({"year", "expected_failures"} <= set(row) for row in fleet["per_year"])
    assert output["cautions"]


def test_bearing_b_lives_follow_iso281_table12_from_the_checks_lives(document, write_case_file):
    # ISO 281:2007 table 12: a1 = 1 at 90 %, 0.25 at 99 % (the table rounds to two
    # decimals); B10 is the check's L10.
    path = write_case_file(document)
    lives = bearing_lives_of_check(path)
    output = run_json("forecast", path)
    for label in ("outboard", "inboard"):
        unit = next(u for u in output["units"] if u["name"] == f"{label} bearing")
        assert unit["b10_h"] == pytest.approx(lives[label], rel=1e-9)
        assert round(unit["b1_h"] / lives[label], 2) == 0.25


def test_a_file_at_99_percent_reliability_spreads_the_same_l10(document, write_case_file):
    # The distribution stands on L10 whatever reliability the check's verdict asks for
    # (a1 scales the life only, ISO 281:2007 9.2).
    at_90 = run_json("forecast", write_case_file(document, "r90.toml"))
    document["project"]["reliability_percent"] = 99
    at_99 = run_json("forecast", write_case_file(document, "r99.toml"))
    for first, second in zip(at_90["units"], at_99["units"]):
        assert second["b10_h"] == pytest.approx(first["b10_h"], rel=1e-9)


def test_two_parameter_wheel_end_is_the_series_closed_form(document, write_case_file):
    # Weibull units of one slope in series: H = sum (t/eta_i)^beta, so B10 =
    # ln(1/0.9)^(1/beta) (sum eta_i^-beta)^(-1/beta) (Barlow & Proschan, from memory).
    beta = 1.2
    path = write_case_file(document)
    lives = bearing_lives_of_check(path)
    output = run_json("forecast", path, "--weibull-slope", beta)
    assert output["distribution"] == "weibull"
    etas = [life / LN_090 ** (1 / beta) for life in lives.values()]
    expected = LN_090 ** (1 / beta) * sum(eta ** -beta for eta in etas) ** (-1 / beta)
    wheel_end = next(u for u in output["units"] if u["name"] == "wheel end")
    assert wheel_end["b10_h"] == pytest.approx(expected, rel=1e-9)
    median = math.log(2) ** (1 / beta) * sum(eta ** -beta for eta in etas) ** (-1 / beta)
    assert wheel_end["b50_h"] == pytest.approx(median, rel=1e-9)


def test_reliability_at_target_matches_scipy(document, write_case_file):
    # ISO 281:2007 9.2 distribution built in scipy: Weibull slope 1.5, loc 0.05 L10.
    path = write_case_file(document)
    lives = bearing_lives_of_check(path)
    output = run_json("forecast", path)
    target = document["project"]["target_life_h"]
    survive = 1.0
    for label, life in lives.items():
        unit = stats.weibull_min(1.5, loc=0.05 * life, scale=0.95 * life / LN_090 ** (1 / 1.5))
        bearing = next(u for u in output["units"] if u["name"] == f"{label} bearing")
        assert bearing["reliability_at_target"] == pytest.approx(unit.sf(target), rel=1e-9)
        survive *= unit.sf(target)
    wheel_end = next(u for u in output["units"] if u["name"] == "wheel end")
    assert wheel_end["reliability_at_target"] == pytest.approx(survive, rel=1e-9)


def test_fleet_counts_match_a_seeded_simulation_of_the_same_fleet(document, write_case_file):
    # Monte Carlo of the fleet (common practice): machines draw lognormal hours per year,
    # each bearing a life from scipy's ISO 281 distribution; tolerance 4 standard errors.
    document["fleet"] = {**FLEET, "warranty_hours": 1500}
    path = write_case_file(document)
    lives = bearing_lives_of_check(path)
    fleet = run_json("forecast", path)["fleet"]
    rng = np.random.default_rng(20261203)
    fleets, machines, bearings = 400, FLEET["machines"], 2 * FLEET["wheel_ends_per_machine"]
    usage = FLEET["hours_per_year_median"] * np.exp(
        FLEET["hours_per_year_spread"] * rng.standard_normal((fleets, machines, 1)))
    life = np.concatenate([stats.weibull_min(1.5, loc=0.05 * l, scale=0.95 * l / LN_090 ** (1 / 1.5))
                           .rvs(size=(fleets, machines, bearings // 2), random_state=rng)
                           for l in lives.values()], axis=-1)
    covered = np.minimum(usage * FLEET["warranty_years"], 1500.0)
    failed = life <= covered
    counts = failed.sum(axis=(1, 2))
    claims = failed.any(axis=2).sum(axis=1)
    for value, simulated in ((fleet["expected_failures_in_warranty"], counts),
                             (fleet["machines_with_claim_in_warranty"], claims)):
        error = simulated.std(ddof=1) / math.sqrt(fleets)
        assert abs(value - simulated.mean()) < 4 * error + 1e-9
    low, high = np.quantile(counts, [0.05, 0.95])
    assert abs(fleet["band_90"]["low"] - low) <= 3 and abs(fleet["band_90"]["high"] - high) <= 3
    first_year = (life <= usage * 1.0).sum(axis=(1, 2))
    error = first_year.std(ddof=1) / math.sqrt(fleets)
    assert abs(fleet["per_year"][0]["first_failures"] - first_year.mean()) < 4 * error


def test_options_override_the_file(document, write_case_file):
    document["fleet"] = FLEET
    output = run_json("forecast", write_case_file(document), "--machines", 600)
    assert output["fleet"]["machines"] == 600
    assert output["fleet"]["wheel_ends_per_machine"] == FLEET["wheel_ends_per_machine"]


def test_no_fleet_gives_distributions_only(document, write_case_file):
    output = run_json("forecast", write_case_file(document))
    assert output["fleet"] is None and output["units"]


def test_bundled_fleet_runs_and_plots(tmp_path):
    out = tmp_path / "forecast.png"
    result = run("forecast", SITE_DUMPER, "--plot", out)
    assert result.exit_code == 0, result.output
    assert "Caution" in result.output and out.stat().st_size > 10_000


@pytest.mark.parametrize("table,key,value,fragment", [
    ("fleet", "machines", 0, "fleet.machines"),
    ("fleet", "hours_per_year_spread", -0.1, "fleet.hours_per_year_spread"),
    ("fleet", "warranty_years", 0, "fleet.warranty_years"),
    ("fleet", "colour", 1, "fleet.colour"),
    ("reliability", "distribution", "gamma", "reliability.distribution"),
    ("reliability", "weibull_slope", 1.3, "reliability.weibull_slope"),
])
def test_bad_fleet_keys_are_one_line_naming_file_and_key(document, write_case_file, table, key,
                                                         value, fragment):
    document["fleet"] = dict(FLEET)
    document.setdefault(table, {})[key] = value
    path = write_case_file(document)
    for command in ("forecast", "check"):
        result = run(command, path)
        assert result.exit_code == 2, result.output
        lines = result.output.strip().splitlines()
        assert len(lines) == 1 and path in lines[0] and fragment in lines[0]


def test_weibull_without_slope_is_named(document, write_case_file):
    document["reliability"] = {"distribution": "weibull"}
    result = run("forecast", write_case_file(document))
    assert result.exit_code == 2 and "reliability.distribution" in result.output


@pytest.mark.parametrize("option,value", [("--machines", 0), ("--hours-per-year-spread", -1),
                                          ("--weibull-slope", 0)])
def test_bad_options_are_one_line_naming_the_option(document, write_case_file, option, value):
    document["fleet"] = FLEET
    result = run("forecast", write_case_file(document), option, value)
    assert result.exit_code == 2
    assert len(result.output.strip().splitlines()) == 1 and option in result.output


def test_missing_fleet_key_with_options_names_it(document, write_case_file):
    result = run("forecast", write_case_file(document), "--machines", 10)
    assert result.exit_code == 2 and "fleet.hours_per_year_median" in result.output


def test_a_sweep_refuses_forecast_keys():
    result = run("sweep", SITE_DUMPER, "--vary", "fleet.machines=1:3:3")
    assert result.exit_code == 2 and "fleet.machines" in result.output


def test_reading_a_file_does_not_load_the_forecasts_libraries():
    # Start-up stays lean (project rule): the [fleet] and [reliability] readers come with every
    # file, scipy only with a forecast or a fit.
    import subprocess
    import sys

    code = ("import sys, hubload.casefile.load; "
            "print(any(name.split('.')[0] == 'scipy' for name in sys.modules))")
    found = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True,
                           check=True)
    assert found.stdout.strip() == "False"
