"""Progress on long work: the engine, studies and logs call ``on_progress(done, total)`` as
they advance; the bar (report.progress) draws on a terminal only, never into a pipe, a file
or click's CliRunner, so --json on stdout stays one document. Common practice: a progress
indicator belongs to interactive terminals only; nothing here has a published source."""

import io
import json
import re
import time
from pathlib import Path

import numpy as np
import pytest
from click.testing import CliRunner
from logsupport import YARD_LOADER, realistic_log, write_log
from rich.console import Console

import hubload.report.progress as bar_module
from hubload import api
from hubload.casefile.load import read_document
from hubload.casefile.machine import load_machine
from hubload.cli import main
from hubload.engine import evaluate
from hubload.logs.analysis import log_options
from hubload.logs.pipeline import process_log
from hubload.model.refined.pair import BLOCK_CASES
from hubload.progress import in_parts
from hubload.report.html.check import report_html
from hubload.report.progress import LateProgress

ROOT = Path(__file__).parent.parent
SITE_DUMPER = ROOT / "load_cases" / "site_dumper.toml"
ROAD_SWEEPER = ROOT / "load_cases" / "road_sweeper.toml"


class Recorder:
    def __init__(self):
        self.calls = []

    def __call__(self, done, total):
        self.calls.append((done, total))


def assert_advances_to_the_end(calls):
    assert calls, "no progress reported"
    done = [d for d, _ in calls]
    assert done == sorted(done)
    assert calls[-1][0] == calls[-1][1]


def many_cases(document: dict, count: int) -> dict:
    """The document's first case repeated ``count`` times with varied loads."""
    first = document["case"][0]
    document["case"] = [{**first, "name": f"case {i}", "time_percent": 100 / count,
                         "wheel_load_kN": 5 + 15 * i / count} for i in range(count)]
    return document


def test_parts_report_as_one_total():
    seen = Recorder()
    first, second = in_parts(seen, 2)
    first(1, 4), first(4, 4), second(2, 4), second(4, 4)
    assert seen.calls == [(1, 8), (4, 8), (6, 8), (8, 8)]


def test_the_refined_solve_reports_each_block_of_cases(document):
    from hubload.casefile.load import study_from_document

    document["project"]["method"] = "refined"
    yard = read_document(YARD_LOADER)
    document["pair"] = yard["pair"]
    study = study_from_document(many_cases(document, 2 * BLOCK_CASES + 1))
    seen = Recorder()
    evaluate(study, on_progress=seen)
    assert seen.calls == [(1, 3), (2, 3), (3, 3)]


def test_a_setting_band_reports_its_three_solves_as_one_bar():
    # the road sweeper's [pair.setting] has a tolerance: the middle and both ends are solved
    seen = Recorder()
    api.check(api.load(ROAD_SWEEPER, "refined"), on_progress=seen)
    assert seen.calls == [(1, 3), (2, 3), (3, 3)]


def test_setting_sweep_sweep_brief_and_compare_report_to_the_end(tmp_path):
    for run in (lambda seen: api.setting(SITE_DUMPER, on_progress=seen),
                lambda seen: api.sweep(SITE_DUMPER, ["wheel.offset_mm=40:200:3"],
                                       on_progress=seen),
                lambda seen: api.brief(SITE_DUMPER, on_progress=seen),
                lambda seen: api.compare([SITE_DUMPER, YARD_LOADER], on_progress=seen)):
        seen = Recorder()
        run(seen)
        assert_advances_to_the_end(seen.calls)
    seen = Recorder()
    api.brief(SITE_DUMPER, on_progress=seen)
    assert [d for d, _ in seen.calls] == [1, 2, 3, 4, 5, 6]   # three searches per bearing


def test_the_report_builder_reports_each_section():
    found = api.check(YARD_LOADER)
    seen = Recorder()
    report_html(found.value, read_document(YARD_LOADER), seen)
    assert_advances_to_the_end(seen.calls)
    assert len(seen.calls) >= 5


