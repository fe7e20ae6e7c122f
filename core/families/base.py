"""What a standard family is: its documents, its factors, its limit states, its load model
and its rating measure, in one small frozen object that the checks are handed.

A :class:`Family` is built once per assessment from the engineer's choices
(:func:`core.families.build_family`); it is the one place where the family's factors live.
Factors that belong to one member (condition, system factor, distribution) come from
:meth:`Family.member_factors`. Limit states are listed as :class:`LimitStateSpec`: a key, a
name and a function of one station's inputs returning zero or more
:class:`core.assess.results.LimitState`; a new limit state (girder ends, lateral-torsional
buckling, ...) is one more entry in the family's list.
"""

from __future__ import annotations

from collections.abc import Callable, Mapping
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from core.errors import InputError

if TYPE_CHECKING:
    from core.assess.results import LimitState


@dataclass(frozen=True)
class Factor:
    """One factor of the family: symbol, value, what it is and where it comes from
    (clause and edition, "from memory", or "engineer's input")."""

    symbol: str
    value: float
    description: str
    source: str

    def __post_init__(self) -> None:
        v = float(self.value)
        if not v == v or v in (float("inf"), float("-inf")):
            raise InputError(f"factor {self.symbol} = {self.value!r} is not a finite number")
        object.__setattr__(self, "value", v)


@dataclass(frozen=True)
class Document:
    """A document the family follows. ``pointer`` marks a document outside the family that
    the family itself points to (e.g. AISC 360 to ASCE/SEI 7 for load combinations)."""

    title: str
    edition: str
    role: str
    pointer: bool = False

    @property
    def label(self) -> str:
        return f"{self.title}, {self.edition}"


@dataclass(frozen=True)
class LimitStateSpec:
    """One limit state of the family: its key, its name, and the function that checks it at
    a station, ``check(ctx, done) -> list[LimitState]`` (an empty list where it does not
    apply); ``done`` holds the limit states already found at the station, in order, so a
    check may build on an earlier one (bending and shear on the web shear)."""

    key: str
    name: str
    check: Callable[[Any], list[LimitState]]


@dataclass(frozen=True)
class Choice:
    """An engineer's choice the family made, for the assumptions page."""

    item: str
    value: str
    source: str


@dataclass(frozen=True)
class Family:
    """A standard family configured for one assessment.

    Attributes:
        key: ``"aashto"``, ``"aisc"`` or ``"en1993"``.
        name: the family in words (named on every report page).
        documents: the documents followed, with their editions.
        factors: every factor used for the whole assessment, by symbol.
        limit_states: the limit states checked at every station, in order.
        measure: the rating measure (rating factor, demand / capacity, utilisation).
        depth_basis: the web depth basis for shear (``"clear"``, ``"web"``, ``"rivet_lines"``).
        choices: the other choices (level, load model, thickness basis ...) as stated.
        tokens: words that identify this family's documents and symbols; no other family's
            output may contain them (the leak test).
        rules: the family's own behaviour the assessment calls (an object with
            ``material(survey)``, ``member_factors(member, opts)``, ``live_cases(member,
            survey, opts)``, ``design_keys(cases, opts)``, ``summary_cases(cases, opts)``).
    """

    key: str
    name: str
    documents: tuple[Document, ...]
    factors: Mapping[str, Factor]
    limit_states: tuple[LimitStateSpec, ...]
    measure: Any
    depth_basis: str
    choices: tuple[Choice, ...] = ()
    tokens: tuple[str, ...] = ()
    rules: Any = None
    short_name: str = ""

    def factor(self, symbol: str) -> float:
        """The value of factor ``symbol``.

        Raises:
            KeyError: not a factor of this family (the message lists them).
        """
        return self.f(symbol).value

    def f(self, symbol: str) -> Factor:
        try:
            return self.factors[symbol]
        except KeyError:
            raise KeyError(
                f"{symbol!r} is not a factor of {self.key}: {sorted(self.factors)}"
            ) from None

    @property
    def short(self) -> str:
        """The family's name for a page footer."""
        return self.short_name or self.name


def override(
    defaults: Mapping[str, Factor],
    given: Mapping[str, float],
    family: str,
    ranges: Mapping[str, tuple[float, float]],
) -> dict[str, Factor]:
    """Defaults with the engineer's values put in (source "engineer's input").

    Raises:
        InputError: a symbol the family does not have, or a value outside its range.
    """
    out = dict(defaults)
    for sym, v in given.items():
        if sym not in defaults:
            raise InputError(
                f"factor {sym!r} is not a factor of the {family} family; its factors: "
                f"{sorted(defaults)}"
            )
        lo, hi = ranges.get(sym, (0.0, 5.0))
        try:
            val = float(v)
        except (TypeError, ValueError):
            raise InputError(f"factor {sym} = {v!r} is not a number") from None
        if not lo < val <= hi:
            raise InputError(f"factor {sym} = {val:g} is outside ({lo:g}, {hi:g}]")
        d = defaults[sym]
        out[sym] = Factor(
            sym, val, d.description, f"engineer's input (default {d.value:g}: {d.source})"
        )
    return out
