"""The tables of a load-case file that only ``hubload forecast`` reads: the fleet and the life
distribution (a contract: keys may be added, never renamed)."""

from __future__ import annotations

from hubload.schema.limits import MAX_TARGET_LIFE_H
from hubload.schema.spec import Field, Table

# Fleet forecasts (hubload forecast): a fleet of up to 100,000 machines with up to 16 wheel ends
# keeps the exact count distribution (support machines x bearings + 1) within a few MB; no
# machine runs more than the 8,784 hours of a leap year; a lognormal usage spread sigma of 1.2
# (one standard deviation a factor 3.3) is wider than any fleet's (common practice), and the
# forecast's quadrature is converged to it (model/fleet_forecast.py); 50 years outlast any
# machine.
MAX_MACHINES, MAX_WHEEL_ENDS, HOURS_PER_YEAR = 100_000, 16, 8784.0
# A machine in service runs at least an hour a year; below it the forecast's times underflow
# (common practice).
MIN_HOURS_PER_YEAR = 1.0
MAX_USAGE_SIGMA, MAX_FORECAST_YEARS = 1.2, 50
# Weibull slopes of rolling-bearing fatigue lie near 1.1 to 1.5 (ISO 281's distribution: 1.5);
# 0.3 to 10 covers early failures to wear-out (common practice). A calibration factor from
# field data beyond 100 either way points to a wrong model, not a correction.
MIN_WEIBULL_SLOPE, MAX_WEIBULL_SLOPE, MAX_CALIBRATION = 0.3, 10.0, 100.0

FLEET = Table(
    name="fleet",
    required=False,
    doc="A fleet of machines that carry this wheel end (or, in a machine file, of this "
        "machine), for `hubload forecast`: expected failures per year and within the warranty "
        "(docs/reliability.md). The check does not use it. Options of the same names override "
        "the keys.",
    fields=(
        Field("machines", "integer", "Machines in the fleet, all put into service together.",
              required=True, minimum=1, maximum=MAX_MACHINES, example=400),
        Field("wheel_ends_per_machine", "integer", "Wheel ends like this file's on each machine "
              "(all on the same duty; not in a machine file, whose machine has its own).", default=1, minimum=1, maximum=MAX_WHEEL_ENDS,
              example=4),
        Field("hours_per_year_median", "number", "Median operating hours per machine and year "
              "[h] (half the fleet runs less, half more).", required=True,
              minimum=MIN_HOURS_PER_YEAR,
              maximum=HOURS_PER_YEAR, example=1200),
        Field("hours_per_year_spread", "number", "Spread of the yearly hours over the fleet: "
              "the standard deviation sigma of ln(hours per year), lognormal (0: every machine "
              "runs the median; 0.5: a sixth of the fleet runs more than 1.65 x the median).",
              default=0.0, minimum=0, maximum=MAX_USAGE_SIGMA, example=0.5),
        Field("years", "integer", "Years of the forecast (default: the warranty's, rounded up).",
              minimum=1, maximum=MAX_FORECAST_YEARS, example=5),
        Field("warranty_years", "number", "Warranty period from delivery [years].",
              required=True, exclusive_minimum=0, maximum=MAX_FORECAST_YEARS, example=2),
        Field("warranty_hours", "number", "Operating hours that end the warranty earlier "
              "[h] (optional).", exclusive_minimum=0, maximum=MAX_TARGET_LIFE_H, example=3000),
        Field("calibration_factor", "number", "Multiplies every predicted life (field B10 / "
              "predicted B10, from `hubload field --against`; default 1).", default=1.0,
              minimum=1.0 / MAX_CALIBRATION, maximum=MAX_CALIBRATION, example=1.0),
    ),
)

RELIABILITY = Table(
    name="reliability",
    required=False,
    doc="The life distribution behind `hubload forecast` and `hubload field --against` "
        "(docs/reliability.md). The check does not use it.",
    fields=(
        Field("distribution", "string", "iso281: the distribution behind ISO 281's a1 "
              "(three-parameter Weibull, slope 1.5, minimum life 0.05 L10); weibull: "
              "two-parameter Weibull with weibull_slope.", default="iso281",
              choices=("iso281", "weibull")),
        Field("weibull_slope", "number", "Weibull slope beta of the two-parameter distribution "
              "(needed by distribution = \"weibull\", e.g. 1.1 to 1.5 for rolling-bearing "
              "fatigue; not with iso281, whose slope is 1.5).", minimum=MIN_WEIBULL_SLOPE,
              maximum=MAX_WEIBULL_SLOPE),
    ),
)

# The key that a machine file's [fleet] refuses: the machine has its own wheel ends.
PER_MACHINE = "wheel_ends_per_machine"

# Tables that only `hubload forecast` reads: a sweep of their keys would change nothing.
FORECAST_TABLES = (FLEET.name, RELIABILITY.name)
