"""``hubload spectrum``: one log or a folder of logs -> lives, spectra files, report."""

from __future__ import annotations

import dataclasses
from dataclasses import dataclass
from pathlib import Path

import click

from hubload import api
from hubload.commands import console
from hubload.errors import InputError
from hubload.report.json.text import document_text
from hubload.logs.analysis import COMBINED_NAME, LogRun, log_paths
from hubload.logs.spectrum import SpectrumResult, classed_temperature_c
from hubload.report.files import checked_output, write_text
from hubload.report.progress import LateProgress
from hubload.report.spectrumfile import spectrum_text


@dataclass(frozen=True)
class Request:
    """The options of one ``hubload spectrum`` run."""

    log: str
    case_file: str
    out: str | None = None
    force: bool = False
    as_json: bool = False
    columns: tuple[str, ...] = ()
    classes: tuple[str, ...] = ()
    gaps: str = "error"
    max_gap_s: float | None = None
    jobs: int | None = None
    cluster: str | None = None
    skip_bad: bool = False
    weights: str | None = None
    method: str | None = None
    table: str | None = None


def spectrum(request: Request) -> api.LogsResult:
    folder = Path(request.log).is_dir()
    paths = log_paths(request.log)
    inputs = (*paths, request.case_file)
    targets = fleet_targets(request, paths, inputs) if folder else {}
    if request.out and not folder:  # before the log is read: a refusal should not wait
        checked_output(request.out, request.force, (".toml",), inputs=inputs)
    if request.table:
        from hubload.commands import checked_table
        from hubload.report.spreadsheet.spectrum import FOLDER_SHEETS, LOG_SHEETS

        checked_table(request.table, FOLDER_SHEETS if folder else LOG_SHEETS, request.force,
                      inputs)
    description = f"reading {len(paths)} logs" if folder else "reading the log"
    with LateProgress(description) as progress:
        finished = iter(range(1, len(paths) + 1))
        found = api.spectrum(request.log, request.case_file, request.columns, request.classes,
                             request.gaps, request.max_gap_s, request.jobs, request.cluster,
                             request.skip_bad, weights=request.weights, method=request.method,
                             on_log_done=lambda _path: progress(next(finished), len(paths)),
                             on_progress=None if folder else progress)
    run = found.value
    files = write_fleet_files(targets, run, request.force, inputs) if folder \
        else write_single(request, run, inputs)
    found = dataclasses.replace(found, files=files)
    if request.table:
        from hubload.commands import write_table, written
        from hubload.report.spreadsheet.spectrum import spectrum_sheets

        for name in write_table(request.table, spectrum_sheets(run), request.force, inputs):
            written("Table", name, request.as_json)
    if request.as_json:
        click.echo(document_text(found.to_dict()))
    else:
        from hubload.report.terminal.spectrum import render, render_fleet

        if folder:
            render_fleet(run, console(), files)
        else:
            render(run.single, console(), files.get(run.single.summary.name))
    return found


def write_single(request: Request, run: LogRun, inputs: tuple[str, ...]) -> dict[str, str]:
    result = run.single
    if not request.out:
        return {}
    write_text(request.out, spectrum_of(run, result, Path(request.log).name), request.force,
               inputs=inputs)
    return {result.summary.name: request.out}


def spectrum_of(run: LogRun, result: SpectrumResult, log_name: str) -> str:
    return spectrum_text(run.machine, result.classed.study.cases, log_name, run.study.title,
                         classed_temperature_c(result.summary))


def fleet_targets(request: Request, paths: list[str],
                  inputs: tuple[str, ...]) -> dict[str, Path]:
    """The spectrum file of each log (``<stem>.toml``) and ``combined.toml`` in the --out
    folder, checked before any log is read; empty without --out."""
    if not request.out:
        return {}
    folder = Path(request.out)
    if (folder.exists() and not folder.is_dir()) or folder.suffix.lower() == ".toml":
        raise InputError("expected a folder for the spectra of a folder of logs (one "
                         f"load-case file per log and {COMBINED_NAME}.toml)",
                         file=str(folder), key_path="--out")
    targets = {path: folder / f"{Path(path).stem}.toml" for path in paths}
    targets[COMBINED_NAME] = folder / f"{COMBINED_NAME}.toml"
    if len(set(targets.values())) < len(targets):
        raise InputError("two logs would write the same spectrum file (same name stem, or a "
                         f"log named {COMBINED_NAME!r}); rename one", file=request.log)
    if folder.is_dir():
        for target in targets.values():
            checked_output(str(target), request.force, inputs=inputs)
    return targets


def write_fleet_files(targets: dict[str, Path], run: LogRun, force: bool,
                      inputs: tuple[str, ...]) -> dict[str, str]:
    """The spectrum of each usable log and the combined one, in the --out folder; each
    file checked again as it is written (a file that appeared meanwhile is kept)."""
    if not targets:
        return {}
    folder = targets[COMBINED_NAME].parent
    try:
        folder.mkdir(parents=True, exist_ok=True)
    except OSError as error:
        raise InputError(f"cannot create the folder ({error.strerror})", file=str(folder),
                         key_path="--out") from None
    written = {}
    for result in [*run.results, run.combined]:
        name = result.summary.name
        log_name = Path(name).name if name != COMBINED_NAME else f"{len(run.results)} logs"
        written[name] = str(write_text(str(targets[name]), spectrum_of(run, result, log_name),
                                       force, inputs=inputs))
    return written
