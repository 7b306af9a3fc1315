"""The JSON document of ``hubload compare --json``: each file's check results side by side."""

from __future__ import annotations


from hubload.engine import Result
from hubload.report.cautions import CAUTIONS
from hubload.report.json.check import result_document
from hubload.report.json.text import document_text
from hubload.report.numbers import json_number
from hubload.report.quantities import ratios_to_first, shared_life_quantities
from hubload.studies.compare import Comparison

# Keys of the check's JSON left out per file: the case table (summarised as damage shares)
# and the cautions (written once).
PER_CASE_KEYS = ("cases", "cautions")


def damage_shares(result: Result) -> list[dict]:
    """Each case's share of the pair's damage on the governing basis."""
    shares = result.governing.system_damage_share
    return [{"case": name, "share": json_number(share)}
            for name, share in zip(result.study.cases.names, shares)]


def compare_document(comparison: Comparison) -> dict:
    results = comparison.results
    found = {q.key: ratios_to_first(results, q) for q in shared_life_quantities(results)}
    files = []
    for index, result in enumerate(comparison.results):
        document = result_document(result)
        files.append({
            **{key: value for key, value in document.items() if key not in PER_CASE_KEYS},
            "damage_shares": damage_shares(result),
            "damage_life": result.governing.symbol,
            "ratio_to_first": {key: None if values[index] is None else json_number(values[index])
                               for key, values in found.items()},
        })
    return {"files": files, "cautions": CAUTIONS}


def to_json(comparison: Comparison) -> str:
    return document_text(compare_document(comparison))
