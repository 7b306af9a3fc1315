"""``hubload compare`` on the terminal: lives side by side, ratios, damage shares per file."""

from __future__ import annotations

from rich.console import Console
from rich.table import Table
from rich.text import Text

from hubload.engine import Result
from hubload.report.cautions import CAUTIONS
from hubload.report.columns import CASE_ROWS_SHOWN, most_damaging
from hubload.report.messages import summary_lines
from hubload.report.numbers import hours, safety, share
from hubload.report.quantities import ratios_to_first, shared_life_quantities
from hubload.report.usertext import plain
from hubload.studies.compare import Comparison


def ratio_text(value: float | None) -> str:
    return "-" if value is None else f"x{value:.2f}"


def lives_table(comparison: Comparison) -> Table:
    """Quantities in rows, files in columns (ratios against file #1 in brackets)."""
    results = comparison.results
    table = Table(title="Side by side (ratio against #1)", title_justify="left")
    table.add_column("")
    for index in range(1, len(results) + 1):
        table.add_column(f"#{index}", justify="right")
    for item in shared_life_quantities(results, repeat_governing=False):
        found = ratios_to_first(results, item)
        table.add_row(f"{item.label} h", *(
            hours(float(item.of(r))) + ("" if index == 0 else f" ({ratio_text(found[index])})")
            for index, r in enumerate(results)))
    table.add_row("worst s0", *(safety(r.lowest_static_safety) for r in results))
    if any(r.shaft is not None for r in results):
        table.add_row("shaft min safety", *(
            "-" if r.lowest_shaft_safety is None else safety(r.lowest_shaft_safety)
            for r in results))
    table.add_row("verdict", *(verdict_text(r) for r in results))
    if any(r.shaft is not None and r.overall is not None for r in results):
        table.add_row("overall verdict", *(overall_text(r) for r in results))
    table.add_row("dominant case", *(dominant_text(r) for r in results))
    return table


def verdict_text(result: Result) -> Text:
    found = result.verdict
    if found is None:
        return Text("no target")
    return Text.assemble(("pass", "green") if found.passed else ("FAIL", "bold red"),
                         f" ({found.life_name})")


def overall_text(result: Result) -> Text:
    found = result.overall
    if found is None or result.shaft is None:
        return Text("-")
    if found.passed:
        return Text("pass", style="green")
    return Text.assemble(("FAIL", "bold red"), f" ({found.worst.name})")


def dominant_text(result: Result) -> Text:
    index = result.dominant_case
    if index is None:
        return Text("none")
    shares = result.governing.system_damage_share
    return Text(f"{plain(result.study.cases.names[index])} ({share(shares[index])}), "
                f"{result.governing.symbol}")


def shares_table(index: int, result: Result) -> Table:
    governing = result.governing
    shares = governing.system_damage_share
    names = result.study.cases.names
    table = Table(title=f"#{index}: damage shares of the pair by case ({governing.symbol})",
                  title_justify="left")
    for heading, justify in (("case", "left"), ("share", "right"), ("", "left")):
        table.add_column(heading, justify=justify)
    rows = most_damaging(shares, CASE_ROWS_SHOWN) or range(len(names))
    dominant = result.dominant_case
    for position in rows:
        table.add_row(Text(plain(names[position])), share(shares[position]),
                      bar(shares[position]), style="bold" if position == dominant else None)
    if len(rows) < len(names):
        table.caption = f"the {len(rows)} most damaging of {len(names):,} cases"
    return table


def bar(value: float, width: int = 20) -> Text:
    filled = round(float(value) * width)
    return Text.assemble(("█" * filled, "cyan"), "·" * (width - filled))


def render(comparison: Comparison, console: Console) -> None:
    for index, result in enumerate(comparison.results, start=1):
        console.print(Text.assemble(f"#{index}: ", (plain(result.study.title), "bold"),
                                    f" ({plain(result.study.source)})"))
    console.print(lives_table(comparison))
    for index, result in enumerate(comparison.results, start=1):
        console.print(shares_table(index, result))
    for result in comparison.results:
        for line in summary_lines(result.findings, result.study.cases.names):
            console.print(Text.assemble(("Warning", "yellow"),
                                        f" ({plain(result.study.title)}): {plain(line)}"))
    console.print(Text(f"Caution: {CAUTIONS}", style="dim"))
