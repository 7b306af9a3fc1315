"""One plain function per command: parsed options in, the API's result out, handed to report.

Each function checks its output files first (a refusal should not wait for the work),
runs the Python API (``hubload.api``), writes the files asked for and prints; it returns
the result, so a command works from a notebook too.
"""

from __future__ import annotations

import os
import sys

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
    """A rich console, imported only when a command prints tables (--json does not); a
    reader that closes the pipe early (head, less) ends the run quietly with status 0."""
    from rich.console import Console

    class PipedConsole(Console):
        def on_broken_pipe(self) -> None:
            quiet_standard_output()
            raise SystemExit(0)

    return PipedConsole(stderr=stderr)


def quiet_standard_output() -> None:
    """Standard output to the null device, so that the interpreter's last flush into a
    closed pipe stays silent."""
    try:
        os.dup2(os.open(os.devnull, os.O_WRONLY), sys.stdout.fileno())
    except (OSError, ValueError):      # no file descriptor (an in-process runner)
        pass


def written(kind: str, path: str, as_json: bool = False) -> None:
    """Name every file written (on stderr with --json: stdout stays one JSON document)."""
    from hubload.report.usertext import plain

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
    """Refuse a --table output before the work; ``sheets``: the sheet names, or where they
    are ("module:NAME", imported only with a --table)."""
    if path is not None:
        from hubload.report.spreadsheet.workbook import check_outputs

        check_outputs(path, named(sheets) if isinstance(sheets, str) else sheets, force,
                      inputs)


def write_table(path: str, sheets, force: bool, inputs: tuple[str, ...]) -> list[str]:
    """Write the --table sheets; the files written, to be named once the work is done."""
    from hubload.report.spreadsheet.workbook import write_sheets

    return list(write_sheets(path, sheets, force, inputs))


class Outputs:
    """The files a command writes, each under the progress bar's phase of its own, named on
    the terminal once the bar is gone (``name_all``)."""

    def __init__(self, progress, force: bool, inputs: tuple[str, ...]):
        self.progress, self.force, self.inputs = progress, force, inputs
        self.files: list[tuple[str, str]] = []

    def table(self, path: str | None, sheets: str, *args) -> None:
        """Write the sheets ``sheets(*args)`` (named "module:function", imported only when
        asked for) to the --table ``path`` when one is given."""
        if path is not None:
            self.progress.phase("writing the tables")
            self.files += [("Table", name) for name in
                           write_table(path, named(sheets)(*args), self.force, self.inputs)]

    def plot(self, path: str | None, figure: str, *args) -> None:
        """Draw ``figure(*args)`` ("module:function") into the --plot ``path`` when given."""
        if path is not None:
            from hubload.report.plots import save

            self.progress.phase("drawing the plot")
            save(named(figure)(*args), path, self.force, self.inputs)
            self.files.append(("Plot", path))

    def name_all(self, as_json: bool) -> None:
        for kind, path in self.files:
            written(kind, path, as_json)


def named(reference: str):
    """The function "module:function", its module imported now (outputs load only when
    asked for: plots, sheets and tables cost start-up time)."""
    from importlib import import_module

    module, _, name = reference.partition(":")
    return getattr(import_module(module), name)


def printed(found, document: str | None, render: str, **options) -> None:
    """The --json document when one was built, else ``render(result, console, **options)``
    ("module:function")."""
    if document is not None:
        click.echo(document)
    else:
        named(render)(found.value, console(), **options)


def check(file: str, as_json: bool = False, report: str | None = None,
          plot: str | None = None, force: bool = False, method: str | None = None,
          show_all: bool = False, table: str | None = None) -> api.CheckResult:
    from hubload.report.progress import LateProgress

    inputs = inputs_of((file,), report, plot, table)
    checked(report, force, (".html", ".htm"), inputs)
    checked(plot, force, PLOT_SUFFIXES, inputs)
    checked_table(table, "hubload.report.spreadsheet.check:SHEETS", force, inputs)
    with LateProgress("reading the file") as progress:  # ends before anything is printed
        outputs = Outputs(progress, force, inputs)
        study = api.load(file, method)
        found = api.check(study, on_progress=progress.phase(computing(study)))
        outputs.table(table, "hubload.report.spreadsheet.check:check_sheets", found.value)
        if report is not None:
            write_report(found, file, report, force, inputs,
                         progress.phase("writing the report"))
            outputs.files.append(("Report", report))
        outputs.plot(plot, "hubload.report.plots.spectrum:damage_share_figure", found.value)
        document = json_text(found, progress) if as_json else None
    outputs.name_all(as_json)
    printed(found, document, "hubload.report.terminal.check:render_check", show_all=show_all)
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
