"""Machine files end to end: operations -> wheel ends -> lives (hubload machine).

The model's own free-body, mirror and load-transfer checks are in tests/model/test_machine.py;
these check what the file, the conversion and the command add to them.
"""

import json
import math
import shutil
import tempfile
import tomllib
from pathlib import Path

import pytest
import sympy
import tomli_w
from click.testing import CliRunner
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

import hubload
from hubload.cli import main

ROOT = Path(__file__).parent.parent
MACHINES = ROOT / "load_cases" / "machines"
WHEEL_END = MACHINES / "yard_loader_wheel_end.toml"
G = 9.80665  # standard gravity, 3rd CGPM 1901


def machine_document(operations, **machine):
    document = {
        "project": {"title": "test machine", "target_life_h": 5000},
        "machine": {"mass_kg": 4000.0, "cog_from_front_axle_mm": 1100.0, "cog_height_mm": 900.0,
                    "wheelbase_mm": 2400.0, "rolling_resistance": 0.0},
        "payload": {"cog_from_front_axle_mm": -800.0, "cog_height_mm": 1000.0},
        "axle": [{"name": "front axle", "position": "front", "track_mm": 1500.0, "driven": True,
                  "wheel_end": "wheel_end.toml"},
                 {"name": "rear axle", "position": "rear", "track_mm": 1500.0, "driven": True,
                  "wheel_end": "wheel_end.toml"}],
        "operation": operations,
    }
    for key, value in machine.items():
        table, name = key.split("__")
        if table == "axle":
            document["axle"][int(name[-1])][name[:-1]] = value
        else:
            document[table][name] = value
    return document


def write_machine(folder: Path, document) -> Path:
    shutil.copy(WHEEL_END, folder / "wheel_end.toml")
    path = folder / "machine.toml"
    path.write_text(tomli_w.dumps(document))
    return path


def run(*args):
    return CliRunner().invoke(main, [str(a) for a in args])


def machine_json(folder: Path, document) -> dict:
    result = run("machine", write_machine(folder, document), "--json")
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


def wheel(document: dict, name: str) -> dict:
    return next(w for w in document["wheel_ends"] if w["name"] == name)


def operation(name="op", time_percent=100.0, speed_kmh=6.0, **keys):
    return {"name": name, "time_percent": time_percent, "speed_kmh": speed_kmh, **keys}


# -- the free body of the machine, from the file's numbers -------------------------------------

def test_axle_loads_balance_forces_and_pitch_moments_about_the_cog(tmp_path):
    # Rigid body in the machine's plane of symmetry, solved by sympy (Meriam & Kraige, Statics:
    # equilibrium; composite centre of mass): contact points s ahead of and L - s behind the
    # combined CoG, h below it; gravity m g (-sin theta, -cos theta) in machine axes with
    # tan theta = grade; the ground's forces along X add to m g (a_x + sin theta) (Newton).
    op = operation(payload_kg=1500.0, accel_g=-0.2, grade_percent=-10.0, speed_kmh=8.0)
    found = machine_json(tmp_path, machine_document([op], machine__rolling_resistance=0.03))
    mass = 4000 + 1500
    s = sympy.Rational(4000 * 1100 - 1500 * 800, mass) / 1000
    h = sympy.Rational(4000 * 900 + 1500 * 1000, mass) / 1000
    wheelbase = sympy.Rational(24, 10)
    theta = sympy.atan(sympy.Rational(-10, 100))
    front, rear, along = sympy.symbols("front rear along")
    weight = mass * sympy.nsimplify(G)
    solution = sympy.solve([
        sympy.Eq(front + rear, weight * sympy.cos(theta)),
        sympy.Eq(along, weight * (sympy.Rational(-2, 10) + sympy.sin(theta))),
        # moments about the CoG (y component of r x F): z F_x - x F_z with z = -h
        sympy.Eq(-h * along - s * front + (wheelbase - s) * rear, 0)], [front, rear, along])
    loads = {name: wheel(found, name)["cases"][0]["wheel_load_kN"] * 1000
             for name in ("front left", "front right", "rear left", "rear right")}
    assert loads["front left"] + loads["front right"] == pytest.approx(
        float(solution[front]), rel=1e-9)
    assert loads["rear left"] + loads["rear right"] == pytest.approx(
        float(solution[rear]), rel=1e-9)


