"""One pass over one log: direct damage and dwell classing, chunk by chunk.

Every chunk of clean samples is evaluated by the engine as a batch of load cases, in
cache-sized pieces (engine.samples: only the per-sample lives and loads a log needs);
the per-sample Palmgren-Miner damage (hold time / case life) of each bearing and the
classing weights go into a dwell table. Memory stays bounded by the chunk size and the
number of occupied classes; there is no loop per row.
"""

from __future__ import annotations

import dataclasses
import functools
from dataclasses import dataclass, field
from pathlib import Path

import numpy as np

from hubload.domain.study import Study
from hubload.engine.samples import SampleLives, sample_lives
from hubload.errors import InputError
from hubload.logs.clean import Cleaner, CleaningReport, Samples
from hubload.logs import shaft
from hubload.logs.columns import ColumnPlan, plan_columns
from hubload.logs.reader import counted, headers, read_chunks, row_count
from hubload.logs.samples import (FLAGS, flag_time_s, operating_points, sample_cases,
                                  sample_temperature_c, with_cases)
from hubload.model import dwell, iso281
from hubload.units import KN, SECONDS_PER_HOUR

CLASS_CHANNELS = ("wheel_load_kN", "side_force_kN", "tractive_force_kN", "speed_rpm")
# The side force acts a loaded radius below the axis: its couple dominates the
# bearing reactions, so it gets the finest classes. Speed only converts hours to
# revolutions, which the classes keep exactly, so it needs the fewest.
DEFAULT_CLASSES = {"wheel_load_kN": 16, "side_force_kN": 32, "tractive_force_kN": 12,
                   "speed_rpm": 8}
# finest class width 2**-6 = 1/64 kN or r/min: below any sensor's resolution
MIN_EXPONENTS = np.full(len(CLASS_CHANNELS), -6)
LABELS = ("outboard", "inboard")
FORCES = CLASS_CHANNELS[:3]
LEVEL_EXPONENT = iso281.LIFE_EXPONENT_ROLLER
WEIGHTS = ("time_s", "revolutions",
           *(f"revolutions_x_power_{key}" for key in FORCES),
           *(f"time_x_{key}" for key in FORCES),
           "revolutions_x_temperature_C", "time_x_temperature_C",
           *(f"damage_{label}" for label in LABELS),
           *(f"damage_modified_{label}" for label in LABELS))
KAPPA_FLAG = "kappa_outside_scope"
# samples evaluated at once: a few MB of temporaries (measured: 16-32 k rows run about a
# third faster per row than 64 k, whose temporaries spill out of a 2 MB L2 cache)
PIECE_ROWS = 16_384


@dataclass(frozen=True)
class LogOptions:
    """How to read and class a log (plain data: it travels to worker processes)."""

    mapping: dict[str, str] = field(default_factory=dict)
    gaps: str = "error"
    max_gap_s: float | None = None
    classes: tuple[int, ...] = tuple(DEFAULT_CLASSES.values())


@dataclass(frozen=True)
class LogSummary:
    """Everything the outputs need from one log (or a merged fleet)."""

    name: str
    plan: ColumnPlan | None
    cleaning: CleaningReport
    table: dwell.DwellTable
    peak_static_load_n: dict[str, float]
    flag_time_s: dict[str, float]
    logged_temperature: bool = False
    weights: tuple[str, ...] = WEIGHTS               # names of the table's sums, in order
    shaft: dict[str, np.ndarray] | None = None      # shaft.chunk_extremes over the log

    def total(self, weight: str) -> float:
        return float(np.sum(self.table.sums[self.weights.index(weight)]))

    @property
    def duration_h(self) -> float:
        return self.total("time_s") / SECONDS_PER_HOUR


