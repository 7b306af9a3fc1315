"""Running the per-log function over many logs: in-process, process pool or Dask.

The same picklable function (:func:`summarise`) runs everywhere; scheduling is
left to ``concurrent.futures`` on one machine and to a Dask distributed
scheduler (``--cluster ADDRESS``) beyond it.
"""

from __future__ import annotations

import os
from collections.abc import Callable
from concurrent.futures import ProcessPoolExecutor, as_completed
from dataclasses import dataclass
from pathlib import Path

from hubload.domain.study import Study
from hubload.errors import InputError
from hubload.logs.pipeline import LogOptions, LogSummary, process_log
from hubload.logs.reader import LOG_SUFFIXES

Progress = Callable[[str], None]
CONNECT_TIMEOUT_S = 10


@dataclass(frozen=True)
class Failure:
    """A log that could not be used, with the one-line reason."""

    name: str
    message: str


def summarise(path: str, study: Study, options: LogOptions) -> LogSummary | Failure:
    """Process one log; bad input comes back as a value (it crosses process borders).

    Whatever else stops one log (memory, a bug) comes back as a Failure too, so that one
    broken log never stops a fleet that skips the bad ones."""
    try:
        return process_log(path, study, options)
    except InputError as error:
        return Failure(path, str(error.located(path)))
    except MemoryError:
        return Failure(path, f"{path}: not enough memory for this log")
    except Exception as error:  # noqa: BLE001 -- reported as this log's failure
        return Failure(path, f"{path}: internal error ({type(error).__name__}: {error})")


def find_logs(folder: Path) -> list[Path]:
    """The CSV and Parquet logs of a folder (not recursive), sorted by name."""
    logs = sorted(p for p in folder.iterdir() if p.is_file() and p.suffix.lower() in LOG_SUFFIXES)
    if not logs:
        raise InputError("no logs in the folder: expected files ending in "
                         + ", ".join(LOG_SUFFIXES), file=str(folder))
    return logs


def run_local(paths: list[str], study: Study, options: LogOptions, jobs: int | None,
              progress: Progress) -> list[LogSummary | Failure]:
    """All logs on this machine: one worker process per core unless ``jobs`` says otherwise."""
    workers = min(jobs or os.cpu_count() or 1, len(paths))
    if workers <= 1:
        results = []
        for path in paths:
            results.append(summarise(path, study, options))
            progress(path)
        return results
    found: dict[str, LogSummary | Failure] = {}
    with ProcessPoolExecutor(max_workers=workers) as pool:
        futures = {pool.submit(summarise, path, study, options): path for path in paths}
        for future in as_completed(futures):
            found[futures[future]] = outcome(future, futures[future])
            progress(futures[future])
    return [found[path] for path in paths]


def outcome(future, path: str) -> LogSummary | Failure:
    """The future's result; a worker that died (killed, out of memory) fails its log only."""
    try:
        return future.result()
    except Exception as error:  # noqa: BLE001 -- e.g. BrokenProcessPool
        return Failure(path, f"{path}: the worker process stopped ({type(error).__name__})")


def run_cluster(address: str, paths: list[str], study: Study, options: LogOptions,
                progress: Progress) -> list[LogSummary | Failure]:
    """All logs on a running Dask distributed scheduler at ``address``."""
    try:
        from distributed import Client
        from distributed import as_completed as completed
    except ImportError:
        raise InputError("--cluster needs the 'distributed' package (pip install distributed)",
                         key_path="--cluster") from None
    try:
        client = Client(address, timeout=f"{CONNECT_TIMEOUT_S}s")
    except (OSError, TimeoutError, ValueError) as error:
        raise InputError(f"cannot reach the Dask scheduler at {address!r} ({error})",
                         key_path="--cluster") from None
    with client:
        futures = client.map(summarise, paths, study=study, options=options, pure=False)
        names = {future.key: path for future, path in zip(futures, paths)}
        found = {}
        for future in completed(futures):
            found[names[future.key]] = outcome(future, names[future.key])
            progress(names[future.key])
    return [found[path] for path in paths]
