"""The machine of a load-case file without its duty spectrum (for measured logs).

A log brings its own operating points, so the file's ``[[case]]`` blocks (or its
``[cases]`` table, which is not read) are ignored and may be absent; wheel, pair and every other table are validated
as usual.
"""

from __future__ import annotations

from pathlib import Path

from hubload.casefile.load import read_toml, study_from_document
from hubload.domain.study import Study
from hubload.errors import InputError

PLACEHOLDER_CASE = {"name": "placeholder", "time_percent": 100.0, "wheel_load_kN": 0.0,
                    "speed_rpm": 0.0}


def load_machine(path: str | Path) -> tuple[Study, dict]:
    """The study (with a placeholder case) and the parsed document of ``path``."""
    file = str(path)
    machine = {key: value for key, value in read_toml(path).items()
               if key not in ("case", "cases")}
    try:
        study = study_from_document({**machine, "case": [PLACEHOLDER_CASE]}, source=file)
    except InputError as error:
        raise error.located(file) from None
    return study, machine
