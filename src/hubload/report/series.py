"""Named quantities read from the check's JSON documents (the contract keys).

Sweeps, comparisons and the HTML report draw from these, so a quantity shows up
wherever a file's results carry it (the modified life L10m with a lubrication
block, the shaft's minimum safety with a shaft block) and is left out elsewhere.
"""

from __future__ import annotations

import math
from collections.abc import Callable, Iterable
from dataclasses import dataclass

from hubload.model.lubrication import life_symbol
from hubload.report.numbers import life_h

MISSING = object()


def lookup(document: dict, dotted: str):
    """The value at ``dotted`` (e.g. ``system.l10m_h``), or MISSING when the key is absent."""
    node = document
    for key in dotted.split("."):
        if not isinstance(node, dict) or key not in node:
            return MISSING
        node = node[key]
    return node


def shaft_min_safety(document: dict):
    """Lowest ``min_safety`` of ``shaft.sections[]``: None if infinite, MISSING without a shaft."""
    sections = lookup(document, "shaft.sections")
    if sections is MISSING or not isinstance(sections, list) or not sections:
        return MISSING
    values = [s.get("min_safety") for s in sections if isinstance(s, dict)]
    finite = [v for v in values if isinstance(v, (int, float))]
    return min(finite) if finite else None


@dataclass(frozen=True)
class Series:
    """One plotted/tabulated quantity: a label, its kind (life or safety) and a reader."""

    label: str
    kind: str  # "life" [h] or "safety" [-]
    read: Callable[[dict], object]
    system: bool = False
    modified: bool = False
    key: str = ""  # dotted JSON path of the quantity, where it is a single key

    def values(self, documents: Iterable[dict]) -> list[float]:
        """Values per document; a null life is infinite, a missing value NaN."""
        out = []
        for document in documents:
            value = self.read(document)
            if value is MISSING:
                out.append(math.nan)
            elif value is None:
                out.append(math.inf)
            else:
                out.append(float(value))
        return out


def reader(dotted: str) -> Callable[[dict], object]:
    return lambda document: lookup(document, dotted)


def keyed(label: str, kind: str, dotted: str, **flags) -> Series:
    """A series read from one key of the document."""
    return Series(label, kind, reader(dotted), key=dotted, **flags)


def all_series(document: dict) -> list[Series]:
    """The quantities this document carries, lives first (system, then each bearing)."""
    bearings = lookup(document, "bearings")
    labels = list(bearings) if isinstance(bearings, dict) else []
    modified = life_symbol(document.get("reliability_percent", 90.0))  # l10m_h holds L1m at 99 %
    candidates = [keyed("system L10", "life", "system.l10_h", system=True),
                  keyed(f"system {modified}", "life", "system.l10m_h", system=True, modified=True)]
    for label in labels:
        candidates += [keyed(f"{label} L10", "life", f"bearings.{label}.l10_h"),
                       keyed(f"{label} {modified}", "life", f"bearings.{label}.l10m_h",
                             modified=True)]
    candidates += [keyed(f"{label} s0", "safety", f"bearings.{label}.s0") for label in labels]
    candidates.append(Series("shaft min safety", "safety", shaft_min_safety))
    return [series for series in candidates if series.read(document) is not MISSING]


@dataclass(frozen=True)
class GoverningLife:
    """The life a verdict judges, read from a check document: its symbol, the JSON key that
    holds it and the factor on that key's value."""

    name: str      # L10, L10m, or e.g. L1 / L1m at 99 % reliability
    key: str       # "l10_h" or "l10m_h"
    factor: float  # a1 on a basic L10 at another reliability than 90 %, else 1

    def of(self, node: dict) -> float:
        """This life [h] of a document's ``system`` or ``bearings.<label>`` node (inf for null)."""
        return life_h(node.get(self.key)) * self.factor


def governing_life(document: dict) -> GoverningLife:
    """The life the verdict uses (ISO 281:2007, 9.1-9.2), also where the file gives no target:
    the modified life Lnm = a1 aISO L10 with lubrication (JSON l10m_h, a1 included), else the
    basic life a1 L10."""
    reliability = document.get("reliability_percent", 90.0)
    if "l10m_h" in document.get("system", {}):
        return GoverningLife(life_symbol(reliability), "l10m_h", 1.0)
    a1 = document.get("a1")
    return GoverningLife(life_symbol(reliability, modified=False), "l10_h",
                         1.0 if a1 is None else float(a1))


@dataclass(frozen=True)
class DamageShares:
    """Each case's share of the pair's damage for the life the verdict uses."""

    life: str  # the governing life's symbol, e.g. "L10" or "L10m"
    system_key: str
    bearing_key: str

    def system(self, document: dict) -> list[float]:
        return [case.get(self.system_key) or 0.0 for case in document["cases"]]

    def bearing(self, document: dict, label: str) -> list[float]:
        return [case["bearings"][label].get(self.bearing_key) or 0.0
                for case in document["cases"]]

    def dominant(self, document: dict) -> tuple[int, str, float] | None:
        shares = self.system(document)
        if not shares or max(shares) <= 0:
            return None
        index = max(range(len(shares)), key=shares.__getitem__)
        return index, document["cases"][index]["name"], shares[index]


def damage_shares_of(document: dict) -> DamageShares:
    """Shares of the life the verdict uses (the modified life when the file gives lubrication;
    the factor a1 does not change shares)."""
    life = governing_life(document)
    cases = document["cases"]
    if life.key == "l10m_h" and cases and "system_damage_share_modified" in cases[0]:
        return DamageShares(life.name, "system_damage_share_modified", "damage_share_modified")
    return DamageShares(life.name if life.key == "l10_h" else "L10", "system_damage_share",
                        "damage_share")
