"""Fatigue strength of a steel shaft section: endurance limit, Marin factors, notch factors.

Follows R. G. Budynas, J. K. Nisbett, Shigley's Mechanical Engineering Design,
10th ed., McGraw-Hill 2015, chapter 6. The surface-factor table changed between
editions and the fatigue strength fraction f is read from a figure in older
editions but computed in the 10th; both are taken here as in the 10th edition.
Equation numbers below are those of the 10th edition as recalled (from memory);
the values themselves are checked in tests/model/test_shaft.py against the
book's worked examples.

References
----------
[1] Shigley 10th ed., eq. (6-8): rotating-beam endurance limit of steel
    S'e = 0.5 Sut for Sut <= 1400 MPa, else 700 MPa.
[2] Shigley 10th ed., eqs. (6-10)-(6-12): fatigue strength fraction at 10^3
    cycles, f = (sigma'F / Sut) (2 10^3)^b with sigma'F = Sut + 345 MPa and
    b = -log(sigma'F / S'e) / log(2 Ne), Ne = 10^6; f = 0.9 for Sut < 483 MPa.
[3] Shigley 10th ed., eq. (6-18): Marin equation Se = ka kb kc kd ke S'e.
[4] Shigley 10th ed., eq. (6-19) and table 6-2: surface factor ka = a Sut^b.
[5] Shigley 10th ed., eq. (6-20): size factor kb of a rotating round bar.
[6] Shigley 10th ed., section 6-14 (combinations of loading modes): with the
    stresses combined by von Mises, the load factor is kc = 1.
[7] Shigley 10th ed., eq. (6-27): temperature factor kd, 70 <= T <= 1000 F.
[8] Shigley 10th ed., eq. (6-29) and table 6-5: reliability factor
    ke = 1 - 0.08 za, za the standard normal variate of the reliability.
[9] Shigley 10th ed., eqs. (6-32)-(6-35): Kf = 1 + q (Kt - 1), Neuber's notch
    sensitivity q = 1 / (1 + sqrt(a) / sqrt(r)) with sqrt(a) of steel from Sut
    (bending and torsion), 50 <= Sut <= 250 kpsi.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

PA_PER_MPA = 1e6
PA_PER_KPSI = 6.894757e6
MM_PER_INCH = 25.4

ENDURANCE_RATIO = 0.5
ENDURANCE_CAP_PA = 700e6
ENDURANCE_CAP_FROM_PA = 1400e6
ENDURANCE_CYCLES = 1e6
FRACTION_KNEE_CYCLES = 1e3
LOW_STRENGTH_FRACTION = 0.9
LOW_STRENGTH_LIMIT_PA = 70 * PA_PER_KPSI
TRUE_FRACTURE_OFFSET_PA = 50 * PA_PER_KPSI

# Table 6-2 of the 10th edition, Sut in MPa: ka = a Sut^b [4].
SURFACE_FACTOR_MPA = {
    "ground": (1.58, -0.085),
    "machined": (4.51, -0.265),    # machined or cold-drawn
    "hot-rolled": (57.7, -0.718),
    "forged": (272.0, -0.995),     # as-forged
}
SURFACES = tuple(SURFACE_FACTOR_MPA)

SIZE_FACTOR_RANGE_MM = (2.79, 254.0)
SIZE_FACTOR_BREAK_MM = 51.0
LOAD_FACTOR_COMBINED = 1.0
TEMPERATURE_FACTOR_RANGE_F = (70.0, 1000.0)
RELIABILITY_SLOPE = 0.08

NOTCH_SENSITIVITY_RANGE_PA = (50 * PA_PER_KPSI, 250 * PA_PER_KPSI)
# sqrt(a) [sqrt(in)] = c0 + c1 Sut + c2 Sut^2 + c3 Sut^3 with Sut in kpsi [9].
NEUBER_BENDING = (0.246, -3.08e-3, 1.51e-5, -2.67e-8)
NEUBER_TORSION = (0.190, -2.51e-3, 1.35e-5, -2.67e-8)


def rotating_beam_endurance_limit_pa(ultimate_pa):
    """Endurance limit S'e [Pa] of a polished rotating-beam specimen of steel [1]."""
    ultimate = np.asarray(ultimate_pa, dtype=float)
    return np.where(ultimate <= ENDURANCE_CAP_FROM_PA, ENDURANCE_RATIO * ultimate,
                    ENDURANCE_CAP_PA)


def fatigue_strength_fraction(ultimate_pa):
    """Fraction f of Sut reached at 10^3 cycles [2], computed as in the 10th edition.

    Uses the unmodified S'e of [1]; below Sut = 70 kpsi (483 MPa) the book's
    conservative f = 0.9 applies (the formula gives 0.90 at 70 kpsi).
    """
    ultimate = np.asarray(ultimate_pa, dtype=float)
    true_fracture = ultimate + TRUE_FRACTURE_OFFSET_PA
    exponent = (-np.log10(true_fracture / rotating_beam_endurance_limit_pa(ultimate))
                / np.log10(2.0 * ENDURANCE_CYCLES))
    fraction = true_fracture / ultimate * (2.0 * FRACTION_KNEE_CYCLES) ** exponent
    return np.where(ultimate < LOW_STRENGTH_LIMIT_PA, LOW_STRENGTH_FRACTION, fraction)


