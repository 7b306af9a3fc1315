"""Compiled Newton iteration of the refined equilibrium, one case after the other (numba).

hubload.model.refined.solver states the method and owns its constants; this module runs
it as machine code [1]. Each case is solved start to finish on its own, so that its few
arrays (one value per lamina) stay in the processor's cache however many cases a batch
holds. Per Newton iteration the laminae are passed once for every trial point of the line
search (approach, load, tangent stiffness, energy) and, at the accepted point, once for
the force sums and once for the Hessian from the loads and tangents the trial stored: the
accepted trial is the next Newton point, so nothing is computed twice.

The lamina law Q = k delta^n needs delta^(n-1), for n = 10/9 the ninth root. It is taken
from the binary64 exponent and mantissa of delta [3] with two degree-4 polynomials
(log2 of the mantissa; 2 to the fraction of the result), then refined once by the
binomial series of (1 + e)^(1/9) to third order [2]: the loop vectorises, where pow is a
library call per lamina. Other exponents use pow.

The sums over laminae are compiled with reassociation allowed (numba fastmath
"reassoc", "contract") so that they vectorise; they differ from numpy's sums only by
rounding. numba compiles on first use and keeps the machine code on disk (cache=True):
beside this file, or in the user's cache folder when the package folder is read-only;
where no folder is writable it compiles in memory in every process (slower start, same
results). solver.py imports this module only when it solves: commands that do not use
the refined method never load numba.

References
----------
[1] S. K. Lam, A. Pitrou, S. Seibert, Numba: a LLVM-based Python JIT compiler, Proc.
    LLVM-HPC 2015.
[2] J.-M. Muller, Elementary Functions: Algorithms and Implementation, 3rd ed.,
    Birkhauser 2016: range reduction by the floating-point exponent, polynomial
    approximation, refinement of roots (from memory).
[3] IEEE 754-2008, binary64: sign bit, 11 exponent bits biased by 1023, 52 mantissa bits.
"""

from __future__ import annotations

import numba
import numpy as np
from llvmlite import ir
from numba import types
from numba.extending import intrinsic

SUMS = ("reassoc", "contract")
SMALLEST_NORMAL = float(np.finfo(np.float64).tiny)
EXPONENT_BIAS = 1023
MANTISSA_BITS = 52
MANTISSA_MASK = np.int64((1 << MANTISSA_BITS) - 1)
ONE_BITS = np.int64(EXPONENT_BIAS << MANTISSA_BITS)
# Least-squares fits on 400 Chebyshev nodes (numpy.polynomial.polynomial.polyfit), lowest
# power first: log2(1 + u) on [0, 1] within 1.0e-4; 2^f on [0, 1] within 3.6e-6
# (relative). The ninth root's first guess is then within 1.2e-5, and the third-order
# correction leaves 0.0225 (9 x 1.2e-5)^4 = 3e-18 (tests/model/refined/test_kernel.py).
LOG2_FIT = (0.00010018903126171778, 1.4373021721432728, -0.6729341930681537,
            0.315467608893087, -0.08001087690681268)
EXP2_FIT = (1.000003597144564, 0.6929695509319078, 0.24162132266294692,
            0.05171773546017355, 0.0136839828938446)


def compiled(fastmath=(), inline="never"):
    """numba.njit with the disk cache where a cache folder is writable, else without it."""
    def decorate(function):
        options = {"nogil": True, "error_model": "numpy", "inline": inline,
                   "fastmath": set(fastmath) if fastmath else False}
        try:
            return numba.njit(cache=True, **options)(function)
        except RuntimeError:   # numba found no writable cache folder: compile per process
            return numba.njit(**options)(function)
    return decorate


@intrinsic
def float_bits(typing_context, value):
    """The 64 bits of a binary64 as an int64 (a reinterpretation, not a conversion)."""
    def generate(context, builder, signature, arguments):
        return builder.bitcast(arguments[0], ir.IntType(64))
    return types.int64(types.float64), generate


@intrinsic
def bits_float(typing_context, value):
    """The binary64 whose 64 bits are those of an int64."""
    def generate(context, builder, signature, arguments):
        return builder.bitcast(arguments[0], ir.DoubleType())
    return types.float64(types.int64), generate


