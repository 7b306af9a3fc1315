"""The tables of ``hubload check``: spectrum, bearing loads and lives per case, lubrication,
ratings from the geometry and the spectrum lives. Shared by the terminal and the HTML report.
"""

from __future__ import annotations

import numpy as np

from hubload.engine import Result
from hubload.engine.governing import symbol_of
from hubload.report.columns import Column, TableSpec, cut_to_cases
from hubload.report.numbers import factor_text, fixed, hours, percent, safety
from hubload.units import CELSIUS_ZERO_K, CST, KN

SHORT = {"outboard": "out", "inboard": "in"}


def life_symbols(result: Result) -> tuple[str, str | None]:
    """Symbols of the per-case basic and (with lubrication) modified lives of the method."""
    reliability = float(result.study.reliability_percent)
    basic = symbol_of(result.method, 90.0, False)
    modified = None if result.modified is None else symbol_of(result.method, reliability, True)
    return basic, modified


def index_column(result: Result, rows=None) -> Column:
    count = len(result.study.cases)
    return Column("case_index", "#", list(range(count)) if rows is None else rows)


def case_limit(result: Result, spec: TableSpec, limit: int | None) -> TableSpec:
    governing = result.governing
    return cut_to_cases(spec, governing.system_damage_share, governing.symbol, limit)


def spectrum_table(result: Result, limit: int | None) -> TableSpec:
    cases, governing = result.study.cases, result.governing
    columns = [index_column(result),
               Column("name", "case", list(cases.names), name=True),
               Column("time_fraction", "time", list(cases.time_fraction), "%", percent),
               Column("speed_rpm", "n", list(cases.speed_rpm), "r/min", fixed(1),
                      legend="wheel speed")]
    if result.modified is not None:
        def per_case(values):   # a classed log's study may hold one value for every case
            return list(np.broadcast_to(values, (len(cases),)))
        columns += [Column("temperature_C", "T", per_case(result.study.lubrication.temperature_k
                                                          - CELSIUS_ZERO_K), "C", fixed(0),
                           legend="bearing temperature"),
                    Column("viscosity_cSt", "nu", per_case(result.modified.viscosity_m2_s / CST),
                           "cSt", fixed(1), legend="oil viscosity")]
    columns.append(Column("governing_damage_share", "damage", list(governing.system_damage_share),
                          "%", percent,
                          legend=f"share of the pair's damage on the governing basis "
                                 f"({governing.symbol})"))
    spec = TableSpec("spectrum", f"Duty spectrum: {len(cases):,} cases", tuple(columns))
    return case_limit(result, spec, limit)


def loads_table(result: Result, limit: int | None) -> TableSpec:
    columns = [index_column(result)]
    equivalent = "Pref" if result.refined is not None else "P"
    for label, bearing in result.bearings.items():
        short = SHORT[label]
        columns += [
            Column(f"{label}.fr_kN", f"Fr {short}", list(bearing.radial_n / KN), "kN", fixed(2)),
            Column(f"{label}.fa_kN", f"Fa {short}", list(bearing.axial_n / KN), "kN", fixed(2)),
            Column(f"{label}.p_kN", f"{equivalent} {short}", list(bearing.equivalent_n / KN),
                   "kN", fixed(2)),
            Column(f"{label}.p0_kN", f"P0 {short}", list(bearing.static_equivalent_n / KN),
                   "kN", fixed(2))]
    how = ("the refined load distribution; Pref: ISO/TS 16281 reference equivalent load"
           if result.refined is not None else "the ISO 281 rule for the pair")
    spec = TableSpec("loads", "Bearing loads per case", tuple(columns),
                     notes=(f"Fr, Fa: radial and axial load from {how}; P: equivalent dynamic "
                            f"load, P0: static (ISO 76); out: outboard, in: inboard bearing.",))
    return case_limit(result, spec, limit)


def lives_table(result: Result, limit: int | None) -> TableSpec:
    basic, modified = life_symbols(result)
    governing = result.governing
    columns = [index_column(result)]
    for label, bearing in result.bearings.items():
        short = SHORT[label]
        columns.append(Column(f"{label}.l10_h", f"{basic} {short}", list(bearing.case_life_h),
                              "h", hours))
        if modified is not None:
            columns.append(Column(f"{label}.l10m_h", f"{modified} {short}",
                                  list(result.modified.bearings[label].case_life_h), "h", hours))
        columns.append(Column(f"{label}.governing_damage_share", f"dmg {short}",
                              list(governing.bearing_damage_share(label)), "%", percent))
    spec = TableSpec("lives", "Bearing lives per case (the case alone) and damage shares",
                     tuple(columns),
                     notes=(f"dmg: the case's share of the bearing's damage on the governing "
                            f"basis ({governing.symbol}).",))
    return case_limit(result, spec, limit)


def kappa_alert(value) -> bool:
    return bool(np.isfinite(value) and value < 0.1)


def kappa_text(value) -> str:
    """kappa, marked '!' below ISO 281's scope (readable without colour, and in grey print)."""
    return factor_text(value) + (" !" if kappa_alert(value) else "")