def test_wheel_loads_add_to_the_weight_normal_to_the_ground_on_grade_and_cross_slope(tmp_path):
    # Normal component of gravity m g cos(theta) cos(phi) for grade theta and roll angle phi
    # (ISO 8855 yaw-pitch-roll angles, from memory; rotation matrices of any dynamics text).
    op = operation(payload_kg=800.0, grade_percent=12.0, cross_slope_percent=-9.0,
                   lateral_accel_g=0.05, mirror=False)
    found = machine_json(tmp_path, machine_document([op]))
    total = sum(w["cases"][0]["wheel_load_kN"] for w in found["wheel_ends"]) * 1000
    expected = 4800 * G * math.cos(math.atan(0.12)) * math.cos(math.atan(-0.09))
    assert total == pytest.approx(expected, rel=1e-12)


def test_static_axle_loads_by_the_lever_rule(tmp_path):
    # Lever rule (Meriam & Kraige, Statics; Gillespie 1992, ch. 2). Hand example: 4000 kg at
    # 1.10 m behind the front axle of a 2.40 m wheelbase and 1500 kg 0.80 m ahead of it:
    # front = g (4000 * 1.30 + 1500 * 3.20) / 2.40 = 40,861.0 N, rear = g (4000 * 1.10 -
    # 1500 * 0.80) / 2.40 = 13,075.5 N; each wheel half of its axle's load.
    found = machine_json(tmp_path, machine_document([operation(payload_kg=1500.0,
                                                               speed_kmh=0.0)]))
    assert wheel(found, "front left")["cases"][0]["wheel_load_kN"] == pytest.approx(
        40.8610 / 2, abs=1e-4)
    assert wheel(found, "rear right")["cases"][0]["wheel_load_kN"] == pytest.approx(
        13.0755 / 2, abs=1e-4)


# -- symmetry --------------------------------------------------------------------------------

def test_a_symmetric_machine_in_straight_travel_gives_left_and_right_the_same_lives(tmp_path):
    # Mirror symmetry of the free body (Meriam & Kraige, Statics): nothing pushes sideways.
    ops = [operation("travel", 60.0, 10.0), operation("climb", 25.0, 4.0, grade_percent=15.0,
                                                        payload_kg=1000.0),
           operation("brake", 15.0, 8.0, accel_g=-0.3)]
    found = machine_json(tmp_path, machine_document(ops, machine__rolling_resistance=0.04))
    for axle in ("front", "rear"):
        left, right = wheel(found, f"{axle} left"), wheel(found, f"{axle} right")
        assert left["cases"] == right["cases"]
        assert left["governing_life"]["life_h"] == pytest.approx(
            right["governing_life"]["life_h"], rel=1e-12)
        assert all(case["side_force_kN"] == 0 for case in left["cases"])


def test_a_left_turn_equals_a_right_turn_with_the_wheels_swapped(tmp_path):
    # Mirror symmetry of a machine symmetric left to right (Meriam & Kraige, Statics).
    def turn(sign):
        folder = tmp_path / ("left" if sign > 0 else "right")
        folder.mkdir()
        return machine_json(folder, machine_document([operation(
            lateral_accel_g=0.18 * sign, cross_slope_percent=5.0 * sign, mirror=False)]))
    left_turn, right_turn = turn(1), turn(-1)
    for axle in ("front", "rear"):
        for side, other in (("left", "right"), ("right", "left")):
            a, b = wheel(left_turn, f"{axle} {side}"), wheel(right_turn, f"{axle} {other}")
            for key in ("wheel_load_kN", "side_force_kN", "tractive_force_kN", "speed_rpm"):
                assert a["cases"][0][key] == pytest.approx(b["cases"][0][key], rel=1e-12,
                                                           abs=1e-12)
            assert a["governing_life"]["life_h"] == pytest.approx(
                b["governing_life"]["life_h"], rel=1e-9)
    assert left_turn["machine"]["l10_h"] == pytest.approx(right_turn["machine"]["l10_h"],
                                                          rel=1e-9)


