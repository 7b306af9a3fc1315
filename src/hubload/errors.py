"""The one error type users see: bad input, named by file and key path."""

from __future__ import annotations


class InputError(Exception):
    """Bad user input. Rendered as one line ``FILE: key.path: message``; exit status 2."""

    def __init__(self, message: str, file: str | None = None, key_path: str | None = None):
        super().__init__(message)
        self.message = message
        self.file = file
        self.key_path = key_path

    def __str__(self) -> str:
        parts = [part for part in (self.file, self.key_path) if part]
        return ": ".join([*parts, self.message])

    def located(self, file: str) -> "InputError":
        """The same error, naming ``file`` if it named none yet."""
        return self if self.file else InputError(self.message, file, self.key_path)
