"""ISO 281:2007 modified rating life: lubrication, contamination and reliability.

Everything here is for roller bearings (the tapered pair of a wheel-hub motor),
numpy-vectorised, SI units at the interface (m, m^2/s, K, N); the standard's
own units (mm, mm^2/s, r/min) are used only inside the formulas that need them.
Clause and table numbers of ISO 281:2007 are quoted from memory.

References
----------
[1] ASTM D341, Standard practice for viscosity-temperature equations and
    charts for liquid petroleum or hydrocarbon products (Walther form
    log10 log10(nu + 0.7) = A - B log10 T, nu in mm^2/s, T in K; valid for
    nu >= 2 mm^2/s -- lower viscosities need the extra terms of newer editions).
[2] ISO 281:2007, Rolling bearings -- Dynamic load ratings and rating life,
    9.3.3: viscosity ratio kappa = nu / nu1 with the reference viscosity
    nu1 = 45000 n^-0.83 dm^-0.5 (n < 1000 r/min) or 4500 n^-0.5 dm^-0.5
    (n >= 1000 r/min); n in r/min, dm in mm, nu1 in mm^2/s.
[3] ISO 281:2007, 9.3.5 (figure 4 and its equations): aISO for radial roller
    bearings, aISO = 0.1 [1 - (1.5859 - k1 / kappa^k2) (eC Cu / P)^0.4]^-9.185
    with (k1, k2) = (1.3993, 0.054381) for 0.1 <= kappa < 0.4,
    (1.2348, 0.19087) for 0.4 <= kappa < 1 and (1.2348, 0.071739) for
    1 <= kappa <= 4; kappa > 4 is taken as 4; aISO <= 50. Constants from memory.
[4] ISO 281:2007, annex A: contamination factor eC = a (1 - c / dm^(1/3)),
    a = k kappa^0.68 dm^0.55 with a <= 1 and 0 <= eC <= 1; the constants (k, c)
    depend on the lubrication method and cleanliness (the tables of annex A
    for oil with on-line filtration, oil without filtration or with off-line
    filtration, and grease; values from memory, see CONTAMINATION_LEVELS).
[5] ISO 281:2007, annex B: fatigue load limit of roller bearings estimated
    from the static rating, Cu = C0 / 8.2 for dm <= 100 mm and
    Cu = C0 / 8.2 (100 / dm)^0.3 for dm > 100 mm (from memory).
[6] ISO 281:2007, 9.2 and table 12: life modification factor for reliability,
    a1 = 0.95 (ln(100/R) / ln(100/90))^(2/3) + 0.05 for 90 <= R <= 99.95 %;
    a three-parameter Weibull distribution with slope 1.5 and minimum life
    0.05 L10 (T. A. Harris, M. N. Kotzalas, Essential Concepts of Bearing
    Technology, 5th ed., 2007, discuss its background; from memory).
[7] ISO 4406:1999, Hydraulic fluid power -- Fluids -- Method for coding the
    level of contamination by solid particles: code R4/R6/R14 for particles
    larger than 4, 6 and 14 um(c); the cumulative counts make R4 >= R6 >= R14.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.units import CELSIUS_ZERO_K, MM

WALTHER_CONSTANT_MM2_S = 0.7
TEMPERATURE_40C_K = CELSIUS_ZERO_K + 40.0
TEMPERATURE_100C_K = CELSIUS_ZERO_K + 100.0
WALTHER_LOWEST_VISCOSITY_M2_S = 2e-6
MM2_S = 1e-6

KAPPA_SCOPE_MIN = 0.1
KAPPA_EVALUATION_MAX = 4.0
A_ISO_MAX = 50.0
RELIABILITY_MIN_PERCENT = 90.0
RELIABILITY_MAX_PERCENT = 99.95
A1_WEIBULL_SLOPE = 1.5
A1_MINIMUM_LIFE_RATIO = 0.05

CU_STATIC_RATIO_ROLLER = 8.2
CU_SIZE_LIMIT_MM = 100.0
CU_SIZE_EXPONENT_ROLLER = 0.3


def walther_coefficients(temperature_1_k, viscosity_1_m2_s, temperature_2_k, viscosity_2_m2_s):
    """(A, B) of the Walther line through two (temperature [K], viscosity [m^2/s]) points [1].

    log10 log10(nu + 0.7) = A - B log10 T with nu in mm^2/s and T in K.
    """
    z_1 = np.log10(np.log10(np.asarray(viscosity_1_m2_s) / MM2_S + WALTHER_CONSTANT_MM2_S))
    z_2 = np.log10(np.log10(np.asarray(viscosity_2_m2_s) / MM2_S + WALTHER_CONSTANT_MM2_S))
    log_t1, log_t2 = np.log10(temperature_1_k), np.log10(temperature_2_k)
    slope_b = (z_1 - z_2) / (log_t2 - log_t1)
    return z_1 + slope_b * log_t1, slope_b


def walther_viscosity_m2_s(temperature_k, intercept_a, slope_b):
    """Kinematic viscosity [m^2/s] at ``temperature_k`` [K] on a Walther line (A, B) [1]."""
    z = intercept_a - slope_b * np.log10(temperature_k)
    return (np.power(10.0, np.power(10.0, z)) - WALTHER_CONSTANT_MM2_S) * MM2_S


def oil_viscosity_m2_s(temperature_k, viscosity_40c_m2_s, viscosity_100c_m2_s):
    """Viscosity [m^2/s] at ``temperature_k`` [K] of an oil given at 40 and 100 C [1]."""
    a, b = walther_coefficients(TEMPERATURE_40C_K, viscosity_40c_m2_s,
                                TEMPERATURE_100C_K, viscosity_100c_m2_s)
    return walther_viscosity_m2_s(temperature_k, a, b)


def reference_viscosity_m2_s(speed_rpm, mean_diameter_m):
    """Reference viscosity nu1 [m^2/s] needed for adequate lubrication [2].

    Speed [r/min] > 0, mean diameter dm = (d + D) / 2 [m]; inf at standstill.
    """
    speed = np.asarray(speed_rpm, dtype=float)
    dm_mm = np.asarray(mean_diameter_m, dtype=float) / MM
    moving = np.where(speed > 0, speed, 1.0)
    slow = speed < 1000.0      # one power per case, with the exponent of its speed range
    nu1_mm2_s = (np.where(slow, 45000.0, 4500.0) * np.power(moving, np.where(slow, -0.83, -0.5))
                 / np.sqrt(dm_mm))
    return np.where(speed > 0, nu1_mm2_s * MM2_S, np.inf)


def viscosity_ratio(viscosity_m2_s, reference_viscosity_m2_s_):
    """kappa = nu / nu1 [2]; 0 at standstill (nu1 infinite)."""
    return np.asarray(viscosity_m2_s) / np.asarray(reference_viscosity_m2_s_)


def kappa_outside_scope(kappa):
    """True where kappa < 0.1, below the range of the aISO equations [3]."""
    return np.asarray(kappa) < KAPPA_SCOPE_MIN


@dataclass(frozen=True)
class ContaminationLevel:
    """One row of ISO 281 annex A: eC = a (1 - c / dm^(1/3)), a = k kappa^0.68 dm^0.55 [4]."""

    label: str
    k: float
    c: float


def oil_rows(pairs) -> tuple[ContaminationLevel, ...]:
    return tuple(ContaminationLevel(f"-/{r6}/{r14}", k, c) for (r6, r14), k, c in pairs)


ISO4406_ROWS = ((13, 10), (15, 12), (17, 14), (19, 16), (21, 18))

# Constants of ISO 281:2007 annex A, recalled from memory; rows from clean to dirty.
CONTAMINATION_LEVELS: dict[str, tuple[ContaminationLevel, ...]] = {
    "oil-filtered": oil_rows(zip(ISO4406_ROWS, (0.0864, 0.0432, 0.0288, 0.0216, 0.0177),
                                 (0.5663, 0.9987, 1.6329, 2.3362, 3.5014))),
    "oil-unfiltered": oil_rows(zip(ISO4406_ROWS, (0.0864, 0.0288, 0.0133, 0.00864, 0.00411),
                                   (0.6796, 1.141, 1.67, 2.5164, 3.8974))),
    "grease": (ContaminationLevel("high", 0.0864, 0.6796),
               ContaminationLevel("normal", 0.0432, 1.141),
               ContaminationLevel("slight-to-typical", 0.0177, 1.887),
               ContaminationLevel("severe", 0.0115, 2.662),
               ContaminationLevel("very-severe", 0.00617, 4.06)),
}
GREASE_CLEANLINESS = tuple(level.label for level in CONTAMINATION_LEVELS["grease"])
BEYOND_TABLE = ContaminationLevel("dirtier than -/21/18 (eC = 0)", 0.0, 0.0)


@dataclass(frozen=True)
class Iso4406Match:
    """Which annex A row an ISO 4406 code (R6/R14) is evaluated with."""

    level: ContaminationLevel
    exact: bool
    cleaner_than_table: bool = False

    @property
    def note(self) -> str:
        if self.exact:
            return f"row {self.level.label} of ISO 281 annex A"
        if self.level is BEYOND_TABLE:
            return ("dirtier than the dirtiest row of ISO 281 annex A (-/21/18): eC = 0 taken, "
                    "which gives the lowest aISO (0.1)")
        if self.cleaner_than_table:
            return (f"cleaner than the cleanest row of ISO 281 annex A: that row, "
                    f"{self.level.label}, is used (conservative)")
        return f"between rows of ISO 281 annex A: the dirtier row {self.level.label} is used"


def iso4406_level(method: str, code_6um: int, code_14um: int) -> Iso4406Match:
    """The cleanest annex A row at least as dirty as the code R6/R14 in both sizes [4, 7]."""
    cleanest_6, cleanest_14 = ISO4406_ROWS[0]
    for level, (row_6, row_14) in zip(CONTAMINATION_LEVELS[method], ISO4406_ROWS):
        if code_6um <= row_6 and code_14um <= row_14:
            return Iso4406Match(
                level, exact=(code_6um, code_14um) == (row_6, row_14),
                cleaner_than_table=(code_6um, code_14um) != (row_6, row_14)
                and code_6um <= cleanest_6 and code_14um <= cleanest_14)
    return Iso4406Match(BEYOND_TABLE, exact=False)


def contamination_factor(kappa, mean_diameter_m, level: ContaminationLevel):
    """Contamination factor eC (0..1) by ISO 281 annex A [4].

    kappa is taken within 0.1..4, the same bounded value as in aISO [3]: eC only
    feeds aISO, whose equations stop at kappa = 4 (a thicker film adds no life),
    so a larger kappa must not raise eC either; below 0.1 (outside the
    standard's scope) it is a bounding estimate. dm = mean diameter [m].
    """
    kappa_eval = np.clip(kappa, KAPPA_SCOPE_MIN, KAPPA_EVALUATION_MAX)
    dm_mm = np.asarray(mean_diameter_m, dtype=float) / MM
    a = np.minimum(level.k * np.power(kappa_eval, 0.68) * np.power(dm_mm, 0.55), 1.0)
    return np.clip(a * (1.0 - level.c / np.cbrt(dm_mm)), 0.0, 1.0)


def fatigue_load_limit_n(static_rating_n, mean_diameter_m):
    """Fatigue load limit Cu [N] of a roller bearing estimated from C0 [N] [5]."""
    dm_mm = np.asarray(mean_diameter_m, dtype=float) / MM
    size_factor = np.where(dm_mm > CU_SIZE_LIMIT_MM,
                           np.power(CU_SIZE_LIMIT_MM / dm_mm, CU_SIZE_EXPONENT_ROLLER), 1.0)
    return np.asarray(static_rating_n) / CU_STATIC_RATIO_ROLLER * size_factor


def kappa_term_roller(kappa):
    """The bracket term (1.5859 - k1 / kappa^k2) of the roller aISO equations [3].

    kappa is taken within 0.1..4; the term, -6e-5 at kappa = 0.1 by the
    rounded constants, is not let below 0 so that aISO(0.1) = 0.1 for any load.
    """
    kappa_eval = np.clip(kappa, KAPPA_SCOPE_MIN, KAPPA_EVALUATION_MAX)
    k1 = np.where(kappa_eval < 0.4, 1.3993, 1.2348)
    k2 = np.select([kappa_eval < 0.4, kappa_eval < 1.0], [0.054381, 0.19087], 0.071739)
    return np.maximum(1.5859 - k1 / np.power(kappa_eval, k2), 0.0)


def life_modification_factor(kappa, contamination_factor_, fatigue_limit_n, equivalent_load_n):
    """aISO of a radial roller bearing [3] (0.1 .. 50).

    kappa outside 0.1..4 is evaluated at the nearer limit; a load P = 0 gives
    the cap (eC Cu / P infinite).
    """
    term = kappa_term_roller(kappa)
    load = np.asarray(equivalent_load_n, dtype=float)
    with np.errstate(divide="ignore", over="ignore"):  # a vanishing P: the cap, as P = 0
        ratio = np.where(load > 0, contamination_factor_ * fatigue_limit_n
                         / np.where(load > 0, load, 1.0), np.inf)
    with np.errstate(invalid="ignore"):
        reduction = np.where(term > 0, term * np.power(ratio, 0.4), 0.0)
    base = 1.0 - reduction
    floor = (A_ISO_MAX / 0.1) ** (-1.0 / 9.185)
    return np.where(base > floor, 0.1 * np.power(np.maximum(base, floor), -9.185), A_ISO_MAX)


def reliability_factor(reliability_percent):
    """a1 for a reliability R [%] (90..99.95) [6]."""
    ratio = np.log(100.0 / np.asarray(reliability_percent, dtype=float)) / np.log(100.0 / 90.0)
    return ((1.0 - A1_MINIMUM_LIFE_RATIO) * np.power(ratio, 1.0 / A1_WEIBULL_SLOPE)
            + A1_MINIMUM_LIFE_RATIO)


def life_symbol(reliability_percent: float, modified: bool = True) -> str:
    """ISO 281 life symbol for a reliability, e.g. L10m (90 %), L1m (99 %), L0.05m."""
    failure = round(100.0 - float(reliability_percent), 6)
    return f"L{failure:g}{'m' if modified else ''}"
