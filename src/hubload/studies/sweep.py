"""Parameter sweeps: any numeric key of a file over evenly spaced values, on a grid.

The file is read once; each point sets the varied keys in the parsed document and
converts it to a Study (cheap), and the points are evaluated by the engine in
batches (``engine.evaluate_many``), never file by file.
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Callable, Sequence
from dataclasses import dataclass

import numpy as np

from hubload.casefile.load import read_document, study_from_document
from hubload.casefile.variation import KeyPath, current_value, parse_key_path, variant_studies
from hubload.engine import Result, evaluate_many
from hubload.errors import InputError
from hubload.report.jsonout import result_document
from hubload.report.numbers import life_h
from hubload.report.series import MISSING, governing_life, lookup, shaft_min_safety
from hubload.studies.crossing import Crossing, target_crossings

MAX_POINTS = 100_000
BATCH_POINTS = 1024
# Keys of the check's JSON that describe the file, not a point: written once per sweep.
FILE_LEVEL_KEYS = ("title", "source", "method", "cases", "cautions")


@dataclass(frozen=True)
class Axis:
    """One varied key and its evenly spaced values."""

    path: KeyPath
    values: np.ndarray

    @property
    def key(self) -> str:
        return self.path.text


@dataclass(frozen=True)
class SweepPoint:
    """A point's values of the varied keys and the check's JSON document of it (the engine
    Result is not kept: a grid of 100,000 points would hold them all)."""

    values: dict[str, float]
    document: dict

    @property
    def governing_life_h(self) -> float:
        """The system's life of the kind the verdict uses [h] (also without a target)."""
        verdict = self.document.get("verdict")
        if verdict is not None:
            return life_h(verdict["life_h"])
        return governing_life(self.document).of(self.document["system"])


@dataclass(frozen=True)
class Sweep:
    title: str
    source: str
    axes: tuple[Axis, ...]
    points: tuple[SweepPoint, ...]
    target_life_h: float | None
    file_values: dict[str, float | None]

    @property
    def shape(self) -> tuple[int, ...]:
        return tuple(len(axis.values) for axis in self.axes)

    @property
    def governing_life_name(self) -> str:
        return governing_life(self.points[0].document).name

    def crossings(self) -> list[tuple[dict[str, float], list[Crossing]]]:
        """Target crossings along the last axis, for each value of the others.

        Works on life / target per point, so a varied target life is followed too.
        """
        if self.points[0].document.get("verdict") is None:
            return []
        return self.crossings_of_one([ratio_to_target(p.document) for p in self.points])

    def shaft_crossings(self) -> list[tuple[dict[str, float], list[Crossing]]]:
        """Where the shaft's lowest safety crosses its required safety (when both are given)."""
        ratios = [shaft_ratio(p.document) for p in self.points]
        if any(ratio is None for ratio in ratios):
            return []
        return self.crossings_of_one(ratios)

    def crossings_of_one(self, ratios: list[float]) -> list[tuple[dict[str, float],
                                                                  list[Crossing]]]:
        """Crossings of 1 by ``ratios`` (one per point) along the last axis, for each value
        of the other axes."""
        grid = np.array(ratios, dtype=float).reshape(self.shape)
        return [({axis.key: float(axis.values[i]) for axis, i in zip(self.axes, fixed)},
                 target_crossings(self.axes[-1].values, grid[fixed], 1.0))
                for fixed in itertools.product(*(range(n) for n in self.shape[:-1]))]


def shaft_ratio(document: dict) -> float | None:
    """Lowest shaft safety / required safety of a point; None without both."""
    lowest, required = shaft_min_safety(document), lookup(document, "shaft.required_safety")
    if lowest is MISSING or not isinstance(required, (int, float)) or required <= 0:
        return None
    return math.inf if lowest is None else lowest / required


def ratio_to_target(document: dict) -> float:
    """Governing life / target life of a point (inf for an infinite life)."""
    verdict = document["verdict"]
    return life_h(verdict["life_h"]) / verdict["target_h"]


def parse_vary(spec: str, document: dict, file: str) -> Axis:
    """``KEY=START:STOP:COUNT`` -> Axis; InputError (naming the file and key) when malformed."""
    key, equals, span = spec.partition("=")
    key = key.strip()
    parts = span.split(":")
    if not equals or not key or len(parts) != 3:
        raise InputError(f"--vary expects KEY=START:STOP:COUNT (e.g. wheel.offset_mm=60:140:9), "
                         f"got {spec!r}", file=file)
    try:
        path = parse_key_path(key, document)
    except InputError as error:
        raise error.located(file) from None
    try:
        start, stop = float(parts[0]), float(parts[1])
        count = int(parts[2])
    except ValueError:
        raise InputError(f"expected numbers START:STOP and a whole COUNT, got {span!r}",
                         file=file, key_path=key) from None
    # a finite span needs finite ends, and linspace overflows without it (+-1e308)
    if not math.isfinite(stop - start) or count < 2 or start == stop:
        raise InputError(f"expected finite START != STOP and COUNT >= 2, got {span!r}",
                         file=file, key_path=key)
    values = np.linspace(start, stop, count)
    if path.integer:
        if not np.allclose(values, np.round(values), rtol=0, atol=1e-9):
            raise InputError(f"'{path.field.key}' is a whole number: choose START, STOP and "
                             f"COUNT so that every step is whole, got {span!r}",
                             file=file, key_path=key)
        values = np.round(values)
    return Axis(path=path, values=values)


def run_sweep(file: str, specs: Sequence[str],
              on_progress: Callable[[int, int], None] | None = None,
              method: str | None = None) -> Sweep:
    """Evaluate the grid of every ``--vary`` spec (the first key varies slowest).

    ``method`` overrides the file's ``[project] method`` (as ``check --method`` does).
    """
    document = read_document(file)
    if method is not None:
        document = {**document, "project": {**document.get("project", {}), "method": method}}
    try:
        base = study_from_document(document, source=file)
    except InputError as error:
        raise error.located(file) from None
    if not specs:
        raise InputError("give at least one --vary KEY=START:STOP:COUNT", file=file)
    axes = tuple(parse_vary(spec, document, file) for spec in specs)
    keys = [axis.key for axis in axes]
    if len(set(keys)) != len(keys):
        raise InputError(f"each key may be varied once, got {', '.join(keys)}", file=file)
    total = math.prod(len(axis.values) for axis in axes)
    if total > MAX_POINTS:
        raise InputError(f"the grid has {total:,} points; at most {MAX_POINTS:,} are allowed",
                         file=file)
    grid = list(itertools.product(*(axis.values for axis in axes)))
    points: list[SweepPoint] = []
    for start in range(0, total, BATCH_POINTS):
        chunk = [{axis.path: float(v) for axis, v in zip(axes, values)}
                 for values in grid[start:start + BATCH_POINTS]]
        studies = variant_studies(document, chunk, file)
        for values, result in zip(chunk, evaluate_many(studies)):
            points.append(SweepPoint(values={path.text: int(v) if path.integer else v
                                             for path, v in values.items()},
                                     document=point_document(result)))
        if on_progress is not None:
            on_progress(len(points), total)
    return Sweep(title=base.title, source=file, axes=axes, points=tuple(points),
                 target_life_h=base.target_life_h,
                 file_values={axis.key: current_value(document, axis.path) for axis in axes})


def point_document(result: Result) -> dict:
    """The check's JSON document of one point, without the keys that describe the file."""
    document = result_document(result)
    return {key: value for key, value in document.items() if key not in FILE_LEVEL_KEYS}
