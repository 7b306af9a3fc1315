"""The hand-worked example of docs/worked-example.md, number by number."""

import pytest

from hubload.casefile import study_from_document
from hubload.engine import evaluate

WORKED_EXAMPLE = {
    "wheel": {"offset_mm": 100, "loaded_radius_mm": 400},
    "pair": {
        "arrangement": "back-to-back",
        "outboard": {"position_mm": 30, "C_kN": 120, "C0_kN": 160, "e": 0.4, "Y": 1.5, "Y0": 0.8},
        "inboard": {"position_mm": -50, "C_kN": 100, "C0_kN": 130, "e": 0.4, "Y": 1.5, "Y0": 0.8},
    },
    "case": [{"name": "worked", "time_percent": 100, "wheel_load_kN": 20, "side_force_kN": 4,
              "tractive_force_kN": 6, "speed_rpm": 50}],
}

# Values from docs/worked-example.md (hand calculation, 4 significant digits).
HAND = {
    "outboard": {"fr": 20.80, "fa": 6.935, "p": 20.80, "l10_h": 114_700, "s0": 7.691},
    "inboard": {"fr": 5.815, "fa": 2.935, "p": 6.728, "l10_h": 2_691_000, "s0": 22.36},
}


@pytest.fixture(scope="module")
def result():
    return evaluate(study_from_document(WORKED_EXAMPLE))


@pytest.mark.parametrize("label", ["outboard", "inboard"])
def test_worked_example_bearing_loads_lives_and_static_safety(result, label):
    bearing, hand = result.bearings[label], HAND[label]
    assert bearing.radial_n[0] / 1e3 == pytest.approx(hand["fr"], rel=5e-4)
    assert bearing.axial_n[0] / 1e3 == pytest.approx(hand["fa"], rel=5e-4)
    assert bearing.equivalent_n[0] / 1e3 == pytest.approx(hand["p"], rel=5e-4)
    assert float(bearing.life_h) == pytest.approx(hand["l10_h"], rel=5e-4)
    assert float(bearing.static_safety) == pytest.approx(hand["s0"], rel=5e-4)


def test_worked_example_system_life_and_distance(result):
    assert float(result.system_life_h) == pytest.approx(111_900, rel=5e-4)
    assert float(result.system_life_km) == pytest.approx(843_500, rel=5e-4)
