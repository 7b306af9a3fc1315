"""``hubload field`` on the terminal: the fits, the prediction beside them, what they rest on."""

from __future__ import annotations

from rich.console import Console
from rich.text import Text

from hubload.report.cautions import CAUTIONS
from hubload.report.numbers import hours_with_unit
from hubload.report.reliability_notes import field_notes
from hubload.report.specs.field import fits_table
from hubload.report.terminal.tables import render
from hubload.report.usertext import plain
from hubload.studies.field import FieldStudy


def data_line(study: FieldStudy) -> str:
    data = study.data
    line = (f"{len(data.hours):,} units: {data.failures:,} failed, {data.suspensions:,} "
            f"suspended")
    positions = data.by_position()
    if positions:
        line += "; failed by position: " + ", ".join(f"{name} {found[0]}"
                                                     for name, found in positions.items())
    return line + "."


def bounds_line(study: FieldStudy) -> str | None:
    fit = study.fit
    if not study.is_fit:
        return None
    return (f"{100 * fit.confidence:g} % bounds ({fit.bounds_method}): beta {fit.beta_low:.2f} to "
            f"{fit.beta_high:.2f}; eta {hours_with_unit(fit.eta_low_h)} to "
            f"{hours_with_unit(fit.eta_high_h)}.")


def prediction_lines(study: FieldStudy) -> list[str]:
    found = study.prediction
    if found is None:
        return []
    ratio = "-" if found.ratio != found.ratio else f"{found.ratio:.2f}"
    unit = "" if found.wheel_end.name == "wheel end" else f"{plain(found.wheel_end.name)}; "
    return [f"Predicted wheel end ({unit}{plain(found.source)}): B10 "
            f"{hours_with_unit(found.wheel_end.b10_h)}, B50 "
            f"{hours_with_unit(found.wheel_end.b50_h)}.",
            f"Field B10 / predicted B10 = {ratio} ({100 * study.fit.confidence:g} % bounds "
            f"{found.ratio_low:.2f} to {found.ratio_high:.2f}): the calibration factor."]


def render_field(study: FieldStudy, console: Console) -> None:
    console.print(Text.assemble(("Field data", "bold"), f"  ({plain(study.data.source)})"))
    console.print(Text(data_line(study)))
    render(fits_table(study), console)
    for line in filter(None, [bounds_line(study), *prediction_lines(study)]):
        console.print(Text(line))
    for note in field_notes(study):
        console.print(Text(f"Note: {plain(note)}", style="dim"))
    console.print(Text(f"Caution: {CAUTIONS}", style="dim"))