@pytest.mark.parametrize("suffix, total", [(".parquet", 3000), (".csv", None)])
def test_a_single_log_reports_its_rows(tmp_path, suffix, total):
    log = write_log(tmp_path / f"log{suffix}", realistic_log(3000))
    seen = Recorder()
    process_log(log, load_machine(YARD_LOADER)[0], log_options(), on_progress=seen)
    assert seen.calls[-1] == (3000, total)
    assert all(t == total for _, t in seen.calls)


class FakeTerminal(io.StringIO):
    def isatty(self):
        return True


def test_the_bar_draws_on_a_terminal_after_the_delay():
    screen = FakeTerminal()
    console = Console(file=screen, force_terminal=True, width=80)
    def drawn() -> str:
        return re.sub(r"\x1b\[[0-9;?]*[A-Za-z]", "", screen.getvalue())

    with LateProgress("reading the file", console, show_after_s=0.0) as progress:
        progress.phase("computing 40 cases (refined)")
        progress(10, 40)
        deadline = time.monotonic() + 10.0     # a loaded CI machine may be slow to draw
        while "25 %" not in drawn() and time.monotonic() < deadline:
            time.sleep(0.05)
    assert "computing 40 cases (refined)" in drawn() and "25 %" in drawn()


def test_a_short_run_draws_nothing_on_a_terminal():
    screen = FakeTerminal()
    console = Console(file=screen, force_terminal=True, width=80)
    with LateProgress("reading the file", console) as progress:
        progress(1, 2)
    assert screen.getvalue() == ""


def test_a_pipe_gets_no_bar_even_when_rich_is_told_it_is_a_terminal(monkeypatch):
    # FORCE_COLOR (set by many CI systems) makes rich treat any stream as a terminal
    monkeypatch.setenv("FORCE_COLOR", "1")
    stream = io.StringIO()
    with LateProgress("x", Console(file=stream), show_after_s=0.0) as progress:
        progress(1, 4)
        time.sleep(0.2)
    assert stream.getvalue() == "" and progress.timer is None


@pytest.mark.parametrize("args", [["check", "--json", "--method", "refined"],
                                  ["setting", "--json"], ["brief"]])
def test_cli_runner_output_stays_clean_with_the_bar_due_at_once(monkeypatch, write_case_file,
                                                               document, args):
    monkeypatch.setenv("FORCE_COLOR", "1")
    monkeypatch.setattr(bar_module, "SHOW_AFTER_S", 0.0)
    yard = read_document(YARD_LOADER)
    document["pair"] = yard["pair"]
    path = write_case_file(many_cases(document, 300))
    result = CliRunner().invoke(main, [args[0], path, *args[1:]])
    assert result.exit_code == 0, result.output
    assert result.stderr == ""
    if "--json" in args:
        json.loads(result.stdout)
    assert "\x1b" not in result.stdout


def test_no_computing_layer_imports_the_report_layer():
    # DEVELOPERS.md: model <- domain <- casefile, engine <- studies, logs <- report
    source = ROOT / "src" / "hubload"
    for layer in ("model", "domain", "casefile", "engine", "studies", "logs"):
        for module in (source / layer).rglob("*.py"):
            imports = re.findall(r"^\s*(?:from|import) (hubload\.report\S*)",
                                 module.read_text(), re.MULTILINE)
            assert not imports, (module, imports)
    assert "hubload" not in "".join(re.findall(r"^(?:from|import) .*$",
                                               (source / "progress.py").read_text(),
                                               re.MULTILINE))


def test_evaluate_without_a_callback_gives_the_same_result(document):
    from hubload.casefile.load import study_from_document

    document["project"]["method"] = "refined"
    document["pair"] = read_document(YARD_LOADER)["pair"]
    study = study_from_document(many_cases(document, 300))
    quiet, watched = evaluate(study), evaluate(study, on_progress=Recorder())
    assert np.array_equal(quiet.system_life_h, watched.system_life_h)
