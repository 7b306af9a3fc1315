"""The JSON document of ``hubload sweep --json`` on a machine file.

Each point carries the machine's ``machine``, ``governing_life``, ``verdict`` and
``overall_verdict`` as ``hubload machine --json`` writes them, and each wheel end's
governing life; the per-case detail of every wheel end is one ``hubload machine`` away.
"""

from __future__ import annotations


from hubload.report.cautions import CAUTIONS
from hubload.report.json.machine import machine_document
from hubload.report.numbers import json_number
from hubload.studies.machine_sweep import MachineSweep
from hubload.report.json.text import document_text

POINT_KEYS = ("machine", "governing_life", "verdict", "overall_verdict")


def point_document(result) -> dict:
    document = machine_document(result)
    point = {key: document[key] for key in POINT_KEYS}
    point["wheel_ends"] = [{"name": w["name"], "governing_life": {
        key: w["governing_life"][key] for key in ("symbol", "life_h", "basis")},
        "lowest_static_safety": w["lowest_static_safety"],
        "lowest_shaft_safety": w["lowest_shaft_safety"]} for w in document["wheel_ends"]]
    return point


def machine_sweep_document(sweep: MachineSweep) -> dict:
    return {
        "title": sweep.title,
        "source": sweep.source,
        "kind": "machine",
        "parameters": [{"key": axis.key, "start": json_number(axis.values[0]),
                        "stop": json_number(axis.values[-1]), "count": len(axis.values),
                        "file_value": sweep.file_values.get(axis.key),
                        "linked": [{"key": path.text, "start": json_number(values[0]),
                                    "stop": json_number(values[-1]),
                                    "file_value": sweep.file_values.get(path.text)}
                                   for path, values in axis.linked]}
                       for axis in sweep.axes],
        "target_life_h": sweep.target_life_h,
        "governing_life": sweep.results[0].governing.symbol,
        "points": [{"values": values, **point_document(result)}
                   for values, result in zip(sweep.values, sweep.results)],
        "cautions": CAUTIONS,
    }


def to_json(sweep: MachineSweep) -> str:
    return document_text(machine_sweep_document(sweep))
