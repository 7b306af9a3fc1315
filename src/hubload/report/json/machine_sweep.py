"""The JSON document of ``hubload sweep --json`` on a machine file.

Each point carries the machine's ``machine``, ``governing_life``, ``verdict`` and
``overall_verdict`` as ``hubload machine --json`` writes them, and each wheel end's
governing life; the per-case detail of every wheel end is one ``hubload machine`` away.
"""

from __future__ import annotations


from hubload.report.cautions import CAUTIONS
from hubload.report.json.machine import machine_document
from hubload.report.json.sweep import parameter_entries
from hubload.report.json.text import document_text
from hubload.studies.machine_sweep import MachineSweep

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
        "parameters": parameter_entries(sweep.axes, sweep.file_values),
        "target_life_h": sweep.target_life_h,
        "governing_life": sweep.results[0].governing.symbol,
        "points": [{"values": values, **point_document(result)}
                   for values, result in zip(sweep.values, sweep.results)],
        "cautions": CAUTIONS,
    }


def to_json(sweep: MachineSweep) -> str:
    return document_text(machine_sweep_document(sweep))
