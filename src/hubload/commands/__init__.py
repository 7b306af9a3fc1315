"""One plain function per command: parsed options in, the API's result out, handed to report.

Each function checks its output files first (a refusal should not wait for the work),
runs the Python API (``hubload.api``), writes the files asked for and prints; it returns
the result, so a command works from a notebook too.
"""

from __future__ import annotations


import click

from hubload import api
from hubload.errors import InputError
from hubload.report.json.text import document_text

PLOT_SUFFIXES = (".png", ".svg")


def checked(path: str | None, force: bool, suffixes: tuple[str, ...] = (),
            inputs: tuple[str, ...] = ()) -> None:
    """Refuse an output before the work: checked again when it is written."""
    if path is not None:
        from hubload.report.files import checked_output

        checked_output(path, force, suffixes, inputs)


def console(stderr: bool = False):
    """A rich console, imported only when a command prints tables (--json does not)."""
    from rich.console import Console

    return Console(stderr=stderr)


def written(kind: str, path: str, as_json: bool = False) -> None:
    """Name every file written (on stderr with --json: stdout stays one JSON document)."""
    from hubload.report.terminal.tables import plain

    console(stderr=as_json).print(f"{kind} written to {plain(path)}", highlight=False,
                                  markup=False)


def inputs_of(files: tuple[str, ...], *outputs: str | None) -> tuple[str, ...]:
    """The load-case files and the tables they read their cases from (no output replaces
    them); read only when an output is asked for, so that a plain run reads each file once."""
    if all(output is None for output in outputs):
        return files
    from hubload.casefile.casetable import input_files

    return tuple(name for file in files for name in input_files(file))


def checked_table(path: str | None, sheets, force: bool, inputs: tuple[str, ...]) -> None:
    if path is not None:
        from hubload.report.spreadsheet.workbook import check_outputs

        check_outputs(path, sheets, force, inputs)


def write_table(path: str, sheets, force: bool, inputs: tuple[str, ...]) -> list[str]:
    """Write the --table sheets; the files written, to be named once the work is done."""
    from hubload.report.spreadsheet.workbook import write_sheets

    return list(write_sheets(path, sheets, force, inputs))


def check(file: str, as_json: bool = False, report: str | None = None,
          plot: str | None = None, force: bool = False, method: str | None = None,
          show_all: bool = False, table: str | None = None) -> api.CheckResult:
    from hubload.report.progress import LateProgress

    inputs = inputs_of((file,), report, plot, table)
    checked(report, force, (".html", ".htm"), inputs)
    checked(plot, force, PLOT_SUFFIXES, inputs)
    if table is not None:
        from hubload.report.spreadsheet.check import SHEETS

        checked_table(table, SHEETS, force, inputs)
    files = []
    with LateProgress("reading the file") as progress:  # ends before anything is printed
        study = api.load(file, method)
        found = api.check(study, on_progress=progress.phase(computing(study)))
        if table is not None:
            from hubload.report.spreadsheet.check import check_sheets

            progress.phase("writing the tables")
            files += [("Table", name) for name in
                      write_table(table, check_sheets(found.value), force, inputs)]
        if report is not None:
            write_report(found, file, report, force, inputs,
                         progress.phase("writing the report"))
            files.append(("Report", report))
        if plot is not None:
            from hubload.report.plots import save
            from hubload.report.plots.spectrum import damage_share_figure

            progress.phase("drawing the plot")
            save(damage_share_figure(found.value), plot, force, inputs)
            files.append(("Plot", plot))
        document = json_text(found, progress) if as_json else None
    for kind, path in files:
        written(kind, path, as_json)
    if as_json:
        click.echo(document)
    else:
        from hubload.report.terminal.check import render_check

        render_check(found.value, console(), show_all=show_all)
    return found


def computing(study) -> str:
    """The words of the bar while a study's cases are computed."""
    count = len(study.cases.names)
    return f"computing {count:,} case{'s' if count != 1 else ''} ({study.method})"


