"""Prints how fast the refined method solves: a 20-case spectrum, a 37-point setting sweep,
cases per second, and the ratio against a plain per-roller Python loop of the same model.

A script, not a test: run `python tests/benchmarks/bench_refined.py`. It limits BLAS to one
thread before numpy loads, so the figures are for one core.
"""

import os

for variable in ("OPENBLAS_NUM_THREADS", "OMP_NUM_THREADS", "MKL_NUM_THREADS"):
    os.environ[variable] = "1"

import math  # noqa: E402

import numpy as np  # noqa: E402

from hubload.model.refined import RollerSet, contact, layout, pair_bearings, pair_response  # noqa: E402
from hubload.model.refined.solver import (ARMIJO, DAMPING_MAX, DAMPING_MIN,  # noqa: E402
                                          DAMPING_START, MAX_HALVINGS, MAX_ITERATIONS,
                                          REFERENCE_APPROACH_M, RELATIVE_TOLERANCE)
from timing import timed_best_of  # noqa: E402

CASES = 20
SETTINGS_UM = np.arange(-60.0, 120.1, 5.0)     # 37 settings
OFFSET_M, RADIUS_M = 0.095, 0.385


def invented_pair():
    """2 x 20 rollers, 30 laminae each: an invented 55-60 mm bore pair with crowned rollers."""
    outboard = RollerSet(20, 10.5e-3, 16e-3, math.radians(16), 85e-3, 12e-6)
    inboard = RollerSet(20, 9.5e-3, 13e-3, math.radians(16), 78e-3, 10e-6)
    return pair_bearings("back-to-back", outboard, 0.028, inboard, -0.052)


def spectrum():
    rng = np.random.default_rng(1)
    return (rng.uniform(5e3, 25e3, CASES), rng.uniform(-6e3, 6e3, CASES),
            rng.uniform(-10e3, 10e3, CASES))


# --- reference: the same model and algorithm, one case at a time, looping over the rollers ---

def roller_rows(bearing, mid_x, half_spread):
    """Per roller: influence rows (laminae, 5), stiffness, profile gap (laminae), setting gap."""
    geometry = bearing.rollers
    alpha = geometry.contact_angle_rad
    offsets = contact.lamina_offsets_m(geometry.roller_length_m)
    lever = (bearing.load_centre_m + offsets / math.cos(alpha) - mid_x) / half_spread
    rows = []
    for j in range(geometry.rollers):
        psi = 2 * math.pi * j / geometry.rollers
        c, s = math.cos(psi), math.sin(psi)
        influence = np.stack([np.full_like(lever, bearing.thrust_sign * math.sin(alpha)),
                              np.full_like(lever, math.cos(alpha) * c),
                              np.full_like(lever, math.cos(alpha) * s),
                              -math.cos(alpha) * s * lever, math.cos(alpha) * c * lever], axis=1)
        rows.append((influence, contact.lamina_stiffness_n_per_m(geometry.roller_length_m),
                     contact.profile_drop_m(offsets, geometry.roller_length_m,
                                            geometry.crown_drop_m), 0.5 * math.sin(alpha)))
    return rows


def loop_state(rollers, z, setting, exponent):
    """Force vector, Hessian, energy and contact sum by a Python loop over the rollers."""
    force, hessian, energy, magnitude = np.zeros(5), np.zeros((5, 5)), 0.0, np.zeros(5)
    for influence, stiffness, profile, setting_gap in rollers:
        delta = np.maximum(influence @ z - profile - setting_gap * setting, 0.0)
        load = stiffness * delta ** exponent
        tangent = exponent * stiffness * delta ** (exponent - 1.0)
        force += influence.T @ load
        magnitude += np.abs(influence).T @ load
        hessian += (influence.T * tangent) @ influence
        energy += float(np.sum(load * delta)) / (exponent + 1.0)
    return force, hessian, energy, magnitude


