"""The load-case file format (a contract: keys may be added, never renamed).

Positions are along the shaft axis from the motor's mounting face (x = 0),
positive outboard (towards the wheel). Units are part of every key name.
"""

from __future__ import annotations

from hubload.model.lubrication import (CONTAMINATION_LEVELS, GREASE_CLEANLINESS,
                                       RELIABILITY_MAX_PERCENT, RELIABILITY_MIN_PERCENT)
from hubload.model.shaft.strength import SURFACES
from hubload.model.shaft.stress import CRITERIA
from hubload.model.materials import MATERIALS
from hubload.model.operating import DEFAULT_ADHESION_MU
from hubload.model.setting import SETTING_BASES
from hubload.model.tapered_pair import ARRANGEMENTS
from hubload.schema.spec import Choice, Field, Table

# Choices and limits the model's tables define are taken from them, so that the validator
# can never let through a value the model has no entry for.

VERDICT_BASES = ("shorter", "iso281", "refined")
MATERIAL_NAMES = tuple(MATERIALS)
TIME_SUM_TOLERANCE_PERCENT = 0.5

# Plausibility limits (common practice): generous bounds beyond anything a wheel driven by a
# hydraulic hub motor meets, so that no real machine is refused while a unit slip (m for mm,
# N for kN) or a hostile value is, before it can overflow in a unit conversion.
# Positions along the shaft and the wheel offset: hub motors carry the wheel within a few
# hundred mm of their mounting face; 2 m is beyond any of them.
MAX_POSITION_MM = 2000.0
# Tyre radii: the smallest wheels on such drives are about 200 mm across, the largest
# earthmover tyres about 4 m (radius 2 m, from memory).
MIN_RADIUS_MM, MAX_RADIUS_MM = 50.0, 2500.0
# Wheel forces: the heaviest off-road tyres carry about 1,000 kN (100 t, from memory); the
# limit doubles it. Side and tractive forces stay below adhesion x load (adhesion <= 2).
MAX_WHEEL_FORCE_KN = 2000.0
# Speeds: low-speed high-torque motors run up to a few hundred r/min; a road wheel at
# 300 km/h with a 0.3 m radius turns about 2,650 r/min.
MAX_SPEED_RPM, MAX_SPEED_KMH = 5000.0, 300.0
# Hydraulics: wheel motors are rated up to about 450-500 bar; 2,000 bar is beyond any pump.
MAX_PRESSURE_BAR, MAX_FLOW_LPM, MAX_DISPLACEMENT_CC = 2000.0, 10000.0, 100000.0
# The smallest hydraulic motors displace a few cm3 per revolution; their efficiencies lie
# between about 0.8 and 0.98: below 10 % no motor drives a wheel (and a tiny one overflowed
# the braking speed, flow / efficiency).
MIN_DISPLACEMENT_CC, MIN_EFFICIENCY = 1.0, 0.1
# Lateral acceleration: friction-limited by the adhesion coefficient (<= 2).
MAX_LATERAL_G = 3.0
# Bearings: catalogue tapered roller bearings span about C = 10 kN (10 mm bore) to tens of MN
# (metre-size, from memory).
MIN_RATING_KN, MAX_RATING_KN = 0.1, 100000.0
MIN_DIAMETER_MM, MAX_DIAMETER_MM = 5.0, 5000.0
MAX_ROLLER_MM, MAX_ROLLERS, MAX_CROWN_DROP_UM = 500.0, 500, 1000.0
# Load factors: e = 1.5 tan a and Y = 0.4 cot a for angles of 1 to 60 deg stay below these.
MAX_E, MAX_Y = 5.0, 50.0
# Y = 0.4 cot a is 0.23 at 60 deg, the steepest angle allowed; 0.1 is below any bearing (a
# tiny Y overflowed the induced axial force 0.5 Fr / Y).
MIN_Y = 0.1
# Rollers: under a millimetre no tapered roller is made; notch radii under 10 um are cracks
# (Neuber's sqrt(a / r) overflowed at a radius of 5e-324 mm).
MIN_ROLLER_MM, MIN_NOTCH_RADIUS_MM = 0.5, 0.01
# A required safety factor below 1 would accept a computed failure.
MIN_REQUIRED_SAFETY = 1.0
MIN_CONTACT_ANGLE_DEG = 1.0
# A life target of a million hours is over a century of continuous running; below an hour
# no drive is designed (and a target of 1e-308 h overflowed the load margin, life / target).
MIN_TARGET_LIFE_H, MAX_TARGET_LIFE_H = 1.0, 1e6
MAX_VISCOSITY_CST = 100000.0   # ISO VG 3200, the top grade, is 3,200 mm2/s at 40 C
MAX_AXLE_LOAD_KN, MIN_TRACK_MM, MAX_VEHICLE_MM = 2 * MAX_WHEEL_FORCE_KN, 100.0, 10000.0
# Shaft steels: from about 300 MPa (mild steel) to about 2,500 MPa (maraging, from memory).
MIN_STRENGTH_MPA, MAX_STRENGTH_MPA = 100.0, 5000.0
MAX_KT, MAX_NOTCH_RADIUS_MM, MAX_REQUIRED_SAFETY = 10.0, 100.0, 10.0

