"""One plain function per command: parsed options in, the API's result out, handed to report.

Each function checks its output files first (a refusal should not wait for the work),
runs the Python API (``hubload.api``), writes the files asked for and prints; it returns
the result, so a command works from a notebook too.
"""

from __future__ import annotations

import json

import click

from hubload import api
from hubload.errors import InputError

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


def check(file: str, as_json: bool = False, report: str | None = None,
          plot: str | None = None, force: bool = False, method: str | None = None,
          show_all: bool = False) -> api.CheckResult:
    checked(report, force, (".html", ".htm"), (file,))
    checked(plot, force, PLOT_SUFFIXES, (file,))
    found = api.check(file, method=method)
    if report is not None:
        from hubload.casefile.load import read_document
        from hubload.report.files import write_text
        from hubload.report.html.check import report_html

        write_text(report, report_html(found.value, read_document(file)), force,
                   inputs=(file,))
        written("Report", report, as_json)
    if plot is not None:
        from hubload.report.plots import save
        from hubload.report.plots.spectrum import damage_share_figure

        save(damage_share_figure(found.value), plot, force, (file,))
        written("Plot", plot, as_json)
    if as_json:
        click.echo(json.dumps(found.to_dict(), indent=2))
    else:
        from hubload.report.terminal.check import render_check

        render_check(found.value, console(), show_all=show_all)
    return found


def schema(machine: bool = False) -> None:
    from hubload.schema.export import json_schema

    if machine:
        from hubload.schema.machineformat import MACHINE_FORMAT

        click.echo(json.dumps(json_schema(MACHINE_FORMAT, "hubload machine file"), indent=2))
        return
    from hubload.schema import FORMAT

    click.echo(json.dumps(json_schema(FORMAT), indent=2))


def template() -> None:
    from hubload.schema import FORMAT
    from hubload.schema.export import template_text

    click.echo(template_text(FORMAT), nl=False)


def sweep(file: str, specs: tuple[str, ...], as_json: bool = False, plot: str | None = None,
          force: bool = False, method: str | None = None) -> api.SweepResult:
    from hubload.report.progress import LateProgress

    checked(plot, force, PLOT_SUFFIXES, (file,))
    if plot is not None and len(specs) not in (1, 2):
        raise InputError(f"--plot draws one or two --vary keys, got {len(specs)}", file=plot)
    if plot is not None and api.is_machine_file(file):
        raise InputError("--plot draws sweeps of load-case files; for a machine file use "
                         "--json, or sweep a wheel file of --write-wheel-files", file=plot)
    with LateProgress("sweep") as progress:
        found = api.sweep(file, specs, method=method, on_progress=progress)
    if isinstance(found, api.MachineSweepResult):
        if as_json:
            click.echo(json.dumps(found.to_dict(), indent=2))
        else:
            from hubload.report.terminal.machine_sweep import render as render_machine

            render_machine(found.value, console())
        return found
    if plot is not None:
        from hubload.report.plots import save
        from hubload.report.plots.sweep import sweep_contour_figure, sweep_line_figure

        draw = sweep_line_figure if len(found.axes) == 1 else sweep_contour_figure
        save(draw(found.value), plot, force, (file,))
        written("Plot", plot, as_json)
    if as_json:
        click.echo(json.dumps(found.to_dict(), indent=2))
    else:
        from hubload.report.terminal.sweep import render

        render(found.value, console())
    return found


def compare(files: tuple[str, ...], as_json: bool = False, plot: str | None = None,
            force: bool = False, method: str | None = None) -> api.ComparisonResult:
    checked(plot, force, PLOT_SUFFIXES, files)
    if plot is not None and any(api.is_machine_file(f) for f in files):
        raise InputError("--plot draws comparisons of load-case files; for machine files use "
                         "--json", file=plot)
    found = api.compare(list(files), method=method)
    if isinstance(found, api.MachineComparisonResult):
        if as_json:
            click.echo(json.dumps(found.to_dict(), indent=2))
        else:
            from hubload.report.terminal.machine_compare import render as render_machines

            render_machines(found.value, console())
        return found
    if plot is not None:
        from hubload.report.plots import save
        from hubload.report.plots.spectrum import compare_figure

        save(compare_figure(found.value), plot, force, files)
        written("Plot", plot, as_json)
    if as_json:
        click.echo(json.dumps(found.to_dict(), indent=2))
    else:
        from hubload.report.terminal.compare import render

        render(found.value, console())
    return found


def brief(file: str, out: str | None = None, force: bool = False,
          required_s0: float | None = None, method: str | None = None) -> api.BriefResult:
    checked(out, force, (".md", ".markdown", ".html", ".htm") if out is not None else (),
            inputs=(file,))
    from hubload.report.terminal.tables import plain

    found = api.brief(file, required_s0=required_s0, method=method)
    html = out is not None and out.lower().endswith((".html", ".htm"))
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
    checked(plot, force, PLOT_SUFFIXES, (file,))
    found = api.setting(file, start_um, stop_um, step_um)
    if plot is not None:
        from hubload.report.plots import save
        from hubload.report.plots.setting import setting_figure

        save(setting_figure(found.value), plot, force, (file,))
        written("Plot", plot, as_json)
    if as_json:
        click.echo(json.dumps(found.to_dict(), indent=2))
    else:
        from hubload.report.terminal.setting import render_setting

        render_setting(found.value, console())
    return found


def spectrum(**options):
    from hubload.commands.logs import Request, spectrum as run_spectrum

    return run_spectrum(Request(**options))
