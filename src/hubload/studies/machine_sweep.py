"""Sweeps of a machine file: any numeric key of the machine over a range (or grid) of values.

Key paths are those of the machine file (``machine.cog_height_mm``,
``operation[2].payload_kg``, ``axle[0].track_mm``), resolved against its format as a
load-case sweep resolves its keys. Each point is the machine file with the varied keys
set, converted and evaluated as ``hubload machine`` does: its wheel ends' spectra
follow from the varied machine, so a point is a whole machine, one by one.
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Callable, Sequence
from dataclasses import dataclass

from hubload.casefile.load import read_document
from hubload.casefile.machinefile import machine_from_document
from hubload.casefile.variation import at_point, current_value, with_values
from hubload.engine.machine import MachineResult, evaluate_machine
from hubload.errors import InputError
from hubload.schema.machineformat import MACHINE_FORMAT
from hubload.studies.sweep import Axis, parse_vary

# Each point derives and evaluates four wheel ends (about 10 ms): a few thousand points
# stay within a minute.
MAX_MACHINE_POINTS = 5000


@dataclass(frozen=True)
class MachineSweep:
    """Every point of the grid (the first key varies slowest) with its machine result."""

    title: str
    source: str
    axes: tuple[Axis, ...]
    values: tuple[dict[str, float], ...]
    results: tuple[MachineResult, ...]
    target_life_h: float | None
    file_values: dict[str, float | None]


def run_machine_sweep(file: str, specs: Sequence[str],
                      on_progress: Callable[[int, int], None] | None = None,
                      method: str | None = None) -> MachineSweep:
    """Evaluate the machine at every point of the grid of ``--vary`` specs."""
    document = read_document(file)
    if method is not None:
        document = {**document, "project": {**document.get("project", {}), "method": method}}
    base = machine_from_document(document, file)
    if not specs:
        raise InputError("give at least one --vary KEY=START:STOP:COUNT", file=file)
    axes = tuple(parse_vary(spec, document, file, MACHINE_FORMAT) for spec in specs)
    keys = [path.text for axis in axes for path, _ in axis.moving()]
    if len(set(keys)) != len(keys):
        raise InputError(f"each key may be varied once, got {', '.join(keys)}", file=file)
    total = math.prod(len(axis.values) for axis in axes)
    if total > MAX_MACHINE_POINTS:
        raise InputError(f"the grid has {total:,} points; a machine sweep allows at most "
                         f"{MAX_MACHINE_POINTS:,}", file=file)
    results, values = [], []
    for point in itertools.product(*(range(len(axis.values)) for axis in axes)):
        at = {path: value for axis, i in zip(axes, point) for path, value in axis.at(i).items()}
        try:
            study = machine_from_document(with_values(document, at), file)
        except InputError as error:
            raise at_point(error, at, error.file or file) from None
        results.append(evaluate_machine(study))
        values.append({path.text: int(v) if path.integer else v for path, v in at.items()})
        if on_progress is not None:
            on_progress(len(values), total)
    return MachineSweep(title=base.title, source=file, axes=axes, values=tuple(values),
                        results=tuple(results), target_life_h=base.target_life_h,
                        file_values={path.text: current_value(document, path)
                                     for axis in axes for path, _ in axis.moving()})
