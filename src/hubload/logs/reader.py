"""Chunked reading of CSV and Parquet logs with pyarrow (bounded memory).

CSV goes through pyarrow's streaming reader (``pyarrow.csv.open_csv``), Parquet
through ``ParquetFile.iter_batches``; only the planned columns are read and each
chunk comes out as float64 numpy arrays (NaN for empty cells).
"""

from __future__ import annotations

import csv
import re
from collections.abc import Iterator
from dataclasses import dataclass
from pathlib import Path

import numpy as np
import pyarrow as pa
import pyarrow.compute as pc
import pyarrow.csv as pacsv
import pyarrow.parquet as pq

from hubload.errors import InputError
from hubload.logs.columns import DISCRETE_CHANNELS

CSV_BLOCK_BYTES = 4 << 20
PARQUET_BATCH_ROWS = 65_536
CSV_SUFFIXES = (".csv", ".txt", ".tsv")
PARQUET_SUFFIXES = (".parquet", ".pq")
LOG_SUFFIXES = CSV_SUFFIXES + PARQUET_SUFFIXES
DELIMITERS = (",", ";", "\t")
NUMBER = re.compile(r"^\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*$|^\s*(nan|NaN|NAN)?\s*$")
DISCRETE_LEVELS = {"mode": ("full", "half")}


@dataclass(frozen=True)
class RawChunk:
    """Consecutive data rows: ``first_row`` is the 1-based row number of the first."""

    first_row: int
    columns: dict[str, np.ndarray]

    def __len__(self) -> int:
        return len(next(iter(self.columns.values())))


def log_kind(path: Path) -> str:
    suffix = path.suffix.lower()
    if suffix in CSV_SUFFIXES:
        return "csv"
    if suffix in PARQUET_SUFFIXES:
        return "parquet"
    raise InputError(f"unknown log type {suffix!r}: expected a CSV ({', '.join(CSV_SUFFIXES)}) "
                     f"or Parquet ({', '.join(PARQUET_SUFFIXES)}) file", file=str(path))


def headers(path: Path) -> list[str]:
    """Column names of the log (the header row of a CSV file, the schema of Parquet)."""
    if not path.is_file():
        raise InputError("log file not found", file=str(path))
    if log_kind(path) == "parquet":
        try:
            return list(pq.ParquetFile(path).schema_arrow.names)
        except (pa.ArrowException, OSError) as error:
            raise InputError(f"cannot read the Parquet file ({error})", file=str(path)) from None
    return list(next(csv.reader([header_line(path)], delimiter=delimiter(path)), []))


def row_count(path: Path) -> int | None:
    """The rows of a Parquet log (from its metadata); None for CSV, known only once read."""
    if log_kind(path) != "parquet":
        return None
    try:
        return pq.ParquetFile(path).metadata.num_rows
    except (pa.ArrowException, OSError):
        return None     # read_chunks names the error


def counted(chunks: Iterator[RawChunk], total: int | None, on_progress) -> Iterator[RawChunk]:
    """``chunks`` as they come, calling ``on_progress(rows done, total)`` once each chunk
    has been used (hubload.progress)."""
    done = 0
    for chunk in chunks:
        yield chunk
        done += len(chunk)
        on_progress(done, total)


def header_line(path: Path) -> str:
    try:
        with path.open(encoding="utf-8-sig", newline="") as stream:
            return stream.readline().rstrip("\r\n")
    except (OSError, UnicodeDecodeError) as error:
        raise InputError(f"cannot read the file ({error})", file=str(path)) from None


def delimiter(path: Path) -> str:
    line = header_line(path)
    return max(DELIMITERS, key=line.count)


def read_chunks(path: Path, columns: dict[str, str]) -> Iterator[RawChunk]:
    """Chunks of the channels ``columns`` ({channel: header}) in file order."""
    reader = read_parquet if log_kind(path) == "parquet" else read_csv
    yield from reader(path, columns)


def read_csv(path: Path, columns: dict[str, str]) -> Iterator[RawChunk]:
    types = {header: (pa.string() if key in DISCRETE_CHANNELS else pa.float64())
             for key, header in columns.items()}
    options = dict(
        read_options=pacsv.ReadOptions(block_size=CSV_BLOCK_BYTES, encoding="utf8"),
        parse_options=pacsv.ParseOptions(delimiter=delimiter(path)),
        convert_options=pacsv.ConvertOptions(include_columns=list(types), column_types=types))
    row = 1
    try:
        for batch in pacsv.open_csv(path, **options):
            chunk = to_chunk(batch, columns, row, path)
            row += len(chunk)
            yield chunk
    except pa.ArrowInvalid as error:
        raise locate_csv_error(path, columns, error) from None