PROJECT = Table(
    name="project",
    doc="What the file is about and what it must reach.",
    required=False,
    fields=(
        Field("title", "string", "Title shown on every output (default: the file name).",
              example="Yard loader, front left wheel"),
        Field("target_life_h", "number", "Required life of the drive [h]: the bearing pair's "
              "system life and, with a [shaft] table, the shaft's fatigue life.",
              minimum=MIN_TARGET_LIFE_H, maximum=MAX_TARGET_LIFE_H, example=5000),
        Field("reliability_percent", "number", "Reliability R [%] of the lives and the verdict "
              "(default 90: L10; 99 gives L1 with a1 = 0.25, ISO 281).",
              minimum=RELIABILITY_MIN_PERCENT, maximum=RELIABILITY_MAX_PERCENT, example=90),
        Field("method", "string", "How the pair's lives are computed: iso281 (the ISO 281 rule "
              "for a pair set to zero clearance) or refined (internal load distribution with the "
              "bearing setting, ISO/TS 16281 reference life; needs each bearing's internal "
              "geometry; see docs/refined-method.md). `hubload check --method` overrides it.",
              default="iso281", choices=("iso281", "refined")),
        Field("verdict_basis", "string", "Which life the verdict judges with the refined "
              "method: shorter (the shorter of the ISO 281 rule's life and the refined life, "
              "named), iso281 or refined. The refined (ISO/TS 16281) life carries the "
              "line-contact exponent 4 where ISO 281 uses 10/3, so at light loads it is longer "
              "for reasons unrelated to the bearing setting; see docs/refined-method.md. "
              "Without the refined method the ISO 281 life is the only one.",
              default="shorter", choices=VERDICT_BASES),
    ),
)

WHEEL = Table(
    name="wheel",
    doc="Where the wheel sits on the shaft and how large the tyre is.",
    fields=(
        Field("offset_mm", "number", "Axial position of the wheel centre plane [mm] "
              "(may be negative: wheel centre inboard of the mounting face).",
              required=True, minimum=-MAX_POSITION_MM, maximum=MAX_POSITION_MM, example=95,
              label="wheel offset"),
        Field("loaded_radius_mm", "number", "Contact patch to wheel axis under load [mm].",
              required=True, minimum=MIN_RADIUS_MM, maximum=MAX_RADIUS_MM, example=330,
              label="loaded radius"),
        Field("rolling_radius_mm", "number", "Rolling radius [mm], used for km/h <-> r/min and "
              "for distances (default: loaded_radius_mm).", minimum=MIN_RADIUS_MM,
              maximum=MAX_RADIUS_MM),
        Field("adhesion_mu", "number", "Tyre-ground adhesion coefficient: a tractive or braking "
              "force above adhesion_mu x wheel load is capped there and the case flagged "
              "(0.6: common practice for tyres on dry ground; see docs/operating-points.md).",
              default=DEFAULT_ADHESION_MU, exclusive_minimum=0, maximum=2),
    ),
)

