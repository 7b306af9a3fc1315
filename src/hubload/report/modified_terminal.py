"""Terminal tables of the ISO 281 modified life (shown when [lubrication] is given)."""

from __future__ import annotations

import math

import numpy as np
from rich.table import Table

from hubload.engine import Result
from hubload.units import CELSIUS_ZERO_K
from hubload.report.numbers import hours, share
from hubload.units import CST

OUTSIDE_SCOPE_MARK = "!"


def factor(value, digits: int = 2) -> str:
    value = float(value)
    return "-" if math.isnan(value) else f"{value:.{digits}f}"


def kappa_cell(kappa, outside_scope) -> str:
    kappa = float(kappa)
    cell = "-" if math.isnan(kappa) else f"{kappa:.3g}" if kappa < 1 else f"{kappa:.2f}"
    return f"[bold red]{cell} {OUTSIDE_SCOPE_MARK}[/]" if outside_scope else cell


def modified_bearing_table(result: Result, label: str) -> Table:
    """Per case: kappa, eC, aISO, modified life and its damage share."""
    modified = result.modified
    bearing = modified.bearings[label]
    symbol = modified.symbol
    table = Table(title=f"{label.capitalize()} bearing: {symbol} = a1 aISO L10 "
                        f"(a1 = {float(modified.a1):.3g})", title_justify="left")
    for heading in ("#", "kappa", "eC", "aISO", f"{symbol} h", "damage"):
        table.add_column(heading, justify="right")
    for index in range(len(result.study.cases)):
        table.add_row(str(index),
                      kappa_cell(bearing.kappa[index], bearing.kappa_outside_scope[index]),
                      factor(bearing.e_c[index]), factor(bearing.a_iso[index]),
                      hours(bearing.case_life_h[index]),
                      share(bearing.damage_share[index]))
    return table


def oil_headings(result: Result) -> list[str]:
    """Extra duty-spectrum columns: bearing temperature and oil viscosity per case."""
    return [] if result.modified is None else ["T C", "nu cSt"]


def oil_cells(result: Result, index: int) -> list[str]:
    if result.modified is None:
        return []
    temperature_c = result.study.lubrication.temperature_k[index] - CELSIUS_ZERO_K
    return [f"{temperature_c:.0f}", f"{result.modified.viscosity_m2_s[index] / CST:.1f}"]


def modified_summary_cells(result: Result, label: str | None) -> list[str]:
    """Modified life [h] of a bearing (or of the pair for ``label`` None) for the summary."""
    if result.modified is None:
        return []
    if label is None:
        return [hours(result.modified.system_life_h)]
    return [hours(result.modified.bearings[label].life_h)]


def modified_summary_headings(result: Result) -> list[str]:
    return [] if result.modified is None else [f"{result.modified.symbol} h"]


def notes(result: Result) -> list[str]:
    """What the modified life was evaluated with (shown beneath the tables)."""
    modified = result.modified
    if modified is None:
        return []
    lines = [f"Lubrication: {result.study.lubrication.method}; {modified.contamination_note}."]
    estimated = [label for label, b in modified.bearings.items() if b.fatigue_limit_estimated]
    if estimated:
        lines.append(f"Cu of the {' and '.join(estimated)} bearing{'s' * (len(estimated) > 1)} "
                     f"estimated from C0 (ISO 281 annex B): give Cu_kN from the bearing data "
                     f"when known.")
    dominant = int(np.argmax(modified.system_damage_share))
    if modified.system_damage_share[dominant] > 0 and dominant != result.dominant_case:
        lines.append(f"Dominant case of the modified life: '{result.study.cases.names[dominant]}' "
                     f"({share(modified.system_damage_share[dominant])} of the pair's damage).")
    if any(b.kappa_outside_scope.any() for b in modified.bearings.values()):
        lines.append(f"kappa marked {OUTSIDE_SCOPE_MARK}: below 0.1, outside ISO 281's scope; "
                     f"eC and aISO evaluated at kappa = 0.1 (see the warning).")
    return lines
