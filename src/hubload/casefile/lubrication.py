"""Read the [lubrication] table and its companions into SI (checks the schema cannot express)."""

from __future__ import annotations

import re

import numpy as np

from hubload.domain.study import Lubrication, Pair
from hubload.errors import InputError
from hubload.units import CELSIUS_ZERO_K
from hubload.units import CST

ISO4406_PATTERN = re.compile(r"^\s*(\d{1,2}|-)\s*/\s*(\d{1,2})\s*/\s*(\d{1,2})\s*$")
ISO4406_HIGHEST_SCALE_NUMBER = 28   # last row of the ISO 4406:1999 scale table (from memory)


def read_lubrication(data: dict | None, case_blocks: list[dict], pair: Pair) -> Lubrication | None:
    """The lubrication of the pair, or None; case temperatures need a [lubrication] table."""
    if data is None:
        stray = next((i for i, block in enumerate(case_blocks) if "temperature_C" in block), None)
        if stray is not None:
            raise InputError("a case temperature needs a [lubrication] table (oil data and "
                             "method) to be used", key_path=f"case[{stray}].temperature_C")
        return None
    if data["viscosity_100C_cSt"] >= data["viscosity_40C_cSt"]:
        raise InputError(f"expected the viscosity at 100 C below the one at 40 C "
                         f"({data['viscosity_40C_cSt']:g} mm2/s): oil thins as it warms; "
                         f"got {data['viscosity_100C_cSt']:g}",
                         key_path="lubrication.viscosity_100C_cSt")
    require_mean_diameters(pair)
    temperatures_c = np.array([block.get("temperature_C", data["temperature_C"])
                               for block in case_blocks], dtype=float)
    method = data["method"]
    common = dict(viscosity_40c_m2_s=data["viscosity_40C_cSt"] * CST,
                  viscosity_100c_m2_s=data["viscosity_100C_cSt"] * CST,
                  temperature_k=temperatures_c + CELSIUS_ZERO_K, method=method)
    if method == "grease":
        if "iso4406" in data:
            raise InputError('an ISO 4406 code applies to oil; for method = "grease" give '
                             "grease_cleanliness instead", key_path="lubrication.iso4406")
        return Lubrication(**common, cleanliness=data["grease_cleanliness"])
    if "grease_cleanliness" in data:
        raise InputError(f'grease_cleanliness applies to method = "grease"; for "{method}" give '
                         'the oil\'s ISO 4406 code as iso4406 = "18/16/13"',
                         key_path="lubrication.grease_cleanliness")
    code_6um, code_14um = parse_iso4406(data["iso4406"])
    return Lubrication(**common, cleanliness=data["iso4406"].strip(),
                       code_6um=code_6um, code_14um=code_14um)


def require_mean_diameters(pair: Pair) -> None:
    for label, bearing in pair.bearings().items():
        if bearing.mean_diameter_m is None:
            raise InputError("missing required key with [lubrication]: the bearing's mean "
                             "diameter dm = (d + D) / 2 [mm], needed for the reference viscosity "
                             "(ISO 281)", key_path=f"pair.{label}.mean_diameter_mm")


def parse_iso4406(code: str) -> tuple[int, int]:
    """The R6 and R14 scale numbers of an ISO 4406 code 'R4/R6/R14' or '-/R6/R14'."""
    match = ISO4406_PATTERN.match(code)
    expected = 'expected an ISO 4406 code such as "18/16/13" or "-/16/13"'
    if not match:
        raise InputError(f"{expected}, got {code!r}", key_path="lubrication.iso4406")
    numbers = [int(part) for part in match.groups() if part != "-"]
    if any(number > ISO4406_HIGHEST_SCALE_NUMBER for number in numbers):
        raise InputError(f"{expected} (scale numbers 0..{ISO4406_HIGHEST_SCALE_NUMBER}), "
                         f"got {code!r}", key_path="lubrication.iso4406")
    if numbers != sorted(numbers, reverse=True):
        raise InputError(f"{expected}: the counts are cumulative (particles > 4, > 6, > 14 um), "
                         f"so the numbers cannot grow from left to right; got {code!r}",
                         key_path="lubrication.iso4406")
    return numbers[-2], numbers[-1]
