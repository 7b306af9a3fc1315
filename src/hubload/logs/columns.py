"""The channels of a measured log and which file column feeds each of them.

Columns are named like the load-case keys by default; ``--column KEY=HEADER``
maps another header to a channel. Columns the log does not need are ignored.
Measured wheel forces take precedence over forces derived from the hydraulics
or the lateral acceleration, as given keys do in a load-case file.
"""

from __future__ import annotations

import difflib
from dataclasses import dataclass

from hubload.errors import InputError
from hubload.schema import fileformat as limits

CHANNELS: dict[str, str] = {
    "time_s": "time stamp [s]; each sample holds until the next time stamp",
    "wheel_load_kN": "vertical force of the ground on the tyre [kN]",
    "side_force_kN": "force of the ground on the tyre along the axle [kN], + inboard",
    "tractive_force_kN": "longitudinal force at the tyre [kN], + driving, - braking",
    "speed_rpm": "wheel speed [r/min]",
    "speed_kmh": "vehicle speed [km/h]",
    "pressure_bar": "pressure difference across the motor [bar], + drives, - brakes",
    "flow_lpm": "flow through the motor [l/min]",
    "mode": 'displacement mode of a two-speed motor, "full" or "half"',
    "lateral_accel_g": "lateral acceleration [g], + this wheel on the outside of the turn",
    "temperature_C": "bearing operating temperature [C] for the modified life",
}
DISCRETE_CHANNELS = frozenset({"mode"})
LIMITS = {"wheel_load_kN": (0.0, None), "temperature_C": (-40.0, 150.0)}
# The largest magnitude of a sample (the file format's plausibility limits, common
# practice): beyond it a sample is a bad cell, like an empty one, and the --gaps policy
# applies. Time stamps: 10^12 s is over 30,000 years (epoch seconds are about 1.7e9).
PLAUSIBLE = {"time_s": 1e12, "wheel_load_kN": limits.MAX_WHEEL_FORCE_KN,
             "side_force_kN": limits.MAX_WHEEL_FORCE_KN,
             "tractive_force_kN": limits.MAX_WHEEL_FORCE_KN,
             "speed_rpm": limits.MAX_SPEED_RPM, "speed_kmh": limits.MAX_SPEED_KMH,
             "pressure_bar": limits.MAX_PRESSURE_BAR, "flow_lpm": limits.MAX_FLOW_LPM,
             "lateral_accel_g": limits.MAX_LATERAL_G}
SPEED_SOURCES = ("speed_rpm", "speed_kmh", "flow_lpm")
TRACTIVE_SOURCES = ("tractive_force_kN", "pressure_bar")
NEEDS_MOTOR = ("pressure_bar", "flow_lpm")
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
    """Which header feeds each channel that is read, and where each quantity comes from."""

    headers: dict[str, str]
    speed_channel: str
    tractive_channel: str | None
    notes: tuple[str, ...]

    @property
    def hydraulic(self) -> bool:
        return self.tractive_channel == "pressure_bar"


def plan_columns(available: list[str], mapping: dict[str, str], file: str,
                 has_motor: bool = False, has_vehicle: bool = False,
                 has_lubrication: bool = False) -> ColumnPlan:
    """Choose the columns to read from a log whose header row is ``available``."""
    present = set(available)
    for key, header in mapping.items():
        if header not in present:
            raise InputError(f"column {header!r} (mapped to {key}) is not in the log; "
                             f"{close_headers(header, available)}", file=file, key_path=OPTION)
    found = {key: mapping.get(key, key) for key in CHANNELS if mapping.get(key, key) in present}
    repeated = sorted({h for h in found.values() if available.count(h) > 1})
    if repeated:  # the reader would take one of them without a word
        raise InputError("repeated column " + ", ".join(
            f"{h!r} ({available.count(h)} times)" for h in repeated) + " in the header; "
            "expected each column once (rename or remove the copies)", file=file)
    if "time_s" not in found:
        raise missing(file, "time_s", available)
    if "wheel_load_kN" not in found and not (has_vehicle and "lateral_accel_g" in found):
        raise missing(file, "wheel_load_kN", available,
                      " (or lateral_accel_g with a [vehicle] block in the case file)")
    notes: list[str] = []
    speed = first_of(SPEED_SOURCES, found, notes, "speed")
    if speed is None:
        raise InputError("no speed column: expected one of " + ", ".join(SPEED_SOURCES)
                         + f"; {close_headers('speed', available)}; map one with "
                         f"{OPTION} speed_rpm=HEADER", file=file)
    tractive = first_of(TRACTIVE_SOURCES, found, notes, "tractive force")
    for key in NEEDS_MOTOR:
        if key in (speed, tractive) and not has_motor:
            raise InputError(f"the log's {key} column needs a [motor] block in the case file "
                             "(displacement_cc, efficiencies) to turn it into torque and speed",
                             file=file)
    if "temperature_C" in found and not has_lubrication:
        notes.append(f"column {found.pop('temperature_C')!r} (temperature_C) ignored: no "
                     "[lubrication] block")
    if "mode" in found and not has_motor:
        notes.append(f"column {found.pop('mode')!r} (mode) ignored: no [motor] block")
    if "lateral_accel_g" in found and {"wheel_load_kN", "side_force_kN"} <= set(found):
        notes.append(f"column {found.pop('lateral_accel_g')!r} (lateral_accel_g) ignored: "
                     "wheel load and side force are measured")
    if tractive is None:
        notes.append("no tractive_force_kN or pressure_bar column: tractive force taken as 0")
    if "side_force_kN" not in found:
        notes.append("no side_force_kN column: side force " + (
            "from lateral_accel_g" if "lateral_accel_g" in found else "taken as 0"))
    return ColumnPlan(headers=found, speed_channel=speed, tractive_channel=tractive,
                      notes=tuple(notes))


def first_of(sources: tuple[str, ...], found: dict[str, str], notes: list[str],
             what: str) -> str | None:
    """The first source present (measured before derived); the others are dropped."""
    present = [key for key in sources if key in found]
    for unused in present[1:]:
        notes.append(f"column {found.pop(unused)!r} ({unused}) ignored: {what} is taken "
                     f"from {found[present[0]]!r} ({present[0]})")
    return present[0] if present else None


def missing(file: str, key: str, available: list[str], alternative: str = "") -> InputError:
    return InputError(f"missing column {key!r} ({CHANNELS[key]}){alternative}; "
                      f"{close_headers(key, available)}; map another header with "
                      f"{OPTION} {key}=HEADER", file=file)


def close_headers(wanted: str, available: list[str]) -> str:
    close = difflib.get_close_matches(wanted, available, n=3, cutoff=0.4)
    if close:
        return "closest headers: " + ", ".join(repr(c) for c in close)
    shown = ", ".join(repr(h) for h in available[:12])
    return f"the log's headers are {shown}" + (", ..." if len(available) > 12 else "")