def surface_factor(ultimate_pa, surface: str):
    """Surface factor ka = a Sut^b (Sut in MPa) of table 6-2, 10th edition [4]."""
    a, b = SURFACE_FACTOR_MPA[surface]
    return a * np.power(np.asarray(ultimate_pa, dtype=float) / PA_PER_MPA, b)


def size_factor_rotating(diameter_m):
    """Size factor kb of a rotating round bar in bending or torsion [5], d [m].

    kb = (d / 7.62)^-0.107 for 2.79 <= d <= 51 mm, 1.51 d^-0.157 for 51 < d <= 254 mm;
    the range is checked where the file is read.
    """
    d_mm = np.asarray(diameter_m, dtype=float) * 1e3
    return np.where(d_mm <= SIZE_FACTOR_BREAK_MM, np.power(d_mm / 7.62, -0.107),
                    1.51 * np.power(d_mm, -0.157))


def temperature_factor(temperature_c):
    """Temperature factor kd [7] at the operating temperature [deg C].

    The polynomial fit covers 70-1000 F (21-538 C) and gives 1.000 at 70 F; below
    that kd = 1 (the book's room-temperature value).
    """
    fahrenheit = np.maximum(1.8 * np.asarray(temperature_c, dtype=float) + 32.0,
                            TEMPERATURE_FACTOR_RANGE_F[0])
    return (0.975 + 0.432e-3 * fahrenheit - 0.115e-5 * fahrenheit ** 2
            + 0.104e-8 * fahrenheit ** 3 - 0.595e-12 * fahrenheit ** 4)


def reliability_factor(reliability_percent):
    """Reliability factor ke = 1 - 0.08 za [8] for a reliability in [50, 100) %.

    za is the standard normal quantile; the standard library's (Wichura's algorithm AS 241)
    keeps scipy.special out of the CLI's start-up.
    """
    reliability = np.asarray(reliability_percent, dtype=float) / 100.0
    if np.all(reliability == 0.5):  # the median endurance limit: za = 0, ke = 1
        return np.ones_like(reliability)
    from statistics import NormalDist  # loaded only for a reliability above the median

    quantile = np.vectorize(NormalDist().inv_cdf, otypes=[float])
    return 1.0 - RELIABILITY_SLOPE * quantile(reliability)


@dataclass(frozen=True)
class MarinFactors:
    """The factors of the Marin equation [3]; ``product`` turns S'e into Se."""

    surface: np.ndarray
    size: np.ndarray
    load: float
    temperature: np.ndarray
    reliability: np.ndarray

    @property
    def product(self):
        return self.surface * self.size * self.load * self.temperature * self.reliability


def marin_factors(ultimate_pa, surface: str, diameter_m, temperature_c,
                  reliability_percent) -> MarinFactors:
    """Marin factors [3] of a rotating shaft section under combined loading (kc = 1 [6])."""
    return MarinFactors(
        surface=surface_factor(ultimate_pa, surface),
        size=size_factor_rotating(diameter_m),
        load=LOAD_FACTOR_COMBINED,
        temperature=temperature_factor(temperature_c),
        reliability=reliability_factor(reliability_percent))


def endurance_limit_pa(ultimate_pa, factors: MarinFactors):
    """Endurance limit Se [Pa] of the part: Marin equation Se = ka kb kc kd ke S'e [1, 3]."""
    return factors.product * rotating_beam_endurance_limit_pa(ultimate_pa)


def neuber_constant_sqrt_m(ultimate_pa, torsion: bool = False):
    """Neuber's characteristic length sqrt(a) [sqrt(m)] of steel [9] (Sut in kpsi in the fit)."""
    sut_kpsi = np.asarray(ultimate_pa, dtype=float) / PA_PER_KPSI
    c0, c1, c2, c3 = NEUBER_TORSION if torsion else NEUBER_BENDING
    sqrt_a_in = c0 + c1 * sut_kpsi + c2 * sut_kpsi ** 2 + c3 * sut_kpsi ** 3
    return sqrt_a_in * np.sqrt(MM_PER_INCH * 1e-3)


def notch_sensitivity(notch_radius_m, ultimate_pa, torsion: bool = False):
    """Notch sensitivity q = 1 / (1 + sqrt(a / r)) of steel [9]; radius [m], Sut [Pa].

    The fit for sqrt(a) covers 50 <= Sut <= 250 kpsi (345-1724 MPa); the range is
    checked where the file is read.
    """
    sqrt_a = neuber_constant_sqrt_m(ultimate_pa, torsion)
    return 1.0 / (1.0 + sqrt_a / np.sqrt(np.asarray(notch_radius_m, dtype=float)))


def fatigue_notch_factor(kt, q):
    """Fatigue stress-concentration factor Kf = 1 + q (Kt - 1) [9]."""
    return 1.0 + np.asarray(q, dtype=float) * (np.asarray(kt, dtype=float) - 1.0)