MOTOR = Table(
    name="motor",
    doc="The hydraulic wheel motor: needed by cases given as pressure_bar and flow_lpm.",
    required=False,
    fields=(
        Field("displacement_cc", "number", "Displacement per revolution in full mode [cm3].",
              required=True, minimum=MIN_DISPLACEMENT_CC, maximum=MAX_DISPLACEMENT_CC,
              example=750),
        Field("half_mode", "boolean", "The motor can switch to half displacement (two-speed "
              "motor): cases may then give mode = \"half\".", default=False),
        Field("efficiency_volumetric", "number", "Volumetric efficiency (speed = flow x "
              "efficiency / displacement; default 1: ideal).", default=1.0,
              minimum=MIN_EFFICIENCY, maximum=1, example=0.96),
        Field("efficiency_mechanical", "number", "Hydraulic-mechanical efficiency (torque = "
              "pressure x displacement x efficiency / 2 pi; default 1: ideal).", default=1.0,
              minimum=MIN_EFFICIENCY, maximum=1, example=0.92),
        Field("max_pressure_bar", "number", "Rated pressure difference [bar]; cases above it "
              "are flagged.", exclusive_minimum=0, maximum=MAX_PRESSURE_BAR, example=350),
        Field("max_speed_rpm", "number", "Rated speed [r/min]; cases above it are flagged.",
              exclusive_minimum=0, maximum=MAX_SPEED_RPM, example=200),
    ),
)

VEHICLE = Table(
    name="vehicle",
    doc="The axle that carries this wheel: lets cases give lateral_accel_g instead of "
        "wheel_load_kN and side_force_kN (steady-state lateral load transfer).",
    required=False,
    fields=(
        Field("axle_load_kN", "number", "Static load on this wheel's axle [kN] (both wheels).",
              required=True, exclusive_minimum=0, maximum=MAX_AXLE_LOAD_KN, example=30),
        Field("track_mm", "number", "Track width of the axle, tyre centre to tyre centre [mm].",
              required=True, minimum=MIN_TRACK_MM, maximum=MAX_VEHICLE_MM, example=1550),
        Field("cog_height_mm", "number", "Height of the centre of gravity above the ground [mm].",
              required=True, minimum=0, maximum=MAX_VEHICLE_MM, example=900),
    ),
)

BEARING_FIELDS = (
    Field("name", "string", "Label of the bearing (optional).", example="tapered roller"),
    Field("position_mm", "number", "Axial position of the bearing's effective load centre [mm].",
          required=True, minimum=-MAX_POSITION_MM, maximum=MAX_POSITION_MM),
    Field("C_kN", "number", "Basic dynamic load rating C [kN] (ISO 281).",
          required=True, minimum=MIN_RATING_KN, maximum=MAX_RATING_KN),
    Field("C0_kN", "number", "Basic static load rating C0 [kN] (ISO 76).",
          required=True, minimum=MIN_RATING_KN, maximum=MAX_RATING_KN),
    Field("e", "number", "Limit of Fa/Fr for X = 1, Y = 0 (ISO 281).", exclusive_minimum=0,
          maximum=MAX_E),
    Field("Y", "number", "Axial load factor Y for Fa/Fr > e (ISO 281).", minimum=MIN_Y,
          maximum=MAX_Y),
    Field("Y0", "number", "Static axial load factor Y0 (ISO 76).", exclusive_minimum=0,
          maximum=MAX_Y),
    Field("contact_angle_deg", "number", "Contact angle of the outer raceway (cup) [deg]. "
          "Gives e = 1.5 tan a, Y = 0.4 cot a, Y0 = 0.22 cot a when e, Y, Y0 are not given; "
          "with them, e, Y, Y0 serve the ISO 281 rule and the angle the internal geometry.",
          minimum=MIN_CONTACT_ANGLE_DEG, exclusive_maximum=60),
    Field("mean_diameter_mm", "number", "Mean diameter dm = (d + D) / 2 [mm] (bore d, outside "
          "diameter D); required with [lubrication].", minimum=MIN_DIAMETER_MM,
          maximum=MAX_DIAMETER_MM),
    Field("Cu_kN", "number", "Fatigue load limit Cu [kN] from the bearing's data (default: "
          "estimated from C0 by ISO 281 annex B).", exclusive_minimum=0,
          maximum=MAX_RATING_KN),
    Field("rollers", "integer", "Internal geometry: number of rollers Z (with roller_diameter_mm, "
          "roller_length_mm, pitch_diameter_mm and contact_angle_deg; needed by the refined "
          "method, and gives C and C0 from the geometry).", minimum=3, maximum=MAX_ROLLERS),
    Field("roller_diameter_mm", "number", "Mean roller diameter Dwe [mm].",
          minimum=MIN_ROLLER_MM, maximum=MAX_ROLLER_MM),
    Field("roller_length_mm", "number", "Effective roller length Lwe [mm] (contact length with "
          "the raceway, without the chamfers).", minimum=MIN_ROLLER_MM, maximum=MAX_ROLLER_MM),
    Field("pitch_diameter_mm", "number", "Pitch diameter Dpw of the roller set [mm] (diameter of "
          "the circle through the roller centres at mid-length).", minimum=MIN_DIAMETER_MM,
          maximum=MAX_DIAMETER_MM),
    Field("roller_profile", "string", "Roller profile along its length: straight, or "
          "logarithmic crowning (then give crown_drop_um).", default="straight",
          choices=("straight", "logarithmic")),
    Field("crown_drop_um", "number", "Drop of the logarithmic profile at the ends of the "
          "effective length [um] (both contacts together).", exclusive_minimum=0,
          maximum=MAX_CROWN_DROP_UM),
    Field("bore_mm", "number", "Bore d of the cone [mm] (shaft seat); needed by the fits of a "
          "[pair.setting] on the unmounted basis.", exclusive_minimum=0,
          maximum=MAX_POSITION_MM),
    Field("outside_diameter_mm", "number", "Outside diameter D of the cup [mm] (housing seat); "
          "needed by the cup fit of a [pair.setting].", exclusive_minimum=0,
          maximum=MAX_POSITION_MM),
)

