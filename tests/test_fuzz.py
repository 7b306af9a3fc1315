"""Seeded, bounded fuzzing of load-case files and logs through the command line.

Each bundled scenario is parsed and mutated where it has structure: a value replaced by a
huge, negative, zero, non-finite, string, control-character or wrongly typed one, a key or a
table deleted, an extra key, a case repeated; its TOML text is mutated too (a table written
twice, a cut-off file, an unclosed quote). Logs are CSV files with bad cells, repeated
columns, short rows and stray quotes, and Parquet files with bad samples, repeated or
missing columns, text or integer columns. For every mutant: exit status 0 or 2; with 2 exactly
one line, starting with "error:"; never a traceback, an internal error or a warning; and an
accepted file's JSON holds no null where a number is promised (null means infinite only
where docs/json-output.md says so). Common practice (mutation fuzzing); no published source.

random.Random(seed) makes every run the same: 510 mutants by default, about 3 s.
FUZZ_MUTANTS=N in the environment runs N per scenario and N CSV logs (N / 4 Parquet logs)
for a longer search outside CI; N = 1500 (6,375 mutants, 20 s) passes.
"""

from __future__ import annotations

import copy
import json
import math
import os
import random
import tomllib
import warnings
from pathlib import Path

import pytest
import tomli_w
from click.testing import CliRunner

from hubload.cli import main

ROOT = Path(__file__).parent.parent
SCENARIOS = sorted((ROOT / "load_cases").glob("*.toml"))
CASE_MUTANTS = int(os.environ.get("FUZZ_MUTANTS", 120))    # per scenario
LOG_MUTANTS = int(os.environ.get("FUZZ_MUTANTS", 120))

HOSTILE_VALUES = [0, -1, -0.0, 1e308, -1e308, 1e-308, 1e20, -1e20, 10 ** 400, 2 ** 63,
                  math.nan, math.inf, -math.inf, "", "nan", "abc", "x" * 5000,
                  "\x1b[2J\x07", True, [], [1, 2], {"a": 1}, 1e-9, 0.5, 1e6]
SCALES = [1e6, -1.0, 1e-6, 0.0, 1e12, 1.5]

# docs/json-output.md: these may be null (an infinite life or safety, an undefined value,
# an absent table); every other number must be a number.
NULLABLE = {"dominant_case", "verdict", "lubrication", "shaft", "permissible", "iso281",
            "overall_verdict", "alternative", "setting", "setting_band", "friction", "best",
            "case", "case_index", "min_safety_case", "yield_safety_case", "target_h",
            "permissible_radial_load_kN", "permissible_utilisation", "kappa", "e_c", "a_iso",
            "safety", "min_safety", "yield_safety", "s0", "value", "load_margin", "nu1_cSt",
            "subject",
            "dominant_case_modified", "name", "limit",
            # undefined per docs/operating-points.md (e.g. a pressure without a motor)
            "given_as", "mode", "pressure_bar", "flow_lpm", "motor_power_kW", "speed_kmh",
            "lateral_accel_g", "tractive_force_demand_kN", "adhesion_limit_kN",
            # docs/shaft.md: the moment reading is undefined at or inboard of the face
            "moment_equivalent_force_kN", "permissible_utilisation_moment",
            "permissible_utilisation_radial",
            # docs/logs.md: no --out file; a fleet combined by logged hours
            "spectrum_file", "fleet_mix"}


def nullable(key: str) -> bool:
    # lives and distances to failure are infinite without fatigue: l10_h, life_km, ...
    return key in NULLABLE or key.endswith(("_h", "_km"))


def stray_nulls(document, path="") -> list[str]:
    found = []
    if isinstance(document, dict):
        for key, value in document.items():
            where = f"{path}.{key}" if path else key
            if value is None and not nullable(key) and not path.endswith(".values"):
                found.append(where)
            found += stray_nulls(value, where)
    elif isinstance(document, list):
        for index, item in enumerate(document):
            if item is None:
                found.append(f"{path}[{index}]")
            found += stray_nulls(item, f"{path}[{index}]")
    return found


def leaves(document, path=()):
    """(container, key, path) of every value that is not a table or an array of tables."""
    for key, value in (document.items() if isinstance(document, dict)
                       else enumerate(document)):
        here = (*path, key)
        if isinstance(value, dict) or (isinstance(value, list) and value
                                       and all(isinstance(v, dict) for v in value)):
            yield (document, key, here)
            yield from leaves(value, here)
        else:
            yield (document, key, here)


