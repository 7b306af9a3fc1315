"""Plain functions behind each CLI command: read inputs, run the engine, report."""

from __future__ import annotations

import json
import math

import click
from rich.console import Console

from hubload.casefile import load_study
from hubload.engine import STATIC_SAFETY_WARNING, evaluate
from hubload.errors import InputError
from hubload.report import jsonout, terminal
from hubload.schema import FORMAT
from hubload.schema.export import json_schema, template_text


def load_for_method(file: str, method: str | None):
    """The study of ``file``, computed by ``method`` when given (else the file's own)."""
    from hubload.casefile.geometry import with_method

    study = load_study(file)
    try:
        return with_method(study, method)
    except InputError as error:
        raise error.located(file) from None


def check(file: str, as_json: bool = False, report: str | None = None,
          plot: str | None = None, force: bool = False, method: str | None = None) -> None:
    from hubload.report import files

    for path, suffixes in ((report, (".html", ".htm")), (plot, (".png", ".svg"))):
        if path is not None:
            files.checked_output(path, force, suffixes)
    result = evaluate(load_for_method(file, method))
    write_check_files(file, result, report, plot, force)
    if as_json:
        click.echo(jsonout.to_json(result))
    else:
        terminal.render(result, Console())


def write_check_files(file: str, result, report: str | None, plot: str | None,
                      force: bool) -> None:
    if report is not None:
        from hubload.casefile.load import read_document
        from hubload.report.files import write_text
        from hubload.report.html import report_html

        write_text(report, report_html(result, read_document(file)), force)
    if plot is not None:
        from hubload.report.jsonout import result_document
        from hubload.report.plots import save
        from hubload.report.plots.spectrum import damage_share_figure

        save(damage_share_figure(result_document(result)), plot, force)


def schema() -> None:
    click.echo(json.dumps(json_schema(FORMAT), indent=2))


def template() -> None:
    click.echo(template_text(FORMAT), nl=False)


def sweep(file: str, specs: tuple[str, ...], as_json: bool = False, plot: str | None = None,
          force: bool = False, method: str | None = None) -> None:
    from hubload.report import sweep_out
    from hubload.report.files import checked_output
    from hubload.report.progress import LateProgress
    from hubload.studies.sweep import run_sweep

    if plot is not None:
        checked_output(plot, force, (".png", ".svg"))
        if len(specs) not in (1, 2):
            raise InputError(f"--plot draws one or two --vary keys, got {len(specs)}",
                             file=plot)
    with LateProgress("sweep") as progress:
        found = run_sweep(file, specs, on_progress=progress, method=method)
    emit(found, sweep_out, as_json, plot, force, draw=sweep_figure)


def sweep_figure(found):
    from hubload.report.plots.sweep import sweep_contour_figure, sweep_line_figure

    return (sweep_line_figure if len(found.axes) == 1 else sweep_contour_figure)(found)


def compare(files: tuple[str, ...], as_json: bool = False, plot: str | None = None,
            force: bool = False, method: str | None = None) -> None:
    from hubload.report import compare_out
    from hubload.report.files import checked_output
    from hubload.studies.compare import run_compare

    if plot is not None:
        checked_output(plot, force, (".png", ".svg"))
    found = run_compare([load_for_method(file, method) for file in files])
    emit(found, compare_out, as_json, plot, force, draw=compare_figure)


def compare_figure(found):
    from hubload.report.plots.spectrum import compare_figure as figure

    return figure(found)


def brief(file: str, out: str | None = None, force: bool = False,
          required_s0: float | None = None, method: str | None = None) -> None:
    from hubload.casefile.load import read_document
    from hubload.report.brief_md import brief_markdown
    from hubload.report.files import checked_output, write_text
    from hubload.studies.requirements import requirements_of

    required_s0 = STATIC_SAFETY_WARNING if required_s0 is None else required_s0
    if not (required_s0 > 0 and math.isfinite(required_s0)):
        raise InputError(f"--s0 expects a positive number, got {required_s0:g}")
    if out is not None:
        checked_output(out, force)
    text = brief_markdown(requirements_of(load_for_method(file, method), required_s0),
                          read_document(file))
    if out is None:
        click.echo(text, nl=False)
    else:
        write_text(out, text, force)
        click.echo(f"Brief written to {out}")


def spectrum(**options) -> None:
    from hubload.logs.run import Request, spectrum as run_spectrum
    run_spectrum(Request(**options))


def setting(file: str, start_um: float, stop_um: float, step_um: float, as_json: bool = False,
            plot: str | None = None, force: bool = False) -> None:
    from hubload.report import setting_out
    from hubload.report.files import checked_output
    from hubload.studies.setting import run_setting_sweep, setting_values_um

    if plot is not None:
        checked_output(plot, force, (".png", ".svg"))
    settings_um = setting_values_um(start_um, stop_um, step_um)
    found = run_setting_sweep(load_for_method(file, "refined"), settings_um)
    emit(found, setting_out, as_json, plot, force, draw=setting_figure)


def setting_figure(found):
    from hubload.report.plots.setting import setting_figure as figure

    return figure(found)


def emit(found, output, as_json: bool, plot: str | None, force: bool, draw) -> None:
    """Print a study's results as JSON or tables (``output``: its report module); write its
    chart first when asked, ``draw`` building the figure (plotting is imported only then)."""
    if plot is not None:
        from hubload.report.plots import save

        save(draw(found), plot, force)
    if as_json:
        click.echo(output.to_json(found))
    else:
        output.render(found, Console())
        if plot is not None:
            Console().print(f"Plot written to {plot}")
