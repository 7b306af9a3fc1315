"""The ``on_progress(done, total)`` callbacks that long work calls; nothing here draws.

The engine, the studies and the logs take an optional ``on_progress`` and call it as work
advances: ``done`` of ``total`` units (blocks of cases, points, root searches, rows), and
``total`` may be None when it is not known in advance (a CSV log's rows). The report layer
draws them (``report.progress.LateProgress``); a notebook may pass any callable. This
module imports nothing of hubload, so every layer may use it.
"""

from __future__ import annotations

from collections.abc import Callable

OnProgress = Callable[[int, "int | None"], None]


def ignore(_done: int, _total: int | None) -> None:
    """The callback of work nobody watches."""


def in_parts(on_progress: OnProgress | None, parts: int) -> list[OnProgress]:
    """One callback per part of work done in ``parts`` equal parts one after the other.

    Part ``i`` reporting ``done`` of ``total`` reports ``i * total + done`` of
    ``parts * total`` to ``on_progress``: the refined solve at both ends of a setting band,
    or point by point, reports as one bar.
    """
    if on_progress is None:
        return [ignore] * parts

    def part(index: int) -> OnProgress:
        def report(done: int, total: int | None) -> None:
            on_progress(index * total + done if total else done,
                        parts * total if total else None)
        return report

    return [part(index) for index in range(parts)]
