"""Read a load-case file into a :class:`~hubload.domain.study.Study` (SI units)."""

from __future__ import annotations

import math
import tomllib
from pathlib import Path

import numpy as np

from hubload.casefile.casetable import expand_case_table
from hubload.casefile.finite import check_finite
from hubload.casefile.fleet import read_life_model
from hubload.casefile.geometry import read_geometry, with_method
from hubload.casefile.lubrication import read_lubrication
from hubload.casefile.operating_points import derive_cases, read_motor, read_vehicle
from hubload.casefile.setting import read_setting
from hubload.casefile.shaft import read_shaft
from hubload.casefile.validate import validate_document
from hubload.domain.operating import Motor, Vehicle
from hubload.domain.study import Bearing, Cases, Pair, Study, Wheel
from hubload.errors import InputError
from hubload.model.iso281 import factors_from_contact_angle
from hubload.schema import FORMAT
from hubload.schema.fileformat import TIME_SUM_TOLERANCE_PERCENT
from hubload.units import KN, MM

BYTE_ORDER_MARK = "\ufeff"


def load_study(path: str | Path) -> Study:
    """Parse, validate and convert the file at ``path``; raise InputError naming it."""
    file = str(path)
    document = read_toml(path)
    if isinstance(document.get("machine"), dict) and "case" not in document:
        raise InputError("expected a load-case file; this is a machine file ([machine]): "
                         "hubload machine reads it", file=file)
    try:
        return study_from_document(document, source=file)
    except InputError as error:
        raise error.located(file) from None


def read_document(path: str | Path) -> dict:
    """The parsed TOML of the file at ``path`` with the rows of a ``[cases] table`` as its
    ``case`` blocks (not yet validated as a whole); InputError naming the file."""
    try:
        return expand_case_table(read_toml(path), str(path))[0]
    except InputError as error:
        raise error.located(str(path)) from None


def read_toml(path: str | Path) -> dict:
    """The parsed TOML of the file at ``path`` as written; InputError naming it."""
    file = str(path)
    if not file:
        raise InputError("expected the name of a TOML file, got an empty one", file="''")
    try:
        text = Path(path).read_text(encoding="utf-8")
    except FileNotFoundError:
        raise InputError("file not found", file=file) from None
    except (OSError, UnicodeDecodeError) as error:
        raise InputError(f"cannot read the file ({error})", file=file) from None
    if text.startswith(BYTE_ORDER_MARK):
        raise InputError("the file starts with a byte-order mark, which TOML does not allow; "
                         "save it as UTF-8 without BOM", file=file)
    try:
        document = tomllib.loads(text)
    except tomllib.TOMLDecodeError as error:
        raise InputError(f"TOML syntax error: {error}", file=file) from None
    except RecursionError:
        raise InputError("TOML nesting too deep: arrays or inline tables inside each other "
                         "hundreds of levels deep; a load-case file nests a few levels",
                         file=file) from None
    except ValueError as error:  # Python's limit on the digits of an integer literal
        raise InputError(f"TOML integer out of range ({str(error).split(';')[0]})",
                         file=file) from None
    return document


def study_from_document(document: dict, source: str = "<document>") -> Study:
    """Validate a parsed TOML document and convert it to a Study (a ``[cases] table`` is
    read relative to ``source``; errors in its cases name its rows and columns)."""
    document, table = expand_case_table(document, source)
    try:
        return study_from_validated(validate_document(document, FORMAT), source)
    except InputError as error:
        raise (error if table is None else table.relocated(error)) from None


def study_from_validated(data: dict, source: str = "<document>", finite: bool = True,
                         cases_memo: dict | None = None) -> Study:
    """Convert a document already checked by validate_document (defaults filled in).

    ``finite=False`` leaves the check after conversion to the caller (a sweep checks its
    points together, casefile.variation). ``cases_memo``, shared by the variants of one
    document, reuses their cases where the blocks and what the cases read of the other
    tables are the same (see :func:`memo_cases`)."""
    wheel = read_wheel(data["wheel"])
    pair = read_pair(data["pair"])
    project = data.get("project", {})
    read_life_model(data.get("reliability"))   # its cross-key rule holds for every command
    motor, vehicle = read_motor(data.get("motor")), read_vehicle(data.get("vehicle"))
    lubrication = read_lubrication(data.get("lubrication"), data["case"], pair)
    pair = read_setting(data["pair"], pair, data["case"],
                        None if lubrication is None else lubrication.temperature_k)
    study = Study(
        source=source,
        title=project.get("title", Path(source).stem),
        target_life_h=project.get("target_life_h"),
        wheel=wheel,
        pair=pair,
        cases=memo_cases(cases_memo, data["case"], wheel, motor, vehicle),
        motor=motor,
        vehicle=vehicle,
        lubrication=lubrication,
        reliability_percent=project.get("reliability_percent", 90.0),
        shaft=read_shaft(data["shaft"], pair) if "shaft" in data else None,
        verdict_basis=project.get("verdict_basis", "shorter"),
    )
    study = with_method(study, project.get("method", "iso281"))
    return check_finite(study) if finite else study


