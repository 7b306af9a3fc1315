"""Folders of logs: per-log spectra, the combined one, process pool and Dask."""

import json

import numpy as np
import pytest
from click.testing import CliRunner
from logsupport import YARD_LOADER, realistic_log, write_log

from hubload.cli import main


def spectrum_json(*args):
    result = CliRunner().invoke(main, ["spectrum", *map(str, args), "--json"])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


def shifted(columns, start_s):
    return {**columns, "time_s": columns["time_s"] - columns["time_s"][0] + start_s}


def without_last_row(columns):
    return {key: values[:-1] for key, values in columns.items()}


@pytest.fixture(scope="module")
def fleet(tmp_path_factory):
    """Three logs of different length and harshness, and their concatenation.

    A log's last row only ends it (it holds no time), so the concatenation drops
    each log's last row and starts the next log at that time stamp.
    """
    folder = tmp_path_factory.mktemp("fleet")
    logs = [realistic_log(rows, seed) for rows, seed in ((6000, 11), (9000, 12), (4000, 13))]
    logs[1] = {**logs[1], "wheel_load_kN": logs[1]["wheel_load_kN"] * 1.3}
    joined, start = [], 0.0
    for index, log in enumerate(logs):
        log = shifted(log, start)
        start = log["time_s"][-1]
        joined.append(log if index == len(logs) - 1 else without_last_row(log))
        write_log(folder / f"machine-{index + 1}.{'parquet' if index % 2 else 'csv'}", log)
    concatenated = {key: np.concatenate([part[key] for part in joined]) for key in logs[0]}
    single = write_log(tmp_path_factory.mktemp("single") / "all.parquet", concatenated)
    return folder, single


def test_fleet_combination_equals_the_concatenated_log(fleet):
    folder, single = fleet
    combined = spectrum_json(folder, "--case-file", YARD_LOADER, "--jobs", "1")
    whole = spectrum_json(single, "--case-file", YARD_LOADER)
    assert combined["duration_h"] == pytest.approx(whole["duration_h"], rel=1e-12)
    for label in ("outboard", "inboard"):
        assert combined["direct"]["bearings"][label]["l10_h"] == pytest.approx(
            whole["direct"]["bearings"][label]["l10_h"], rel=1e-9)
    assert combined["classed"]["system"]["l10_h"] == pytest.approx(
        whole["classed"]["system"]["l10_h"], rel=1e-9)
    assert [c["name"] for c in combined["classed"]["cases"]] == [
        c["name"] for c in whole["classed"]["cases"]]
    assert [c["time_fraction"] for c in combined["classed"]["cases"]] == pytest.approx(
        [c["time_fraction"] for c in whole["classed"]["cases"]], rel=1e-9)


def test_fleet_ranks_the_harshest_log_first_and_weights_by_time(fleet):
    folder, _ = fleet
    document = spectrum_json(folder, "--case-file", YARD_LOADER, "--jobs", "1")
    assert [log["log"].rsplit("/", 1)[-1] for log in document["logs"]] == [
        "machine-1.csv", "machine-2.parquet", "machine-3.csv"]
    assert document["ranking"][0]["log"].endswith("machine-2.parquet")  # 30 % heavier loads
    # time-weighted combination: the pair's damage per hour is the hour-weighted mean
    hours = [log["duration_h"] for log in document["logs"]]
    rates = [1 / log["direct"]["system"]["l10_h"] for log in document["logs"]]
    outboard = sum(h / log["direct"]["bearings"]["outboard"]["l10_h"]
                   for h, log in zip(hours, document["logs"])) / sum(hours)
    assert 1 / document["direct"]["bearings"]["outboard"]["l10_h"] == pytest.approx(outboard)
    assert min(rates) < 1 / document["direct"]["system"]["l10_h"] < max(rates)


def test_process_pool_gives_the_same_results_as_one_process(fleet):
    folder, _ = fleet
    pooled = spectrum_json(folder, "--case-file", YARD_LOADER, "--jobs", "2")
    serial = spectrum_json(folder, "--case-file", YARD_LOADER, "--jobs", "1")
    assert pooled["direct"] == serial["direct"]
    assert pooled["ranking"] == serial["ranking"]


def test_fleet_runs_on_a_dask_cluster(fleet):
    distributed = pytest.importorskip("distributed")
    folder, _ = fleet
    serial = spectrum_json(folder, "--case-file", YARD_LOADER, "--jobs", "1")
    with distributed.LocalCluster(n_workers=1, threads_per_worker=2, processes=False,
                                  dashboard_address=None) as cluster:
        on_cluster = spectrum_json(folder, "--case-file", YARD_LOADER,
                                   "--cluster", cluster.scheduler_address)
    assert on_cluster["direct"] == serial["direct"]
    assert on_cluster["classed"]["system"] == serial["classed"]["system"]


