"""The machine command's outputs and studies: wheel files, report, JSON, schema, sweeps and
comparisons of machine files."""

import json
import shutil
import tomllib

import pytest
import tomli_w
from click.testing import CliRunner

import hubload
from hubload.cli import main
from machinesupport import (MACHINES, ROOT, WHEEL_END, machine_document, operation, run,
                            write_machine)


# -- the wheel files and the command ------------------------------------------------------------

def test_written_wheel_files_give_the_same_lives_through_check(tmp_path):
    # The contract of --write-wheel-files: an ordinary load-case file per wheel end.
    machine = MACHINES / "yard_loader_machine.toml"
    out = tmp_path / "wheels"
    result = run("machine", machine, "--json", "--write-wheel-files", out)
    assert result.exit_code == 0, result.output
    found = json.loads(result.stdout)
    for entry in found["wheel_ends"]:
        checked = run("check", out / (entry["name"].replace(" ", "_") + ".toml"), "--json")
        assert checked.exit_code == 0, checked.output
        document = json.loads(checked.output)
        assert document["governing_life"]["life_h"] == entry["governing_life"]["life_h"]
        assert document["system"]["l10_h"] == entry["system"]["l10_h"]
        for label in ("outboard", "inboard"):
            assert document["bearings"][label]["s0"] == entry["bearings"][label]["s0"]
    again = run("machine", machine, "--write-wheel-files", out)
    assert again.exit_code == 2 and "--force" in again.output
    assert run("machine", machine, "--write-wheel-files", out, "--force").exit_code == 0


def test_the_bundled_machine_reports_every_wheel_end_within_80_columns():
    result = CliRunner().invoke(main, ["machine", str(MACHINES / "yard_loader_machine.toml"),
                                       "--cases"], terminal_width=80, env={"COLUMNS": "80"})
    assert result.exit_code == 0, result.output
    assert max(len(line) for line in result.output.splitlines()) <= 80
    for name in ("front left", "front right", "rear left", "rear right", "Weakest wheel end",
                 "Caution"):
        assert name in result.output


def test_json_carries_the_contract_keys():
    # docs/json-output.md, hubload machine.
    found = hubload.machine(MACHINES / "yard_loader_machine.toml").to_dict()
    entry = found["wheel_ends"][0]
    assert {"name", "axle", "side", "governing_life", "system", "bearings", "cases"} <= set(entry)
    assert set(entry["system"]) >= {"l10_h", "l10m_h"}
    assert set(entry["bearings"]["outboard"]) >= {"l10_h", "l10m_h", "s0"}
    assert set(entry["cases"][0]) >= {"name", "time_fraction", "wheel_load_kN", "side_force_kN",
                                      "tractive_force_kN", "speed_rpm"}
    assert set(found["machine"]) >= {"l10_h", "l10m_h"}
    assert set(found["verdict"]) == {"life", "life_h", "target_h", "passed", "basis"}
    assert {"symbol", "life_h", "basis"} <= set(found["governing_life"])
    lives_h = [w["governing_life"]["life_h"] for w in found["wheel_ends"]]
    assert found["governing_life"]["life_h"] < min(lives_h)   # a series system


def test_the_html_report_of_a_machine_names_every_wheel_end_and_the_verdict(tmp_path):
    # Output files are never overwritten without --force (DEVELOPERS.md, common practice).
    machine = MACHINES / "yard_loader_machine.toml"
    report = tmp_path / "machine.html"
    assert run("machine", machine, "--report", report).exit_code == 0
    text = report.read_text()
    for name in ("front left", "front right", "rear left", "rear right", "Weakest wheel end",
                 "Caution", 'data-key="verdict.life_h"'):
        assert name in text
    again = run("machine", machine, "--report", report)
    assert again.exit_code == 2 and "--force" in again.output

def test_docs_machine_file_format_page_is_generated_from_the_format():
    from hubload.schema.export import MACHINE_INTRO, reference_markdown
    from hubload.schema.machineformat import MACHINE_FORMAT

    expected = reference_markdown(MACHINE_FORMAT, MACHINE_INTRO)
    assert (ROOT / "docs" / "machine-file-format.md").read_text() == expected, (
        "regenerate: PYTHONPATH=src python -m hubload.schema.export machine > "
        "docs/machine-file-format.md")


