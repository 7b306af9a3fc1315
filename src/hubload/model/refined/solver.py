"""Equilibrium of the rigid shaft on the laminae of both bearings, many cases at once.

With the approach delta_l = a_l . z - c_l of lamina l affine in the five
(scaled) displacements z and the lamina load Q_l = k_l max(delta_l, 0)^n, the
equilibrium sum_l Q_l a_l = F is the stationary point of the convex potential

    U(z) = sum_l k_l max(delta_l, 0)^(n+1) / (n+1) - F . z

(strain energy of the contacts minus the work of the external load) [1]. It is
solved by Newton's method on U with the analytic gradient and Hessian
sum_l n k_l max(delta_l, 0)^(n-1) a_l a_l^T, a Levenberg-Marquardt damping for
states with few or no laminae in contact (end play: the Hessian is singular
until the shaft touches) and an Armijo back-tracking line search; since U is
convex every accepted step brings the shaft nearer its equilibrium [2]. Each
case iterates from z = 0 on its own, in compiled code
(hubload.model.refined.kernel), so a case's result does not depend on the
other cases of its batch. Cases that have not converged after MAX_ITERATIONS
steps are retried one by one with scipy.optimize.minimize (trust-region, exact
Hessian) [3]; a case that still fails is reported as having no equilibrium.

References
----------
[1] T. A. Harris, M. N. Kotzalas, Advanced Concepts of Bearing Technology,
    5th ed., CRC 2007, ch. 1 (equilibrium of the rolling elements and rings).
[2] J. Nocedal, S. J. Wright, Numerical Optimization, 2nd ed., Springer 2006,
    ch. 3 (line search, Armijo condition) and ch. 10 (Levenberg-Marquardt).
[3] scipy.optimize.minimize, method "trust-exact" (More-Sorensen trust region).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import NamedTuple

import numpy as np

from hubload.model.refined.layout import Laminae

RELATIVE_TOLERANCE = 1e-9
ENERGY_ROUNDING = 1e-12
NEGLIGIBLE_FORCE_N = 1e-6
MAX_ITERATIONS = 80
REFERENCE_APPROACH_M = 1e-6
ARMIJO = 1e-4
MAX_HALVINGS = 40
DAMPING_START, DAMPING_MIN, DAMPING_MAX = 1.0, 1e-12, 1e8
# The start: the merged model's balance to 1e-3 of the load scale, from where the damping
# starts low. Measured on 60 random cases (-40 to 120 um): 6.8 Newton steps of the full
# model from z = 0 against 2.2 (at most 3) from there, at a tenth of the cost per step
# for the merged model (3 laminae per roller instead of 30).
START_LAMINAE_PER_ROLLER = 3
START_TOLERANCE = 1e-3
REFINE_DAMPING = 1e-6


class NewtonControls(NamedTuple):
    """The constants above, handed to the compiled iteration as one argument (a change
    here then reaches code that numba cached on disk)."""

    relative_tolerance: float = RELATIVE_TOLERANCE
    negligible_force_n: float = NEGLIGIBLE_FORCE_N
    energy_rounding: float = ENERGY_ROUNDING
    armijo: float = ARMIJO
    damping_start: float = DAMPING_START
    damping_min: float = DAMPING_MIN
    damping_max: float = DAMPING_MAX
    max_iterations: int = MAX_ITERATIONS
    max_halvings: int = MAX_HALVINGS
    start_tolerance: float = START_TOLERANCE
    refine_damping: float = REFINE_DAMPING


@dataclass(frozen=True)
class Equilibrium:
    """Scaled displacements z (5, M), lamina loads [N] (L, M), convergence (M,)."""

    displacement: np.ndarray
    lamina_loads_n: np.ndarray
    converged: np.ndarray
    iterations: int


@dataclass(frozen=True)
class Work:
    """What the compiled iteration did per case (M,), on the full and on the merged model:
    convergence checks (each but the last followed by a Newton step) and passes over the
    laminae for an energy (the start and every line-search trial)."""

    checks: np.ndarray
    energy_passes: np.ndarray
    start_checks: np.ndarray
    start_passes: np.ndarray


def model_rows(laminae: Laminae):
    """(rows (13, L), damping diagonal (5,) [N/m]) of the laminae for the compiled iteration.

    Rows 0-4: influence d(delta)/dz; 5-9: its magnitude; 10: profile gap [m]; 11: gap per
    metre of setting; 12: stiffness [N/m^n]. The damping is the diagonal of the Hessian
    with every lamina at REFERENCE_APPROACH_M, so that it has the units and the scale of
    the contact stiffness.
    """
    influence = laminae.influence.T
    reference_tangent = (laminae.exponent * laminae.stiffness
                         * REFERENCE_APPROACH_M ** (laminae.exponent - 1.0))
    rows = np.concatenate([influence, np.abs(influence), laminae.profile_gap_m[None],
                           laminae.setting_gap[None], laminae.stiffness[None]]).astype(float)
    return np.ascontiguousarray(rows), influence ** 2 @ reference_tangent


def solve_with_work(laminae: Laminae, external, setting_m) -> tuple[Equilibrium, Work]:
    """solve_equilibrium, and the work the compiled iteration did for each case."""
    # Imported here: numba takes half a second to load, and only the refined method needs it.
    from hubload.model.refined import kernel

    external = np.asarray(external, dtype=float)
    cases = external.shape[1]
    settings = np.ascontiguousarray(np.broadcast_to(setting_m, (cases,)), dtype=float)
    merged, full = model_rows(laminae.merged(START_LAMINAE_PER_ROLLER)), model_rows(laminae)
    exponent, ninth = float(laminae.exponent), bool(laminae.exponent == 10.0 / 9.0)
    z, loads = np.empty((cases, 5)), np.empty((cases, laminae.stiffness.size))
    work = np.empty((cases, 5), dtype=np.int64)
    kernel.solve_cases((merged[0], full[0]), np.stack([merged[1], full[1]]), exponent, ninth,
                       np.ascontiguousarray(external.T), settings, NewtonControls(), z, loads,
                       work)
    converged = work[:, 4].astype(bool)
    for case in np.flatnonzero(~converged):
        converged[case] = minimise_one(kernel, full[0], exponent, ninth,
                                       np.ascontiguousarray(external[:, case]), settings[case],
                                       z[case], loads[case])
    found = Equilibrium(displacement=z.T, lamina_loads_n=loads.T, converged=converged,
                        iterations=int(min(work[:, 0].max(initial=1), MAX_ITERATIONS)))
    return found, Work(*work[:, :4].T)


def solve_equilibrium(laminae: Laminae, external, setting_m) -> Equilibrium:
    """Displacements and lamina loads for loads ``external`` (5, M) and settings (M,) [m]."""
    return solve_with_work(laminae, external, setting_m)[0]


def minimise_one(kernel, model, exponent, ninth, external, setting_m, z, loads) -> bool:
    """One case by scipy's trust-region Newton method from ``z``; overwrites ``z`` and
    ``loads`` (L,) with its result and returns whether it balances the case."""
    # Imported here: scipy.optimize costs a third of a second at start-up and only the
    # rare case that the compiled Newton iteration leaves unconverged needs it.
    from scipy import optimize

    gaps = model[10] + model[11] * setting_m
    tangents, forces, magnitudes = np.empty_like(loads), np.empty(5), np.empty(5)
    matrix = np.empty((5, 5))

    def energy_and_gradient(point):
        energy = kernel.lamina_energy(model, gaps, exponent, ninth, point, loads, tangents)
        kernel.force_sums(model, loads, forces, magnitudes)
        return energy - external @ point, forces - external

    def hessian(point):
        kernel.lamina_energy(model, gaps, exponent, ninth, point, loads, tangents)
        kernel.hessian_sums(model, tangents, matrix)
        return matrix.copy()

    found = optimize.minimize(energy_and_gradient, z.copy(), jac=True, hess=hessian,
                              method="trust-exact",
                              options={"gtol": 1e-3 * RELATIVE_TOLERANCE
                                       * (np.max(np.abs(external)) + 1.0), "maxiter": 500})
    z[:] = found.x
    kernel.lamina_energy(model, gaps, exponent, ninth, z, loads, tangents)
    kernel.force_sums(model, loads, forces, magnitudes)
    return bool(np.all(np.isfinite(z)) and kernel.balanced(
        forces, magnitudes, external, RELATIVE_TOLERANCE, NEGLIGIBLE_FORCE_N))
