"""``hubload machine``: a machine file's wheel ends and the machine's life.

``--write-wheel-files DIR`` writes each wheel end as an ordinary load-case file (the
wheel end file with the machine's [project] and the derived [[case]] blocks, every
number as computed), so that ``hubload check`` and every other command give the
wheel end's lives unchanged. No file is written over an existing one without
``--force``, and every target is checked before the first is written.
"""

from __future__ import annotations

from pathlib import Path

import click

from hubload import api
from hubload.errors import InputError
from hubload.report.json.text import document_text

HEADER = ("# Wheel end '{wheel}', derived by hubload machine from\n"
          "#   machine file:   {machine}\n"
          "#   wheel end file: {wheel_end}\n"
          "# with the machine's [project] and one case per operation (two for an\n"
          "# operation spent half mirrored). Edit the machine file, not this one.\n\n")


def wheel_file_name(wheel: str) -> str:
    return wheel.replace(" ", "_") + ".toml"


def machine(file: str, as_json: bool = False, show_cases: bool = False,
            write_wheel_files: str | None = None, force: bool = False,
            report: str | None = None, show_all: bool = False,
            table: str | None = None) -> api.MachineResult:
    from hubload.commands import checked, checked_table, write_table, written
    from hubload.report.spreadsheet.machine import SHEETS

    checked(report, force, (".html", ".htm"), (file,))
    checked_table(table, SHEETS, force, (file,))
    found = api.machine(file)
    if table is not None:
        from hubload.report.spreadsheet.machine import machine_sheets

        for name in write_table(table, machine_sheets(found.value), force,
                                (file, *{w.wheel_end_file for w in found.value.study.wheel_ends})):
            written("Table", name, as_json)
    if report is not None:
        from hubload.casefile.load import read_document
        from hubload.report.files import write_text
        from hubload.report.html.machine import machine_html

        write_text(report, machine_html(found.value, read_document(file)), force,
                   inputs=(file, *{w.wheel_end_file for w in found.value.study.wheel_ends}))
        written("Report", report, as_json)
    if write_wheel_files is not None:
        write_files(found.value, file, Path(write_wheel_files), force, as_json)
    if as_json:
        click.echo(document_text(found.to_dict()))
    else:
        from hubload.commands import console
        from hubload.report.terminal.machine import render_machine

        render_machine(found.value, console(), show_cases=show_cases, show_all=show_all)
    return found


def write_files(result, file: str, folder: Path, force: bool, as_json: bool) -> None:
    import tomli_w

    from hubload.commands import written
    from hubload.report.files import checked_output, write_text
    from hubload.report.usertext import plain

    if folder.exists() and not folder.is_dir():
        raise InputError("is not a folder; expected the folder for the wheel end files",
                         file=str(folder))
    folder.mkdir(parents=True, exist_ok=True)
    wheels = result.study.wheel_ends
    inputs = (file, *sorted({wheel.wheel_end_file for wheel in wheels}))
    targets = [str(folder / wheel_file_name(wheel.name)) for wheel in wheels]
    for target in targets:
        checked_output(target, force, (".toml",), inputs)
    for wheel, target in zip(wheels, targets):
        header = HEADER.format(wheel=wheel.name, machine=plain(" ".join(file.splitlines())),
                               wheel_end=plain(" ".join(wheel.wheel_end_file.splitlines())))
        write_text(target, header + tomli_w.dumps(wheel.document), force, (".toml",), inputs)
        written("Wheel end file", target, as_json)
