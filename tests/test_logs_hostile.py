"""Hostile logs: duplicate columns, absurd samples, runaway quotes, endless gaps, a log that
breaks its worker. One line and exit 2 each, or a correct result; the row numbers are
counted from 1 over the data rows (the header is not a row), as everywhere in the logs."""

import json

import numpy as np
import pyarrow as pa
import pyarrow.parquet as pq
import pytest
from click.testing import CliRunner
from logsupport import YARD_LOADER, write_csv_text

from hubload.cli import main
from hubload.logs import clean
from hubload.logs.reader import RawChunk

HEADER = "time_s,wheel_load_kN,side_force_kN,tractive_force_kN,speed_rpm"
ROWS = [f"{i},{10 + i % 3},0,1,40" for i in range(60)]


def run(*args):
    return CliRunner().invoke(main, ["spectrum", *map(str, args), "--case-file",
                                     str(YARD_LOADER)])


def one_line_error(*args):
    result = run(*args)
    assert result.exit_code == 2, result.output
    message = result.output.strip()
    assert message.count("\n") == 0 and message.startswith("error: "), message
    assert "Traceback" not in message and "Warning" not in message
    return message


def test_a_repeated_csv_column_is_refused_naming_it(tmp_path):
    # pyarrow would read one of the two 'wheel_load_kN' columns without a word
    text = HEADER + ",wheel_load_kN\n" + "\n".join(row + ",99" for row in ROWS) + "\n"
    message = one_line_error(write_csv_text(tmp_path / "log.csv", text))
    assert "repeated column 'wheel_load_kN' (2 times)" in message


def test_a_repeated_parquet_column_is_refused_naming_it(tmp_path):
    # a Parquet file may hold two columns of one name; the first here is the speed
    count = 60
    arrays = [np.arange(count, dtype=float), np.full(count, 40.0), np.zeros(count),
              np.ones(count), np.full(count, 40.0), np.full(count, 12.0)]
    names = ["time_s", "wheel_load_kN", "side_force_kN", "tractive_force_kN", "speed_rpm",
             "wheel_load_kN"]
    path = tmp_path / "log.parquet"
    pq.write_table(pa.Table.from_arrays([pa.array(a) for a in arrays], names=names), path)
    assert "repeated column 'wheel_load_kN' (2 times)" in one_line_error(path)


def test_an_absurd_sample_is_a_bad_cell_under_the_policy(tmp_path):
    rows = list(ROWS)
    rows[29] = "29,1e300,0,1,40"      # data row 30
    log = write_csv_text(tmp_path / "log.csv", HEADER + "\n" + "\n".join(rows) + "\n")
    message = one_line_error(log)
    assert "row 30, column 'wheel_load_kN': implausible sample 1e+300" in message
    assert "at most 2000" in message
    dropped = run(log, "--gaps", "drop", "--json")
    assert dropped.exit_code == 0, dropped.output
    assert json.loads(dropped.output)["cleaning"]["dropped_rows"] == 1
    filled = run(log, "--gaps", "interpolate", "--json")
    assert filled.exit_code == 0, filled.output
    assert json.loads(filled.output)["cleaning"]["filled_values"] == 1


def test_an_unclosed_quote_names_its_row(tmp_path):
    # the quote opened in data row 30 runs on past the csv module's 128 KB field limit
    text = HEADER + "\n" + "\n".join(ROWS[:29]) + '\n29,"10,0,1,40\n' + ("x" * 100 + "\n") * 1400
    message = one_line_error(write_csv_text(tmp_path / "log.csv", text))
    assert ": row 30: " in message and "quotes" in message


def test_gap_filling_comes_in_bounded_batches_that_keep_every_second():
    # 3,000 gaps of 1,000 s at a 0.01 s interval: 3 million filled samples, never at once
    gaps = 3000
    time_s = np.cumsum(np.tile([0.01, 0.01, 1000.0], gaps))
    columns = {"time_s": time_s, "wheel_load_kN": np.full(time_s.size, 10.0),
               "speed_rpm": np.full(time_s.size, 40.0)}
    cleaner = clean.Cleaner("log.csv", {key: key for key in columns}, "interpolate")
    batches = list(cleaner.run([RawChunk(1, columns)]))
    largest = max(len(batch) for batch in batches)
    assert largest <= clean.FILL_BATCH_SAMPLES + clean.MAX_FILL_SAMPLES
    # zero-order hold: the hold times cover the log from its first to its last stamp
    total = sum(float(np.sum(batch.hold_s)) for batch in batches)
    assert total == pytest.approx(time_s[-1] - time_s[0], rel=1e-12)
    assert cleaner.report.filled_samples > 2_000_000


def test_one_log_that_breaks_its_worker_does_not_stop_a_skipping_fleet(tmp_path, monkeypatch):
    from hubload.logs import fleet

    for name in ("a.csv", "b.csv"):
        write_csv_text(tmp_path / name, HEADER + "\n" + "\n".join(ROWS) + "\n")
    real = fleet.process_log

    def exhausted(path, study, options, on_progress=None):
        if str(path).endswith("a.csv"):
            raise MemoryError
        return real(path, study, options, on_progress)

    monkeypatch.setattr(fleet, "process_log", exhausted)
    result = run(tmp_path, "--jobs", "1", "--skip-bad", "--json")
    assert result.exit_code == 0, result.output
    document = json.loads(result.output)
    assert len(document["logs"]) == 1
    assert "not enough memory" in json.dumps(document["skipped"])
