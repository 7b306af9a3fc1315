"""`hubload template --machine`: a commented machine file that `hubload machine` reads with a
wheel end file, and which names every key of the machine file's format (the format itself,
schema/machineformat.py, is the reference; round trip: common practice)."""

import json
import re
import tomllib

import tomli_w

from machinesupport import WHEEL_END, run

from hubload.schema.machineformat import MACHINE_FORMAT
from hubload.schema.machine_template import WHEEL_END_DROPS, WHEEL_END_FILE


def template(*options) -> str:
    result = run("template", *options)
    assert result.exit_code == 0, result.output
    return result.output


def test_the_template_is_a_machine_file_that_hubload_machine_reads(tmp_path):
    path = tmp_path / "machine.toml"
    path.write_text(template("--machine"))
    (tmp_path / WHEEL_END_FILE).write_text(WHEEL_END.read_text())
    result = run("machine", path, "--json")
    assert result.exit_code == 0, result.output
    document = json.loads(result.output)
    assert [w["name"] for w in document["wheel_ends"]] == [
        "front left", "front right", "rear left", "rear right"]
    parsed = tomllib.loads(path.read_text())
    assert [axle["position"] for axle in parsed["axle"]] == ["front", "rear"]
    assert sum(operation["time_percent"] for operation in parsed["operation"]) == 100
    assert run("forecast", path).exit_code == 0      # its [fleet] is a machine file's


def test_the_load_case_template_without_the_machines_tables_is_its_wheel_end_file(tmp_path):
    wheel_end = tomllib.loads(template())
    for table in WHEEL_END_DROPS:
        wheel_end.pop(table.strip("[]"), None)
    (tmp_path / WHEEL_END_FILE).write_text(tomli_w.dumps(wheel_end))
    path = tmp_path / "machine.toml"
    path.write_text(template("--machine"))
    result = run("machine", path)
    assert result.exit_code == 0, result.output


def test_the_template_names_every_key_of_the_format_but_the_refused_one():
    text = template("--machine")
    written = set(re.findall(r"^(?:# )?(\w+) = ", text, flags=re.MULTILINE))
    for table in MACHINE_FORMAT.tables:
        assert f"[{table.name}]" in text, table.name
        for field in table.fields:
            assert (field.key in written) != (field.key == "wheel_ends_per_machine"), field.key