def mutate_document(document: dict, rng: random.Random) -> tuple[dict, str]:
    """One structure-aware mutation of a parsed load-case file, and its description."""
    mutant = copy.deepcopy(document)
    places = list(leaves(mutant))
    container, key, path = rng.choice(places)
    where = ".".join(map(str, path))
    kind = rng.choice(["value", "value", "value", "scale", "delete", "extra", "repeat"])
    if kind == "scale" and isinstance(container[key], (int, float)) \
            and not isinstance(container[key], bool):
        container[key] = container[key] * rng.choice(SCALES)
    elif kind == "delete":
        del container[key]
    elif kind == "extra":
        table = container[key] if isinstance(container[key], dict) else container
        if isinstance(table, dict):
            table[rng.choice(["extra_key", "C_KN", "offset", "Name"])] = 1
    elif kind == "repeat" and isinstance(mutant.get("case"), list):
        mutant["case"].append(copy.deepcopy(rng.choice(mutant["case"])))
    else:
        kind = "value"
        container[key] = copy.deepcopy(rng.choice(HOSTILE_VALUES))
    return mutant, f"{kind} at {where}"


def mutate_text(text: str, rng: random.Random) -> tuple[str, str]:
    """One mutation of the TOML text itself."""
    lines = text.splitlines()
    kind = rng.choice(["twice", "cut", "quote", "garbage", "control"])
    if kind == "twice":
        headers = [i for i, line in enumerate(lines) if line.startswith("[")
                   and not line.startswith("[[")]
        start = rng.choice(headers) if headers else 0
        stop = next((i for i in range(start + 1, len(lines)) if lines[i].startswith("[")),
                    len(lines))
        lines += lines[start:stop]
    elif kind == "cut":
        return text[:rng.randrange(len(text))], "cut"
    elif kind == "quote":
        index = rng.randrange(len(lines))
        lines[index] = lines[index] + ' = "unclosed'
    elif kind == "garbage":
        lines[rng.randrange(len(lines))] = rng.choice(["}{", "= 1", "[[]]", "x = ", "\x00"])
    else:
        named = [i for i, line in enumerate(lines) if line.startswith("name =")] or [0]
        lines.insert(rng.choice(named) + 1, 'title_note = "\\u001b[2J\\u0007"')
    return "\n".join(lines) + "\n", kind


def dumped(document: dict) -> str | None:
    try:
        return tomli_w.dumps(document)
    except (TypeError, ValueError):
        return None     # not expressible in TOML (e.g. a table inside an array of values)


def run_cli(args: list[str]):
    """The command through click, with every warning recorded (pytest would swallow them)."""
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        result = CliRunner().invoke(main, args)
    return result, caught


def assert_clean_outcome(args: list[str], what: str) -> None:
    result, caught = run_cli(args)
    output = result.output
    context = f"{what}: {output[-600:]!r}"
    assert result.exit_code in (0, 2), context
    assert "Traceback" not in output and "RuntimeWarning" not in output, context
    assert not [w for w in caught if issubclass(w.category, RuntimeWarning)], context
    if result.exit_code == 2:
        lines = result.stderr.strip().splitlines()
        assert len(lines) == 1 and lines[0].startswith("error:"), context
        assert result.stdout == "", context
        assert "non-finite number" not in lines[0], context    # caught late: names no key
    elif "--json" in args:
        assert result.stderr == "", context
        nulls = stray_nulls(json.loads(result.stdout))
        assert not nulls, f"{what}: null where a number is promised: {nulls[:5]}"


@pytest.mark.parametrize("scenario", SCENARIOS, ids=lambda p: p.stem)
def test_mutated_load_case_files_end_cleanly(tmp_path, scenario):
    rng = random.Random(f"case files {scenario.stem}")
    text = scenario.read_text()
    document = tomllib.loads(text)
    path = tmp_path / "mutant.toml"
    for index in range(CASE_MUTANTS):
        if index % 5 == 4:
            mutant, what = mutate_text(text, rng)
        else:
            mutated, what = mutate_document(document, rng)
            mutant = dumped(mutated)
            if mutant is None:
                continue
        path.write_text(mutant, encoding="utf-8")
        args = ["check", str(path), "--json"]
        if index % 7 == 3:
            args += ["--method", "refined"]
        assert_clean_outcome(args, f"{scenario.name} mutant {index} ({what})")


