"""Domain types: the study (wheel, pair, cases, lubrication, shaft) in SI units, and batching.

These are what the engine computes on; ``hubload.casefile`` builds them from files, and
``hubload.domain.batch`` stacks variants of a study along a leading point axis.
"""
