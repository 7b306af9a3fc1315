"""Reference for the compiled solver: the same equilibrium, batched in plain numpy (test code).

This is the numpy form of hubload.model.refined.solver's method (damped Newton on the
convex contact potential, Armijo line search), every case iterating from z = 0 with the
damping at DAMPING_START, all cases as columns of one array. The tests compare the
compiled solver against it on random cases; the package itself has one solver.

With the approach delta_l = a_l . z - c_l and Q_l = k_l max(delta_l, 0)^n the
equilibrium sum_l Q_l a_l = F is the stationary point of the convex potential
U(z) = sum_l k_l max(delta_l, 0)^(n+1) / (n+1) - F . z [1], solved with the
analytic gradient and Hessian, a Levenberg-Marquardt damping and Armijo
back-tracking [2]; no scipy fallback here (a case that does not converge is
reported so).

References
----------
[1] T. A. Harris, M. N. Kotzalas, Advanced Concepts of Bearing Technology,
    5th ed., CRC 2007, ch. 1 (equilibrium of the rolling elements and rings).
[2] J. Nocedal, S. J. Wright, Numerical Optimization, 2nd ed., Springer 2006,
    ch. 3 (line search, Armijo condition) and ch. 10 (Levenberg-Marquardt).
"""

from __future__ import annotations

import numpy as np

from hubload.model.refined.layout import Laminae
from hubload.model.refined.solver import (ARMIJO, DAMPING_MAX, DAMPING_MIN, DAMPING_START,
                                          ENERGY_ROUNDING, MAX_HALVINGS, MAX_ITERATIONS,
                                          NEGLIGIBLE_FORCE_N, REFERENCE_APPROACH_M,
                                          RELATIVE_TOLERANCE, Equilibrium)


class ContactField:
    """Loads, energy, gradient and Hessian of the laminae for displacements z."""

    def __init__(self, laminae: Laminae, gaps_m: np.ndarray):
        self.influence = laminae.influence
        self.stiffness = laminae.stiffness[:, None]
        self.exponent = laminae.exponent
        self.gaps_m = gaps_m

    def approach(self, z, cases=slice(None)):
        return self.influence @ z - self.gaps_m[:, cases]

    def loads(self, z, cases=slice(None)):
        """(loads [N], tangent stiffness, energy [J]) of every lamina, each (L, m)."""
        delta = np.maximum(self.approach(z, cases), 0.0)
        root = np.power(delta, self.exponent - 1.0)
        load = self.stiffness * delta * root
        return load, self.exponent * self.stiffness * root, load * delta / (self.exponent + 1.0)

    def energy(self, z, external, cases=slice(None)):
        return np.sum(self.loads(z, cases)[2], axis=0) - np.sum(external * z, axis=0)

    def hessian(self, tangent):
        """sum_l t_l a_l a_l^T as (m, 5, 5)."""
        return np.einsum("li,lj,lm->mij", self.influence, self.influence, tangent,
                         optimize=True)


def converged_mask(contact_sum, residual, external):
    """|residual| <= tol x (|external| + sum of contact force magnitudes) + 1 uN, per component."""
    scale = np.max(np.abs(external), axis=0) + np.max(contact_sum, axis=0)
    return np.all(np.abs(residual) <= RELATIVE_TOLERANCE * scale + NEGLIGIBLE_FORCE_N, axis=0)


def solve_equilibrium(laminae: Laminae, external, setting_m) -> Equilibrium:
    """Displacements and lamina loads for loads ``external`` (5, M) and settings (M,) [m]."""
    external = np.asarray(external, dtype=float)
    cases = external.shape[1]
    field = ContactField(laminae, laminae.gaps_m(np.broadcast_to(setting_m, (cases,))))
    reference_tangent = (laminae.exponent * laminae.stiffness
                         * REFERENCE_APPROACH_M ** (laminae.exponent - 1.0))
    damping_matrix = np.diag(np.diag(field.hessian(reference_tangent[:, None])[0]))
    z = np.zeros((5, cases))
    damping = np.full(cases, DAMPING_START)
    done = np.zeros(cases, dtype=bool)
    iteration = 0
    for iteration in range(1, MAX_ITERATIONS + 1):
        active = np.flatnonzero(~done)
        if active.size == 0:
            break
        za, fa = z[:, active], external[:, active]
        load, tangent, _ = field.loads(za, active)
        residual = field.influence.T @ load - fa
        finished = converged_mask(np.abs(field.influence).T @ load, residual, fa)
        done[active[finished]] = True
        keep = ~finished
        if not np.any(keep):
            break
        active, za, fa = active[keep], za[:, keep], fa[:, keep]
        gradient = residual[:, keep]
        matrix = (field.hessian(tangent[:, keep])
                  + damping[active, None, None] * damping_matrix[None])
        step = -np.linalg.solve(matrix, gradient.T[..., None])[..., 0].T
        z[:, active], full_step = line_search(field, za, fa, step, gradient, active)
        damping[active] = np.clip(np.where(full_step, damping[active] / 10.0,
                                           damping[active] * 10.0), DAMPING_MIN, DAMPING_MAX)
    load = field.loads(z)[0]
    residual = field.influence.T @ load - external
    done = converged_mask(np.abs(field.influence).T @ load, residual, external)
    return Equilibrium(displacement=z, lamina_loads_n=field.loads(z)[0], converged=done,
                       iterations=iteration)


def line_search(field: ContactField, z, external, step, gradient, cases):
    """Armijo back-tracking per case; returns (new z, whether the full step was taken)."""
    start = field.energy(z, external, cases)
    slope = np.sum(gradient * step, axis=0)
    # Near the solution energy changes drown in rounding; allow for it there.
    rounding = ENERGY_ROUNDING * (np.abs(start) + np.sum(np.abs(external * z), axis=0))
    scale = np.ones(z.shape[1])
    pending = np.arange(z.shape[1])
    for _ in range(MAX_HALVINGS):
        trial = z[:, pending] + scale[pending] * step[:, pending]
        accepted = (field.energy(trial, external[:, pending], cases[pending])
                    <= start[pending] + ARMIJO * scale[pending] * slope[pending]
                    + rounding[pending])
        pending = pending[~accepted]
        if pending.size == 0:
            break
        scale[pending] *= 0.5
    scale[pending] = 0.0
    return z + scale * step, scale == 1.0
