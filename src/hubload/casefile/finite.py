"""Finite after conversion: every number of a Study checked once it is in SI units.

The validator checks each value as written (finite, within its limits); this checks
them again after the unit conversion and the derivations of the operating points
(km/h to r/min, pressure to torque, lateral load transfer), so that no overflow or
undefined value reaches the engine, where it would become an infinite life.
Walks the Study's dataclasses, so a new field is covered without a change here.
"""

from __future__ import annotations

import dataclasses

import numpy as np

from hubload.domain.study import Study
from hubload.errors import InputError

# How each case was built (NaN marks a key the case does not give): checked through the
# Cases arrays derived from it instead.
SKIPPED = frozenset({"operating"})
# Fields whose +inf is a documented value, not an overflow: a housing wall without an
# outside diameter given is unbounded (model.setting, thick-walled cylinder).
UNBOUNDED = frozenset({"housing_outside_diameter_m"})


def check_finite(study: Study) -> Study:
    """``study`` unchanged; InputError naming the first number that is not finite."""
    for table, name, value in numbers(study, ""):
        array = np.asarray(value, dtype=float)
        allowed = np.isposinf(array) if name in UNBOUNDED else False
        bad = np.flatnonzero(~(np.isfinite(array) | allowed))
        if bad.size:
            index = int(bad[0])
            per_case = table == "cases" and array.size == len(study.cases)
            raise InputError(
                f"{name} = {array.flat[index]} after the conversion to SI units; expected a "
                "finite number: check the magnitudes of the keys it is computed from"
                + (f" (case '{study.cases.names[index]}')" if per_case else ""),
                key_path=f"case[{index}]" if per_case else file_table(table))
    return study


def numbers(node, path: str):
    """(table path, field, value) of every float or float array below a dataclass."""
    for item in dataclasses.fields(node):
        if item.name in SKIPPED:
            continue
        value = getattr(node, item.name)
        name = f"{path}.{item.name}" if path else item.name
        if dataclasses.is_dataclass(value):
            yield from numbers(value, name)
        elif isinstance(value, tuple) and value and dataclasses.is_dataclass(value[0]):
            for index, part in enumerate(value):
                yield from numbers(part, f"{name}[{index}]")
        elif isinstance(value, (float, np.ndarray)) and not isinstance(value, bool):
            yield path, item.name, value


def file_table(path: str) -> str | None:
    """The file's table of a Study path (the wheel, a bearing, a shaft section)."""
    return {"": None, "cases": "case"}.get(path, path.replace("sections", "section")
                                           .replace(".geometry", ""))
