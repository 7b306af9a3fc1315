"""`hubload forecast` and `hubload field --against` on a machine file.

Sources: series systems R = product of R_i (O'Connor & Kleyner, Practical Reliability
Engineering, 5th ed., ch. 6, "series reliability"); k identical two-parameter Weibull units
in series have eta k^(-1/beta) (same chapter: the minimum of Weibull lives); ISO 281:2007
9.2 for the distribution behind a1 (three-parameter Weibull, slope 1.5, minimum life
0.05 L10, built here with scipy.stats.weibull_min); the mean of a Poisson-binomial count is
the sum of its probabilities (linearity of expectation); a seeded Monte Carlo simulation of
the fleet, tolerance from its own standard error (common practice).
"""

import math

import numpy as np
import pytest
from hypothesis import assume, given, settings, strategies as st
from scipy import optimize, stats

from machinesupport import MACHINES, machine_document, operation, run, write_machine
from clisupport import run_json

BUNDLED = MACHINES / "yard_loader_machine.toml"
WHEEL_ENDS = ("front left", "front right", "rear left", "rear right")
LN_090 = math.log(1 / 0.9)
FLEET = {"machines": 250, "hours_per_year_median": 1100, "hours_per_year_spread": 0.5,
         "years": 3, "warranty_years": 2}


def iso281(l10_h):
    """ISO 281:2007 9.2's distribution of a bearing with rating life l10_h, from scipy."""
    return stats.weibull_min(1.5, loc=0.05 * l10_h, scale=0.95 * l10_h / LN_090 ** (1 / 1.5))


def bearing_l10s(machine: dict) -> dict[str, list[float]]:
    """Each wheel end's bearing lives L10m (reliability 90 %, so a1 = 1) from `machine`."""
    return {w["name"]: [w["bearings"][b]["l10m_h"] for b in ("outboard", "inboard")]
            for w in machine["wheel_ends"]}


def series_b10(l10s) -> float:
    survive = lambda t: np.prod([iso281(l).sf(t) for l in l10s])  # noqa: E731
    return optimize.brentq(lambda t: survive(t) - 0.9, 1e-3, 1e9, xtol=1e-9, rtol=1e-12)


def units_of(document: dict) -> dict:
    return {unit["name"]: unit for unit in document["units"]}


def test_every_wheel_end_and_the_machine_are_series_systems_of_their_bearings():
    lives = bearing_l10s(run_json("machine", BUNDLED))
    units = units_of(run_json("forecast", BUNDLED))
    assert [u["kind"] for u in units.values()] == ["wheel end"] * 4 + ["machine"]
    for name in WHEEL_ENDS:
        assert units[name]["b10_h"] == pytest.approx(series_b10(lives[name]), rel=1e-6)
    every = [life for pair in lives.values() for life in pair]
    assert units["machine (4 wheel ends)"]["b10_h"] == pytest.approx(series_b10(every), rel=1e-6)


def test_a_mirror_symmetric_machine_gives_equal_left_and_right_wheel_ends():
    # Every operation of the bundled machine is spent half mirrored: left and right alike.
    units = units_of(run_json("forecast", BUNDLED))
    for axle in ("front", "rear"):
        left, right = units[f"{axle} left"], units[f"{axle} right"]
        for key in ("b1_h", "b10_h", "b50_h"):
            assert left[key] == pytest.approx(right[key], rel=1e-9)


def test_four_identical_weibull_wheel_ends_in_series_have_eta_times_4_to_minus_1_over_beta(
        tmp_path):
    # CoG midway between the axles, equal axles, straight level travel: four equal wheel
    # ends; with a two-parameter Weibull (slope 1.3) the machine's B10 is 4^(-1/1.3) of one.
    document = machine_document([operation(speed_kmh=8.0)], machine__cog_from_front_axle_mm=1200.0)
    path = write_machine(tmp_path, document)
    units = units_of(run_json("forecast", path, "--weibull-slope", 1.3))
    wheel_end = units["front left"]["b10_h"]
    for name in WHEEL_ENDS:
        assert units[name]["b10_h"] == pytest.approx(wheel_end, rel=1e-9)
    machine = units["machine (4 wheel ends)"]["b10_h"]
    assert machine == pytest.approx(wheel_end * 4 ** (-1 / 1.3), rel=1e-6)