def test_the_bundled_machine_validates_against_the_printed_json_schema():
    # jsonschema (independent validator of the JSON Schema standard) checks our export.
    import jsonschema

    printed = run("schema", "--machine")
    assert printed.exit_code == 0
    schema = json.loads(printed.output)
    jsonschema.Draft202012Validator.check_schema(schema)
    jsonschema.validate(tomllib.loads((MACHINES / "yard_loader_machine.toml").read_text()),
                        schema)
    with pytest.raises(jsonschema.ValidationError):
        jsonschema.validate({**tomllib.loads((MACHINES / "yard_loader_machine.toml")
                                             .read_text()), "wheels": 4}, schema)


# -- sweeps of a machine file --------------------------------------------------------------------

@pytest.mark.parametrize("spec, key, value", [
    ("machine.cog_height_mm=700:1300:4", ("machine", "cog_height_mm"), 1100.0),
    ("operation[1].payload_kg=0:2000:3", ("operation", 1, "payload_kg"), 1000.0),
    ("axle[0].track_mm=1300:1700:3", ("axle", 0, "track_mm"), 1500.0),
])
def test_a_machine_sweep_point_is_the_machine_with_that_value(tmp_path, spec, key, value):
    # A sweep point must equal a separate run of the file with the value written in
    # (the project's rule for sweeps, tests/studies/test_sweep_matches_check.py).
    source = MACHINES / "yard_loader_machine.toml"
    swept = run("sweep", source, "--vary", spec, "--json")
    assert swept.exit_code == 0, swept.output
    points = json.loads(swept.output)["points"]
    document = tomllib.loads(source.read_text())
    node = document[key[0]] if len(key) == 2 else document[key[0]][key[1]]
    node[key[-1]] = value
    for name in ("yard_loader_wheel_end.toml",):
        shutil.copy(MACHINES / name, tmp_path / name)
    written = tmp_path / "machine.toml"
    written.write_text(tomli_w.dumps(document))
    alone = json.loads(run("machine", written, "--json").output)
    point = next(p for p in points if p["values"][spec.split("=")[0]] == value)
    assert point["governing_life"]["life_h"] == alone["governing_life"]["life_h"]
    assert point["machine"] == alone["machine"]
    assert [w["governing_life"]["life_h"] for w in point["wheel_ends"]] == [
        w["governing_life"]["life_h"] for w in alone["wheel_ends"]]


def test_a_machine_sweep_fits_80_columns_and_refuses_an_unknown_key():
    source = MACHINES / "yard_loader_machine.toml"
    found = CliRunner().invoke(main, ["sweep", str(source), "--vary",
                                      "machine.cog_height_mm=700:1300:4", "--vary",
                                      "operation[1].payload_kg=0:2000:3"], env={"COLUMNS": "80"})
    assert found.exit_code == 0, found.output
    assert max(len(line) for line in found.output.splitlines()) <= 80
    bad = run("sweep", source, "--vary", "machine.cog_hieght_mm=700:1300:4")
    assert bad.exit_code == 2
    assert bad.output.strip() == (f"error: {source}: machine.cog_hieght_mm: unknown key "
                                  f"'cog_hieght_mm'; did you mean 'cog_height_mm'?")

