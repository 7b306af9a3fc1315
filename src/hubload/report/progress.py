"""A progress bar (rich, on stderr) that appears only when a run lasts over a second.

Never on anything but a terminal: when stderr is a pipe, a file or click's CliRunner, the
bar draws nothing at all (no thread is started), so logs and ``--json`` output stay clean.
The bar appears after SHOW_AFTER_S even when the work calls back rarely or not at all (a
timer starts it): a file being parsed or a JSON document being built shows a pulsing bar.
"""

from __future__ import annotations

import sys
import threading

SHOW_AFTER_S = 1.0


def on_terminal(stream) -> bool:
    """True when ``stream`` is a terminal: the stream itself must say so (rich also believes
    FORCE_COLOR, which CI sets on pipes)."""
    isatty = getattr(stream, "isatty", None)
    try:
        return bool(isatty is not None and isatty())
    except ValueError:     # a closed stream
        return False


def progress_bar(console):
    """The bar: words, bar, share done (the count, e.g. of rows, while the total is unknown)
    and time.

    rich loads here, on a terminal only: ``check --json`` into a pipe never imports it."""
    from rich.progress import BarColumn, Progress, ProgressColumn, TextColumn, \
        TimeElapsedColumn
    from rich.text import Text

    class ShareColumn(ProgressColumn):
        def render(self, task) -> Text:
            if task.total is None:
                return Text(f"{int(task.completed):,}" if task.completed else "")
            return Text(f"{task.percentage:3.0f} %")

    # stdout is never redirected into the bar: it may be a JSON document
    return Progress(TextColumn("{task.description}"), BarColumn(), ShareColumn(),
                    TimeElapsedColumn(), console=console, transient=True,
                    redirect_stdout=False, redirect_stderr=False)


class LateProgress:
    """Callable ``(done, total)`` for long work; shows nothing for short runs.

    Use as a context manager so the bar is removed when the work ends, and end it before
    anything is printed on stdout. ``phase(description)`` starts the next stage of a
    command's work (reading, computing, writing) on the same bar; ``total`` None pulses.
    """

    def __init__(self, description: str, console=None, show_after_s: float | None = None):
        self.console = console      # a rich Console; by default one on stderr
        self.enabled = on_terminal(sys.stderr if console is None else console.file)
        self.show_after_s = SHOW_AFTER_S if show_after_s is None else show_after_s
        self.description = description
        self.done, self.total = 0, None
        self.lock = threading.Lock()
        self.timer = None
        self.bar = None           # the rich Progress, made on a terminal only
        self.task = None          # its one task, once shown
        self.closed = False

    def __call__(self, done: int, total: int | None) -> None:
        if not self.enabled:
            return
        with self.lock:
            self.done, self.total = done, total
            if self.task is not None:
                self.bar.update(self.task, completed=done, total=total)

    def phase(self, description: str, total: int | None = None) -> "LateProgress":
        """The next stage of the work: its words, the bar back at the start."""
        if self.enabled:
            with self.lock:
                self.description, self.done, self.total = description, 0, total
                if self.task is not None:   # a new task: rich cannot unset a total
                    self.bar.remove_task(self.task)
                    self.add_task()
        return self

    def add_task(self) -> None:
        self.task = self.bar.add_task(self.description, total=self.total,
                                      completed=self.done)

    def show(self) -> None:
        with self.lock:
            if self.closed or self.task is not None:
                return
            self.add_task()
            self.bar.start()

    def __enter__(self) -> "LateProgress":
        if self.enabled:
            if self.console is None:
                from rich.console import Console

                self.console = Console(stderr=True)
            self.enabled = self.console.is_terminal     # e.g. TTY_COMPATIBLE=0
        if self.enabled:
            self.bar = progress_bar(self.console)
            self.timer = threading.Timer(self.show_after_s, self.show)
            self.timer.daemon = True
            self.timer.start()
        return self

    def __exit__(self, *_exc) -> None:
        if self.timer is not None:
            self.timer.cancel()
        with self.lock:
            self.closed = True
            if self.task is not None:
                self.bar.stop()