BEARING_FACTORS = Choice(
    "load factors", groups=(("e", "Y", "Y0"), ("contact_angle_deg",)), exclusive=False,
    doc="Give e, Y and Y0 from the bearing's data, or contact_angle_deg, or both (then e, Y, Y0 "
        "serve the ISO 281 rule and the angle the internal geometry).")

BEARING_GEOMETRY = Choice(
    "internal geometry",
    groups=(("rollers", "roller_diameter_mm", "roller_length_mm", "pitch_diameter_mm"),),
    required=False,
    doc="The internal geometry (rollers, roller_diameter_mm, roller_length_mm, "
        "pitch_diameter_mm, with contact_angle_deg) is optional for the ISO 281 rule and "
        "required by the refined method.")


def bearing_table(name: str, doc: str, position_mm: float) -> Table:
    examples = {"position_mm": position_mm, "C_kN": 160 if name == "outboard" else 140,
                "C0_kN": 200 if name == "outboard" else 175, "e": 0.4, "Y": 1.5, "Y0": 0.8,
                "contact_angle_deg": 15, "mean_diameter_mm": 85 if name == "outboard" else 77,
                "rollers": 19 if name == "outboard" else 18,
                "roller_diameter_mm": 13 if name == "outboard" else 12,
                "roller_length_mm": 22 if name == "outboard" else 20,
                "pitch_diameter_mm": 88 if name == "outboard" else 80}
    fields = tuple(Field(**{**f.__dict__, "example": examples.get(f.key, f.example)})
                   for f in BEARING_FIELDS)
    return Table(name=name, doc=doc, fields=fields, choices=(BEARING_FACTORS, BEARING_GEOMETRY))


