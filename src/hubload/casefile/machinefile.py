"""Read a machine file: the machine, its axles and operations, and its wheel end files.

The file is validated against :data:`hubload.schema.machineformat.MACHINE_FORMAT`
(unknown keys, types, limits); the rules across keys are checked here. Each axle's
wheel end file is a load-case file without ``[[case]]`` blocks; it is validated as
one (with a placeholder case) and named in every error it causes. The operations
become per-wheel load cases in :mod:`hubload.casefile.wheelcases`.
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from pathlib import Path

from hubload.casefile.load import read_document, study_from_document
from hubload.casefile.machine import PLACEHOLDER_CASE
from hubload.casefile.validate import validate_document
from hubload.casefile.variation import with_values
from hubload.domain.machine import MachineStudy
from hubload.domain.study import Study
from hubload.errors import InputError
from hubload.model.machine import Axle, Machine
from hubload.schema.machineformat import MACHINE_FORMAT
from hubload.units import MM

# Tables of a load-case file that the machine file decides for its wheel ends.
MACHINE_TABLES = {"case": "the machine's operations give the cases",
                  "project": "the machine file's [project] applies to every wheel end",
                  "vehicle": "the machine file describes the axle",
                  "machine": "a wheel end file is a load-case file, not a machine file",
                  "fleet": "the machine file's [fleet] describes the machines",
                  "reliability": "the machine file's [reliability] applies to every wheel end"}


@dataclass(frozen=True)
class WheelEndFile:
    """A wheel end file: its path, its document (without cases) and its placeholder study."""

    path: str
    document: dict
    study: Study


@dataclass(frozen=True)
class AxleInput:
    """An axle of the machine file with its wheel end file (None: no results)."""

    index: int
    name: str
    position: str
    axle: Axle
    wheel_end: WheelEndFile | None
    rolling_radius_m: float


def load_machine_study(path: str | Path) -> MachineStudy:
    """Parse, validate and convert the machine file at ``path``; InputError naming it."""
    return machine_from_document(read_document(path), str(path))


# A top-level [machine] table, written as a header, a dotted key or an inline table: no
# load-case file has a key of that name, so the text tells the kinds apart unparsed.
MACHINE_TABLE_LINE = re.compile(r"^[ \t]*(\[[ \t]*machine[ \t]*\]|machine[ \t]*[.=])",
                                re.MULTILINE)


def is_machine_file(path: str | Path) -> bool:
    """Whether the file at ``path`` is a machine file, from its text (a file that cannot be
    read is left to the command's own reading, which names the problem)."""
    try:
        return MACHINE_TABLE_LINE.search(Path(path).read_text(encoding="utf-8")) is not None
    except (OSError, UnicodeDecodeError):
        return False


def is_machine_document(document: dict) -> bool:
    """Whether a parsed file is a machine file (it has a [machine] table)."""
    return isinstance(document.get("machine"), dict)


def machine_from_document(document: dict, file: str,
                          wheel_end_values: dict | None = None) -> MachineStudy:
    """Validate and convert a parsed machine file; wheel end paths are relative to ``file``.

    ``wheel_end_values`` (axle index -> {KeyPath: value}) sets keys of an axle's wheel end
    file, as a sweep of the machine varies them."""
    from hubload.casefile.wheelcases import machine_study

    path = Path(file)
    if not is_machine_document(document) and ("case" in document or "wheel" in document):
        raise InputError("expected a machine file ([machine], [[axle]], [[operation]]); this "
                         "is a load-case file: hubload check reads it", file=file)
    try:
        data = validate_document(document, MACHINE_FORMAT)
        axles = read_axles(data["axle"], path.parent, wheel_end_values or {})
        machine = read_machine(data["machine"], axles)
        return machine_study(data, axles, machine, file)
    except InputError as error:
        raise error.located(file) from None


def read_axles(blocks: list[dict], folder: Path,
               wheel_end_values: dict) -> tuple[AxleInput, AxleInput]:
    """The front and the rear axle (in that order); InputError for any other set."""
    if len(blocks) != 2:
        raise InputError(f"expected exactly two [[axle]] blocks (a front and a rear axle), "
                         f"got {len(blocks)}", key_path="axle")
    positions = [block["position"] for block in blocks]
    if positions[0] == positions[1]:
        raise InputError(f"expected one front and one rear axle, got two {positions[0]} axles",
                         key_path="axle[1].position")
    if all(block["oscillating"] for block in blocks):
        raise InputError("at most one axle can oscillate: with both free to roll the machine "
                         "has no roll support", key_path="axle[1].oscillating")
    if not any(block["driven"] for block in blocks):
        raise InputError("expected at least one driven axle (driven = true): the machine has "
                         "hub motors", key_path="axle[0].driven")
    axles = [read_axle(index, block, folder, wheel_end_values.get(index, {}))
             for index, block in enumerate(blocks)]
    axles.sort(key=lambda axle: axle.position != "front")
    check_same_adhesion(axles)
    return axles[0], axles[1]


def read_axle(index: int, block: dict, folder: Path, values: dict) -> AxleInput:
    key = f"axle[{index}]"
    wheel_end = None
    if values and "wheel_end" not in block:
        raise InputError("this axle has no wheel_end file whose keys could be varied",
                         key_path=f"{key}.wheel_end")
    if "wheel_end" in block:
        if "rolling_radius_mm" in block:
            raise InputError("give rolling_radius_mm only for an axle without wheel_end; the "
                             "wheel end file's [wheel] gives it",
                             key_path=f"{key}.rolling_radius_mm")
        wheel_end = read_wheel_end(folder / block["wheel_end"], f"{key}.wheel_end", values)
        radius_m = float(wheel_end.study.wheel.rolling_radius_m)
    elif "rolling_radius_mm" in block:
        radius_m = block["rolling_radius_mm"] * MM
    elif block["driven"]:
        raise InputError("a driven axle without wheel_end needs rolling_radius_mm (its share "
                         "of the tractive force)", key_path=f"{key}.rolling_radius_mm")
    else:
        radius_m = 1.0   # an undriven wheel without results: its radius enters nothing
    axle = Axle(track_m=block["track_mm"] * MM, driven=block["driven"],
                oscillating=block["oscillating"], pivot_height_m=block["pivot_height_mm"] * MM)
    return AxleInput(index=index, name=block["name"], position=block["position"], axle=axle,
                     wheel_end=wheel_end, rolling_radius_m=radius_m)


def read_wheel_end(path: Path, key_path: str, values: dict | None = None) -> WheelEndFile:
    """The wheel end file at ``path`` (with ``values``, KeyPath -> value, set), validated as
    a load-case file without cases."""
    file = str(path)
    document = read_wheel_end_document(path, key_path)
    if values:
        document = with_values(document, values)
    for table, reason in MACHINE_TABLES.items():
        if table in document:
            header = "[[case]] blocks" if table == "case" else f"[{table}] table"
            raise InputError(f"a wheel end file has no {header}: {reason}", file=file,
                             key_path=table)
    try:
        study = study_from_document({**document, "case": [PLACEHOLDER_CASE]}, source=file)
    except InputError as error:
        raise error.located(file) from None
    return WheelEndFile(path=file, document=document, study=study)


def read_wheel_end_document(path: Path, key_path: str) -> dict:
    """The parsed wheel end file; InputError naming the machine file's key when it is missing."""
    if not path.is_file():
        raise InputError(f"wheel end file '{path}' not found (the path is relative to the "
                         f"machine file)", key_path=key_path)
    return read_document(path)


def check_same_adhesion(axles: list[AxleInput]) -> None:
    """Both wheel ends' tyres meet one ground: the machine's forces need one adhesion."""
    given = [axle for axle in axles if axle.wheel_end is not None]
    if not given:
        raise InputError("no axle has a wheel_end file: the machine would have no results",
                         key_path="axle[0].wheel_end")
    values = {float(axle.wheel_end.study.wheel.adhesion_mu) for axle in given}
    if len(values) > 1:
        raise InputError(f"the wheel end files give different [wheel] adhesion_mu "
                         f"({', '.join(f'{v:g}' for v in sorted(values))}); the machine's "
                         f"tyres meet one ground, expected one value",
                         key_path=f"axle[{given[1].index}].wheel_end")


def adhesion_of(axles) -> float:
    return next(float(axle.wheel_end.study.wheel.adhesion_mu) for axle in axles
                if axle.wheel_end is not None)


def read_machine(data: dict, axles: tuple[AxleInput, AxleInput]) -> Machine:
    front, rear = axles
    return Machine(
        mass_kg=data["mass_kg"], cog_behind_front_m=data["cog_from_front_axle_mm"] * MM,
        cog_height_m=data["cog_height_mm"] * MM, wheelbase_m=data["wheelbase_mm"] * MM,
        front=front.axle, rear=rear.axle,
        rolling_radius_m=(front.rolling_radius_m,) * 2 + (rear.rolling_radius_m,) * 2,
        drive=data["drive"])
