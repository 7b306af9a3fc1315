"""Helpers for the log tests: logs built from a known spectrum, and the realistic generator."""

from __future__ import annotations

import sys
from pathlib import Path

import numpy as np
import pyarrow as pa
import pyarrow.csv as pacsv
import pyarrow.parquet as pq

sys.path.insert(0, str(Path(__file__).parent / "benchmarks"))

import gen_log  # noqa: E402  (the benchmark's generator, shared on purpose)

ROOT = Path(__file__).parent.parent
YARD_LOADER = ROOT / "load_cases" / "yard_loader.toml"
CHANNELS = ("wheel_load_kN", "side_force_kN", "tractive_force_kN", "speed_rpm")


def spectrum_log(cases: list[dict], seconds: float = 1000.0, rate_hz: float = 1.0,
                 repeats: int = 3) -> dict[str, np.ndarray]:
    """A log that holds each case for its share of ``seconds``, the cycle ``repeats`` times.

    Case dicts use the log's channel names; the last row only ends the log.
    """
    samples = [max(1, round(c["time_percent"] / 100 * seconds * rate_hz)) for c in cases]
    columns = {key: np.tile(np.repeat([c.get(key, 0.0) for c in cases], samples), repeats)
               for key in CHANNELS}
    columns = {key: np.append(values, 0.0) for key, values in columns.items()}
    return {"time_s": np.arange(columns["speed_rpm"].size) / rate_hz, **columns}


def write_log(path: Path, columns: dict[str, np.ndarray]) -> str:
    table = pa.table(columns)
    if path.suffix == ".parquet":
        pq.write_table(table, path)
    else:
        pacsv.write_csv(table, path)
    return str(path)


def write_csv_text(path: Path, text: str) -> str:
    path.write_text(text)
    return str(path)


def realistic_log(rows: int, seed: int = 1) -> dict[str, np.ndarray]:
    return gen_log.synthetic_log(rows, seed=seed)