PAIR_SETTING = Table(
    name="setting",
    required=False,
    doc="The setting made at assembly, with its tolerance, and what changes it in operation "
        "(fits, temperatures, materials); each case is solved at its own operating setting "
        "(docs/operating-setting.md). Needs each bearing's internal geometry.",
    fields=(
        Field("assembly_um", "number", "Axial setting at assembly [um]: > 0 end play, < 0 "
              "preload.", required=True, minimum=-500, maximum=2000, example=60),
        Field("tolerance_um", "number", "Half-width of the assembly setting's band [um] "
              "(setting = assembly_um +/- tolerance_um); the verdict uses the worse end.",
              default=0.0, minimum=0, maximum=500, example=20),
        Field("basis", "string", "mounted: the setting was measured with the rings pressed in "
              "(fits included); unmounted: it follows from component dimensions, and the fits "
              "(cone_interference_um, cup_interference_um) take up part of it.",
              default="mounted", choices=SETTING_BASES),
        Field("assembly_temperature_C", "number", "Temperature of every part when the setting "
              "was made [C].", default=20.0, minimum=-40, maximum=150),
        Field("shaft_temperature_C", "number", "Operating temperature of shaft, cones and rollers "
              "[C] (a case may override it; default: the case's bearing temperature).",
              minimum=-40, maximum=200),
        Field("housing_temperature_C", "number", "Operating temperature of housing and cups [C] "
              "(a case may override it; default: the case's bearing temperature).",
              minimum=-40, maximum=200),
        Field("shaft_material", "string", "Shaft material (expansion coefficient and modulus "
              "from hubload's table, docs/operating-setting.md).", default="steel",
              choices=MATERIAL_NAMES),
        Field("housing_material", "string", "Housing material.", default="steel",
              choices=MATERIAL_NAMES),
        Field("shaft_expansion_per_K", "number", "Linear expansion coefficient of the shaft "
              "[1/K], instead of the material's.", exclusive_minimum=0, maximum=1e-4),
        Field("housing_expansion_per_K", "number", "Linear expansion coefficient of the housing "
              "[1/K], instead of the material's.", exclusive_minimum=0, maximum=1e-4),
        Field("shaft_modulus_GPa", "number", "Young's modulus of the shaft [GPa], instead of the "
              "material's.", exclusive_minimum=1, maximum=500),
        Field("housing_modulus_GPa", "number", "Young's modulus of the housing [GPa], instead of "
              "the material's.", exclusive_minimum=1, maximum=500),
        Field("cone_interference_um", "number", "Diametral interference of each cone on the "
              "shaft [um] (unmounted basis; needs each bearing's bore_mm).", minimum=0,
              maximum=500),
        Field("cup_interference_um", "number", "Diametral interference of each cup in the housing "
              "[um] (unmounted basis, or a light-alloy housing; needs outside_diameter_mm).",
              minimum=0, maximum=500),
        Field("shaft_bore_mm", "number", "Bore of a hollow shaft under the cones [mm] (default 0: "
              "solid).", default=0.0, minimum=0, maximum=MAX_POSITION_MM),
        Field("housing_outside_diameter_mm", "number", "Outside diameter of the housing wall "
              "around the cups [mm] (default: a thick housing).", exclusive_minimum=0,
              maximum=MAX_POSITION_MM),
    ),
)

PAIR = Table(
    name="pair",
    doc="The pair of tapered roller bearings in the motor's front housing.",
    fields=(
        Field("arrangement", "string", "How the two bearings are mounted.",
              required=True, choices=ARRANGEMENTS, example="back-to-back"),
        Field("axial_setting_um", "number", "Axial setting of the pair in operation [um] for the "
              "refined method: > 0 end play (axial free travel of the shaft), < 0 preload, 0 "
              "line-to-line (the default). Give either this or a [pair.setting] table (the "
              "assembly setting, from which each case's operating setting follows).",
              minimum=-500, maximum=2000, example=0),
        Field("rotating_ring", "string", "Ring that turns relative to the load: inner (the "
              "shaft carries the wheel and turns in a fixed housing) or outer (the housing turns "
              "with the wheel on a fixed shaft); refined method.", default="inner",
              choices=("inner", "outer")),
    ),
    tables=(
        bearing_table("outboard", "The bearing nearer the wheel.", 40),
        bearing_table("inboard", "The bearing farther from the wheel.", -30),
        PAIR_SETTING,
    ),
    choices=(Choice("setting", groups=(("axial_setting_um",), ("setting",)), required=False,
                    doc="Give the operating setting as axial_setting_um, or the assembly "
                        "setting as a [pair.setting] table, not both."),),
)

