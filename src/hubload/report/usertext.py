"""User text (names and titles from the user's files) made safe to show: the terminal, plots,
workbooks and HTML hold no escape sequences or control characters."""

from __future__ import annotations

import re

# Terminal escape sequences whole (ECMA-48: CSI ... final byte, OSC ... BEL or ST, and the
# two-byte ones), so that no remnant like "[31m" stays behind; then any control character.
ESCAPE_SEQUENCE = re.compile(r"(\x1b\[|\x9b)[0-?]*[ -/]*[@-~]?"
                             r"|(\x1b[\]PX^_]|[\x90\x98\x9d\x9e\x9f]).*?(\x07|\x1b\\|\x9c|$)"
                             r"|\x1b[ -/]*[0-~]?", re.DOTALL)
CONTROL = re.compile(r"[\x00-\x08\x0b-\x1f\x7f-\x9f]")
LINE_BREAKS = re.compile(r"[\r\n\t]+")


def plain(text: str) -> str:
    """``text`` with escape sequences and control characters removed (line breaks and tabs
    stay).

    >>> plain("wheel \\x1b[31mred\\x1b[0m\\x07")
    'wheel red'
    """
    return CONTROL.sub("", ESCAPE_SEQUENCE.sub("", str(text)))


def one_line(text: str) -> str:
    """:func:`plain` text on one line: line breaks and tabs become spaces (a name that
    breaks would split a table row, a Markdown heading or an error line).

    >>> one_line("front\\r\\nleft\\twheel")
    'front left wheel'
    """
    return LINE_BREAKS.sub(" ", plain(text))
