"""Validation and repair of a log stream: NaN samples, time order, gaps.

Each sample holds until the next time stamp (zero-order hold), so a chunk's
last row waits for the next chunk before its hold time is known: the cleaner
carries it over. Policies for empty (NaN) samples and gaps:

- ``error``: stop at the first one, naming the file, row and column;
- ``drop``: drop rows with an empty sample (the previous sample holds on) and
  cut gaps down to the nominal sample interval (the gap time leaves the log);
- ``interpolate``: fill empty samples linearly in time and fill gaps with
  samples at the nominal interval, linear between the samples on either side.

Time stamps must increase strictly; repeated or backward stamps are errors
under every policy (no repair could know which sample is right).
"""

from __future__ import annotations

from collections.abc import Iterable, Iterator
from dataclasses import dataclass, field

import numpy as np

from hubload.errors import InputError
from hubload.logs.columns import CHANNELS, DISCRETE_CHANNELS, LIMITS, PLAUSIBLE
from hubload.logs.reader import RawChunk

GAP_FACTOR = 10.0
MAX_FILL_SAMPLES = 1000
# Samples made by filling gaps go out in batches of about this many (plus one gap's fill
# at most), so that memory stays bounded however many gaps a log has.
FILL_BATCH_SAMPLES = 1 << 16
HINT = "use --gaps drop or --gaps interpolate to repair"


@dataclass(frozen=True)
class Samples:
    """Clean samples: source row, start time [s], hold time [s], channels (file units)."""

    rows: np.ndarray
    time_s: np.ndarray
    hold_s: np.ndarray
    channels: dict[str, np.ndarray]

    def __len__(self) -> int:
        return self.time_s.size

    def take(self, index) -> "Samples":
        return Samples(self.rows[index], self.time_s[index], self.hold_s[index],
                       {key: values[index] for key, values in self.channels.items()})


def fill_batches(counts: np.ndarray) -> list[slice]:
    """Consecutive slices of the samples whose filled counts add to about
    FILL_BATCH_SAMPLES each (one sample's count at most beyond it)."""
    batch = np.cumsum(counts) // FILL_BATCH_SAMPLES
    starts = np.flatnonzero(np.diff(batch, prepend=-1))
    return [slice(int(a), int(b)) for a, b in zip(starts, [*starts[1:], counts.size])]


@dataclass
class CleaningReport:
    """What the cleaner found and did (counts are reported to the user)."""

    rows: int = 0
    used_rows: int = 0
    dropped_rows: int = 0
    filled_values: int = 0
    gaps: int = 0
    gap_time_s: float = 0.0
    filled_samples: int = 0
    nominal_interval_s: float | None = None
    max_gap_s: float | None = None
    notes: list[str] = field(default_factory=list)


@dataclass
class Block:
    rows: np.ndarray
    columns: dict[str, np.ndarray]

    def take(self, index) -> "Block":
        return Block(self.rows[index], {k: v[index] for k, v in self.columns.items()})

    @staticmethod
    def join(first: "Block | None", second: "Block") -> "Block":
        if first is None:
            return second
        return Block(np.concatenate([first.rows, second.rows]),
                     {k: np.concatenate([first.columns[k], v])
                      for k, v in second.columns.items()})


