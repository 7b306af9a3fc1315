"""Rich tables of the refined method and of the ratings from the internal geometry."""

from __future__ import annotations

import numpy as np
from rich.table import Table

from hubload.engine import Result
from hubload.engine.refined_method import RATING_DEVIATION_WARNING, STATIC_RATING_PRESSURE_PA
from hubload.report.numbers import setting_kind
from hubload.units import KN



def life_basis(result: Result) -> str:
    """What the per-case life and P columns hold."""
    if result.refined is None:
        return "ISO 281 basic life"
    return "refined load distribution, ISO/TS 16281 reference life (P = Pref)"


def distribution_table(result: Result, label: str) -> Table:
    """Load zone, peak roller load and contact pressure per case of one bearing."""
    found = result.refined.bearings[label]
    table = Table(title=f"{label.capitalize()} bearing: load distribution per case",
                  title_justify="left")
    for heading in ("#", "load zone deg", "Qmax kN", "p max MPa"):
        table.add_column(heading, justify="right")
    for index in range(len(result.study.cases)):
        pressure = found.max_contact_pressure_pa[index]
        style = "red" if pressure > STATIC_RATING_PRESSURE_PA else None
        table.add_row(str(index), f"{np.degrees(found.load_zone_rad[index]):.0f}",
                      f"{found.max_roller_load_n[index] / KN:.2f}",
                      f"[{style}]{pressure / 1e6:,.0f}[/]" if style else f"{pressure / 1e6:,.0f}")
    return table


def shaft_table(result: Result) -> Table:
    refined = result.refined
    setting_um = float(np.squeeze(refined.setting_m)) * 1e6
    table = Table(title=f"Shaft in the housing per case (axial setting {setting_um:g} um, "
                        f"{setting_kind(setting_um)}; "
                        f"{result.study.pair.rotating_ring} ring rotating)", title_justify="left")
    for heading in ("#", "tilt mrad", "axial um", "radial at wheel um", "equilibrium"):
        table.add_column(heading, justify="right")
    for index in range(len(result.study.cases)):
        table.add_row(str(index), f"{refined.tilt_rad[index] * 1e3:.3f}",
                      f"{refined.axial_displacement_m[index] * 1e6:+.1f}",
                      f"{refined.radial_displacement_at_wheel_m[index] * 1e6:.1f}",
                      "yes" if refined.converged[index] else "[red]none found[/]")
    return table


def ratings_table(result: Result) -> Table | None:
    """Typed ratings beside those from the internal geometry (ISO 281, ISO 76)."""
    if not result.geometry_ratings:
        return None
    table = Table(title="Ratings: typed and from the internal geometry (ISO 281 C, ISO 76 C0)",
                  title_justify="left")
    for heading, justify in (("bearing", "left"), ("C kN", "right"), ("C geometry kN", "right"),
                             ("C0 kN", "right"), ("C0 geometry kN", "right")):
        table.add_column(heading, justify=justify)
    pair = result.study.pair.bearings()
    for label, rated in result.geometry_ratings.items():
        cells = []
        for typed, geometric in ((pair[label].dynamic_rating_n, rated.dynamic_n),
                                 (pair[label].static_rating_n, rated.static_n)):
            off = abs(float(np.squeeze(geometric)) / float(np.squeeze(typed)) - 1.0) > RATING_DEVIATION_WARNING
            text = f"{float(np.squeeze(geometric)) / KN:.1f}"
            cells += [f"{float(np.squeeze(typed)) / KN:.1f}", f"[yellow]{text}[/]" if off else text]
        table.add_row(label, *cells)
    return table


def refined_tables(result: Result) -> list[Table]:
    """Every table this module adds to the check report, in order."""
    tables = [] if result.refined is None else [
        *(distribution_table(result, label) for label in result.refined.bearings),
        shaft_table(result)]
    ratings = ratings_table(result)
    return tables + ([] if ratings is None else [ratings])
