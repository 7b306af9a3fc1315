"""Output files: written whole or not at all, never over an input, never over a file that
appeared meanwhile, never through a dangling link (POSIX rename(2) and link(2) semantics)."""

import os
import signal
import subprocess
import sys
import time
from pathlib import Path

import pytest
from click.testing import CliRunner

from hubload.cli import main
from hubload.errors import InputError
from hubload.report import files

ROOT = Path(__file__).parent.parent
YARD_LOADER = ROOT / "load_cases" / "yard_loader.toml"


def refused(args):
    result = CliRunner().invoke(main, [str(a) for a in args])
    assert result.exit_code == 2, result.output
    assert result.output.count("\n") == 1, result.output
    return result.output


def leftovers(folder: Path) -> list[str]:
    return [p.name for p in folder.iterdir() if p.name.endswith(".tmp")]


def test_an_interrupted_write_keeps_the_old_file_and_leaves_nothing(tmp_path):
    target = tmp_path / "brief.md"
    target.write_text("the old brief\n")

    def half_then_killed(temporary: Path) -> None:
        temporary.write_text("the new bri")
        raise KeyboardInterrupt  # as Ctrl-C, or SIGTERM (the CLI turns it into an exit)

    with pytest.raises(KeyboardInterrupt):
        files.write_with(str(target), half_then_killed, force=True)
    assert target.read_text() == "the old brief\n"
    assert leftovers(tmp_path) == []


def test_an_interrupted_first_write_leaves_no_file(tmp_path):
    target = tmp_path / "chart.svg"
    with pytest.raises(KeyboardInterrupt):
        files.write_with(str(target), lambda t: (t.write_text("<svg"), (_ for _ in ()).throw(
            KeyboardInterrupt)), force=False)
    assert not target.exists() and leftovers(tmp_path) == []


def test_a_file_that_appears_during_the_run_is_not_overwritten(tmp_path):
    target = tmp_path / "spectrum.toml"

    def someone_else_writes_first(temporary: Path) -> None:
        temporary.write_text("ours\n")
        target.write_text("theirs\n")

    with pytest.raises(InputError, match="--force"):
        files.write_with(str(target), someone_else_writes_first, force=False)
    assert target.read_text() == "theirs\n" and leftovers(tmp_path) == []


def test_a_written_file_gets_the_usual_permissions(tmp_path):
    # a new file is 0o666 less the umask (POSIX open(2)), not a temporary file's 0o600
    mask = os.umask(0o022)
    os.umask(mask)
    written = files.write_text(str(tmp_path / "brief.md"), "text\n", force=False)
    assert written.stat().st_mode & 0o777 == 0o666 & ~mask


@pytest.mark.parametrize("option", ["--out", "--force-link"])
def test_an_output_that_is_the_input_is_refused_even_with_force(tmp_path, option):
    case = tmp_path / "case.toml"
    case.write_text(YARD_LOADER.read_text())
    out = case
    if option == "--force-link":   # the same file through a symbolic link
        out = tmp_path / "link.md"
        out.symlink_to(case)
    message = refused(["brief", case, "--out", out, "--force"])
    assert "is an input of this run" in message
    assert case.read_text() == YARD_LOADER.read_text()


def test_a_plot_over_the_case_file_is_refused(tmp_path):
    case = tmp_path / "case.svg.toml"
    case.write_text(YARD_LOADER.read_text())
    hard = tmp_path / "chart.svg"
    os.link(case, hard)                   # a hard link names the same file as well
    assert "is an input" in refused(["check", case, "--plot", hard, "--force"])


def test_a_dangling_symlink_is_refused(tmp_path):
    link = tmp_path / "report.html"
    link.symlink_to(tmp_path / "nowhere" / "report.html")
    assert "symbolic link to a file that does not exist" in refused(
        ["check", YARD_LOADER, "--report", link, "--force"])


def test_a_fleet_never_writes_over_its_case_file(tmp_path):
    logs = tmp_path / "logs"
    logs.mkdir()
    rows = "".join(f"{i},{10 + i % 3},0,1,40\n" for i in range(50))
    (logs / "machine.csv").write_text("time_s,wheel_load_kN,side_force_kN,tractive_force_kN,"
                                      "speed_rpm\n" + rows)
    case = tmp_path / "out" / "machine.toml"   # where the log's spectrum would go
    case.parent.mkdir()
    case.write_text(YARD_LOADER.read_text())
    message = refused(["spectrum", logs, "--case-file", case, "--out", case.parent, "--force"])
    assert "is an input of this run" in message
    assert case.read_text() == YARD_LOADER.read_text()


def test_a_run_killed_while_writing_leaves_no_partial_report(tmp_path):
    # a real process, stopped by SIGTERM while it works on a large report: the report
    # is there whole (the run finished) or not at all, and no temporary file is left
    blocks = "".join(f"\n[[case]]\nname = \"case {i}\"\ntime_percent = {100 / 3000!r}\n"
                     f"wheel_load_kN = {10 + i % 9}\nspeed_rpm = 30\n" for i in range(3000))
    text = YARD_LOADER.read_text()
    case = tmp_path / "many.toml"
    case.write_text(text[:text.index("[[case]]")] + blocks)
    report = tmp_path / "report.html"
    process = subprocess.Popen([sys.executable, "-m", "hubload", "check", str(case),
                                "--report", str(report)], stdout=subprocess.DEVNULL,
                               stderr=subprocess.DEVNULL)
    deadline = time.monotonic() + 60
    while not leftovers(tmp_path) and process.poll() is None and time.monotonic() < deadline:
        time.sleep(0.01)
    process.send_signal(signal.SIGTERM)
    process.wait(timeout=60)
    assert leftovers(tmp_path) == []
    if report.exists():
        assert report.read_text().rstrip().endswith("</html>")
