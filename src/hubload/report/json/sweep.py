"""The JSON document of ``hubload sweep --json``: each point as a check of it would write it."""

from __future__ import annotations


from hubload.report.cautions import CAUTIONS
from hubload.report.json.check import result_document
from hubload.report.json.text import document_text
from hubload.report.numbers import json_number
from hubload.studies.sweep import Sweep

# Keys of the check's JSON that describe the file, not a point: written once per sweep.
FILE_LEVEL_KEYS = ("title", "source", "method", "cases", "cautions")


def point_document(result) -> dict:
    """The check's JSON document of one point, without the keys that describe the file."""
    document = result_document(result, per_case=False)
    return {key: value for key, value in document.items() if key not in FILE_LEVEL_KEYS}


def crossing_entries(found, sweep: Sweep) -> list[dict]:
    return [{"at": where, "key": sweep.axes[-1].key, "value": c.value,
             "falls_below": c.falls_below, "interpolated": c.interpolated}
            for where, crossings in found for c in crossings]


def sweep_document(sweep: Sweep) -> dict:
    """``points[]`` with ``values`` and the check's per-point objects (bearings, system, ...)."""
    return {
        "title": sweep.title,
        "source": sweep.source,
        "parameters": [{"key": axis.key, "start": json_number(axis.values[0]),
                        "stop": json_number(axis.values[-1]), "count": len(axis.values),
                        "file_value": sweep.file_values.get(axis.key),
                        "linked": [{"key": path.text, "start": json_number(values[0]),
                                    "stop": json_number(values[-1]),
                                    "file_value": sweep.file_values.get(path.text)}
                                   for path, values in axis.linked]}
                       for axis in sweep.axes],
        "target_life_h": sweep.target_life_h,
        "governing_life": sweep.first.governing.symbol,
        "points": [{"values": values, **point_document(result)}
                   for values, result in zip(sweep.values, sweep.points())],
        "crossings": crossing_entries(sweep.crossings(), sweep),
        "shaft_crossings": crossing_entries(sweep.shaft_crossings(), sweep),
        "cautions": CAUTIONS,
    }


def to_json(sweep: Sweep) -> str:
    return document_text(sweep_document(sweep))