def parse_classes(options: tuple[str, ...] | list[str]) -> tuple[int, ...]:
    """``N`` (every channel) or ``CHANNEL=N`` strings -> classes per class channel."""
    classes = dict(DEFAULT_CLASSES)
    for option in options:
        key, separator, count = option.rpartition("=")
        targets = [key.strip()] if separator else list(classes)
        if separator and key.strip() not in classes:
            raise InputError(f"unknown channel {key.strip()!r}; classed channels: "
                             + ", ".join(classes), key_path="--classes")
        try:
            number = int(count)
        except ValueError:
            number = 0
        if not dwell.MIN_CLASSES <= number <= 1024:
            raise InputError(f"expected a whole number of classes from {dwell.MIN_CLASSES} "
                             f"to 1024, got {count!r}", key_path="--classes")
        classes.update({target: number for target in targets})
    return tuple(classes[key] for key in CLASS_CHANNELS)


def process_log(path: str | Path, study: Study, options: LogOptions,
                on_progress=None) -> LogSummary:
    """Read, clean, integrate and class one log; ``on_progress(rows, total rows or None)``
    after each chunk (hubload.progress).

    Every sample is evaluated by the ISO 281 rule for the pair, whatever the study's method:
    the refined method solves the log's classes instead (logs.spectrum), not millions of rows.
    One process, one thread (measured: worker threads gain nothing, as the per-sample
    path's short numpy calls keep taking the GIL; forked worker processes lost time on a
    10-million-row log, where the reader's pages shared with them are copied on write).
    """
    path = Path(path)
    study = dataclasses.replace(study, method="iso281")
    plan = plan_columns(headers(path), options.mapping, str(path),
                        has_motor=study.motor is not None, has_vehicle=study.vehicle is not None,
                        has_lubrication=study.lubrication is not None)
    cleaner = Cleaner(str(path), plan.headers, options.gaps, options.max_gap_s)
    weight_names = WEIGHTS + shaft.damage_names(study)
    table = dwell.empty_table(len(CLASS_CHANNELS), len(weight_names), MIN_EXPONENTS)
    peak = dict.fromkeys(LABELS, 0.0)
    shaft_extremes = None
    flagged = dict.fromkeys((*FLAGS, KAPPA_FLAG), 0.0)
    chunks = read_chunks(path, plan.headers)
    if on_progress is not None:
        chunks = counted(chunks, row_count(path), on_progress)
    for samples in cleaner.run(chunks):
        # the pieces write their classing inputs into the chunk's arrays, classed at once
        values = np.empty((len(CLASS_CHANNELS), len(samples)))
        weights = np.empty((len(weight_names), len(samples)))
        for piece in pieces(len(samples)):
            part = chunk_part(samples.take(piece), plan, study, str(path),
                              (values[:, piece], weights[:, piece]))
            for flag, seconds in part.flag_time_s.items():
                flagged[flag] += seconds
            peak = {label: max(peak[label], part.peak_static_load_n[label]) for label in LABELS}
            shaft_extremes = shaft.worst(shaft_extremes, part.shaft)
        table = dwell.add_samples(table, values, weights, options.classes, MIN_EXPONENTS)
    cleaning = cleaner.report
    cleaning.notes[:0] = plan.notes
    return LogSummary(name=str(path), plan=plan, cleaning=cleaning, table=table,
                      peak_static_load_n=peak, flag_time_s=flagged,
                      logged_temperature="temperature_C" in plan.headers,
                      weights=weight_names, shaft=shaft_extremes)


def pieces(size: int, rows: int = PIECE_ROWS) -> list[slice]:
    """Consecutive slices of at most ``rows`` samples: the per-sample path's dozens of
    temporary arrays then stay in the processor's cache."""
    return [slice(start, min(start + rows, size)) for start in range(0, size, rows)]


@dataclass(frozen=True)
class ChunkPart:
    """What one piece of samples adds to a log's summary besides its classing inputs:
    flagged time, peak static loads and shaft extremes."""

    flag_time_s: dict[str, float]
    peak_static_load_n: dict[str, float]
    shaft: dict[str, np.ndarray] | None


