"""Synthetic field logs of a compact yard loader's front wheel (invented data).

The machine switches between work states (travel empty or loaded, pushing into
a heap, cornering either way, braking, loading at standstill) with random dwell
times; within a state each channel wanders around the state's level (first-order
filtered noise) with occasional short shocks. Nothing here is measured data.

    python tests/benchmarks/gen_log.py /tmp/log.parquet --rows 10000000

writes a log (CSV or Parquet by the suffix); nothing large is committed.
"""

from __future__ import annotations

import argparse

import numpy as np
import pyarrow as pa
import pyarrow.csv as pacsv
import pyarrow.parquet as pq
from scipy.signal import lfilter

# state: share of time, mean dwell [s], wheel load, side force, tractive force [kN], speed [r/min]
STATES = {
    "travel empty": (0.32, 40.0, 11.0, 0.0, 2.0, 80.0),
    "travel loaded": (0.24, 30.0, 17.0, 0.0, 3.0, 55.0),
    "pushing into a heap": (0.10, 8.0, 19.0, 0.0, 10.0, 12.0),
    "cornering outer": (0.11, 6.0, 16.0, 4.5, 2.0, 40.0),
    "cornering inner": (0.11, 6.0, 9.0, -2.5, 1.0, 40.0),
    "braking loaded": (0.04, 3.0, 21.0, 0.0, -8.0, 35.0),
    "loading at standstill": (0.08, 20.0, 23.0, 0.0, 0.0, 0.0),
}
NOISE_KN = (1.2, 0.6, 0.8)
NOISE_RPM = 4.0
SMOOTHING = 0.97
SHOCK_RATE = 0.002


def state_sequence(rows: int, rate_hz: float, rng: np.random.Generator) -> np.ndarray:
    """Index of the work state at each sample (dwell times drawn per visit)."""
    shares = np.array([s[0] for s in STATES.values()])
    dwell_s = np.array([s[1] for s in STATES.values()])
    visit_probability = shares / dwell_s
    visit_probability /= visit_probability.sum()
    states, lengths, total = [], [], 0
    while total < rows:
        batch = rng.choice(len(STATES), size=4096, p=visit_probability)
        length = np.maximum(1, np.round(rng.exponential(dwell_s[batch]) * rate_hz)).astype(int)
        states.append(batch)
        lengths.append(length)
        total += int(length.sum())
    return np.repeat(np.concatenate(states), np.concatenate(lengths))[:rows]


def wander(rows: int, scale: float, rng: np.random.Generator) -> np.ndarray:
    """First-order filtered noise of standard deviation about ``scale``."""
    white = rng.normal(0.0, scale * np.sqrt(1 - SMOOTHING ** 2), rows)
    return lfilter([1.0], [1.0, -SMOOTHING], white)


def synthetic_log(rows: int, rate_hz: float = 10.0, seed: int = 1) -> dict[str, np.ndarray]:
    """Columns time_s, wheel_load_kN, side_force_kN, tractive_force_kN, speed_rpm."""
    rng = np.random.default_rng(seed)
    state = state_sequence(rows, rate_hz, rng)
    levels = np.array([s[2:] for s in STATES.values()])[state]
    wheel = levels[:, 0] + wander(rows, NOISE_KN[0], rng)
    wheel += (rng.random(rows) < SHOCK_RATE) * rng.exponential(6.0, rows)
    side = levels[:, 1] + wander(rows, NOISE_KN[1], rng)
    tractive = levels[:, 2] + wander(rows, NOISE_KN[2], rng)
    moving = levels[:, 3] > 0
    speed = np.where(moving, np.abs(levels[:, 3] + wander(rows, NOISE_RPM, rng)), 0.0)
    return {
        "time_s": np.arange(rows) / rate_hz,
        "wheel_load_kN": np.maximum(wheel, 0.0),
        "side_force_kN": side,
        "tractive_force_kN": tractive,
        "speed_rpm": speed,
    }


def write_log(path: str, columns: dict[str, np.ndarray], chunk_rows: int = 1_000_000) -> None:
    """Write a CSV or Parquet log (by suffix) in chunks."""
    table = pa.table(columns)
    if path.endswith(".parquet"):
        pq.write_table(table, path, row_group_size=chunk_rows)
    else:
        pacsv.write_csv(table, path)


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("path")
    parser.add_argument("--rows", type=int, default=1_000_000)
    parser.add_argument("--rate-hz", type=float, default=10.0)
    parser.add_argument("--seed", type=int, default=1)
    args = parser.parse_args()
    write_log(args.path, synthetic_log(args.rows, args.rate_hz, args.seed))


if __name__ == "__main__":
    main()
