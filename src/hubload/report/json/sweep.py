"""The JSON document of ``hubload sweep --json``: each point as a check of it would write it.

A sweep of more than :data:`SUMMARY_ABOVE_POINTS` points (a large grid) gives each point its
summary instead: values, governing life, bearings, system, lowest shaft safety and verdict,
read column-wise from each chunk's batched result (picking a whole result per point, with its
warnings, took about 1 ms a point and 8 kB of JSON: a 200 x 200 grid wrote 300 MB in 35 s).
``points_detail`` says which.
"""

from __future__ import annotations

import numpy as np

from hubload.report.cautions import CAUTIONS
from hubload.report.json.check import result_document
from hubload.report.json.text import document_text
from hubload.report.numbers import json_number
from hubload.studies.sweep import Sweep

# Keys of the check's JSON that describe the file, not a point: written once per sweep.
FILE_LEVEL_KEYS = ("title", "source", "method", "cases", "cautions")
SUMMARY_ABOVE_POINTS = 1000


def point_document(result) -> dict:
    """The check's JSON document of one point, without the keys that describe the file."""
    document = result_document(result, per_case=False)
    return {key: value for key, value in document.items() if key not in FILE_LEVEL_KEYS}


def crossing_entries(found, sweep: Sweep) -> list[dict]:
    return [{"at": where, "key": sweep.axes[-1].key, "value": c.value,
             "falls_below": c.falls_below, "interpolated": c.interpolated}
            for where, crossings in found for c in crossings]


def parameter_entries(axes, file_values: dict) -> list[dict]:
    """``parameters[]``: each axis's key, range and the file's value, with its linked keys
    (load-case and machine sweeps alike)."""
    return [{"key": axis.key, "start": json_number(axis.values[0]),
             "stop": json_number(axis.values[-1]), "count": len(axis.values),
             "file_value": file_values.get(axis.key),
             "linked": [{"key": path.text, "start": json_number(values[0]),
                         "stop": json_number(values[-1]),
                         "file_value": file_values.get(path.text)}
                        for path, values in axis.linked]}
            for axis in axes]


def sweep_document(sweep: Sweep) -> dict:
    """``points[]`` with ``values`` and the check's per-point objects (bearings, system, ...)."""
    return {
        "title": sweep.title,
        "source": sweep.source,
        "parameters": parameter_entries(sweep.axes, sweep.file_values),
        "target_life_h": sweep.target_life_h,
        "governing_life": sweep.first.governing.symbol,
        "points_detail": "summary" if summarised(sweep) else "full",
        "points": summary_points(sweep) if summarised(sweep) else
        [{"values": values, **point_document(result)}
         for values, result in zip(sweep.values, sweep.points())],
        "crossings": crossing_entries(sweep.crossings(), sweep),
        "shaft_crossings": crossing_entries(sweep.shaft_crossings(), sweep),
        "cautions": CAUTIONS,
    }


def summarised(sweep: Sweep) -> bool:
    return len(sweep.values) > SUMMARY_ABOVE_POINTS


def summary_points(sweep: Sweep) -> list[dict]:
    """Each point's summary, chunk by chunk, from the batched results' arrays."""
    points = []
    values = iter(sweep.values)
    for chunk in sweep.chunks:
        columns = summary_columns(chunk.result, len(chunk.studies))
        points += [{"values": next(values), **point_summary(columns, index)}
                   for index in range(len(chunk.studies))]
    return points


def summary_columns(result, count: int) -> dict:
    """Per-point lists (length ``count``, infinite as None) of a batched result, and the
    governing candidate's index per point."""
    def column(values):
        array = np.broadcast_to(np.asarray(values, dtype=float).reshape(-1), (count,))
        return np.where(np.isfinite(array), array, np.nan).tolist()

    governing = result.governing
    modified = result.modified
    verdict = result.verdict
    shaft = result.lowest_shaft_safety
    return {
        "candidates": [{"symbol": c.symbol, "method": c.method, "basis": c.basis}
                       for c in governing.candidates],
        "chosen": np.broadcast_to(np.asarray(governing.chosen).reshape(-1), (count,)).tolist(),
        "life_h": column(governing.life_h), "life_km": column(governing.life_km),
        "reliability_percent": column(governing.pick(lambda c: c.reliability_percent)),
        "bearings": {label: {"l10_h": column(b.life_h), "l10_km": column(b.life_km),
                             "s0": column(b.static_safety),
                             **({} if modified is None else {
                                 "l10m_h": column(modified.bearings[label].life_h),
                                 "l10m_km": column(modified.bearings[label].life_km)})}
                     for label, b in result.bearings.items()},
        "system": {"l10_h": column(result.system_life_h),
                   "l10_km": column(result.system_life_km),
                   **({} if modified is None else {
                       "l10m_h": column(modified.system_life_h),
                       "l10m_km": column(modified.system_life_km)})},
        "shaft": None if shaft is None else column(shaft),
        "target_h": None if verdict is None else column(verdict.target_h),
        "passed": None if verdict is None else np.broadcast_to(
            np.asarray(verdict.passed).reshape(-1), (count,)).tolist(),
    }


def point_summary(columns: dict, index: int) -> dict:
    """One point's summary; NaN (an infinite life) is written as null, as in every output."""
    candidate = columns["candidates"][columns["chosen"][index]]
    life_h = none_if_nan(columns["life_h"][index])
    target, passed, shaft = columns["target_h"], columns["passed"], columns["shaft"]
    return {
        "governing_life": {**candidate, "life_h": life_h,
                           "life_km": none_if_nan(columns["life_km"][index]),
                           "reliability_percent": columns["reliability_percent"][index]},
        "bearings": {label: {key: none_if_nan(values[index]) for key, values in keys.items()}
                     for label, keys in columns["bearings"].items()},
        "system": {key: none_if_nan(values[index]) for key, values in columns["system"].items()},
        "lowest_shaft_safety": None if shaft is None else none_if_nan(shaft[index]),
        "verdict": None if target is None else {
            "life": candidate["symbol"], "life_h": life_h, "target_h": target[index],
            "passed": passed[index]},
    }


def none_if_nan(value: float) -> float | None:
    return None if value != value else value


def to_json(sweep: Sweep) -> str:
    return document_text(sweep_document(sweep))