@compiled(inline="always")   # into the loops that call it, with their fastmath
def ninth_root(x):
    """x^(1/9) for a positive normal binary64 x, within a few units in the last place [2, 3].

    x = 2^e (1 + u): log2 x = e + log2(1 + u); t = log2(x) / 9 = k + f with k whole and
    0 <= f < 1; first guess y = 2^k 2^f, then y (1 + e)^(1/9) with e = x / y^9 - 1.
    """
    bits = float_bits(x)
    exponent = np.float64(np.int32(bits >> MANTISSA_BITS)) - EXPONENT_BIAS
    u = bits_float((bits & MANTISSA_MASK) | ONE_BITS) - 1.0
    c0, c1, c2, c3, c4 = LOG2_FIT
    t = (exponent + (c0 + u * (c1 + u * (c2 + u * (c3 + u * c4))))) * (1.0 / 9.0)
    whole = np.floor(t)
    f = t - whole
    d0, d1, d2, d3, d4 = EXP2_FIT
    power_of_two = bits_float(np.int64(np.int32(whole) + EXPONENT_BIAS) << MANTISSA_BITS)
    y = power_of_two * (d0 + f * (d1 + f * (d2 + f * (d3 + f * d4))))
    y2 = y * y
    y4 = y2 * y2
    e = x / (y4 * y4 * y) - 1.0
    # (1 + e)^(1/9) = 1 + e/9 - 4 e^2/81 + 68 e^3/2187 - ..., binomial coefficients C(1/9, k)
    return y + y * e * ((1.0 / 9.0) + e * ((-4.0 / 81.0) + e * (68.0 / 2187.0)))


@compiled(SUMS)
def lamina_energy(model, gaps, exponent, ninth, z, loads, tangents):
    """Strain energy [J] of the laminae at displacements z (5,); loads [N] and tangent
    stiffnesses dQ/ddelta [N/m] of every lamina into ``loads`` and ``tangents`` (L,).

    ``model``: the rows of solver.model_rows; ``gaps`` (L,) [m]; Q = k max(delta, 0)^n,
    energy sum Q delta / (n + 1). Three short loops (approach, root, law) that each
    vectorise; a NaN approach stays NaN (no trial at a NaN point is accepted).
    """
    a0, a1, a2, a3, a4, stiffness = model[0], model[1], model[2], model[3], model[4], model[12]
    z0, z1, z2, z3, z4 = z[0], z[1], z[2], z[3], z[4]
    approach, roots = loads, tangents
    for lamina in range(gaps.size):
        approach[lamina] = (a0[lamina] * z0 + a1[lamina] * z1 + a2[lamina] * z2
                            + a3[lamina] * z3 + a4[lamina] * z4 - gaps[lamina])
    if ninth:
        for lamina in range(gaps.size):
            roots[lamina] = ninth_root(max(approach[lamina], SMALLEST_NORMAL))
    else:
        power = exponent - 1.0
        for lamina in range(gaps.size):
            roots[lamina] = max(approach[lamina], SMALLEST_NORMAL) ** power
    energy = 0.0
    for lamina in range(gaps.size):
        delta = approach[lamina]
        touching = not delta <= 0.0
        clamped = max(delta, SMALLEST_NORMAL)
        root = roots[lamina]
        load = stiffness[lamina] * clamped * root if touching else 0.0
        tangents[lamina] = exponent * stiffness[lamina] * root if touching else 0.0
        loads[lamina] = load
        energy += load * clamped
    return energy / (exponent + 1.0)


@compiled(SUMS)
def force_sums(model, loads, forces, magnitudes):
    """forces (5,) <- sum_l Q_l a_l, the laminae's generalised force on the shaft [N];
    magnitudes (5,) <- sum_l Q_l |a_l|, the scale of the convergence test [N]."""
    a0, a1, a2, a3, a4 = model[0], model[1], model[2], model[3], model[4]
    b0, b1, b2, b3, b4 = model[5], model[6], model[7], model[8], model[9]
    f0 = f1 = f2 = f3 = f4 = 0.0
    m0 = m1 = m2 = m3 = m4 = 0.0
    for lamina in range(loads.size):
        q = loads[lamina]
        f0 += q * a0[lamina]
        f1 += q * a1[lamina]
        f2 += q * a2[lamina]
        f3 += q * a3[lamina]
        f4 += q * a4[lamina]
        m0 += q * b0[lamina]
        m1 += q * b1[lamina]
        m2 += q * b2[lamina]
        m3 += q * b3[lamina]
        m4 += q * b4[lamina]
    forces[0], forces[1], forces[2], forces[3], forces[4] = f0, f1, f2, f3, f4
    magnitudes[0], magnitudes[1], magnitudes[2], magnitudes[3], magnitudes[4] = m0, m1, m2, m3, m4