def test_an_oscillating_axle_shows_no_lateral_load_transfer(tmp_path):
    # A pendulum axle with its pivot at ground level takes no roll moment (statics of the
    # pivoted axle; Milliken & Milliken 1995, ch. 18, from memory): its wheels stay equally
    # loaded in a turn, and the other axle moves F_y h / t between its wheels.
    op = operation(lateral_accel_g=0.2, mirror=False)
    found = machine_json(tmp_path, machine_document([op], axle__oscillating1=True))
    rear = [wheel(found, f"rear {side}")["cases"][0]["wheel_load_kN"] for side in ("left",
                                                                                  "right")]
    assert rear[0] == pytest.approx(rear[1], rel=1e-12)
    front = [wheel(found, f"front {side}")["cases"][0]["wheel_load_kN"] for side in ("left",
                                                                                    "right")]
    assert (front[1] - front[0]) / 2 == pytest.approx(0.2 * 4000 * G * 0.9 / 1.5 / 1000,
                                                      rel=1e-12)


def test_a_mirrored_operation_spends_half_its_time_each_way(tmp_path):
    # The duty of a machine that turns both ways (issue contract: mirror = true by default).
    found = machine_json(tmp_path, machine_document([operation(lateral_accel_g=0.15)]))
    cases = wheel(found, "front left")["cases"]
    assert [c["time_fraction"] for c in cases] == [0.5, 0.5]
    assert cases[0]["side_force_kN"] < 0 < cases[1]["side_force_kN"]   # inside, then outside


# -- properties --------------------------------------------------------------------------------

operation_values = st.fixed_dictionaries({
    "payload_kg": st.floats(0, 1500), "speed_kmh": st.floats(6, 15),  # R > t / 2
    "accel_g": st.floats(-0.15, 0.15), "lateral_accel_g": st.floats(-0.12, 0.12),
    "grade_percent": st.floats(-10, 10), "cross_slope_percent": st.floats(-8, 8),
})


def lives(document):
    with tempfile.TemporaryDirectory() as folder:
        found = hubload.machine(write_machine(Path(folder), document)).to_dict()
    return ([w["governing_life"]["life_h"] for w in found["wheel_ends"]],
            found["machine"], found["governing_life"]["life_h"])


