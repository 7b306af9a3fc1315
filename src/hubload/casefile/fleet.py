"""The [fleet] and [reliability] tables of a load-case file, with command-line overrides.

The tables are validated with the rest of the file (schema/fileformat.py); here their
keys become a :class:`~hubload.domain.fleet.Fleet` and a
:class:`~hubload.domain.fleet.LifeModel`. An option of the same name as a key (``machines``
is ``--machines``) overrides it and is checked against the same limits; its errors name
the option.
"""

from __future__ import annotations

import math
from collections.abc import Mapping

from hubload.casefile.validate import validate_value
from hubload.domain.fleet import Fleet, LifeModel
from hubload.errors import InputError
from hubload.model.reliability import ISO281_SLOPE
from hubload.schema.fleetformat import FLEET, PER_MACHINE, RELIABILITY


def option_name(key: str) -> str:
    """The command-line option of a key: hours_per_year_median -> --hours-per-year-median."""
    return "--" + key.replace("_", "-")


def merged(table, given: Mapping | None, overrides: Mapping) -> tuple[dict, set]:
    """The validated table's keys with the overrides (validated by the same fields) on top,
    and the keys that came from options."""
    values = dict(given or {})
    from_options = set()
    for key, value in overrides.items():
        if value is None:
            continue
        field = table.field_named(key)
        values[key] = validate_value(value, field, option_name(key))
        from_options.add(key)
    return values, from_options


def read_life_model(given: Mapping | None, overrides: Mapping | None = None) -> LifeModel:
    """The distribution of [reliability] (validated), with ``distribution`` and
    ``weibull_slope`` overrides; a slope goes with the two-parameter Weibull only."""
    overrides = dict(overrides or {})
    if overrides.get("weibull_slope") is not None and overrides.get("distribution") is None:
        overrides["distribution"] = "weibull"   # a slope given alone means its distribution
    values, from_options = merged(RELIABILITY, given, overrides)
    kind = values.get("distribution", "iso281")
    slope = values.get("weibull_slope")

    def where(key: str) -> str:
        return option_name(key) if key in from_options else f"reliability.{key}"

    if kind == "weibull" and slope is None:
        raise InputError('distribution "weibull" needs its slope: give weibull_slope '
                         "(e.g. 1.5)", key_path=where("distribution"))
    if kind == "iso281" and slope is not None:
        raise InputError(f'expected no weibull_slope with distribution "iso281" (its slope is '
                         f'{ISO281_SLOPE:g}); set distribution = "weibull" to use '
                         f"{slope:g}", key_path=where("weibull_slope"))
    return LifeModel(kind, ISO281_SLOPE if slope is None else float(slope))


def refuse_wheel_ends_per_machine(written: object, overrides: Mapping) -> None:
    """A machine file's fleet counts the machine's own wheel ends: its [fleet] as written
    (before defaults) and the options may not set wheel_ends_per_machine."""
    where = option_name(PER_MACHINE) if overrides.get(PER_MACHINE) is not None else \
        f"fleet.{PER_MACHINE}" if isinstance(written, Mapping) and PER_MACHINE in written \
        else None
    if where is not None:
        raise InputError("a machine file's machine has its own wheel ends (the [[axle]] "
                         "blocks): expected no wheel_ends_per_machine", key_path=where)


def read_fleet(given: Mapping | None, overrides: Mapping | None = None) -> Fleet | None:
    """The fleet of [fleet] (validated) with option overrides; None when neither gives one."""
    overrides = {key: value for key, value in (overrides or {}).items() if value is not None}
    if given is None and not overrides:
        return None
    values, _ = merged(FLEET, given, overrides)
    for field in FLEET.fields:
        if field.required and field.key not in values:
            raise InputError(f"missing required key ({field.doc}); give it in [fleet] or as "
                             f"{option_name(field.key)}", key_path=f"fleet.{field.key}")
        if field.default is not None:
            values.setdefault(field.key, field.default)
    warranty_years = float(values["warranty_years"])
    return Fleet(
        machines=int(values["machines"]),
        usage_median_h_per_year=float(values["hours_per_year_median"]),
        warranty_years=warranty_years,
        years=int(values.get("years", max(1, math.ceil(warranty_years)))),
        usage_sigma_ln=float(values["hours_per_year_spread"]),
        wheel_ends_per_machine=int(values["wheel_ends_per_machine"]),
        warranty_cap_h=float(values.get("warranty_hours", math.inf)),
        calibration=float(values["calibration_factor"]))
