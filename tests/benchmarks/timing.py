"""Timing helper shared by the benchmark scripts (they print figures; they are not tests)."""

import time


def best_of(repeats, function):
    """Shortest wall time [s] of ``repeats`` calls: the least disturbed by other work."""
    times = []
    for _ in range(repeats):
        start = time.perf_counter()
        function()
        times.append(time.perf_counter() - start)
    return min(times)