@settings(max_examples=15, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(values=st.lists(operation_values, min_size=2, max_size=3),
       split=st.integers(0, 2), fraction=st.floats(0.1, 0.9))
def test_splitting_an_operation_into_two_copies_leaves_every_life_unchanged(values, split,
                                                                           fraction):
    # Palmgren-Miner linear damage (Palmgren 1924; Miner 1945): damage adds over time, so an
    # operation spent as two copies with the same total time changes no life.
    split %= len(values)
    ops = [operation(f"op {i}", 100.0 / len(values), **v) for i, v in enumerate(values)]
    copies = [dict(ops[split], name="first copy", time_percent=ops[split]["time_percent"]
                   * fraction),
              dict(ops[split], name="second copy", time_percent=ops[split]["time_percent"]
                   * (1 - fraction))]
    halves = ops[:split] + copies + ops[split + 1:]
    whole, parts = lives(machine_document(ops)), lives(machine_document(halves))
    assert parts[0] == pytest.approx(whole[0], rel=1e-9)
    assert parts[1]["l10_h"] == pytest.approx(whole[1]["l10_h"], rel=1e-9)
    assert parts[1]["l10m_h"] == pytest.approx(whole[1]["l10m_h"], rel=1e-9)
    assert parts[2] == pytest.approx(whole[2], rel=1e-9)


@settings(max_examples=15, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(height=st.floats(500, 1200), extra=st.floats(50, 400),
       accel=st.floats(0.05, 0.2), speed=st.floats(4, 12))
def test_more_cog_height_never_lengthens_the_outside_wheels_life_in_a_turn(height, extra,
                                                                          accel, speed):
    # Lateral load transfer grows with the CoG height (Gillespie 1992, ch. 9): the outside
    # wheel of a steady level left turn (the right one, rigid axles) carries more load and
    # more side force, and its bearings never last longer for it.
    def outside_lives(cog_height_mm):
        document = machine_document([operation(speed_kmh=speed, lateral_accel_g=accel,
                                               mirror=False)],
                                    machine__cog_height_mm=cog_height_mm)
        found, _, _ = lives(document)
        return found[1], found[3]   # front right, rear right
    low, high = outside_lives(height), outside_lives(height + extra)
    assert high[0] <= low[0] * (1 + 1e-12)
    assert high[1] <= low[1] * (1 + 1e-12)


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


def test_each_rigid_axle_reproduces_the_per_wheel_vehicle_lateral_transfer(tmp_path):
    # The load-case file's [vehicle] rule for one wheel, W = A / 2 + A a_y h / t and S = W a_y
    # (Gillespie 1992, ch. 9), is what a rigid axle of a machine on level ground gives its
    # wheels when nothing accelerates along the travel: the outside wheel of a left turn (front
    # right) with the axle's load, track and the CoG height must get the same forces and life.
    accel = 0.17
    found = machine_json(tmp_path, machine_document([operation(lateral_accel_g=accel,
                                                               mirror=False)]))
    axle_kN = sum(wheel(found, f"front {side}")["cases"][0]["wheel_load_kN"]
                  for side in ("left", "right"))
    outside = wheel(found, "front right")
    single = dict(tomllib.loads(WHEEL_END.read_text()),
                  vehicle={"axle_load_kN": axle_kN, "track_mm": 1500.0, "cog_height_mm": 900.0},
                  case=[{"name": "left turn, outside wheel", "time_percent": 100.0,
                         "lateral_accel_g": accel,
                         "speed_rpm": outside["cases"][0]["speed_rpm"]}])
    path = tmp_path / "single.toml"
    path.write_text(tomli_w.dumps(single))
    checked = run("check", path, "--json")
    assert checked.exit_code == 0, checked.output
    case = json.loads(checked.output)["cases"][0]
    assert case["wheel_load_kN"] == pytest.approx(outside["cases"][0]["wheel_load_kN"], rel=1e-12)
    assert case["side_force_kN"] == pytest.approx(outside["cases"][0]["side_force_kN"], rel=1e-12)
    assert json.loads(checked.output)["governing_life"]["life_h"] == pytest.approx(
        outside["governing_life"]["life_h"], rel=1e-9)


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


def test_the_machine_life_is_every_bearing_in_series_with_the_weibull_slope_of_rollers(tmp_path):
    # Bearings in series, L = (sum L_k^-e)^(-1/e), e = 9/8 for roller bearings
    # (Lundberg & Palmgren 1952, as given in Harris & Kotzalas, Essential Concepts of Bearing
    # Technology, 5th ed., 2007; from memory): eight bearings of four wheel ends.
    found = hubload.machine(MACHINES / "yard_loader_machine.toml").to_dict()
    for key in ("l10_h", "l10m_h"):
        lives = [b[key] for w in found["wheel_ends"] for b in w["bearings"].values()]
        assert len(lives) == 8
        expected = sum(life ** -1.125 for life in lives) ** (-1 / 1.125)
        assert found["machine"][key] == pytest.approx(expected, rel=1e-12)
    weakest = wheel(found, found["governing_life"]["weakest_wheel_end"]["name"])
    shortest = min(w["governing_life"]["life_h"] for w in found["wheel_ends"])
    assert weakest["governing_life"]["life_h"] == pytest.approx(shortest, rel=1e-12)


def test_an_axle_without_wheel_end_carries_load_but_has_no_results(tmp_path):
    # Issue contract; lever rule (Meriam & Kraige, Statics): the front wheels' loads do not
    # depend on whether the rear axle has results.
    document = machine_document([operation()])
    with_rear = machine_json(tmp_path, document)
    del document["axle"][1]["wheel_end"]
    document["axle"][1]["rolling_radius_mm"] = 395.0
    folder = tmp_path / "front only"
    folder.mkdir()
    front_only = machine_json(folder, document)
    assert [w["name"] for w in front_only["wheel_ends"]] == ["front left", "front right"]
    assert wheel(front_only, "front left")["cases"] == wheel(with_rear, "front left")["cases"]


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