@compiled(SUMS)
def hessian_sums(model, tangents, matrix):
    """matrix (5, 5) <- sum_l t_l a_l a_l^T [N/m], the Hessian of the contact energy."""
    a0, a1, a2, a3, a4 = model[0], model[1], model[2], model[3], model[4]
    h00 = h01 = h02 = h03 = h04 = h11 = h12 = h13 = h14 = 0.0
    h22 = h23 = h24 = h33 = h34 = h44 = 0.0
    for lamina in range(tangents.size):
        t = tangents[lamina]
        x0, x1, x2, x3, x4 = a0[lamina], a1[lamina], a2[lamina], a3[lamina], a4[lamina]
        t0, t1, t2, t3 = t * x0, t * x1, t * x2, t * x3
        h00 += t0 * x0
        h01 += t0 * x1
        h02 += t0 * x2
        h03 += t0 * x3
        h04 += t0 * x4
        h11 += t1 * x1
        h12 += t1 * x2
        h13 += t1 * x3
        h14 += t1 * x4
        h22 += t2 * x2
        h23 += t2 * x3
        h24 += t2 * x4
        h33 += t3 * x3
        h34 += t3 * x4
        h44 += t * x4 * x4
    matrix[0, 0], matrix[1, 1], matrix[2, 2], matrix[3, 3], matrix[4, 4] = h00, h11, h22, h33, h44
    matrix[0, 1] = matrix[1, 0] = h01
    matrix[0, 2] = matrix[2, 0] = h02
    matrix[0, 3] = matrix[3, 0] = h03
    matrix[0, 4] = matrix[4, 0] = h04
    matrix[1, 2] = matrix[2, 1] = h12
    matrix[1, 3] = matrix[3, 1] = h13
    matrix[1, 4] = matrix[4, 1] = h14
    matrix[2, 3] = matrix[3, 2] = h23
    matrix[2, 4] = matrix[4, 2] = h24
    matrix[3, 4] = matrix[4, 3] = h34


@compiled()
def solve_in_place(matrix, vector):
    """vector <- matrix^-1 vector by Gaussian elimination with partial pivoting (as LAPACK's
    gesv); ``matrix`` is overwritten. False for a zero pivot or a result that is not finite."""
    size = vector.size
    for column in range(size):
        pivot = column
        for row in range(column + 1, size):
            if abs(matrix[row, column]) > abs(matrix[pivot, column]):
                pivot = row
        if matrix[pivot, column] == 0.0:
            return False
        for k in range(size):
            swapped = matrix[column, k]
            matrix[column, k] = matrix[pivot, k]
            matrix[pivot, k] = swapped
        swapped = vector[column]
        vector[column] = vector[pivot]
        vector[pivot] = swapped
        for row in range(column + 1, size):
            factor = matrix[row, column] / matrix[column, column]
            for k in range(column, size):
                matrix[row, k] -= factor * matrix[column, k]
            vector[row] -= factor * vector[column]
    total = 0.0
    for row in range(size - 1, -1, -1):
        value = vector[row]
        for k in range(row + 1, size):
            value -= matrix[row, k] * vector[k]
        vector[row] = value / matrix[row, row]
        total += vector[row]
    return np.isfinite(total)


@compiled()
def balanced(forces, magnitudes, external, tolerance, negligible_n):
    """The convergence test of hubload.model.refined.solver, for one case: every component
    |forces - external| <= tolerance (max |external| + max magnitude) + negligible_n."""
    scale = 0.0
    largest_magnitude = 0.0
    for i in range(5):
        scale = max(scale, abs(external[i]))
        largest_magnitude = max(largest_magnitude, magnitudes[i])
    limit = tolerance * (scale + largest_magnitude) + negligible_n
    for i in range(5):
        if not abs(forces[i] - external[i]) <= limit:
            return False
    return True


@compiled()
def external_work(external, z):
    """F . z [J] (forces [N] times scaled displacements [m])."""
    return (external[0] * z[0] + external[1] * z[1] + external[2] * z[2] + external[3] * z[3]
            + external[4] * z[4])


