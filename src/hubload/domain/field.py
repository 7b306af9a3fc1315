"""Field data: operating hours of units that failed or are still running (suspended)."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np


@dataclass(frozen=True)
class FieldData:
    """One row per unit: hours [h] run, failed (True) or suspended, optional id and position."""

    source: str
    hours: np.ndarray
    failed: np.ndarray
    unit: tuple[str, ...] | None = None
    position: tuple[str, ...] | None = None
    row_number: tuple[int, ...] = ()   # each unit's row in the file (for messages)

    @property
    def failures(self) -> int:
        return int(self.failed.sum())

    @property
    def suspensions(self) -> int:
        return int((~self.failed).sum())

    def by_position(self) -> dict[str, tuple[int, int]]:
        """Failures and suspensions per wheel position (empty without a position column)."""
        if self.position is None:
            return {}
        counts: dict[str, list[int]] = {}
        for position, failed in zip(self.position, self.failed):
            counts.setdefault(position, [0, 0])[0 if failed else 1] += 1
        return {name: (found[0], found[1]) for name, found in counts.items()}
