"""Rating measures: how a family compares a factored resistance with its load effects.

- :class:`RatingFactor` (AASHTO MBE 6A.4.2, LRFR):
  RF = (C - gDC DC - gDW DW) / (gLL (LL + IM)), C = phi_c phi_s phi Rn with
  phi_c phi_s >= 0.85 (6A.4.2.1); the system factor phi_s applies to flexural and axial
  effects only (6A.4.2.4), shear and connections take 1.0. From memory. Where the factored
  dead load alone exceeds C the rating factor is reported as 0 with a note (a negative value
  would rise towards 0 as the live load grows, which reads as a better rating).
- :class:`DemandCapacity` (AISC 360-22 B3.1 with the load combination of the document AISC
  points to, ASCE/SEI 7-22 2.3.1 combination 2, 1.2 D + 1.6 L; from memory):
  D/C = (1.2 D + 1.6 L) / (phi Rn).
- :class:`Utilisation` (EN 1990:2002 Annex A2, Table A2.4(B), Eq. 6.10; from memory):
  U = (gamma_G G_k + gamma_Q Q_k) / R_d; its reserve is 1 - U.

Load effects are magnitudes in the sense of the resistance (N or N*mm).
"""

from __future__ import annotations

from collections.abc import Iterator, Mapping
from dataclasses import dataclass

from core.checks.flags import Flag, FlagThresholds, flag_rating_factor, flag_utilisation
from core.checks.results import CheckValue, Row
from core.errors import InputError
from core.families.base import Factor

PHI_CS_FLOOR = 0.85


@dataclass(frozen=True)
class Rating:
    """One limit state rated at one station in the family's measure.

    Attributes:
        measure, symbol: ``"rating factor"`` / ``"RF"``, ``"demand / capacity"`` / ``"D/C"``
            or ``"utilisation"`` / ``"U"``.
        value: the number. higher_is_better: True for RF.
        demand: factored load effect (N or N*mm). capacity: the resistance term compared.
        load: which live load, in words. values, notes: the working.
    """

    measure: str
    symbol: str
    value: float
    higher_is_better: bool
    demand: float
    capacity: float
    load: str
    kind: str
    values: tuple[CheckValue, ...]
    notes: tuple[str, ...] = ()

    @property
    def badness(self) -> float:
        """Sorts the worst first: lower is worse for every measure."""
        return self.value if self.higher_is_better else -self.value

    def rows(self) -> Iterator[Row]:
        for v in self.values:
            yield v.row()
        yield (self.symbol, self.measure, self.value, "dimensionless", self.load)


def _check(v: float, name: str, where: str, *, positive: bool = False) -> float:
    if v != v or v < 0.0 or (positive and v == 0.0):
        need = "greater than 0" if positive else "0 or more"
        raise InputError(f"load effect {name} = {v:g} must be {need}", where=where)
    return float(v)


@dataclass(frozen=True)
class RatingFactor:
    """LRFR rating factor at one level (inventory, operating, legal or permit)."""

    level: str
    gDC: Factor
    gDW: Factor
    gLL: Factor
    name: str = "rating factor"
    symbol: str = "RF"
    higher_is_better: bool = True
    SOURCE = "AASHTO MBE 3rd ed. (2018), 6A.4.2.1, Eq. 6A.4.2.1-1 (from memory)"

    def rate(
        self,
        *,
        capacity: float,
        kind: str,
        flexural: bool,
        DC: float,
        DW: float,
        LL: float,
        load: str,
        member: Mapping[str, Factor],
        where: str = "",
    ) -> Rating:
        """RF of a factored resistance ``capacity`` (phi Rn) against DC, DW and LL+IM."""
        DC, DW = _check(DC, "DC", where), _check(DW, "DW", where)
        LL = _check(LL, "LL+IM", where, positive=True)
        phi_c = member["phi_c"]
        phi_s = member["phi_s"]
        s = phi_s.value if flexural else 1.0
        raw = phi_c.value * s
        cs = max(raw, PHI_CS_FLOOR)
        C = cs * capacity
        left = C - self.gDC.value * DC - self.gDW.value * DW
        RF = max(left, 0.0) / (self.gLL.value * LL)
        demand = self.gDC.value * DC + self.gDW.value * DW + self.gLL.value * LL
        vals = (
            CheckValue("phi_c", phi_c.value, "dimensionless", phi_c.description, phi_c.source),
            CheckValue(
                "phi_s",
                s,
                "dimensionless",
                phi_s.description if flexural else "system factor: 1.0 for shear and connections",
                phi_s.source if flexural else "AASHTO MBE 3rd ed. (2018), 6A.4.2.4 (from memory)",
            ),
            CheckValue("phi Rn", capacity, kind, "factored resistance", "the limit state's clause"),
            CheckValue("C", C, kind, "capacity phi_c phi_s phi Rn", self.SOURCE),
            CheckValue(
                "gDC", self.gDC.value, "dimensionless", self.gDC.description, self.gDC.source
            ),
            CheckValue("DC", DC, kind, "dead load effect, components", "load model"),
            CheckValue(
                "gDW", self.gDW.value, "dimensionless", self.gDW.description, self.gDW.source
            ),
            CheckValue("DW", DW, kind, "dead load effect, wearing surface", "load model"),
            CheckValue(
                "gLL", self.gLL.value, "dimensionless", self.gLL.description, self.gLL.source
            ),
            CheckValue("LL+IM", LL, kind, f"live load effect with IM: {load}", "load model"),
        )
        notes = []
        if raw < PHI_CS_FLOOR:
            notes.append(f"phi_c phi_s = {raw:.3g} raised to the {PHI_CS_FLOOR} floor (6A.4.2.1)")
        if left < 0.0:
            notes.append(
                f"C - gDC DC - gDW DW = {left:.4g} < 0: the factored dead load alone exceeds the "
                "capacity; RF taken as 0 (no live load capacity), not negative"
            )
        return Rating(self.name, self.symbol, RF, True, demand, C, load, kind, vals, tuple(notes))

    @property
    def live_factor(self) -> Factor:
        return self.gLL

    def design(self, DC: float, DW: float, LL: float) -> float:
        """Factored load effect gDC DC + gDW DW + gLL (LL + IM)."""
        return self.gDC.value * DC + self.gDW.value * DW + self.gLL.value * LL

    def flag(self, subject: str, r: Rating, th: FlagThresholds) -> Flag:
        return flag_rating_factor(subject, r.value, th)


