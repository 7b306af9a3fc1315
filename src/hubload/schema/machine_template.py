"""The commented starting machine file of ``hubload template --machine``.

Written by the template writer of :mod:`hubload.schema.export` from the machine file's
format, every key with its doc and limits; the two ``[[axle]]`` blocks and the operations
need values of their own (one front and one rear axle; operations whose time shares add to
100 %), which this module gives as data. The file reads as it is, together with a wheel end
file named ``wheel_end.toml`` beside it (a load-case file without the tables of
:data:`WHEEL_END_DROPS`).
"""

from __future__ import annotations

from hubload.schema.export import template_lines
from hubload.schema.fleetformat import FLEET, PER_MACHINE, RELIABILITY
from hubload.schema.machineformat import AXLE, MACHINE, OPERATION, PAYLOAD, PROJECT

WHEEL_END_FILE = "wheel_end.toml"
# What a wheel end file leaves to the machine file (casefile/machinefile.py refuses them).
WHEEL_END_DROPS = ("[[case]]", "[project]", "[vehicle]", "[fleet]", "[reliability]")
PROJECT_VALUES = {"title": "My machine", "target_life_h": 10000,
                  "reliability_percent": 90}
AXLES = (
    {"name": "front axle", "position": "front", "track_mm": 1650, "driven": True,
     "oscillating": False, "pivot_height_mm": 0, "wheel_end": WHEEL_END_FILE},
    {"name": "rear axle", "position": "rear", "track_mm": 1650, "driven": True,
     "oscillating": True, "pivot_height_mm": 0, "wheel_end": WHEEL_END_FILE},
)
OPERATIONS = (
    {"name": "travel, empty", "time_percent": 50, "payload_kg": 0, "speed_kmh": 10},
    {"name": "travel, loaded", "time_percent": 30, "payload_kg": 1500, "speed_kmh": 8},
    {"name": "turning, loaded", "time_percent": 20, "payload_kg": 1500, "speed_kmh": 6,
     "lateral_accel_g": 0.15},
)
HEADER = f"""# hubload machine file (hubload machine FILE). Units are part of every key name.
# Machine axes: X forward, Y to the left, Z up (docs/machine.md). Each [[axle]] names a
# wheel end file, here {WHEEL_END_FILE} beside this file: a load-case file describing the
# left wheel (the right wheel is its mirror image), without
# {", ".join(WHEEL_END_DROPS)} (take `hubload template` and delete them).
# [fleet] and [reliability] here are read by `hubload forecast` only.
# Replace every value with your machine's.

"""


def machine_template_text() -> str:
    """A commented machine file that ``hubload machine`` reads with a wheel end file."""
    lines = template_lines(PROJECT, PROJECT.name, PROJECT_VALUES)
    lines += template_lines(MACHINE, MACHINE.name) + template_lines(PAYLOAD, PAYLOAD.name)
    for values in AXLES:
        lines += template_lines(AXLE, AXLE.name, values)
    for values in OPERATIONS:
        lines += template_lines(OPERATION, OPERATION.name, values)
    # [fleet] and [reliability] (hubload forecast) as in a load-case file's template, less
    # wheel_ends_per_machine, which a machine file refuses: the machine has its own.
    for table in (FLEET, RELIABILITY):
        lines += [line for line in template_lines(table, table.name)
                  if not line.startswith(PER_MACHINE)]
    return HEADER + "\n".join(lines)
