"""Timing helper shared by the benchmark scripts (they print figures; they are not tests)."""

import time


def timed_best_of(repeats, function):
    """Shortest wall time [s] of ``repeats`` calls (the least disturbed by other work) and the
    last call's return value."""
    times = []
    for _ in range(repeats):
        start = time.perf_counter()
        result = function()
        times.append(time.perf_counter() - start)
    return min(times), result


def best_of(repeats, function):
    """Shortest wall time [s] of ``repeats`` calls."""
    return timed_best_of(repeats, function)[0]
