"""Several load-case files side by side (two customers' spectra, two motor variants...).

Files with the same number of cases and the same structure are evaluated in one
batched engine call; the others one by one.
"""

from __future__ import annotations

from collections import defaultdict
from collections.abc import Sequence
from dataclasses import dataclass

from hubload.domain.batch import StackError
from hubload.domain.study import Study
from hubload.engine import Result, evaluate, evaluate_many


@dataclass(frozen=True)
class Comparison:
    """The result of each file, in the order given."""

    results: tuple[Result, ...]


def evaluate_all(studies: Sequence[Study], on_progress=None) -> list[Result]:
    """Results in input order; same-shaped studies are batched. ``on_progress(done,
    total)`` after each group of studies (hubload.progress)."""
    groups: dict[int, list[int]] = defaultdict(list)
    for index, study in enumerate(studies):
        groups[len(study.cases)].append(index)
    results: list[Result | None] = [None] * len(studies)
    for indices in groups.values():
        members = [studies[i] for i in indices]
        try:
            found = evaluate_many(members) if len(members) > 1 else [evaluate(members[0])]
        except StackError:
            found = [evaluate(study) for study in members]
        for i, result in zip(indices, found):
            results[i] = result
        if on_progress is not None:
            on_progress(sum(result is not None for result in results), len(studies))
    return results


def run_compare(studies: Sequence[Study], on_progress=None) -> Comparison:
    """The studies side by side, in the order given."""
    return Comparison(tuple(evaluate_all(studies, on_progress)))
