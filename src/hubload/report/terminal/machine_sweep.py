"""``hubload sweep`` of a machine file on the terminal: per point the machine's life, each
wheel end's, the weakest wheel end and the verdict (report/specs/machine_sweep.py)."""

from __future__ import annotations

from rich.console import Console
from rich.text import Text

from hubload.report.cautions import CAUTIONS
from hubload.report.specs.machine_sweep import point_table
from hubload.report.terminal.tables import render as render_table
from hubload.report.usertext import plain
from hubload.studies.machine_sweep import MachineSweep


def render(sweep: MachineSweep, console: Console) -> None:
    console.print(Text.assemble((plain(sweep.title), "bold"), f"  ({plain(sweep.source)})"))
    render_table(point_table(sweep), console)
    console.print(Text(f"Caution: {CAUTIONS}", style="dim"))
