"""The published documents the limit-state checks follow, with the edition of each.

One :class:`Document` per standard (or textbook, for closed forms of mechanics). A check
cites ``DOC.ref("6.10.11.2.3-2")`` beside each value it reports; clause and equation
numbers recalled without the text at hand are marked "(from memory)", as every number
of these modules is unless said otherwise.
"""

from __future__ import annotations

from collections.abc import Iterable
from dataclasses import dataclass

from core.checks._inputs import internal
from core.checks.results import CapacityResult, CheckValue
from core.errors import InputError


@dataclass(frozen=True)
class Document:
    """A published document: its full name, the edition followed and a short name."""

    name: str
    edition: str
    short: str

    def ref(self, clause: str, *, memory: bool = True) -> str:
        """``"<short> <edition>, <clause> (from memory)"``."""
        tail = " (from memory)" if memory else ""
        return f"{self.short} {self.edition}, {clause}{tail}"

    def result(
        self,
        limit_state: str,
        clause: str,
        Rn: float,
        phi: float,
        kind: str,
        values: Iterable[CheckValue],
        notes: Iterable[str] = (),
    ) -> CapacityResult:
        """A :class:`CapacityResult` citing this document (clause marked from memory)."""
        return CapacityResult(
            limit_state=limit_state,
            standard=self.name,
            edition=self.edition,
            clause=f"{clause} (from memory)",
            Rn=Rn,
            phi=phi,
            kind=kind,
            values=tuple(values),
            notes=tuple(notes),
        )


AASHTO_LRFD = Document("AASHTO LRFD Bridge Design Specifications", "9th ed. (2020)", "AASHTO LRFD")
AASHTO_MBE = Document("AASHTO Manual for Bridge Evaluation", "3rd ed. (2018)", "AASHTO MBE")
AISC_360 = Document("AISC 360-22 Specification for Structural Steel Buildings", "2022", "AISC 360")
EN_1993_1_1 = Document(
    "EN 1993-1-1 Design of steel structures: general rules and rules for buildings",
    "2005",
    "EN 1993-1-1",
)
EN_1993_1_5 = Document(
    "EN 1993-1-5 Design of steel structures: plated structural elements", "2006", "EN 1993-1-5"
)
EN_1993_1_9 = Document("EN 1993-1-9 Design of steel structures: fatigue", "2005", "EN 1993-1-9")
EN_1993_2 = Document("EN 1993-2 Design of steel structures: steel bridges", "2006", "EN 1993-2")
#: the three-factor Mcr formula the Eurocode text itself does not print
ENV_1993_1_1 = Document(
    "ENV 1993-1-1 Eurocode 3 (prestandard), Annex F: elastic critical moment",
    "1992",
    "ENV 1993-1-1",
)
#: closed forms of elastic stability
TIMOSHENKO_GERE = Document(
    "Timoshenko and Gere, Theory of Elastic Stability", "2nd ed. (1961)", "Timoshenko & Gere"
)


def factor(x: float, name: str, *, low: float = 0.0, high: float = 2.0, where: str = "") -> float:
    """A resistance or partial factor in ``(low, high]``.

    Raises:
        InputError: not a finite number in range.
    """
    return internal(x, "dimensionless", name, where=where, low=low, high=high)


def choice(value: str, allowed: Iterable[str], name: str, *, where: str = "") -> str:
    """``value`` if it is one of ``allowed``.

    Raises:
        InputError: naming the value and the allowed ones.
    """
    allowed = tuple(allowed)
    if value not in allowed:
        raise InputError(f"{name} = {value!r} is not one of {list(allowed)}", where=where)
    return value


def member_length(x: object, name: str, *, where: str = "") -> float:
    """A positive length along a member (span, unbraced length), mm, at most 1 km.

    Raises:
        InputError: not a finite length in range.
    """
    return internal(x, "length", name, where=where, low=0.0, high=1e6)
