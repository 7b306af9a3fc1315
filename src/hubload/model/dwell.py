"""Time-at-level (dwell-time) classing of sampled channels on nested grids.

A sampled signal is classed by the time it dwells in each level; for several
channels at once the classes are the cells of a grid and each cell gathers sums
of per-sample weights (hold time, revolutions, load x revolutions, damage...).

Class widths are powers of two, anchored at zero. The grids of any two data sets
therefore nest: a class of the coarser grid is a union of classes of the finer
one, so cell tables combine exactly, and a stream can be classed in one pass,
coarsening (merging neighbour classes pairwise) whenever its range outgrows the
class count. The result is the same as classing the whole data set at once.

Arrays follow the model convention: the cell (or sample) axis is the last one.

References
----------
[1] H. Koehler, S. Jenne, K. Poetter, H. Zenner, Load Assumption for Fatigue
    Design of Structures and Components, Springer 2017, ch. 2 (classification
    of load-time histories; time-at-level counting) -- from memory.
[2] A. Palmgren, Die Lebensdauer von Kugellagern, VDI-Z 68 (1924); M. A. Miner,
    Cumulative damage in fatigue, J. Appl. Mech. 12 (1945): damage adds linearly,
    so per-sample damage may be summed per class in any order.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

MIN_CLASSES = 2


@dataclass(frozen=True)
class DwellTable:
    """Occupied cells of a class grid with the summed weights of their samples.

    ``exponents`` (c,): class width 2**e of each channel; ``keys`` (c, m): class
    index floor(value / 2**e) of each occupied cell; ``sums`` (k, m): summed
    weights; ``low``/``high`` (c,): observed range of each channel (nan before
    any sample).
    """

    exponents: np.ndarray
    keys: np.ndarray
    sums: np.ndarray
    low: np.ndarray
    high: np.ndarray

    @property
    def widths(self) -> np.ndarray:
        return np.ldexp(1.0, self.exponents)

    def class_bounds(self) -> tuple[np.ndarray, np.ndarray]:
        """Lower and upper bound (c, m) of every occupied cell."""
        widths = self.widths[:, None]
        return self.keys * widths, (self.keys + 1) * widths


def empty_table(channels: int, weights: int, min_exponents) -> DwellTable:
    """A table with no samples yet, at the finest allowed widths."""
    return DwellTable(
        exponents=np.broadcast_to(np.asarray(min_exponents, dtype=np.int64),
                                  (channels,)).copy(),
        keys=np.zeros((channels, 0), dtype=np.int64),
        sums=np.zeros((weights, 0)),
        low=np.full(channels, np.nan), high=np.full(channels, np.nan))


def width_exponents(span, classes, min_exponents) -> np.ndarray:
    """Smallest exponent e >= min with span / 2**e <= classes - 1.

    A zero-anchored grid of that width covers the span with at most
    ``classes`` classes, whatever the span's offset [1].
    """
    span = np.nan_to_num(np.asarray(span, dtype=float), nan=0.0)
    steps = np.asarray(classes, dtype=float) - 1.0
    with np.errstate(divide="ignore"):
        needed = np.ceil(np.log2(np.where(span > 0, span / steps, 1.0)))
    exponents = np.where(span > 0, needed, min_exponents).astype(np.int64)
    # log2 may round the wrong way at exact powers of two: step once if needed
    exponents = np.where(np.ldexp(steps, exponents) < span, exponents + 1, exponents)
    return np.maximum(exponents, min_exponents)


def covering_exponents(low, high, classes, min_exponents) -> np.ndarray:
    """Width exponents whose zero-anchored grid holds ``low``..``high`` in <= ``classes`` classes.

    width_exponents sees the span high - low, which rounds: a tiny value just below zero
    beside one on a class bound can need one class more than the rounded span shows, and
    one coarser step then suffices.
    """
    exponents = width_exponents(high - low, classes, min_exponents)
    ends = class_keys(np.nan_to_num(np.stack([low, high], axis=-1)), exponents)
    return np.where(ends[:, 1] - ends[:, 0] >= classes, exponents + 1, exponents)


def class_keys(values, exponents) -> np.ndarray:
    """Class index floor(value / 2**e) per channel (values (c, n)) [1]."""
    values = np.asarray(values, dtype=float)
    keys = np.floor(np.ldexp(values, -np.asarray(exponents, dtype=np.int64)[:, None]))
    # a tiny negative value may underflow to -0.0; it still belongs below zero
    return np.where((keys == 0) & (values < 0), -1, keys).astype(np.int64)


def aggregate(keys: np.ndarray, weights: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Unique cells of ``keys`` (c, n) and the sums (k, m) of ``weights`` (k, n) in each."""
    if keys.shape[-1] == 0:
        return keys, np.zeros((weights.shape[0], 0))
    origin = keys.min(axis=1, keepdims=True)
    shape = tuple(int(span) for span in keys.max(axis=1) - origin[:, 0] + 1)
    flat = np.ravel_multi_index(tuple(keys - origin), shape)
    size = math.prod(shape)
    if size <= 4 * flat.size:
        occupied = np.flatnonzero(np.bincount(flat, minlength=size))
        sums = bin_sums(flat, weights, size)[:, occupied]
    else:
        occupied, inverse = np.unique(flat, return_inverse=True)
        sums = bin_sums(inverse, weights, occupied.size)
    cell_keys = np.stack(np.unravel_index(occupied, shape)) + origin
    return cell_keys.astype(np.int64), sums


