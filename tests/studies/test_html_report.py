"""``check --report``: one self-contained HTML page, opened in headless Chromium (Debian's
chromium package; .ci/run installs it): it must render without a single console message
(no script errors, no blocked outside resource) and show the check's key figures."""

from __future__ import annotations

import json
import re
import shutil
import subprocess

import pytest
from click.testing import CliRunner

from hubload.cli import main
from studies_helpers import SCENARIOS, YARD_LOADER

CHROMIUM = shutil.which("chromium") or shutil.which("chromium-browser")
needs_chromium = pytest.mark.skipif(
    CHROMIUM is None, reason="chromium is not installed here (.ci/run installs it in CI)")
FLAGS = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
         "--disable-background-networking", "--disable-component-update", "--disable-sync",
         "--enable-logging=stderr", "--v=0"]


def write_report(scenario, tmp_path, *options):
    report = tmp_path / f"{scenario.stem}.html"
    result = CliRunner().invoke(main, ["check", str(scenario), "--report", str(report), *options])
    assert result.exit_code == 0, result.output
    check = json.loads(CliRunner().invoke(main, ["check", str(scenario), "--json", *options])
                       .output)
    return report, check


def chromium(tmp_path, *arguments) -> subprocess.CompletedProcess:
    profile = tmp_path / "profile"
    return subprocess.run([CHROMIUM, *FLAGS, f"--user-data-dir={profile}", *arguments],
                          capture_output=True, text=True, timeout=180, check=False)


def rendered_text(dom: str, key: str) -> str:
    match = re.search(rf'data-key="{re.escape(key)}">([^<]*)<', dom)
    assert match, key
    return match.group(1)


RUNS = [(scenario, ()) for scenario in SCENARIOS] + [(YARD_LOADER, ("--method", "refined"))]


@needs_chromium
@pytest.mark.parametrize("scenario,options", RUNS,
                         ids=[f"{s.stem}{'-' + o[-1] if o else ''}" for s, o in RUNS])
def test_report_renders_in_chromium_without_console_messages_and_shows_key_figures(
        scenario, options, tmp_path):
    report, check = write_report(scenario, tmp_path, *options)
    run = chromium(tmp_path, "--dump-dom", report.as_uri())
    assert run.returncode == 0, run.stderr[-2000:]
    console = [line for line in run.stderr.splitlines() if ":CONSOLE" in line]
    assert console == [], console
    dom = run.stdout
    assert check["title"] in dom and "Caution." in dom
    life = check["system"]["l10_h"]
    assert rendered_text(dom, "system.l10_h") == ("infinite" if life is None else f"{life:,.0f}")
    for label, bearing in check["bearings"].items():
        assert rendered_text(dom, f"bearings.{label}.s0") == f"{bearing['s0']:.2f}"
    if check["verdict"] is not None:
        assert ("PASS" if check["verdict"]["passed"] else "FAIL") in dom
    assert dom.count("<svg") >= 2  # the charts are in the page itself


@needs_chromium
def test_report_prints_to_pdf(tmp_path):
    report, _ = write_report(YARD_LOADER, tmp_path)
    pdf = tmp_path / "report.pdf"
    run = chromium(tmp_path, "--no-pdf-header-footer", f"--print-to-pdf={pdf}", report.as_uri())
    assert run.returncode == 0 and pdf.read_bytes().startswith(b"%PDF")
    assert [line for line in run.stderr.splitlines() if ":CONSOLE" in line] == []


def test_report_loads_nothing_from_outside_and_forbids_it(tmp_path):
    report, _ = write_report(YARD_LOADER, tmp_path)
    page = report.read_text(encoding="utf-8")
    assert "default-src 'none'" in page
    assert "<script" not in page and "<link" not in page and "@import" not in page
    for reference in re.findall(r'(?:src|href)="([^"]*)"', page):
        assert reference.startswith("#"), reference
    ids = re.findall(r'\sid="([^"]+)"', page)
    assert len(ids) == len(set(ids)), "ids of the inline charts collide"


def test_report_is_never_written_over_a_file_without_force(tmp_path):
    report = tmp_path / "report.html"
    report.write_text("keep me")
    runner = CliRunner()
    refused = runner.invoke(main, ["check", str(YARD_LOADER), "--report", str(report)])
    assert refused.exit_code == 2 and "--force" in refused.output
    assert report.read_text() == "keep me"
    assert runner.invoke(main, ["check", str(YARD_LOADER), "--report", str(report),
                                "--force"]).exit_code == 0
    assert report.read_text().startswith("<!DOCTYPE html>")
    wrong = runner.invoke(main, ["check", str(YARD_LOADER), "--report", str(tmp_path / "r.txt")])
    assert wrong.exit_code == 2 and ".html" in wrong.output


def test_check_plot_writes_the_damage_share_chart(tmp_path):
    plot = tmp_path / "shares.svg"
    result = CliRunner().invoke(main, ["check", str(YARD_LOADER), "--plot", str(plot)])
    assert result.exit_code == 0 and "<svg" in plot.read_text()[:500]


def test_report_of_an_unloaded_wheel_reads_infinite_where_json_writes_null(tmp_path, document,
                                                                            write_case_file):
    # No load: L10 = (C/P)^(10/3) and s0 = C0/P0 (ISO 281, ISO 76) are infinite, which the
    # JSON writes as null; the page must say "infinite", not a dash or "infinite h".
    for case in document["case"]:
        case.update(wheel_load_kN=0, side_force_kN=0, tractive_force_kN=0)
    path = write_case_file(document)
    report = tmp_path / "unloaded.html"
    assert CliRunner().invoke(main, ["check", path, "--report", str(report)]).exit_code == 0
    page = report.read_text(encoding="utf-8")
    for key in ("bearings.outboard.s0", "bearings.inboard.s0", "system.l10_h", "verdict.life_h"):
        assert rendered_text(page, key) == "infinite", key
    assert "infinite h" not in page
    row = re.search(r"<th>bearing pair L10 life</th>(.*?)</tr>", page).group(1)
    value, limit, margin, result = re.findall(r"<td>([^<]*)</td>", row)
    assert (value, limit, margin, result) == ("infinite", "&gt;= 5,000 h", "infinite", "pass")
