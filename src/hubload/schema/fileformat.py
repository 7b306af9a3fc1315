"""The load-case file format (a contract: keys may be added, never renamed).

Positions are along the shaft axis from the motor's mounting face (x = 0),
positive outboard (towards the wheel). Units are part of every key name.
"""

from __future__ import annotations

from hubload.model.lubrication import (CONTAMINATION_LEVELS, GREASE_CLEANLINESS,
                                       RELIABILITY_MAX_PERCENT, RELIABILITY_MIN_PERCENT)
from hubload.model.materials import MATERIALS
from hubload.model.operating import DEFAULT_ADHESION_MU
from hubload.model.setting import SETTING_BASES
from hubload.model.tapered_pair import ARRANGEMENTS
from hubload.schema.fleetformat import FLEET, RELIABILITY
from hubload.schema.limits import (MAX_AXLE_LOAD_KN, MAX_CROWN_DROP_UM, MAX_DIAMETER_MM,
                                   MAX_DISPLACEMENT_CC, MAX_E, MAX_FLOW_LPM, MAX_LATERAL_G,
                                   MAX_POSITION_MM, MAX_PRESSURE_BAR, MAX_RADIUS_MM, MAX_RATING_KN,
                                   MAX_ROLLERS, MAX_ROLLER_MM, MAX_SPEED_KMH, MAX_SPEED_RPM,
                                   MAX_TARGET_LIFE_H, MAX_VEHICLE_MM, MAX_VISCOSITY_CST,
                                   MAX_WHEEL_FORCE_KN, MAX_Y, MIN_CONTACT_ANGLE_DEG,
                                   MIN_DIAMETER_MM, MIN_DISPLACEMENT_CC, MIN_EFFICIENCY,
                                   MIN_RADIUS_MM, MIN_RATING_KN, MIN_ROLLER_MM, MIN_TARGET_LIFE_H,
                                   MIN_TRACK_MM, MIN_Y)
from hubload.schema.shaftformat import SHAFT
from hubload.schema.spec import Choice, Field, Table

# Choices and limits the model's tables define are taken from them, so that the validator
# can never let through a value the model has no entry for.

VERDICT_BASES = ("shorter", "iso281", "refined")
MATERIAL_NAMES = tuple(MATERIALS)
TIME_SUM_TOLERANCE_PERCENT = 0.5

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
    Field("bore_mm", "number", "Bore d of the cone [mm] (shaft seat); needed by a "
          "[pair.setting] whose cone fit can act: an interference, a shaft that expands "
          "otherwise than the rings, or a hollow shaft.", exclusive_minimum=0,
          maximum=MAX_POSITION_MM),
    Field("outside_diameter_mm", "number", "Outside diameter D of the cup [mm] (housing seat); "
          "needed by a [pair.setting] whose cup fit can act: an interference, a housing that "
          "expands otherwise than the rings, or a given housing wall.", exclusive_minimum=0,
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
    required=False,   # or a [cases] table: the root's choice "cases" asks for one of them
    doc="One load case of the duty spectrum (repeat the block for each case), or a [cases] "
        "table naming a spreadsheet with one row per case.",
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

CASE_TABLE_SUFFIXES = (".csv", ".xlsx")

CASES = Table(
    name="cases",
    required=False,
    doc="The load cases from a spreadsheet instead of [[case]] blocks: one row per case, one "
        "column per [[case]] key, headed by the key exactly as written in a block "
        "(wheel_load_kN, speed_kmh, ...); an empty cell is a key not given. Every cell is "
        "checked by the rules of a [[case]] block. See docs/spreadsheets.md.",
    fields=(
        Field("table", "string", "The table file [.csv or .xlsx], relative to this file "
              "(e.g. \"duty.xlsx\").", required=True, example="duty.csv"),
        Field("sheet", "string", "The sheet of an .xlsx workbook (default: its first sheet)."),
    ),
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

FORMAT = Table(
    name="",
    doc="A hubload load-case file.",
    tables=(PROJECT, WHEEL, MOTOR, VEHICLE, PAIR, LUBRICATION, CASE, CASES, SHAFT, FLEET,
            RELIABILITY),
    # named so that the message of a file without cases reads "missing required table [[case]]"
    choices=(Choice("required table [[case]]", groups=(("case",), ("cases",)),
                    doc="Give the load cases as [[case]] blocks or as a [cases] table "
                        "(a spreadsheet), not both."),),
)