def bin_sums(bins: np.ndarray, weights: np.ndarray, size: int) -> np.ndarray:
    """Sums (k, size) of each row of ``weights`` (k, n) over the samples in each bin."""
    sums = np.zeros((len(weights), size))
    for row, weight in enumerate(weights):
        sums[row] = np.bincount(bins, weights=weight, minlength=size)
    return sums


def coarsened(table: DwellTable, exponents) -> DwellTable:
    """The same samples on a coarser grid (exponents >= the table's): classes merge pairwise."""
    exponents = np.asarray(exponents, dtype=np.int64)
    shift = exponents - table.exponents
    if np.any(shift < 0):
        raise ValueError("a dwell table can only be coarsened")
    if not np.any(shift):
        return table
    keys, sums = aggregate(table.keys >> shift[:, None], table.sums)
    return DwellTable(exponents, keys, sums, table.low, table.high)


def add_samples(table: DwellTable, values, weights, classes, min_exponents) -> DwellTable:
    """Class samples ``values`` (c, n) with per-sample ``weights`` (k, n) into ``table``.

    The grid coarsens so that each channel keeps at most ``classes`` classes over
    the range seen so far; the result equals classing all samples at once [1, 2].
    """
    values = np.asarray(values, dtype=float)
    if values.shape[-1] == 0:
        return table
    low = np.fmin(table.low, values.min(axis=1))
    high = np.fmax(table.high, values.max(axis=1))
    exponents = np.maximum(table.exponents, covering_exponents(low, high, classes, min_exponents))
    base = coarsened(table, exponents)
    keys, all_weights = class_keys(values, exponents), np.asarray(weights, dtype=float)
    if base.keys.shape[-1]:     # a table with samples already (else no copy)
        keys = np.concatenate([base.keys, keys], axis=1)
        all_weights = np.concatenate([base.sums, all_weights], axis=1)
    cell_keys, sums = aggregate(keys, all_weights)
    return DwellTable(exponents, cell_keys, sums, low, high)


def merged(tables: list[DwellTable], classes, min_exponents) -> DwellTable:
    """One table holding the samples of all ``tables`` (exact: the grids nest) [1]."""
    low = np.fmin.reduce([t.low for t in tables])
    high = np.fmax.reduce([t.high for t in tables])
    exponents = np.maximum.reduce(
        [t.exponents for t in tables] + [covering_exponents(low, high, classes, min_exponents)])
    parts = [coarsened(t, exponents) for t in tables]
    keys, sums = aggregate(np.concatenate([p.keys for p in parts], axis=1),
                           np.concatenate([p.sums for p in parts], axis=1))
    return DwellTable(exponents, keys, sums, low, high)


def marginal(table: DwellTable, channel: int) -> tuple[np.ndarray, np.ndarray]:
    """Class indices of one channel and the sums (k, m) of all cells in each class."""
    keys, sums = aggregate(table.keys[channel:channel + 1], table.sums)
    return keys[0], sums


def weighted_means(weighted_sums, weight_sum, fallback_sums=None, fallback_weight=None):
    """Weighted means sum(w x) / sum(w) per cell; where sum(w) = 0 use the fallback weights.

    Revolution-weighted class levels (common practice for the mean load of a
    rolling bearing at variable speed) are undefined for cells at standstill;
    their time-weighted level is used instead.
    """
    weight_sum = np.asarray(weight_sum, dtype=float)
    positive = weight_sum > 0
    means = np.asarray(weighted_sums) / np.where(positive, weight_sum, 1.0)
    if fallback_sums is None:
        return np.where(positive, means, 0.0)
    fallback_weight = np.asarray(fallback_weight, dtype=float)
    fallback = np.asarray(fallback_sums) / np.where(fallback_weight > 0, fallback_weight, 1.0)
    return np.where(positive, means, fallback)
