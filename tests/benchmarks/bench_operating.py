"""Prints how fast operating points are derived per sample (the path a measured log takes):
pressure, flow, mode and lateral acceleration -> wheel forces, speed and flags, vectorised.
A script, not a test: run `python tests/benchmarks/bench_operating.py`."""

import time

import numpy as np

from hubload.domain.operating import Motor, Vehicle, derive_operating_points

MOTOR = Motor(displacement_m3=820e-6, half_mode=True, efficiency_volumetric=0.96,
              efficiency_mechanical=0.93, max_pressure_pa=350e5, max_speed_rpm=190)
VEHICLE = Vehicle(axle_load_n=33e3, track_m=1.56, cog_height_m=0.98)


def samples(count):
    rng = np.random.default_rng(1)
    missing = np.full(count, np.nan)
    return dict(wheel_load_n=missing, side_force_n=missing, tractive_force_n=missing,
                speed_rpm=missing, pressure_pa=rng.uniform(-150e5, 380e5, count),
                flow_m3s=rng.uniform(0, 70e-3 / 60, count), half_mode=rng.random(count) < 0.3,
                lateral_accel_g=rng.uniform(-0.3, 0.3, count))


def main():
    for count in (10_000, 1_000_000, 10_000_000):
        columns = samples(count)
        start = time.perf_counter()
        points = derive_operating_points(**columns, rolling_radius_m=0.442, adhesion_mu=0.55,
                                         motor=MOTOR, vehicle=VEHICLE)
        seconds = time.perf_counter() - start
        print(f"{count:>12,} samples: {seconds * 1e3:9.1f} ms  "
              f"({count / seconds / 1e6:6.1f} M samples/s; "
              f"{int(points.slips.sum()):,} slipping)")


if __name__ == "__main__":
    main()
