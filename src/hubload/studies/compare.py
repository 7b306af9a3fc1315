"""Several load-case files side by side (two customers' spectra, two motor variants...).

Files with the same number of cases and the same structure are evaluated in one
batched engine call; the others one by one.
"""

from __future__ import annotations

import math
from collections import defaultdict
from collections.abc import Sequence
from dataclasses import dataclass

from hubload.domain.batch import StackError
from hubload.domain.study import Study
from hubload.engine import Result, evaluate, evaluate_many
from hubload.report.jsonout import result_document
from hubload.report.series import Series, all_series


@dataclass(frozen=True)
class Comparison:
    """The check's JSON document of each file, in the order given."""

    documents: tuple[dict, ...]

    def life_series(self) -> list[Series]:
        """Lives carried by every file (L10m only when all files give lubrication)."""
        present = [{s.label: s for s in all_series(document)} for document in self.documents]
        return [series for label, series in present[0].items()
                if series.kind == "life" and all(label in p for p in present)]

    def ratios(self, series: Series) -> list[float | None]:
        """Each file's value over the first file's (None when either is infinite or missing)."""
        values = series.values(self.documents)
        first = values[0]
        return [value / first if math.isfinite(value) and math.isfinite(first) and first > 0
                else None for value in values]


def evaluate_all(studies: Sequence[Study]) -> list[Result]:
    """Results in input order; same-shaped studies are batched."""
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
    return results


def run_compare(studies: Sequence[Study]) -> Comparison:
    """The studies side by side, in the order given."""
    return Comparison(tuple(result_document(result) for result in evaluate_all(studies)))
