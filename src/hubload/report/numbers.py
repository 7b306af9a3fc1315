"""Numbers as every output writes them: JSON values and table text.

JSON has neither infinity nor NaN: an infinite life (and an undefined value) is
written as null, and a null life read back from a document is an infinite one.
"""

from __future__ import annotations

import math

import numpy as np


def json_number(value) -> float | None:
    """A finite float, or None for inf/NaN (a batched point's value may be a one-element array)."""
    value = float(value.item() if isinstance(value, np.ndarray) else value)
    return value if math.isfinite(value) else None


def json_numbers(values) -> list[float | None]:
    """:func:`json_number` of each value of a per-case array, converted in one numpy call."""
    return [value if math.isfinite(value) else None
            for value in np.asarray(values, dtype=float).tolist()]


def json_rows(columns: dict[str, object], count: int) -> list[dict]:
    """One dict per case from per-case arrays (``{key: array}``, key order kept): numbers as
    :func:`json_number`, boolean arrays as true/false; a value shared by every case is repeated."""
    converted = []
    for values in columns.values():
        array = np.asarray(values)
        if array.shape != (count,):
            array = np.broadcast_to(array, (count,))
        converted.append(array.tolist() if array.dtype == bool else json_numbers(array))
    return [dict(zip(columns, row)) for row in zip(*converted)]


def life_h(value) -> float:
    """A life [h] read from a JSON document: null is an infinite life."""
    return math.inf if value is None else float(value)


def hours(value) -> str:
    """A life [h] as table text: whole hours from 10 h, three digits below; 'infinite' for an
    infinite life (or null), '-' for an undefined one (NaN)."""
    value = life_h(value)
    if math.isnan(value):
        return "-"
    if math.isinf(value):
        return "infinite"
    return f"{value:,.0f}" if value >= 10 else f"{value:.3g}"


def hours_with_unit(value) -> str:
    """:func:`hours` with its unit where it has one: '1,250 h', but 'infinite'."""
    text = hours(value)
    return f"{text} h" if math.isfinite(life_h(value)) else text


def share(value) -> str:
    """A fraction (damage or time share) as a percentage."""
    return f"{100 * float(value):.1f} %"


def safety(value) -> str:
    """A safety factor as table text: 'infinite' when unloaded (or null), '-' when undefined."""
    value = math.inf if value is None else float(value)
    if math.isnan(value):
        return "-"
    return "infinite" if math.isinf(value) else f"{value:.2f}"


def setting_kind(setting_um: float) -> str:
    """An axial setting's name by its sign (the file format's: > 0 end play, < 0 preload)."""
    return "end play" if setting_um > 0 else "preload" if setting_um < 0 else "line-to-line"


def percent(value) -> str:
    """A fraction as a percentage without the unit (for columns headed '%')."""
    value = float(value)
    return "-" if math.isnan(value) else f"{100 * value:.1f}"


def fixed(digits: int):
    """A formatter to ``digits`` decimals; '-' for an undefined value (NaN or None)."""
    def text(value) -> str:
        value = math.nan if value is None else float(value)
        if math.isnan(value):
            return "-"
        return "infinite" if math.isinf(value) else f"{value:,.{digits}f}"
    return text


def factor_text(value) -> str:
    """A dimensionless factor (kappa, eC, aISO): 3 significant digits below 1, else 2 decimals."""
    value = float(value)
    if math.isnan(value):
        return "-"
    return f"{value:.3g}" if abs(value) < 1 else f"{value:.2f}"
