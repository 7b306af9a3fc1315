"""The refined verdict tells the truth: with the refined method the ISO 281 rule's lives stand
beside the refined (ISO/TS 16281 reference) ones, and ``[project] verdict_basis`` decides.

Symbols as ISO/TS 16281:2008 names the reference lives (L10r basic, L10mr modified) and ISO
281:2007 the others (L10, L10m; Lnm at another reliability, 9.2).
"""

from __future__ import annotations

import json

import pytest
from click.testing import CliRunner

from hubload.cli import main
from studies_helpers import YARD_LOADER, read_toml, write_toml


def check(path, *options) -> dict:
    result = CliRunner().invoke(main, ["check", str(path), "--json", *options])
    assert result.exit_code == 0, result.output
    return json.loads(result.output)


def refined_file(tmp_path, basis: str, **project) -> dict:
    document = read_toml(YARD_LOADER)
    document["project"].update(method="refined", verdict_basis=basis, **project)
    return check(write_toml(document, tmp_path / f"{basis}.toml"))


@pytest.mark.parametrize("basis", ["shorter", "iso281", "refined"])
def test_verdict_basis_picks_the_life_it_names(tmp_path, basis):
    found = refined_file(tmp_path, basis)
    iso = found["iso281"]["system"]["l10m_h"]           # the ISO 281 rule, beside
    refined = found["system"]["l10m_h"]                  # the refined method's keys
    expected = {"shorter": min(iso, refined), "iso281": iso, "refined": refined}[basis]
    governing = found["governing_life"]
    assert governing["life_h"] == pytest.approx(expected, rel=1e-12)
    assert governing["symbol"] == ("L10mr" if governing["life_h"] == refined and
                                   (basis != "shorter" or refined < iso) else "L10m")
    assert found["verdict"]["life"] == governing["symbol"]
    assert governing["alternative"]["life_h"] == pytest.approx(
        refined if governing["method"] == "iso281" else iso, rel=1e-12)


def test_refined_lives_are_named_reference_lives(tmp_path):
    found = refined_file(tmp_path, "refined", reliability_percent=99)
    assert found["governing_life"]["symbol"] == "L1mr"
    assert "ISO/TS 16281" in found["governing_life"]["basis"]
    assert found["lubrication"]["life_symbol"] == "L1mr"


def test_methods_that_disagree_on_the_target_say_so(tmp_path):
    both = refined_file(tmp_path, "shorter")
    iso, refined = both["iso281"]["system"]["l10m_h"], both["system"]["l10m_h"]
    between = (iso * refined) ** 0.5                     # a target one passes and one fails
    found = refined_file(tmp_path, "shorter", target_life_h=between)
    assert found["verdict"]["passed"] is False           # the shorter life governs
    kinds = [record["kind"] for record in found["warning_records"]]
    assert "methods_disagree" in kinds
    assert any("disagree" in text and "exponent 4" in text for text in found["warnings"])


def test_iso281_method_has_one_candidate_and_no_iso281_block(tmp_path):
    found = check(YARD_LOADER)
    assert found["iso281"] is None and found["governing_life"]["alternative"] is None
    assert found["governing_life"]["life_h"] == found["system"]["l10m_h"]