LOG_HEADER = ["time_s", "wheel_load_kN", "side_force_kN", "tractive_force_kN", "speed_rpm"]
BAD_CELLS = ["", "nan", "inf", "-inf", "1e300", "-1e300", "abc", '"', '"1,2"', "1e-320",
             "0x10", " 5 ", "NaN", "--1", "1,5", "\x00", "9" * 400]


def base_log(rng: random.Random, rows: int = 60) -> list[list[str]]:
    return [[f"{i * 0.1:.1f}", f"{rng.uniform(5, 25):.2f}", f"{rng.uniform(-4, 4):.2f}",
             f"{rng.uniform(-5, 8):.2f}", f"{rng.uniform(0, 90):.1f}"] for i in range(rows)]


def mutate_log(rng: random.Random) -> tuple[str, str]:
    header, rows = list(LOG_HEADER), base_log(rng)
    kinds = rng.sample(["cell", "cell", "column", "short", "long", "quote", "order",
                        "header", "empty"], rng.randint(1, 3))
    for kind in sorted(kinds, key=lambda k: k == "empty"):      # emptied last
        if kind == "cell":
            for _ in range(rng.randint(1, 5)):
                row = rows[rng.randrange(len(rows))]
                row[rng.randrange(len(row))] = rng.choice(BAD_CELLS)
        elif kind == "column":
            repeated = rng.randrange(len(header))
            header.append(header[repeated])
            for row in rows:
                row.append(row[repeated] if repeated < len(row) else "1")
        elif kind == "short":
            row = rows[rng.randrange(len(rows))]
            del row[rng.randrange(1, len(row)):]
        elif kind == "long":
            rows[rng.randrange(len(rows))].append("7")
        elif kind == "quote":
            row = rows[rng.randrange(len(rows))]
            row[rng.randrange(len(row))] = '"12'
        elif kind == "order":     # time running backwards or standing still
            index = rng.randrange(1, len(rows))
            rows[index][0] = rows[index - 1][0] if rng.random() < 0.5 else "-5"
        elif kind == "header":
            header[rng.randrange(len(header))] = rng.choice(["", "wheel_load_N", "time_s",
                                                             "x" * 300])
        else:
            rows = rows[:rng.randint(0, 2)]
    text = "\n".join(",".join(line) for line in [header, *rows]) + "\n"
    return text, "+".join(kinds)


def test_mutated_logs_end_cleanly(tmp_path):
    rng = random.Random("logs")
    path = tmp_path / "log.csv"
    case_file = str(ROOT / "load_cases" / "yard_loader.toml")
    for index in range(LOG_MUTANTS):
        text, what = mutate_log(rng)
        path.write_text(text, encoding="utf-8")
        args = ["spectrum", str(path), "--case-file", case_file, "--json"]
        if index % 3 == 1:
            args += ["--gaps", rng.choice(["interpolate", "drop"])]
        assert_clean_outcome(args, f"log mutant {index} ({what})")


# Regressions: each input below once ended in "the calculation met a non-finite number"
# (an overflow caught late, naming no key) or an internal error; the first two were found by
# the mutations above, the others by setting every numeric key of the bundled scenarios to
# 1e-308 and 5e-324 in turn. Each is now refused by a named limit of the file format, or,
# for a vanishing speed, computed as standstill.
TINY_VALUE_REGRESSIONS = [
    ("road_sweeper", ("project", "target_life_h"), 1e-308, []),
    ("site_dumper", ("motor", "efficiency_volumetric"), 1e-308, []),
    ("site_dumper", ("motor", "efficiency_mechanical"), 1e-308, []),
    ("site_dumper", ("motor", "displacement_cc"), 1e-308, []),
    ("site_dumper", ("pair", "outboard", "Y"), 1e-308, []),
    ("road_sweeper", ("pair", "outboard", "roller_length_mm"), 5e-324, ["--method", "refined"]),
    ("road_sweeper", ("shaft", "section", 0, "notch_radius_mm"), 5e-324, []),
    ("road_sweeper", ("shaft", "required_safety"), 1e-308, []),
]


@pytest.mark.parametrize("scenario, path, value, options", TINY_VALUE_REGRESSIONS,
                         ids=[".".join(map(str, r[1])) for r in TINY_VALUE_REGRESSIONS])
