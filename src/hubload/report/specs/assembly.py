"""The operating setting and friction table of ``hubload check`` (terminal and HTML)."""

from __future__ import annotations

import numpy as np

from hubload.engine import Result
from hubload.report.columns import Column, TableSpec, cut_to_cases
from hubload.report.numbers import fixed, hours_with_unit, setting_kind
from hubload.report.specs.check import SHORT
from hubload.units import UM


def shows_setting(result: Result) -> bool:
    return result.setting.assembly_m is not None or result.refined is not None


def setting_columns(result: Result) -> list[Column]:
    setting = result.setting
    columns = [Column("operating_setting_um", "setting", list(setting.operating_m / UM), "um",
                      fixed(1), legend="axial setting in operation (> 0 end play, < 0 preload)")]
    if setting.terms is None:
        return columns
    terms = setting.terms
    count = len(result.study.cases)
    take_up = terms.fit_take_up_m if setting.basis == "unmounted" else 0.0
    for key, label, values, words in (
            ("fit_take_up", "fits", take_up, "taken up by the fits (unmounted basis)"),
            ("radial_thermal", "radial", terms.radial_thermal_m,
             "lost to the rings' radial growth (through cot a)"),
            ("fit_thermal", "fit dT", terms.fit_thermal_m, "lost to the fits' change with "
             "temperature"),
            ("axial_thermal", "axial", terms.axial_thermal_m, "lost to the shaft's axial growth "
             "against the housing")):
        columns.append(Column(f"setting_loss_um.{key}", label,
                              list(np.broadcast_to(values, (count,)) / UM), "um", fixed(1),
                              legend=words))
    return columns


def friction_columns(result: Result) -> list[Column]:
    friction = result.friction
    if friction is None:
        return []
    columns = []
    for label, bearing in friction.bearings.items():
        columns += [Column(f"{label}.friction_torque_Nm", f"M {SHORT[label]}",
                           list(bearing.torque_nm), "N m", fixed(2)),
                    Column(f"{label}.power_W", f"loss {SHORT[label]}", list(bearing.power_w),
                           "W", fixed(1))]
    return columns


def setting_table(result: Result, limit: int | None, friction: bool = True) -> TableSpec | None:
    """Per case: the operating setting and its terms, the bearings' friction and power loss
    (``friction`` False: the setting only, its friction said in one line, friction_line)."""
    columns = (setting_columns(result) if shows_setting(result) else []) + \
        (friction_columns(result) if friction else [])
    if not columns:
        return None
    count = len(result.study.cases)
    spec = TableSpec("setting", "Bearing setting and friction per case",
                     (Column("case_index", "#", list(range(count))), *columns),
                     notes=tuple(setting_notes(result, friction)))
    governing = result.governing
    return cut_to_cases(spec, governing.system_damage_share, governing.symbol, limit)


def friction_line(result: Result) -> str:
    """The bearings' friction in one line: the spectrum's mean power loss and the peak torque."""
    friction = result.friction
    label, bearing = max(friction.bearings.items(), key=lambda kv: float(np.max(kv[1].torque_nm)))
    worst = int(np.argmax(bearing.torque_nm))
    return (f"Friction (Palmgren, f0 = {friction.f0:g}): the pair's mean power loss "
            f"{float(friction.mean_power_w):.1f} W over the spectrum; highest torque "
            f"{float(bearing.torque_nm[worst]):.2f} N m ({label} bearing, case {worst}); per case: "
            f"--all or --json.")


def setting_notes(result: Result, friction: bool = True) -> list[str]:
    notes = []
    setting = result.setting
    if setting.assembly_m is not None:
        assembly_um = float(setting.assembly_m) / UM
        tolerance_um = float(setting.tolerance_m) / UM
        notes.append(f"Assembly setting {assembly_um:g} +/- {tolerance_um:g} um "
                     f"({setting_kind(assembly_um)}, {setting.basis} basis); in operation: "
                     f"assembly - fits - radial - fit dT - axial.")
    band = band_line(result)
    if band:
        notes.append(band)
    if result.friction is not None and friction:
        notes.append(f"M: friction torque, loss: power loss (Palmgren, f0 = "
                     f"{result.friction.f0:g}); the pair's mean loss over the spectrum "
                     f"{float(result.friction.mean_power_w):.1f} W.")
    return notes


def band_line(result: Result) -> str:
    """The refined lives at both ends of the band and in its middle."""
    if result.band is None:
        return ""
    setting = result.setting
    assembly, tolerance = float(setting.assembly_m) / UM, float(setting.tolerance_m) / UM
    by_end = {c.band_end: c for c in result.governing.candidates if c.method == "refined"}
    symbol = by_end[""].symbol
    return (f"Setting band: system {symbol} {hours_with_unit(by_end['low'].system_life_h)} at "
            f"{assembly - tolerance:g} um, {hours_with_unit(by_end[''].system_life_h)} at "
            f"{assembly:g} um, {hours_with_unit(by_end['high'].system_life_h)} at "
            f"{assembly + tolerance:g} um; the worse end counts for the verdict.")
