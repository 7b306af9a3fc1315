"""A machine as the engine computes on it: its wheel ends, each an ordinary Study.

The machine file's operations become one load case per wheel end and operation
(two for an operation spent half mirrored); every wheel end's Study carries them
as its cases, in the same order, so that case ``j`` is the same moment of the
machine's duty at every wheel end.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.domain.study import Study
from hubload.model.machine import Machine


@dataclass(frozen=True)
class WheelEnd:
    """One wheel of the machine with its wheel end's study (the derived spectrum as cases).

    ``document`` is the load-case document the study was built from (the wheel end file
    with the machine's [project] and the derived [[case]] blocks): written out, it gives
    the same lives through ``hubload check``.
    """

    name: str                # "front left", ...
    axle: str                # the axle's name from the machine file
    position: str            # front | rear
    side: str                # left | right
    wheel_end_file: str      # the wheel end file, as the machine file names it (resolved)
    study: Study
    document: dict


@dataclass(frozen=True)
class MachineStudy:
    """The machine, its operations and the wheel ends that have results (front left first)."""

    source: str
    title: str
    target_life_h: float | None
    reliability_percent: float
    machine: Machine
    operation_names: tuple[str, ...]
    case_operation: np.ndarray      # per case: index of its operation
    case_mirrored: np.ndarray       # per case: the mirrored half of its operation
    case_names: tuple[str, ...]
    time_fraction: np.ndarray       # per case
    speed_kmh: np.ndarray           # per case: ground speed of the machine's CoG
    wheel_ends: tuple[WheelEnd, ...]