def read_wheel(data: dict) -> Wheel:
    loaded_m = data["loaded_radius_mm"] * MM
    return Wheel(offset_m=data["offset_mm"] * MM, loaded_radius_m=loaded_m,
                 rolling_radius_m=data.get("rolling_radius_mm", data["loaded_radius_mm"]) * MM,
                 adhesion_mu=data["adhesion_mu"])


def read_pair(data: dict) -> Pair:
    outboard = read_bearing(data["outboard"], "outboard")
    inboard = read_bearing(data["inboard"], "inboard")
    if outboard.position_m == inboard.position_m:
        raise InputError("zero bearing spread: both bearings at the same position; "
                         "expected the outboard bearing's load centre outboard of the inboard one",
                         key_path="pair.outboard.position_mm")
    if outboard.position_m < inboard.position_m:
        raise InputError(f"expected the outboard bearing (nearer the wheel) at a larger position "
                         f"than the inboard one ({inboard.position_m / MM:g} mm), "
                         f"got {outboard.position_m / MM:g} mm", key_path="pair.outboard.position_mm")
    return Pair(arrangement=data["arrangement"], outboard=outboard, inboard=inboard,
                axial_setting_m=data.get("axial_setting_um", 0.0) * 1e-6,
                rotating_ring=data.get("rotating_ring", "inner"))


def read_bearing(data: dict, label: str) -> Bearing:
    if "e" in data:   # the bearing's own factors win over those from the angle
        e, y, y0 = data["e"], data["Y"], data["Y0"]
    else:
        e, y, y0 = (float(v) for v in factors_from_contact_angle(
            math.radians(data["contact_angle_deg"])))
    if data.get("Cu_kN", 0.0) >= data["C0_kN"]:
        raise InputError(f"expected the fatigue load limit Cu below C0 ({data['C0_kN']:g} kN; "
                         f"typically C0 / 8), got {data['Cu_kN']:g} kN",
                         key_path=f"pair.{label}.Cu_kN")
    return Bearing(label=data.get("name", label), position_m=data["position_mm"] * MM,
                   dynamic_rating_n=data["C_kN"] * KN, static_rating_n=data["C0_kN"] * KN,
                   e=e, y=y, y0=y0,
                   mean_diameter_m=optional_scaled(data, "mean_diameter_mm", MM),
                   fatigue_limit_n=optional_scaled(data, "Cu_kN", KN),
                   geometry=read_geometry(data, label))


def optional_scaled(data: dict, key: str, factor: float) -> float | None:
    return data[key] * factor if key in data else None


def memo_cases(memo: dict | None, blocks: list[dict], wheel: Wheel, motor: Motor | None,
               vehicle: Vehicle | None) -> Cases:
    """read_cases, or the Cases already read from the same blocks with the same wheel radius,
    adhesion, motor and vehicle (all the cases read of the other tables): a sweep's variants
    share their unchanged [[case]] list, and deriving its operating points is the bulk of
    building a variant. The memo keeps the blocks it saw, so their ids stay unique."""
    if memo is None:
        return read_cases(blocks, wheel, motor, vehicle)
    key = (id(blocks), wheel.rolling_radius_m, wheel.adhesion_mu, motor, vehicle)
    if key not in memo:
        memo[key] = (blocks, read_cases(blocks, wheel, motor, vehicle))
    return memo[key][1]


def read_cases(blocks: list[dict], wheel: Wheel, motor: Motor | None = None,
               vehicle: Vehicle | None = None) -> Cases:
    total_percent = sum(block["time_percent"] for block in blocks)
    if abs(total_percent - 100.0) > TIME_SUM_TOLERANCE_PERCENT:
        raise InputError(f"time shares add to {total_percent:g} %, expected 100 % "
                         f"(within {TIME_SUM_TOLERANCE_PERCENT:g} %)", key_path="case[].time_percent")
    points = derive_cases(blocks, wheel, motor, vehicle)
    return Cases(
        names=tuple(block["name"] for block in blocks),
        time_fraction=np.array([block["time_percent"] for block in blocks]) / total_percent,
        wheel_load_n=points.wheel_load_n,
        side_force_n=points.side_force_n,
        tractive_force_n=points.tractive_force_n,
        speed_rpm=points.speed_rpm,
        operating=points,
    )
