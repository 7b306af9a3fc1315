"""Named quantities read from typed results: what sweeps, comparisons and charts show.

Each :class:`Quantity` reads one value per study from a result (single or batched:
the read broadcasts over the points), with its label and kind. Which quantities a
result carries follows from the result itself: the modified life with lubrication,
the ISO 281 rule's lives beside the refined ones, the shaft's lowest safety with a
shaft.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass

import numpy as np

from hubload.engine import Result
from hubload.engine.governing import symbol_of


@dataclass(frozen=True)
class Quantity:
    """One tabulated or plotted quantity: key, label, kind (life [h] or safety) and reader."""

    key: str                    # dotted name, as the check's JSON writes it
    label: str
    kind: str                   # "life" or "safety"
    read: Callable[[Result], np.ndarray]
    system: bool = False
    modified: bool = False
    bearing: str | None = None
    method: str = "iso281"

    def of(self, result: Result) -> np.ndarray:
        return np.asarray(self.read(result), dtype=float)


def governing_quantity(result: Result) -> Quantity:
    """The governing system life (the verdict's), named by its symbol."""
    return Quantity("governing_life.life_h", f"system {result.governing.symbol} (governing)",
                    "life", lambda r: r.governing.life_h, system=True)


def method_quantities(result: Result, lives_of: Callable[[Result], object], method: str,
                      prefix: str) -> list[Quantity]:
    """System and bearing lives of one method's lives: basic, then modified."""
    reliability = result.governing.choice.reliability
    lives = lives_of(result)
    basic = symbol_of(method, 90.0, False)
    modified = symbol_of(method, reliability, True) if lives.modified is not None else None
    found = [Quantity(f"{prefix}system.l10_h", f"system {basic}", "life",
                      lambda r: lives_of(r).system_life_h, system=True, method=method)]
    if modified is not None:
        found.append(Quantity(f"{prefix}system.l10m_h", f"system {modified}", "life",
                              lambda r: lives_of(r).modified.system_life_h, system=True,
                              modified=True, method=method))
    for label in lives.bearings:
        found.append(Quantity(f"{prefix}bearings.{label}.l10_h", f"{label} {basic}", "life",
                              lambda r, k=label: lives_of(r).bearings[k].life_h, bearing=label,
                              method=method))
        if modified is not None:
            found.append(Quantity(
                f"{prefix}bearings.{label}.l10m_h", f"{label} {modified}", "life",
                lambda r, k=label: lives_of(r).modified.bearings[k].life_h, bearing=label,
                modified=True, method=method))
    return found


def all_quantities(result: Result) -> list[Quantity]:
    """The quantities ``result`` carries: lives (system first, then each bearing; the ISO
    281 rule's beside the refined ones), then s0 of each bearing and the shaft's lowest
    fatigue safety."""
    found = method_quantities(result, lambda r: r, result.method, "")
    if result.iso281 is not None:
        found += method_quantities(result, lambda r: r.iso281, "iso281", "iso281.")
    found += [Quantity(f"bearings.{label}.s0", f"{label} s0", "safety",
                       lambda r, k=label: r.bearings[k].static_safety, bearing=label)
              for label in result.bearings]
    if result.shaft is not None and result.shaft.sections:
        found.append(Quantity("shaft.min_safety", "shaft min safety", "safety",
                              lambda r: r.lowest_shaft_safety))
    return found


def governing_key(result: Result) -> str | None:
    """The key of the quantity that holds the governing life, where one does (a1 L10 at a
    reliability other than 90 % without lubrication has none)."""
    choice = result.governing.choice
    prefix = "iso281." if choice.method == "iso281" and result.iso281 is not None else ""
    if choice.modified:
        return f"{prefix}system.l10m_h"
    return f"{prefix}system.l10_h" if choice.reliability == 90.0 else None


def shared_life_quantities(results, repeat_governing: bool = True) -> list[Quantity]:
    """The governing life, then the lives every result carries (L10m only when all give
    lubrication), in the first result's order. ``repeat_governing=False`` leaves out the
    governing row where every result's governing life is one of the other rows."""
    present = [{q.key: q for q in all_quantities(r) if q.kind == "life"} for r in results]
    shared = [q for key, q in present[0].items() if all(key in p for p in present)]
    keys = {governing_key(r) for r in results}
    if not repeat_governing and len(keys) == 1 and None not in keys:
        return shared
    return [governing_quantity(results[0]), *shared]


def ratios_to_first(results, quantity: Quantity) -> list[float | None]:
    """Each result's value over the first one's (None when either is infinite or zero)."""
    values = [float(quantity.of(r)) for r in results]
    first = values[0]
    return [value / first if math.isfinite(value) and math.isfinite(first) and first > 0
            else None for value in values]
