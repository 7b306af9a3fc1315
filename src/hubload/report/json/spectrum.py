"""Machine-readable results of ``hubload spectrum`` (contract keys: see docs/logs.md).

``direct.{bearings.*.l10_h, system.l10_h}``, ``classed.{system.l10_h, cases}``,
``classing_error``, ``rows`` and ``duration_h`` are a contract; infinite lives
are null.
"""

from __future__ import annotations

from dataclasses import asdict
from pathlib import Path

from hubload.logs.analysis import LogRun
from hubload.logs.pipeline import CLASS_CHANNELS, LABELS
from hubload.logs.spectrum import SpectrumResult, classed_temperature_c
from hubload.report.cautions import CAUTIONS
from hubload.report.json.check import governing_entry
from hubload.report.messages import warning_texts
from hubload.report.numbers import json_number
from hubload.report.specs.fleet import dominant_class, lowest_s0, lowest_shaft
from hubload.units import KN



def cleaning_entry(result: SpectrumResult, policy: str) -> dict:
    report = result.summary.cleaning
    return {"policy": policy, "used_rows": report.used_rows, "dropped_rows": report.dropped_rows,
            "filled_values": report.filled_values, "gaps": report.gaps,
            "gap_time_s": report.gap_time_s, "filled_samples": report.filled_samples,
            "nominal_interval_s": report.nominal_interval_s, "max_gap_s": report.max_gap_s}


def modified(lives: dict | None, label: str) -> dict:
    """``{"l10m_h": ...}`` when lubrication is given (the key of check's contract), else {}."""
    return {} if lives is None else {"l10m_h": json_number(lives[label])}


def direct_entry(result: SpectrumResult) -> dict:
    lives = result.modified_life_h
    system = None if lives is None else {"system": result.modified_system_life_h}
    governing = result.direct_governing
    return {
        "governing_life": {"symbol": governing.symbol, "life_h": json_number(governing.life_h),
                           "basis": governing.basis, "method": governing.method,
                           "reliability_percent": governing.choice.reliability},
        "bearings": {label: {"l10_h": json_number(result.life_h[label]),
                             **modified(lives, label),
                             "damage": json_number(result.damage[label]),
                             "s0": json_number(result.static_safety[label])} for label in LABELS},
        "system": {"l10_h": json_number(result.system_life_h), **modified(system, "system")},
        "damage_by_class": {key: [{k: json_number(v) for k, v in asdict(share).items()}
                                  for share in shares]
                            for key, shares in result.shares.items()},
    }


def shaft_entries(result: SpectrumResult) -> dict:
    """``shaft`` blocks of direct and classed (empty without [shaft])."""
    if result.shaft_life_h is None:
        return {}
    study_shaft = result.classed.study.shaft
    extremes = result.summary.shaft
    direct = {"sections": [{
        "name": section.name, "fatigue_life_h": json_number(life),
        "min_safety": json_number(extremes["min_safety"][i]),
        "yield_safety": json_number(extremes["yield_safety"][i]),
    } for i, (section, life) in enumerate(zip(study_shaft.sections, result.shaft_life_h))],
        "max_permissible_utilisation": json_number(extremes["max_utilisation"][0])}
    classed = {"sections": [{"name": s.name, "fatigue_life_h": json_number(s.fatigue_life_h)}
                            for s in result.classed.shaft.sections]}
    return {"direct": direct, "classed": classed}


