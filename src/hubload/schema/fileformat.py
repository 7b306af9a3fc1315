"""The load-case file format (a contract: keys may be added, never renamed).

Positions are along the shaft axis from the motor's mounting face (x = 0),
positive outboard (towards the wheel). Units are part of every key name.
"""

from __future__ import annotations

from hubload.schema.spec import Choice, Field, Table

PROJECT = Table(
    name="project",
    doc="What the file is about and what it must reach.",
    required=False,
    fields=(
        Field("title", "string", "Title shown on every output (default: the file name).",
              example="Yard loader, front left wheel"),
        Field("target_life_h", "number", "Required system life of the bearing pair [h].",
              exclusive_minimum=0, example=5000),
    ),
)

WHEEL = Table(
    name="wheel",
    doc="Where the wheel sits on the shaft and how large the tyre is.",
    fields=(
        Field("offset_mm", "number", "Axial position of the wheel centre plane [mm] "
              "(may be negative: wheel centre inboard of the mounting face).",
              required=True, example=95),
        Field("loaded_radius_mm", "number", "Contact patch to wheel axis under load [mm].",
              required=True, exclusive_minimum=0, example=330),
        Field("rolling_radius_mm", "number", "Rolling radius [mm], used for km/h <-> r/min and "
              "for distances (default: loaded_radius_mm).", exclusive_minimum=0),
    ),
)

BEARING_FIELDS = (
    Field("name", "string", "Label of the bearing (optional).", example="tapered roller"),
    Field("position_mm", "number", "Axial position of the bearing's effective load centre [mm].",
          required=True),
    Field("C_kN", "number", "Basic dynamic load rating C [kN] (ISO 281).",
          required=True, exclusive_minimum=0),
    Field("C0_kN", "number", "Basic static load rating C0 [kN] (ISO 76).",
          required=True, exclusive_minimum=0),
    Field("e", "number", "Limit of Fa/Fr for X = 1, Y = 0 (ISO 281).", exclusive_minimum=0),
    Field("Y", "number", "Axial load factor Y for Fa/Fr > e (ISO 281).", exclusive_minimum=0),
    Field("Y0", "number", "Static axial load factor Y0 (ISO 76).", exclusive_minimum=0),
    Field("contact_angle_deg", "number", "Contact angle [deg]; gives e = 1.5 tan a, "
          "Y = 0.4 cot a, Y0 = 0.22 cot a when e, Y, Y0 are not given.",
          exclusive_minimum=0, exclusive_maximum=60),
)

BEARING_FACTORS = Choice(
    "load factors", groups=(("e", "Y", "Y0"), ("contact_angle_deg",)),
    doc="Give either e, Y and Y0 from the bearing's data, or contact_angle_deg.")


def bearing_table(name: str, doc: str, position_mm: float) -> Table:
    examples = {"position_mm": position_mm, "C_kN": 160 if name == "outboard" else 140,
                "C0_kN": 200 if name == "outboard" else 175, "e": 0.4, "Y": 1.5, "Y0": 0.8}
    fields = tuple(Field(**{**f.__dict__, "example": examples.get(f.key, f.example)})
                   for f in BEARING_FIELDS)
    return Table(name=name, doc=doc, fields=fields, choices=(BEARING_FACTORS,))


PAIR = Table(
    name="pair",
    doc="The pair of tapered roller bearings in the motor's front housing.",
    fields=(
        Field("arrangement", "string", "How the two bearings are mounted.",
              required=True, choices=("back-to-back", "face-to-face"), example="back-to-back"),
    ),
    tables=(
        bearing_table("outboard", "The bearing nearer the wheel.", 40),
        bearing_table("inboard", "The bearing farther from the wheel.", -30),
    ),
)

CASE = Table(
    name="case",
    array=True,
    doc="One load case of the duty spectrum (repeat the block for each case).",
    fields=(
        Field("name", "string", "Name of the case.", required=True, example="straight travel"),
        Field("time_percent", "number", "Share of operating time [%]; all cases add to 100.",
              required=True, minimum=0, maximum=100, example=100),
        Field("wheel_load_kN", "number", "Vertical force of the ground on the tyre [kN].",
              required=True, minimum=0, example=25),
        Field("side_force_kN", "number", "Force of the ground on the tyre along the axle [kN], "
              "positive towards the vehicle centreline (inboard).", default=0.0, example=0),
        Field("tractive_force_kN", "number", "Longitudinal force at the tyre [kN], "
              "+ driving, - braking.", default=0.0, example=5),
        Field("speed_rpm", "number", "Wheel speed [r/min] (0: standstill).", minimum=0),
        Field("speed_kmh", "number", "Vehicle speed [km/h], converted with the rolling radius.",
              minimum=0, example=8),
    ),
    choices=(Choice("speed", groups=(("speed_rpm",), ("speed_kmh",)),
                    doc="Give exactly one of speed_rpm or speed_kmh."),),
)

FORMAT = Table(
    name="",
    doc="A hubload load-case file.",
    tables=(PROJECT, WHEEL, PAIR, CASE),
)
