"""The pair's setting in each case: the file's operating setting, or the one that follows from
the assembly setting ([pair.setting]) through fits and temperatures (hubload.model.setting).

The assembly setting has a tolerance band; the refined method is solved at both of its ends
as well as in the middle, and the verdict takes the worse end (engine.governing).
"""

from __future__ import annotations

from dataclasses import dataclass, replace

import numpy as np

from hubload.domain.study import Study
from hubload.model import setting as model
from hubload.model.setting import SettingTerms


@dataclass(frozen=True)
class OperatingSetting:
    """The setting of every case [m] (> 0 end play, < 0 preload) and how it came about.

    ``terms`` and the fit flags only with a [pair.setting]; per-case arrays end in the
    case axis, batched studies carry their point axes first.
    """

    operating_m: np.ndarray            # the middle of the band, per case
    assembly_m: np.ndarray | None      # per study; None: the file gave the operating setting
    tolerance_m: np.ndarray | None
    basis: str | None
    terms: SettingTerms | None
    cup_fit_lost: dict[str, np.ndarray] | None   # per bearing and case: a tight cup came loose

    @property
    def band(self) -> bool:
        """Whether the setting has a tolerance band to evaluate (single or batched)."""
        return self.tolerance_m is not None and bool(np.any(np.asarray(self.tolerance_m) > 0))


def operating_setting(study: Study) -> OperatingSetting:
    """The operating setting of every case of ``study``."""
    pair = study.pair
    count = len(study.cases)
    given = pair.setting
    if given is None:
        operating = np.broadcast_to(np.asarray(pair.axial_setting_m, dtype=float),
                                    np.broadcast_shapes(np.shape(pair.axial_setting_m), (count,)))
        return OperatingSetting(operating, None, None, None, None, None)
    terms = model.setting_terms(given.mounting, given.shaft_temperature_k,
                                given.housing_temperature_k, given.assembly_temperature_k)
    take_up = terms.fit_take_up_m if given.basis == model.UNMOUNTED else 0.0
    operating = np.asarray(given.assembly_m, dtype=float) - take_up - terms.thermal_loss_m
    tight = {"outboard": np.asarray(given.mounting.outboard.housing_interference_m) > 0,
             "inboard": np.asarray(given.mounting.inboard.housing_interference_m) > 0}
    lost = {label: tight[label] & loose for label, loose in zip(("outboard", "inboard"),
                                                                   terms.cup_loose)}
    return OperatingSetting(
        operating_m=np.broadcast_to(operating, np.broadcast_shapes(np.shape(operating),
                                                                   (count,))),
        assembly_m=per_study(given.assembly_m), tolerance_m=per_study(given.tolerance_m),
        basis=given.basis, terms=terms, cup_fit_lost=lost)


def per_study(value) -> np.ndarray:
    value = np.asarray(value, dtype=float)
    return value[..., 0] if value.ndim else value


def at_assembly(study: Study, assembly_m) -> Study:
    """The study with its assembly setting replaced (band ends, setting sweeps), no band."""
    given = study.pair.setting
    changed = replace(given, assembly_m=assembly_m, tolerance_m=0.0)
    return replace(study, pair=replace(study.pair, setting=changed))


def band_ends(study: Study) -> tuple[Study, Study]:
    """The study at the low and the high end of its assembly setting's band."""
    given = study.pair.setting
    return (at_assembly(study, np.asarray(given.assembly_m) - given.tolerance_m),
            at_assembly(study, np.asarray(given.assembly_m) + given.tolerance_m))
