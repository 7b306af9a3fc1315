"""The study commands: sweep, compare (load-case files or machines), brief and setting."""

from __future__ import annotations

import click

from hubload import api
from hubload.commands import (PLOT_SUFFIXES, Outputs, checked, checked_table, console,
                              inputs_of, json_text, printed, written)
from hubload.errors import InputError


def sweep(file: str, specs: tuple[str, ...], as_json: bool = False, plot: str | None = None,
          force: bool = False, method: str | None = None,
          table: str | None = None) -> api.SweepResult:
    from hubload.report.progress import LateProgress

    inputs = inputs_of((file,), plot, table)
    checked(plot, force, PLOT_SUFFIXES, inputs)
    if plot is not None and len(specs) not in (1, 2):
        raise InputError(f"--plot draws one or two --vary keys, got {len(specs)}", file=plot)
    if api.is_machine_file(file):
        return machine_sweep(file, specs, as_json, plot, table, force, method)
    checked_table(table, "hubload.report.spreadsheet.studies:SWEEP_SHEETS", force, inputs)
    with LateProgress("sweeping") as progress:
        outputs = Outputs(progress, force, inputs)
        found = api.sweep(file, specs, method=method, on_progress=progress)
        outputs.table(table, "hubload.report.spreadsheet.studies:sweep_sheets", found.value)
        outputs.plot(plot, "hubload.report.plots.sweep:sweep_line_figure" if len(found.axes) == 1
                     else "hubload.report.plots.sweep:sweep_contour_figure", found.value)
        document = json_text(found, progress) if as_json else None
    outputs.name_all(as_json)
    printed(found, document, "hubload.report.terminal.sweep:render")
    return found


def machine_sweep(file: str, specs: tuple[str, ...], as_json: bool, plot: str | None,
                  table: str | None, force: bool, method: str | None):
    from hubload.report.progress import LateProgress

    refuse_plot_for_machines(plot, "sweeps", "or sweep a wheel file of --write-wheel-files")
    checked_table(table, "hubload.report.spreadsheet.machine:SWEEP_SHEETS", force, (file,))
    with LateProgress("sweeping") as progress:
        outputs = Outputs(progress, force, (file,))
        found = api.sweep(file, specs, method=method, on_progress=progress)
        outputs.table(table, "hubload.report.spreadsheet.machine:machine_sweep_sheets",
                      found.value)
        document = json_text(found, progress) if as_json else None
    outputs.name_all(as_json)
    printed(found, document, "hubload.report.terminal.machine_sweep:render")
    return found


def refuse_plot_for_machines(plot: str | None, what: str, hint: str = "") -> None:
    """Plots of machine sweeps and comparisons are not drawn: one line saying so."""
    if plot is not None:
        raise InputError(f"--plot draws {what} of load-case files; for machine files use "
                         f"--json or --table{', ' + hint if hint else ''}", file=plot)


def machine_compare(files: tuple[str, ...], as_json: bool, plot: str | None,
                    table: str | None, force: bool, method: str | None):
    from hubload.report.progress import LateProgress

    refuse_plot_for_machines(plot, "comparisons")
    checked_table(table, "hubload.report.spreadsheet.machine:COMPARE_SHEETS", force,
                  tuple(files))
    with LateProgress(f"comparing {len(files)} machines") as progress:
        outputs = Outputs(progress, force, tuple(files))
        found = api.compare(list(files), method=method)
        outputs.table(table, "hubload.report.spreadsheet.machine:machine_compare_sheets",
                      found.value)
        document = json_text(found, progress) if as_json else None
    outputs.name_all(as_json)
    printed(found, document, "hubload.report.terminal.machine_compare:render")
    return found


def compare(files: tuple[str, ...], as_json: bool = False, plot: str | None = None,
            force: bool = False, method: str | None = None,
            table: str | None = None) -> api.ComparisonResult:
    from hubload.report.progress import LateProgress

    if any(api.is_machine_file(name) for name in files):
        return machine_compare(files, as_json, plot, table, force, method)
    inputs = inputs_of(tuple(files), plot, table)
    checked(plot, force, PLOT_SUFFIXES, inputs)
    checked_table(table, "hubload.report.spreadsheet.studies:COMPARE_SHEETS", force, inputs)
    with LateProgress(f"comparing {len(files)} files") as progress:
        outputs = Outputs(progress, force, inputs)
        found = api.compare(list(files), method=method, on_progress=progress)
        outputs.table(table, "hubload.report.spreadsheet.studies:compare_sheets", found.value)
        outputs.plot(plot, "hubload.report.plots.spectrum:compare_figure", found.value)
        document = json_text(found, progress) if as_json else None
    outputs.name_all(as_json)
    printed(found, document, "hubload.report.terminal.compare:render")
    return found


def brief(file: str, out: str | None = None, force: bool = False,
          required_s0: float | None = None, method: str | None = None) -> api.BriefResult:
    from hubload.report.progress import LateProgress

    checked(out, force, (".md", ".markdown", ".html", ".htm") if out is not None else (),
            inputs=(file,))
    from hubload.report.usertext import plain

    html = out is not None and out.lower().endswith((".html", ".htm"))
    with LateProgress("searching the required ratings") as progress:
        found = api.brief(file, required_s0=required_s0, method=method, on_progress=progress)
        progress.phase("writing the brief")
        # no escape sequence from the file reaches a terminal
        text = found.to_html() if html else plain(found.to_markdown())
    if out is None:
        click.echo(text, nl=False)
    else:
        from hubload.report.files import write_text

        write_text(out, text, force, inputs=(file,))
        written("Brief", out)
    return found


def setting(file: str, start_um: float, stop_um: float, step_um: float, as_json: bool = False,
            plot: str | None = None, force: bool = False) -> api.SettingResult:
    from hubload.report.progress import LateProgress

    checked(plot, force, PLOT_SUFFIXES, (file,))
    with LateProgress("solving the cases at each setting") as progress:
        found = api.setting(file, start_um, stop_um, step_um, on_progress=progress)
        if plot is not None:
            from hubload.report.plots import save
            from hubload.report.plots.setting import setting_figure

            progress.phase("drawing the plot")
            save(setting_figure(found.value), plot, force, (file,))
        document = json_text(found, progress) if as_json else None
    if plot is not None:
        written("Plot", plot, as_json)
    if as_json:
        click.echo(document)
    else:
        from hubload.report.terminal.setting import render_setting

        render_setting(found.value, console())
    return found
