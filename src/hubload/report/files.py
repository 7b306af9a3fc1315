"""Writing output files: never over a user's file without --force."""

from __future__ import annotations

from pathlib import Path

from hubload.errors import InputError


def checked_output(path: str, force: bool, suffixes: tuple[str, ...] = ()) -> Path:
    """``path`` as a Path, after checking its suffix and that it may be written.

    InputError (exit 2) when the suffix is not one of ``suffixes``, when the file
    exists and ``force`` is not given, or when its folder does not exist.
    """
    target = Path(path)
    if suffixes and target.suffix.lower() not in suffixes:
        raise InputError(f"expected a file name ending in {' or '.join(suffixes)}, "
                         f"got '{target.name}'", file=str(path))
    if target.is_dir():
        raise InputError("is a folder; expected a file name", file=str(path))
    if target.exists() and not force:
        raise InputError("exists already; not overwritten (add --force to replace it)",
                         file=str(path))
    if not target.parent.exists():
        raise InputError(f"folder '{target.parent}' does not exist", file=str(path))
    return target


def write_text(path: str, text: str, force: bool, suffixes: tuple[str, ...] = ()) -> Path:
    target = checked_output(path, force, suffixes)
    try:
        target.write_text(text, encoding="utf-8")
    except OSError as error:
        raise InputError(f"cannot write the file ({error.strerror})", file=str(path)) from None
    return target
