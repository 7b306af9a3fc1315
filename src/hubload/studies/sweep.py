"""Parameter sweeps: any numeric key of a file over evenly spaced values, on a grid.

The file is read once; each point sets the varied keys in the parsed document and
converts it to a Study (cheap), and the points are evaluated by the engine in
batches of BATCH_POINTS (one batched call each), never file by file. The sweep keeps
the batched results: columns of per-point values are read from them directly, and
a point's own result is picked out only when an output asks for it.
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from functools import cached_property

import numpy as np

from hubload.casefile.casetable import expand_case_table
from hubload.casefile.load import read_toml, study_from_document
from hubload.casefile.validate import validate_number
from hubload.casefile.variation import KeyPath, current_value, parse_key_path, \
    stacked_variants, variant_studies
from hubload.domain.batch import StackError, picker
from hubload.domain.grid import grid_builder, point_study
from hubload.domain.study import Study
from hubload.engine import Result, evaluate, with_findings
from hubload.errors import InputError
from hubload.schema import FORMAT
from hubload.schema.spec import Table
from hubload.studies.crossing import Crossing, target_crossings

MAX_POINTS = 100_000
BATCH_POINTS = 1024


LINK = "&"        # KEY=START:STOP:COUNT&KEY2=START:STOP moves two keys along one axis


@dataclass(frozen=True)
class Axis:
    """One sweep axis: a varied key and its evenly spaced values, and any keys linked to it
    (moved together, e.g. a tyre's loaded and rolling radius), each with its own values."""

    path: KeyPath
    values: np.ndarray
    linked: tuple[tuple[KeyPath, np.ndarray], ...] = ()

    @property
    def key(self) -> str:
        return self.path.text

    @property
    def text(self) -> str:
        """Every key that moves along the axis: 'a & b'."""
        return f" {LINK} ".join(path.text for path, _ in self.moving())

    def moving(self) -> tuple[tuple[KeyPath, np.ndarray], ...]:
        return ((self.path, self.values), *self.linked)

    def at(self, index: int) -> dict[KeyPath, float]:
        """The value of every key of the axis at grid index ``index``."""
        return {path: float(values[index]) for path, values in self.moving()}


@dataclass(frozen=True)
class SweepChunk:
    """Up to BATCH_POINTS consecutive points: their studies and their batched result."""

    studies: Sequence[Study]        # a tuple, or PointStudies
    result: Result

    @cached_property
    def take(self):
        return picker(self.result, len(self.studies), self.studies)

    def point(self, index: int) -> Result:
        """The result of point ``index`` of the chunk, as a check of it gives (findings too).

        A chunk of one point is evaluated on its own: in a batch of one, a point axis of
        length one cannot be told from a case axis of length one."""
        if len(self.studies) == 1:
            return evaluate(self.studies[0])
        result = with_findings(self.take(index))
        if self.shared_overall is not None:
            result.__dict__["overall"] = self.shared_overall.point(index, len(self.studies))
        return result

    @cached_property
    def shared_overall(self):
        """The chunk's overall verdict, computed once, where every point judges the same kind
        of life (the items' names follow it); else None, each point's own is computed."""
        chosen = np.asarray(self.result.governing.chosen)
        if chosen.size > 1 and not np.all(chosen == chosen.flat[0]):
            return None
        return self.result.overall


@dataclass(frozen=True)
class Sweep:
    """Every point of the grid (the first key varies slowest), evaluated in batches."""

    title: str
    source: str
    axes: tuple[Axis, ...]
    values: tuple[dict[str, float], ...]      # each point's values of the varied keys
    chunks: tuple[SweepChunk, ...]
    target_life_h: float | None
    file_values: dict[str, float | None]

    @property
    def shape(self) -> tuple[int, ...]:
        return tuple(len(axis.values) for axis in self.axes)

    @property
    def first(self) -> Result:
        return self.chunks[0].point(0)

    def points(self):
        """Each point's result, in grid order (picked from its chunk when asked)."""
        for chunk in self.chunks:
            for index in range(len(chunk.studies)):
                yield chunk.point(index)

    def column(self, read: Callable[[Result], object]) -> np.ndarray:
        """``read(batched result)`` of every chunk, joined: one value per point."""
        return np.concatenate([np.broadcast_to(np.asarray(read(chunk.result), dtype=float),
                                               (len(chunk.studies),))
                               for chunk in self.chunks])

    @property
    def governing_life_h(self) -> np.ndarray:
        return self.column(lambda r: r.governing.life_h)

    @property
    def targets_h(self) -> np.ndarray | None:
        """The target life of each point (it may be a varied key); None without a target."""
        if self.target_life_h is None:
            return None
        return self.column(lambda r: np.asarray(r.study.target_life_h, dtype=float)[..., 0])

    def crossings(self) -> list[tuple[dict[str, float], list[Crossing]]]:
        """Target crossings along the last axis, for each value of the others.

        Works on life / target per point, so a varied target life is followed too.
        """
        targets = self.targets_h
        if targets is None:
            return []
        return self.crossings_of_one(self.governing_life_h / targets)

    def shaft_crossings(self) -> list[tuple[dict[str, float], list[Crossing]]]:
        """Where the shaft's lowest safety crosses its required safety (when both are given)."""
        if self.first.lowest_shaft_safety is None:
            return []
        lowest = self.column(lambda r: r.lowest_shaft_safety)
        required = self.column(lambda r: r.shaft.required_safety)
        return self.crossings_of_one(lowest / required)

    def crossings_of_one(self, ratios) -> list[tuple[dict[str, float], list[Crossing]]]:
        """Crossings of 1 by ``ratios`` (one per point) along the last axis, for each value
        of the other axes."""
        grid = np.asarray(ratios, dtype=float).reshape(self.shape)
        return [({axis.key: float(axis.values[i]) for axis, i in zip(self.axes, fixed)},
                 target_crossings(self.axes[-1].values, grid[fixed], 1.0))
                for fixed in itertools.product(*(range(n) for n in self.shape[:-1]))]


def parse_vary(spec: str, document: dict, file: str, table: Table = FORMAT) -> Axis:
    """``KEY=START:STOP:COUNT``, optionally linked to more keys moving with it
    (``&KEY2=START:STOP[:COUNT]``, the same count) -> Axis; InputError (naming the file and
    key) when malformed."""
    first, *others = spec.split(LINK)
    axis = parse_one(first, document, file, table)
    linked = []
    for part in others:
        if part.count(":") == 1:
            part = f"{part}:{len(axis.values)}"
        found = parse_one(part, document, file, table)
        if len(found.values) != len(axis.values):
            raise InputError(f"linked keys move together: expected COUNT {len(axis.values)} "
                             f"like {axis.key}, got {len(found.values)}", file=file,
                             key_path=found.key)
        linked.append((found.path, found.values))
    return Axis(path=axis.path, values=axis.values, linked=tuple(linked))


def parse_one(spec: str, document: dict, file: str, table: Table = FORMAT) -> Axis:
    """One ``KEY=START:STOP:COUNT``."""
    key, equals, span = spec.partition("=")
    key = key.strip()
    parts = span.split(":")
    if not equals or not key or len(parts) != 3:
        raise InputError(f"--vary expects KEY=START:STOP:COUNT (e.g. wheel.offset_mm=60:140:9), "
                         f"got {spec!r}", file=file)
    try:
        path = parse_key_path(key, document, table)
    except InputError as error:
        raise error.located(file) from None
    try:
        start, stop = float(parts[0]), float(parts[1])
        count = int(parts[2])
    except ValueError:
        raise InputError(f"expected numbers START:STOP and a whole COUNT, got {span!r}",
                         file=file, key_path=key) from None
    # a finite span needs finite ends, and linspace overflows without it (+-1e308)
    one_point = count == 1 and start == stop   # the file's own value, e.g. for a check
    if not math.isfinite(stop - start) or not (one_point or (count >= 2 and start != stop)):
        raise InputError(f"expected finite START != STOP and COUNT >= 2 (or START = STOP with "
                         f"COUNT = 1), got {span!r}", file=file, key_path=key)
    if count > MAX_POINTS:  # before linspace: it would try to allocate them all
        raise InputError(f"expected a COUNT of at most {MAX_POINTS:,} (the largest grid), got "
                         f"{count:,}", file=file, key_path=key)
    for end in (start, stop):  # the grid's extremes: refused before any point is computed
        try:
            validate_number(end, path.field, key)
        except InputError as error:
            raise error.located(file) from None
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
    written = read_toml(file)
    if method is not None:
        written = {**written, "project": {**written.get("project", {}), "method": method}}
    try:
        base = study_from_document(written, source=file)   # errors in a table name its rows
        document = expand_case_table(written, file)[0]
    except InputError as error:
        raise error.located(file) from None
    if not specs:
        raise InputError("give at least one --vary KEY=START:STOP:COUNT", file=file)
    axes = tuple(parse_vary(spec, document, file) for spec in specs)
    keys = [path.text for axis in axes for path, _ in axis.moving()]
    if len(set(keys)) != len(keys):
        raise InputError(f"each key may be varied once, got {', '.join(keys)}", file=file)
    total = math.prod(len(axis.values) for axis in axes)
    if total > MAX_POINTS:
        raise InputError(f"the grid has {total:,} points; at most {MAX_POINTS:,} are allowed",
                         file=file)
    grid = list(itertools.product(*(range(len(axis.values)) for axis in axes)))
    build = grid_study(document, axes, base, file) if len(axes) > 1 else None
    chunks, values = [], []
    for start, stop in chunk_bounds(total):
        chunk = [{path: value for axis, i in zip(axes, point) for path, value in axis.at(i).items()}
                 for point in grid[start:stop]]
        if build is None:
            studies, batched = stacked_variants(document, chunk, file)
            studies = tuple(studies)
        else:
            batched = build([np.array(column) for column in zip(*grid[start:stop])])
            studies = PointStudies(base, batched, stop - start)
        within = None if on_progress is None else (   # the refined solve's blocks
            lambda done, blocks, start=start, stop=stop:
            on_progress(start + (stop - start) * done // blocks, total))
        chunks.append(SweepChunk(studies, evaluate(batched, with_findings=False,
                                                   on_progress=within)))
        values += [{path.text: int(v) if path.integer else v for path, v in point.items()}
                   for point in chunk]
        if on_progress is not None:
            on_progress(len(values), total)
    return Sweep(title=base.title, source=file, axes=axes, values=tuple(values),
                 chunks=tuple(chunks), target_life_h=base.target_life_h,
                 file_values={path.text: current_value(document, path)
                              for axis in axes for path, _ in axis.moving()})


@dataclass(frozen=True)
class PointStudies:
    """The studies of a chunk built as one batched study, taken out point by point on demand."""

    base: Study
    batched: Study
    count: int

    def __len__(self) -> int:
        return self.count

    def __getitem__(self, index: int) -> Study:
        return point_study(self.base, self.batched, index)


def grid_study(document: dict, axes: tuple[Axis, ...], base: Study, file: str):
    """A builder of a grid's batched studies from each axis's variants (domain.grid), or None
    where the points must be built one by one: when two axes vary the same leaf of the study
    (a derived value).

    Two axes may move keys of one table, whose cross-key rules (the bearings' order, a
    section inside the shaft) hold point by point: the grid's corners are then validated as
    points of their own. The rules are comparisons of values that move monotonically along
    each axis, so where every corner holds them, every point of the grid does."""
    variants = [variant_studies(document, [axis.at(i) for i in range(len(axis.values))], file)
                for axis in axes]
    try:
        build = grid_builder(base, variants)
    except StackError:
        return None
    tables = [{path.segments[0][0] for path, _ in axis.moving()} for axis in axes]
    if build is not None and sum(len(t) for t in tables) != len(set().union(*tables)):
        corners = [{path: value for axis, index in zip(axes, corner)
                    for path, value in axis.at(index).items()}
                   for corner in itertools.product(*((0, len(a.values) - 1) for a in axes))]
        variant_studies(document, corners, file)
    return build


def chunk_bounds(total: int) -> list[tuple[int, int]]:
    """(start, stop) of each batch of points; never a batch of one point (a batched study
    of one point cannot tell a point axis from a case axis of length one)."""
    bounds = [(start, min(start + BATCH_POINTS, total)) for start in range(0, total, BATCH_POINTS)]
    if len(bounds) > 1 and bounds[-1][1] - bounds[-1][0] == 1:
        bounds[-2:] = [(bounds[-2][0], bounds[-2][1] - 1), (bounds[-2][1] - 1, total)]
    return bounds
