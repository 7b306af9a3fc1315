"""Prints how fast the refined method solves, against floors measured in the same run.

- cases/s of the equilibrium solver alone and of the whole pair response (equilibrium,
  loads, lives) for 20, 1,000, 10,000 and 100,000 cases, and the cost per case against
  1,000 cases (flat = 1);
- the solver's arithmetic rate against a dense kernel on the same core (numpy matmul);
- the numpy reference solver (tests/model/refined/reference_solver.py: the same method,
  batched in numpy) on the same cases;
- the 20-case spectrum and the 37-point setting sweep;
- what numba costs: a first call with an empty cache (compile), with a filled cache (load),
  and whether a command without the refined method imports it.

A script, not a test: run `python tests/benchmarks/bench_refined.py`. It limits BLAS to
one thread before numpy loads, so the figures are for one core. The machine is shared:
every figure is a best of several runs, and rates are read against the floor measured in
the same run.
"""

import os

for variable in ("OPENBLAS_NUM_THREADS", "OMP_NUM_THREADS", "MKL_NUM_THREADS"):
    os.environ[variable] = "1"

import math  # noqa: E402
import pathlib  # noqa: E402
import subprocess  # noqa: E402
import sys  # noqa: E402
import tempfile  # noqa: E402
import time  # noqa: E402

import numpy as np  # noqa: E402

from hubload.model.refined import RollerSet, layout, pair_bearings, pair_response  # noqa: E402
from hubload.model.refined import solver  # noqa: E402
from hubload.model.refined.pair import BLOCK_CASES  # noqa: E402
from timing import best_of, timed_best_of  # noqa: E402

ROOT = pathlib.Path(__file__).resolve().parents[2]
sys.path.insert(0, str(ROOT / "tests" / "model" / "refined"))
import reference_solver  # noqa: E402

SIZES = (20, 1_000, 10_000, 100_000)
SETTINGS_UM = np.arange(-60.0, 120.1, 5.0)     # 37 settings
OFFSET_M, RADIUS_M = 0.095, 0.385
FLOOR_SIZE = 512
# Arithmetic per lamina, counted as the compiled code does it (FMA = 2): an energy pass
# is the approach (10), the ninth root (two degree-4 polynomials 16, y^9 4, division and
# correction 8, exponent handling 2) and the law (6); force sums 20; Hessian 15 x 2 + 1.
FLOPS_ENERGY, FLOPS_FORCES, FLOPS_HESSIAN = 46, 20, 31


def invented_pair():
    """2 x 20 rollers, 30 laminae each: an invented 55-60 mm bore pair with crowned rollers."""
    outboard = RollerSet(20, 10.5e-3, 16e-3, math.radians(16), 85e-3, 12e-6)
    inboard = RollerSet(20, 9.5e-3, 13e-3, math.radians(16), 78e-3, 10e-6)
    return pair_bearings("back-to-back", outboard, 0.028, inboard, -0.052)


def random_spectrum(cases, seed=1):
    rng = np.random.default_rng(seed)
    return (rng.uniform(5e3, 25e3, cases), rng.uniform(-6e3, 6e3, cases),
            rng.uniform(-10e3, 10e3, cases))


def floor_gflops():
    """GFLOP/s of a dense 512 x 512 matrix product on one core (numpy's BLAS)."""
    a = np.random.default_rng(0).random((FLOOR_SIZE, FLOOR_SIZE))
    return 2 * FLOOR_SIZE ** 3 / best_of(10, lambda: a @ a) / 1e9


def solver_flops(laminae, work) -> float:
    """Arithmetic [FLOP] of one solve, from what the compiled iteration did per case."""
    full, merged = laminae.stiffness.size, laminae.merged(solver.START_LAMINAE_PER_ROLLER)
    merged = merged.stiffness.size
    return float(sum(
        size * (FLOPS_ENERGY * passes.sum() + FLOPS_FORCES * checks.sum()
                + FLOPS_HESSIAN * (checks - 1).sum())
        for size, checks, passes in ((full, work.checks, work.energy_passes),
                                     (merged, work.start_checks, work.start_passes))))


def size_row(bearings, laminae, cases):
    """(solver s, pair response s, solver FLOP) for ``cases`` cases, best of a few runs."""
    wheel, side, tractive = random_spectrum(cases)
    external = layout.external_load_vector(wheel, side, tractive, OFFSET_M, RADIUS_M,
                                           laminae.mid_x_m, laminae.half_spread_m)
    settings = np.full(cases, 20e-6)
    repeats = 2 if cases >= 100_000 else 3 if cases >= 10_000 else 7
    solve_s, (found, work) = timed_best_of(
        repeats, lambda: solver.solve_with_work(laminae, external, settings))
    assert found.converged.all()
    del found
    response_s = best_of(repeats, lambda: pair_response(bearings, wheel, side, tractive,
                                                        OFFSET_M, RADIUS_M, 20e-6))
    return solve_s, response_s, solver_flops(laminae, work)


