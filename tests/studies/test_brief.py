"""Supplier brief: the inverse rating solve returns the target life, its numbers are the
check's numbers, and it is written only where and when asked."""

from __future__ import annotations

import dataclasses
import json
import math
import re

import numpy as np
import pytest
import sympy
from click.testing import CliRunner
from hypothesis import given
from hypothesis import strategies as st

from hubload.casefile import load_study
from hubload.cli import main
from hubload.model.requirements import spectrum_equivalent_load_n, wheel_moment_nm
from hubload.studies.requirements import life_at, requirements_of
from studies_helpers import SCENARIOS, YARD_LOADER, read_toml, write_toml

KN = 1e3
WEIBULL_SLOPE = 9 / 8  # system life of roller bearings in series (Lundberg-Palmgren)


def with_target(path, tmp_path, factor):
    """A copy of ``path`` whose target is ``factor`` x the pair's current governing life."""
    document = read_toml(path)
    check = json.loads(CliRunner().invoke(main, ["check", str(path), "--json"]).output)
    life = check["system"].get("l10m_h") or check["system"]["l10_h"]
    document.setdefault("project", {})["target_life_h"] = life * factor
    return write_toml(document, tmp_path / f"target_{factor}.toml")


@pytest.mark.parametrize("scenario", SCENARIOS, ids=lambda p: p.stem)
@pytest.mark.parametrize("factor", [0.3, 0.8, 1.7])
def test_every_solved_rating_gives_back_exactly_the_target_life(scenario, factor, tmp_path):
    study = load_study(with_target(scenario, tmp_path, factor))
    needs = requirements_of(study, 2.0)
    for bearing in needs.bearings:
        others = [b.label for b in needs.bearings if b.label != bearing.label]
        solves = ((bearing.alone, {bearing.label}, bearing.label),
                  (bearing.both, {bearing.label, *others}, "system"),
                  (bearing.this_only, {bearing.label}, "system"))
        for solve, scaled_labels, whose in solves:
            if solve.factor is None:
                continue
            life = life_at(study, {label: solve.factor for label in scaled_labels}, whose)
            assert life == pytest.approx(study.target_life_h, rel=1e-9), (bearing.label, whose)


def test_one_bearing_solve_matches_the_closed_form_of_the_system_life(tmp_path):
    # Basic L10: with the inboard bearing as given, the pair reaches T when the outboard
    # life is L_o* = (T^-e - L_i^-e)^(-1/e) (system life), i.e. C* = C (L_o*/L_o)^(3/10)
    # (ISO 281:2007, 7.1). The brief finds it by brentq on the engine.
    study = load_study(with_target(YARD_LOADER, tmp_path, 0.8))
    needs = requirements_of(study, 2.0)
    outboard, inboard = needs.bearings
    target = study.target_life_h
    needed = (target ** -WEIBULL_SLOPE - inboard.life_h ** -WEIBULL_SLOPE) ** (-1 / WEIBULL_SLOPE)
    assert outboard.this_only.factor == pytest.approx((needed / outboard.life_h) ** 0.3,
                                                      rel=1e-10)


def test_a_target_beyond_the_other_bearing_is_reported_out_of_reach(tmp_path):
    study = load_study(with_target(YARD_LOADER, tmp_path, 1.0))
    inboard_life = requirements_of(study, 2.0).bearings[1].life_h
    study = dataclasses.replace(study, target_life_h=2 * inboard_life)
    outboard = requirements_of(study, 2.0).bearings[0]
    assert outboard.this_only.factor is None and "out of reach" in outboard.this_only.note
    assert outboard.both.factor is not None


def table_row(markdown: str, heading: str) -> list[str]:
    line = next(line for line in markdown.splitlines() if line.startswith(f"| {heading}"))
    return [cell.strip() for cell in line.strip("|").split("|")][1:]


def kilonewtons(cell: str) -> float:
    return float(re.match(r"([\d,.]+) kN", cell).group(1).replace(",", ""))


