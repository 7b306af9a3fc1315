"""The JSON document of ``hubload compare --json`` on machine files: each machine's lives,
verdict and wheel ends side by side, the ratios of its lives to the first machine's."""

from __future__ import annotations

from collections.abc import Sequence

from hubload.engine.machine import MachineResult
from hubload.report.cautions import CAUTIONS
from hubload.report.json.machine import machine_document
from hubload.report.json.machine_sweep import point_document
from hubload.report.numbers import json_number


def ratio(value: float | None, first: float | None) -> float | None:
    if value is None or first is None or first == 0:   # null: an infinite life
        return None
    return json_number(value / first)


def compare_document(machines: Sequence[MachineResult]) -> dict:
    documents = [machine_document(machine) for machine in machines]
    first = documents[0]
    entries = []
    for machine, document in zip(machines, documents):
        entries.append({
            "title": document["title"], "source": document["source"],
            **point_document(machine),
            "ratio_to_first": {
                "governing_life": ratio(document["governing_life"]["life_h"],
                                        first["governing_life"]["life_h"]),
                "l10_h": ratio(document["machine"]["l10_h"], first["machine"]["l10_h"]),
                "l10m_h": ratio(document["machine"]["l10m_h"], first["machine"]["l10m_h"])},
        })
    return {"kind": "machine", "machines": entries, "cautions": CAUTIONS}