def _factor_value(f: Factor) -> CheckValue:
    return CheckValue(f.symbol, f.value, "dimensionless", f.description, f.source)


@dataclass(frozen=True)
class _OverCapacity:
    """A measure that is a factored demand over the factored resistance (lower is better):
    demand = dead factor x (DC + DW) + live factor x LL. Subclasses name the symbols."""

    dead: Factor
    live: Factor
    name = ""
    symbol = ""
    higher_is_better = False
    SOURCE = ""
    WORDS = ()  # (symbol, words) of the resistance, dead load, live load, demand

    def rate(
        self,
        *,
        capacity: float,
        kind: str,
        flexural: bool,
        DC: float,
        DW: float,
        LL: float,
        load: str,
        member: Mapping[str, Factor],
        where: str = "",
    ) -> Rating:
        R, D, L, E = self.WORDS
        DC, DW = _check(DC, D[0], where), _check(DW, D[0], where)
        LL = _check(LL, L[0], where, positive=True)
        demand = self.design(DC, DW, LL)
        value = min(float("inf") if capacity <= 0.0 else demand / capacity, 1e9)
        vals = (
            CheckValue(R[0], capacity, kind, R[1], "the limit state's clause"),
            CheckValue(D[0], DC + DW, kind, D[1], "load model"),
            CheckValue(L[0], LL, kind, f"{L[1]}: {load}", "load model"),
            _factor_value(self.dead),
            _factor_value(self.live),
            CheckValue(E[0], demand, kind, E[1], self.SOURCE),
        )
        notes = (f"reserve 1 - {self.symbol} = {1.0 - value:.3g}",)
        return Rating(
            self.name, self.symbol, value, False, demand, capacity, load, kind, vals, notes
        )

    @property
    def live_factor(self) -> Factor:
        return self.live

    def design(self, DC: float, DW: float, LL: float) -> float:
        return self.dead.value * (DC + DW) + self.live.value * LL

    def flag(self, subject: str, r: Rating, th: FlagThresholds) -> Flag:
        return flag_utilisation(subject, r.value, th, self.name)


@dataclass(frozen=True)
class DemandCapacity(_OverCapacity):
    """Demand / design strength with the LRFD combination 1.2 D + 1.6 L."""

    name = "demand / capacity"
    symbol = "D/C"
    SOURCE = "AISC 360-22 B3.1 with ASCE/SEI 7-22 2.3.1, combination 2 (from memory)"
    WORDS = (
        ("phi Rn", "design strength"),
        ("D", "dead load effect"),
        ("L", "live load effect"),
        ("Ru", "required strength 1.2 D + 1.6 L"),
    )


@dataclass(frozen=True)
class Utilisation(_OverCapacity):
    """Design effect / design resistance with EN 1990 Eq. 6.10 (one variable action)."""

    name = "utilisation"
    symbol = "U"
    SOURCE = "EN 1990:2002 Annex A2, Table A2.4(B), Eq. 6.10 (from memory)"
    WORDS = (
        ("R_d", "design resistance"),
        ("G_k", "permanent actions (self-weight and surfacing)"),
        ("Q_k", "traffic action"),
        ("E_d", "design effect gamma_G G_k + gamma_Q Q_k"),
    )
