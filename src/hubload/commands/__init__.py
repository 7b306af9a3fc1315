"""One plain function per command: parsed options in, the API's result out, handed to report.

Each function checks its output files first (a refusal should not wait for the work),
runs the Python API (``hubload.api``), writes the files asked for and prints; it returns
the result, so a command works from a notebook too.
"""

from __future__ import annotations

import click

from hubload import api
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


def template(machine_file: bool = False) -> None:
    if machine_file:
        from hubload.schema.machine_template import machine_template_text

        click.echo(machine_template_text(), nl=False)
        return
    from hubload.schema import FORMAT
    from hubload.schema.export import template_text

    click.echo(template_text(FORMAT), nl=False)


def json_text(found, progress) -> str:
    """The --json document of a result, built under the bar (a large one takes seconds)."""
    progress.phase("writing JSON")
    return document_text(found.to_dict())


def cases(file: str, to: str, force: bool = False):
    """Write the file's cases as a table that a [cases] table reads back."""
    from hubload.report.spreadsheet.cases import cases_sheet
    from hubload.report.spreadsheet.workbook import check_outputs, write_sheets

    check_outputs(to, ["cases"], force, (file,))
    found = api.cases(file)
    write_sheets(to, [cases_sheet(found)], force, found.inputs)
    written("Cases", to)
    return found


def spectrum(**options):
    from hubload.commands.logs import Request, spectrum as run_spectrum

    return run_spectrum(Request(**options))