def lubrication_table(result: Result, limit: int | None) -> TableSpec | None:
    modified = result.modified
    if modified is None:
        return None
    columns = [index_column(result)]
    for label, bearing in modified.bearings.items():
        short = SHORT[label]
        columns += [
            Column(f"{label}.kappa", f"kappa {short}", list(bearing.kappa), "", kappa_text,
                   alert=kappa_alert),
            Column(f"{label}.e_c", f"eC {short}", list(bearing.e_c), "", fixed(2)),
            Column(f"{label}.a_iso", f"aISO {short}", list(bearing.a_iso), "", fixed(2))]
    symbol = life_symbols(result)[1]
    notes = [f"{symbol} = a1 aISO L10 (ISO 281:2007, 9.1), a1 = {float(modified.a1):.3g}; "
             f"kappa = nu / nu1; '-': standstill"
             + ("; !: kappa < 0.1, outside ISO 281's scope (eC, aISO at 0.1)."
                if any(b.kappa_outside_scope.any() for b in modified.bearings.values())
                else ".")]
    spec = TableSpec("lubrication", "Lubrication per case (ISO 281 modified life)",
                     tuple(columns), notes=tuple(notes))
    return case_limit(result, spec, limit)


def ratings_table(result: Result, always: bool = True) -> TableSpec | None:
    """Typed ratings beside those from the internal geometry (ISO 281 C, ISO 76 C0); with
    ``always`` False only where they matter: the refined method rates from the geometry."""
    if not result.geometry_ratings or not (always or result.refined is not None):
        return None
    pair = result.study.pair.bearings()
    labels = list(result.geometry_ratings)
    rated = [result.geometry_ratings[label] for label in labels]
    return TableSpec("ratings", "Ratings: typed and from the internal geometry", (
        Column("bearing", "bearing", labels, name=True),
        Column("c_kN", "C", [float(pair[k].dynamic_rating_n) / KN for k in labels], "kN",
               fixed(1)),
        Column("c_from_geometry_kN", "C geom", [float(r.dynamic_n) / KN for r in rated], "kN",
               fixed(1)),
        Column("c0_kN", "C0", [float(pair[k].static_rating_n) / KN for k in labels], "kN",
               fixed(1)),
        Column("c0_from_geometry_kN", "C0 geom", [float(r.static_n) / KN for r in rated], "kN",
               fixed(1))),
        notes=("C geom: ISO 281 (7.1.1) from the rollers; C0 geom: ISO 76 from the rollers.",))


def summary_rows(result: Result):
    """(label, name, method lives) rows of the summary: each bearing, then the pair."""
    pair = result.study.pair.bearings()
    rows = [(label, pair[label].label if pair[label].label != label else "", label)
            for label in result.bearings]
    return rows + [("pair (system)", "", None)]


def method_columns(result: Result, lives, modified, symbols: tuple[str, str | None],
                   prefix: str) -> list[Column]:
    """Life, distance, modified life and s0 columns of one method's lives."""
    rows = summary_rows(result)

    def per_row(bearing_value, system_value):
        return [system_value if key is None else bearing_value(key) for _, _, key in rows]

    basic, modified_symbol = symbols
    columns = [
        Column(f"{prefix}l10_h", basic, per_row(
            lambda k: float(lives.bearings[k].life_h), float(lives.system_life_h)), "h", hours),
        Column(f"{prefix}l10_km", basic, per_row(
            lambda k: float(lives.bearings[k].life_km), float(lives.system_life_km)), "km",
            hours)]
    if modified is not None:
        columns += [
            Column(f"{prefix}l10m_h", modified_symbol, per_row(
                lambda k: float(modified.bearings[k].life_h), float(modified.system_life_h)),
                "h", hours),
            Column(f"{prefix}l10m_km", modified_symbol, per_row(
                lambda k: float(modified.bearings[k].life_km), float(modified.system_life_km)),
                "km", hours)]
    columns.append(Column(f"{prefix}s0", "s0", per_row(
        lambda k: float(lives.bearings[k].static_safety), float("nan")), "", safety))
    return columns


def summary_table(result: Result) -> TableSpec:
    rows = summary_rows(result)
    columns = [Column("bearing", "bearing", [r[0] for r in rows], name=True)]
    refined = result.refined is not None
    columns += method_columns(result, result, result.modified, life_symbols(result), "")
    named = [f"{label}: {name}" for label, name, _ in rows if name]
    notes = ["; ".join(named) + "."] if named else []
    if refined:
        lives = result.iso281
        reliability = float(result.study.reliability_percent)
        symbols = ("L10", None if lives.modified is None else symbol_of("iso281", reliability,
                                                                        True))
        columns += method_columns(result, lives, lives.modified, symbols, "iso281.")
        notes.append(f"{life_symbols(result)[0]}: ISO/TS 16281 reference rating life of the "
                     f"refined load distribution; L10: the ISO 281 rule for the pair, beside it.")
    return TableSpec("summary", "Spectrum lives (Palmgren-Miner) and static safety",
                     tuple(columns), notes=tuple(notes), keep_first=1,
                     row_keys=tuple("system" if key is None else f"bearings.{key}"
                                    for _, _, key in rows))
