"""Writing output files: never over a user's file without --force, never over an input,
never half-written.

Every output is written to a temporary file in the target's folder and then moved into
place in one step (a rename within one file system is atomic, POSIX rename(2)): a run
that is killed leaves the old file or none, never a truncated one. Without --force the
move itself refuses an existing file (a hard link fails if the name exists), so a file
that appeared while the run was working is not overwritten either.
"""

from __future__ import annotations

import contextlib
import os
import secrets
from collections.abc import Callable, Iterable, Iterator
from pathlib import Path

from hubload.errors import InputError

EXISTS = "exists already; not overwritten (add --force to replace it)"


def checked_output(path: str, force: bool, suffixes: tuple[str, ...] = (),
                   inputs: Iterable[str] = ()) -> Path:
    """``path`` as a Path, after checking its suffix and that it may be written.

    InputError (exit 2) when the suffix is not one of ``suffixes``, when the file
    exists and ``force`` is not given, when it is one of the run's ``inputs`` (even
    with ``force``), when it is a symbolic link to nothing, or when its folder does not
    exist.
    """
    target = Path(path)
    if any(same_file(target, Path(source)) for source in inputs):
        raise InputError("is an input of this run; an output may not replace it, not even "
                         "with --force (choose another name)", file=str(path))
    if suffixes and target.suffix.lower() not in suffixes:
        raise InputError(f"expected a file name ending in {' or '.join(suffixes)}, "
                         f"got '{target.name}'", file=str(path))
    if target.is_dir():
        raise InputError("is a folder; expected a file name", file=str(path))
    if target.is_symlink() and not target.exists():
        raise InputError("is a symbolic link to a file that does not exist; expected a plain "
                         "file name (remove the link or write elsewhere)", file=str(path))
    if target.exists() and not force:
        raise InputError(EXISTS, file=str(path))
    if not target.parent.exists():
        raise InputError(f"folder '{target.parent}' does not exist", file=str(path))
    return target


def same_file(first: Path, second: Path) -> bool:
    """Whether two paths name one file (through links, '..' or hard links)."""
    try:
        if first.exists() and second.exists():
            return os.path.samefile(first, second)
        return first.resolve() == second.resolve()
    except (OSError, RuntimeError):   # RuntimeError: a symbolic link loop
        return False


def write_text(path: str, text: str, force: bool, suffixes: tuple[str, ...] = (),
               inputs: Iterable[str] = ()) -> Path:
    """Write ``text`` (UTF-8) to ``path`` atomically, after the checks of checked_output."""
    return write_with(path, lambda temporary: temporary.write_text(text, encoding="utf-8"),
                      force, suffixes, inputs)


def write_with(path: str, write: Callable[[Path], object], force: bool,
               suffixes: tuple[str, ...] = (), inputs: Iterable[str] = ()) -> Path:
    """Call ``write`` on a temporary file beside ``path`` and move it into place."""
    target = checked_output(path, force, suffixes, inputs)
    try:
        with temporary_beside(target) as temporary:
            write(temporary)
            move_into_place(temporary, target, force)
    except FileExistsError:
        raise InputError(EXISTS, file=str(path)) from None
    except OSError as error:
        raise InputError(f"cannot write the file ({error.strerror or error})",
                         file=str(path)) from None
    return target


@contextlib.contextmanager
def temporary_beside(target: Path) -> Iterator[Path]:
    """A new empty file in the target's folder (same file system), removed unless moved."""
    temporary = target.with_name(f".{target.name}.{secrets.token_hex(4)}.tmp")
    # O_EXCL: a name nobody else holds; mode 0o666 less the umask, as for any new file
    os.close(os.open(temporary, os.O_WRONLY | os.O_CREAT | os.O_EXCL, 0o666))
    try:
        yield temporary
    finally:
        temporary.unlink(missing_ok=True)


def move_into_place(temporary: Path, target: Path, force: bool) -> None:
    """Rename over the target (``force``), or link without replacing (FileExistsError)."""
    if force:
        os.replace(temporary, target)
        return
    try:
        os.link(temporary, target)
    except FileExistsError:
        raise
    except OSError:   # a file system without hard links: the check just made must do
        if target.exists():
            raise FileExistsError(target) from None
        os.replace(temporary, target)
