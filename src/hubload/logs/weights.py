"""A fleet mix: the share of machines that work like each log (``spectrum FOLDER --weights``).

A CSV file with the columns ``log`` (the log's file name, with or without its suffix) and
``share`` (a fraction, a percentage or a number of machines: the shares are normalised). Every
log of the folder must appear once; errors name the file, row and column (counted from 1, the
header being row 1).
"""

from __future__ import annotations

import csv
import dataclasses
import math
from pathlib import Path


from hubload.errors import InputError
from hubload.logs.pipeline import LogSummary

COLUMNS = ("log", "share")
# A share is a fraction, a percentage or a count of machines: a million covers any fleet,
# and the shares' sum stays finite.
MAX_SHARE = 1e6


def read_weights(path: str | Path, logs: list[str]) -> dict[str, float]:
    """Normalised share of each log (keyed by the log's path as given in ``logs``)."""
    file = str(path)
    try:
        with open(path, newline="", encoding="utf-8") as handle:
            rows = list(csv.reader(handle))
    except FileNotFoundError:
        raise InputError("file not found", file=file) from None
    except (OSError, UnicodeDecodeError, csv.Error) as error:
        raise InputError(f"cannot read the fleet mix ({error})", file=file) from None
    if not rows or [cell.strip() for cell in rows[0]] != list(COLUMNS):
        raise InputError("expected a header row 'log,share'", file=file, key_path="row 1")
    names = {Path(log).name: log for log in logs} | {Path(log).stem: log for log in logs}
    shares: dict[str, float] = {}
    for number, row in enumerate(rows[1:], start=2):
        if len(row) != 2:
            raise InputError(f"expected 2 cells (log, share), got {len(row)}", file=file,
                             key_path=f"row {number}")
        name, text = (cell.strip() for cell in row)
        if name not in names:
            raise InputError(f"no log {name!r} in the folder", file=file,
                             key_path=f"row {number}, column 1")
        try:
            share = float(text)
        except ValueError:
            share = math.nan
        if not (math.isfinite(share) and 0 <= share <= MAX_SHARE):
            raise InputError(f"expected a share from 0 to {MAX_SHARE:g}, got {text!r}",
                             file=file, key_path=f"row {number}, column 2")
        if names[name] in shares:
            raise InputError(f"log {name!r} given twice", file=file, key_path=f"row {number}")
        shares[names[name]] = share
    missing = [Path(log).name for log in logs if log not in shares]
    if missing:
        raise InputError(f"no share for {', '.join(missing)}", file=file)
    total = sum(shares.values())
    if total <= 0:
        raise InputError("the shares add to zero", file=file)
    return {log: share / total for log, share in shares.items()}


def mixed(summaries: list[LogSummary], shares: dict[str, float]) -> list[LogSummary]:
    """Each log's summary scaled so that the logs enter a merge in the fleet's proportions.

    Every sum of a dwell table is extensive (time, revolutions, damage), so scaling a log's
    sums by s = share x (total hours / its hours) keeps its own spectrum and gives it the
    share of the fleet's time; the fleet's logged hours stay the same.
    """
    total_s = sum(s.total("time_s") for s in summaries)
    scaled = []
    for summary in summaries:
        factor = shares[summary.name] * total_s / summary.total("time_s")
        table = dataclasses.replace(summary.table, sums=summary.table.sums * factor)
        flags = {flag: seconds * factor for flag, seconds in summary.flag_time_s.items()}
        scaled.append(dataclasses.replace(summary, table=table, flag_time_s=flags))
    return scaled


def mix_note(shares: dict[str, float]) -> str:
    """The fleet mix in words, for the outputs."""
    return "weighted by fleet mix: " + ", ".join(
        f"{Path(log).name} {100 * share:.0f} %" for log, share in shares.items())


