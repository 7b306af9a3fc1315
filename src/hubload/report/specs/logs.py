"""The lives table of ``hubload spectrum`` (terminal and spreadsheet): direct and classed."""

from __future__ import annotations

from hubload.engine.governing import symbol_of
from hubload.logs.pipeline import LABELS
from hubload.logs.spectrum import SpectrumResult, iso281_lives
from hubload.report.columns import Column, TableSpec
from hubload.report.numbers import hours, safety


def lives_table(result: SpectrumResult) -> TableSpec:
    """Direct lives (every sample, ISO 281 rule) beside the classed spectrum's by the same rule,
    and, when the classes are solved by the refined method, its reference lives too."""
    classed = result.classed
    iso = iso281_lives(classed)
    reliability = float(classed.study.reliability_percent)
    rows = [*LABELS, None]

    def per_row(bearing, system):
        return [system() if label is None else bearing(label) for label in rows]

    columns = [Column("bearing", "bearing", [label or "pair (system)" for label in rows],
                      name=True),
               Column("direct.l10_h", "direct L10", per_row(lambda k: result.life_h[k],
                                                            lambda: result.system_life_h),
                      "h", hours),
               Column("classed.l10_h", "classed L10", per_row(
                   lambda k: iso.bearings[k].life_h, lambda: iso.system_life_h), "h", hours)]
    if iso.modified is not None:
        symbol = symbol_of("iso281", reliability, True)
        columns += [Column("direct.l10m_h", f"direct {symbol}", per_row(
                        lambda k: result.modified_life_h[k], lambda: result.modified_system_life_h),
                        "h", hours),
                    Column("classed.l10m_h", f"classed {symbol}", per_row(
                        lambda k: iso.modified.bearings[k].life_h,
                        lambda: iso.modified.system_life_h), "h", hours)]
    if classed.refined is not None:
        columns.append(Column("classed.l10r_h", "classed L10r", per_row(
            lambda k: classed.bearings[k].life_h, lambda: classed.system_life_h), "h", hours))
        if classed.modified is not None:
            columns.append(Column("classed.l10mr_h", f"classed {symbol_of('refined', reliability, True)}",
                                  per_row(lambda k: classed.modified.bearings[k].life_h,
                                          lambda: classed.modified.system_life_h), "h", hours))
    columns += [Column("damage", "log damage", per_row(lambda k: result.damage[k], lambda: None),
                       "", lambda v: "" if v is None else f"{v:.3g}"),
                Column("s0", "s0 at peak", per_row(lambda k: result.static_safety[k],
                                                   lambda: None), "",
                       lambda v: "" if v is None else safety(v))]
    return TableSpec("log_lives", "Lives: direct (every sample) and classed spectrum",
                     tuple(columns))