class Cleaner:
    """Turns raw chunks into clean :class:`Samples`, carrying rows across chunks."""

    def __init__(self, file: str, headers: dict[str, str], policy: str = "error",
                 max_gap_s: float | None = None):
        self.file, self.headers, self.policy = file, headers, policy
        self.report = CleaningReport(max_gap_s=max_gap_s)
        self.carry: Block | None = None
        self.started = False

    def run(self, chunks: Iterable[RawChunk]) -> Iterator[Samples]:
        for chunk in chunks:
            self.report.rows += len(chunk)
            rows = np.arange(chunk.first_row, chunk.first_row + len(chunk))
            yield from self.feed(Block(rows, dict(chunk.columns)))
        self.finish()

    def fail(self, message: str, row: int, key: str) -> InputError:
        return InputError(message, file=self.file,
                          key_path=f"row {row}, column {self.headers[key]!r}")

    def feed(self, block: Block) -> Iterable[Samples]:
        block = Block.join(self.carry, self.settle_implausible(block))
        self.observe_interval(block.columns["time_s"])
        block = self.settle_empty(block)
        self.check_order(block)
        self.check_limits(block)
        last = self.last_complete(block)
        if last is None or last < 1:
            self.carry = block
            return []
        self.carry = block.take(slice(last, None))
        return self.with_holds(block.take(slice(0, last + 1)))

    def settle_implausible(self, block: Block) -> Block:
        """A sample beyond the plausible magnitude of its channel is a bad cell: an error
        naming it, or (drop, interpolate) an empty cell that the policy repairs."""
        columns = dict(block.columns)
        for key, bound in PLAUSIBLE.items():
            if key not in columns:
                continue
            with np.errstate(invalid="ignore"):
                bad = np.abs(columns[key]) > bound
            if not bad.any():
                continue
            if self.policy == "error":
                index = int(np.argmax(bad))
                raise self.fail(f"implausible sample {columns[key][index]:g} (expected at "
                                f"most {bound:g} in magnitude: {CHANNELS[key]}); {HINT}",
                                int(block.rows[index]), key)
            columns[key] = np.where(bad, np.nan, columns[key])
        return Block(block.rows, columns)

    def settle_empty(self, block: Block) -> Block:
        """Apply the policy to empty samples; rows without a time stamp always go."""
        empty = np.stack([np.isnan(v) for v in block.columns.values()])
        if not empty.any():
            self.started = True
            return block
        channel, index = np.unravel_index(np.argmax(empty.T), empty.T.shape)[::-1]
        if self.policy == "error":
            key = list(block.columns)[channel]
            raise self.fail(f"empty, NaN or infinite sample; {HINT}", int(block.rows[index]),
                            key)
        keep = ~np.isnan(block.columns["time_s"])
        if self.policy == "drop":
            keep &= ~empty.any(axis=0)
        elif not self.started:
            # nothing before the first complete row to interpolate from
            complete = np.flatnonzero(~empty.any(axis=0))
            if complete.size:
                keep[:complete[0]] = False
            else:
                keep[:] = False
        self.started = self.started or bool(keep.any() and not empty[:, keep][:, 0].any())
        self.report.dropped_rows += int(np.count_nonzero(~keep))
        return block.take(keep)

    def last_complete(self, block: Block) -> int | None:
        if self.policy != "interpolate":
            # settle_empty left no empty sample (it stopped at one, or dropped its row)
            return len(block.rows) - 1 if len(block.rows) else None
        complete = ~np.any([np.isnan(v) for v in block.columns.values()], axis=0)
        found = np.flatnonzero(complete)
        return int(found[-1]) if found.size else None

    def check_order(self, block: Block) -> None:
        steps = np.diff(block.columns["time_s"])
        bad = np.flatnonzero(~(steps > 0))
        if bad.size:
            index = int(bad[0])
            before, after = block.columns["time_s"][index:index + 2]
            word = "repeats" if after == before else "goes back from"
            raise self.fail(f"time stamp {after:g} s {word} {before:g} s of row "
                            f"{int(block.rows[index])}: time stamps must increase",
                            int(block.rows[index + 1]), "time_s")

    def check_limits(self, block: Block) -> None:
        for key, (low, high) in LIMITS.items():
            if key in block.columns:
                values = block.columns[key]
                outside = np.flatnonzero((values < low) | (high is not None and values > high))
                if outside.size:
                    limits = f">= {low:g}" if high is None else f"from {low:g} to {high:g}"
                    raise self.fail(f"expected a value {limits} ({CHANNELS[key]}), got "
                                    f"{values[outside[0]]:g}; check the channel's units and "
                                    "sign convention", int(block.rows[outside[0]]), key)

    def with_holds(self, block: Block) -> Iterable[Samples]:
        """Samples of all rows but the last, holding until the next row's stamp (in
        batches of bounded size where gaps are filled)."""
        if self.policy == "interpolate":
            block = self.interpolate_empty(block)
        time_s = block.columns["time_s"]
        hold_s = np.diff(time_s)
        head = block.take(slice(0, -1))
        channels = {k: v for k, v in head.columns.items() if k != "time_s"}
        nominal, max_gap = self.gap_limits()
        gaps = np.flatnonzero(hold_s > max_gap)
        samples = Samples(head.rows, time_s[:-1], hold_s, channels)
        self.report.used_rows += head.rows.size
        return self.repair_gaps(samples, block, gaps, nominal, max_gap) if gaps.size \
            else [samples]

    def interpolate_empty(self, block: Block) -> Block:
        time_s = block.columns["time_s"]
        columns = {}
        for key, values in block.columns.items():
            empty = np.isnan(values)
            if empty.any():
                valid = ~empty
                if key in DISCRETE_CHANNELS:
                    previous = np.maximum.accumulate(np.where(valid, np.arange(values.size), 0))
                    values = values[previous]
                else:
                    values = values.copy()
                    values[empty] = np.interp(time_s[empty], time_s[valid], values[valid])
                self.report.filled_values += int(np.count_nonzero(empty))
            columns[key] = values
        return Block(block.rows, columns)

    def observe_interval(self, time_s: np.ndarray) -> None:
        """The nominal sample interval: median step of the first stamps (before repairs)."""
        if self.report.nominal_interval_s is not None:
            return
        steps = np.diff(time_s[~np.isnan(time_s)])
        if np.any(steps > 0):
            self.report.nominal_interval_s = float(np.median(steps[steps > 0]))

    def gap_limits(self) -> tuple[float, float]:
        nominal = self.report.nominal_interval_s
        if self.report.max_gap_s is None:
            self.report.max_gap_s = GAP_FACTOR * nominal
        return nominal, self.report.max_gap_s

    def repair_gaps(self, samples: Samples, block: Block, gaps: np.ndarray,
                    nominal: float, max_gap: float) -> Iterable[Samples]:
        if self.policy == "error":
            index = int(gaps[0])
            raise self.fail(
                f"gap of {samples.hold_s[index]:g} s to the next row (longer than "
                f"{max_gap:g} s, {GAP_FACTOR:g} x the median interval of {nominal:g} s unless "
                f"--max-gap-s is given); {HINT}", int(block.rows[index]), "time_s")
        self.report.gaps += gaps.size
        if self.policy == "drop":
            hold_s = samples.hold_s.copy()
            self.report.gap_time_s += float(np.sum(hold_s[gaps] - nominal))
            hold_s[gaps] = nominal
            return [Samples(samples.rows, samples.time_s, hold_s, samples.channels)]
        counts = np.ones(len(samples), dtype=np.int64)
        counts[gaps] = np.minimum(np.ceil(samples.hold_s[gaps] / nominal), MAX_FILL_SAMPLES)
        following = {key: values[1:] for key, values in block.columns.items()}
        # lazily, one batch at a time: the caller evaluates each before the next is made
        return (self.fill_gaps(samples.take(part), {k: v[part] for k, v in following.items()},
                               counts[part]) for part in fill_batches(counts))

    def fill_gaps(self, samples: Samples, following: dict[str, np.ndarray],
                  counts: np.ndarray) -> Samples:
        """Replace each sample by ``counts`` samples over its hold time, linear towards
        the following row (about the nominal interval in a gap, one sample elsewhere)."""
        source = np.repeat(np.arange(len(samples)), counts)
        step = np.arange(source.size) - np.repeat(np.cumsum(counts) - counts, counts)
        fraction = step / counts[source]
        hold_s = samples.hold_s[source] / counts[source]
        channels = {}
        for key, values in samples.channels.items():
            if key in DISCRETE_CHANNELS:
                channels[key] = values[source]
            else:
                after = following[key]
                channels[key] = values[source] + fraction * (after[source] - values[source])
        self.report.filled_samples += int(source.size - len(samples))
        time_s = samples.time_s[source] + fraction * samples.hold_s[source]
        return Samples(samples.rows[source], time_s, hold_s, channels)

    def finish(self) -> None:
        if self.carry is not None:
            tail = len(self.carry.rows) - 1
            last = self.last_complete(self.carry)
            if last is not None and last < tail:
                self.report.dropped_rows += tail - last
                self.report.notes.append(
                    f"{tail - last} empty row(s) at the end of the log could not be "
                    "interpolated and were dropped")
        if self.report.used_rows == 0:
            raise InputError("no duration: the log needs at least two rows with valid time "
                             "stamps and samples", file=self.file)