CASE = Table(
    name="case",
    array=True,
    doc="One load case of the duty spectrum (repeat the block for each case).",
    fields=(
        Field("name", "string", "Name of the case.", required=True, example="straight travel"),
        Field("time_percent", "number", "Share of operating time [%]; all cases add to 100 "
              f"(within {TIME_SUM_TOLERANCE_PERCENT:g}).", required=True, minimum=0,
              maximum=100 + TIME_SUM_TOLERANCE_PERCENT, example=100),
        Field("wheel_load_kN", "number", "Vertical force of the ground on the tyre [kN]; "
              "required unless a [vehicle] block derives it from lateral_accel_g.",
              minimum=0, maximum=MAX_WHEEL_FORCE_KN, example=25, label="wheel load"),
        Field("side_force_kN", "number", "Force of the ground on the tyre along the axle [kN], "
              "positive towards the vehicle centreline (inboard); default 0, or wheel load x "
              "lateral_accel_g.", minimum=-MAX_WHEEL_FORCE_KN, maximum=MAX_WHEEL_FORCE_KN,
              example=0, label="side force (+ inboard)"),
        Field("tractive_force_kN", "number", "Longitudinal force at the tyre [kN], "
              "+ driving, - braking (default 0).", minimum=-MAX_WHEEL_FORCE_KN,
              maximum=MAX_WHEEL_FORCE_KN, example=5, label="tractive force"),
        Field("speed_rpm", "number", "Wheel speed [r/min] (0: standstill).", minimum=0,
              maximum=MAX_SPEED_RPM),
        Field("speed_kmh", "number", "Vehicle speed [km/h], converted with the rolling radius.",
              minimum=0, maximum=MAX_SPEED_KMH, example=8),
        Field("pressure_bar", "number", "Pressure difference across the motor [bar]: + drives "
              "the wheel, - brakes it (the motor pumps). Needs a [motor] block.",
              minimum=-MAX_PRESSURE_BAR, maximum=MAX_PRESSURE_BAR),
        Field("flow_lpm", "number", "Flow through the motor [l/min]; gives the speed.",
              minimum=0, maximum=MAX_FLOW_LPM),
        Field("mode", "string", "Motor displacement in use (default full; half needs "
              "[motor] half_mode = true).", choices=("full", "half")),
        Field("lateral_accel_g", "number", "Steady lateral acceleration [g], + when this wheel "
              "is on the outside of the turn; gives the side force (and, with a [vehicle] block, "
              "the wheel load).", minimum=-MAX_LATERAL_G, maximum=MAX_LATERAL_G),
        Field("temperature_C", "number", "Bearing operating temperature in this case [C] "
              "(default: [lubrication] temperature_C).", minimum=-40, maximum=150),
        Field("shaft_temperature_C", "number", "Temperature of shaft, cones and rollers in this "
              "case [C] (a [pair.setting]; default: its shaft_temperature_C).",
              minimum=-40, maximum=200),
        Field("housing_temperature_C", "number", "Temperature of housing and cups in this case "
              "[C] (a [pair.setting]; default: its housing_temperature_C).",
              minimum=-40, maximum=200),
    ),
    choices=(Choice("speed", groups=(("speed_rpm",), ("speed_kmh",), ("pressure_bar", "flow_lpm")),
                    doc="Give exactly one of speed_rpm or speed_kmh (a force case), or "
                        "pressure_bar with flow_lpm (a hydraulic case)."),
             Choice("tractive force source", groups=(("tractive_force_kN",), ("pressure_bar",)),
                    required=False,
                    doc="A hydraulic case derives its tractive force from pressure_bar; "
                        "do not give tractive_force_kN too.")),
)

LUBRICATION = Table(
    name="lubrication",
    doc="How the bearings are lubricated; gives the ISO 281 modified life L10m = a1 aISO L10.",
    required=False,
    fields=(
        Field("viscosity_40C_cSt", "number", "Kinematic viscosity at 40 C [mm2/s] from the oil's "
              "data sheet (Walther/ASTM D341 holds down to 2 mm2/s).", required=True, minimum=2,
              maximum=MAX_VISCOSITY_CST, example=46),
        Field("viscosity_100C_cSt", "number", "Kinematic viscosity at 100 C [mm2/s] from the data "
              "sheet; below the 40 C value.", required=True, minimum=2,
              maximum=MAX_VISCOSITY_CST, example=7.8),
        Field("temperature_C", "number", "Bearing operating temperature [C] (a case may "
              "override it).", required=True, minimum=-40, maximum=150, example=60),
        Field("method", "string", "oil-filtered: oil with on-line filtration; oil-unfiltered: "
              "no or off-line filtration; grease.", required=True,
              choices=tuple(CONTAMINATION_LEVELS), example="oil-filtered"),
        Field("iso4406", "string", 'Oil cleanliness code "R4/R6/R14" or "-/R6/R14" (ISO 4406); '
              "R6/R14 select the row of ISO 281 annex A.", example="18/16/13"),
        Field("grease_cleanliness", "string", "Cleanliness level for grease (ISO 281 annex A).",
              choices=GREASE_CLEANLINESS),
    ),
    choices=(Choice("cleanliness", groups=(("iso4406",), ("grease_cleanliness",)),
                    doc="Give iso4406 for the oil methods or grease_cleanliness for grease."),),
)

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

FORMAT = Table(
    name="",
    doc="A hubload load-case file.",
    tables=(PROJECT, WHEEL, MOTOR, VEHICLE, PAIR, LUBRICATION, CASE, SHAFT),
)
