"""The [shaft] table of a load-case file and its sections (a contract: keys may be added,
never renamed); the check is described in docs/shaft.md."""

from __future__ import annotations

from hubload.model.shaft.strength import SURFACES
from hubload.model.shaft.stress import CRITERIA
from hubload.schema.limits import (MAX_KT, MAX_NOTCH_RADIUS_MM, MAX_POSITION_MM, MAX_RATING_KN,
                                   MAX_REQUIRED_SAFETY, MAX_STRENGTH_MPA, MIN_NOTCH_RADIUS_MM,
                                   MIN_REQUIRED_SAFETY, MIN_STRENGTH_MPA)
from hubload.schema.spec import Choice, Field, Table

SHAFT_SECTION = Table(
    name="section",
    array=True,
    doc="A section of the wheel shaft to check: a shoulder fillet, a groove, a bearing seat "
        "(repeat the block for each section).",
    fields=(
        Field("name", "string", "Name of the section (unique).", required=True,
              example="flange fillet"),
        Field("position_mm", "number", "Axial position of the section [mm], same axis as the "
              "bearings and the wheel offset.", required=True, minimum=-MAX_POSITION_MM,
              maximum=MAX_POSITION_MM, example=70),
        Field("diameter_mm", "number", "Diameter of the solid shaft at the section [mm] (the "
              "smaller diameter at a shoulder), 2.79-254 mm.", required=True,
              exclusive_minimum=0, example=60),
        Field("kt_bending", "number", "Stress-concentration factor Kt in bending (1: no notch).",
              default=1.0, minimum=1, maximum=MAX_KT, example=1.7),
        Field("kt_torsion", "number", "Stress-concentration factor Kts in torsion (1: no notch).",
              default=1.0, minimum=1, maximum=MAX_KT, example=1.4),
        Field("notch_sensitivity", "number", "Notch sensitivity q (Kf = 1 + q (Kt - 1)); "
              "default 1 (Kf = Kt) unless notch_radius_mm is given.", minimum=0, maximum=1),
        Field("notch_radius_mm", "number", "Notch (fillet) radius [mm]; q is then estimated "
              "for steel by Neuber's equation.", minimum=MIN_NOTCH_RADIUS_MM,
              maximum=MAX_NOTCH_RADIUS_MM, example=3),
        Field("carries_torque", "boolean", "Whether the drive torque (tractive force x rolling "
              "radius) passes through this section.", default=True, example=True),
    ),
    choices=(Choice("notch sensitivity", groups=(("notch_sensitivity",), ("notch_radius_mm",)),
                    required=False,
                    doc="Give notch_sensitivity or notch_radius_mm, not both."),),
)

SHAFT_PERMISSIBLE = Table(
    name="permissible",
    required=False,
    doc="The motor supplier's curve of permissible radial wheel load against the position of "
        "the load (same axis as the wheel offset); interpolated linearly, never extrapolated.",
    fields=(
        Field("load_position_mm", "number-list", "Positions of the curve's points [mm], "
              "strictly increasing.", required=True, minimum=-MAX_POSITION_MM,
              maximum=MAX_POSITION_MM, example=(0, 50, 100, 150)),
        Field("radial_load_kN", "number-list", "Permissible radial wheel load at each position "
              "[kN].", required=True, exclusive_minimum=0, maximum=MAX_RATING_KN,
              example=(60, 45, 35, 28)),
    ),
)

SHAFT = Table(
    name="shaft",
    required=False,
    doc="Fatigue and yield check of the wheel (motor) shaft, steel, by the method of Shigley's "
        "Mechanical Engineering Design, 10th ed.",
    fields=(
        Field("ultimate_strength_MPa", "number", "Tensile strength Sut of the shaft steel [MPa].",
              required=True, minimum=MIN_STRENGTH_MPA, maximum=MAX_STRENGTH_MPA, example=900),
        Field("yield_strength_MPa", "number", "Yield strength Sy of the shaft steel [MPa].",
              required=True, minimum=MIN_STRENGTH_MPA, maximum=MAX_STRENGTH_MPA, example=700),
        Field("surface", "string", "Surface finish at the checked sections (Marin surface "
              "factor).", required=True, choices=SURFACES,
              example="machined"),
        Field("temperature_C", "number", "Operating temperature of the shaft [deg C] (Marin "
              "temperature factor; 1 up to 21 C).", minimum=-60, maximum=538),
        Field("reliability_percent", "number", "Reliability of the endurance limit [%] (Marin "
              "reliability factor; 50 = the mean endurance limit).", default=50.0, minimum=50,
              exclusive_maximum=100, example=99),
        Field("criterion", "string", "Fatigue criterion of the safety factor.",
              default="goodman", choices=CRITERIA),
        Field("required_safety", "number", "Smallest acceptable fatigue and yield safety factor "
              "(default 1.5, common practice for shafts under well-known loads).",
              default=1.5, minimum=MIN_REQUIRED_SAFETY, maximum=MAX_REQUIRED_SAFETY),
    ),
    tables=(SHAFT_SECTION, SHAFT_PERMISSIBLE),
)