def test_forecast_of_a_machine_equals_its_written_wheel_files_combined(tmp_path):
    folder = tmp_path / "wheels"
    assert run("machine", BUNDLED, "--write-wheel-files", folder).exit_code == 0
    fleet_options = ["--machines", 250, "--hours-per-year-median", 1100,
                     "--warranty-years", 2]
    machine = run_json("forecast", BUNDLED, *fleet_options, "--hours-per-year-spread", 0)
    units = units_of(machine)
    l10s = []
    for name in WHEEL_ENDS:
        alone = run_json("forecast", folder / (name.replace(" ", "_") + ".toml"))
        alone_units = units_of(alone)
        assert units[name]["b10_h"] == pytest.approx(alone_units["wheel end"]["b10_h"],
                                                     rel=1e-9)
        l10s += [alone_units[f"{b} bearing"]["l10_h"] for b in ("outboard", "inboard")]
    # No usage spread: each machine runs 2,200 h in the warranty. Expected first failures
    # = sum of the bearings' F; machines with a claim = machines x (1 - product of R).
    fleet = machine["fleet"]
    probabilities = np.array([iso281(l).cdf(2200.0) for l in l10s])
    assert fleet["expected_failures_in_warranty"] == pytest.approx(
        250 * probabilities.sum(), rel=1e-6)
    assert fleet["machines_with_claim_in_warranty"] == pytest.approx(
        250 * (1 - np.prod(1 - probabilities)), rel=1e-6)
    assert fleet["bearings_per_machine"] == 8 and fleet["wheel_ends_per_machine"] == 4


def test_the_machine_fleet_matches_a_seeded_simulation_of_the_same_fleet(tmp_path):
    # Monte Carlo (common practice): each machine draws lognormal hours per year, each of its
    # eight bearings a life from scipy's ISO 281 distribution; tolerance 4 standard errors.
    lives = bearing_l10s(run_json("machine", BUNDLED))
    options = [f"--{key.replace('_', '-')}={value}" for key, value in FLEET.items()]
    fleet = run_json("forecast", BUNDLED, *options, "--warranty-hours", 3000)["fleet"]
    rng = np.random.default_rng(20261203)
    fleets, machines = 300, FLEET["machines"]
    usage = FLEET["hours_per_year_median"] * np.exp(
        FLEET["hours_per_year_spread"] * rng.standard_normal((fleets, machines, 1)))
    life = np.stack([iso281(l).rvs(size=(fleets, machines), random_state=rng)
                     for pair in lives.values() for l in pair], axis=-1)
    failed = life <= np.minimum(usage * FLEET["warranty_years"], 3000.0)
    counts, claims = failed.sum(axis=(1, 2)), failed.any(axis=2).sum(axis=1)
    for value, simulated in ((fleet["expected_failures_in_warranty"], counts),
                             (fleet["machines_with_claim_in_warranty"], claims)):
        assert abs(value - simulated.mean()) < 4 * simulated.std(ddof=1) / math.sqrt(fleets)


def test_a_machine_file_refuses_wheel_ends_per_machine(tmp_path):
    document = machine_document([operation()])
    document["fleet"] = {**FLEET, "wheel_ends_per_machine": 4}
    result = run("forecast", write_machine(tmp_path, document))
    assert result.exit_code == 2
    assert "fleet.wheel_ends_per_machine" in result.output
    assert len(result.output.strip().splitlines()) == 1
    result = run("forecast", BUNDLED, "--wheel-ends-per-machine", 2)
    assert result.exit_code == 2 and "--wheel-ends-per-machine" in result.output


