"""The lean per-sample path of measured logs (engine.samples) against engine.evaluate.

The per-sample path must give each sample the life the full engine gives the same
load case: it reuses the engine's per-case functions, so the two agree to rounding
(viscosity per distinct temperature instead of per case). Common practice: a fast path
is checked against the reference path it replaces, on random inputs (hypothesis).
"""

import copy
import dataclasses

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from hubload.casefile.load import read_document, study_from_document
from hubload.domain.study import Cases
from hubload.engine import evaluate
from hubload.engine.samples import sample_lives
from hubload.logs.samples import with_cases
from pathlib import Path

DEMO = Path(__file__).resolve().parents[1] / "load_cases" / "yard_loader.toml"
LABELS = ("outboard", "inboard")
RTOL = 1e-12


def random_cases(draw, size):
    def forces(low, high):  # [N]; zero, or at least a newton (as logged, in kN steps)
        return draw(st.lists(st.one_of(st.just(0.0), st.floats(low, high).filter(
            lambda force: abs(force) >= 1.0)), min_size=size, max_size=size))

    floats = st.floats
    wheel, side, tractive = forces(0.0, 60e3), forces(-30e3, 30e3), forces(-30e3, 30e3)
    # a share of standstill samples, and speeds across the nu1 formula's 1000 r/min switch
    speed = draw(st.lists(st.one_of(st.just(0.0), floats(0.1, 2000.0)),
                          min_size=size, max_size=size))
    return Cases(names=("",) * size, time_fraction=np.full(size, 1.0 / size),
                 wheel_load_n=np.array(wheel), side_force_n=np.array(side),
                 tractive_force_n=np.array(tractive), speed_rpm=np.array(speed))


@st.composite
def studies(draw):
    document = copy.deepcopy(read_document(DEMO))
    document["wheel"]["offset_mm"] = draw(st.floats(-40, 250))
    for label in LABELS:
        document["pair"][label]["C_kN"] = draw(st.floats(40, 200))
    if draw(st.booleans()):
        document["pair"]["arrangement"] = "face-to-face"
    if not draw(st.booleans()):
        del document["lubrication"]
        for block in document["case"]:
            block.pop("temperature_C", None)
    if not draw(st.booleans()):
        del document["shaft"]
    study = study_from_document(document)
    size = draw(st.integers(1, 40))
    cases = random_cases(draw, size)
    temperature_c = None
    if study.lubrication is not None:
        choice = draw(st.sampled_from(["constant", "few", "many"]))
        levels = {"constant": [60.0], "few": [40.0, 60.0, 85.0],
                  "many": draw(st.lists(st.floats(-10, 120), min_size=size, max_size=size))}
        values = levels[choice]
        temperature_c = np.array([values[i % len(values)] for i in range(size)])
    return with_cases(study, cases, temperature_c)


def close(lean, full):
    np.testing.assert_allclose(np.asarray(lean), np.asarray(full), rtol=RTOL, atol=0.0)


@settings(max_examples=120, deadline=None)
@given(study=studies())
def test_the_per_sample_path_gives_every_sample_the_life_of_the_same_load_case(study):
    lean = sample_lives(study)
    full = evaluate(study, with_findings=False)
    for label in LABELS:
        bearing, reference = lean.bearings[label], full.bearings[label]
        close(bearing.case_life_h, reference.case_life_h)
        close(bearing.static_equivalent_n, reference.static_equivalent_n)
        if full.modified is None:
            assert not lean.modified and np.all(np.isinf(bearing.modified_life_h))
        else:
            modified = full.modified.bearings[label]
            close(bearing.modified_life_h, modified.case_life_h)
            assert np.array_equal(bearing.kappa_outside_scope, modified.kappa_outside_scope)
    assert (lean.shaft is None) == (full.shaft is None)
    if full.shaft is not None:
        for lives, section in zip(lean.shaft.case_life_h, full.shaft.sections):
            close(lives, section.case_life_h)
        close(lean.shaft.min_safety, [s.min_safety for s in full.shaft.sections])
        close(lean.shaft.yield_safety, [s.yield_safety for s in full.shaft.sections])
        permissible = full.shaft.permissible
        if permissible is not None and bool(permissible.inside):
            close(lean.shaft.max_utilisation, np.max(permissible.utilisation))
        else:
            assert np.isnan(lean.shaft.max_utilisation)


@pytest.mark.filterwarnings("ignore::RuntimeWarning")  # the infinite load itself
def test_non_finite_loads_are_refused_as_by_the_engine():
    study = study_from_document(read_document(DEMO))
    cases = dataclasses.replace(study.cases, wheel_load_n=np.where(
        np.arange(len(study.cases.names)) == 2, np.inf, study.cases.wheel_load_n))
    broken = dataclasses.replace(study, cases=cases)
    with pytest.raises(Exception) as lean:
        sample_lives(broken)
    with pytest.raises(Exception) as full:
        evaluate(broken)
    assert str(lean.value) == str(full.value)
