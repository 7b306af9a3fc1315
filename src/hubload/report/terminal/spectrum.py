"""Rich tables for ``hubload spectrum``."""

from __future__ import annotations

import numpy as np
from rich.console import Console
from rich.table import Table
from rich.text import Text

from hubload.logs.analysis import LogRun
from hubload.logs.spectrum import SpectrumResult
from hubload.logs.weights import mix_note
from hubload.report.cautions import CAUTIONS
from hubload.report.messages import warning_texts
from hubload.report.numbers import hours, safety, share
from hubload.report.specs.fleet import fleet_table
from hubload.report.specs.logs import lives_table
from hubload.report.terminal.tables import render as render_spec
from hubload.report.usertext import plain
from hubload.units import KN

TOP_CASES = 10


def shaft_table(result: SpectrumResult) -> Table | None:
    if result.shaft_life_h is None:
        return None
    extremes = result.summary.shaft
    table = Table(title="Shaft sections over the log", title_justify="left")
    for heading in ("section", "direct fatigue life h", "classed fatigue life h",
                    "lowest safety", "yield safety"):
        table.add_column(heading, justify="left" if heading == "section" else "right")
    for i, (section, life) in enumerate(zip(result.classed.shaft.sections,
                                            result.shaft_life_h)):
        table.add_row(Text(plain(section.name)), hours(life), hours(section.fatigue_life_h),
                      safety(extremes['min_safety'][i]), safety(extremes['yield_safety'][i]))
    return table


def shares_table(result: SpectrumResult, key: str, title: str, unit: str) -> Table:
    table = Table(title=title, title_justify="left")
    for heading in (f"class {unit}", "time", "damage"):
        table.add_column(heading, justify="right")
    for item in result.shares[key]:
        table.add_row(f"{item.low:g} .. {item.high:g}", share(item.time_fraction),
                      share(item.damage_share))
    return table


def top_cases_table(result: SpectrumResult) -> Table:
    cases = result.classed.study.cases
    shares = result.classed.governing.system_damage_share
    order = np.argsort(-shares)[:TOP_CASES]
    table = Table(title=f"Classed spectrum: {len(cases)} cases; the {len(order)} most damaging "
                        f"({result.classed.governing.symbol})", title_justify="left")
    for heading, justify in (("class", "left"), ("time", "right"), ("W kN", "right"),
                             ("S kN", "right"), ("T kN", "right"), ("n r/min", "right"),
                             ("damage", "right")):
        table.add_column(heading, justify=justify)
    for i in order:
        table.add_row(Text(plain(cases.names[i])), share(cases.time_fraction[i]),
                      f"{cases.wheel_load_n[i] / KN:.2f}", f"{cases.side_force_n[i] / KN:.2f}",
                      f"{cases.tractive_force_n[i] / KN:.2f}", f"{cases.speed_rpm[i]:.1f}",
                      share(shares[i]))
    return table


def cleaning_lines(result: SpectrumResult) -> list[str]:
    report = result.summary.cleaning
    lines = [f"{report.rows:,} rows, {report.used_rows:,} used, "
             f"{result.summary.duration_h:,.2f} h logged"]
    if report.dropped_rows:
        lines.append(f"{report.dropped_rows:,} row(s) with empty samples dropped")
    if report.filled_values:
        lines.append(f"{report.filled_values:,} empty sample(s) interpolated")
    if report.gaps:
        action = (f"{report.gap_time_s:,.1f} s of gap time left out" if report.filled_samples == 0
                  else f"{report.filled_samples:,} samples interpolated into them")
        lines.append(f"{report.gaps:,} gap(s) longer than {report.max_gap_s:g} s: {action}")
    return lines + list(report.notes)


def error_line(result: SpectrumResult) -> str:
    if result.classing_error is None:
        return "Classing error: undefined (no fatigue damage in the log)."
    line = f"Classing error (classed vs direct system life): {100 * result.classing_error:+.2f} %"
    if result.modified_classing_error is not None:
        line += (f" for L10, {100 * result.modified_classing_error:+.2f} % for "
                 f"{result.direct_governing.symbol}")
    return line


def render_log(result: SpectrumResult, console: Console, spectrum_file: str | None) -> None:
    console.print(Text(plain(result.summary.name), style="bold"))
    for line in cleaning_lines(result):
        console.print(Text(f"  {plain(line)}"))
    render_spec(lives_table(result), console)
    console.print(error_line(result))
    shaft = shaft_table(result)
    if shaft is not None:
        console.print(shaft)
    console.print(shares_table(result, "wheel_load_kN", "Direct damage by wheel load", "kN"))
    console.print(shares_table(result, "speed_rpm", "Direct damage by wheel speed", "r/min"))
    console.print(top_cases_table(result))
    if spectrum_file:
        console.print(Text(f"Spectrum written to {plain(spectrum_file)} (hubload check runs on "
                           "it)."))
    console.print(Text(f"Governing life (direct): {result.direct_governing.symbol} = "
                       f"{hours(result.governing_life_h)} h ({result.direct_governing.basis})."))
    for warning in warning_texts(result.findings, ()):
        console.print(Text.assemble(("Warning:", "yellow"), f" {plain(warning)}"))


def render(result: SpectrumResult, console: Console, spectrum_file: str | None) -> None:
    render_log(result, console, spectrum_file)
    console.print(f"[dim]Caution: {CAUTIONS}[/]")


def render_fleet(run: LogRun, console: Console, files: dict[str, str]) -> None:
    render_spec(fleet_table(run), console)
    if run.mix is not None:
        console.print(Text(mix_note(run.mix)))
    for failure in run.failures:
        console.print(Text.assemble(("Skipped:", "yellow"), f" {plain(failure.message)}"))
    combined = run.combined
    written = [f for name, f in files.items() if f and name != combined.summary.name]
    if written:
        console.print(f"{len(written)} per-log spectra written next to the combined one.")
    console.print("[bold]Combined fleet (all logs back to back, weighted by their hours)[/]")
    render_log(combined, console, files.get(combined.summary.name))
    console.print(f"[dim]Caution: {CAUTIONS}[/]")
