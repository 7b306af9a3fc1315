"""Every bad input exits with status 2 and one clear line naming file and key path."""

import pytest
from click.testing import CliRunner

from hubload.cli import main


def run_check(path):
    result = CliRunner().invoke(main, ["check", path])
    assert result.exit_code == 2, result.output
    assert result.exception is None or isinstance(result.exception, SystemExit)
    assert "Traceback" not in result.output
    message = result.output.strip()
    assert message.count("\n") == 0, message
    assert message.startswith(f"error: {path}")
    return message


def edited(document, edit):
    edit(document)
    return document


@pytest.mark.parametrize("edit, key_path, expected", [
    (lambda d: d["wheel"].pop("offset_mm"), "wheel.offset_mm", "missing required key"),
    (lambda d: d["wheel"].update(ofset_mm=3), "wheel.ofset_mm", "did you mean 'offset_mm'"),
    (lambda d: d["pair"]["outboard"].update(C_kN="120"), "pair.outboard.C_kN", "expected a number"),
    (lambda d: d["pair"]["outboard"].update(C_kN=-5), "pair.outboard.C_kN", ">= 0.1"),
    (lambda d: d["pair"]["inboard"].update(C0_kN=0), "pair.inboard.C0_kN", ">= 0.1"),
    (lambda d: d["case"][0].update(speed_rpm=-10), "case[0].speed_rpm", ">= 0"),
    (lambda d: d["case"][1].update(wheel_load_kN=-1), "case[1].wheel_load_kN", ">= 0"),
    (lambda d: d["case"][0].update(speed_kmh=3), "case[0].speed_kmh", "only one of"),
    (lambda d: d["case"][0].pop("speed_rpm"), "case[0]", "missing speed"),
    (lambda d: d["case"][0].update(time_percent=50), "case[].time_percent", "add to 80 %"),
    (lambda d: d["pair"]["outboard"].update(position_mm=-50), "pair.outboard.position_mm",
     "zero bearing spread"),
    (lambda d: d["pair"]["outboard"].update(position_mm=-60), "pair.outboard.position_mm",
     "outboard bearing"),
    (lambda d: d["pair"].update(arrangement="back-2-back"), "pair.arrangement",
     "did you mean 'back-to-back'"),
    (lambda d: d["pair"]["outboard"].pop("Y0"), "pair.outboard.Y0", "go together"),
    (lambda d: d["pair"]["outboard"].update(rollers=18), "pair.outboard.roller_diameter_mm",
     "go together"),
    (lambda d: d["case"][0].update(wheel_load_kN=True), "case[0].wheel_load_kN", "boolean"),
    (lambda d: d.pop("case"), "case", "missing required table [[case]]"),
    (lambda d: d.update(case=[]), "case", "at least 1"),
])
def test_bad_value_names_key_path_and_expectation(document, write_case_file, edit, key_path,
                                                  expected):
    path = write_case_file(edited(document, edit))
    message = run_check(path)
    assert key_path in message
    assert expected in message


@pytest.mark.parametrize("literal", ["nan", "inf", "-inf"])
def test_nan_and_inf_are_refused(document, write_case_file, literal):
    import tomli_w
    text = tomli_w.dumps(document).replace("offset_mm = 100", f"offset_mm = {literal}")
    message = run_check(write_case_file(text))
    assert "wheel.offset_mm" in message and "finite" in message


def test_toml_syntax_error_names_line(write_case_file):
    message = run_check(write_case_file("[wheel]\noffset_mm = = 3\n"))
    assert "TOML syntax error" in message and "line 2" in message


def test_missing_file(tmp_path):
    message = run_check(str(tmp_path / "nowhere.toml"))
    assert "file not found" in message


def test_byte_order_mark_is_named(document, write_case_file):
    # TOML 1.0 (toml.io): a document is UTF-8; Python's tomllib rejects a leading BOM, which
    # some editors write. The line says what to change instead of "invalid statement".
    import tomli_w
    message = run_check(write_case_file("\ufeff" + tomli_w.dumps(document)))
    assert "byte-order mark" in message


def test_empty_number_list_is_called_empty(document, write_case_file):
    document["shaft"] = {"ultimate_strength_MPa": 800, "yield_strength_MPa": 600,
                         "surface": "machined",
                         "section": [{"name": "fillet", "position_mm": 40, "diameter_mm": 50}],
                         "permissible": {"load_position_mm": [], "radial_load_kN": []}}
    message = run_check(write_case_file(document))
    assert "shaft.permissible.load_position_mm" in message and "got an empty list" in message
