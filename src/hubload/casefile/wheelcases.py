"""The machine's operations as load cases of each wheel end (hubload.model.machine).

Each operation is one case of every wheel end; an operation with a lateral
component and ``mirror = true`` is two, each with half its time: as given and
mirrored (left turn <-> right turn, slope side swapped; the model's
``mirrored_operations``). The cases are written as ordinary ``[[case]]`` blocks
(wheel load, side force + inboard of that wheel, tractive force as the drive asks
it, speed in r/min from the wheel's own speed and rolling radius) and the wheel
end document with them becomes a Study exactly as a load-case file does; the
wheel end's adhesion cap and its flag apply there.
"""

from __future__ import annotations

import re
from dataclasses import fields
from pathlib import Path

import numpy as np

from hubload.casefile.load import study_from_document
from hubload.casefile.machinefile import AxleInput, adhesion_of
from hubload.casefile.validate import MAX_STRING_CHARS
from hubload.domain.machine import MachineStudy, WheelEnd
from hubload.errors import InputError
from hubload.model import machine as mm
from hubload.model.kinematics import kmh_to_rpm
from hubload.schema.fileformat import TIME_SUM_TOLERANCE_PERCENT
from hubload.units import KMH, KN, MM, STANDARD_GRAVITY

MIRRORED = " (mirrored)"
# Case names of the wheel ends carry the operation's name (and the mirror's mark) within
# the load-case format's limit on a name.
MAX_OPERATION_NAME_CHARS = 180
WHEEL_NAMES = ("front left", "front right", "rear left", "rear right")
CASE_KEY = re.compile(r"^case\[(\d+)\]\.(.+)$")


def machine_study(data: dict, axles: tuple[AxleInput, AxleInput], machine: mm.Machine,
                  file: str) -> MachineStudy:
    """The machine's study: the operations checked and turned into each wheel end's cases."""
    blocks = data["operation"]
    check_operations(blocks, data, axles)
    operations, rows = case_operations(blocks, data, adhesion_of(axles))
    forces = mm.wheel_forces(machine, operations)
    check_forces(forces, operations, blocks, rows, machine)
    names = tuple(blocks[k]["name"] + (MIRRORED if mirrored else "") for k, mirrored in rows)
    times = np.array([share_percent(blocks, k, rows) for k, _ in rows])
    project = data.get("project", {})
    title = project.get("title", Path(file).stem)
    asked_n = mm.stacked([forces.tractive_demand_n * share for share in
                          mm.drive_shares(machine, list(forces.wheel_load_n))])
    wheel_ends = []
    for axle in axles:
        if axle.wheel_end is None:
            continue
        for wheel in (0, 1) if axle.position == "front" else (2, 3):
            blocks_of_wheel = case_blocks(names, times, forces, asked_n, wheel,
                                          machine.rolling_radius_m[wheel], blocks, rows)
            wheel_ends.append(wheel_end(axle, wheel, title, project, blocks_of_wheel, rows,
                                        blocks))
    return MachineStudy(
        source=file, title=title, target_life_h=project.get("target_life_h"),
        reliability_percent=project.get("reliability_percent", 90.0), machine=machine,
        operation_names=tuple(block["name"] for block in blocks),
        case_operation=np.array([k for k, _ in rows]),
        case_mirrored=np.array([mirrored for _, mirrored in rows]), case_names=names,
        time_fraction=times / times.sum(), speed_kmh=operations.speed_ms / KMH,
        wheel_ends=tuple(wheel_ends))


def check_operations(blocks: list[dict], data: dict, axles) -> None:
    total = sum(block["time_percent"] for block in blocks)
    if abs(total - 100.0) > TIME_SUM_TOLERANCE_PERCENT:
        raise InputError(f"time shares add to {total:g} %, expected 100 % (within "
                         f"{TIME_SUM_TOLERANCE_PERCENT:g} %)", key_path="operation[].time_percent")
    seen = {}
    for index, block in enumerate(blocks):
        name = block["name"]
        key = f"operation[{index}]"
        if len(name) > MAX_OPERATION_NAME_CHARS:
            raise InputError(f"expected at most {MAX_OPERATION_NAME_CHARS} characters, got "
                             f"{len(name):,}", key_path=f"{key}.name")
        if name in seen:
            raise InputError(f"operation name '{name}' is used by operation[{seen[name]}] "
                             f"already; expected unique names", key_path=f"{key}.name")
        seen[name] = index
        if block["payload_kg"] > 0 and "payload" not in data:
            raise InputError(f"operation '{name}' carries a payload: add a [payload] table "
                             f"(cog_from_front_axle_mm, cog_height_mm)",
                             key_path=f"{key}.payload_kg")
        if "temperature_C" in block:
            for axle in axles:
                if axle.wheel_end is not None and axle.wheel_end.study.lubrication is None:
                    raise InputError(
                        f"operation '{name}': a temperature needs a [lubrication] table in "
                        f"the wheel end file {axle.wheel_end.path}",
                        key_path=f"{key}.temperature_C")