@compiled()
def iterate(model, damping_diagonal, exponent, ninth, external, tolerance, damping, controls,
            scratch, vectors, matrix, z):
    """Damped Newton iteration of one case from ``z`` (hubload.model.refined.solver) until
    the forces balance to ``tolerance``; ``damping`` is the first Levenberg-Marquardt factor.

    ``scratch`` (5, L): gaps [m], then two (loads, tangents) pairs, the current point's and
    the trial's, which trade places when a trial is accepted; ``vectors`` (4, 5): trial,
    step, forces, magnitudes. Updates ``z``; returns (convergence checks made, passes over
    the laminae for an energy, converged, scratch row of the final loads).
    """
    gaps = scratch[0]
    trial, step, forces, magnitudes = vectors[0], vectors[1], vectors[2], vectors[3]
    current = 1
    energy = lamina_energy(model, gaps, exponent, ninth, z, scratch[1], scratch[2])
    passes, checks = 1, 0
    while True:
        checks += 1
        force_sums(model, scratch[current], forces, magnitudes)
        done = balanced(forces, magnitudes, external, tolerance, controls.negligible_force_n)
        if done or checks > controls.max_iterations:
            return checks, passes, done, current
        hessian_sums(model, scratch[current + 1], matrix)
        for i in range(5):
            matrix[i, i] += damping * damping_diagonal[i]
            step[i] = external[i] - forces[i]
        scale = 0.0
        if solve_in_place(matrix, step):
            other = 4 - current
            scale, found, used = line_search(model, exponent, ninth, external, controls, gaps,
                                             z, energy, forces, step, trial, scratch[other],
                                             scratch[other + 1])
            passes += used
            if scale > 0.0:
                for i in range(5):
                    z[i] = trial[i]
                energy, current = found, other
        damping = min(max(damping / 10.0 if scale == 1.0 else damping * 10.0,
                          controls.damping_min), controls.damping_max)


@compiled()
def line_search(model, exponent, ninth, external, controls, gaps, z, energy, forces, step,
                trial, trial_loads, trial_tangents):
    """Armijo back-tracking from z along ``step``: (share of the step taken, 0 if none;
    lamina energy at ``trial``, where it stops; lamina passes used)."""
    start = energy - external_work(external, z)
    slope = 0.0
    work_size = 0.0
    for i in range(5):
        slope += (forces[i] - external[i]) * step[i]
        work_size += abs(external[i] * z[i])
    # Near the solution energy changes drown in rounding; allow for it there.
    rounding = controls.energy_rounding * (abs(start) + work_size)
    scale = 1.0
    for halving in range(controls.max_halvings):
        for i in range(5):
            trial[i] = z[i] + scale * step[i]
        found = lamina_energy(model, gaps, exponent, ninth, trial, trial_loads, trial_tangents)
        if found - external_work(external, trial) <= (start + controls.armijo * scale * slope
                                                      + rounding):
            return scale, found, halving + 1
        scale *= 0.5
    return 0.0, energy, controls.max_halvings


@compiled()
def solve_cases(models, dampings, exponent, ninth, external, settings_m, controls, z, loads,
                work):
    """Every case in turn, each first on the merged laminae from z = 0 to a rough balance,
    then on every lamina from there (hubload.model.refined.solver).

    ``models`` (merged, full) of solver.model_rows, ``dampings`` (2, 5) their damping
    diagonals [N/m], ``external`` (M, 5) [N], ``settings_m`` (M,). Results into ``z``
    (M, 5), ``loads`` (M, L) [N] and ``work`` (M, 5): convergence checks and energy passes
    of the full model, the same of the merged model, converged (1 or 0).
    """
    scratches = (np.empty((5, models[0].shape[1])), np.empty((5, models[1].shape[1])))
    vectors, matrix = np.empty((4, 5)), np.empty((5, 5))
    tolerances = (controls.start_tolerance, controls.relative_tolerance)
    first_dampings = (controls.damping_start, controls.refine_damping)
    for case in range(settings_m.size):
        for i in range(5):
            z[case, i] = 0.0
        for stage in range(2):
            model, scratch = models[stage], scratches[stage]
            for lamina in range(model.shape[1]):
                scratch[0, lamina] = model[10, lamina] + model[11, lamina] * settings_m[case]
            checks, passes, done, current = iterate(
                model, dampings[stage], exponent, ninth, external[case], tolerances[stage],
                first_dampings[stage], controls, scratch, vectors, matrix, z[case])
            work[case, 2 - 2 * stage], work[case, 3 - 2 * stage] = checks, passes
        work[case, 4] = done
        for lamina in range(loads.shape[1]):
            loads[case, lamina] = scratch[current, lamina]
