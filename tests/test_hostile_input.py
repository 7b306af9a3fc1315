"""Hostile and absurd input: one line, exit status 2, never a traceback or a wrong answer.

Each case comes from a fuzzing run over mutated load-case files; the expectations are
the file format's rules (TOML 1.0, toml.io) and the plausibility limits of the format
(common practice, docs/file-format.md).
"""

import pytest
import tomli_w
from click.testing import CliRunner

from hubload.cli import main


def one_line_error(args, status=2):
    result = CliRunner().invoke(main, args)
    assert result.exit_code == status, result.output
    assert "Traceback" not in result.output and "Warning" not in result.output, result.output
    message = result.output.strip()
    assert message.count("\n") == 0, message
    assert message.startswith("error: "), message
    return message


def with_value(document, table, key, literal):
    """The document as TOML text, ``key`` of ``table`` written as the raw ``literal``."""
    text = tomli_w.dumps(document)
    header = f"[{table}]\n"
    assert header in text
    return text.replace(header, f"{header}{key} = {literal}\n", 1)


def test_an_overflowing_wheel_load_is_refused_not_passed(document, write_case_file):
    # 1e306 kN is finite as written but infinite in newtons: it must not become a case
    # of infinite life (the damage of the spectrum would vanish and a FAIL turn into a PASS).
    document["case"][0]["wheel_load_kN"] = 1e306
    message = one_line_error(["check", write_case_file(document)])
    assert "case[0].wheel_load_kN" in message and "<= 2000" in message


@pytest.mark.parametrize("table, key, value, limit", [
    ("wheel", "offset_mm", 1e6, "<= 2000"),              # a kilometre
    ("wheel", "rolling_radius_mm", 1e-3, ">= 50"),       # a micrometre
    ("wheel", "loaded_radius_mm", 1e-3, ">= 50"),
])
def test_absurd_magnitudes_name_the_key_and_the_limit(document, write_case_file, table, key,
                                                      value, limit):
    document[table][key] = value
    message = one_line_error(["check", write_case_file(document)])
    assert f"{table}.{key}" in message and limit in message


def test_an_integer_of_400_digits_is_one_line(document, write_case_file):
    text = tomli_w.dumps(document).replace("offset_mm = 100", "offset_mm = " + "9" * 400)
    message = one_line_error(["check", write_case_file(text)])
    assert "wheel.offset_mm" in message and "400 digits" in message


def test_a_hexadecimal_integer_beyond_the_float_range_is_one_line(document, write_case_file):
    # TOML allows hexadecimal integers of any length; this one has 4,817 decimal digits
    text = with_value(document, "pair.outboard", "rollers", "0x" + "f" * 4000)
    message = one_line_error(["check", write_case_file(text)])
    assert "pair.outboard.rollers" in message and "digits" in message


@pytest.mark.parametrize("nested", ["[" * 3000 + "]" * 3000,
                                    "{a = " * 3000 + "1" + "}" * 3000])
def test_deep_nesting_is_one_line(document, write_case_file, nested):
    text = tomli_w.dumps(document) + f"\n[extra]\nx = {nested}\n"
    assert "nesting too deep" in one_line_error(["check", write_case_file(text)])


def test_a_very_long_name_is_refused(document, write_case_file):
    document["case"][0]["name"] = "x" * 1_000_000
    message = one_line_error(["check", write_case_file(document)])
    assert "case[0].name" in message and "at most 200 characters" in message


def test_a_very_long_unknown_key_is_shortened(document, write_case_file):
    document["wheel"]["k" * 100_000] = 1
    message = one_line_error(["check", write_case_file(document)])
    assert "unknown key" in message and len(message) < 500


def test_a_raw_control_character_is_a_toml_error(document, write_case_file):
    # TOML 1.0: control characters other than tab must be escaped in basic strings
    text = tomli_w.dumps(document).replace('"travel"', '"tra\x1bvel"')
    assert "TOML syntax error" in one_line_error(["check", write_case_file(text)])


@pytest.mark.parametrize("args, expected", [
    (["check", "--bogus", "x.toml"], "No such option"),
    (["check"], "Missing argument"),
    (["nope"], "No such command"),
    (["spectrum", "x.csv", "--case-file", "y.toml", "--gaps", "sometimes"], "--gaps"),
])
def test_usage_errors_are_one_line(args, expected):
    assert expected in one_line_error(args)


def test_a_huge_sweep_count_is_refused_before_allocating(document, write_case_file):
    message = one_line_error(["sweep", write_case_file(document), "--vary",
                              "wheel.offset_mm=60:160:100000000000000000000"])
    assert "COUNT of at most 100,000" in message


def test_a_sweep_beyond_the_limits_is_refused_before_any_point(document, write_case_file):
    message = one_line_error(["sweep", write_case_file(document), "--vary",
                              "wheel.offset_mm=60:1e300:10"])
    assert "wheel.offset_mm" in message and "<= 2000" in message


def test_an_absurd_required_static_safety_is_refused(document, write_case_file):
    message = one_line_error(["brief", write_case_file(document), "--s0", "1e308"])
    assert "--s0" in message and "up to 20" in message


ESCAPED_TITLE = "\x1b]0;retitled\x07wheel \x1b[31mred\x1b[0m"


@pytest.mark.parametrize("command", [["check"], ["check", "--all"], ["compare"], ["brief"],
                                     ["sweep", "--vary", "wheel.offset_mm=60:100:3"]])
def test_escape_sequences_from_the_file_never_reach_the_terminal(document, write_case_file,
                                                                 command):
    # ECMA-48 control functions (CSI colour, OSC window title) in a title and a case name
    document["project"]["title"] = ESCAPED_TITLE
    document["case"][0]["name"] = "travel \x1b[2J\x1b[31mcleared\x1b[0m"
    path = write_case_file(document)
    args = [command[0], path, *command[1:]] + ([path] if command == ["compare"] else [])
    result = CliRunner().invoke(main, args)
    assert result.exit_code == 0, result.output
    assert "\x1b" not in result.output and "\x07" not in result.output
    assert "[31m" not in result.output and "retitled" not in result.output
    assert "wheel red" in result.output


def test_the_json_keeps_the_names_as_given_escaped(document, write_case_file):
    import json

    document["project"]["title"] = ESCAPED_TITLE
    result = CliRunner().invoke(main, ["check", write_case_file(document), "--json"])
    assert result.exit_code == 0, result.output
    assert "\\u001b]0;retitled\\u0007" in result.output  # JSON (RFC 8259) escapes controls
    assert json.loads(result.output)["title"] == ESCAPED_TITLE
