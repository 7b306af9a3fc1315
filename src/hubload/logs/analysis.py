"""One log or a folder of logs -> typed results: each log's lives and spectrum, the fleet's.

Computation only: no printing, no files. The command (``hubload.commands.spectrum``)
writes the spectra and hands the :class:`LogRun` to the report layer.
"""

from __future__ import annotations

import math

from collections.abc import Callable
from dataclasses import dataclass
from pathlib import Path

from hubload.casefile.geometry import with_method
from hubload.casefile.machine import load_machine
from hubload.domain.study import Study
from hubload.errors import InputError
from hubload.logs.columns import parse_column_options
from hubload.logs.fleet import Failure, find_logs, run_cluster, run_local, summarise
from hubload.logs.pipeline import LogOptions, merge_summaries, parse_classes
from hubload.logs.spectrum import SpectrumResult, spectrum_result
from hubload.logs.weights import mixed, read_weights

COMBINED_NAME = "combined"


@dataclass(frozen=True)
class Ranked:
    """A log's place in its fleet: its pair damage per hour on the governing basis."""

    result: SpectrumResult
    damage_per_hour: float
    relative_to_fleet: float | None


@dataclass(frozen=True)
class LogRun:
    """The results of one log, or of a folder: each usable log, the fleet, the failures."""

    case_file: str
    study: Study
    machine: dict                         # the case file's tables without its cases
    options: LogOptions
    results: tuple[SpectrumResult, ...]
    combined: SpectrumResult | None       # a folder: all logs back to back
    failures: tuple[Failure, ...]
    mix: dict[str, float] | None = None   # the fleet mix the combination used (None: by hours)

    @property
    def single(self) -> SpectrumResult | None:
        return self.results[0] if self.combined is None else None

    def ranking(self) -> list[Ranked]:
        """The logs from harshest to mildest (damage per hour of the governing life)."""
        fleet = damage_rate(self.combined)
        ranked = [Ranked(r, damage_rate(r), damage_rate(r) / fleet if fleet > 0 else None)
                  for r in self.results]
        return sorted(ranked, key=lambda row: -row.damage_per_hour)


def usable_shares(mix: dict[str, float], summaries) -> dict[str, float]:
    """The fleet mix of the logs that could be used (skipped logs leave it), normalised."""
    kept = {s.name: mix[s.name] for s in summaries}
    total = sum(kept.values())
    if total <= 0:
        raise InputError("the usable logs have no share in the fleet mix")
    return {name: share / total for name, share in kept.items()}


def damage_rate(result: SpectrumResult) -> float:
    """The pair's damage per hour on the governing basis (1 / life), 0 for an infinite life."""
    life = result.governing_life_h
    return 1.0 / life if 0 < life < float("inf") else 0.0


def log_options(columns=(), classes=(), gaps: str = "error",
                max_gap_s: float | None = None) -> LogOptions:
    """How to read and class a log, from the command's words (column maps, class counts)."""
    if max_gap_s is not None and not 0 < max_gap_s < math.inf:
        raise InputError(f"expected a positive, finite time [s], got {max_gap_s:g}",
                         key_path="--max-gap-s")
    return LogOptions(mapping=parse_column_options(tuple(columns)), gaps=gaps,
                      max_gap_s=max_gap_s, classes=parse_classes(tuple(classes)))


def log_paths(log: str | Path) -> list[str]:
    """The log itself, or the logs of a folder (sorted by name)."""
    target = Path(log)
    return [str(p) for p in find_logs(target)] if target.is_dir() else [str(target)]


def analyse(log: str | Path, case_file: str | Path, options: LogOptions,
            jobs: int | None = None, cluster: str | None = None, skip_bad: bool = False,
            on_log_done: Callable[[str], None] | None = None,
            weights: str | Path | None = None, method: str | None = None,
            on_rows=None) -> LogRun:
    """Read, clean, integrate and class every log; a folder's logs combined as a fleet, by
    their logged hours or, with ``weights`` (a CSV file), by the fleet mix it gives.
    ``method`` ("iso281", "refined") overrides the case file's for the classed spectrum; the
    samples themselves always go through the ISO 281 rule (logs.pipeline). ``on_rows(rows
    done, total or None)`` follows a single log's reading (hubload.progress)."""
    study, machine = load_machine(case_file)
    try:
        study = with_method(study, method)
    except InputError as error:
        raise error.located(str(case_file)) from None
    paths = log_paths(log)
    folder = Path(log).is_dir()
    if weights is not None and not folder:
        raise InputError("--weights mixes the logs of a folder; give a folder of logs, or "
                         "leave it out for one log", file=str(log), key_path="--weights")
    mix = read_weights(weights, paths) if folder and weights is not None else None
    done = on_log_done or (lambda _path: None)
    if cluster:
        found = run_cluster(cluster, paths, study, options, done)
    elif folder:
        found = run_local(paths, study, options, jobs, done)
    else:
        found = [summarise(paths[0], study, options, on_rows)]
        done(paths[0])
    failures = tuple(f for f in found if isinstance(f, Failure))
    if failures and (not folder or not skip_bad):
        if not folder:
            raise InputError(failures[0].message)
        raise InputError(f"{len(failures)} of {len(paths)} logs could not be used "
                         "(skipping the bad logs leaves them out): "
                         + "; ".join(f.message for f in failures))
    summaries = [s for s in found if not isinstance(s, Failure)]
    if not summaries:
        raise InputError("no usable log in the folder", file=str(log))
    results = tuple(spectrum_result(s, study) for s in summaries)
    shares = None if mix is None else usable_shares(mix, summaries)
    parts = summaries if shares is None else mixed(summaries, shares)
    combined = spectrum_result(merge_summaries(COMBINED_NAME, parts, options.classes),
                               study) if folder else None
    return LogRun(case_file=str(case_file), study=study, machine=machine, options=options,
                  results=results, combined=combined, failures=failures, mix=shares)