def read_parquet(path: Path, columns: dict[str, str]) -> Iterator[RawChunk]:
    row = 1
    try:
        source = pq.ParquetFile(path)
        for batch in source.iter_batches(batch_size=PARQUET_BATCH_ROWS,
                                         columns=list(dict.fromkeys(columns.values()))):
            chunk = to_chunk(batch, columns, row, path)
            row += len(chunk)
            yield chunk
    except (pa.ArrowInvalid, OSError) as error:
        raise InputError(f"cannot read the Parquet file ({error})", file=str(path)) from None


def to_chunk(batch: pa.RecordBatch, columns: dict[str, str], first_row: int,
             path: Path) -> RawChunk:
    arrays = {}
    for key, header in columns.items():
        column = batch.column(batch.schema.get_field_index(header))
        if key in DISCRETE_CHANNELS:
            arrays[key] = discrete_codes(column, key, header, first_row, path)
        else:
            arrays[key] = numeric(column, key, header, path)
    return RawChunk(first_row, arrays)


def numeric(column: pa.Array, key: str, header: str, path: Path) -> np.ndarray:
    if pa.types.is_timestamp(column.type) and key == "time_s":
        nanoseconds = pc.cast(column, pa.timestamp("ns")).cast(pa.int64())
        return nanoseconds.to_numpy(zero_copy_only=False).astype(float) * 1e-9
    if not (pa.types.is_integer(column.type) or pa.types.is_floating(column.type)):
        raise InputError(f"expected numbers, got {column.type} values", file=str(path),
                         key_path=f"column {header!r}")
    # an integer beyond 2^53 has no exact float: unsafe casting rounds it (it is absurd as a
    # sample anyway, and the plausibility limits then judge it)
    values = pc.cast(column, pa.float64(), safe=False).to_numpy(zero_copy_only=False)
    # an infinite sample is as unusable as an empty one: the cleaner's policy applies
    return np.where(np.isinf(values), np.nan, values)


def discrete_codes(column: pa.Array, key: str, header: str, first_row: int,
                   path: Path) -> np.ndarray:
    """Index of each value in the channel's levels; NaN for empty cells."""
    levels = DISCRETE_LEVELS[key]
    text = pc.utf8_trim_whitespace(pc.cast(column, pa.string()))
    codes = pc.index_in(text, value_set=pa.array(levels)).to_numpy(zero_copy_only=False)
    codes = np.asarray(codes, dtype=float)
    unknown = np.flatnonzero(np.isnan(codes) & ~np.asarray(pc.is_null(text)))
    if unknown.size:
        index = int(unknown[0])
        raise InputError(f"expected one of {', '.join(repr(v) for v in levels)}, got "
                         f"{text[index].as_py()!r}", file=str(path),
                         key_path=f"row {first_row + index}, column {header!r}")
    return codes


def locate_csv_error(path: Path, columns: dict[str, str], error: Exception) -> InputError:
    """Re-scan the CSV file to name the row and column that pyarrow could not read.

    Bytes that are not UTF-8 are read as U+FFFD, so such a cell is named like any other
    that is not a number."""
    numeric_headers = {h for k, h in columns.items() if k not in DISCRETE_CHANNELS}
    number = 0
    with path.open(encoding="utf-8-sig", errors="replace", newline="") as stream:
        rows = csv.reader(stream, delimiter=delimiter(path))
        try:
            names = next(rows, [])
            positions = {h: names.index(h) for h in numeric_headers if h in names}
            for number, row in enumerate(rows, start=1):
                found = row_error(row, len(names), positions)
                if found is not None:
                    message, column = found
                    return InputError(message, file=str(path),
                                      key_path=f"row {number}{column}")
        except csv.Error as failure:  # an unclosed quote runs on into a giant field
            return InputError(f"cannot read the row ({failure}): expected closed quotes "
                              "and fields of ordinary length", file=str(path),
                              key_path=f"row {number + 1}")
    return InputError(f"cannot read the CSV file ({cut(str(error))})", file=str(path))


def cut(text: str, limit: int = 200) -> str:
    """A library's message shortened (pyarrow quotes the offending row, however long)."""
    return text if len(text) <= limit else text[:limit] + "..."


def row_error(row: list[str], fields: int, positions: dict[str, int]) -> tuple[str, str] | None:
    """What is wrong with one CSV row, and ", column 'HEADER'" where a cell is to blame."""
    if len(row) != fields:
        return f"expected {fields} fields, got {len(row)}", ""
    for header, position in positions.items():
        if not NUMBER.match(row[position]):
            return f"expected a number, got {row[position]!r}", f", column {header!r}"
    return None