def test_regression_a_vanishing_divisor_is_refused_naming_its_key(tmp_path, scenario, path,
                                                                  value, options):
    document = tomllib.loads((ROOT / "load_cases" / f"{scenario}.toml").read_text())
    table = document
    for key in path[:-1]:
        table = table[key]
    if path[-1] not in table:
        pytest.skip(f"{scenario} has no {path[-1]}")
    table[path[-1]] = value
    file = tmp_path / "tiny.toml"
    file.write_text(tomli_w.dumps(document))
    result, _ = run_cli(["check", str(file), "--json", *options])
    assert result.exit_code == 2, result.output
    key_path = ".".join(str(p) if not isinstance(p, int) else f"[{p}]" for p in path) \
        .replace(".[", "[")
    assert key_path in result.stderr and "expected" in result.stderr, result.stderr


def test_regression_a_logged_speed_of_1e_320_rpm_is_standstill_not_an_error(tmp_path):
    # found by log mutant 277: life = 1e6 L / (60 n) overflowed, an internal error in the log
    from hubload.model.iso281 import life_hours

    with warnings.catch_warnings():
        warnings.simplefilter("error")
        assert life_hours(10.0, 1e-320) == math.inf
    rows = [f"{i},{12 + i % 3},1,2,{1e-320 if i == 5 else 40}" for i in range(40)]
    path = tmp_path / "log.csv"
    path.write_text(",".join(LOG_HEADER) + "\n" + "\n".join(rows) + "\n")
    assert_clean_outcome(["spectrum", str(path), "--case-file",
                          str(ROOT / "load_cases" / "yard_loader.toml"), "--json"], "1e-320")
    result, _ = run_cli(["spectrum", str(path), "--case-file",
                         str(ROOT / "load_cases" / "yard_loader.toml"), "--json"])
    assert result.exit_code == 0, result.output


PARQUET_MUTANTS = max(LOG_MUTANTS // 4, 10)
BAD_SAMPLES = [math.nan, math.inf, -math.inf, 1e300, -1e300, 5e-324, -1.0, 0.0, 1e6]


def parquet_mutant(rng: random.Random) -> tuple[list[str], list, str]:
    """Column names and arrays of a Parquet log with one to three defects."""
    import pyarrow as pa

    names = list(LOG_HEADER)
    rows = base_log(rng)
    columns = [pa.array([float(row[i]) for row in rows]) for i in range(len(names))]
    kinds = rng.sample(["sample", "sample", "repeat", "text", "drop", "empty", "int"],
                       rng.randint(1, 3))
    for kind in sorted(kinds, key=lambda k: k == "empty"):
        index = rng.randrange(len(names))
        if kind == "sample":
            values = columns[index].to_pylist()
            bad = rng.choice(BAD_SAMPLES)
            values[rng.randrange(len(values))] = str(bad) \
                if pa.types.is_string(columns[index].type) else bad
            columns[index] = pa.array(values)
        elif kind == "repeat":        # a second column of the same name, other values
            names.append(names[index])
            columns.append(columns[(index + 1) % len(columns)])
        elif kind == "text":
            columns[index] = pa.array([str(v) for v in columns[index].to_pylist()])
        elif kind == "int" and pa.types.is_floating(columns[index].type):
            values = columns[index].to_pylist()
            if all(math.isfinite(v) and abs(v) < 2 ** 62 for v in values):
                columns[index] = pa.array([int(v) for v in values])
        elif kind == "drop" and len(names) > 1:
            del names[index], columns[index]
        elif kind == "empty":
            kept = rng.randint(0, 1)
            columns = [column.slice(0, kept) for column in columns]
    return names, columns, "+".join(kinds)


def test_mutated_parquet_logs_end_cleanly(tmp_path):
    import pyarrow as pa
    import pyarrow.parquet as pq

    rng = random.Random("parquet logs")
    path = tmp_path / "log.parquet"
    case_file = str(ROOT / "load_cases" / "yard_loader.toml")
    for index in range(PARQUET_MUTANTS):
        names, columns, what = parquet_mutant(rng)
        pq.write_table(pa.Table.from_arrays(columns, names=names), path)
        assert_clean_outcome(["spectrum", str(path), "--case-file", case_file, "--json"],
                             f"parquet mutant {index} ({what})")
