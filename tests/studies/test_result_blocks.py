"""Results that other features add to the check's JSON (the shaft's sections, L10m) reach
the sweep tables and plots, the comparison and the HTML report without changes there."""

from __future__ import annotations

import copy
import json
import re

from click.testing import CliRunner

from hubload.cli import main
from hubload.report.html import report_page
from hubload.report.series import all_series, shaft_min_safety
from studies_helpers import YARD_LOADER, read_toml

SHAFT = {"sections": [
    {"name": "flange fillet", "min_safety": 1.85, "min_safety_case": "braking, loaded",
     "yield_safety": 3.1, "fatigue_life_h": None},
    {"name": "bearing seat", "min_safety": 2.6, "min_safety_case": "pushing into a heap",
     "yield_safety": 4.0, "fatigue_life_h": 120000.0}]}


def check_document() -> dict:
    return json.loads(CliRunner().invoke(main, ["check", str(YARD_LOADER), "--json"]).output)


def test_shaft_minimum_safety_is_a_series_when_the_document_has_sections():
    document = check_document()
    labels = [s.label for s in all_series(document)]
    assert ("shaft min safety" in labels) == bool((document.get("shaft") or {}).get("sections"))
    with_shaft = {**copy.deepcopy(document), "shaft": SHAFT}
    series = {s.label: s for s in all_series(with_shaft)}
    assert series["shaft min safety"].values([with_shaft]) == [1.85]  # the lower section
    assert shaft_min_safety({"shaft": {"sections": [{"min_safety": None}]}}) is None


def test_modified_life_series_follow_the_documents_keys():
    document = check_document()
    labels = [s.label for s in all_series(document)]
    assert ("system L10m" in labels) == ("l10m_h" in document["system"])


def test_report_page_shows_a_result_block_it_was_not_written_for():
    document = {**check_document(), "shaft": SHAFT}
    page = report_page(document, read_toml(YARD_LOADER))
    assert re.search(r'data-key="shaft.sections\[0\].min_safety">1.85<', page)
    assert "flange fillet" in page and "braking, loaded" in page


def test_sweep_reports_where_the_shaft_safety_crosses_its_required_value():
    # Shaft safety 1/(k x) against a required 1.5: log(safety) is linear in log(x), not in x,
    # so the interpolated crossing lies within a grid step of the exact x* = 1/(1.5 k).
    import numpy as np

    from hubload.casefile.variation import KeyPath
    from hubload.schema.spec import Field
    from hubload.studies.sweep import Axis, Sweep, SweepPoint

    x = np.linspace(0.5, 2.0, 31)
    k = 0.5
    points = tuple(SweepPoint({"k": float(v)}, {
        "verdict": None, "shaft": {"required_safety": 1.5,
                                   "sections": [{"min_safety": 1 / (k * v)}]}}) for v in x)
    axis = Axis(KeyPath("k", (("k", None),), Field("k", "number", "")), x)
    sweep = Sweep("t", "t.toml", (axis,), points, None, {"k": None})
    ((where, found),) = sweep.shaft_crossings()
    assert where == {} and len(found) == 1 and found[0].falls_below
    assert abs(found[0].value - 1 / (1.5 * k)) < x[1] - x[0]
    # reported without a target life too: the shaft's limit is its own
    from hubload.report.sweep_out import crossing_lines

    (line,) = [text for text in crossing_lines(sweep) if text.startswith("Shaft")]
    assert f"k = {found[0].value:.4g}" in line and "falls below" in line


def grid_sweep(lives_h):
    """A 2 x 2 sweep whose points carry only the governing life (target 100 h)."""
    import numpy as np

    from hubload.casefile.variation import KeyPath
    from hubload.schema.spec import Field
    from hubload.studies.sweep import Axis, Sweep, SweepPoint

    axes = tuple(Axis(KeyPath(key, ((key, None),), Field(key, "number", "")), values)
                 for key, values in (("a", np.array([1.0, 2.0])), ("b", np.array([10.0, 20.0]))))
    points = tuple(SweepPoint({}, {"verdict": {"life": "L10", "life_h": life, "target_h": 100.0,
                                               "passed": life is None or life >= 100}})
                   for life in lives_h)
    return Sweep("t", "t.toml", axes, points, 100.0, {"a": None, "b": None})


def test_life_map_draws_grids_with_zero_or_only_infinite_lives():
    # A zero life (no equilibrium under the refined method) has no place on a log colour
    # scale, and a grid of infinite lives has nothing to shade: both still make a chart
    # spanning the whole grid.
    from hubload.report.plots.sweep import sweep_contour_figure

    for lives in ([0.0, 50.0, 200.0, 400.0], [None] * 4, [300.0] * 4):
        axes = sweep_contour_figure(grid_sweep(lives)).axes[0]
        assert axes.get_xlim()[0] <= 10.0 and axes.get_xlim()[1] >= 20.0
        assert axes.get_ylim()[0] <= 1.0 and axes.get_ylim()[1] >= 2.0
