"""Comparison output: rich tables and the JSON document of ``hubload compare``."""

from __future__ import annotations

import json

from rich.console import Console
from rich.table import Table
from rich.markup import escape

from hubload.report.cautions import CAUTIONS
from hubload.report.numbers import hours, json_number, safety, share
from hubload.report.series import MISSING, all_series, damage_shares_of, shaft_min_safety
from hubload.studies.compare import Comparison

# Keys of the check's JSON left out per file: the case table (summarised as damage shares)
# and the cautions (written once).
PER_CASE_KEYS = ("cases", "cautions")


def damage_shares(document: dict) -> list[dict]:
    """Each case's share of the pair's damage, for the life the verdict uses."""
    shares = damage_shares_of(document)
    return [{"case": case["name"], "share": share}
            for case, share in zip(document["cases"], shares.system(document))]


def compare_document(comparison: Comparison) -> dict:
    series = comparison.life_series()
    ratios = {item.key: comparison.ratios(item) for item in series}
    files = []
    for index, document in enumerate(comparison.documents):
        files.append({
            **{key: value for key, value in document.items() if key not in PER_CASE_KEYS},
            "damage_shares": damage_shares(document),
            "damage_life": damage_shares_of(document).life,
            "ratio_to_first": {label: None if values[index] is None else json_number(values[index])
                               for label, values in ratios.items()},
        })
    return {"files": files, "cautions": CAUTIONS}


def to_json(comparison: Comparison) -> str:
    return json.dumps(compare_document(comparison), indent=2)


def ratio_text(value: float | None) -> str:
    return "-" if value is None else f"x{value:.2f}"


def file_lines(comparison: Comparison) -> list[str]:
    return [f"#{i}: [bold]{escape(d['title'])}[/] ({escape(d['source'])})"
            for i, d in enumerate(comparison.documents, start=1)]


def lives_table(comparison: Comparison) -> Table:
    """Quantities in rows, files in columns (ratios against file #1 in brackets)."""
    documents = comparison.documents
    table = Table(title="Side by side (ratio against #1)", title_justify="left")
    table.add_column("")
    for index in range(1, len(documents) + 1):
        table.add_column(f"#{index}", justify="right")
    for item in comparison.life_series():
        values = item.values(documents)
        ratios = comparison.ratios(item)
        table.add_row(f"{item.label} h", *(
            hours(value) + ("" if index == 0 else f" ({ratio_text(ratios[index])})")
            for index, value in enumerate(values)))
    table.add_row("worst s0", *(worst_safety(d) for d in documents))
    shafts = [shaft_min_safety(d) for d in documents]
    if any(value is not MISSING for value in shafts):
        table.add_row("shaft min safety", *("-" if v is MISSING else safety(v) for v in shafts))
    table.add_row("verdict", *(verdict_text(d) for d in documents))
    if any(isinstance(d.get("overall_verdict"), dict) for d in documents):
        table.add_row("overall verdict", *(overall_text(d) for d in documents))
    table.add_row("dominant case", *(f"{dominant_text(d)}, {damage_shares_of(d).life}"
                                     for d in documents))
    return table


def worst_safety(document: dict) -> str:
    safeties = [s.values([document])[0] for s in all_series(document) if s.label.endswith(" s0")]
    return safety(min(safeties)) if safeties else "-"


def verdict_text(document: dict) -> str:
    verdict = document.get("verdict")
    if verdict is None:
        return "no target"
    return (f"[green]pass[/] ({verdict['life']})" if verdict["passed"]
            else f"[red]FAIL[/] ({verdict['life']})")


def overall_text(document: dict) -> str:
    overall = document.get("overall_verdict")
    if not isinstance(overall, dict):
        return "-"
    worst = (overall.get("worst") or {}).get("item", "")
    return "[green]pass[/]" if overall.get("passed") else f"[red]FAIL[/] ({worst})"


def dominant_text(document: dict) -> str:
    dominant = damage_shares_of(document).dominant(document)
    if dominant is None:
        return "none"
    _, name, value = dominant
    return f"{name} ({share(value)})"


def shares_table(index: int, document: dict) -> Table:
    shares = damage_shares_of(document)
    table = Table(title=f"#{index}: damage shares of the pair by case ({shares.life})",
                  title_justify="left")
    for heading, justify in (("case", "left"), ("share", "right"), ("", "left")):
        table.add_column(heading, justify=justify)
    dominant = (shares.dominant(document) or (None,))[0]
    for position, item in enumerate(damage_shares(document)):
        style = "bold" if position == dominant else None
        table.add_row(item["case"], share(item["share"]), bar(item["share"]), style=style)
    return table


def bar(value: float | None, width: int = 20) -> str:
    filled = round((value or 0.0) * width)
    return "[cyan]" + "█" * filled + "[/]" + "·" * (width - filled)


def render(comparison: Comparison, console: Console) -> None:
    for line in file_lines(comparison):
        console.print(line)
    console.print(lives_table(comparison))
    for index, document in enumerate(comparison.documents, start=1):
        console.print(shares_table(index, document))
    for document in comparison.documents:
        for warning in document.get("warnings", []):
            console.print(f"[yellow]Warning[/] ({escape(document['title'])}): {escape(warning)}")
    console.print(f"[dim]Caution: {CAUTIONS}[/]")
