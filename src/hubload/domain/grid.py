"""A grid of study variants built directly as one batched study, without a study per point.

A sweep over several keys varies each key on its own axis. Each axis's variants are built
once (a few hundred at most) and stacked (domain.batch); a point of the grid then takes, leaf
by leaf, the value of the axis that varies that leaf, and the file's value elsewhere. This is
exact when no two axes vary the same leaf of the study (a derived value such as a case's
speed from km/h and the rolling radius would be varied by both): :func:`grid_builder` returns
None then, and the caller evaluates the points one study each.

Float leaves get the point axis as (P, 1), like stacked studies (domain.batch), so that every
result carries the point axis first; :func:`point_study` takes one point back out against
the base study's own shapes.
"""

from __future__ import annotations

import dataclasses
from collections.abc import Sequence
from typing import Any

import numpy as np

from hubload.domain.batch import LABEL_FIELDS, is_float_scalar, is_integer, stack_studies
from hubload.domain.study import Study


class Overlap(ValueError):
    """Two axes vary the same leaf of the study: the grid cannot be built leaf by leaf."""


def varying(base: Any, stacked: Any) -> bool:
    """Whether an axis's stacked leaf differs from point to point."""
    if not isinstance(stacked, np.ndarray) or stacked.ndim != np.ndim(base) + 1 and not (
            np.ndim(base) == 0 and stacked.ndim == 2):
        return False
    different = stacked != stacked[:1]
    if np.issubdtype(stacked.dtype, np.floating):   # NaN marks an absent key: equal to itself
        different &= ~(np.isnan(stacked) & np.isnan(stacked[:1]))
    return bool(np.any(different))


def assemble(base: Any, axes: list[tuple[Any, np.ndarray]], count: int, name: str) -> Any:
    """The leaf (or subtree) of ``count`` points: from the axis that varies it, indexed by that
    axis's index of each point, else the base value (floats as (count, 1))."""
    if dataclasses.is_dataclass(base) and not isinstance(base, type):
        return dataclasses.replace(base, **{
            f.name: assemble(getattr(base, f.name),
                             [(getattr(node, f.name), index) for node, index in axes], count,
                             f.name)
            for f in dataclasses.fields(base) if f.init})
    if name in LABEL_FIELDS:
        return base
    if isinstance(base, dict):
        return {key: assemble(base[key], [(node[key], index) for node, index in axes], count,
                              str(key)) for key in base}
    if isinstance(base, (list, tuple)) and not isinstance(base, np.ndarray):
        return type(base)(assemble(item, [(node[i], index) for node, index in axes], count, name)
                          for i, item in enumerate(base))
    moving = [(node, index) for node, index in axes if varying(base, node)]
    if len(moving) > 1:
        raise Overlap(name)
    if moving:
        node, index = moving[0]
        return node[index]
    if is_float_scalar(base):   # as domain.batch stacks floats: the point axis first
        return np.full((count, 1), float(base))
    return base


def grid_builder(base: Study, axis_variants: Sequence[Sequence[Study]]):
    """A function (point indices per axis) -> batched study of those points, or None when two
    axes vary the same leaf."""
    stacks = [stack_studies(list(variants)) for variants in axis_variants]

    def build(indices: Sequence[np.ndarray]) -> Study:
        count = len(indices[0])
        return assemble(base, list(zip(stacks, indices)), count, "study")

    try:
        build([np.zeros(2, dtype=int) for _ in stacks])
    except Overlap:
        return None
    return build


def point_study(base: Any, batched: Any, index: int, name: str = "study") -> Any:
    """Point ``index`` of a batched study, shaped like ``base`` (the file's own study)."""
    if dataclasses.is_dataclass(base) and not isinstance(base, type):
        return dataclasses.replace(base, **{
            f.name: point_study(getattr(base, f.name), getattr(batched, f.name), index, f.name)
            for f in dataclasses.fields(base) if f.init})
    if name in LABEL_FIELDS:
        return base
    if isinstance(base, dict):
        return {key: point_study(base[key], batched[key], index, str(key)) for key in base}
    if isinstance(base, (list, tuple)) and not isinstance(base, np.ndarray):
        return type(base)(point_study(item, batched[i], index, name)
                          for i, item in enumerate(base))
    if isinstance(batched, np.ndarray) and batched.ndim == np.ndim(base) + 1:
        value = batched[index]
        return value.item() if np.ndim(base) == 0 and is_integer(base) else value
    if isinstance(batched, np.ndarray) and np.ndim(base) == 0 and batched.ndim == 2:
        value = batched[index, 0]
        return int(value) if is_integer(base) else float(value)
    return base