def loop_solve(rollers, external, setting, exponent=contact.LOAD_EXPONENT):
    """Damped Newton with Armijo back-tracking, one case; the batched solver's algorithm."""
    reference = np.zeros((5, 5))
    for influence, stiffness, _, _ in rollers:
        reference += (influence.T * exponent * stiffness
                      * REFERENCE_APPROACH_M ** (exponent - 1.0)) @ influence
    damping_matrix = np.diag(np.diag(reference))
    z, damping = np.zeros(5), DAMPING_START
    for _ in range(MAX_ITERATIONS):
        force, hessian, energy, magnitude = loop_state(rollers, z, setting, exponent)
        residual = force - external
        scale = np.max(np.abs(external)) + np.max(magnitude)
        if np.all(np.abs(residual) <= RELATIVE_TOLERANCE * scale + 1e-6):
            break
        step = -np.linalg.solve(hessian + damping * damping_matrix, residual)
        start = energy - external @ z
        slope, scale_step = residual @ step, 1.0
        rounding = 1e-12 * (abs(start) + np.sum(np.abs(external * z)))
        for _ in range(MAX_HALVINGS):
            trial = z + scale_step * step
            trial_energy = loop_state(rollers, trial, setting, exponent)[2] - external @ trial
            if trial_energy <= start + ARMIJO * scale_step * slope + rounding:
                break
            scale_step *= 0.5
        z = z + scale_step * step
        damping = min(max(damping / 10 if scale_step == 1.0 else damping * 10, DAMPING_MIN),
                      DAMPING_MAX)
    return z


def loop_spectrum(bearings, wheel, side, tractive, setting):
    laminae = layout.build_laminae(bearings)
    rollers = [row for b in bearings for row in roller_rows(b, laminae.mid_x_m,
                                                           laminae.half_spread_m)]
    external = layout.external_load_vector(wheel, side, tractive, OFFSET_M, RADIUS_M,
                                           laminae.mid_x_m, laminae.half_spread_m)
    return np.stack([loop_solve(rollers, external[:, i], setting) for i in range(len(wheel))],
                    axis=1)


def main():
    bearings = invented_pair()
    wheel, side, tractive = spectrum()
    rollers = sum(b.rollers.rollers for b in bearings)
    print(f"refined model: {CASES} cases, {rollers} rollers x {contact.LAMINAE} laminae "
          f"({rollers * contact.LAMINAE} laminae), BLAS on one thread")

    spectrum_s, response = timed_best_of(7, lambda: pair_response(
        bearings, wheel, side, tractive, OFFSET_M, RADIUS_M, 20e-6))
    assert response.converged.all()
    print(f"  20-case spectrum (equilibrium, loads, lives): {spectrum_s * 1e3:.1f} ms "
          f"(target < 500 ms), {CASES / spectrum_s:,.0f} cases/s")

    settings = SETTINGS_UM[:, None] * 1e-6
    sweep_s, swept = timed_best_of(3, lambda: pair_response(
        bearings, wheel, side, tractive, OFFSET_M, RADIUS_M, settings))
    assert swept.converged.all()
    points = swept.converged.size
    print(f"  {len(SETTINGS_UM)}-point setting sweep ({points} solves): {sweep_s:.3f} s "
          f"(target < 10 s), {points / sweep_s:,.0f} cases/s")

    laminae = layout.build_laminae(bearings)
    loop_s, loop_z = timed_best_of(2, lambda: loop_spectrum(bearings, wheel, side, tractive,
                                                            20e-6))
    from hubload.model.refined import solver
    external = layout.external_load_vector(wheel, side, tractive, OFFSET_M, RADIUS_M,
                                           laminae.mid_x_m, laminae.half_spread_m)
    batched_z = solver.solve_equilibrium(laminae, external, np.full(CASES, 20e-6)).displacement
    agreement = np.max(np.abs(loop_z - batched_z)) / np.max(np.abs(batched_z))
    equilibrium_s, _ = timed_best_of(7, lambda: solver.solve_equilibrium(
        laminae, external, np.full(CASES, 20e-6)))
    print(f"  per-roller Python loop, same model and algorithm: {loop_s:.2f} s for the "
          f"20-case equilibrium ({CASES / loop_s:,.1f} cases/s)")
    print(f"  batched equilibrium alone: {equilibrium_s * 1e3:.1f} ms -> "
          f"{loop_s / equilibrium_s:,.0f}x faster than the loop "
          f"(displacements agree to {agreement:.1e} relative)")


if __name__ == "__main__":
    main()
