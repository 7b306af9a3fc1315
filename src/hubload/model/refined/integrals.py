"""Sjovall's load-distribution integrals Jr(epsilon), Ja(epsilon) of a rigid-ring bearing.

With the load distribution factor epsilon (the loaded share of the diameter),
the roller loads are Q(psi) = Qmax [1 - (1 - cos psi) / (2 epsilon)]^n inside
the load zone |psi| <= psi_l = arccos(1 - 2 epsilon) (all of the ring when
epsilon >= 1), and the bearing's forces are

    Fr = Z Qmax cos(a) Jr(epsilon),   Fa = Z Qmax sin(a) Ja(epsilon),
    Jr = 1/(2 pi) int Q/Qmax cos psi dpsi,   Ja = 1/(2 pi) int Q/Qmax dpsi  [1].

The exponent n is that of the load-deflection law: 10/9 for line contact in
this package (hubload.model.refined.contact); Harris & Kotzalas tabulate the
integrals for n = 1.1 (Jr(0.5) = 0.2453), which differs in the fourth digit.

References
----------
[1] T. A. Harris, M. N. Kotzalas, Essential Concepts of Bearing Technology,
    5th ed., CRC 2007, ch. 7 (Sjovall integrals; table of Jr and Ja for point
    and line contact); H. Sjovall, Teknisk Tidskrift 63 (1933).
"""

from __future__ import annotations

import math

import numpy as np
from scipy import integrate


def load_zone_half_angle_rad(epsilon):
    """psi_l [rad] = arccos(1 - 2 epsilon), pi for epsilon >= 1 [1]."""
    return np.arccos(np.clip(1.0 - 2.0 * np.asarray(epsilon, dtype=float), -1.0, 1.0))


def relative_roller_load(psi_rad, epsilon, exponent):
    """Q(psi) / Qmax [-] [1]; zero outside the load zone."""
    return np.maximum(1.0 - (1.0 - np.cos(psi_rad)) / (2.0 * epsilon), 0.0) ** exponent


def sjovall_integrals(epsilon: float, exponent: float) -> tuple[float, float]:
    """(Jr, Ja) at load distribution factor ``epsilon`` by adaptive quadrature [1]."""
    limit = float(load_zone_half_angle_rad(epsilon))

    def radial(psi):
        return relative_roller_load(psi, epsilon, exponent) * math.cos(psi)

    def axial(psi):
        return relative_roller_load(psi, epsilon, exponent)

    jr = integrate.quad(radial, 0.0, limit, epsabs=1e-13, epsrel=1e-12)[0] / math.pi
    ja = integrate.quad(axial, 0.0, limit, epsabs=1e-13, epsrel=1e-12)[0] / math.pi
    return jr, ja