def print_sizes(bearings, laminae):
    floor = floor_gflops()
    print(f"  floor: numpy {FLOOR_SIZE} x {FLOOR_SIZE} matmul on one core, {floor:.1f} GFLOP/s")
    print("  cases     solver cases/s   per case vs 1,000   pair response cases/s   "
          "per case vs 1,000   solver GFLOP/s (share of floor)")
    rows = {cases: size_row(bearings, laminae, cases) for cases in SIZES}
    base_solve, base_response = rows[1_000][0] / 1_000, rows[1_000][1] / 1_000
    for cases, (solve_s, response_s, flops) in rows.items():
        print(f"  {cases:>7,}   {cases / solve_s:>14,.0f}   {solve_s / cases / base_solve:>17.2f}"
              f"   {cases / response_s:>21,.0f}   {response_s / cases / base_response:>17.2f}"
              f"   {flops / solve_s / 1e9:>8.1f} ({flops / solve_s / 1e9 / floor:.0%})")
    largest = SIZES[-1]
    wheel, side, tractive = random_spectrum(largest)
    external = layout.external_load_vector(wheel, side, tractive, OFFSET_M, RADIUS_M,
                                           laminae.mid_x_m, laminae.half_spread_m)
    settings = np.full(largest, 20e-6)
    blocks = [slice(start, start + BLOCK_CASES) for start in range(0, largest, BLOCK_CASES)]
    # Each block's result is dropped before the next, as pair_response reduces it.
    blocked_s = best_of(2, lambda: all(solver.solve_equilibrium(
        laminae, external[:, part], settings[part]).converged.all() for part in blocks))
    print(f"  {largest:,} cases in one solve return {largest * laminae.stiffness.size * 8 / 1e9:.2f}"
          f" GB of lamina loads, written into fresh memory; the same solver called on blocks of "
          f"{BLOCK_CASES} (as pair_response does): {largest / blocked_s:,.0f} cases/s, per case "
          f"vs 1,000: {blocked_s / largest / base_solve:.2f}")
    return rows


def print_reference(laminae, rows):
    wheel, side, tractive = random_spectrum(1_000)
    external = layout.external_load_vector(wheel, side, tractive, OFFSET_M, RADIUS_M,
                                           laminae.mid_x_m, laminae.half_spread_m)
    settings = np.full(1_000, 20e-6)
    reference_s, reference = timed_best_of(2, lambda: reference_solver.solve_equilibrium(
        laminae, external, settings))
    compiled = solver.solve_equilibrium(laminae, external, settings)
    agreement = (np.max(np.abs(compiled.displacement - reference.displacement))
                 / np.max(np.abs(reference.displacement)))
    print(f"  numpy reference solver, 1,000 cases: {1_000 / reference_s:,.0f} cases/s -> "
          f"compiled {reference_s / rows[1_000][0]:.0f}x faster "
          f"(displacements agree to {agreement:.1e} relative)")


def print_studies(bearings):
    wheel, side, tractive = random_spectrum(20)
    spectrum_s, response = timed_best_of(15, lambda: pair_response(
        bearings, wheel, side, tractive, OFFSET_M, RADIUS_M, 20e-6))
    assert response.converged.all()
    print(f"  20-case spectrum (equilibrium, loads, lives): {spectrum_s * 1e3:.2f} ms, "
          f"{20 / spectrum_s:,.0f} cases/s")
    settings = SETTINGS_UM[:, None] * 1e-6
    sweep_s, swept = timed_best_of(5, lambda: pair_response(
        bearings, wheel, side, tractive, OFFSET_M, RADIUS_M, settings))
    assert swept.converged.all()
    print(f"  {len(SETTINGS_UM)}-point setting sweep ({swept.converged.size} solves): "
          f"{sweep_s * 1e3:.1f} ms, {swept.converged.size / sweep_s:,.0f} cases/s")


FIRST_SOLVE = """
import time, numpy as np
from hubload.model.refined import layout, solver
from bench_refined import invented_pair
laminae = layout.build_laminae(invented_pair())
start = time.perf_counter()
solver.solve_equilibrium(laminae, np.ones((5, 3)), np.zeros(3))
print(time.perf_counter() - start)
"""

NUMBA_IMPORT = "import time; s = time.perf_counter(); import numba; print(time.perf_counter() - s)"

ISO_CHECK = """
import sys
from hubload.cli import main
main(["check", "load_cases/yard_loader.toml", "--json"], standalone_mode=False)
print("numba" in sys.modules)
"""


def in_fresh_process(code, environment=None):
    found = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True,
                           cwd=ROOT, env={**os.environ, **(environment or {})}, check=True)
    return found.stdout.strip().splitlines()[-1]


def print_start_up():
    benchmarks = {"PYTHONPATH": str(pathlib.Path(__file__).parent)}
    with tempfile.TemporaryDirectory() as cache:
        fresh = {**benchmarks, "NUMBA_CACHE_DIR": cache}
        compile_s = float(in_fresh_process(FIRST_SOLVE, fresh))
        load_s = min(float(in_fresh_process(FIRST_SOLVE, fresh)) for _ in range(3))
    import_s = min(float(in_fresh_process(NUMBA_IMPORT)) for _ in range(3))
    loaded = in_fresh_process(ISO_CHECK)
    print(f"  first solve in a fresh process: {compile_s:.1f} s with an empty numba cache "
          f"(compiles once per machine), {load_s:.2f} s with the cache filled, of which "
          f"importing numba {import_s:.2f} s")
    print(f"  `check` without the refined method imports numba: {loaded} "
          f"(start-up cost for it: {'none' if loaded == 'False' else 'SOME'})")


def main():
    bearings = invented_pair()
    laminae = layout.build_laminae(bearings)
    print(f"refined model: {laminae.stiffness.size} laminae (2 x 20 rollers x 30), "
          f"BLAS on one thread, {time.strftime('%Y-%m-%d')}")
    solver.solve_equilibrium(laminae, np.ones((5, 2)), np.zeros(2))   # load the kernel
    rows = print_sizes(bearings, laminae)
    print_reference(laminae, rows)
    print_studies(bearings)
    print_start_up()


if __name__ == "__main__":
    main()