def write_report(found: api.CheckResult, file: str, report: str, force: bool,
                 inputs: tuple[str, ...], on_progress) -> None:
    from hubload.casefile.load import read_document
    from hubload.report.files import write_text
    from hubload.report.html.check import report_html

    write_text(report, report_html(found.value, read_document(file), on_progress), force,
               inputs=inputs)


def schema(machine: bool = False) -> None:
    from hubload.schema.export import json_schema

    if machine:
        from hubload.schema.machineformat import MACHINE_FORMAT

        click.echo(document_text(json_schema(MACHINE_FORMAT, "hubload machine file")))
        return
    from hubload.schema import FORMAT

    click.echo(document_text(json_schema(FORMAT)))


def template() -> None:
    from hubload.schema import FORMAT
    from hubload.schema.export import template_text

    click.echo(template_text(FORMAT), nl=False)


def sweep(file: str, specs: tuple[str, ...], as_json: bool = False, plot: str | None = None,
          force: bool = False, method: str | None = None,
          table: str | None = None) -> api.SweepResult:
    from hubload.report.progress import LateProgress

    inputs = inputs_of((file,), plot, table)
    checked(plot, force, PLOT_SUFFIXES, inputs)
    if plot is not None and len(specs) not in (1, 2):
        raise InputError(f"--plot draws one or two --vary keys, got {len(specs)}", file=plot)
    if api.is_machine_file(file):
        return machine_sweep(file, specs, as_json, plot, table, method)
    if table is not None:
        from hubload.report.spreadsheet.studies import SWEEP_SHEETS

        checked_table(table, SWEEP_SHEETS, force, inputs)
    files = []
    with LateProgress("sweeping") as progress:
        found = api.sweep(file, specs, method=method, on_progress=progress)
        if table is not None:
            from hubload.report.spreadsheet.studies import sweep_sheets

            progress.phase("writing the tables")
            files += [("Table", name) for name in
                      write_table(table, sweep_sheets(found.value), force, inputs)]
        if plot is not None:
            from hubload.report.plots import save
            from hubload.report.plots.sweep import sweep_contour_figure, sweep_line_figure

            progress.phase("drawing the plot")
            draw = sweep_line_figure if len(found.axes) == 1 else sweep_contour_figure
            save(draw(found.value), plot, force, inputs)
            files.append(("Plot", plot))
        document = json_text(found, progress) if as_json else None
    for kind, path in files:
        written(kind, path, as_json)
    if as_json:
        click.echo(document)
    else:
        from hubload.report.terminal.sweep import render

        render(found.value, console())
    return found


def json_text(found, progress) -> str:
    """The --json document of a result, built under the bar (a large one takes seconds)."""
    progress.phase("writing JSON")
    return document_text(found.to_dict())


def machine_sweep(file: str, specs: tuple[str, ...], as_json: bool, plot: str | None,
                  table: str | None, method: str | None):
    from hubload.report.progress import LateProgress

    refuse_for_machines(plot, table, "sweeps", "or sweep a wheel file of --write-wheel-files")
    with LateProgress("sweeping") as progress:
        found = api.sweep(file, specs, method=method, on_progress=progress)
        document = json_text(found, progress) if as_json else None
    if as_json:
        click.echo(document)
    else:
        from hubload.report.terminal.machine_sweep import render as render_machine

        render_machine(found.value, console())
    return found


def refuse_for_machines(plot: str | None, table: str | None, what: str, hint: str = "") -> None:
    """Plots and sheets of machine sweeps and comparisons are not drawn: one line saying so."""
    for option, path in (("--plot", plot), ("--table", table)):
        if path is not None:
            raise InputError(f"{option} writes {what} of load-case files; for machine files "
                             f"use --json{', ' + hint if hint else ''}", file=path)


def machine_compare(files: tuple[str, ...], as_json: bool, plot: str | None,
                    table: str | None, method: str | None):
    refuse_for_machines(plot, table, "comparisons")
    found = api.compare(list(files), method=method)
    if as_json:
        click.echo(document_text(found.to_dict()))
    else:
        from hubload.report.terminal.machine_compare import render as render_machines

        render_machines(found.value, console())
    return found


