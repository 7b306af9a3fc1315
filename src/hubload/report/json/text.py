"""The text of a JSON document: indented for reading, with long lists one item per line.

``json.dumps(..., indent=2)`` runs the standard library's pure-Python encoder (the C encoder
serves only unindented output): for a 200-point sweep it took longer than the computation.
Here every list of more than :data:`ONE_LINE_ITEMS_ABOVE` items is written one compact item
per line by the C encoder, and everything else indented as before: a small document reads
as it did, a large one is a row per point or case that a line tool can take apart.

>>> print(document_text({"system": {"l10_h": 1.5}, "points": list(range(3))}))
{
  "system": {
    "l10_h": 1.5
  },
  "points": [
    0,
    1,
    2
  ]
}
"""

from __future__ import annotations

import json

ONE_LINE_ITEMS_ABOVE = 50
COMPACT = json.JSONEncoder(allow_nan=False, separators=(", ", ": ")).encode


def document_text(document) -> str:
    """``document`` as JSON text (NaN and infinity refused: the documents give null)."""
    return "".join(_parts(document, ""))


def _parts(value, indent: str):
    inner = indent + "  "
    if isinstance(value, dict) and value:
        yield "{\n"
        for index, (key, item) in enumerate(value.items()):
            yield ",\n" if index else ""
            yield f"{inner}{COMPACT(str(key))}: "
            yield from _parts(item, inner)
        yield f"\n{indent}}}"
    elif isinstance(value, (list, tuple)) and value:
        yield "[\n"
        long = len(value) > ONE_LINE_ITEMS_ABOVE
        for index, item in enumerate(value):
            yield ",\n" if index else ""
            yield inner
            yield from ([COMPACT(item)] if long else _parts(item, inner))
        yield f"\n{indent}]"
    else:
        yield COMPACT(value)
