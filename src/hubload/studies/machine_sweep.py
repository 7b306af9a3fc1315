"""Sweeps of a machine file: any numeric key of the machine over a range (or grid) of values.

Key paths are those of the machine file (``machine.cog_height_mm``,
``operation[2].payload_kg``, ``axle[0].track_mm``), resolved against its format as a
load-case sweep resolves its keys, and those of an axle's wheel end file behind the
axle's ``wheel_end`` key (``axle[0].wheel_end.wheel.offset_mm``: both wheels of that
axle). Each point is the machine file with the varied keys set, converted and evaluated
as ``hubload machine`` does: its wheel ends' spectra follow from the varied machine, so
a point is a whole machine, one by one.
"""

from __future__ import annotations

import itertools
import math
import re
from collections.abc import Callable, Sequence
from dataclasses import dataclass, replace
from pathlib import Path

from hubload.casefile.load import read_document
from hubload.casefile.machinefile import machine_from_document, read_wheel_end_document
from hubload.casefile.variation import KeyPath, at_point, current_value, with_values
from hubload.engine.machine import MachineResult, evaluate_machine
from hubload.errors import InputError
from hubload.schema import FORMAT
from hubload.schema.machineformat import MACHINE_FORMAT
from hubload.studies.sweep import LINK, Axis, parse_vary

WHEEL_END_KEY = re.compile(r"^axle\[(\d+)\]\.wheel_end\.")
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
    wheel_end_of: dict[KeyPath, int] = {}      # a wheel end key -> its axle's index
    wheel_end_file_values: dict[str, float | None] = {}
    axes = tuple(parse_machine_vary(spec, document, file, wheel_end_of, wheel_end_file_values)
                 for spec in specs)
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
        machine_at = {path: v for path, v in at.items() if path not in wheel_end_of}
        wheel_end_at: dict[int, dict] = {}
        for path, value in at.items():
            if path in wheel_end_of:
                wheel_end_at.setdefault(wheel_end_of[path], {})[path] = value
        try:
            study = machine_from_document(with_values(document, machine_at), file, wheel_end_at)
        except InputError as error:
            raise at_point(error, at, error.file or file) from None
        results.append(evaluate_machine(study))
        values.append({path.text: int(v) if path.integer else v for path, v in at.items()})
        if on_progress is not None:
            on_progress(len(values), total)
    return MachineSweep(title=base.title, source=file, axes=axes, values=tuple(values),
                        results=tuple(results), target_life_h=base.target_life_h,
                        file_values={path.text: wheel_end_file_values[path.text]
                                     if path in wheel_end_of else current_value(document, path)
                                     for axis in axes for path, _ in axis.moving()})


def parse_machine_vary(spec: str, document: dict, file: str, wheel_end_of: dict,
                       file_values: dict) -> Axis:
    """A ``--vary`` spec of a machine key, or of the keys of one axle's wheel end file
    (``axle[0].wheel_end.wheel.offset_mm``, linked keys of that file too)."""
    parts = [part.strip() for part in spec.split(LINK)]
    prefixes = [WHEEL_END_KEY.match(part) for part in parts]
    if not any(prefixes):
        return parse_vary(spec, document, file, MACHINE_FORMAT)
    if not all(prefixes) or len({p.group(0) for p in prefixes}) > 1:
        raise InputError("linked keys of a machine sweep belong to one file: the machine "
                         "file's, or one axle's wheel end file", file=file, key_path=parts[0])
    prefix = prefixes[0].group(0)
    index = int(prefixes[0].group(1))
    axles = document.get("axle") if isinstance(document.get("axle"), list) else []
    if index >= len(axles) or not isinstance(axles[index].get("wheel_end"), str):
        raise InputError("expected an axle with a wheel_end file", file=file,
                         key_path=f"axle[{index}].wheel_end")
    wheel_end = read_wheel_end_document(Path(file).parent / axles[index]["wheel_end"],
                                        f"axle[{index}].wheel_end")
    relative = LINK.join(part[len(prefix):] for part in parts)
    try:
        axis = parse_vary(relative, wheel_end, file, FORMAT)
    except InputError as error:
        raise InputError(error.message, file=file,
                         key_path=prefix + (error.key_path or "")) from None
    named = {path: replace(path, text=prefix + path.text) for path, _ in axis.moving()}
    for original, path in named.items():
        wheel_end_of[path] = index
        file_values[path.text] = current_value(wheel_end, original)
    return Axis(path=named[axis.path], values=axis.values,
                linked=tuple((named[path], values) for path, values in axis.linked))
