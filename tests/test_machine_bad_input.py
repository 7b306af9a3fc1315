"""Bad machine files end in one line naming the file, the key path and what was expected.

Common practice of this project's command line (DEVELOPERS.md, errors): exit status 2.
"""

import pytest
import tomli_w
from click.testing import CliRunner

from hubload.cli import main
from machinesupport import MACHINES, ROOT, WHEEL_END, machine_document, operation, write_machine


def failure(folder, document, wheel_end_text=None):
    path = write_machine(folder, document)
    if wheel_end_text is not None:
        (folder / "wheel_end.toml").write_text(wheel_end_text)
    result = CliRunner().invoke(main, ["machine", str(path)])
    assert result.exit_code == 2, result.output
    lines = result.output.strip().splitlines()
    assert len(lines) == 1, result.output
    assert lines[0].startswith(f"error: {path}")
    return lines[0]


def third_axle(document):
    document["axle"].append(dict(document["axle"][1], name="tag axle"))
    return document


def with_axle(index, **keys):
    def change(document):
        document["axle"][index].update(keys)
        return document
    return change


CASES = {
    "unknown axle position": (with_axle(1, position="back"),
                              ("axle[1].position", '"front", "rear"', "'back'")),
    "three axles": (third_axle, ("axle:", "exactly two [[axle]]", "got 3")),
    "two front axles": (with_axle(1, position="front"), ("axle[1].position", "two front")),
    "missing wheel end file": (with_axle(0, wheel_end="nowhere.toml"),
                               ("axle[0].wheel_end", "nowhere.toml", "not found")),
    "both axles oscillate": (lambda d: with_axle(1, oscillating=True)(
        with_axle(0, oscillating=True)(d)), ("axle[1].oscillating", "at most one")),
    "unknown key": (lambda d: {**d, "machine": {**d["machine"], "cog_hieght_mm": 1}},
                    ("machine.cog_hieght_mm", "did you mean 'cog_height_mm'")),
}


@pytest.mark.parametrize("name", CASES)
def test_bad_machine_tables_end_in_one_line(tmp_path, name):
    change, expected = CASES[name]
    line = failure(tmp_path, change(machine_document([operation()])))
    for text in expected:
        assert text in line


OPERATIONS = {
    "time shares not adding to 100 %": (
        [operation("a", 60.0), operation("b", 30.0)],
        ("operation[].time_percent", "add to 90 %", "expected 100 %")),
    "a wheel lifting off": (
        [operation("tipping", 100.0, cross_slope_percent=90.0)],
        ("operation[0]", "'tipping'", "lifts off")),
    "a turn tighter than half the track": (
        [operation("a", 50.0), operation("spin", 50.0, speed_kmh=1.0, lateral_accel_g=0.2)],
        ("operation[1].lateral_accel_g", "'spin'", "below half the track", "0.75 m")),
    "lateral acceleration at standstill": (
        [operation("still", 100.0, speed_kmh=0.0, lateral_accel_g=0.1)],
        ("operation[0].lateral_accel_g", "'still'", "speed_kmh > 0")),
    "payload without a payload table": (
        [operation("loaded", 100.0, payload_kg=500.0)],
        ("operation[0].payload_kg", "[payload]")),
    "two operations of one name": (
        [operation("a", 50.0), operation("a", 50.0)], ("operation[1].name", "unique")),
}


@pytest.mark.parametrize("name", OPERATIONS)
def test_bad_operations_end_in_one_line_naming_the_operation(tmp_path, name):
    operations, expected = OPERATIONS[name]
    document = machine_document(operations)
    if name == "payload without a payload table":
        del document["payload"]
    line = failure(tmp_path, document)
    for text in expected:
        assert text in line


def test_a_wheel_end_file_with_cases_is_refused_naming_it(tmp_path):
    text = tomli_w.dumps({"case": [{"name": "x", "time_percent": 100, "wheel_load_kN": 10,
                                    "speed_rpm": 10}]}) + WHEEL_END.read_text()
    path = write_machine(tmp_path, machine_document([operation()]))
    (tmp_path / "wheel_end.toml").write_text(text)
    result = CliRunner().invoke(main, ["machine", str(path)])
    assert result.exit_code == 2
    assert result.output.strip() == (f"error: {tmp_path / 'wheel_end.toml'}: case: a wheel end "
                                     "file has no [[case]] blocks: the machine's operations "
                                     "give the cases")


def test_a_bad_wheel_end_file_is_named_with_its_key(tmp_path):
    text = WHEEL_END.read_text().replace("C_kN = 98", "C_kN = -98")
    path = write_machine(tmp_path, machine_document([operation()]))
    (tmp_path / "wheel_end.toml").write_text(text)
    result = CliRunner().invoke(main, ["machine", str(path)])
    assert result.exit_code == 2
    assert result.output.startswith(f"error: {tmp_path / 'wheel_end.toml'}: pair.outboard.C_kN")


def test_a_machine_file_and_a_load_case_file_given_to_the_other_command_are_named():
    # One line, exit 2, and the command that reads the file (common practice of this CLI).
    machine = MACHINES / "yard_loader_machine.toml"
    single = ROOT / "load_cases" / "yard_loader.toml"
    for args, expected in ((["check", machine], "hubload machine reads it"),
                           (["machine", single], "hubload check reads it")):
        result = CliRunner().invoke(main, [str(a) for a in args])
        assert result.exit_code == 2
        assert result.output.strip().endswith(expected)


def test_a_derived_case_outside_the_load_case_limits_names_its_operation(tmp_path):
    # A 1,000 t machine on these wheel ends: the derived wheel load exceeds the load-case
    # format's plausibility limit (2,000 kN); the error names the operation, not a case.
    document = machine_document([operation("heavy travel")], machine__mass_kg=1.0e6)
    line = failure(tmp_path, document)
    assert "operation[0]" in line and "'heavy travel'" in line and "wheel_load_kN" in line
