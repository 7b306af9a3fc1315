"""One log's pieces on several worker processes: the same summary as one after the other.

The pieces are merged in file order whatever the workers' timing, so the summaries are
identical, not just close (common practice for a parallel reduction: a fixed order of
combination makes it deterministic). Bad input deep in a log is reported as by a pass
on one process.
"""

import dataclasses

import numpy as np
import pytest
from logsupport import YARD_LOADER, realistic_log, write_log

from hubload.casefile.machine import load_machine
from hubload.errors import InputError
from hubload.logs.pipeline import PIECE_ROWS, LogOptions, process_log

ROWS = 3 * PIECE_ROWS + 123


@pytest.fixture(scope="module")
def study():
    return load_machine(YARD_LOADER)[0]


@pytest.mark.parametrize("suffix", [".parquet", ".csv"])
def test_a_log_on_two_workers_gives_the_summary_of_one(tmp_path, study, suffix):
    log = write_log(tmp_path / f"log{suffix}", realistic_log(ROWS))
    one, two = (process_log(log, study, LogOptions(chunk_workers=workers))
                for workers in (1, 2))
    assert np.array_equal(one.table.keys, two.table.keys)
    assert np.array_equal(one.table.sums, two.table.sums)
    assert one.peak_static_load_n == two.peak_static_load_n
    assert one.flag_time_s == two.flag_time_s
    for key in one.shaft:
        assert np.array_equal(one.shaft[key], two.shaft[key], equal_nan=True)
    assert dataclasses.asdict(one.cleaning) == dataclasses.asdict(two.cleaning)


def test_a_bad_row_deep_in_a_log_is_named_as_on_one_worker(tmp_path, study):
    columns = realistic_log(ROWS)
    columns["speed_rpm"][ROWS - 50] = np.nan
    log = write_log(tmp_path / "log.parquet", columns)
    messages = []
    for workers in (1, 2):
        with pytest.raises(InputError) as error:
            process_log(log, study, LogOptions(chunk_workers=workers))
        messages.append(str(error.value))
    assert messages[0] == messages[1]
    assert f"row {ROWS - 49}" in messages[0]
