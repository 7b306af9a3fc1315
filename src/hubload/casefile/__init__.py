"""Load-case files: TOML parsing, validation against the format, conversion to SI.

``load_study(path)`` is the entry point; every problem raises
:class:`hubload.errors.InputError` naming the file and the key path.
"""

from hubload.casefile.load import load_study, study_from_document

__all__ = ["load_study", "study_from_document"]