def test_a_wheel_end_file_with_a_fleet_is_refused(tmp_path):
    path = write_machine(tmp_path, machine_document([operation()]))
    wheel_end = tmp_path / "wheel_end.toml"
    wheel_end.write_text(wheel_end.read_text() + "\n[fleet]\nmachines = 3\n")
    result = run("forecast", path)
    assert result.exit_code == 2 and "[fleet]" in result.output


def field_file(tmp_path, rows, position=True):
    header = "hours,status" + (",position" if position else "")
    path = tmp_path / "field.csv"
    path.write_text("\n".join([header] + rows) + "\n")
    return path


def predicted(tmp_path, rows, position=True) -> dict:
    data = field_file(tmp_path, rows, position)
    return run_json("field", data, "--against", BUNDLED)["against"]


def test_field_against_a_machine_predicts_the_wheel_end_of_the_rows_positions(tmp_path):
    lives = bearing_l10s(run_json("machine", BUNDLED))
    failures = ["900,failed", "1500,failed", "2500,failed", "4000,suspended"]
    only_rear = predicted(tmp_path, [f"{row},rear left" for row in failures])
    assert only_rear["predicted_unit"] == "rear left"
    assert only_rear["predicted_b10_h"] == pytest.approx(series_b10(lives["rear left"]),
                                                         rel=1e-6)
    # Rows from all four positions (or no position column): the wheel end drawn from them is
    # the mixture F = sum share_i F_i (law of total probability).
    for against in (predicted(tmp_path, failures, position=False),
                    predicted(tmp_path, [f"{row},{name}" for row, name in
                                         zip(failures, WHEEL_ENDS)])):
        mixed = lambda t: np.mean([1 - np.prod([iso281(l).sf(t) for l in lives[n]])  # noqa
                                   for n in WHEEL_ENDS])
        expected = optimize.brentq(lambda t: mixed(t) - 0.1, 1.0, 1e7, rtol=1e-12)
        assert against["predicted_b10_h"] == pytest.approx(expected, rel=1e-6)


def test_field_positions_that_name_no_wheel_end_of_the_machine_are_refused(tmp_path):
    data = field_file(tmp_path, ["900,failed,front left", "1500,failed,FL"])
    result = run("field", data, "--against", BUNDLED)
    assert result.exit_code == 2
    assert "row 3, column position" in result.output and "'FL'" in result.output


def test_a_machine_sweep_refuses_a_key_of_the_fleet():
    result = run("sweep", BUNDLED, "--vary", "fleet.machines=100:200:2")
    assert result.exit_code == 2 and "enters only `hubload forecast`" in result.output


@settings(max_examples=40, deadline=None)
@given(lives=st.lists(st.floats(100.0, 1e5), min_size=1, max_size=4),
       weights=st.lists(st.integers(0, 5), min_size=4, max_size=4),
       p=st.sampled_from([0.01, 0.1, 0.5]))
def test_the_mixtures_b_life_is_where_the_weighted_failure_probabilities_reach_p(
        lives, weights, p):
    # Law of total probability: F_mix(t) = sum w_i F_i(t); F_mix(B_p) = p, and B_p lies
    # between the shortest and the longest unit's own B_p (each F_i is monotonic).
    from hubload.model.reliability import LifeDistribution
    from hubload.studies.machine_forecast import mixture_b_life_h

    weights = weights[:len(lives)]
    assume(sum(weights) > 0)
    shares = [w / sum(weights) for w in weights]
    units = [(share, (LifeDistribution("iso281", life, 1.5),)) for share, life in
             zip(shares, lives)]
    found = mixture_b_life_h(units, p)
    mixed = sum(share * iso281(life).cdf(found) for share, life in zip(shares, lives))
    assert mixed == pytest.approx(p, rel=1e-6)
    own = [iso281(life).ppf(p) for share, life in zip(shares, lives) if share > 0]
    assert min(own) * (1 - 1e-9) <= found <= max(own) * (1 + 1e-9)
