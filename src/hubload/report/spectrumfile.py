"""A classed spectrum written as a new load-case file (``hubload check`` runs on it)."""

from __future__ import annotations

import tomli_w

from hubload.casefile.validate import MAX_STRING_CHARS
from hubload.domain.study import Cases
from hubload.report.usertext import plain
from hubload.units import KN

SIGNIFICANT = 10


def rounded(value) -> float:
    """A plain float to 10 significant digits (far below any classing error)."""
    return float(f"{float(value):.{SIGNIFICANT}g}")


def case_blocks(cases: Cases, temperature_c=None) -> list[dict]:
    blocks = [{
        "name": name,
        "time_percent": rounded(100.0 * cases.time_fraction[i]),
        "wheel_load_kN": rounded(cases.wheel_load_n[i] / KN),
        "side_force_kN": rounded(cases.side_force_n[i] / KN),
        "tractive_force_kN": rounded(cases.tractive_force_n[i] / KN),
        "speed_rpm": rounded(cases.speed_rpm[i]),
    } for i, name in enumerate(cases.names)]
    if temperature_c is not None:
        for block, value in zip(blocks, temperature_c):
            block["temperature_C"] = rounded(value)
    return blocks


def spectrum_text(machine: dict, cases: Cases, log_name: str, title: str,
                  temperature_c=None) -> str:
    """The case file's machine tables with the classed spectrum as its [[case]] blocks."""
    document = {key: value for key, value in machine.items()}
    title = f"{title}, spectrum of {log_name}"
    if len(title) > MAX_STRING_CHARS:  # the file must pass the check it is written for
        title = title[:MAX_STRING_CHARS - 3] + "..."
    document["project"] = {**machine.get("project", {}), "title": title}
    log_name = plain(" ".join(log_name.splitlines()))  # one comment line
    document["case"] = case_blocks(cases, temperature_c)
    header = (f"# Duty spectrum classed from the log {log_name} by hubload spectrum:\n"
              "# time-at-level classes; each case holds a class's share of time, its mean\n"
              "# speed and the revolution-weighted power mean (p = 10/3) of each force.\n\n")
    return header + tomli_w.dumps(document)
