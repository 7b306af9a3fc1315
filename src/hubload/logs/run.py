"""``hubload spectrum``: one log or a folder of logs -> lives, spectra, report."""

from __future__ import annotations

import json
from dataclasses import dataclass
from pathlib import Path

import click
from rich.console import Console
from rich.progress import Progress

from hubload.casefile.machine import load_machine
from hubload.domain.study import Study
from hubload.errors import InputError
from hubload.logs.columns import parse_column_options
from hubload.logs.fleet import Failure, find_logs, run_cluster, run_local
from hubload.logs.pipeline import LogOptions, merge_summaries, parse_classes
from hubload.logs.spectrum import SpectrumResult, classed_temperature_c, spectrum_result
from hubload.report.json import spectrum as logsjson
from hubload.report.terminal import spectrum as logsview
from hubload.report.files import checked_output, write_text
from hubload.report.spectrumfile import spectrum_text

COMBINED_NAME = "combined"


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


def spectrum(request: Request) -> None:
    study, machine = load_machine(request.case_file)
    if request.max_gap_s is not None and not request.max_gap_s > 0:
        raise InputError(f"expected a positive time, got {request.max_gap_s:g}",
                         key_path="--max-gap-s")
    options = LogOptions(mapping=parse_column_options(request.columns), gaps=request.gaps,
                         max_gap_s=request.max_gap_s, classes=parse_classes(request.classes))
    target = Path(request.log)
    if target.is_dir():
        paths = [str(p) for p in find_logs(target)]
        run_fleet(request, study, machine, options, paths, fleet_targets(request, paths))
    else:
        if request.out:  # before the log is read: a refusal should not wait for a long log
            checked_output(request.out, request.force)
        run_single(request, study, machine, options)


def run_single(request: Request, study: Study, machine: dict, options: LogOptions) -> None:
    found = run(request, [request.log], study, options)[0]
    if isinstance(found, Failure):
        raise InputError(found.message)
    result = spectrum_result(found, study)
    written = None
    if request.out:
        write_text(request.out, spectrum_text(machine, result.classed.study.cases,
                                              Path(request.log).name, study.title,
                                              classed_temperature_c(found)), request.force)
        written = request.out
    if request.as_json:
        click.echo(json.dumps(logsjson.single_document(result, request.gaps, written,
                                                       request.case_file), indent=2))
    else:
        logsview.render(result, Console(), written)


def run_fleet(request: Request, study: Study, machine: dict, options: LogOptions,
              paths: list[str], targets: dict[str, Path]) -> None:
    found = run(request, paths, study, options)
    failures = [f.message for f in found if isinstance(f, Failure)]
    if failures and not request.skip_bad:
        raise InputError(f"{len(failures)} of {len(paths)} logs could not be used "
                         "(--skip-bad leaves them out): " + "; ".join(failures))
    summaries = [s for s in found if not isinstance(s, Failure)]
    if not summaries:
        raise InputError("no usable log in the folder", file=request.log)
    results = [spectrum_result(s, study) for s in summaries]
    combined = spectrum_result(merge_summaries(COMBINED_NAME, summaries, options.classes), study)
    files = write_fleet_files(targets, machine, study, results, combined)
    ranking = logsjson.ranking(results, combined)
    if request.as_json:
        click.echo(json.dumps(logsjson.fleet_document(results, combined, request.gaps, files,
                                                      request.case_file, failures), indent=2))
    else:
        logsview.render_fleet(combined, ranking, Console(), files, failures)


def fleet_targets(request: Request, paths: list[str]) -> dict[str, Path]:
    """The spectrum file of each log (``<stem>.toml``) and ``combined.toml`` in the --out
    folder, checked before any log is read; empty without --out."""
    if not request.out:
        return {}
    folder = Path(request.out)
    if folder.exists() and not folder.is_dir():
        raise InputError("expected a folder for the spectra of a folder of logs",
                         file=str(folder), key_path="--out")
    targets = {path: folder / f"{Path(path).stem}.toml" for path in paths}
    targets[COMBINED_NAME] = folder / f"{COMBINED_NAME}.toml"
    if len(set(targets.values())) < len(targets):
        raise InputError("two logs would write the same spectrum file (same name stem, or a "
                         f"log named {COMBINED_NAME!r}); rename one", file=request.log)
    if folder.is_dir():
        for target in targets.values():
            checked_output(str(target), request.force)
    return targets


def write_fleet_files(targets: dict[str, Path], machine: dict, study: Study,
                      results: list[SpectrumResult], combined: SpectrumResult) -> dict:
    """The spectrum of each usable log and the combined one, in the --out folder."""
    if not targets:
        return {}
    folder = targets[COMBINED_NAME].parent
    try:
        folder.mkdir(parents=True, exist_ok=True)
    except OSError as error:
        raise InputError(f"cannot create the folder ({error.strerror})", file=str(folder),
                         key_path="--out") from None
    written = {}
    for result in [*results, combined]:
        name = result.summary.name
        log_name = Path(name).name if name != COMBINED_NAME else f"{len(results)} logs"
        written[name] = str(write_text(str(targets[name]), spectrum_text(
            machine, result.classed.study.cases, log_name, study.title,
            classed_temperature_c(result.summary)), True))
    return written


def run(request: Request, paths: list[str], study: Study, options: LogOptions) -> list:
    """Summaries (or failures) of ``paths``, with a progress bar on a terminal."""
    console = Console(stderr=True)
    with Progress(console=console, disable=not console.is_terminal or len(paths) == 1,
                  transient=True) as progress:
        task = progress.add_task("logs", total=len(paths))

        def advance(_path: str) -> None:
            progress.advance(task)

        if request.cluster:
            return run_cluster(request.cluster, paths, study, options, advance)
        return run_local(paths, study, options, request.jobs, advance)
