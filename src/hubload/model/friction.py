"""Friction torque and power loss of a tapered roller bearing (Palmgren's model).

M = M0 + M1: a load-independent (viscous) part M0 from the lubricant's drag and
a load-dependent part M1 from the rolling contacts [1]. Roller-end / rib sliding,
which tapered bearings add under heavy axial load, is not modelled, nor seal
drag: both make the real torque larger. Numpy-vectorised, SI at the interface
(m, m^2/s, N, N m, W), speeds in r/min; the model's own units (mm, cSt, N mm)
only inside the formulas.

Under preload the rollers carry far more than the external load: pass each
bearing's radial and axial forces from the refined method's solved roller-load
distribution (hubload.model.refined.pair: BearingResponse.radial_n, axial_n),
not the ISO 281 pair rule's loads, which assume zero clearance and know nothing
of a preload. The split into M0 and M1 (:class:`FrictionTorque`) shows how much
of the torque the loads cause.

References
----------
[1] T. A. Harris, M. N. Kotzalas, Rolling Bearing Analysis, 5th ed. (Essential
    Concepts of Bearing Technology), CRC 2007, chapter on friction in rolling
    bearings, after A. Palmgren, Ball and Roller Bearing Engineering, 3rd ed.,
    1959: M0 = 1e-7 f0 (nu n)^(2/3) dm^3 [N mm] for nu n >= 2000, otherwise
    M0 = 160e-7 f0 dm^3 (nu [cSt], n [r/min], dm [mm]); M1 = f1 P1 dm with,
    for tapered roller bearings, f1 = 0.0004 and P1 = max(Fr, 2 Y Fa) (Y the
    ISO 281 axial factor; from memory: the constants differ between editions
    and bearing series).
[2] Same source, table of f0 for tapered roller bearings: about 6 with oil
    bath or grease, 8 to 10 with oil jet or on a vertical shaft (from memory).
    The upper end, 10, is taken for jet and vertical shaft: a power loss is
    used to size cooling, where too low a value is the unsafe side.
[3] Power loss N = M omega, omega = 2 pi n / 60 (mechanics).
"""

from __future__ import annotations

from dataclasses import dataclass
from types import MappingProxyType

import numpy as np

from hubload.units import CST, MM

NMM = 1e-3                     # N mm in N m

F1_TAPERED = 0.0004
F0_TAPERED = MappingProxyType({"oil-bath": 6.0, "grease": 6.0, "oil-jet": 10.0,
                               "vertical-shaft": 10.0})
LOW_SPEED_PRODUCT_CST_RPM = 2000.0
LOW_SPEED_COEFFICIENT = 160e-7
VISCOUS_COEFFICIENT = 1e-7
AXIAL_LOAD_FACTOR = 2.0


def viscous_torque_nm(viscosity_m2_s, speed_rpm, mean_diameter_m, f0):
    """Load-independent torque M0 [N m] [1].

    ``viscosity_m2_s`` the operating kinematic viscosity [m^2/s]; ``speed_rpm``
    [r/min] (its magnitude); ``mean_diameter_m`` dm = (d + D) / 2 [m]; ``f0``
    the lubrication factor [2]. Below nu n = 2000 cSt r/min the torque keeps its
    low-speed value 160e-7 f0 dm^3, also at standstill; as in the source the
    torque steps down by 0.8 % at the limit (2000^(2/3) = 158.7 < 160).
    """
    product = np.asarray(viscosity_m2_s, dtype=float) / CST * np.abs(speed_rpm)
    dm_cubed = np.power(np.asarray(mean_diameter_m, dtype=float) / MM, 3)
    fast = VISCOUS_COEFFICIENT * np.power(product, 2.0 / 3.0)
    coefficient = np.where(product >= LOW_SPEED_PRODUCT_CST_RPM, fast, LOW_SPEED_COEFFICIENT)
    return f0 * coefficient * dm_cubed * NMM


def friction_load_n(radial_n, axial_n, y_factor):
    """Load P1 [N] of the load-dependent torque of a tapered bearing: max(Fr, 2 Y Fa) [1].

    ``y_factor`` is the ISO 281 Y of the bearing (not an inch-series K).
    """
    return np.maximum(radial_n, AXIAL_LOAD_FACTOR * np.asarray(y_factor) * axial_n)


def load_torque_nm(radial_n, axial_n, y_factor, mean_diameter_m, f1=F1_TAPERED):
    """Load-dependent torque M1 = f1 P1 dm [N m], forces [N], dm [m] [1]."""
    return f1 * friction_load_n(radial_n, axial_n, y_factor) * np.asarray(mean_diameter_m)


@dataclass(frozen=True)
class FrictionTorque:
    """Friction torque of one bearing [N m], split into its two parts [1]."""

    viscous_nm: np.ndarray
    load_nm: np.ndarray

    @property
    def total_nm(self):
        """M = M0 + M1 [N m]."""
        return self.viscous_nm + self.load_nm


def friction_torque(viscosity_m2_s, speed_rpm, mean_diameter_m, radial_n, axial_n, y_factor,
                    f0, f1=F1_TAPERED) -> FrictionTorque:
    """M0 and M1 of a tapered roller bearing [N m] per case (arrays broadcast) [1, 2].

    Units as in :func:`viscous_torque_nm` and :func:`load_torque_nm`; under
    preload pass the refined method's bearing forces (module docstring).
    """
    viscous = viscous_torque_nm(viscosity_m2_s, speed_rpm, mean_diameter_m, f0)
    load = load_torque_nm(radial_n, axial_n, y_factor, mean_diameter_m, f1)
    viscous, load = np.broadcast_arrays(viscous, load)
    return FrictionTorque(viscous_nm=viscous, load_nm=load)


def power_loss_w(torque_nm, speed_rpm):
    """Power loss N = M omega [W] from torque [N m] and speed [r/min] [3]; 0 at standstill."""
    return np.asarray(torque_nm) * 2.0 * np.pi * np.abs(speed_rpm) / 60.0


def mean_power_w(power_w, time_fraction):
    """Time-weighted mean power [W] over a spectrum, cases on the last axis.

    sum(t_j N_j) / sum(t_j): the time shares need not add up to 1; 0 where no
    case has any time.
    """
    weights = np.asarray(time_fraction, dtype=float)
    total = np.sum(weights, axis=-1)
    weighted = np.sum(weights * np.asarray(power_w, dtype=float), axis=-1)
    return np.where(total > 0, weighted / np.where(total > 0, total, 1.0), 0.0)
