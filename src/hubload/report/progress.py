"""A progress bar (rich, on stderr) that appears only when a run lasts over a second."""

from __future__ import annotations

import time

from rich.console import Console
from rich.progress import BarColumn, Progress, TextColumn, TimeRemainingColumn

SHOW_AFTER_S = 1.0


class LateProgress:
    """Callable ``(done, total)`` for long loops; shows nothing for short runs.

    Use as a context manager so the bar is removed when the work ends.
    """

    def __init__(self, description: str, console: Console | None = None):
        self.description = description
        self.console = console or Console(stderr=True)
        self.started = time.perf_counter()
        self.progress: Progress | None = None
        self.task = None

    def __call__(self, done: int, total: int) -> None:
        if self.progress is None:
            if time.perf_counter() - self.started < SHOW_AFTER_S or done >= total:
                return
            self.progress = Progress(TextColumn("{task.description}"), BarColumn(),
                                     TextColumn("{task.completed}/{task.total}"),
                                     TimeRemainingColumn(), console=self.console,
                                     transient=True)
            self.progress.start()
            self.task = self.progress.add_task(self.description, total=total)
        self.progress.update(self.task, completed=done, total=total)

    def __enter__(self) -> "LateProgress":
        return self

    def __exit__(self, *_exc) -> None:
        if self.progress is not None:
            self.progress.stop()