def classed_entry(result: SpectrumResult, spectrum_file: str | None) -> dict:
    classed = result.classed
    cases = classed.study.cases
    temperatures = classed_temperature_c(result.summary)
    table = result.summary.table
    lives = None if classed.modified is None else {
        "system": classed.modified.system_life_h,
        **{label: b.life_h for label, b in classed.modified.bearings.items()}}
    return {
        "governing_life": governing_entry(classed),
        "system": {"l10_h": json_number(classed.system_life_h), **modified(lives, "system")},
        "bearings": {label: {"l10_h": json_number(classed.bearings[label].life_h),
                             **modified(lives, label)} for label in LABELS},
        "classes": {key: {"width": json_number(table.widths[i]),
                          "count": int(len(set(table.keys[i].tolist())))}
                    for i, key in enumerate(CLASS_CHANNELS)},
        "spectrum_file": spectrum_file,
        "cases": [{
            "name": name,
            "time_fraction": json_number(cases.time_fraction[i]),
            "wheel_load_kN": json_number(cases.wheel_load_n[i] / KN),
            "side_force_kN": json_number(cases.side_force_n[i] / KN),
            "tractive_force_kN": json_number(cases.tractive_force_n[i] / KN),
            "speed_rpm": json_number(cases.speed_rpm[i]),
            **({} if temperatures is None else {"temperature_C": json_number(temperatures[i])}),
            "system_damage_share": json_number(classed.system_damage_share[i]),
            "governing_damage_share": json_number(classed.governing.system_damage_share[i]),
        } for i, name in enumerate(cases.names)],
    }


def log_document(result: SpectrumResult, policy: str, spectrum_file: str | None) -> dict:
    """One log (or a fleet's combination) as plain JSON-ready data."""
    summary = result.summary
    return {
        "log": summary.name,
        "rows": summary.cleaning.rows,
        "duration_h": json_number(summary.duration_h),
        "columns": dict(summary.plan.headers) if summary.plan else None,
        "cleaning": cleaning_entry(result, policy),
        "direct": direct_entry(result),
        "classed": classed_entry(result, spectrum_file),
        **({} if result.shaft_life_h is None else {"shaft": shaft_entries(result)}),
        "classing_error": None if result.classing_error is None
        else json_number(result.classing_error),
        **({} if result.modified_life_h is None else {
            "classing_error_l10m": None if result.modified_classing_error is None
            else json_number(result.modified_classing_error)}),
        "flags_time_fraction": {flag: json_number(seconds / 3600 / summary.duration_h)
                                if summary.duration_h > 0 else None
                                for flag, seconds in summary.flag_time_s.items()},
        "notes": list(summary.cleaning.notes),
        "warnings": warning_texts(result.findings, ()),
    }


def single_document(result: SpectrumResult, policy: str, spectrum_file: str | None,
                    case_file: str) -> dict:
    return {"case_file": case_file, **log_document(result, policy, spectrum_file),
            "cautions": CAUTIONS}


def ranking_entries(run: LogRun) -> list[dict]:
    """Logs from harshest to mildest: the pair's damage per hour on the governing basis (the
    direct life the verdict judges), against the fleet's."""
    return [{"log": row.result.summary.name,
             "s0": json_number(lowest_s0(row)),
             "shaft_min_safety": json_number(lowest_shaft(row)),
             "dominant_class": dominant_class(row),
             "flags_time_fraction": {flag: json_number(seconds / row.result.summary.total("time_s"))
                                     for flag, seconds in row.result.summary.flag_time_s.items()
                                     if seconds > 0},
             "duration_h": json_number(row.result.summary.duration_h),
             "system_l10_h": json_number(row.result.system_life_h),
             "governing_life": {"symbol": row.result.direct_governing.symbol,
                                "life_h": json_number(row.result.governing_life_h)},
             "damage_per_hour": json_number(row.damage_per_hour),
             "relative_to_fleet": None if row.relative_to_fleet is None
             else json_number(row.relative_to_fleet)}
            for row in run.ranking()]


def fleet_document(run: LogRun, policy: str, files: dict[str, str]) -> dict:
    """The combined fleet (contract keys at the top), each log, and the ranking."""
    combined = run.combined
    return {
        "case_file": run.case_file,
        **log_document(combined, policy, files.get(combined.summary.name)),
        "logs": [log_document(r, policy, files.get(r.summary.name)) for r in run.results],
        "ranking": ranking_entries(run),
        "skipped": [f.message for f in run.failures],
        "fleet_mix": None if run.mix is None else {Path(k).name: v for k, v in run.mix.items()},
        "cautions": CAUTIONS,
    }
