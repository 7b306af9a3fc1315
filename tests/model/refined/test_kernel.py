"""The compiled solver against the numpy reference, its ninth root against mpmath, and how it
loads (disk cache, fallback without one, never at start-up of other commands)."""

import math
import subprocess
import sys
import textwrap

import mpmath
import numba
import numpy as np
import pytest

from hubload.model.refined import kernel, layout, pair_bearings, solver

import reference_solver
from refined_pairs import roller_set

DOUBLE_EPSILON = np.finfo(np.float64).eps


def random_pair(rng, arrangement):
    """An invented pair with random internal geometry (ranges as in test_equilibrium)."""
    def rollers():
        count, diameter = int(rng.integers(12, 31)), rng.uniform(6.0, 20.0)
        angle, gamma = rng.uniform(10.0, 30.0), rng.uniform(0.06, 0.3)
        pitch = max(diameter * math.cos(math.radians(angle)) / gamma,
                    1.1 * count * diameter / math.pi)
        return roller_set(count, diameter, rng.uniform(0.8, 2.0) * diameter, angle, pitch,
                          rng.uniform(0.0, 20.0))
    return pair_bearings(arrangement, rollers(), rng.uniform(5.0, 90.0) * 1e-3, rollers(),
                         -rng.uniform(5.0, 90.0) * 1e-3)


def random_cases(rng, laminae, cases):
    """Ground forces up to 40 kN at random patches, settings from 80 um preload to 300 um play."""
    external = layout.external_load_vector(
        rng.uniform(0.0, 40e3, cases), rng.uniform(-40e3, 40e3, cases),
        rng.uniform(-40e3, 40e3, cases), rng.uniform(-0.05, 0.25, cases),
        rng.uniform(0.2, 0.6, cases), laminae.mid_x_m, laminae.half_spread_m)
    return external, rng.uniform(-80e-6, 300e-6, cases)


def balance_errors(laminae, external, settings, z):
    """The reference's convergence test on the compiled solution, recomputed in numpy:
    |residual| / (tolerance x scale + negligible force), per case (<= 1 passes)."""
    field = reference_solver.ContactField(laminae, laminae.gaps_m(settings))
    load = field.loads(z)[0]
    residual = np.abs(field.influence.T @ load - external)
    scale = np.max(np.abs(external), axis=0) + np.max(np.abs(field.influence).T @ load, axis=0)
    return np.max(residual, axis=0) / (solver.RELATIVE_TOLERANCE * scale
                                       + solver.NEGLIGIBLE_FORCE_N)


@pytest.mark.parametrize("seed, arrangement, exponent", [
    (1, "back-to-back", 10 / 9), (2, "face-to-face", 10 / 9), (3, "back-to-back", 1.1),
    (4, "face-to-face", 10 / 9), (5, "back-to-back", 10 / 9)])
def test_compiled_solver_matches_the_numpy_reference_on_random_cases(seed, arrangement,
                                                                     exponent):
    rng = np.random.default_rng(seed)
    laminae = layout.build_laminae(random_pair(rng, arrangement), exponent=exponent)
    external, settings = random_cases(rng, laminae, 150)
    compiled = solver.solve_equilibrium(laminae, external, settings)
    reference = reference_solver.solve_equilibrium(laminae, external, settings)
    assert compiled.converged.all() and reference.converged.all()
    assert np.all(balance_errors(laminae, external, settings, compiled.displacement) <= 1.0)
    # Both stop once the forces balance to 1e-9 of the load scale; measured on such cases,
    # either solution then lies within 5e-8 of the exact equilibrium (relative to the
    # largest displacement or lamina load of the case): 2e-7 leaves a margin.
    z_scale = np.max(np.abs(reference.displacement), axis=0)
    load_scale = np.max(reference.lamina_loads_n, axis=0)
    assert np.all(np.max(np.abs(compiled.displacement - reference.displacement), axis=0)
                  <= 2e-7 * z_scale + 1e-15)
    assert np.all(np.max(np.abs(compiled.lamina_loads_n - reference.lamina_loads_n), axis=0)
                  <= 2e-7 * load_scale + 1e-9)


def test_a_case_gives_the_same_result_alone_and_in_any_batch():
    # Each case iterates on its own: a sweep point is the same calculation as a single check.
    rng = np.random.default_rng(7)
    laminae = layout.build_laminae(random_pair(rng, "back-to-back"))
    external, settings = random_cases(rng, laminae, 40)
    batch = solver.solve_equilibrium(laminae, external, settings)
    order = rng.permutation(40)
    shuffled = solver.solve_equilibrium(laminae, external[:, order], settings[order])
    alone = solver.solve_equilibrium(laminae, external[:, 11:12], settings[11:12])
    assert np.array_equal(shuffled.displacement, batch.displacement[:, order])
    assert np.array_equal(shuffled.lamina_loads_n, batch.lamina_loads_n[:, order])
    assert np.array_equal(alone.displacement[:, 0], batch.displacement[:, 11])


def test_ninth_root_matches_mpmath_within_two_units_in_the_last_place():
    # mpmath at 40 digits is the outside reference (numpy's x ** (1/9) carries the rounding
    # of 1/9 itself: ~15 ulp at 1e-250).
    rng = np.random.default_rng(3)
    values = np.concatenate([10.0 ** rng.uniform(-307.5, 307.5, 400),
                             rng.uniform(1e-9, 1e-4, 400),    # lamina approaches [m]
                             [np.finfo(float).tiny, 1.0, 2.0, 512.0, np.finfo(float).max]])
    mpmath.mp.dps = 40
    for x in values:
        exact = mpmath.root(mpmath.mpf(float(x)), 9)
        assert abs(kernel.ninth_root(float(x)) / exact - 1) <= 2 * DOUBLE_EPSILON, x


def test_without_a_writable_cache_folder_the_kernel_compiles_in_memory():
    # numba caches only functions it can find a folder for; a function from source without a
    # file has none, as a read-only install without a writable home has none.
    namespace = {}
    exec(textwrap.dedent("""
        def doubled(x):
            return 2.0 * x
    """), namespace)
    with pytest.raises(RuntimeError, match="cannot cache"):
        numba.njit(cache=True)(namespace["doubled"])
    assert kernel.compiled()(namespace["doubled"])(21.0) == 42.0


def test_commands_without_the_refined_method_never_load_numba(tmp_path):
    # numba takes about half a second to import: only the refined method may pay for it.
    script = textwrap.dedent("""
        import sys
        from hubload.cli import main
        from hubload.model.refined import pair_response  # the refined package itself
        main(["check", "load_cases/yard_loader.toml", "--json"], standalone_mode=False)
        assert "numba" not in sys.modules, "numba was imported"
    """)
    found = subprocess.run([sys.executable, "-c", script], capture_output=True, text=True,
                           cwd=pytest.importorskip("pathlib").Path(__file__).parents[3])
    assert found.returncode == 0, found.stderr
