"""Results that a file's tables add (the shaft's sections, L10m) reach the sweep tables and
plots, the comparison and the HTML report: they are read from the typed result, whose
structure follows the file."""

from __future__ import annotations

import json
import re
from types import SimpleNamespace

import numpy as np
from click.testing import CliRunner

import hubload
from hubload.cli import main
from hubload.report.quantities import all_quantities
from studies_helpers import YARD_LOADER, read_toml, write_toml


def test_shaft_minimum_safety_is_a_quantity_exactly_when_the_file_has_a_shaft(tmp_path):
    found = hubload.check(YARD_LOADER)
    shaft = {q.key: q for q in all_quantities(found.value)}["shaft.min_safety"]
    # property: the lowest safety is the minimum over the sections, as the JSON lists them
    sections = found.to_dict()["shaft"]["sections"]
    assert float(shaft.of(found.value)) == min(s["min_safety"] for s in sections)
    document = read_toml(YARD_LOADER)
    del document["shaft"]
    plain = hubload.check(write_toml(document, tmp_path / "no_shaft.toml"))
    assert "shaft.min_safety" not in {q.key for q in all_quantities(plain.value)}


def test_modified_life_quantities_follow_the_lubrication_table(tmp_path):
    document = read_toml(YARD_LOADER)
    with_oil = {q.key for q in all_quantities(hubload.check(YARD_LOADER).value)}
    del document["lubrication"]
    for case in document["case"]:
        case.pop("temperature_C", None)
    without = {q.key for q in all_quantities(
        hubload.check(write_toml(document, tmp_path / "dry.toml")).value)}
    assert "system.l10m_h" in with_oil and "system.l10m_h" not in without


def test_report_page_shows_the_shaft_sections_as_the_json_gives_them(tmp_path):
    report = tmp_path / "report.html"
    assert CliRunner().invoke(main, ["check", str(YARD_LOADER), "--report",
                                     str(report)]).exit_code == 0
    page = report.read_text(encoding="utf-8")
    sections = hubload.check(YARD_LOADER).to_dict()["shaft"]["sections"]
    for section in sections:
        assert section["name"] in page
        assert re.search(rf"<th>{re.escape(section['name'])}</th>.*?<td>"
                         rf"{section['min_safety']:.2f}</td>", page, re.S)


def test_sweep_reports_where_the_shaft_safety_crosses_its_required_value():
    # Property of interpolation: the reported crossing lies between two neighbouring points
    # whose lowest shaft safeties straddle the required safety.
    run = CliRunner().invoke(main, ["sweep", str(YARD_LOADER), "--vary",
                                    "shaft.section[1].diameter_mm=50:70:11", "--json"])
    assert run.exit_code == 0, run.output
    sweep = json.loads(run.output)
    (crossing,) = sweep["shaft_crossings"]
    x = [p["values"]["shaft.section[1].diameter_mm"] for p in sweep["points"]]
    lowest = [min(s["min_safety"] for s in p["shaft"]["sections"]) for p in sweep["points"]]
    required = sweep["points"][0]["shaft"]["required_safety"]
    i = next(i for i in range(len(x) - 1) if (lowest[i] - required) * (lowest[i + 1] - required) < 0)
    assert x[i] <= crossing["value"] <= x[i + 1] and not crossing["falls_below"]
    text = CliRunner().invoke(main, ["sweep", str(YARD_LOADER), "--vary",
                                     "shaft.section[1].diameter_mm=50:70:11"]).output
    assert f"= {crossing['value']:.4g}" in text and "rises above" in text


def grid_sweep(lives_h):
    """A 2 x 2 sweep whose points carry only the governing life (target 100 h)."""
    from hubload.casefile.variation import KeyPath
    from hubload.schema.spec import Field
    from hubload.studies.sweep import Axis

    axes = tuple(Axis(KeyPath(key, ((key, None),), Field(key, "number", f"{key} [mm]")), values)
                 for key, values in (("a", np.array([1.0, 2.0])), ("b", np.array([10.0, 20.0]))))
    study = SimpleNamespace(cases=SimpleNamespace(names=()), shaft=None)
    return SimpleNamespace(
        title="t", axes=axes, shape=(2, 2), file_values={"a": None, "b": None},
        governing_life_h=np.array([np.inf if v is None else v for v in lives_h]),
        targets_h=np.full(4, 100.0), first=SimpleNamespace(
            governing=SimpleNamespace(symbol="L10"), study=study))


def test_life_map_draws_grids_with_zero_or_only_infinite_lives():
    # A zero life (no equilibrium under the refined method) has no place on a log colour
    # scale, and a grid of infinite lives has nothing to shade: both still make a chart
    # spanning the whole grid.
    from hubload.report.plots.sweep import sweep_contour_figure

    for lives in ([0.0, 50.0, 200.0, 400.0], [None] * 4, [300.0] * 4):
        axes = sweep_contour_figure(grid_sweep(lives)).axes[0]
        assert axes.get_xlim()[0] <= 10.0 and axes.get_xlim()[1] >= 20.0
        assert axes.get_ylim()[0] <= 1.0 and axes.get_ylim()[1] >= 2.0
