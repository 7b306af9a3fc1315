"""Studies under the refined method (--method refined): each sweep point is the separate
`check --method refined` of a written file, comparisons carry the refined lives, and the
brief solves the rating needed on the geometry rating that the refined lives use (with the
refined lives' own exponent, ISO/TS 16281)."""

from __future__ import annotations

import copy
import json

import numpy as np
import pytest
from click.testing import CliRunner

from hubload.casefile import load_study
from hubload.casefile.geometry import with_method
from hubload.casefile.variation import parse_key_path
from hubload.cli import main
from hubload.model.refined.layout import RollerSet
from hubload.model.refined.life import (
    lamina_ratings_n, life_factor_of_rating_factor, reference_life_mrev)
from hubload.studies.requirements import life_at, requirements_of
from studies_helpers import SCENARIOS, YARD_LOADER, assert_close, read_toml, set_key, write_toml

FILE_LEVEL_KEYS = ("title", "source", "method", "cases", "cautions")


def check(path, *options) -> dict:
    result = CliRunner().invoke(main, ["check", str(path), "--json", *options])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


@pytest.mark.parametrize("key,start,stop", [
    ("wheel.offset_mm", 60.0, 140.0),
    ("pair.axial_setting_um", -30.0, 90.0),
    ("case[3].side_force_kN", 0.0, 8.0),
])
def test_refined_sweep_point_equals_a_refined_check_of_a_written_file(key, start, stop,
                                                                      tmp_path):
    document = read_toml(YARD_LOADER)
    swept = CliRunner().invoke(main, ["sweep", str(YARD_LOADER), "--method", "refined",
                                      "--vary", f"{key}={start}:{stop}:3", "--json"])
    assert swept.exit_code == 0, swept.output
    points = json.loads(swept.output)["points"]
    path = parse_key_path(key, document)
    for index, value in enumerate((start, (start + stop) / 2, stop)):
        variant = copy.deepcopy(document)
        set_key(variant, path.segments, value)
        expected = check(write_toml(variant, tmp_path / f"p{index}.toml"), "--method", "refined")
        for name, entry in expected.items():
            if name not in FILE_LEVEL_KEYS:
                assert_close(points[index][name], entry, f"{key}={value}: {name}", rel=1e-9)


def test_refined_compare_carries_the_refined_lives():
    compared = json.loads(CliRunner().invoke(main, [
        "compare", *map(str, SCENARIOS), "--method", "refined", "--json"]).output)
    for entry, scenario in zip(compared["files"], SCENARIOS):
        assert entry["method"] == "refined"
        assert_close(entry["system"], check(scenario, "--method", "refined")["system"], "system",
                     rel=1e-9)


def refined_study(document: dict, tmp_path, name: str):
    return with_method(load_study(write_toml(document, tmp_path / name)), "refined")


def test_refined_brief_ratings_give_back_exactly_the_target_life(tmp_path):
    # The inverse solve under the refined method scales the geometry rating (and with it
    # every lamina capacity); checked on the engine for the governing life (L10m here).
    document = read_toml(YARD_LOADER)
    study = refined_study(document, tmp_path, "refined.toml")
    needs = requirements_of(study, 2.0)
    for bearing in needs.bearings:
        others = [b.label for b in needs.bearings if b.label != bearing.label]
        for solve, labels, whose in ((bearing.alone, {bearing.label}, bearing.label),
                                     (bearing.both, {bearing.label, *others}, "system"),
                                     (bearing.this_only, {bearing.label}, "system")):
            if solve.factor is None:
                continue
            assert solve.on_geometry
            life = life_at(study, {label: solve.factor for label in labels}, whose)
            assert life == pytest.approx(study.target_life_h, rel=1e-9), (bearing.label, whose)


def test_refined_required_rating_follows_the_line_contact_life_exponent(tmp_path):
    # ISO/TS 16281: L10r = [sum (q_e/q_c)^(9/2)]^(-8/9), so scaling every lamina rating
    # by k scales L10r by k^4 (Lundberg-Palmgren line contact), not by ISO 281's k^(10/3):
    # C_needed = C_geometry (T / L10r)^(1/4) for the basic life (no [lubrication]).
    document = read_toml(YARD_LOADER)
    document.pop("lubrication")
    document["project"]["verdict_basis"] = "refined"   # the refined life governs
    for case in document["case"]:
        case.pop("temperature_C", None)
    study = refined_study(document, tmp_path, "basic.toml")
    result = check(write_toml(document, tmp_path / "basic_check.toml"), "--method", "refined")
    needs = requirements_of(study, 2.0)
    for bearing in needs.bearings:
        life = result["bearings"][bearing.label]["l10_h"]
        expected = (result["verdict"]["target_h"] / life) ** 0.25
        assert bearing.alone.factor == pytest.approx(expected, rel=1e-9)
        assert bearing.alone.on_geometry


def test_scaled_lamina_ratings_scale_the_reference_life_by_the_fourth_power():
    # The ISO/TS 16281 sum written out with every lamina rating times k, against the
    # model's life times life_factor_of_rating_factor(k).
    rollers = RollerSet(20, 10e-3, 18e-3, np.radians(15.0), 80e-3)
    loads = np.random.default_rng(3).uniform(0.0, 120.0, (20, 30))
    inner, outer = lamina_ratings_n(rollers, 30)
    k = 1.37
    q_ei = np.mean(loads ** 4, axis=0) ** 0.25
    q_eo = np.mean(loads ** 4.5, axis=0) ** (1 / 4.5)
    by_formula = np.sum((k * inner / q_ei) ** -4.5 + (k * outer / q_eo) ** -4.5) ** (-8 / 9)
    assert reference_life_mrev(rollers, loads) * life_factor_of_rating_factor(k) == \
        pytest.approx(by_formula, rel=1e-12)


def test_refined_brief_states_the_setting_its_lives_assume(tmp_path):
    # The ISO 281 pair rule assumes line-to-line; the refined lives use the file's setting.
    document = read_toml(YARD_LOADER)
    document["pair"]["axial_setting_um"] = 35
    path = write_toml(document, tmp_path / "endplay.toml")
    refined = CliRunner().invoke(main, ["brief", str(path), "--method", "refined"]).output
    basic = CliRunner().invoke(main, ["brief", str(path)]).output
    assert "axial setting of 35 um (end play)" in refined and "line-to-line" not in refined
    assert "assumes a line-to-line setting" in basic
