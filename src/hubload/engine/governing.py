"""Which life the verdict judges: decided here, once per study, for every output.

Each evaluated method offers one candidate life of the kind the verdict judges
(ISO 281:2007, 9.1-9.2): with lubrication the modified life Lnm = a1 aISO L10,
else the basic life a1 L10 (L10 itself at 90 % reliability). The refined method's
lives are ISO/TS 16281 reference rating lives (L10r, L10mr) [1]: their lamina sum
carries the line-contact exponent 4 where ISO 281 uses 10/3, so at light loads
they are longer for reasons that have nothing to do with the bearing setting.
With the refined method both candidates are kept and ``[project] verdict_basis``
picks one: the shorter of the two (default), or either by name.

The decision broadcasts: a batched study (leading point axes) gets the choice per
point; for a single study the properties read the chosen candidate directly.

References
----------
[1] ISO/TS 16281:2008, Rolling bearings - Methods for calculating the modified
    reference rating life for universally loaded bearings, clauses 3 and 7.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from hubload.domain.study import Study
from hubload.engine.modified_life import per_study
from hubload.engine.pair import MethodLives
from hubload.model.lubrication import life_symbol

METHOD_NAMES = {"iso281": "ISO 281 rule for the pair", "refined": "refined load distribution"}


@dataclass(frozen=True)
class LifeCandidate:
    """One method's life of the kind the verdict judges, with the damage shares on that basis.

    Per-study values carry the batch axes only; per-case arrays end in the case axis.
    """

    method: str
    modified: bool
    reliability_percent: np.ndarray
    system_life_h: np.ndarray
    system_life_km: np.ndarray
    bearing_life_h: dict[str, np.ndarray]
    bearing_life_km: dict[str, np.ndarray]
    case_life_h: dict[str, np.ndarray]
    system_damage_share: np.ndarray
    bearing_damage_share: dict[str, np.ndarray]
    band_end: str = ""                 # "low" or "high": at that end of the setting band

    @property
    def reliability(self) -> float:
        """The reliability [%] of a single study (of the first point of a batched one)."""
        return float(np.asarray(self.reliability_percent).flat[0])

    @property
    def symbol(self) -> str:
        """E.g. L10m, L1m (ISO 281) or L10mr (ISO/TS 16281)."""
        return symbol_of(self.method, self.reliability, self.modified)

    @property
    def basis(self) -> str:
        text = basis_text(self.method, self.reliability, self.modified)
        return f"{text}, at the {self.band_end} end of the setting band" if self.band_end \
            else text


@dataclass(frozen=True)
class GoverningLife:
    """The candidates and, per study, the index of the one that governs."""

    rule: str                              # verdict_basis: shorter | iso281 | refined
    candidates: tuple[LifeCandidate, ...]
    chosen: np.ndarray

    @property
    def choice(self) -> LifeCandidate:
        """The governing candidate of a single study (of the first point of a batched one)."""
        return self.candidates[int(np.asarray(self.chosen).flat[0])]

    @property
    def symbol(self) -> str:
        return self.choice.symbol

    @property
    def method(self) -> str:
        return self.choice.method

    @property
    def basis(self) -> str:
        return self.choice.basis

    @property
    def life_h(self) -> np.ndarray:
        """The governing system life [h] (per study, batch axes kept)."""
        return self.pick(lambda c: c.system_life_h)

    @property
    def life_km(self) -> np.ndarray:
        return self.pick(lambda c: c.system_life_km)

    @property
    def system_damage_share(self) -> np.ndarray:
        """Each case's share of the pair's damage on the governing basis."""
        return self.pick(lambda c: c.system_damage_share, per_case=True)

    def bearing_life_h(self, label: str) -> np.ndarray:
        return self.pick(lambda c: c.bearing_life_h[label])

    def bearing_damage_share(self, label: str) -> np.ndarray:
        return self.pick(lambda c: c.bearing_damage_share[label], per_case=True)

    def case_life_h(self, label: str) -> np.ndarray:
        return self.pick(lambda c: c.case_life_h[label], per_case=True)

    def pick(self, value, per_case: bool = False) -> np.ndarray:
        """``value(candidate)`` of the governing candidate, point by point."""
        if len(self.candidates) == 1:
            return np.asarray(value(self.candidates[0]))
        chosen = np.asarray(self.chosen)
        index = chosen[..., None] if per_case else chosen
        stacked = np.broadcast_arrays(*(np.asarray(value(c), dtype=float)
                                        for c in self.candidates))
        return np.choose(np.broadcast_to(index, stacked[0].shape), stacked)

    @property
    def dominant_case(self) -> int | None:
        """The case with the largest damage share on the governing basis (single study)."""
        shares = self.system_damage_share
        return int(np.argmax(shares)) if np.any(shares > 0) else None

    def other(self) -> LifeCandidate | None:
        """The other method's life (single study), when two methods were evaluated: the ISO
        281 rule's when a refined life governs, else the shortest refined one."""
        if len(self.candidates) == 1:
            return None
        if self.choice.method == "refined":
            return self.candidates[0]
        refined = self.candidates[1:]
        return min(refined, key=lambda c: float(np.asarray(c.system_life_h).flat[0]))