def test_compare_puts_machines_side_by_side_and_refuses_a_mix(tmp_path):
    # Each compared machine is that machine alone, and its ratio is its life over the first
    # one's (the project's rule for compare, common practice).
    machine = MACHINES / "yard_loader_machine.toml"
    document = tomllib.loads(machine.read_text())
    document["machine"]["cog_height_mm"] = 1250.0
    shutil.copy(WHEEL_END, tmp_path / WHEEL_END.name)
    high = tmp_path / "high.toml"
    high.write_text(tomli_w.dumps(document))
    compared = run("compare", machine, high, "--json")
    assert compared.exit_code == 0, compared.output
    entries = json.loads(compared.output)["machines"]
    for entry, path in zip(entries, (machine, high)):
        alone = json.loads(run("machine", path, "--json").output)
        assert entry["governing_life"]["life_h"] == alone["governing_life"]["life_h"]
    assert entries[1]["ratio_to_first"]["governing_life"] == pytest.approx(
        entries[1]["governing_life"]["life_h"] / entries[0]["governing_life"]["life_h"])
    table = CliRunner().invoke(main, ["compare", str(machine), str(high)],
                               env={"COLUMNS": "80"})
    assert table.exit_code == 0 and "weakest wheel end" in table.output
    assert max(len(line) for line in table.output.splitlines()) <= 80
    mixed = run("compare", machine, ROOT / "load_cases" / "yard_loader.toml")
    assert mixed.exit_code == 2 and len(mixed.output.strip().splitlines()) == 1
    assert "not both" in mixed.output


def test_a_wheel_end_key_of_one_axle_is_swept_on_that_axle_only(tmp_path):
    # A sweep point must equal a separate run with the value written in (the project's rule
    # for sweeps): here the front axle's own copy of the wheel end file, offset 120 mm.
    source = MACHINES / "yard_loader_machine.toml"
    swept = run("sweep", source, "--vary", "axle[0].wheel_end.wheel.offset_mm=80:120:3",
                "--json")
    assert swept.exit_code == 0, swept.output
    point = json.loads(swept.output)["points"][2]
    assert point["values"] == {"axle[0].wheel_end.wheel.offset_mm": 120.0}
    document = tomllib.loads(source.read_text())
    document["axle"][0]["wheel_end"] = "front_wheel_end.toml"
    shutil.copy(WHEEL_END, tmp_path / WHEEL_END.name)
    (tmp_path / "front_wheel_end.toml").write_text(
        WHEEL_END.read_text().replace("offset_mm = 95 ", "offset_mm = 120 "))
    written = tmp_path / "machine.toml"
    written.write_text(tomli_w.dumps(document))
    alone = json.loads(run("machine", written, "--json").output)
    assert [w["governing_life"]["life_h"] for w in point["wheel_ends"]] == [
        w["governing_life"]["life_h"] for w in alone["wheel_ends"]]
    assert point["governing_life"]["life_h"] == alone["governing_life"]["life_h"]


def test_a_machine_of_many_operations_prints_its_most_damaging_cases_only(tmp_path):
    # The check's rule for large spectra (report.columns, common practice): the 25 most
    # damaging cases per wheel end and a line saying what was left out; --all lists them.
    ops = [operation(f"op {i}", 100.0 / 200, 4.0 + i % 9, lateral_accel_g=0.002 * (i % 40),
                     payload_kg=5.0 * i) for i in range(200)]
    path = write_machine(tmp_path, machine_document(ops))
    short = run("machine", path, "--cases")
    assert short.exit_code == 0, short.output
    assert len(short.output.splitlines()) < 200
    assert "more cases" in short.output and "--all" in short.output
    every = run("machine", path, "--cases", "--all")
    assert "op 199" in every.output and "more cases" not in every.output


def test_written_wheel_files_give_the_same_refined_lives_through_check(tmp_path):
    # The contract of --write-wheel-files holds for the refined method too (its [project]
    # method travels with the machine's [project]).
    document = tomllib.loads((MACHINES / "yard_loader_machine.toml").read_text())
    document["project"]["method"] = "refined"
    document["operation"] = document["operation"][:4]
    document["operation"][0]["time_percent"] = 56.0
    shutil.copy(WHEEL_END, tmp_path / WHEEL_END.name)
    path = tmp_path / "refined.toml"
    path.write_text(tomli_w.dumps(document))
    out = tmp_path / "wheels"
    result = run("machine", path, "--json", "--write-wheel-files", out)
    assert result.exit_code == 0, result.output
    for entry in json.loads(result.stdout)["wheel_ends"]:
        assert entry["method"] == "refined"
        checked = json.loads(run("check", out / (entry["name"].replace(" ", "_") + ".toml"),
                                 "--json").output)
        assert checked["governing_life"]["life_h"] == entry["governing_life"]["life_h"]
        assert checked["governing_life"]["symbol"] == entry["governing_life"]["symbol"]