def test_brief_numbers_are_the_checks_numbers():
    markdown = CliRunner().invoke(main, ["brief", str(YARD_LOADER)]).output
    check = json.loads(CliRunner().invoke(main, ["check", str(YARD_LOADER), "--json"]).output)
    labels = list(check["bearings"])
    for row, key in (("max radial load Fr", "fr_kN"), ("max axial load Fa", "fa_kN"),
                     ("max static equivalent load P0", "p0_kN")):
        for label, cell in zip(labels, table_row(markdown, row)):
            largest = max(case["bearings"][label][key] for case in check["cases"])
            assert kilonewtons(cell) == pytest.approx(largest, abs=0.005)
            worst = max(check["cases"], key=lambda c: c["bearings"][label][key])["name"]
            assert f"({worst})" in cell
    for label, cell in zip(labels, table_row(markdown, "static rating C0 given")):
        assert f"s0 = {check['bearings'][label]['s0']:.2f}" in cell
    row, key = ("L10m now", "l10m_h") if check["lubrication"] else ("L10 now", "l10_h")
    for label, cell in zip(labels, table_row(markdown, row)):
        assert float(cell.removesuffix(" h").replace(",", "")) == pytest.approx(
            check["bearings"][label][key], abs=0.5)
    assert f"{check['mean_speed_rpm']:.1f} r/min" in markdown
    assert "Caution" in markdown


def test_equivalent_load_at_the_mean_speed_gives_the_checks_spectrum_life():
    # Shigley 10th ed. sec. 11-7 (variable loading) with ISO 281:2007, 7.1: the constant
    # load Pm at the mean speed does the spectrum's damage, so (C/Pm)^(10/3) 10^6 / (60 n_m)
    # is the bearing's spectrum life as computed case by case by `check`.
    check = json.loads(CliRunner().invoke(main, ["check", str(YARD_LOADER), "--json"]).output)
    document = read_toml(YARD_LOADER)
    mean_rpm = check["mean_speed_rpm"]
    for label in check["bearings"]:
        pm = spectrum_equivalent_load_n(
            [c["time_fraction"] for c in check["cases"]], [c["speed_rpm"] for c in check["cases"]],
            [c["bearings"][label]["p_kN"] * KN for c in check["cases"]])
        c_n = document["pair"][label]["C_kN"] * KN
        life_h = (c_n / pm) ** (10 / 3) * 1e6 / (60 * mean_rpm)
        assert life_h == pytest.approx(check["bearings"][label]["l10_h"], rel=1e-9)


@given(x=st.floats(-0.1, 0.1), w=st.floats(0, 5e4), s=st.floats(-2e4, 2e4),
       t=st.floats(-2e4, 2e4), a=st.floats(-0.1, 0.3), r=st.floats(0.1, 0.8))
def test_wheel_moment_is_the_cross_product_of_lever_and_tyre_force(x, w, s, t, a, r):
    # Independent reference: sympy's vector cross product M = r x F about (x, 0, 0), with
    # the ground force F = (-S, W, T) at the contact patch (a, -R, 0) (docs/conventions.md).
    moment = sympy.Matrix([a - x, -r, 0]).cross(sympy.Matrix([-s, w, t]))
    bending = math.hypot(float(moment[1]), float(moment[2]))
    assert float(wheel_moment_nm(x, w, s, t, a, r)) == pytest.approx(bending, rel=1e-9,
                                                                      abs=1e-6)


def test_equivalent_load_of_a_single_case_or_equal_loads_is_that_load():
    assert float(spectrum_equivalent_load_n([1.0], [50.0], [12e3])) == pytest.approx(12e3)
    assert float(spectrum_equivalent_load_n([0.3, 0.7], [10.0, 90.0], [8e3, 8e3])) == \
        pytest.approx(8e3)
    assert float(spectrum_equivalent_load_n([1.0], [0.0], [8e3])) == 0.0
    assert np.all(np.isfinite(spectrum_equivalent_load_n([0.5, 0.5], [0.0, 30.0], [1e6, 1e3])))


def test_brief_is_written_only_with_out_and_never_over_a_file_without_force(tmp_path):
    runner = CliRunner()
    out = tmp_path / "brief.md"
    first = runner.invoke(main, ["brief", str(YARD_LOADER), "--out", str(out)])
    assert first.exit_code == 0 and out.read_text().startswith("# Supplier brief")
    out.write_text("my notes")
    again = runner.invoke(main, ["brief", str(YARD_LOADER), "--out", str(out)])
    assert again.exit_code == 2 and "--force" in again.output and out.read_text() == "my notes"
    forced = runner.invoke(main, ["brief", str(YARD_LOADER), "--out", str(out), "--force"])
    assert forced.exit_code == 0 and out.read_text().startswith("# Supplier brief")


