"""The channels of a measured log and which file column feeds each of them.

Columns are named like the load-case keys by default; ``--column KEY=HEADER``
maps another header to a channel. Columns the log does not need are ignored.
"""

from __future__ import annotations

import difflib
from dataclasses import dataclass

from hubload.errors import InputError

CHANNELS: dict[str, str] = {
    "time_s": "time stamp [s]; each sample holds until the next time stamp",
    "wheel_load_kN": "vertical force of the ground on the tyre [kN]",
    "side_force_kN": "force of the ground on the tyre along the axle [kN], + inboard",
    "tractive_force_kN": "longitudinal force at the tyre [kN], + driving, - braking",
    "speed_rpm": "wheel speed [r/min]",
    "speed_kmh": "vehicle speed [km/h]",
}
DISCRETE_CHANNELS: frozenset[str] = frozenset()
MINIMUM = {"wheel_load_kN": 0.0}
OPTIONAL_ZERO = ("side_force_kN", "tractive_force_kN")
SPEED_SOURCES = ("speed_rpm", "speed_kmh")
OPTION = "--column"


def parse_column_options(options: tuple[str, ...] | list[str]) -> dict[str, str]:
    """``KEY=HEADER`` strings -> {channel: header}; unknown channels are errors."""
    mapping: dict[str, str] = {}
    for option in options:
        key, separator, header = option.partition("=")
        key, header = key.strip(), header.strip()
        if not separator or not key or not header:
            raise InputError(f"expected KEY=HEADER, got {option!r}", key_path=OPTION)
        if key not in CHANNELS:
            close = difflib.get_close_matches(key, CHANNELS, n=1, cutoff=0.5)
            hint = f"did you mean '{close[0]}'?" if close else "channels: " + ", ".join(CHANNELS)
            raise InputError(f"unknown channel {key!r}; {hint}", key_path=OPTION)
        mapping[key] = header
    return mapping


@dataclass(frozen=True)
class ColumnPlan:
    """Which header feeds each channel that is read, and how the rest is obtained."""

    headers: dict[str, str]
    zero_channels: tuple[str, ...]
    notes: tuple[str, ...]

    @property
    def speed_channel(self) -> str:
        return next(key for key in SPEED_SOURCES if key in self.headers)


def plan_columns(available: list[str], mapping: dict[str, str], file: str) -> ColumnPlan:
    """Choose the columns to read from a log whose header row is ``available``."""
    present = set(available)
    for key, header in mapping.items():
        if header not in present:
            raise InputError(f"column {header!r} (mapped to {key}) is not in the log; "
                             f"{close_headers(header, available)}", file=file, key_path=OPTION)
    found = {key: mapping.get(key, key) for key in CHANNELS if mapping.get(key, key) in present}
    notes = []
    require(found, "time_s", available, file)
    require(found, "wheel_load_kN", available, file)
    speeds = [key for key in SPEED_SOURCES if key in found]
    if not speeds:
        raise InputError("no speed column: expected one of " + ", ".join(SPEED_SOURCES)
                         + f"; {close_headers('speed', available)}; map one with "
                         f"{OPTION} speed_rpm=HEADER", file=file)
    for unused in speeds[1:]:
        notes.append(f"column {found.pop(unused)!r} ({unused}) ignored: speed is taken "
                     f"from {found[speeds[0]]!r} ({speeds[0]})")
    zero = tuple(key for key in OPTIONAL_ZERO if key not in found)
    notes += [f"no {key} column: taken as 0" for key in zero]
    return ColumnPlan(headers=found, zero_channels=zero, notes=tuple(notes))


def require(found: dict[str, str], key: str, available: list[str], file: str) -> None:
    if key not in found:
        raise InputError(f"missing column {key!r} ({CHANNELS[key]}); "
                         f"{close_headers(key, available)}; map another header with "
                         f"{OPTION} {key}=HEADER", file=file)


def close_headers(wanted: str, available: list[str]) -> str:
    close = difflib.get_close_matches(wanted, available, n=3, cutoff=0.4)
    if close:
        return "closest headers: " + ", ".join(repr(c) for c in close)
    shown = ", ".join(repr(h) for h in available[:12])
    return f"the log's headers are {shown}" + (", ..." if len(available) > 12 else "")
