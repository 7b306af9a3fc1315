"""The machine file format (a contract: keys may be added, never renamed).

A machine file describes a two-axle machine, its operations and, per axle, the
wheel end file both wheels of that axle use (a load-case file without
``[[case]]`` blocks). Units are part of every key name. Machine axes: X forward,
Y to the left, Z up; see docs/machine.md.
"""

from __future__ import annotations

from hubload.model.machine import DRIVE_RULES
from hubload.schema.fileformat import PROJECT, TIME_SUM_TOLERANCE_PERCENT
from hubload.schema.fleetformat import FLEET, RELIABILITY
from hubload.schema.limits import (MAX_LATERAL_G, MAX_RADIUS_MM, MAX_SPEED_KMH, MAX_VEHICLE_MM,
                                   MIN_RADIUS_MM, MIN_TRACK_MM)
from hubload.schema.spec import Field, Table

AXLE_POSITIONS = ("front", "rear")
# Plausibility limits (common practice): the heaviest wheeled earthmovers weigh a few hundred
# tonnes (from memory); 2,000 t is beyond any of them. Rolling resistance coefficients run
# from about 0.01 (tyre on concrete) to about 0.3 (soft sand, from memory).
MAX_MASS_KG = 2.0e6
MAX_ROLLING_RESISTANCE = 0.5
# Longitudinal accelerations and slopes: friction-limited (adhesion <= 2, as the lateral one);
# a 100 % grade is 45 deg, beyond what a wheeled machine climbs or crosses.
MAX_ACCEL_G = MAX_LATERAL_G
MAX_SLOPE_PERCENT = 100.0
# A machine's total tractive demand: adhesion (<= 2) times the heaviest machine's weight.
MAX_TRACTIVE_KN = 2.0 * MAX_MASS_KG * 9.80665 / 1000.0

MACHINE = Table(
    name="machine",
    doc="The machine without payload: mass, centre of gravity, wheelbase and drive.",
    fields=(
        Field("mass_kg", "number", "Operating mass without payload [kg].", required=True,
              exclusive_minimum=0, maximum=MAX_MASS_KG, example=4500),
        Field("cog_from_front_axle_mm", "number", "Centre of gravity behind the front axle "
              "[mm] (negative: ahead of it).", required=True, minimum=-MAX_VEHICLE_MM,
              maximum=MAX_VEHICLE_MM, example=1050, label="CoG behind front axle"),
        Field("cog_height_mm", "number", "Height of the centre of gravity above the ground "
              "[mm].", required=True, minimum=0, maximum=MAX_VEHICLE_MM, example=950,
              label="CoG height"),
        Field("wheelbase_mm", "number", "Front axle to rear axle [mm].", required=True,
              minimum=MIN_TRACK_MM, maximum=MAX_VEHICLE_MM, example=2300, label="wheelbase"),
        Field("rolling_resistance", "number", "Rolling resistance coefficient f of the tyres "
              "(force f x wheel load against the travel of every rolling wheel; default 0).",
              default=0.0, minimum=0, maximum=MAX_ROLLING_RESISTANCE, example=0.04),
        Field("drive", "string", "How the driven wheels share the tractive force: "
              "equal-torque (motors in a parallel circuit see one pressure, so equal "
              "displacements give equal torque) or by-load (in proportion to the wheel loads).",
              default="equal-torque", choices=DRIVE_RULES),
    ),
)

PAYLOAD = Table(
    name="payload",
    required=False,
    doc="Where the payload sits (needed when an operation carries payload_kg > 0).",
    fields=(
        Field("cog_from_front_axle_mm", "number", "Payload centre of gravity behind the front "
              "axle [mm] (negative: ahead of it, a bucket).", required=True,
              minimum=-MAX_VEHICLE_MM, maximum=MAX_VEHICLE_MM, example=-900),
        Field("cog_height_mm", "number", "Height of the payload's centre of gravity above the "
              "ground [mm].", required=True, minimum=0, maximum=MAX_VEHICLE_MM, example=900),
    ),
)

