"""A file key in words, with its unit, from the file format's own descriptions.

``wheel.offset_mm`` reads "wheel offset [mm]", ``case[3].side_force_kN`` "side force
(+ inboard) [kN], case 3 'cornering'", ``pair.outboard.C_kN`` "outboard bearing: basic
dynamic load rating C [kN]": what axes and headers of sweeps say instead of dotted keys.
"""

from __future__ import annotations

import re

from hubload.casefile.variation import KeyPath

UNIT = re.compile(r"\[([^\]]+)\]")
CONTEXT = {"outboard": "outboard bearing", "inboard": "inboard bearing",
           "setting": "assembly", "lubrication": "oil", "motor": "motor",
           "vehicle": "vehicle", "permissible": "supplier's curve"}


def field_words(path: KeyPath) -> str:
    """The field's words and unit: its label, else its description up to the unit."""
    field = path.field
    doc = field.doc
    unit = UNIT.search(doc)
    words = field.label or (doc[:unit.start()] if unit else doc.split(".")[0]).strip(" ,:")
    words = words[:1].lower() + words[1:]
    return f"{words} [{unit.group(1)}]" if unit else words


def key_words(path: KeyPath, case_names=(), section_names=()) -> str:
    """The key path in words: the field's, with where it sits (bearing, case, section)."""
    place = []
    for name, index in path.segments[:-1]:
        if name == "case" and index is not None:
            label = f" '{case_names[index]}'" if index < len(case_names) else ""
            place.append(f"case {index}{label}")
        elif name == "section" and index is not None:
            label = f" '{section_names[index]}'" if index < len(section_names) else ""
            place.append(f"shaft section{label}")
        elif name in CONTEXT:
            place.append(CONTEXT[name])
    words = field_words(path)
    _, index = path.segments[-1]
    if index is not None:
        words += f" (point {index})"
    return f"{', '.join(place)}: {words}" if place else words
