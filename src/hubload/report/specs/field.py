"""The table of ``hubload field``: the Weibull fits of the field data."""

from __future__ import annotations

from hubload.model.weibull_fit import WeibullFit
from hubload.report.columns import Column, TableSpec
from hubload.report.numbers import fixed, hours
from hubload.studies.field import FieldStudy

METHOD_NAMES = {"maximum-likelihood": "maximum likelihood",
                "rank-regression-on-y": "median-rank regression",
                "weibayes": "Weibayes (slope assumed)"}


def fits_table(study: FieldStudy) -> TableSpec:
    fits: list[WeibullFit] = [f for f in (study.fit, study.rank_regression) if f is not None]
    level = f"{100 * study.fit.confidence:g} %"
    return TableSpec("fits", "Weibull fits of the field data", (
        Column("method", "method", [METHOD_NAMES[f.method] for f in fits], name=True),
        Column("beta", "beta", [f.beta for f in fits], "", fixed(3), legend="Weibull slope"),
        Column("eta_h", "eta", [f.eta_h for f in fits], "h", hours,
               legend="characteristic life (63.2 % failed)"),
        Column("b10_h", "B10", [f.b10_h for f in fits], "h", hours),
        Column("b10_low_h", "B10 low", [f.b10_low_h for f in fits], "h", hours,
               legend=f"{level} lower bound"),
        Column("b10_high_h", "B10 high", [f.b10_high_h for f in fits], "h", hours,
               legend=f"upper bound ({study.fit.bounds_method})"),
    ))