def test_unreachable_cluster_exits_2(fleet, monkeypatch):
    monkeypatch.setattr("hubload.logs.fleet.CONNECT_TIMEOUT_S", 1)
    folder, _ = fleet
    result = CliRunner().invoke(main, ["spectrum", str(folder), "--case-file",
                                       str(YARD_LOADER), "--cluster", "tcp://127.0.0.1:9"])
    assert result.exit_code == 2
    assert "--cluster" in result.output


def test_fleet_writes_one_spectrum_per_log_and_a_combined_one(fleet, tmp_path):
    folder, _ = fleet
    out = tmp_path / "spectra"
    document = spectrum_json(folder, "--case-file", YARD_LOADER, "--out", out, "--jobs", "1")
    assert sorted(p.name for p in out.iterdir()) == [
        "combined.toml", "machine-1.toml", "machine-2.toml", "machine-3.toml"]
    checked = CliRunner().invoke(main, ["check", str(out / "combined.toml"), "--json"])
    assert json.loads(checked.output)["system"]["l10_h"] == pytest.approx(
        document["classed"]["system"]["l10_h"], rel=1e-7)
    again = CliRunner().invoke(main, ["spectrum", str(folder), "--case-file", str(YARD_LOADER),
                                      "--out", str(out), "--jobs", "1"])
    assert again.exit_code == 2 and "--force" in again.output


def test_bad_log_in_a_fleet_stops_the_run_unless_skipped(fleet, tmp_path):
    folder, _ = fleet
    mixed = tmp_path / "mixed"
    mixed.mkdir()
    for path in folder.iterdir():
        (mixed / path.name).write_bytes(path.read_bytes())
    (mixed / "broken.csv").write_text("time_s,wheel_load_kN,speed_rpm\n0,10,5\n0,11,5\n1,9,5\n")
    stopped = CliRunner().invoke(main, ["spectrum", str(mixed), "--case-file", str(YARD_LOADER),
                                        "--jobs", "1"])
    assert stopped.exit_code == 2
    assert "broken.csv: row 2, column 'time_s'" in stopped.output
    assert len(stopped.output.strip().splitlines()) == 1  # one line, like every input error
    skipped = spectrum_json(mixed, "--case-file", YARD_LOADER, "--jobs", "1", "--skip-bad")
    assert len(skipped["logs"]) == 3 and len(skipped["skipped"]) == 1


def test_fleet_mix_weights_each_log_by_its_share_of_machines(fleet, tmp_path):
    # Palmgren-Miner is linear in time: a fleet in which a share w_i of the machines works like
    # log i wears at sum w_i D_i per hour, D_i a log's damage per hour (whatever its length).
    folder, _ = fleet
    logs = json.loads(CliRunner().invoke(main, ["spectrum", str(folder), "--case-file",
                                                str(YARD_LOADER), "--jobs", "1", "--json"]).output)
    rates = {entry["log"].split("/")[-1]: {label: 1 / entry["direct"]["bearings"][label]["l10_h"]
                                           for label in ("outboard", "inboard")}
             for entry in logs["logs"]}
    shares = {"machine-1.csv": 1, "machine-2.parquet": 3, "machine-3.csv": 0}
    weights = tmp_path / "mix.csv"
    weights.write_text("log,share\n" + "".join(f"{k},{v}\n" for k, v in shares.items()))
    mixed = spectrum_json(folder, "--case-file", YARD_LOADER, "--jobs", "1", "--weights",
                          weights)
    for label in ("outboard", "inboard"):
        expected = sum(shares[name] / 4 * rates[name][label] for name in shares)
        assert 1 / mixed["direct"]["bearings"][label]["l10_h"] == pytest.approx(expected,
                                                                                rel=1e-9)
    assert mixed["fleet_mix"] == {"machine-1.csv": 0.25, "machine-2.parquet": 0.75,
                                  "machine-3.csv": 0.0}
    first = mixed["ranking"][0]
    assert {"s0", "shaft_min_safety", "dominant_class", "governing_life"} <= set(first)


@pytest.mark.parametrize("text, where", [
    ("log,share\nmachine-1.csv,1\n", "no share for"),
    ("log,share\nnope.csv,1\nmachine-1.csv,1\nmachine-2.parquet,1\nmachine-3.csv,1\n",
     "row 2, column 1"),
    ("log,share\nmachine-1.csv,-1\nmachine-2.parquet,1\nmachine-3.csv,1\n", "row 2, column 2"),
    ("name,count\n", "row 1"),
])
def test_bad_fleet_mix_names_the_row(fleet, tmp_path, text, where):
    folder, _ = fleet
    weights = tmp_path / "mix.csv"
    weights.write_text(text)
    found = CliRunner().invoke(main, ["spectrum", str(folder), "--case-file", str(YARD_LOADER),
                                      "--jobs", "1", "--weights", str(weights)])
    assert found.exit_code == 2 and where in found.output and "mix.csv" in found.output
