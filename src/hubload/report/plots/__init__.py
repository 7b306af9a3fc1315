"""Charts (matplotlib, Agg canvas: no display needed): sweeps, comparisons, damage shares.

Figures are built with matplotlib's object API (no pyplot state) and written as
PNG or SVG by the file name's extension, or returned as inline SVG text for the
HTML report. Every chart carries the cautions in its footer.
"""

from __future__ import annotations

import contextlib
import functools
import io
import textwrap
import warnings
from collections.abc import Iterable
from pathlib import Path

import matplotlib
import numpy as np
from matplotlib.backends.backend_agg import FigureCanvasAgg
from matplotlib.figure import Figure
from matplotlib.text import Text
from matplotlib.ticker import FixedFormatter, FuncFormatter

from hubload.report.cautions import CAUTIONS
from hubload.report.files import write_with
from hubload.report.usertext import plain

PLOT_SUFFIXES = (".png", ".svg")
STYLE = {"svg.fonttype": "path", "svg.hashsalt": "hubload", "font.size": 9,
         "axes.grid": True, "grid.alpha": 0.3, "axes.spines.top": False,
         "axes.spines.right": False}
TARGET_COLOUR = "#c0392b"
SYSTEM_COLOUR = "#111111"
BEARING_COLOURS = ("#1f77b4", "#ff7f0e", "#2ca02c", "#9467bd")
CAUTION_POINTS = 6


def styled(build):
    """Run a figure builder with the house style in effect (rc settings apply at build time)."""
    @functools.wraps(build)
    def wrapper(*args, **kwargs):
        with matplotlib.rc_context(STYLE):
            return build(*args, **kwargs)
    return wrapper


def drawable(values, log_scale: bool = False) -> np.ndarray:
    """Values as floats; NaN (a gap in the line) where infinite, undefined or, on a log scale,
    not positive (a zero life)."""
    array = np.asarray(values, dtype=float)
    shown = np.isfinite(array) & (array > 0) if log_scale else np.isfinite(array)
    return np.where(shown, array, np.nan)


def new_figure(width_in: float, height_in: float) -> Figure:
    figure = Figure(figsize=(width_in, height_in), dpi=110, layout="constrained")
    FigureCanvasAgg(figure)
    return figure


def add_caution(figure: Figure) -> None:
    """The cautions in the footer, with room kept for them whatever the figure's height."""
    lines = textwrap.wrap("Caution: " + CAUTIONS, width=150)
    footer_in = len(lines) * CAUTION_POINTS * 1.4 / 72 + 0.08
    bottom = footer_in / figure.get_figheight()
    figure.get_layout_engine().set(rect=(0, bottom, 1, 1 - bottom))
    figure.text(0.01, 0.005, "\n".join(lines), fontsize=CAUTION_POINTS, color="#555555",
                va="bottom")


def printable(figure: Figure) -> Figure:
    """``figure`` with control characters and escape sequences taken out of every text (names
    and titles come from the user's file; a font has no glyph for them)."""
    def cleaned(shown: str) -> str:
        return plain(shown).replace("\t", " ")

    for text in figure.findobj(Text):
        if cleaned(text.get_text()) != text.get_text():
            text.set_text(cleaned(text.get_text()))
    for axis in (axis for axes in figure.axes for axis in (axes.xaxis, axes.yaxis)):
        labels = axis.get_major_formatter()    # tick labels are drawn from it later
        if isinstance(labels, FixedFormatter):
            labels.seq = [cleaned(str(label)) for label in labels.seq]
        elif isinstance(labels, FuncFormatter):   # what set_ticks(..., labels) makes
            labels.func = functools.partial(lambda given, *args: cleaned(str(given(*args))),
                                            labels.func)
    return figure


@contextlib.contextmanager
def missing_glyphs_unreported():
    """A name in a script the plot font lacks (CJK, emoji) is drawn as boxes, without the
    font's warning on stderr: the terminal and the JSON show it as given."""
    with warnings.catch_warnings():
        warnings.filterwarnings("ignore", message="Glyph .* missing from font")
        yield


def save(figure: Figure, path: str, force: bool, inputs: Iterable[str] = ()) -> None:
    """Write ``figure`` as PNG or SVG (by extension), atomically; never over a file without
    ``force``, never over one of the run's ``inputs``."""
    kind = Path(path).suffix.lower().lstrip(".")

    def draw(temporary: Path) -> None:
        with matplotlib.rc_context(STYLE), missing_glyphs_unreported():
            printable(figure).savefig(temporary, format=kind)

    write_with(path, draw, force, PLOT_SUFFIXES, inputs)


def svg_text(figure: Figure) -> str:
    """The figure as an inline <svg> element (no XML prolog, text drawn as paths)."""
    buffer = io.StringIO()
    with matplotlib.rc_context(STYLE), missing_glyphs_unreported():
        printable(figure).savefig(buffer, format="svg")
    text = buffer.getvalue()
    return text[text.index("<svg"):]
