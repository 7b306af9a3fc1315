"""Many studies as one: stacking Study variants along a leading point axis, and back.

The engine and the model broadcast over leading axes with the case axis last,
so P variants of a study evaluate in one call once their parameters are
stacked: a scalar becomes shape (P, 1), a per-case array (P, N). Stacking is
derived from the dataclasses themselves, so fields added to the Study later
stack without changes here:

- floats (and 0-d arrays) always stack to (P, 1), so every result carries the
  point axis first;
- arrays and integers stack when they differ between points, else stay shared;
- labels (names, titles, sources) keep the first point's value: they name
  things and never enter the physics;
- anything else (strings, booleans, None) must be equal in every point, else
  :class:`StackError`.

:func:`picker` takes points back out of a batched result.
"""

from __future__ import annotations

import dataclasses
from collections.abc import Callable, Sequence
from typing import Any

import numpy as np

from hubload.domain.study import Study

LABEL_FIELDS = frozenset({"source", "title", "names", "label", "name"})


class StackError(ValueError):
    """The studies differ in something that cannot be stacked (a choice, a count)."""


def stack_studies(studies: Sequence[Study]) -> Study:
    """One Study whose parameters carry a leading point axis of length len(studies)."""
    if not studies:
        raise StackError("nothing to stack")
    return stack_values(list(studies), "study")


def stack_values(values: list, name: str) -> Any:
    first = values[0]
    if dataclasses.is_dataclass(first) and not isinstance(first, type):
        if any(type(value) is not type(first) for value in values):
            raise StackError(f"{name}: different types")
        return dataclasses.replace(first, **{
            field.name: stack_values([getattr(value, field.name) for value in values],
                                     field.name)
            for field in dataclasses.fields(first) if field.init})
    if name in LABEL_FIELDS:
        return first
    if isinstance(first, dict):
        if any(value.keys() != first.keys() for value in values):
            raise StackError(f"{name}: different keys")
        return {key: stack_values([value[key] for value in values], str(key)) for key in first}
    if is_float_scalar(first):
        if not all(is_float_scalar(value) for value in values):
            raise StackError(f"{name}: numbers mixed with other values")
        return np.array(values, dtype=float)[:, None]
    if isinstance(first, (list, tuple)) and not all_equal(values):
        if any(not isinstance(value, type(first)) or len(value) != len(first)
               for value in values):
            raise StackError(f"{name}: different lengths")
        return type(first)(stack_values([value[i] for value in values], name)
                           for i in range(len(first)))
    if isinstance(first, np.ndarray) or is_integer(first):
        return stack_arrays(values, name)
    if not all_equal(values):
        raise StackError(f"{name}: differs between the studies ({first!r}, ...)")
    return first


def stack_arrays(values: list, name: str) -> Any:
    if all(value is values[0] for value in values):     # one array shared by the studies
        return values[0]
    arrays = [np.asarray(value) for value in values]
    if any(array.shape != arrays[0].shape for array in arrays):
        raise StackError(f"{name}: different shapes")
    stacked = np.stack(arrays)
    if np.all(stacked == stacked[:1]):      # alike at every point (NaN never is): shared
        return values[0]
    return stacked[:, None] if stacked.ndim == 1 else stacked


def is_float_scalar(value: Any) -> bool:
    return (isinstance(value, (float, np.floating))
            or (isinstance(value, np.ndarray) and value.ndim == 0
                and np.issubdtype(value.dtype, np.floating)))


def is_integer(value: Any) -> bool:
    return isinstance(value, (int, np.integer)) and not isinstance(value, bool)


def all_equal(values: list) -> bool:
    first = values[0]
    try:
        return all(bool(value == first) for value in values[1:])
    except (ValueError, TypeError):
        return False


def pick(batched: Any, index: int, count: int, studies: Sequence[Study]) -> Any:
    """Point ``index`` of a batched object of ``count`` points (see :func:`picker`)."""
    take = picker(batched, count, studies)
    return batched if take is None else take(index)


def rebuilder(instance: Any) -> Callable[[dict], Any]:
    """A function changes -> a copy of the dataclass ``instance`` with those fields changed.

    ``dataclasses.replace`` runs ``__init__`` with every field, the bulk of taking a point out
    of a batched result; a frozen dataclass whose fields are all set by ``__init__`` and
    that checks nothing after it is copied field by field instead (cached properties of the
    batch are left behind, as a fresh instance would have them)."""
    kind = type(instance)
    fields = dataclasses.fields(instance)
    plain = (not hasattr(kind, "__post_init__") and not hasattr(kind, "__slots__")
             and all(field.init for field in fields))
    if not plain:
        return lambda changes: dataclasses.replace(instance, **changes)
    shared = {field.name: getattr(instance, field.name) for field in fields}

    def rebuild(changes: dict) -> Any:
        copy = object.__new__(kind)
        copy.__dict__.update(shared)
        copy.__dict__.update(changes)
        return copy

    return rebuild


def picker(batched: Any, count: int, studies: Sequence[Study]) -> Callable[[int], Any] | None:
    """A function index -> that point of ``batched``; None when nothing depends on the point.

    Arrays whose first axis has the point count are indexed; Study instances are
    replaced by the original point study; dataclasses, dicts, lists and tuples are
    rebuilt around their point-dependent parts; the rest is shared. Built once per
    batch, so taking each point costs only the rebuilding.
    """
    if isinstance(batched, Study):
        return studies.__getitem__
    if dataclasses.is_dataclass(batched) and not isinstance(batched, type):
        parts = {field.name: picker(getattr(batched, field.name), count, studies)
                 for field in dataclasses.fields(batched) if field.init}
        varying = {name: take for name, take in parts.items() if take is not None}
        if not varying:
            return None
        rebuild = rebuilder(batched)
        return lambda i: rebuild({n: t(i) for n, t in varying.items()})
    if isinstance(batched, dict):
        parts = {key: picker(value, count, studies) for key, value in batched.items()}
        if all(take is None for take in parts.values()):
            return None
        return lambda i: {key: batched[key] if take is None else take(i)
                          for key, take in parts.items()}
    if isinstance(batched, (list, tuple)):
        parts = [picker(value, count, studies) for value in batched]
        if all(take is None for take in parts):
            return None
        return lambda i: type(batched)(value if take is None else take(i)
                                       for value, take in zip(batched, parts))
    if isinstance(batched, np.ndarray) and batched.ndim >= 1 and batched.shape[0] == count:
        return batched.__getitem__
    return None