@pytest.mark.parametrize("args,expected", [
    (["--s0", "0"], "--s0: expected a positive"),
    (["--s0", "-1"], "--s0: expected a positive"),
    (["--out", "/nonexistent-folder/brief.md"], "does not exist"),
])
def test_brief_bad_options_exit_2_with_one_line(args, expected):
    result = CliRunner().invoke(main, ["brief", str(YARD_LOADER), *args])
    assert result.exit_code == 2 and expected in result.output
    assert len(result.output.strip().splitlines()) == 1


def test_required_static_rating_follows_the_chosen_s0():
    # Static safety factor s0 = C0 / P0 (ISO 76:2006), so C0 needed = s0 x the largest P0.
    markdown = CliRunner().invoke(main, ["brief", str(YARD_LOADER), "--s0", "3.5"]).output
    for p0, c0 in zip(table_row(markdown, "max static equivalent load P0"),
                      table_row(markdown, "C0 for s0 >= 3.5")):
        assert kilonewtons(c0) == pytest.approx(3.5 * kilonewtons(p0), abs=0.02)


@pytest.mark.parametrize("lubrication", [True, False])
def test_solved_rating_meets_the_target_of_the_verdicts_life_at_99_percent(tmp_path,
                                                                           lubrication):
    # At 99 % reliability the verdict judges L1m = a1 aISO L10 (with lubrication) or
    # L1 = a1 L10 (without), a1 = 0.25 (ISO 281:2007, 9.2). Independent path: the file
    # written with both ratings times the solved factor, checked by `check`.
    document = read_toml(YARD_LOADER)
    document["project"]["reliability_percent"] = 99
    if not lubrication:
        document.pop("lubrication")
        for case in document["case"]:
            case.pop("temperature_C", None)
    path = write_toml(document, tmp_path / "r99.toml")
    verdict = json.loads(CliRunner().invoke(main, ["check", str(path), "--json"]).output)["verdict"]
    assert verdict["life"] == ("L1m" if lubrication else "L1")
    document["project"]["target_life_h"] = 0.5 * verdict["life_h"]
    path = write_toml(document, tmp_path / "r99.toml")
    needs = requirements_of(load_study(path), 2.0)
    factor = needs.bearings[0].both.factor
    assert factor is not None and factor < 1
    for label in ("outboard", "inboard"):
        document["pair"][label]["C_kN"] *= factor
    scaled = json.loads(CliRunner().invoke(main, ["check", str(write_toml(
        document, tmp_path / "scaled.toml")), "--json"]).output)["verdict"]
    assert scaled["life_h"] == pytest.approx(document["project"]["target_life_h"], rel=1e-6)
    markdown = CliRunner().invoke(main, ["brief", str(path)]).output
    assert "infinite" not in table_row(markdown, f"{verdict['life']} now")


@pytest.mark.parametrize("scenario", SCENARIOS, ids=lambda p: p.stem)
def test_brief_holds_every_case_and_the_shafts_verdict(scenario, tmp_path):
    # A supplier must be able to redo the calculation: every case with its loads as the check
    # used them, and every shaft item with its limit and result (when the file has a shaft).
    markdown = CliRunner().invoke(main, ["brief", str(scenario)]).output
    check = json.loads(CliRunner().invoke(main, ["check", str(scenario), "--json"]).output)
    for case in check["cases"]:
        row = table_row(markdown, case["name"])
        assert f"{case['wheel_load_kN']:.2f}" in row and f"{case['side_force_kN']:.2f}" in row
        assert f"{case['speed_rpm']:.1f}" in row
    overall = check["overall_verdict"]
    if check["shaft"] is not None:
        for item in overall["items"][1:]:
            assert table_row(markdown, item["item"])[-1] in ("pass", "FAIL", "not assessed")
    page = tmp_path / "brief.html"
    assert CliRunner().invoke(main, ["brief", str(scenario), "--out", str(page)]).exit_code == 0
    html = page.read_text(encoding="utf-8")
    assert html.startswith("<!DOCTYPE html>") and "Caution." in html
    assert all(case["name"] in html for case in check["cases"])