def compare(files: tuple[str, ...], as_json: bool = False, plot: str | None = None,
            force: bool = False, method: str | None = None,
            table: str | None = None) -> api.ComparisonResult:
    from hubload.report.progress import LateProgress

    if any(api.is_machine_file(name) for name in files):
        return machine_compare(files, as_json, plot, table, method)
    inputs = inputs_of(tuple(files), plot, table)
    checked(plot, force, PLOT_SUFFIXES, inputs)
    if table is not None:
        from hubload.report.spreadsheet.studies import COMPARE_SHEETS

        checked_table(table, COMPARE_SHEETS, force, inputs)
    outputs = []
    with LateProgress(f"comparing {len(files)} files") as progress:
        found = api.compare(list(files), method=method, on_progress=progress)
        if table is not None:
            from hubload.report.spreadsheet.studies import compare_sheets

            progress.phase("writing the tables")
            outputs += [("Table", name) for name in
                        write_table(table, compare_sheets(found.value), force, inputs)]
        if plot is not None:
            from hubload.report.plots import save
            from hubload.report.plots.spectrum import compare_figure

            progress.phase("drawing the plot")
            save(compare_figure(found.value), plot, force, inputs)
            outputs.append(("Plot", plot))
        document = json_text(found, progress) if as_json else None
    for kind, path in outputs:
        written(kind, path, as_json)
    if as_json:
        click.echo(document)
    else:
        from hubload.report.terminal.compare import render

        render(found.value, console())
    return found


def brief(file: str, out: str | None = None, force: bool = False,
          required_s0: float | None = None, method: str | None = None) -> api.BriefResult:
    from hubload.report.progress import LateProgress

    checked(out, force, (".md", ".markdown", ".html", ".htm") if out is not None else (),
            inputs=(file,))
    from hubload.report.terminal.tables import plain

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


def cases(file: str, to: str, force: bool = False):
    """Write the file's cases as a table that a [cases] table reads back."""
    from hubload.report.spreadsheet.cases import cases_sheet
    from hubload.report.spreadsheet.workbook import check_outputs, write_sheets

    check_outputs(to, ["cases"], force, (file,))
    found = api.cases(file)
    write_sheets(to, [cases_sheet(found)], force, found.inputs)
    written("Cases", to)
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


def forecast(file: str, as_json: bool = False, plot: str | None = None, force: bool = False,
             method: str | None = None, distribution: str | None = None,
             weibull_slope: float | None = None, **fleet_options) -> api.ForecastResult:
    checked(plot, force, PLOT_SUFFIXES, (file,))
    found = api.forecast(file, method=method, distribution=distribution,
                         weibull_slope=weibull_slope, **fleet_options)
    if plot is not None:
        from hubload.report.plots import save
        from hubload.report.plots.forecast import forecast_figure

        save(forecast_figure(found.value), plot, force, (file,))
        written("Plot", plot, as_json)
    if as_json:
        click.echo(document_text(found.to_dict()))
    else:
        from hubload.report.terminal.forecast import render_forecast

        render_forecast(found.value, console())
    return found


def field(data: str, against: str | None = None, as_json: bool = False,
          plot: str | None = None, force: bool = False, weibayes_slope: float | None = None,
          method: str | None = None) -> api.FieldResult:
    inputs = (data,) + ((against,) if against else ())
    checked(plot, force, PLOT_SUFFIXES, inputs)
    found = api.field(data, against=against, weibayes_slope=weibayes_slope, method=method,
                      band=plot is not None)
    if plot is not None:
        from hubload.report.plots import save
        from hubload.report.plots.field import field_figure

        save(field_figure(found.value), plot, force, inputs)
        written("Plot", plot, as_json)
    if as_json:
        click.echo(document_text(found.to_dict()))
    else:
        from hubload.report.terminal.field import render_field

        render_field(found.value, console())
    return found


def spectrum(**options):
    from hubload.commands.logs import Request, spectrum as run_spectrum

    return run_spectrum(Request(**options))
