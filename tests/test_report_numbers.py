"""Numbers of the JSON outputs: RFC 8259 (JSON), section 6, permits neither Infinity nor NaN,
so every non-finite value must come out as null and every finite one unchanged."""

import json
import math

import numpy as np
from hypothesis import given
from hypothesis import strategies as st

from hubload.report.numbers import hours, json_number, json_rows, life_h

VALUES = st.floats(allow_nan=True, allow_infinity=True, width=64)


@given(st.lists(VALUES, min_size=1, max_size=20), st.lists(st.booleans(), min_size=1,
                                                          max_size=1))
def test_per_case_rows_are_strict_json_with_null_for_non_finite_values(values, flag):
    rows = json_rows({"value": np.array(values), "shared": 2.5,
                      "flag": np.array(flag * len(values))}, len(values))
    json.dumps(rows, allow_nan=False)  # RFC 8259 section 6: raises on inf or NaN
    for row, value in zip(rows, values, strict=True):
        assert row["value"] == (value if math.isfinite(value) else None)
        assert row["value"] == json_number(value)
        assert row["shared"] == 2.5 and row["flag"] is flag[0]


def test_a_null_life_reads_back_as_infinite_and_a_zero_life_stays_zero():
    # The JSON contract writes an infinite life as null (docs/json-output.md).
    assert life_h(None) == math.inf and life_h(0.0) == 0.0
    assert hours(None) == "infinite" and hours(0.0) == "0" and hours(math.nan) == "-"