def chunk_part(samples: Samples, plan: ColumnPlan, study: Study, file: str,
               out: tuple[np.ndarray, np.ndarray]) -> ChunkPart:
    """Operating points, per-sample lives and damage of a piece; its classed values and
    weights (class_inputs) go into ``out``."""
    points = operating_points(samples, plan, study, file)
    cases = sample_cases(points, samples.hold_s)
    flagged = flag_time_s(points, samples.hold_s)
    temperature_c = sample_temperature_c(samples, study)
    lives = sample_lives(with_cases(study, cases, temperature_c))
    hold_h = samples.hold_s / SECONDS_PER_HOUR
    damages = [iso281.damage_rate_per_hour(hold_h, life_h)
               for life_h in case_lives(lives)] + shaft.sample_damages(lives, hold_h)
    flagged[KAPPA_FLAG] = kappa_outside_time_s(lives, samples.hold_s)
    class_inputs(cases, samples.hold_s, temperature_c, damages, out)
    return ChunkPart(
        flag_time_s=flagged,
        peak_static_load_n={label: float(np.max(lives.bearings[label].static_equivalent_n))
                            for label in LABELS},
        shaft=shaft.chunk_extremes(lives))


def case_lives(lives: SampleLives) -> list[np.ndarray]:
    """Per-sample L10 [h] of each bearing, then L10m (inf without lubrication)."""
    return ([lives.bearings[label].case_life_h for label in LABELS]
            + [lives.bearings[label].modified_life_h for label in LABELS])


def kappa_outside_time_s(lives: SampleLives, hold_s: np.ndarray) -> float:
    """Hold time [s] of samples where either bearing runs at kappa < 0.1."""
    if not lives.modified:
        return 0.0
    outside = np.any([lives.bearings[label].kappa_outside_scope for label in LABELS], axis=0)
    return float(np.sum(hold_s[outside]))


def class_inputs(cases, hold_s: np.ndarray, temperature_c: np.ndarray,
                 damages: list[np.ndarray], out: tuple[np.ndarray, np.ndarray]):
    """Classed values (kN, r/min) and the per-sample weights in the order of WEIGHTS
    (then the shaft sections' damage), written into ``out`` = (values, weights): the
    chunk's largest arrays, allocated once per chunk.

    Forces enter the revolution-weighted sums as |F|^p (p = 10/3, the roller
    bearing life exponent) so that a class level can be their damage-equivalent
    power mean; a class never straddles zero, so its sign is the class's sign.
    """
    values, weights = out
    for row, force_n in enumerate((cases.wheel_load_n, cases.side_force_n,
                                   cases.tractive_force_n)):
        np.divide(force_n, KN, out=values[row])
    values[3] = cases.speed_rpm
    forces_kn = values[:3]
    revolutions = cases.speed_rpm * hold_s / 60.0
    weights[0], weights[1] = hold_s, revolutions
    powers = weights[2:5]
    np.power(np.abs(forces_kn), LEVEL_EXPONENT, out=powers)
    powers *= revolutions
    np.multiply(forces_kn, hold_s, out=weights[5:8])
    np.multiply(temperature_c, revolutions, out=weights[8])
    np.multiply(temperature_c, hold_s, out=weights[9])
    for row, damage in enumerate(damages, start=10):
        weights[row] = damage
    return values, weights


def merge_summaries(name: str, summaries: list[LogSummary],
                    classes: tuple[int, ...]) -> LogSummary:
    """The summary of all logs back to back (time-weighted by construction)."""
    cleaning = CleaningReport()
    for part in summaries:
        for key in ("rows", "used_rows", "dropped_rows", "filled_values", "gaps",
                    "gap_time_s", "filled_samples"):
            setattr(cleaning, key, getattr(cleaning, key) + getattr(part.cleaning, key))
    peak = {label: max(s.peak_static_load_n[label] for s in summaries) for label in LABELS}
    table = dwell.merged([s.table for s in summaries], classes, MIN_EXPONENTS)
    flagged = {flag: sum(s.flag_time_s[flag] for s in summaries)
               for flag in summaries[0].flag_time_s}
    return LogSummary(name=name, plan=None, cleaning=cleaning, table=table,
                      peak_static_load_n=peak, flag_time_s=flagged,
                      logged_temperature=any(s.logged_temperature for s in summaries),
                      weights=summaries[0].weights,
                      shaft=functools.reduce(shaft.worst, (s.shaft for s in summaries)))