def symbol_of(method: str, reliability_percent: float, modified: bool) -> str:
    """L10, L1, L10m, L1m (ISO 281) or L10r, L10mr, L1mr (ISO/TS 16281 reference lives)."""
    symbol = life_symbol(reliability_percent, modified=modified)
    return symbol + "r" if method == "refined" else symbol


def basis_text(method: str, reliability_percent: float, modified: bool) -> str:
    """What the candidate life is, in words (shown beside every verdict)."""
    reliability = f"reliability {reliability_percent:g} %"
    if method == "iso281":
        if modified:
            return (f"ISO 281 modified rating life a1 aISO L10, {reliability}, with lubrication "
                    f"and contamination")
        if reliability_percent == 90.0:
            return "ISO 281 basic rating life (no [lubrication] given)"
        return f"a1 L10, {reliability}; aISO not applied (no [lubrication] given)"
    if modified:
        return (f"ISO/TS 16281 modified reference rating life a1 aISO L10r of the refined load "
                f"distribution, {reliability}, with lubrication and contamination")
    if reliability_percent == 90.0:
        return ("ISO/TS 16281 basic reference rating life L10r of the refined load "
                "distribution (no [lubrication] given)")
    return (f"a1 L10r of the refined load distribution, {reliability}; aISO not applied "
            f"(no [lubrication] given)")


def candidate(study: Study, lives: MethodLives, a1, band_end: str = "") -> LifeCandidate:
    """The life of ``lives`` that a verdict judges: modified with lubrication, else a1 L10."""
    modified = lives.modified
    if modified is not None:
        system_h, system_km = modified.system_life_h, modified.system_life_km
        bearing_h = {label: b.life_h for label, b in modified.bearings.items()}
        bearing_km = {label: b.life_km for label, b in modified.bearings.items()}
        case_h = {label: b.case_life_h for label, b in modified.bearings.items()}
        system_share = modified.system_damage_share
        bearing_share = {label: b.damage_share for label, b in modified.bearings.items()}
    else:   # a1 scales every life alike, so the damage shares stay those of L10
        a1 = np.asarray(a1, dtype=float)
        system_h, system_km = a1 * lives.system_life_h, a1 * lives.system_life_km
        bearing_h = {label: a1 * b.life_h for label, b in lives.bearings.items()}
        bearing_km = {label: a1 * b.life_km for label, b in lives.bearings.items()}
        case_h = {label: np.expand_dims(a1, -1) * b.case_life_h
                  for label, b in lives.bearings.items()}
        system_share = lives.system_damage_share
        bearing_share = {label: b.damage_share for label, b in lives.bearings.items()}
    return LifeCandidate(
        method=lives.method, modified=modified is not None,
        reliability_percent=per_study(study.reliability_percent),
        system_life_h=np.asarray(system_h, dtype=float), system_life_km=system_km,
        bearing_life_h=bearing_h, bearing_life_km=bearing_km, case_life_h=case_h,
        system_damage_share=system_share, bearing_damage_share=bearing_share,
        band_end=band_end)


def govern(study: Study, iso281: MethodLives, refined: tuple[MethodLives, ...], a1,
           band_ends: tuple[str, ...] = ()) -> GoverningLife:
    """The governing life of a study from the ISO 281 rule's lives and, with the refined
    method, the refined lives (the middle of the setting band, then its ends).

    ``verdict_basis`` "shorter" takes the shortest of all, "refined" the shortest refined
    one (the worse end of the band), "iso281" the ISO 281 rule's; ties go to the ISO 281
    rule, then to the middle of the band.
    """
    ends = ("",) + tuple(band_ends)
    candidates = (candidate(study, iso281, a1),) + tuple(
        candidate(study, lives, a1, end) for lives, end in zip(refined, ends))
    if len(candidates) == 1:
        return GoverningLife(rule="iso281", candidates=candidates, chosen=np.asarray(0))
    rule = study.verdict_basis
    lives = np.stack(np.broadcast_arrays(*(c.system_life_h for c in candidates)))
    if rule == "iso281":
        chosen = np.zeros(lives.shape[1:], dtype=int)
    elif rule == "refined":
        chosen = 1 + np.argmin(lives[1:], axis=0)
    else:
        chosen = np.argmin(lives, axis=0)
    return GoverningLife(rule=rule, candidates=candidates, chosen=np.asarray(chosen))