def case_operations(blocks: list[dict], data: dict, adhesion_mu: float):
    """The operations of every case (as given, then each mirror after its operation) and,
    per case, (operation index, mirrored)."""
    payload = data.get("payload", {"cog_from_front_axle_mm": 0.0, "cog_height_mm": 0.0})

    def column(key, scale=1.0):
        return np.array([block[key] for block in blocks], dtype=float) * scale

    given = mm.Operations(
        payload_kg=column("payload_kg"),
        payload_behind_front_m=payload["cog_from_front_axle_mm"] * MM,
        payload_height_m=payload["cog_height_mm"] * MM, speed_ms=column("speed_kmh", KMH),
        longitudinal_accel_g=column("accel_g"), lateral_accel_g=column("lateral_accel_g"),
        grade_rad=mm.slope_angle_rad(column("grade_percent")),
        cross_slope_rad=mm.slope_angle_rad(column("cross_slope_percent")),
        adhesion_mu=adhesion_mu, rolling_resistance=data["machine"]["rolling_resistance"],
        tractive_demand_n=np.array([block.get("tractive_force_kN", np.nan) for block in blocks],
                                   dtype=float) * KN)
    given = mm.columns(given)
    mirrored, index = mm.mirrored_operations(given)
    keep = np.array([blocks[k]["mirror"] for k in index], dtype=bool)
    mirrored_of = {int(k): position for position, k in enumerate(index[keep])}
    rows = []
    for k in range(len(blocks)):
        rows.append((k, False))
        if k in mirrored_of:
            rows.append((k, True))
    order = [k if not mirrored else len(blocks) + mirrored_of[k] for k, mirrored in rows]
    joined = {f.name: np.concatenate([getattr(given, f.name), getattr(mirrored, f.name)[keep]])
              [order] for f in fields(given)}
    return mm.Operations(**joined), rows


def share_percent(blocks: list[dict], k: int, rows) -> float:
    """An operation's time, halved when it is spent half mirrored."""
    halves = sum(1 for index, _ in rows if index == k)
    return blocks[k]["time_percent"] / halves


def check_forces(forces: mm.WheelForces, operations: mm.Operations, blocks, rows,
                 machine: mm.Machine) -> None:
    """No turn tighter than half the track, no wheel lifting, in any case."""
    for case, (k, mirrored) in enumerate(rows):
        where = f"operation '{blocks[k]['name']}'" + (" (its mirrored half)" if mirrored else "")
        key = f"operation[{k}]"
        if forces.too_tight[case]:
            raise too_tight_error(operations, case, machine, where, key)
        lifted = np.flatnonzero(forces.lifted[:, case])
        if lifted.size:
            wheel = int(lifted[0])
            raise InputError(
                f"the {WHEEL_NAMES[wheel]} wheel lifts off in {where}: its load would be "
                f"{forces.wheel_load_n[wheel, case] / KN:.2f} kN; the steady, rigid-machine "
                f"model does not hold (expected every wheel loaded: less lateral or "
                f"longitudinal acceleration, slope or payload)", key_path=key)


def too_tight_error(operations, case, machine, where, key) -> InputError:
    speed_ms = float(operations.speed_ms[case])
    accel_g = float(operations.lateral_accel_g[case])
    half_track_m = 0.5 * max(machine.front.track_m, machine.rear.track_m)
    if speed_ms <= 0:
        return InputError(f"lateral_accel_g = {accel_g:g} at standstill in {where}: a steady "
                          f"turn needs speed_kmh > 0", key_path=f"{key}.lateral_accel_g")
    radius_m = speed_ms ** 2 / (abs(accel_g) * STANDARD_GRAVITY)
    limit_g = speed_ms ** 2 / (half_track_m * STANDARD_GRAVITY)
    return InputError(
        f"turning radius v^2 / (a g) = {radius_m:.2f} m in {where} is below half the track "
        f"({half_track_m:.2f} m): expected |lateral_accel_g| below {limit_g:.3g} at "
        f"{speed_ms / KMH:g} km/h", key_path=f"{key}.lateral_accel_g")


def case_blocks(names, times, forces: mm.WheelForces, asked_n, wheel: int, radius_m: float,
                blocks, rows) -> list[dict]:
    """The [[case]] blocks of one wheel (tractive force as asked: the wheel end caps it)."""
    speed_rpm = kmh_to_rpm(forces.speed_ms[wheel] / KMH, radius_m)
    cases = []
    for case, (k, _) in enumerate(rows):
        entry = {"name": names[case], "time_percent": float(times[case]),
                 "wheel_load_kN": float(forces.wheel_load_n[wheel, case] / KN),
                 "side_force_kN": float(forces.side_force_n[wheel, case] / KN),
                 "tractive_force_kN": float(asked_n[wheel, case] / KN),
                 "speed_rpm": float(speed_rpm[case])}
        if "temperature_C" in blocks[k]:
            entry["temperature_C"] = blocks[k]["temperature_C"]
        cases.append(entry)
    return cases


def wheel_end(axle: AxleInput, wheel: int, title: str, project: dict, cases: list[dict],
              rows, blocks) -> WheelEnd:
    name = WHEEL_NAMES[wheel]
    document = {**axle.wheel_end.document,
                "project": {**project, "title": wheel_title(title, name)}, "case": cases}
    try:
        study = study_from_document(document, source=axle.wheel_end.path)
    except InputError as error:
        raise operation_error(error, name, rows, blocks) from None
    return WheelEnd(name=name, axle=axle.name, position=axle.position,
                    side=name.split()[1], wheel_end_file=axle.wheel_end.path, study=study,
                    document=document)


def wheel_title(title: str, wheel: str) -> str:
    suffix = f", {wheel} wheel"
    return title[:MAX_STRING_CHARS - len(suffix)] + suffix


def operation_error(error: InputError, wheel: str, rows, blocks) -> InputError:
    """An error in a derived case, named by the operation it came from."""
    found = CASE_KEY.match(error.key_path or "")
    if found is None:
        return error
    k, mirrored = rows[int(found.group(1))]
    where = f"operation '{blocks[k]['name']}'" + (" (mirrored)" if mirrored else "")
    return InputError(f"{error.message} (derived {found.group(2)} of the {wheel} wheel in "
                      f"{where})", key_path=f"operation[{k}]")