AXLE = Table(
    name="axle",
    array=True,
    doc="One axle (exactly two blocks: a front and a rear axle).",
    fields=(
        Field("name", "string", "Name of the axle.", required=True, example="front axle"),
        Field("position", "string", "Which axle this is.", required=True,
              choices=AXLE_POSITIONS, example="front"),
        Field("track_mm", "number", "Track width, tyre centre to tyre centre [mm].",
              required=True, minimum=MIN_TRACK_MM, maximum=MAX_VEHICLE_MM, example=1650,
              label="track"),
        Field("driven", "boolean", "Whether the axle's wheels are driven (a hub motor in each).",
              required=True, example=True),
        Field("oscillating", "boolean", "A pendulum axle, free to roll about a pivot on the "
              "machine's centreline: it takes no roll moment (with its pivot at ground "
              "level; see pivot_height_mm); the other axle takes all of it. At most one axle "
              "oscillates.", default=False),
        Field("pivot_height_mm", "number", "Height of an oscillating axle's pivot above the "
              "ground [mm] (default 0): the axle then takes its own side force times this "
              "height as roll moment.", default=0.0, minimum=0, maximum=MAX_VEHICLE_MM),
        Field("wheel_end", "string", "Path of the wheel end file both wheels of this axle use "
              "(relative to this file): a load-case file without [[case]] blocks, describing "
              "the left wheel; the right wheel is its mirror image. Without it the axle carries "
              "load but has no results.", example="yard_loader_wheel_end.toml"),
        Field("rolling_radius_mm", "number", "Rolling radius of an axle without wheel_end [mm] "
              "(its wheels' share of an equal-torque drive); with wheel_end the wheel end file "
              "gives it.", minimum=MIN_RADIUS_MM, maximum=MAX_RADIUS_MM),
    ),
)

OPERATION = Table(
    name="operation",
    array=True,
    doc="One steady operation of the machine (repeat the block for each).",
    fields=(
        Field("name", "string", "Name of the operation (unique).", required=True,
              example="travel, bucket loaded"),
        Field("time_percent", "number", "Share of operating time [%]; all operations add to "
              f"100 (within {TIME_SUM_TOLERANCE_PERCENT:g}).", required=True, minimum=0,
              maximum=100 + TIME_SUM_TOLERANCE_PERCENT, example=30),
        Field("payload_kg", "number", "Payload carried [kg] (default 0; needs [payload]).",
              default=0.0, minimum=0, maximum=MAX_MASS_KG, example=1500),
        Field("speed_kmh", "number", "Ground speed of the machine's centre of gravity [km/h] "
              "(0: standstill).", required=True, minimum=0, maximum=MAX_SPEED_KMH, example=8),
        Field("accel_g", "number", "Longitudinal acceleration [g]: + accelerating, - braking "
              "(default 0).", default=0.0, minimum=-MAX_ACCEL_G, maximum=MAX_ACCEL_G),
        Field("lateral_accel_g", "number", "Steady lateral acceleration [g], + turning left "
              "(default 0); the turning radius is v^2 / (lateral_accel_g g).", default=0.0,
              minimum=-MAX_LATERAL_G, maximum=MAX_LATERAL_G),
        Field("grade_percent", "number", "Grade along the travel [%], + uphill (default 0).",
              default=0.0, minimum=-MAX_SLOPE_PERCENT, maximum=MAX_SLOPE_PERCENT),
        Field("cross_slope_percent", "number", "Cross slope across the machine [%], + left "
              "side higher (the machine's roll angle, tan = percent / 100; default 0).",
              default=0.0, minimum=-MAX_SLOPE_PERCENT, maximum=MAX_SLOPE_PERCENT),
        Field("tractive_force_kN", "number", "Total tractive force the machine's driven wheels "
              "give [kN], + driving, - braking (default: from mass, grade, rolling resistance "
              "and accel_g; a larger one pushes against something at ground level).",
              minimum=-MAX_TRACTIVE_KN, maximum=MAX_TRACTIVE_KN),
        Field("temperature_C", "number", "Bearing operating temperature in this operation [C] "
              "(needs [lubrication] in the wheel end files; default: theirs).",
              minimum=-40, maximum=150),
        Field("mirror", "boolean", "An operation with a lateral component spends half its "
              "time mirrored: left turn <-> right turn, slope side swapped (default true).",
              default=True),
    ),
)

MACHINE_FORMAT = Table(
    name="",
    doc="A hubload machine file.",
    # [fleet] and [reliability] as in a load-case file (`hubload forecast`), except that
    # fleet.wheel_ends_per_machine is refused: the machine has its own four wheel ends
    # (casefile/fleet.py).
    tables=(PROJECT, MACHINE, PAYLOAD, AXLE, OPERATION, FLEET, RELIABILITY),
)
